/**
 * The curators' consistency fit in words and figures: the fitted value against the library's, the
 * Birge ratio explained, the residuals' flags. Pure.
 */
import type { ConsistencyResult } from '@shared/schemas/derive';
import { formatSignificant } from './uncertainty-rounding';

type Fitted = ConsistencyResult['fitted'][number];

export interface Comparison {
  /** fitted − library, kJ/mol. */
  difference: number;
  /** The difference over √(u_fit² + u_lib²) (u_lib left out when not stated), or null without any u. */
  sigmas: number | null;
  /** Whether the library's value had no uncertainty, so σ is the fit's alone. */
  fitOnly: boolean;
}

/** How far the library's value lies from the fitted one, in kJ/mol and in combined standard deviations. */
export function compareWithLibrary(f: Fitted): Comparison | null {
  if (!f.library) return null;
  const difference = f.value - f.library.value;
  const uLib = f.library.uncertainty;
  const spread = Math.sqrt(f.uncertainty ** 2 + (uLib ?? 0) ** 2);
  return { difference, sigmas: spread > 0 ? difference / spread : null, fitOnly: uLib === null };
}

/**
 * The Birge ratio R_B = √(χ²/ν) in a sentence: near 1 the measurements scatter as their stated
 * uncertainties lead one to expect; well above 1 they scatter more than stated; well below 1 less.
 * The thresholds are rough guides (common practice, no source): |R_B − 1| beyond about
 * √(2/ν)·2 is notable.
 */
export function birgeSentence(ratio: number | null, degreesOfFreedom: number): string {
  if (ratio === null || degreesOfFreedom <= 0)
    return 'Not defined: there are no more measurements than fitted values, so nothing is left over to judge the scatter by.';
  // The Birge ratio's own spread for ν degrees of freedom is about 1/√(2ν).
  const spread = 1 / Math.sqrt(2 * degreesOfFreedom);
  const r = formatSignificant(ratio, 3, 2);
  if (ratio > 1 + 2 * spread)
    return `R_B = ${r}, well above 1: the measurements scatter more than their stated uncertainties allow. Some uncertainties are understated, or a measurement is wrong — look first at the flagged residuals.`;
  if (ratio < 1 - 2 * spread)
    return `R_B = ${r}, well below 1: the measurements agree better than their stated uncertainties suggest. The uncertainties may be overstated, or the measurements may not be independent.`;
  return `R_B = ${r}, close to 1 for ${degreesOfFreedom} degree${degreesOfFreedom === 1 ? '' : 's'} of freedom: the measurements scatter about as much as their stated uncertainties lead one to expect.`;
}

/** Flagged residuals lie beyond 2σ (the server's flag); the sentence for the count. */
export function flaggedSentence(result: ConsistencyResult): string {
  const n = result.residuals.filter((r) => r.flagged).length;
  if (n === 0) return 'No measurement lies beyond 2σ of the fit.';
  return `${n} measurement${n === 1 ? ' lies' : 's lie'} beyond 2σ of the fit (marked below).`;
}

export interface ExcludedGroup {
  reason: string;
  reactions: string[];
}

/** Measurements left out, grouped by their reason (in the order the reasons first appear). */
export function groupExcluded(excluded: ConsistencyResult['excluded']): ExcludedGroup[] {
  const groups = new Map<string, string[]>();
  for (const e of excluded) {
    const list = groups.get(e.reason);
    if (list) list.push(e.reaction);
    else groups.set(e.reason, [e.reaction]);
  }
  return [...groups].map(([reason, reactions]) => ({ reason, reactions }));
}

/**
 * A measured reaction's reference as a curator reads it: a library key stays as it is; an
 * internal id (`measured:<uuid>`) is shortened to its first eight hex digits, enough to tell the
 * rows of one fit apart (the full id goes in a title).
 */
export function shortReactionRef(ref: string): string {
  const match = /^measured:([0-9a-f]{8})-[0-9a-f-]+$/i.exec(ref);
  return match ? `measured ${match[1]}` : ref;
}
