import { z } from 'zod';
import {
  heatCapacityFormSchema,
  libraryPhaseSchema,
  libraryPropertySchema,
  modelScaleSchema,
  provenanceSchema,
  revisionKindSchema,
  sourceKindSchema,
  uncertaintyKindSchema,
} from './library-core';

/**
 * The library API (GET /api/v1/species, /species/:id, /sources, /library/revisions): public and
 * stable. The library changes only through amendments (shared/schemas/amendments.ts).
 * Energies are kJ/mol, entropies J/(mol K); uncertainties are standard uncertainties (k = 1),
 * null when the source states none.
 */

/** `revision` query or body field: a revision number (from 1). */
export const revisionNumberSchema = z.coerce
  .number({ message: 'Write a revision number such as 1.' })
  .int('Write a whole revision number.')
  .min(1, 'Revisions are numbered from 1.');

export const sourceSchema = z.object({
  id: z.uuid(),
  key: z.string(),
  kind: sourceKindSchema,
  authors: z.string(),
  title: z.string(),
  publication: z.string().nullable(),
  year: z.number().int().nullable(),
  volume: z.string().nullable(),
  pages: z.string().nullable(),
  doi: z.string().nullable(),
  isbn: z.string().nullable(),
  url: z.string().nullable(),
  note: z.string().nullable(),
  /** A short citation in words ("McBride, Gordon & Reno, NASA TM-4513 (1993)"). */
  citation: z.string(),
});
export type Source = z.infer<typeof sourceSchema>;

/** A source as cited beside a value: enough to show and to look up. */
export const sourceRefSchema = z.object({ id: z.uuid(), key: z.string(), citation: z.string() });
export type SourceRef = z.infer<typeof sourceRefSchema>;

/** The headline ΔfH° of a species in lists: the selected value. */
export const selectedEnthalpySchema = z.object({
  value: z.number(),
  uncertainty: z.number().nullable(),
  provenance: provenanceSchema,
  source: z.string(),
});

export const speciesSummarySchema = z.object({
  id: z.uuid(),
  key: z.string(),
  formula: z.string(),
  hill: z.string(),
  charge: z.number().int(),
  phase: libraryPhaseSchema,
  descriptor: z.string().nullable(),
  name: z.string(),
  synonyms: z.array(z.string()),
  cas: z.string().nullable(),
  inchikey: z.string().nullable(),
  referenceState: z.string().nullable(),
  /** g/mol. */
  molarMass: z.number(),
  deltaFH: selectedEnthalpySchema.nullable(),
  /** Valid range of the selected heat-capacity model, K. */
  modelRange: z.tuple([z.number(), z.number()]).nullable(),
  /** Keys of every source with a value or model for the species. */
  sources: z.array(z.string()),
  /** Provenance states of its values. */
  provenances: z.array(provenanceSchema),
});
export type SpeciesSummary = z.infer<typeof speciesSummarySchema>;

export const speciesSortSchema = z.enum(['relevance', 'name', 'formula', 'phase', 'deltaFH', 'molarMass']);

/** GET /api/v1/species query. */
export const speciesQuerySchema = z.object({
  q: z.string().max(200).optional(),
  phase: z
    .union([libraryPhaseSchema, z.literal('s')])
    .transform((p) => (p === 's' ? ('cr' as const) : p))
    .optional(),
  /** Element symbols, comma-separated: species that contain all of them. */
  element: z
    .string()
    .max(200)
    .regex(/^[A-Z][a-z]?(,[A-Z][a-z]?)*$/, 'Write element symbols separated by commas, such as C,O.')
    .optional(),
  /** A source key: species with a value or model from that source. */
  source: z.string().max(100).optional(),
  provenance: provenanceSchema.optional(),
  /** Only species with (true) or without (false) a selected ΔfH°. */
  hasValue: z.enum(['true', 'false']).optional(),
  sort: speciesSortSchema.default('relevance'),
  order: z.enum(['asc', 'desc']).default('asc'),
  limit: z.coerce.number().int().min(1).max(200).default(50),
  offset: z.coerce.number().int().min(0).max(1_000_000).default(0),
  revision: revisionNumberSchema.optional(),
});
export type SpeciesQuery = z.infer<typeof speciesQuerySchema>;

export const speciesListSchema = z.object({
  items: z.array(speciesSummarySchema),
  total: z.number().int(),
  libraryRevision: z.number().int(),
  /** When the query reads as several formulas ("co" is CO or Co), each reading. */
  readings: z.array(z.string()).optional(),
});
export type SpeciesList = z.infer<typeof speciesListSchema>;

export const statedUncertaintySchema = z.object({
  kind: uncertaintyKindSchema,
  value: z.number().nullable(),
  k: z.number().nullable(),
});

export const libraryValueSchema = z.object({
  id: z.uuid(),
  property: libraryPropertySchema,
  value: z.number(),
  /** The value as the source prints it. */
  valueText: z.string(),
  unit: z.string(),
  stated: statedUncertaintySchema,
  /** Standard uncertainty (k = 1) derived from the stated one, null when none is stated. */
  uncertainty: z.number().nullable(),
  uncertaintyRule: z.string(),
  source: sourceRefSchema,
  table: z.string().nullable(),
  entryNote: z.string().nullable(),
  provenance: provenanceSchema,
  provenanceNote: z.string().nullable(),
  pressureBar: z.number(),
  ionConvention: z.string().nullable(),
  derivation: z.record(z.string(), z.unknown()).nullable(),
  selected: z.boolean(),
  selectionReason: z.string().nullable(),
  sinceRevision: z.number().int(),
});
export type LibraryValue = z.infer<typeof libraryValueSchema>;

export const transitionSchema = z.object({
  from: z.string().nullable(),
  to: z.string().nullable(),
  /** K. */
  temperature: z.number(),
  /** kJ/mol, heating direction. */
  enthalpy: z.number(),
  /** A polymorph change, or a jump at a joint inside one fitted entry. */
  kind: z.enum(['transition', 'joint']),
});

export const libraryModelSchema = z.object({
  id: z.uuid(),
  source: sourceRefSchema,
  scale: modelScaleSchema,
  forms: z.array(heatCapacityFormSchema),
  range: z.tuple([z.number(), z.number()]),
  entryNote: z.string().nullable(),
  provenance: provenanceSchema,
  provenanceNote: z.string().nullable(),
  selected: z.boolean(),
  transitions: z.array(transitionSchema),
  sinceRevision: z.number().int(),
});
export type LibraryModel = z.infer<typeof libraryModelSchema>;

/** Two values of one property whose difference exceeds their combined standard uncertainty. */
export const disagreementSchema = z.object({
  property: libraryPropertySchema,
  a: z.uuid(),
  b: z.uuid(),
  difference: z.number(),
  combinedUncertainty: z.number(),
});

export const historyEntrySchema = z.object({
  revision: z.number().int(),
  at: z.iso.datetime({ offset: true }),
  by: z.string().nullable(),
  summary: z.string(),
  /** The amendment whose acceptance made the revision (null for the seed). */
  amendmentId: z.uuid().nullable(),
  /** What changed for this species in that revision, in words. */
  changes: z.array(z.string()),
});

export const speciesDetailSchema = speciesSummarySchema.extend({
  inchi: z.string().nullable(),
  note: z.string().nullable(),
  values: z.array(libraryValueSchema),
  models: z.array(libraryModelSchema),
  sourceDetails: z.array(sourceSchema),
  disagreements: z.array(disagreementSchema),
  history: z.array(historyEntrySchema),
  libraryRevision: z.number().int(),
});
export type SpeciesDetail = z.infer<typeof speciesDetailSchema>;

export const speciesParamsSchema = z.object({ speciesId: z.uuid({ message: 'Not a species id.' }) });
export const speciesDetailQuerySchema = z.object({ revision: revisionNumberSchema.optional() });

/** A point of a species' curves for plots: T in K, Cp in J/(mol K), H − H(298.15 K) in kJ/mol. */
export const speciesCurvesSchema = z.object({
  points: z.array(z.object({ t: z.number(), cp: z.number(), dH: z.number().nullable() })),
  transitions: z.array(transitionSchema),
  range: z.tuple([z.number(), z.number()]),
});

export const revisionSchema = z.object({
  number: z.number().int(),
  kind: revisionKindSchema,
  /** The amendment's title (or the seed's description). */
  summary: z.string(),
  createdAt: z.iso.datetime({ offset: true }),
  /** E-mail of who made it (the accepting curator), kept when the account is removed. */
  createdBy: z.string().nullable(),
  /** The amendment whose acceptance made it (null for the seed). */
  amendmentId: z.uuid().nullable(),
  /** Display name of the curator who accepted the amendment. */
  acceptedBy: z.string().nullable(),
  acceptedAt: z.iso.datetime({ offset: true }).nullable(),
  /** Who proposed the amendment, and why. */
  proposedBy: z.string().nullable(),
  rationale: z.string().nullable(),
  /** How many things it changed (identities touched). */
  changes: z.number().int(),
  /** Counts by kind (sources, species, values, models, selections, reactions, deprecated) and more. */
  detail: z.record(z.string(), z.unknown()),
});
export type Revision = z.infer<typeof revisionSchema>;

export const revisionListSchema = z.object({ items: z.array(revisionSchema), current: z.number().int().nullable() });
export type RevisionList = z.infer<typeof revisionListSchema>;

/** GET /api/v1/sources: every source of the library at a revision, with how many values cite it. */
export const sourceListSchema = z.object({
  items: z.array(
    sourceSchema.extend({ values: z.number().int(), models: z.number().int(), reactions: z.number().int() }),
  ),
  libraryRevision: z.number().int(),
});
export type SourceList = z.infer<typeof sourceListSchema>;
export const sourceListQuerySchema = z.object({ revision: revisionNumberSchema.optional() });
