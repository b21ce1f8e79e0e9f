import { z } from 'zod';
import { revisionNumberSchema } from './library';

/**
 * Bulk import of library rows into one draft amendment, and export of the library at a revision.
 * The tables are those of seeds/library/FORMAT.md (sources, species, values, selections); the
 * JSON export holds the same four tables and imports back unchanged.
 */

/** Most data rows one import may hold, across all its files (more is 413). */
export const MAX_IMPORT_ROWS = 20_000;

/** The tables an import recognises, by their header row. */
export const importTables = ['sources', 'species', 'values', 'selections'] as const;
export type ImportTable = (typeof importTables)[number];

/** One bad row: file, line (1 = the header row; for XLSX the sheet row), column and reason. */
export const importProblemSchema = z.object({
  file: z.string(),
  line: z.number().int().nullable(),
  column: z.string().nullable(),
  reason: z.string(),
});
export type ImportProblem = z.infer<typeof importProblemSchema>;

export const importReportSchema = z.object({
  rowsRead: z.number().int(),
  /** Rows per table across all files. */
  tables: z.record(z.string(), z.number().int()),
  problems: z.array(importProblemSchema),
});
export type ImportReport = z.infer<typeof importReportSchema>;

export const importStates = ['running', 'done', 'failed'] as const;

/** GET /api/v1/amendments/imports/:jobId and the 202 reply of POST /api/v1/amendments/imports. */
export const importJobSchema = z.object({
  jobId: z.uuid(),
  state: z.enum(importStates),
  rowsRead: z.number().int(),
  rowsTotal: z.number().int(),
  report: importReportSchema.nullable(),
  amendmentId: z.uuid().nullable(),
  /** Why a failed import failed as a whole (a bad row is in report.problems instead). */
  error: z.string().nullable(),
});
export type ImportJob = z.infer<typeof importJobSchema>;

export const importJobParamsSchema = z.object({ jobId: z.uuid({ message: 'Not an import job id.' }) });

/** Multipart fields besides the files. */
export const importFieldsSchema = z.object({
  title: z.string().trim().min(3).max(200).optional(),
  rationale: z.string().trim().min(1).max(10_000).optional(),
});

/** GET /api/v1/amendments/imports/limits: what an import takes, read from the server's settings. */
export const importLimitsSchema = z.object({
  /** Largest file, bytes (the evidence file limit). */
  maxFileBytes: z.number().int(),
  /** Most files in one import. */
  maxFiles: z.number().int(),
  /** Most data rows across all files. */
  maxRows: z.number().int(),
  /** Per table: the columns that tell it apart (required) and every column it reads. */
  tables: z.record(z.enum(importTables), z.object({ required: z.array(z.string()), columns: z.array(z.string()) })),
});
export type ImportLimits = z.infer<typeof importLimitsSchema>;

export const exportQuerySchema = z.object({ revision: revisionNumberSchema.optional() });

// ——— The JSON export ———

const nullableText = z.string().nullable();

export const exportSourceSchema = z.object({
  key: z.string(),
  kind: z.string(),
  authors: z.string(),
  title: z.string(),
  publication: nullableText,
  year: z.number().int().nullable(),
  volume: nullableText,
  pages: nullableText,
  doi: nullableText,
  isbn: nullableText,
  url: nullableText,
  note: nullableText,
});

export const exportSpeciesSchema = z.object({
  key: z.string(),
  name: z.string(),
  synonyms: z.array(z.string()),
  cas: nullableText,
  inchikey: nullableText,
  inchi: nullableText,
  referenceState: nullableText,
  note: nullableText,
});

export const exportValueSchema = z.object({
  species: z.string(),
  property: z.enum(['dfH298', 'S298']),
  /** As the source prints it. */
  value: z.string(),
  uncertaintyKind: z.string(),
  uncertainty: nullableText,
  k: z.number().nullable(),
  source: z.string(),
  table: nullableText,
  entryNote: nullableText,
  provenance: z.string(),
  provenanceNote: nullableText,
  pressureBar: z.number(),
  ionConvention: nullableText,
  derivation: z.record(z.string(), z.unknown()).nullable(),
});

export const exportSelectionSchema = z.object({
  species: z.string(),
  property: z.enum(['dfH298', 'S298', 'cp']),
  source: z.string(),
  reason: z.string(),
});

/** The JSON export: `format` tells an import what it reads. */
export const libraryExportSchema = z.object({
  format: z.literal('thermoledger-library-export'),
  version: z.literal(1),
  revision: z.number().int(),
  sources: z.array(exportSourceSchema),
  species: z.array(exportSpeciesSchema),
  values: z.array(exportValueSchema),
  selections: z.array(exportSelectionSchema),
});
export type LibraryExport = z.infer<typeof libraryExportSchema>;
