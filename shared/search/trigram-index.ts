/**
 * Character-trigram index over a list of strings: finds the strings that share the most
 * trigrams with a query, so an expensive fuzzy scorer only looks at a few hundred of them.
 *
 * Why trigrams: one typo changes few of the trigrams of a word padded with one space on each
 * side (a substitution 3, a swap of neighbours 4), so a string within one typo still shares
 * nearly all of the query's trigrams.
 */

export interface TrigramIndex {
  /** Posting list per trigram code (see `trigramCodes`): indexes of the strings containing it, ascending. */
  readonly postings: ReadonlyMap<number, Int32Array>;
  /** Length of each indexed string (to prefer candidates of about the query's length). */
  readonly lengths: Int32Array;
  /** Total entries of all posting lists. */
  readonly postingCount: number;
}

/**
 * Distinct trigrams of " text " (one space of padding on each side), each as one number: three
 * UTF-16 code units × 2^16 apart fit exactly in a double, and number keys are faster in a Map
 * than three-character strings.
 */
export function trigramCodes(text: string): number[] {
  const padded = ` ${text} `;
  const codes = new Set<number>();
  for (let i = 0; i + 3 <= padded.length; i++) {
    codes.add(padded.charCodeAt(i) * 4294967296 + padded.charCodeAt(i + 1) * 65536 + padded.charCodeAt(i + 2));
  }
  return [...codes];
}

export function buildTrigramIndex(texts: readonly string[]): TrigramIndex {
  // Two passes (count, then fill) so the posting lists are typed arrays from the start.
  const codesOf = texts.map(trigramCodes);
  const sizes = new Map<number, number>();
  let postingCount = 0;
  for (const codes of codesOf) {
    for (const code of codes) sizes.set(code, (sizes.get(code) ?? 0) + 1);
    postingCount += codes.length;
  }
  const lists = new Map<number, { list: Int32Array; filled: number }>();
  for (const [code, size] of sizes) lists.set(code, { list: new Int32Array(size), filled: 0 });
  codesOf.forEach((codes, i) => {
    for (const code of codes) {
      const slot = lists.get(code)!;
      slot.list[slot.filled++] = i;
    }
  });
  const postings = new Map<number, Int32Array>();
  for (const [code, { list }] of lists) postings.set(code, list);
  return { postings, lengths: Int32Array.from(texts, (t) => t.length), postingCount };
}

/** Query trigrams a candidate may miss: one typo changes up to 4 of them (a swap of neighbours). */
export const TRIGRAMS_ONE_TYPO_MAY_CHANGE = 4;

/**
 * Scratch space for `trigramCandidates`, sized to the index: one per index, reused by every
 * query (searches are synchronous, so no two queries use it at once).
 */
export class TrigramScratch {
  readonly counts: Uint16Array;
  readonly touched: Int32Array;
  constructor(size: number) {
    this.counts = new Uint16Array(size);
    this.touched = new Int32Array(size);
  }
}

/**
 * Up to `max` strings sharing at least (query trigrams − 4) trigrams with `query` (at least 1),
 * best first: most shared trigrams, then length closest to the query's, then index. `accept`
 * leaves out strings the caller has no use for (already found, filtered out).
 */
export function trigramCandidates(
  index: TrigramIndex,
  scratch: TrigramScratch,
  query: string,
  max: number,
  accept: (i: number) => boolean,
): number[] {
  const grams = trigramCodes(query);
  const { counts, touched } = scratch;
  let touchedCount = 0;
  for (const gram of grams) {
    const list = index.postings.get(gram);
    if (!list) continue;
    for (let k = 0; k < list.length; k++) {
      const i = list[k]!;
      if (counts[i] === 0) touched[touchedCount++] = i;
      counts[i]!++;
    }
  }
  const threshold = Math.max(1, grams.length - TRIGRAMS_ONE_TYPO_MAY_CHANGE);
  // Buckets by shared count, so the best `max` are found without sorting every touched string.
  const buckets: number[][] = Array.from({ length: grams.length + 1 }, () => []);
  for (let k = 0; k < touchedCount; k++) {
    const i = touched[k]!;
    const count = counts[i]!;
    counts[i] = 0;
    if (count >= threshold) buckets[count]!.push(i);
  }
  const out: number[] = [];
  const length = query.length;
  for (let count = grams.length; count >= threshold && out.length < max; count--) {
    // Closest length first, then index: one numeric key per string, sorted natively (no comparator).
    const bucket = buckets[count]!;
    const keys = new Float64Array(bucket.length);
    for (let k = 0; k < bucket.length; k++) keys[k] = Math.abs(index.lengths[bucket[k]!]! - length) * 2 ** 31 + bucket[k]!;
    keys.sort();
    for (let k = 0; k < keys.length && out.length < max; k++) {
      const i = keys[k]! % 2 ** 31;
      if (accept(i)) out.push(i);
    }
  }
  return out;
}
