import { z } from 'zod';
import { fractionTextSchema } from './balance';
import { emailSchema, idSchema, isoDateTimeSchema } from './common';
import { givenReactionSchema } from './derive';
import { revisionNumberSchema, sourceSchema } from './library';
import { provenanceSchema } from './library-core';
import { amountInputSchema, massUnitSchema, temperatureInputSchema, warningSchema } from './reaction-enthalpy';
import { calorimetryRunItemSchema, calorimetryRunValueSchema } from './reaction-sets-calorimetry';
import { plainText } from './text';

/**
 * Reaction sets (/api/v1/teams/:teamId/sets…, /api/v1/shared/:token…): a team's saved work —
 * reactions with their settings, given reactions with their ΔH, derivations, batch quantities,
 * calorimetry runs and notes — with the library revision it uses. Energies are kJ/mol per mole of
 * reaction as written, uncertainties standard (k = 1), null when not stated; ΔH < 0 releases heat.
 */

/** Bounds of one set: every evaluation of a set (share links included) is bounded by them. */
export const SET_LIMITS = {
  items: 200,
  /** Derivations search for routes (up to 2 s each), so a set holds fewer of them. */
  derivations: 10,
  tags: 20,
  title: 200,
  description: 10_000,
  note: 10_000,
  equation: 2_000,
} as const;

export const setItemIdSchema = z.string().regex(/^[A-Za-z0-9_-]{1,64}$/, 'An item id is 1–64 letters, digits, - or _.');

const label = plainText().trim().max(200, 'A label may be up to 200 characters.');
const equation = (what: string) =>
  plainText()
    .trim()
    .min(1, `Type the ${what}.`)
    .max(SET_LIMITS.equation, `A ${what} may be up to ${SET_LIMITS.equation.toLocaleString('en')} characters.`);
const finiteNumber = z.number().refine(Number.isFinite, 'Must be a finite number.');

/** A reaction evaluated from the library at the set's revision, at 298.15 K or at T. */
export const reactionItemSchema = z.object({
  kind: z.literal('reaction'),
  id: setItemIdSchema.optional(),
  label: label.optional(),
  equation: equation('equation'),
  temperature: temperatureInputSchema.optional(),
  /** How the set shows its energies (stored as kJ/mol whatever is chosen). */
  unit: z.enum(['kJ/mol', 'kcal/mol']).optional(),
});

/** A reaction with a ΔH the team measured or took from elsewhere (`source` says where). */
export const givenReactionItemSchema = givenReactionSchema.extend({
  kind: z.literal('given-reaction'),
  id: setItemIdSchema.optional(),
  label: label.optional(),
  equation: equation('reaction'),
  source: plainText().trim().max(500, 'A source may be up to 500 characters.').optional(),
});

/** One step of a route as the derive API names it: which reaction, and its multiplier. */
export const routeStepRefSchema = z.object({
  kind: z.enum(['formation', 'measured', 'given', 'derived']),
  id: z.string().max(200).optional(),
  index: z.number().int().min(0).max(100).optional(),
  multiplier: fractionTextSchema,
});

/** The route a derivation keeps: its rank when chosen and its steps, which find it again. */
export const routeChoiceSchema = z.object({
  index: z.number().int().min(0).max(19),
  steps: z.array(routeStepRefSchema).min(1).max(50),
});
export type RouteChoice = z.infer<typeof routeChoiceSchema>;

/** A Hess's-law derivation: the target, what it derives from, and the chosen route (null: the headline value). */
export const derivationItemSchema = z.object({
  kind: z.literal('derivation'),
  id: setItemIdSchema.optional(),
  label: label.optional(),
  target: equation('target reaction'),
  using: z.enum(['library', 'given', 'both']).optional(),
  reactions: z.array(givenReactionSchema).max(100, 'At most 100 given reactions.').optional(),
  maxRoutes: z.number().int().min(1).max(20).optional(),
  route: routeChoiceSchema.nullable().optional(),
});

/** Heat for batch quantities of one reaction (as POST /reaction-heat takes them). */
export const quantitiesItemSchema = z.object({
  kind: z.literal('quantities'),
  id: setItemIdSchema.optional(),
  label: label.optional(),
  equation: equation('equation'),
  temperature: temperatureInputSchema.optional(),
  amounts: z.array(amountInputSchema).min(1, 'Give the amount of at least one species.').max(40),
  batch: z
    .object({
      mass: z.object({ value: finiteNumber.positive(), unit: massUnitSchema }),
      cp: z.object({ value: finiteNumber.positive(), unit: z.literal('J/(g K)') }),
    })
    .optional(),
});

export type AmountInputs = z.infer<typeof quantitiesItemSchema>['amounts'];

export const noteItemSchema = z.object({
  kind: z.literal('note'),
  id: setItemIdSchema.optional(),
  label: label.optional(),
  text: plainText().max(SET_LIMITS.note, `A note may be up to ${SET_LIMITS.note.toLocaleString('en')} characters.`),
});

/** Every kind of item a set holds, as sent (ids may be left out: the server gives one). */
export const setItemInputSchema = z.discriminatedUnion('kind', [
  reactionItemSchema,
  givenReactionItemSchema,
  derivationItemSchema,
  quantitiesItemSchema,
  noteItemSchema,
  calorimetryRunItemSchema,
]);
export type SetItemInput = z.infer<typeof setItemInputSchema>;
export type SetItemKind = SetItemInput['kind'];
export const setItemKinds = [
  'reaction',
  'given-reaction',
  'derivation',
  'quantities',
  'note',
  'calorimetry-run',
] as const satisfies readonly SetItemKind[];

/** An item as stored: with its id. */
export type SetItem = SetItemInput & { id: string };
export const setItemSchema = setItemInputSchema.and(z.object({ id: setItemIdSchema })) as unknown as z.ZodType<SetItem>;

/** A set follows the newest library revision, or is pinned to one. */
export const setRevisionSchema = z.union([z.literal('latest'), revisionNumberSchema], {
  message: 'Write a revision number such as 3, or "latest".',
});
export type SetRevision = z.infer<typeof setRevisionSchema>;

export const tagSchema = plainText()
  .trim()
  .min(1, 'A tag is not empty.')
  .max(40, 'A tag may be up to 40 characters.')
  .regex(/^[^,]+$/, 'A tag holds no comma.');

function checkItems(items: readonly SetItemInput[] | undefined, ctx: z.RefinementCtx, path: (string | number)[]) {
  if (!items) return;
  const seen = new Set<string>();
  items.forEach((item, i) => {
    if (item.id === undefined) return;
    if (seen.has(item.id))
      ctx.addIssue({ code: 'custom', path: [...path, i, 'id'], message: `Item id ${item.id} is used twice.` });
    seen.add(item.id);
  });
  const derivations = items.filter((i) => i.kind === 'derivation').length;
  if (derivations > SET_LIMITS.derivations)
    ctx.addIssue({
      code: 'custom',
      path,
      message: `A set may hold up to ${SET_LIMITS.derivations} derivations (it has ${derivations}).`,
    });
}

const setFields = {
  title: plainText()
    .trim()
    .min(1, 'Give the set a title.')
    .max(SET_LIMITS.title, `A title may be up to ${SET_LIMITS.title} characters.`),
  description: plainText().max(
    SET_LIMITS.description,
    `A description may be up to ${SET_LIMITS.description.toLocaleString('en')} characters.`,
  ),
  tags: z.array(tagSchema).max(SET_LIMITS.tags, `At most ${SET_LIMITS.tags} tags.`),
  items: z
    .array(setItemInputSchema)
    .max(SET_LIMITS.items, `A set may hold up to ${SET_LIMITS.items} items; split larger work into several sets.`),
  revision: setRevisionSchema,
};

/** POST /teams/:teamId/sets. Without `revision` the set is pinned to the newest revision. */
export const createSetInputSchema = z
  .object({
    title: setFields.title,
    description: setFields.description.optional(),
    tags: setFields.tags.optional(),
    items: setFields.items.optional(),
    revision: setFields.revision.optional(),
  })
  .superRefine((input, ctx) => checkItems(input.items, ctx, ['items']));
export type CreateSetInput = z.infer<typeof createSetInputSchema>;

/**
 * PUT /teams/:teamId/sets/:setId: the whole set as edited, with the version the edit started
 * from. A field left out keeps its current value. A stale version → 409 with the current set.
 */
export const updateSetInputSchema = z
  .object({
    version: z.number({ message: 'Send the version you edited.' }).int().min(1),
    title: setFields.title.optional(),
    description: setFields.description.optional(),
    tags: setFields.tags.optional(),
    items: setFields.items.optional(),
    revision: setFields.revision.optional(),
  })
  .superRefine((input, ctx) => checkItems(input.items, ctx, ['items']));
export type UpdateSetInput = z.infer<typeof updateSetInputSchema>;

/** What a version of a set holds (and what the diff compares). */
export const setStateSchema = z.object({
  title: z.string(),
  description: z.string(),
  tags: z.array(z.string()),
  items: z.array(setItemSchema),
  revision: z.union([z.literal('latest'), z.number().int()]),
});
export type SetState = z.infer<typeof setStateSchema>;

export const reactionSetSchema = setStateSchema.extend({
  id: idSchema,
  teamId: idSchema,
  version: z.number().int(),
  /** The owner: the member who created the set. */
  owner: z.string(),
  createdAt: isoDateTimeSchema,
  updatedBy: z.string(),
  updatedAt: isoDateTimeSchema,
});
export type ReactionSet = z.infer<typeof reactionSetSchema>;

export const setSummarySchema = z.object({
  id: idSchema,
  title: z.string(),
  description: z.string(),
  tags: z.array(z.string()),
  itemCount: z.number().int(),
  revision: z.union([z.literal('latest'), z.number().int()]),
  version: z.number().int(),
  owner: z.string(),
  updatedBy: z.string(),
  updatedAt: isoDateTimeSchema,
});
export type SetSummary = z.infer<typeof setSummarySchema>;

export const setListQuerySchema = z.object({
  /** Words in the title, description or tags. */
  q: z.string().max(200).optional(),
  tag: z.string().max(40).optional(),
  sort: z.enum(['title', 'owner', 'updated']).default('updated'),
  order: z.enum(['asc', 'desc']).optional(),
  limit: z.coerce.number().int().min(1).max(500).default(100),
  offset: z.coerce.number().int().min(0).max(1_000_000).default(0),
});
export type SetListQuery = z.infer<typeof setListQuerySchema>;

export const setListSchema = z.object({ items: z.array(setSummarySchema), total: z.number().int() });
export type SetList = z.infer<typeof setListSchema>;

export const setCreatedSchema = reactionSetSchema;

export const setParamsSchema = z.object({ teamId: idSchema, setId: idSchema });
export const versionParamsSchema = setParamsSchema.extend({ version: z.coerce.number().int().min(1) });

/** The body of a 409: the set as it is now, so the page can show what changed. */
export const setConflictDetailsSchema = z.object({ currentVersion: z.number().int(), current: reactionSetSchema });

export const setVersionSummarySchema = z.object({
  version: z.number().int(),
  createdAt: isoDateTimeSchema,
  by: z.string(),
  summary: z.string(),
});
export type SetVersionSummary = z.infer<typeof setVersionSummarySchema>;
export const setVersionListSchema = z.object({ items: z.array(setVersionSummarySchema), total: z.number().int() });
export const setVersionSchema = setVersionSummarySchema.extend({ state: setStateSchema });
export type SetVersion = z.infer<typeof setVersionSchema>;

export const setDiffQuerySchema = z.object({
  from: z.coerce.number().int().min(1),
  to: z.coerce.number().int().min(1),
});

export const fieldChangeSchema = z.object({
  field: z.enum(['title', 'description', 'tags', 'revision']),
  before: z.unknown(),
  after: z.unknown(),
});
export const itemChangeSchema = z.object({
  id: z.string(),
  change: z.enum(['added', 'removed', 'changed']),
  /** Words for the item ("Reaction: C3H8(g) + 5 O2(g) -> …"). */
  label: z.string(),
  /** Fields of the item that differ (changed items only). */
  fields: z.array(z.string()),
  before: setItemSchema.nullable(),
  after: setItemSchema.nullable(),
});
export const setDiffSchema = z.object({
  fields: z.array(fieldChangeSchema),
  items: z.array(itemChangeSchema),
  /** True when the order of the items that both sides keep differs. */
  reordered: z.boolean(),
});
export type SetDiff = z.infer<typeof setDiffSchema>;
export const versionDiffSchema = setDiffSchema.extend({ from: z.number().int(), to: z.number().int() });

/** POST …/versions/:version/restore and …/move-to-latest: the version the caller last saw. */
export const versionGuardInputSchema = z.object({ version: z.number().int().min(1) });

// ─── Evaluation ───────────────────────────────────────────────────────────────

const energy = z.object({ value: z.number(), uncertainty: z.number().nullable(), unit: z.literal('kJ/mol') });
export const itemErrorSchema = z.object({ code: z.string(), message: z.string() });
const warnings = z.array(warningSchema);

export const evaluatedTermSchema = z.object({
  key: z.string(),
  name: z.string(),
  coefficient: fractionTextSchema,
  side: z.enum(['reactant', 'product']),
  deltaFH: z.object({ value: z.number(), uncertainty: z.number().nullable() }).nullable(),
  /** Library key of the source of the ΔfH° used. */
  source: z.string().nullable(),
  provenance: provenanceSchema.nullable(),
});

const reactionValue = z.object({
  equation: z.string(),
  /** K. */
  temperature: z.number(),
  deltaH: energy,
  deltaH298: energy.nullable(),
  uncertaintyComplete: z.boolean(),
  uncertaintyMissing: z.array(z.string()),
  terms: z.array(evaluatedTermSchema),
  sources: z.array(z.string()),
  warnings,
});

const givenValue = z.object({
  equation: z.string(),
  /** The ΔH as given, in kJ/mol, at `temperature` (K). */
  given: energy,
  temperature: z.number(),
  source: z.string().nullable(),
  /** ΔrH° of the same equation from the library at that temperature, for comparison. */
  library: energy.nullable(),
  libraryProblem: z.string().nullable(),
  sources: z.array(z.string()),
});

const derivationStep = z.object({
  equation: z.string(),
  multiplier: fractionTextSchema,
  deltaH: energy,
  kind: z.enum(['formation', 'measured', 'given', 'derived']),
  source: z.string().nullable(),
});
const derivationValue = z.object({
  target: z.string(),
  status: z.enum(['derived', 'unreachable']),
  /** The value the set reports: the chosen route's, or the derivation's headline when none is chosen. */
  deltaH: energy.nullable(),
  /** combined / best-route / single-route (headline), or chosen-route. */
  basis: z.enum(['combined', 'best-route', 'single-route', 'chosen-route']).nullable(),
  /** The headline of the derivation (all routes), beside the chosen one. */
  headline: energy.nullable(),
  /** The chosen route's steps; null without a chosen route, or when it is not found at this revision. */
  route: z.object({ rank: z.number().int(), steps: z.array(derivationStep) }).nullable(),
  routeMissing: z.boolean(),
  routes: z.number().int(),
  consistent: z.boolean(),
  uncertaintyComplete: z.boolean(),
  sources: z.array(z.string()),
  warnings,
});

const quantitiesValue = z.object({
  equation: z.string(),
  temperature: z.number(),
  deltaH: energy,
  extent: z.number(),
  limiting: z.string(),
  /** kJ, with the sign of ΔH (negative: released). */
  heat: z.object({ value: z.number(), uncertainty: z.number().nullable(), unit: z.literal('kJ') }),
  direction: z.enum(['released', 'absorbed', 'none']),
  adiabaticRise: z.number().nullable(),
  cautions: z.array(z.string()),
  sources: z.array(z.string()),
  warnings,
});

const result = <K extends string, V extends z.ZodType>(kind: K, value: V) =>
  z.object({
    itemId: z.string(),
    kind: z.literal(kind),
    /** Set when the item cannot be evaluated at this revision (the message names the problem). */
    error: itemErrorSchema.nullable(),
    value: value.nullable(),
  });

export const itemResultSchema = z.discriminatedUnion('kind', [
  result('reaction', reactionValue),
  result('given-reaction', givenValue),
  result('derivation', derivationValue),
  result('quantities', quantitiesValue),
  result('note', z.null()),
  result('calorimetry-run', calorimetryRunValueSchema),
]);
export type ItemResult = z.infer<typeof itemResultSchema>;
export type ReactionItemValue = z.infer<typeof reactionValue>;
export type GivenItemValue = z.infer<typeof givenValue>;
export type DerivationItemValue = z.infer<typeof derivationValue>;
export type QuantitiesItemValue = z.infer<typeof quantitiesValue>;

export const setEvaluationSchema = z.object({
  /** The set's version the results belong to. */
  version: z.number().int(),
  libraryRevision: z.number().int(),
  latestRevision: z.number().int(),
  evaluatedAt: isoDateTimeSchema,
  results: z.array(itemResultSchema),
  /** Every library source a result uses, in full (the set's bibliography). */
  sources: z.array(sourceSchema),
  /** What every reader must see: screening only, values typed from memory, incomplete uncertainties. */
  cautions: z.array(z.string()),
});
export type SetEvaluation = z.infer<typeof setEvaluationSchema>;

/** GET …/revision-changes: what moving a pinned set to the newest revision would change. */
export const revisionChangesSchema = z.object({
  pinned: z.number().int(),
  latest: z.number().int(),
  items: z.array(
    z.object({
      itemId: z.string(),
      kind: z.string(),
      label: z.string(),
      before: energy.nullable(),
      after: energy.nullable(),
      /** after − before, kJ/mol; null when either side has no value. */
      difference: z.number().nullable(),
      /** Why a side has no value. */
      problem: z.string().nullable(),
    }),
  ),
  /** Items whose value changes (or appears, or goes). */
  changed: z.number().int(),
});
export type RevisionChanges = z.infer<typeof revisionChangesSchema>;

// ─── Share links ──────────────────────────────────────────────────────────────

/** A share token as it appears in links: 22 + 43 URL-safe characters (selector and verifier). */
export const shareTokenSchema = z.string().max(200);
export const sharedParamsSchema = z.object({ token: shareTokenSchema });
export const linkParamsSchema = setParamsSchema.extend({ linkId: idSchema });

export const createLinkInputSchema = z.object({
  /** When the link stops working (ISO date-time, in the future); none: until revoked. */
  expiresAt: isoDateTimeSchema
    .refine((v) => Date.parse(v) > Date.now(), 'The expiry must be in the future.')
    .optional(),
  /** Also send the link to this address. */
  email: emailSchema.optional(),
});
export type CreateLinkInput = z.infer<typeof createLinkInputSchema>;

export const linkCreatedSchema = z.object({
  id: idSchema,
  url: z.string(),
  /** Shown once: only its hash is kept. */
  token: z.string(),
  expiresAt: isoDateTimeSchema.nullable(),
  emailedTo: z.string().nullable(),
});
export type LinkCreated = z.infer<typeof linkCreatedSchema>;

export const shareLinkSchema = z.object({
  id: idSchema,
  createdAt: isoDateTimeSchema,
  createdBy: z.string(),
  expiresAt: isoDateTimeSchema.nullable(),
  revokedAt: isoDateTimeSchema.nullable(),
  lastUsedAt: isoDateTimeSchema.nullable(),
  emailedTo: z.string().nullable(),
  state: z.enum(['active', 'expired', 'revoked']),
});
export type ShareLink = z.infer<typeof shareLinkSchema>;
export const shareLinkListSchema = z.object({ items: z.array(shareLinkSchema) });

/** GET /shared/:token: the set as shared — no ids, no team, no people — with its results. */
export const sharedSetSchema = setStateSchema.extend({
  version: z.number().int(),
  updatedAt: isoDateTimeSchema,
  evaluation: setEvaluationSchema,
});
export type SharedSet = z.infer<typeof sharedSetSchema>;

/** POST /shared/:token/copy: into a team of the signed-in caller (member or above). */
export const copySharedInputSchema = z.object({ teamId: idSchema });

// ─── Export and import ────────────────────────────────────────────────────────

export const SET_EXPORT_FORMAT = 'thermoledger.reaction-set';

/** The JSON export; POST /teams/:teamId/sets/import reads its `set` (the rest is for people and tools). */
export const setExportSchema = z.object({
  format: z.literal(SET_EXPORT_FORMAT),
  formatVersion: z.literal(1),
  exportedAt: isoDateTimeSchema,
  set: setStateSchema.extend({ version: z.number().int() }),
  evaluation: setEvaluationSchema,
});
export type SetExport = z.infer<typeof setExportSchema>;

export const setImportInputSchema = z.object({
  format: z.literal(SET_EXPORT_FORMAT, { message: `Not a reaction-set export (format "${SET_EXPORT_FORMAT}").` }),
  formatVersion: z.literal(1, { message: 'This export format version is not known.' }),
  set: z
    .object({
      title: setFields.title,
      description: setFields.description.default(''),
      tags: setFields.tags.default([]),
      items: setFields.items.default([]),
      revision: setFields.revision,
    })
    .superRefine((set, ctx) => checkItems(set.items, ctx, ['items'])),
});
export type SetImportInput = z.infer<typeof setImportInputSchema>;
