/**
 * The ΔrH°(T) plot of the enthalpy panel: which temperatures to ask the API for, and the gaps of
 * its reply as intervals to shade. Pure. T in K, ΔrH° in kJ/mol.
 */
import { REFERENCE_TEMPERATURE, TOLERATED_RANGE_START } from '@shared/chemistry/thermo/index';

export type CurveRange = { kind: 'range'; from: number; to: number; points: number } | { kind: 'none'; reason: string };

/** Points asked for: enough for a smooth line, well under the API's 200. */
export const CURVE_POINTS = 81;

/** A model range as the core uses it: a fit from exactly 300 K is used from 298.15 K. */
function effective([min, max]: readonly [number, number]): [number, number] {
  return [min === TOLERATED_RANGE_START ? REFERENCE_TEMPERATURE : min, max];
}

/**
 * The temperatures to plot: the user's `from`/`to` when both are given and ordered; otherwise
 * the range every species' model covers, widened by a tenth on each side (100 K at most, to multiples of 5 K) so the plot shows where
 * the models end (those temperatures come back as gaps). Without a model for some species,
 * there is no curve.
 */
export function curveRange(
  ranges: readonly ([number, number] | null)[],
  override: { from: number | null; to: number | null } = { from: null, to: null },
): CurveRange {
  if (override.from !== null && override.to !== null) {
    if (!(override.from > 0) || !(override.to > override.from))
      return { kind: 'none', reason: 'The plot range must run from a lower to a higher temperature above 0 K.' };
    return { kind: 'range', from: override.from, to: override.to, points: CURVE_POINTS };
  }
  if (ranges.length === 0) return { kind: 'none', reason: 'No species to plot.' };
  if (ranges.some((r) => r === null))
    return {
      kind: 'none',
      reason: 'Some species have no heat-capacity model in the library, so ΔrH° is known at 298.15 K only.',
    };
  const usable = (ranges as [number, number][]).map(effective);
  let lo = Math.max(...usable.map((r) => r[0]));
  let hi = Math.min(...usable.map((r) => r[1]));
  if (!(hi > lo)) {
    // No temperature where every model holds: show the whole span, all of it marked as gaps where it must be.
    lo = Math.min(...usable.map((r) => r[0]));
    hi = Math.max(...usable.map((r) => r[1]));
  }
  // Widened by a tenth on each side, out to whole multiples of 5 K so the axis reads cleanly.
  const pad = Math.min((hi - lo) / 10, 100);
  const from = Math.max(5, Math.floor((lo - pad) / 5) * 5);
  return { kind: 'range', from, to: Math.ceil((hi + pad) / 5) * 5, points: CURVE_POINTS };
}

/** A gap's reason without its own temperature, so a run of gaps with one cause reads once. */
export function gapReason(reason: string): string {
  return reason.replace(/^The reaction cannot be evaluated at [^:]*:\s*/, '');
}

/** A stretch of temperatures without a value, from the first to the last gap in a row. */
export interface GapInterval {
  from: number;
  to: number;
  reasons: string[];
}

/**
 * Runs of consecutive gap temperatures as intervals (between the neighbouring sample points, so
 * the shading reaches the last point that has a value).
 */
export function gapIntervals(
  points: readonly { temperature: number }[],
  gaps: readonly { temperature: number; reason: string }[],
): GapInterval[] {
  const all = [
    ...points.map((p) => ({ t: p.temperature, gap: null as string | null })),
    ...gaps.map((g) => ({ t: g.temperature, gap: gapReason(g.reason) })),
  ].sort((a, b) => a.t - b.t);
  const out: GapInterval[] = [];
  let current: GapInterval | null = null;
  all.forEach((s, i) => {
    if (s.gap === null) {
      current = null;
      return;
    }
    const prev = all[i - 1];
    const next = all[i + 1];
    const from = prev && prev.gap === null ? prev.t : s.t;
    const to = next && next.gap === null ? next.t : s.t;
    if (current) {
      current.to = to;
      if (!current.reasons.includes(s.gap)) current.reasons.push(s.gap);
    } else {
      current = { from, to, reasons: [s.gap] };
      out.push(current);
    }
  });
  return out;
}
