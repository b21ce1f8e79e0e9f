import { z } from 'zod';
import {
  MAX_IMPORT_ROWS,
  exportQuerySchema,
  importFieldsSchema,
  importJobParamsSchema,
  importLimitsSchema,
  importTables,
  importJobSchema,
  libraryExportSchema,
} from '@shared/schemas/library-io';
import { requireActor } from '../context';
import { AppError } from '../errors';
import type { UploadedFile } from '../services/amendment-files.service';
import { knownColumns, tableColumns } from '../library-io/rows-to-entries';
import { exportLibraryCsv, exportLibraryJson, importJob, startImport } from '../services/library-io.service';
import { defineRoute, ReplyWithStatus } from './registry';

const importQuerySchema = z.object({ wait: z.enum(['true', 'false']).default('false') });

/** Bulk import into one draft amendment, and the export of the library at a revision. */
export const libraryIoRoutes = [
  defineRoute({
    method: 'post',
    path: '/amendments/imports',
    summary: 'Import library tables (CSV, XLSX or the JSON export) as one draft amendment',
    description: `multipart/form-data: files in the field \`files\` (one table per CSV, one per XLSX sheet, told apart by the header: sources, species, values or selections of seeds/library/FORMAT.md; or the JSON of GET /library/export.json), optional fields \`title\` and \`rationale\`. The type is read from the content (415 otherwise). Limits (413): the evidence file size, ${MAX_IMPORT_ROWS} rows. Answers 202 with a job to read at GET /amendments/imports/{jobId}; with wait=true answers when the job ends: 201 with the amendment, or 400 with \`details.report.problems\` naming file, line, column and reason of every bad row. A bad row means no amendment is made.`,
    tags: ['amendments'],
    access: 'proposer',
    upload: { field: 'files' },
    request: { query: importQuerySchema },
    responses: { 201: importJobSchema, 202: importJobSchema },
    handler: async ({ ctx, query, req }) => {
      const fields = importFieldsSchema.safeParse(req.body ?? {});
      if (!fields.success)
        throw new AppError(
          'validation_failed',
          `body.${fields.error.issues[0]?.path.join('.')}: ${fields.error.issues[0]?.message}`,
          {
            issues: fields.error.issues.map((i) => ({ path: ['body', ...i.path.map(String)], message: i.message })),
          },
        );
      const wait = query.wait === 'true';
      const job = await startImport(requireActor(ctx), {
        files: (Array.isArray(req.files) ? req.files : []) as UploadedFile[],
        title: fields.data.title,
        rationale: fields.data.rationale,
        wait,
      });
      return new ReplyWithStatus(wait ? 201 : 202, job);
    },
  }),
  defineRoute({
    method: 'get',
    path: '/amendments/imports/limits',
    summary: 'What an import takes: file size, file count and row limits, and the columns of each table',
    description:
      'Read from the server settings (EVIDENCE_MAX_FILE_MB, EVIDENCE_MAX_FILES_PER_UPLOAD) and seeds/library/FORMAT.md, so the import page never copies them.',
    tags: ['amendments'],
    access: 'proposer',
    responses: { 200: importLimitsSchema },
    handler: ({ ctx }) => ({
      maxFileBytes: ctx.config.evidence.maxFileBytes,
      maxFiles: ctx.config.evidence.maxFilesPerUpload,
      maxRows: MAX_IMPORT_ROWS,
      tables: Object.fromEntries(
        importTables.map((t) => [t, { required: [...tableColumns[t]], columns: [...knownColumns[t]] }]),
      ) as Record<(typeof importTables)[number], { required: string[]; columns: string[] }>,
    }),
  }),
  defineRoute({
    method: 'get',
    path: '/amendments/imports/:jobId',
    summary: 'Progress and outcome of an import (the user who started it)',
    description: 'state running | done (amendmentId set) | failed (report.problems or error); rowsRead of rowsTotal.',
    tags: ['amendments'],
    access: 'proposer',
    request: { params: importJobParamsSchema },
    responses: { 200: importJobSchema },
    handler: ({ ctx, params }) => importJob(requireActor(ctx), params),
  }),
  defineRoute({
    method: 'get',
    path: '/library/export.json',
    summary: 'The library at a revision as JSON that imports back as an amendment',
    description:
      'Sources, species, values (as the sources print them) and selections; `revision` (default: the newest).',
    tags: ['library'],
    access: 'public',
    request: { query: exportQuerySchema },
    responses: { 200: libraryExportSchema },
    handler: async ({ ctx, query, res }) => {
      const data = await exportLibraryJson(ctx, query);
      res.attachment(`thermoledger-library-r${data.revision}.json`);
      return data;
    },
  }),
  defineRoute({
    method: 'get',
    path: '/library/export.csv',
    summary: 'The library’s values at a revision as CSV (the values table of seeds/library/FORMAT.md)',
    description:
      "Text cells that start with = + - @ tab or CR are prefixed with ' (spreadsheet formula injection); numbers, negative ones included, are written as they are. A `selected` column says which value is selected. Imports back through POST /amendments/imports.",
    tags: ['library'],
    access: 'public',
    request: { query: exportQuerySchema },
    responses: { 200: null },
    handler: async ({ ctx, query, res }) => {
      const { revision, csv } = await exportLibraryCsv(ctx, query);
      res
        .status(200)
        .attachment(`thermoledger-library-r${revision}.csv`)
        .type('text/csv; charset=utf-8')
        .set('X-Content-Type-Options', 'nosniff')
        .send(csv);
    },
  }),
];
