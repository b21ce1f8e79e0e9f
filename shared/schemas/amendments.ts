import { z } from 'zod';
import { provenanceSchema, reactionMethodSchema, sourceKindSchema, uncertaintyKindSchema } from './library-core';
import { thermoFormSchema, thermoScaleSchema } from './thermo';
import { plainText } from './text';

/**
 * Amendments: every change to the library is proposed as an amendment of one or more entries,
 * reviewed by a curator and, once accepted, applied as one new library revision.
 *
 * Units: ΔfH° and ΔrH in kJ/mol, S° in J/(mol K), temperatures in K. An `uncertainty` is a
 * standard uncertainty (k = 1); `stated` keeps the uncertainty as the source states it.
 */

// ——— States ———

/** Where an amendment stands: our own state names. */
export const amendmentStates = ['draft', 'open', 'accepted', 'returned', 'declined', 'withdrawn'] as const;
export const amendmentStateSchema = z.enum(amendmentStates);
export type AmendmentState = z.infer<typeof amendmentStateSchema>;

/** What moves an amendment between states (and `create`, `edit`, `rebase` that keep or set one). */
export const amendmentActions = [
  'create',
  'edit',
  'open',
  'accept',
  'return',
  'decline',
  'withdraw',
  'rebase',
] as const;
export const amendmentActionSchema = z.enum(amendmentActions);
export type AmendmentAction = z.infer<typeof amendmentActionSchema>;

/** Plain words for each state. */
export const amendmentStateLabels: Record<AmendmentState, string> = {
  draft: 'Draft (seen by its author only)',
  open: 'Open for review',
  accepted: 'Accepted (applied to the library)',
  returned: 'Returned to the author with requests',
  declined: 'Declined',
  withdrawn: 'Withdrawn by the author',
};

/** Most entries one amendment may hold (the API's 1 MB body fits about 3,000 plain value entries). */
export const MAX_AMENDMENT_ENTRIES = 5_000;

// ——— Entry payloads ———

const finite = z.number().refine(Number.isFinite, 'must be a finite number');
const text = (max: number) => plainText().trim().max(max);
const requiredText = (max: number, message = 'must not be empty') => plainText().trim().min(1, message).max(max);
const slug = z
  .string()
  .trim()
  .regex(/^[a-z0-9][a-z0-9.-]*$/, 'must be a lower-case slug such as codata-1989')
  .max(100);
const decimalText = z
  .string()
  .trim()
  .regex(/^-?(\d+(\.\d*)?|\.\d+)([eE][+-]?\d+)?$/, 'must be a decimal number as the source prints it, such as -393.51');

/** A value with its standard uncertainty (null: the source states none). */
export const valueWithUncertaintySchema = z.object({
  value: finite,
  uncertainty: finite.refine((u) => u >= 0, 'must not be negative').nullable(),
});

/** The uncertainty as the source states it (see seeds/library/FORMAT.md, `uncertainty_kind`). */
export const statedUncertaintyInputSchema = z.object({
  kind: uncertaintyKindSchema,
  value: finite.refine((u) => u >= 0, 'must not be negative').nullable(),
  k: finite
    .refine((k) => k > 0, 'must be above 0')
    .nullable()
    .optional(),
});

/** A source given by its words: becomes a new library source (key from the citation unless given). */
export const citedSourceSchema = z.object({
  citation: requiredText(1_000, 'Write the citation.').min(3, 'Write the citation.'),
  key: slug.optional(),
  kind: sourceKindSchema.optional(),
  authors: text(1_000).optional(),
  title: text(1_000).optional(),
  publication: text(500).optional(),
  year: z.number().int().min(1500).max(2100).optional(),
  volume: text(50).optional(),
  pages: text(50).optional(),
  doi: text(200).optional(),
  url: text(1_000).optional(),
});
export type CitedSource = z.infer<typeof citedSourceSchema>;

/**
 * Where an entry's value comes from: an existing source by id, a source by key (one of the
 * library's, or one a `set-source` entry earlier in the amendment adds), or a citation.
 */
export const sourceInputSchema = z.union([
  z.uuid({ message: 'Give a source id, {"key"} or {"citation"}.' }),
  z.object({ key: slug }).strict(),
  citedSourceSchema,
]);
export type SourceInput = z.infer<typeof sourceInputSchema>;

/** A species by its id (a uuid) or its key in the equation language ("CO2(g)"). */
export const speciesRefSchema = z.string().trim().min(1, 'Name the species by id or key.').max(200);

const selectionFields = {
  /** Make this the selected value (or model) of the species; default true. */
  select: z.boolean().optional(),
  selectionReason: text(500).optional(),
};

const valueFields = {
  /** The value as the source prints it (digits kept); must equal `value`. */
  valueText: decimalText.optional(),
  stated: statedUncertaintyInputSchema.optional(),
  // Optional fields left out keep what the library has for that value; null clears them.
  table: text(200).nullable().optional(),
  entryNote: text(500).nullable().optional(),
  provenance: provenanceSchema.optional(),
  provenanceNote: text(2_000).nullable().optional(),
  pressureBar: z.union([z.literal(1), z.literal(1.01325)]).optional(),
  ionConvention: z.enum(['thermal-electron', 'ion']).nullable().optional(),
  /** Only with provenance `derived`: how the value was derived (kept with the value). */
  derivation: z.record(z.string(), z.unknown()).optional(),
  ...selectionFields,
};

/**
 * A new or revised ΔfH° (or S°) of a species from one source. Matched by (species, property,
 * source): an existing value from that source is revised, otherwise a value is added.
 * The minimal form: `{"kind": "revise-value", "species": id, "deltaFH": {"value", "uncertainty"},
 * "source": {"citation"} | id}`.
 */
export const reviseValueEntrySchema = z
  .object({
    kind: z.literal('revise-value'),
    species: speciesRefSchema,
    /** ΔfH°(298.15 K), kJ/mol. */
    deltaFH: valueWithUncertaintySchema.optional(),
    /** S°(298.15 K), J/(mol K). */
    entropy: valueWithUncertaintySchema.optional(),
    source: sourceInputSchema,
    ...valueFields,
  })
  .refine((e) => (e.deltaFH === undefined) !== (e.entropy === undefined), {
    message: 'Give deltaFH or entropy (one property per entry).',
    path: ['deltaFH'],
  });

/** A team's derived ΔfH° (team_derived_values) proposed to the library, with its derivation. */
export const teamValueEntrySchema = z.object({
  kind: z.literal('team-value'),
  teamId: z.uuid(),
  derivedValueId: z.uuid(),
  /** Where the measurements it rests on are published; default: the project's own derivation source. */
  source: sourceInputSchema.optional(),
  note: text(2_000).optional(),
  ...selectionFields,
});

/** A new species (or a correction of an existing one's names and identifiers), by its key. */
export const setSpeciesEntrySchema = z.object({
  kind: z.literal('set-species'),
  /** The species in the equation language with its phase: "C9H10O2(l, benzyl acetate)". */
  key: requiredText(200),
  name: requiredText(200),
  // Left out: kept as the library has them (for a correction); null clears them.
  synonyms: z.array(requiredText(200)).max(50).optional(),
  cas: text(20).nullable().optional(),
  inchikey: text(27).nullable().optional(),
  inchi: text(2_000).nullable().optional(),
  note: text(2_000).nullable().optional(),
});

/** A new or revised heat-capacity model of a species from one source (seeds/library/FORMAT.md). */
export const setModelEntrySchema = z.object({
  kind: z.literal('set-model'),
  species: speciesRefSchema,
  source: sourceInputSchema,
  scale: thermoScaleSchema,
  forms: z.array(thermoFormSchema).min(1).max(20),
  entryNote: text(500).nullable().optional(),
  provenance: provenanceSchema.optional(),
  provenanceNote: text(2_000).nullable().optional(),
  ...selectionFields,
});

/** A new or corrected measured reaction, by key; every species written as its library key. */
export const addReactionEntrySchema = z.object({
  kind: z.literal('add-reaction'),
  /** Stable slug; an existing key revises that reaction. Default: made from the equation. */
  key: slug.optional(),
  equation: requiredText(2_000),
  /** ΔrH per mole of reaction as written, kJ/mol, at `temperature`. */
  deltaH: valueWithUncertaintySchema,
  valueText: decimalText.optional(),
  stated: statedUncertaintyInputSchema.optional(),
  /** K; default 298.15. */
  temperature: finite.refine((t) => t > 0, 'must be above 0 K').optional(),
  method: reactionMethodSchema,
  /** mol/kg, for a solution or dilution enthalpy at finite concentration. */
  molality: finite
    .refine((m) => m > 0, 'must be above 0 mol/kg')
    .nullable()
    .optional(),
  /** False when it restates values the library holds (left out of Hess sums); default true. */
  independent: z.boolean().optional(),
  source: sourceInputSchema,
  table: text(200).nullable().optional(),
  provenance: provenanceSchema.optional(),
  note: text(2_000).nullable().optional(),
});

/** A change of the selected ΔfH°, S° or heat-capacity model: the value (or model) from `source`. */
export const selectValueEntrySchema = z.object({
  kind: z.literal('select-value'),
  species: speciesRefSchema,
  property: z.enum(['dfH298', 'S298', 'cp']),
  source: sourceInputSchema,
  reason: requiredText(500),
});

/** A new source, or a correction of one (`id`); the key is its identity and never changes. */
export const setSourceEntrySchema = z.object({
  kind: z.literal('set-source'),
  id: z.uuid().optional(),
  source: z.object({
    key: slug,
    kind: sourceKindSchema,
    authors: requiredText(1_000),
    title: requiredText(1_000),
    publication: text(500).nullable().optional(),
    year: z.number().int().min(1500).max(2100).nullable().optional(),
    volume: text(50).nullable().optional(),
    pages: text(50).nullable().optional(),
    doi: text(200).nullable().optional(),
    isbn: text(50).nullable().optional(),
    url: text(1_000).nullable().optional(),
    note: text(2_000).nullable().optional(),
  }),
});

/** Marks a value, model or measured reaction as checked against its source (provenance → checked). */
export const markCheckedEntrySchema = z.object({
  kind: z.literal('mark-checked'),
  target: z.enum(['value', 'model', 'reaction']),
  id: z.uuid(),
  note: text(2_000).optional(),
});

/** Closes a row: it stays in earlier revisions and leaves the library from this one on. */
export const deprecateEntrySchema = z.object({
  kind: z.literal('deprecate'),
  target: z.enum(['species', 'value', 'model', 'reaction', 'source']),
  id: z.uuid(),
  reason: requiredText(2_000),
});

export const amendmentEntrySchema = z.discriminatedUnion('kind', [
  reviseValueEntrySchema,
  teamValueEntrySchema,
  setSpeciesEntrySchema,
  setModelEntrySchema,
  addReactionEntrySchema,
  selectValueEntrySchema,
  setSourceEntrySchema,
  markCheckedEntrySchema,
  deprecateEntrySchema,
]);
export type AmendmentEntry = z.infer<typeof amendmentEntrySchema>;
export type AmendmentEntryKind = AmendmentEntry['kind'];
export const amendmentEntryKinds = [
  'revise-value',
  'team-value',
  'set-species',
  'set-model',
  'add-reaction',
  'select-value',
  'set-source',
  'mark-checked',
  'deprecate',
] as const satisfies readonly AmendmentEntryKind[];
export const amendmentEntryKindSchema = z.enum(amendmentEntryKinds);

// ——— Requests ———

/** POST /api/v1/amendments and PUT /api/v1/amendments/:id. */
export const amendmentInputSchema = z.object({
  title: requiredText(200, 'Give the amendment a title.').min(3, 'Give the amendment a title of a few words.'),
  rationale: requiredText(10_000, 'Say why the library should change.'),
  entries: z
    .array(amendmentEntrySchema)
    .min(1, 'An amendment holds at least one entry.')
    .max(MAX_AMENDMENT_ENTRIES, `An amendment holds at most ${MAX_AMENDMENT_ENTRIES} entries.`),
});
export type AmendmentInput = z.infer<typeof amendmentInputSchema>;

/** POST …/return and …/decline. */
export const amendmentReasonInputSchema = z.object({
  reason: requiredText(5_000, 'Say why.').min(3, 'Say why in a few words.'),
});
export type AmendmentReasonInput = z.infer<typeof amendmentReasonInputSchema>;

/** POST …/comments. */
export const amendmentCommentInputSchema = z.object({ body: requiredText(10_000, 'Write the comment.') });
export type AmendmentCommentInput = z.infer<typeof amendmentCommentInputSchema>;

export const amendmentParamsSchema = z.object({ amendmentId: z.uuid({ message: 'Not an amendment id.' }) });

export const amendmentSorts = ['newest', 'oldest', 'updated', 'title'] as const;

/** GET /api/v1/amendments query. */
export const amendmentListQuerySchema = z.object({
  /** One state or several, comma-separated ("open,returned"). */
  state: z
    .string()
    .max(100)
    .transform((v) => v.split(',').map((s) => s.trim()))
    .pipe(z.array(amendmentStateSchema).min(1))
    .optional(),
  /** "me", or a user id. */
  author: z.union([z.literal('me'), z.uuid({ message: 'Write "me" or a user id.' })]).optional(),
  /** A species id or key: amendments with an entry about it. */
  species: z.string().trim().min(1).max(200).optional(),
  /** Only amendments waiting longer than this: days since they were last opened (drafts: created). */
  olderThanDays: z.coerce.number().int().min(0).max(3_650).optional(),
  sort: z.enum(amendmentSorts).default('newest'),
  limit: z.coerce.number().int().min(1).max(200).default(50),
  offset: z.coerce.number().int().min(0).max(1_000_000).default(0),
});
export type AmendmentListQuery = z.infer<typeof amendmentListQuerySchema>;

/** GET /api/v1/amendments/:id query: `impact=false` leaves the impact out (it costs a dry run). */
export const amendmentReadQuerySchema = z.object({ impact: z.enum(['true', 'false']).default('true') });

// ——— Replies ———

const person = z.object({ id: z.uuid().nullable(), name: z.string() });
const dateTime = z.iso.datetime({ offset: true });

/** One side of a diff line: a value, uncertainty and source, or a description (species, model). */
export const diffSideSchema = z.object({
  value: z.number().nullable(),
  valueText: z.string().nullable(),
  /** Standard uncertainty. */
  uncertainty: z.number().nullable(),
  unit: z.string().nullable(),
  source: z.object({ id: z.uuid().nullable(), key: z.string(), citation: z.string() }).nullable(),
  provenance: provenanceSchema.nullable(),
  /** Words for what is not a number: a species' name, a model's kind and range, a reaction. */
  text: z.string().nullable(),
});
export type DiffSide = z.infer<typeof diffSideSchema>;

export const targetTypes = ['species', 'value', 'model', 'reaction', 'selection', 'source'] as const;

export const diffItemSchema = z.object({
  /** Index of the entry (from 0). */
  entry: z.number().int(),
  kind: amendmentEntryKindSchema,
  target: z.object({
    type: z.enum(targetTypes),
    /** Words: "ΔfH° of CO2(g) from codata-1989". */
    label: z.string(),
    speciesId: z.uuid().nullable(),
    speciesKey: z.string().nullable(),
    property: z.enum(['dfH298', 'S298', 'cp']).nullable(),
    /** Stable identity used to detect conflicting changes. */
    identity: z.string(),
  }),
  action: z.enum(['add', 'revise', 'select', 'check', 'deprecate', 'unchanged']),
  old: diffSideSchema.nullable(),
  new: diffSideSchema.nullable(),
  /** When the entry also changes which value is selected. */
  selection: z.object({ from: diffSideSchema.nullable(), to: diffSideSchema }).nullable(),
});
export type DiffItem = z.infer<typeof diffItemSchema>;

export const amendmentSourceSchema = z.object({
  id: z.uuid().nullable(),
  key: z.string(),
  citation: z.string(),
  /** Added to the library by this amendment. */
  isNew: z.boolean(),
});

export const amendmentSummarySchema = z.object({
  id: z.uuid(),
  title: z.string(),
  state: amendmentStateSchema,
  author: person,
  baseRevision: z.number().int(),
  /** The revision its acceptance made. */
  resultRevision: z.number().int().nullable(),
  /** The accepted amendment this one reverts. */
  revertOf: z.uuid().nullable(),
  origin: z.object({ kind: z.enum(['editor', 'import', 'revert']) }).catchall(z.unknown()),
  entryCount: z.number().int(),
  /** Keys of the species its entries are about (at most 20). */
  species: z.array(z.string()),
  commentCount: z.number().int(),
  createdAt: dateTime,
  updatedAt: dateTime,
  /** Last time it entered the review queue. */
  openedAt: dateTime.nullable(),
  /** When it was accepted, declined or withdrawn. */
  closedAt: dateTime.nullable(),
});
export type AmendmentSummary = z.infer<typeof amendmentSummarySchema>;

export const amendmentListSchema = z.object({ items: z.array(amendmentSummarySchema), total: z.number().int() });
export type AmendmentList = z.infer<typeof amendmentListSchema>;

export const amendmentCommentSchema = z.object({ id: z.uuid(), author: person, body: z.string(), createdAt: dateTime });
export type AmendmentComment = z.infer<typeof amendmentCommentSchema>;

export const amendmentEventSchema = z.object({
  action: amendmentActionSchema,
  from: amendmentStateSchema.nullable(),
  to: amendmentStateSchema,
  by: person.nullable(),
  at: dateTime,
  reason: z.string().nullable(),
  /** For rebase: the revisions; for accept: the revision made. */
  detail: z.record(z.string(), z.unknown()),
});

/** A later revision that changed what this amendment changes. */
export const amendmentConflictSchema = z.object({
  revision: z.number().int(),
  amendmentId: z.uuid().nullable(),
  title: z.string(),
  targets: z.array(z.object({ identity: z.string(), label: z.string() })),
});
export type AmendmentConflict = z.infer<typeof amendmentConflictSchema>;

const energy = z.object({ value: z.number(), uncertainty: z.number().nullable() });

/** What accepting the amendment now would change (computed on a dry run against the current revision). */
export const amendmentImpactSchema = z.object({
  /** The revision the dry run started from. */
  revision: z.number().int(),
  status: z.enum(['applies', 'does-not-apply']),
  problems: z.array(z.object({ entry: z.number().int().nullable(), message: z.string() })),
  /** Reactions of the demo scenario (and, later, saved reaction sets) whose species change. */
  reactions: z.array(
    z.object({
      id: z.string(),
      label: z.string(),
      equation: z.string(),
      origin: z.object({ kind: z.enum(['demo-scenario', 'saved-set']), team: z.string().nullable() }),
      entries: z.array(z.number().int()),
      old: energy.nullable(),
      new: energy.nullable(),
      /** new − old, kJ/mol. */
      change: z.number().nullable(),
      problem: z.string().nullable(),
    }),
  ),
  /** Derived values (the library's and the caller's teams') whose inputs change. */
  derivedValues: z.array(
    z.object({
      kind: z.enum(['library', 'team']),
      id: z.uuid(),
      team: z.object({ id: z.uuid(), name: z.string() }).nullable(),
      speciesKey: z.string(),
      old: energy,
      /** old + Σ weight × (input after − input before). */
      new: z.object({ value: z.number() }),
      change: z.number(),
      inputs: z.array(
        z.object({ input: z.string(), label: z.string(), weight: z.string(), old: z.number(), new: z.number() }),
      ),
    }),
  ),
  /** Derived values of teams the caller does not belong to that would shift (count only). */
  otherTeamValues: z.number().int(),
  /** The consistency check for species whose selected ΔfH° changes and that measurements cover. */
  consistency: z.array(
    z.object({
      species: z.string(),
      entries: z.array(z.number().int()),
      proposed: energy,
      /** The fit of the measurements with the proposed value as one of them. */
      fit: energy.nullable(),
      birgeRatio: z.number().nullable(),
      measurements: z.array(
        z.object({
          reaction: z.string(),
          equation: z.string(),
          normalizedBefore: z.number().nullable(),
          normalizedAfter: z.number(),
          flaggedBefore: z.boolean(),
          flaggedAfter: z.boolean(),
          /** Flagged with the proposed value and not before. */
          becomesOutlier: z.boolean(),
        }),
      ),
      note: z.string().nullable(),
    }),
  ),
});
export type AmendmentImpact = z.infer<typeof amendmentImpactSchema>;

/** What the caller may do with the amendment now (the server decides again on each request). */
export const amendmentPermissionsSchema = z.object({
  edit: z.boolean(),
  open: z.boolean(),
  withdraw: z.boolean(),
  accept: z.boolean(),
  return: z.boolean(),
  decline: z.boolean(),
  rebase: z.boolean(),
  revert: z.boolean(),
  comment: z.boolean(),
});

// ——— Evidence files ———

/** The types evidence may have, as read from the content (never from the name or the client's claim). */
export const evidenceMediaTypes = {
  'application/pdf': 'PDF',
  'text/csv': 'CSV',
  'text/plain': 'plain text',
  'application/vnd.openxmlformats-officedocument.spreadsheetml.sheet': 'XLSX',
  'image/png': 'PNG image',
  'image/jpeg': 'JPEG image',
  'image/gif': 'GIF image',
  'image/webp': 'WebP image',
} as const;
export type EvidenceMediaType = keyof typeof evidenceMediaTypes;

export const evidenceFileSchema = z.object({
  id: z.uuid(),
  /** The name it was uploaded under (shown and offered on download; the file is stored under another). */
  name: z.string(),
  mediaType: z.string(),
  size: z.number().int(),
  sha256: z.string(),
  uploadedBy: person,
  createdAt: dateTime,
  /** Where to download it (always as an attachment). */
  href: z.string(),
});
export type EvidenceFile = z.infer<typeof evidenceFileSchema>;

export const evidenceFileListSchema = z.object({ items: z.array(evidenceFileSchema) });
export type EvidenceFileList = z.infer<typeof evidenceFileListSchema>;

export const evidenceFileParamsSchema = amendmentParamsSchema.extend({
  fileId: z.uuid({ message: 'Not a file id.' }),
});

export const amendmentDetailSchema = amendmentSummarySchema.extend({
  rationale: z.string(),
  entries: z.array(amendmentEntrySchema),
  /** Per entry, against the library at `baseRevision`. */
  diff: z.array(diffItemSchema),
  sources: z.array(amendmentSourceSchema),
  comments: z.array(amendmentCommentSchema),
  /** Evidence files (PDF, CSV, XLSX, images). */
  files: z.array(evidenceFileSchema),
  history: z.array(amendmentEventSchema),
  currentRevision: z.number().int(),
  /** Later revisions that changed the same things: accepting needs a rebase first. */
  conflicts: z.array(amendmentConflictSchema),
  /** Null in the replies of actions, and for accepted, declined and withdrawn amendments. */
  impact: amendmentImpactSchema.nullable(),
  allowed: amendmentPermissionsSchema,
});
export type AmendmentDetail = z.infer<typeof amendmentDetailSchema>;

/** GET /api/v1/amendments/counts: for the navigation. */
export const amendmentCountsSchema = z.object({
  /** Drafts count only the caller's own. */
  byState: z.record(amendmentStateSchema, z.number().int()),
  /** Open amendments by others the caller may review (null when the caller is not a curator). */
  awaitingReview: z.number().int().nullable(),
  /** The caller's own amendments that need their action: drafts and returned ones. */
  needsMyAction: z.number().int(),
});
export type AmendmentCounts = z.infer<typeof amendmentCountsSchema>;
