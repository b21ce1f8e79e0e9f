/**
 * fuse.js scores the few hundred candidates the trigram index leaves. A small Fuse over the
 * candidate strings is built per query. tests/bench/species-search-p95.ts compares the ways to do
 * it on the candidates of 367 queries (85 texts on average, at most 200), in CPU time per query:
 * `new Fuse(strings)` ≈ `Fuse.createIndex` + `new Fuse` (the same work, 130–155 µs), `Fuse.match`
 * per candidate about 20–40 % slower (it compiles the pattern for every text), a Fuse over the
 * candidate entries with name and synonym keys about 3 × slower.
 */
import Fuse, { type IFuseOptions } from 'fuse.js';

/**
 * Location is ignored because a typo may sit anywhere in a name; the field-length norm is off so
 * a score is plain errors ÷ pattern length. Texts and pattern come normalised already (lower
 * case, accents stripped), so fuse.js need not fold case again.
 */
const BASE_OPTIONS: IFuseOptions<string> = {
  includeScore: true,
  ignoreLocation: true,
  ignoreFieldNorm: true,
  isCaseSensitive: true,
  shouldSort: false,
};

/** fuse.js's bitap works on 32 characters at a time: a longer pattern is searched as 32-character windows. */
const BITAP_WINDOW = 32;

/**
 * The fuse.js threshold that lets exactly one edit through for a pattern of this length: fuse.js
 * scores an edit as 1 ÷ pattern length, per 32-character window for longer patterns; halfway to
 * two edits keeps rounding out of it.
 */
export function oneTypoThreshold(patternLength: number): number {
  return 1.5 / Math.max(1, Math.min(patternLength, BITAP_WINDOW));
}

/** A candidate that matched: its index in the candidate list and its score (edits ÷ pattern length; fuse.js gives 0.001 to an exact match). */
export interface FuzzyScore {
  candidate: number;
  score: number;
}

/**
 * Candidates that contain `pattern` with at most one typo: fuse.js finds those within one edit
 * (substitution, insertion, deletion); a swap of two neighbours, which fuse.js counts as two
 * edits, is found by looking for each swapped spelling and scored as one edit. Unsorted.
 */
export function rankFuzzy(pattern: string, candidates: readonly string[]): FuzzyScore[] {
  if (candidates.length === 0 || pattern.length === 0) return [];
  const threshold = oneTypoThreshold(pattern.length);
  const fuse = new Fuse(candidates, { ...BASE_OPTIONS, threshold });
  // A long pattern matches when any one window does, and its score is the mean over the windows:
  // keep only those whose mean stays within one edit.
  const out: FuzzyScore[] = fuse
    .search(pattern)
    .map((result) => ({ candidate: result.refIndex, score: result.score ?? 1 }))
    .filter((s) => s.score <= threshold);
  const matched = new Set(out.map((s) => s.candidate));
  const swaps = swappedSpellings(pattern);
  const oneEdit = 1 / pattern.length;
  candidates.forEach((text, candidate) => {
    if (!matched.has(candidate) && swaps.some((s) => text.includes(s))) out.push({ candidate, score: oneEdit });
  });
  return out;
}

/** The pattern with each pair of different neighbouring characters swapped ("caesuim" → "aceusim", …, "caesium"). */
function swappedSpellings(pattern: string): string[] {
  const out: string[] = [];
  for (let i = 0; i + 1 < pattern.length; i++) {
    if (pattern[i] === pattern[i + 1]) continue;
    out.push(pattern.slice(0, i) + pattern[i + 1] + pattern[i] + pattern.slice(i + 2));
  }
  return out;
}
