/** Small helpers for the chemistry tests, written apart from the core so they check it independently. */
import type { Composition, Rat } from '@shared/chemistry';

/** Exact text of a rational ("3", "9/2"), computed here rather than by the core. */
export function text(r: Rat): string {
  return r.d === 1n ? String(r.n) : `${r.n}/${r.d}`;
}

/** A composition as { symbol: "count" } for readable assertions. */
export function counts(composition: Composition): Record<string, string> {
  return Object.fromEntries(Object.entries(composition).map(([symbol, count]) => [symbol, text(count)]));
}
