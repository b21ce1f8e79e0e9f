/**
 * Work limits: how much one call of the core may be asked to do. The parser counts before the
 * work starts and throws `WorkLimitError` (code `payload_too_large`) when a count is over its limit;
 * replies that could grow without bound (the basis of a `multiple` answer) are cut to size instead,
 * with a flag and a warning. The defaults serve real chemistry generously.
 */
import { WorkLimitError } from './errors';
import { argumentMessages, type WorkLimitName } from './messages';

export type { WorkLimitName } from './messages';

/** Limits on the work of one call. All are whole numbers ≥ 1. */
export interface WorkLimits {
  /** Terms per equation (species and heat terms, both sides). Default 80. */
  maxTerms: number;
  /** Distinct species per equation (same formula, charge and phase count once). Default 60. */
  maxSpecies: number;
  /** Basis vectors listed in a reply with several balancings; the dimension is always given. Default 20. */
  maxBasisVectors: number;
  /** Equation lines per batch (blank and "#" lines not counted). Default 2,000. */
  maxLines: number;
  /** Characters per batch text (UTF-16 code units, as JavaScript counts). Default 250,000. */
  maxCharacters: number;
}

/** The default limits. */
export const DEFAULT_WORK_LIMITS: Readonly<WorkLimits> = Object.freeze({
  maxTerms: 80,
  maxSpecies: 60,
  maxBasisVectors: 20,
  maxLines: 2_000,
  maxCharacters: 250_000,
});

/**
 * Deepest bracket nesting the parser reads (groups, complexes). A fixed part of the language, not
 * a tunable limit: it keeps the parser's recursion far from the stack's end whatever the input.
 */
export const MAX_NESTING = 32;

/** Digits allowed in a subscript or multiplier: keeps every count exact and far below 2^53. */
export const MAX_COUNT_DIGITS = 9;

/** The defaults with the given overrides; throws RangeError for a limit that is not a whole number ≥ 1. */
export function resolveWorkLimits(overrides?: Partial<WorkLimits>): WorkLimits {
  if (overrides === undefined) return DEFAULT_WORK_LIMITS;
  const limits: WorkLimits = { ...DEFAULT_WORK_LIMITS };
  for (const name of Object.keys(DEFAULT_WORK_LIMITS) as Array<keyof WorkLimits>) {
    const value = overrides[name];
    if (value === undefined) continue; // unset in the caller's configuration: keep the default
    if (!Number.isSafeInteger(value) || value < 1) throw new RangeError(argumentMessages.badWorkLimit(name));
    limits[name] = value;
  }
  return limits;
}

/** Throws `WorkLimitError` when `found` is over `max`. */
export function checkWorkLimit(limit: WorkLimitName, max: number, found: number): void {
  if (found > max) throw new WorkLimitError(limit, max, found);
}
