/**
 * The names and synonyms of all entries as one sorted table of distinct normalised terms, each
 * with the entries that carry it. Sorted order gives exact lookup and prefix ranges by binary
 * search; a second sorted list of word starts gives prefixes of inner words ("chlor" → sodium
 * chloride). Everything is held in typed arrays so 20,000 species cost a few megabytes.
 */
import { compareCodeUnits, wordStarts } from './normalize';

/** One occurrence of a term: entry index, and which of its texts (-1 = name, k = synonym k). */
export interface TermOccurrence {
  term: string;
  entry: number;
  slot: number;
}

export interface TermTable {
  /** Distinct normalised terms in code-unit order. */
  readonly terms: readonly string[];
  /** Occurrences of term t are at postStart[t] … postStart[t + 1] - 1, in the order given at build. */
  readonly postStart: Int32Array;
  readonly postEntry: Int32Array;
  readonly postSlot: Int32Array;
  /** Word starts sorted by the text from there on: term index and offset. */
  readonly wordTerm: Int32Array;
  readonly wordOffset: Int32Array;
}

/** Builds the table. Occurrences keep their given order inside each term (give them in result order). */
export function buildTermTable(occurrences: readonly TermOccurrence[]): TermTable {
  const byTerm = new Map<string, number[]>();
  occurrences.forEach((occurrence, i) => {
    const list = byTerm.get(occurrence.term);
    if (list) list.push(i);
    else byTerm.set(occurrence.term, [i]);
  });
  // The default sort compares UTF-16 code units, the order compareCodeUnits defines, without a callback.
  const terms = [...byTerm.keys()].sort();
  const postStart = new Int32Array(terms.length + 1);
  const postEntry = new Int32Array(occurrences.length);
  const postSlot = new Int32Array(occurrences.length);
  let at = 0;
  terms.forEach((term, t) => {
    postStart[t] = at;
    for (const i of byTerm.get(term) ?? []) {
      const occurrence = occurrences[i]!;
      // The same entry can carry a term twice (name and synonym alike): keep the first.
      if (alreadyPosted(postEntry, postStart[t]!, at, occurrence.entry)) continue;
      postEntry[at] = occurrence.entry;
      postSlot[at] = occurrence.slot;
      at++;
    }
  });
  postStart[terms.length] = at;

  // Word starts sorted by their text: group them by text (many share one: "chloride"), sort the
  // distinct texts natively (no callback), list each group in term order.
  const byText = new Map<string, number[]>();
  terms.forEach((term, t) => {
    for (const offset of wordStarts(term)) {
      if (offset >= 4096) break; // no name is this long; keeps the packing below exact
      const text = term.slice(offset);
      const group = byText.get(text);
      // Term index and offset packed in one number: offsets of a normalised name stay far below 2^12.
      const packed = t * 4096 + offset;
      if (group) group.push(packed);
      else byText.set(text, [packed]);
    }
  });
  const texts = [...byText.keys()].sort();
  let startCount = 0;
  for (const group of byText.values()) startCount += group.length;
  const wordTerm = new Int32Array(startCount);
  const wordOffset = new Int32Array(startCount);
  let w = 0;
  for (const text of texts) {
    for (const packed of byText.get(text)!) {
      wordTerm[w] = Math.floor(packed / 4096);
      wordOffset[w] = packed % 4096;
      w++;
    }
  }
  return { terms, postStart, postEntry: postEntry.slice(0, at), postSlot: postSlot.slice(0, at), wordTerm, wordOffset };
}

function alreadyPosted(postEntry: Int32Array, from: number, to: number, entry: number): boolean {
  for (let i = from; i < to; i++) if (postEntry[i] === entry) return true;
  return false;
}

/** Index of the term equal to `text`, or -1. */
export function findTerm(table: TermTable, text: string): number {
  const t = lowerBound(table.terms.length, (i) => compareCodeUnits(table.terms[i]!, text));
  return table.terms[t] === text ? t : -1;
}

/** Terms starting with `prefix`, in order: calls `visit(termIndex)` for each until it returns false. */
export function forEachTermWithPrefix(table: TermTable, prefix: string, visit: (term: number) => boolean): void {
  const { terms } = table;
  for (let t = lowerBound(terms.length, (i) => compareCodeUnits(terms[i]!, prefix)); t < terms.length; t++) {
    if (!terms[t]!.startsWith(prefix) || !visit(t)) return;
  }
}

/** Word starts whose text begins with `prefix`, in order of that text: `visit(termIndex)` until it returns false. */
export function forEachWordWithPrefix(table: TermTable, prefix: string, visit: (term: number) => boolean): void {
  const { terms, wordTerm, wordOffset } = table;
  const compareAt = (i: number): number => compareSuffix(terms[wordTerm[i]!]!, wordOffset[i]!, prefix);
  for (let w = lowerBound(wordTerm.length, compareAt); w < wordTerm.length; w++) {
    const term = wordTerm[w]!;
    if (!terms[term]!.startsWith(prefix, wordOffset[w]!) || !visit(term)) return;
  }
}

// Compares text.slice(offset) with `other` without building the slice.
function compareSuffix(text: string, offset: number, other: string): number {
  const length = Math.min(text.length - offset, other.length);
  for (let i = 0; i < length; i++) {
    const d = text.charCodeAt(offset + i) - other.charCodeAt(i);
    if (d !== 0) return d;
  }
  return text.length - offset - other.length;
}

// First index in [0, n) whose comparison with the target is ≥ 0.
function lowerBound(n: number, compare: (i: number) => number): number {
  let lo = 0;
  let hi = n;
  while (lo < hi) {
    const mid = (lo + hi) >>> 1;
    if (compare(mid) < 0) lo = mid + 1;
    else hi = mid;
  }
  return lo;
}
