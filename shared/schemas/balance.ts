import { z } from 'zod';

/** An exact rational written as text: "3", "-2", "1/2". */
export const fractionTextSchema = z
  .string()
  .regex(/^-?\d+(\/\d+)?$/, 'Write an exact fraction such as 3, 1/2 or -3/2.');

/** POST /api/v1/balance request. Public and stable: outside scripts use these field names. */
export const balanceInputSchema = z.object({
  equation: z.string().min(1, 'Type an equation.').max(10_000),
  /** Coefficients to hold fixed, keyed by term index (from 0, in input order). */
  fixed: z.record(z.string().regex(/^\d+$/, 'Term indexes are whole numbers from 0.'), fractionTextSchema).optional(),
  /** Term index whose coefficient becomes 1 (others follow as exact fractions). */
  normaliseTo: z.number().int().min(0).optional(),
});
export type BalanceInput = z.infer<typeof balanceInputSchema>;

export const balanceTermSchema = z.object({
  formula: z.string(),
  hill: z.string(),
  phase: z.string().nullable(),
  descriptor: z.string().nullable(),
  charge: z.number().int(),
  side: z.enum(['reactant', 'product']),
  coefficient: fractionTextSchema,
  /** Added: atoms per formula unit as exact fractions ("4", "9/2"), keys in order of first appearance. */
  composition: z.record(z.string(), fractionTextSchema).optional(),
});
export type BalanceTerm = z.infer<typeof balanceTermSchema>;

export const imbalanceRowSchema = z.object({
  element: z.string(),
  reactants: fractionTextSchema,
  products: fractionTextSchema,
});
export type ImbalanceRow = z.infer<typeof imbalanceRowSchema>;

export const balanceWarningSchema = z.object({
  code: z.string(),
  message: z.string(),
  /** Term index the warning concerns, when it concerns one. */
  term: z.number().int().optional(),
  column: z.number().int().optional(),
  /** Added: whether the warning is about how the text was read or about the balancing. */
  stage: z.enum(['reading', 'balancing']).optional(),
});

/** Added to `impossible` replies: why, as data (`reason` says it in words). Term indexes from 0. */
export const impossibleReasonSchema = z.object({
  code: z.enum(['one_side', 'only_zero', 'must_vanish', 'must_change_side', 'no_positive_balancing']),
  /** Terms that would have to vanish or change side. */
  terms: z.array(z.number().int()).optional(),
  /** Elements (or "charge") found on one side only, or that cannot all balance. */
  elements: z.array(z.string()).optional(),
});

/** POST /api/v1/balance reply. */
export const balanceResultSchema = z.object({
  status: z.enum(['balanced', 'multiple', 'impossible']),
  equation: z.string(),
  terms: z.array(balanceTermSchema),
  asGiven: z.boolean(),
  givenImbalance: z.array(imbalanceRowSchema).optional(),
  dimension: z.number().int().optional(),
  basis: z.array(z.array(fractionTextSchema)).optional(),
  /** Added: true when `basis` lists fewer vectors than `dimension` (the reply's work limit). */
  basisTruncated: z.boolean().optional(),
  reason: z.string().optional(),
  impossible: impossibleReasonSchema.optional(),
  warnings: z.array(balanceWarningSchema),
  /**
   * ΔH of the returned equation in kJ per mole of reaction as written (negative = exothermic), when
   * the input stated one (trailing ΔH or heat term) and the answer is a multiple of the input.
   * Added by the chemistry core; optional, so older clients can ignore it.
   */
  enthalpy: z.object({ value: z.number(), unit: z.literal('kJ/mol'), uncertainty: z.number().optional() }).optional(),
});
export type BalanceResult = z.infer<typeof balanceResultSchema>;

/** Details carried by a `parse_error`: where the input could not be read (line and column from 1). */
export const parseErrorDetailsSchema = z.object({
  line: z.number().int().min(1),
  column: z.number().int().min(1),
  offset: z.number().int().min(0),
  excerpt: z.string(),
  expected: z.array(z.string()),
  /** Added: length of the faulty text from `offset` (0 when something is missing). */
  length: z.number().int().min(0).optional(),
});
export type ParseErrorDetails = z.infer<typeof parseErrorDetailsSchema>;

/** Details carried by a `payload_too_large` error from the chemistry core: which limit, its value and what was found. */
export const workLimitDetailsSchema = z.object({
  limit: z.enum(['terms', 'species', 'lines', 'characters']),
  max: z.number().int(),
  found: z.number().int(),
});
export type WorkLimitDetails = z.infer<typeof workLimitDetailsSchema>;
