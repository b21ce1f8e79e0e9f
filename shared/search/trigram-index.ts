/**
 * Character-trigram index over a list of strings: finds the strings that share the most
 * trigrams with a query, so an expensive fuzzy scorer only looks at a few hundred of them.
 *
 * Why trigrams: one typo changes few of the trigrams of a word padded with one space on each
 * side (a substitution 3, a swap of neighbours 4), so a string within one typo still shares
 * nearly all of the query's trigrams.
 */

export interface TrigramIndex {
  /** Posting list per trigram: indexes of the strings containing it, ascending. */
  readonly postings: ReadonlyMap<string, Int32Array>;
  /** Length of each indexed string (to prefer candidates of about the query's length). */
  readonly lengths: Int32Array;
  /** Total entries of all posting lists. */
  readonly postingCount: number;
}

/** Distinct trigrams of " text " (one space of padding on each side). */
export function trigramsOf(text: string): string[] {
  const padded = ` ${text} `;
  const grams = new Set<string>();
  for (let i = 0; i + 3 <= padded.length; i++) grams.add(padded.slice(i, i + 3));
  return [...grams];
}

export function buildTrigramIndex(texts: readonly string[]): TrigramIndex {
  const lists = new Map<string, number[]>();
  let postingCount = 0;
  texts.forEach((text, i) => {
    for (const gram of trigramsOf(text)) {
      const list = lists.get(gram);
      if (list) list.push(i);
      else lists.set(gram, [i]);
      postingCount++;
    }
  });
  const postings = new Map<string, Int32Array>();
  for (const [gram, list] of lists) postings.set(gram, Int32Array.from(list));
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
  const grams = trigramsOf(query);
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
    const bucket = buckets[count]!;
    bucket.sort((a, b) => Math.abs(index.lengths[a]! - length) - Math.abs(index.lengths[b]! - length) || a - b);
    for (const i of bucket) {
      if (out.length >= max) break;
      if (accept(i)) out.push(i);
    }
  }
  return out;
}
