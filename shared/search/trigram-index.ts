/**
 * Character-trigram index over a list of strings: finds the strings that share the most
 * trigrams with a query, so an expensive fuzzy scorer only looks at a few hundred of them.
 *
 * Why trigrams: one typo changes few of the trigrams of a word padded with one space on each
 * side (a substitution 3, a swap of neighbours 4), so a string within one typo still shares
 * nearly all of the query's trigrams.
 */

export interface TrigramIndex {
  /** Trigram code (see `trigramCode`) → its number, which indexes `postStart`. */
  readonly gramIds: ReadonlyMap<number, number>;
  /** Strings containing trigram g: `postings[postStart[g]]` … `postings[postStart[g + 1] - 1]`, ascending. */
  readonly postStart: Int32Array;
  readonly postings: Int32Array;
  /** Length of each indexed string (to prefer candidates of about the query's length). */
  readonly lengths: Int32Array;
}

/**
 * A trigram as one number: three UTF-16 code units × 2^16 apart fit exactly in a double, and
 * number keys are faster in a Map than three-character strings.
 */
function trigramCode(padded: string, at: number): number {
  return padded.charCodeAt(at) * 4294967296 + padded.charCodeAt(at + 1) * 65536 + padded.charCodeAt(at + 2);
}

/** Distinct trigram codes of " text " (one space of padding on each side). */
export function trigramCodes(text: string): number[] {
  const padded = ` ${text} `;
  const codes = new Set<number>();
  for (let i = 0; i + 3 <= padded.length; i++) codes.add(trigramCode(padded, i));
  return [...codes];
}

/**
 * Builds the index in flat typed arrays: trigrams are numbered as met, each string's trigram
 * numbers are listed once, then counted into one posting array (counting sort, no per-trigram
 * arrays to grow).
 */
export function buildTrigramIndex(texts: readonly string[]): TrigramIndex {
  const gramIds = new Map<number, number>();
  let totalChars = 0;
  for (const text of texts) totalChars += text.length;
  const gramOf = new Int32Array(totalChars + 2 * texts.length);
  const textOf = new Int32Array(gramOf.length);
  let count = 0;
  let lastText = new Int32Array(1024).fill(-1); // grows with the trigram count
  for (let t = 0; t < texts.length; t++) {
    const padded = ` ${texts[t]} `;
    for (let i = 0; i + 3 <= padded.length; i++) {
      const code = trigramCode(padded, i);
      let id = gramIds.get(code);
      if (id === undefined) {
        id = gramIds.size;
        gramIds.set(code, id);
        if (id >= lastText.length) {
          const grown = new Int32Array(lastText.length * 2).fill(-1);
          grown.set(lastText);
          lastText = grown;
        }
      }
      if (lastText[id] === t) continue; // the same trigram twice in one string
      lastText[id] = t;
      gramOf[count] = id;
      textOf[count] = t;
      count++;
    }
  }
  const postStart = new Int32Array(gramIds.size + 1);
  for (let k = 0; k < count; k++) postStart[gramOf[k]! + 1]!++;
  for (let g = 0; g < gramIds.size; g++) postStart[g + 1]! += postStart[g]!;
  const fill = postStart.slice(0, gramIds.size);
  const postings = new Int32Array(count);
  for (let k = 0; k < count; k++) postings[fill[gramOf[k]!]!++] = textOf[k]!;
  return { gramIds, postStart, postings, lengths: Int32Array.from(texts, (t) => t.length) };
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
    const id = index.gramIds.get(gram);
    if (id === undefined) continue;
    for (let k = index.postStart[id]!; k < index.postStart[id + 1]!; k++) {
      const i = index.postings[k]!;
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
    for (let k = 0; k < bucket.length; k++)
      keys[k] = Math.abs(index.lengths[bucket[k]!]! - length) * 2 ** 31 + bucket[k]!;
    keys.sort();
    for (let k = 0; k < keys.length && out.length < max; k++) {
      const i = keys[k]! % 2 ** 31;
      if (accept(i)) out.push(i);
    }
  }
  return out;
}
