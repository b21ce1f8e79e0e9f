/**
 * Species search over one library revision: exact formula and Hill-formula maps, exact
 * name/synonym/CAS RN/InChIKey lookup, prefix ranges over sorted names and inner words, and a
 * trigram index that hands fuse.js only a few hundred candidates for typo-tolerant matching.
 * fuse.js over the whole library was too slow (about 250 ms p95 at 20,000 species).
 *
 * Ranking, best first: tier (formula, hill, exact, prefix, word-prefix, fuzzy — see
 * `SpeciesMatchTier`), except that a query in lower-case letters that is exactly a name or
 * synonym puts those exact hits before its formula readings ("tin" → tin, then TiN); inside formula tiers the query's reading (as typed first); inside prefix
 * tiers the matched text in code-unit order; inside the fuzzy tier the fuse.js score, then texts
 * the query is a subsequence of, then the length closest to the query's; then the
 * entry's normalised name, then its key (code-unit order, the same on every machine).
 */
import { formulaReadings, splitPhaseSuffix, type FormulaReading } from './formula-query';
import { rankFuzzy } from './fuzzy-rank';
import { compareCodeUnits, normalizeText, stripControl } from './normalize';
import { checkOptions, SPECIES_PHASES, type CheckedOptions } from './search-options';
import {
  buildTermTable,
  findTerm,
  forEachTermWithPrefix,
  forEachWordWithPrefix,
  type TermOccurrence,
  type TermTable,
} from './term-table';
import { buildTrigramIndex, trigramCandidates, TrigramScratch, type TrigramIndex } from './trigram-index';
import type {
  SpeciesIndex,
  SpeciesIndexEntry,
  SpeciesIndexStats,
  SpeciesMatch,
  SpeciesMatchField,
  SpeciesMatchTier,
  SpeciesPhase,
  SpeciesSearchHit,
  SpeciesSearchOptions,
  SpeciesSearchResult,
} from './types';

/** Longer queries get no hits (no name or formula is this long; it is pasted junk). */
export const MAX_QUERY_LENGTH = 200;
/** Shorter queries skip fuzzy matching: with 3 letters "one typo" matches nearly anything. */
export const MIN_FUZZY_QUERY_LENGTH = 4;
/** Names and synonyms fuse.js scores per query, at most. */
export const FUZZY_CANDIDATE_LIMIT = 200;

const TIERS: readonly SpeciesMatchTier[] = ['formula', 'hill', 'exact', 'prefix', 'word-prefix', 'fuzzy'];
const T_FORMULA = 0;
const T_HILL = 1;
const T_EXACT = 2;
const T_PREFIX = 3;
const T_WORD = 4;
const T_FUZZY = 5;

const FIELDS: readonly SpeciesMatchField[] = ['formula', 'hill', 'name', 'synonym', 'cas', 'inchikey'];
const F_FORMULA = 0;
const F_HILL = 1;
const F_NAME = 2;
const F_SYNONYM = 3;
const F_CAS = 4;
const F_INCHIKEY = 5;

const CAS_QUERY = /^(?:\d{2,7}-\d{2}-\d|\d{5,10})$/;
const INCHIKEY_FULL = /^[A-Z]{14}-[A-Z]{10}-[A-Z]$/;
const INCHIKEY_BLOCK = /^[A-Z]{14}$/;
const LOWER_CASE_WORD = /^[a-z]+$/;

/**
 * Builds the search index over `entries` (one library revision). The entries are kept by
 * reference and returned in hits; do not change them afterwards. Cost at 20,000 species: see
 * the benchmark (tests/bench/species-search-p95.ts).
 */
export function buildSpeciesIndex<E extends SpeciesIndexEntry>(entries: readonly E[]): SpeciesIndex<E> {
  const n = entries.length;
  const sortName = entries.map((e) => normalizeText(e.name));
  const order = Array.from({ length: n }, (_, i) => i).sort(
    (a, b) =>
      compareCodeUnits(sortName[a]!, sortName[b]!) || compareCodeUnits(entries[a]!.key, entries[b]!.key) || a - b,
  );
  const rank = new Int32Array(n);
  order.forEach((entry, r) => (rank[entry] = r));

  const phaseCode = Uint8Array.from(entries, (e) => {
    const code = SPECIES_PHASES.indexOf(e.phase);
    return code < 0 ? 255 : code;
  });
  const descriptors = entries.map((e) => (e.descriptor ? normalizeText(e.descriptor) : null));
  const elementBits = new Map<string, Uint8Array>();
  const byFormula = new Map<string, number[]>();
  const byHill = new Map<string, number[]>();
  const byCas = new Map<string, number[]>();
  const byInchikey = new Map<string, number[]>();
  const occurrences: TermOccurrence[] = [];

  // In rank order, so every list below is already in result order.
  for (const i of order) {
    const e = entries[i]!;
    for (const symbol of e.elements) {
      let bits = elementBits.get(symbol);
      if (!bits) elementBits.set(symbol, (bits = new Uint8Array(n)));
      bits[i] = 1;
    }
    push(byFormula, e.formula, i);
    push(byHill, e.hill, i);
    if (e.cas) push(byCas, e.cas.replace(/-/g, ''), i);
    if (e.inchikey) {
      const key = e.inchikey.toUpperCase();
      push(byInchikey, key, i);
      push(byInchikey, key.slice(0, 14), i);
    }
    addTerm(occurrences, sortName[i]!, i, -1);
    e.synonyms.forEach((synonym, k) => addTerm(occurrences, normalizeText(synonym), i, k));
  }
  const table = buildTermTable(occurrences);
  const trigrams = buildTrigramIndex(table.terms);
  const stats: SpeciesIndexStats = {
    entries: n,
    terms: table.terms.length,
    wordStarts: table.wordTerm.length,
    trigrams: trigrams.gramIds.size,
    trigramPostings: trigrams.postings.length,
  };
  const data: IndexData<E> = {
    entries,
    rank,
    phaseCode,
    descriptors,
    elementBits,
    byFormula,
    byHill,
    byCas,
    byInchikey,
    table,
    trigrams,
    scratch: new TrigramScratch(table.terms.length),
    stamp: new Uint32Array(n),
    generation: { value: 0 },
  };
  return { size: n, stats, search: (query, options) => search(data, query, options) };
}

interface IndexData<E> {
  entries: readonly E[];
  rank: Int32Array;
  phaseCode: Uint8Array;
  descriptors: readonly (string | null)[];
  elementBits: ReadonlyMap<string, Uint8Array>;
  byFormula: ReadonlyMap<string, readonly number[]>;
  byHill: ReadonlyMap<string, readonly number[]>;
  byCas: ReadonlyMap<string, readonly number[]>;
  byInchikey: ReadonlyMap<string, readonly number[]>;
  table: TermTable;
  trigrams: TrigramIndex;
  scratch: TrigramScratch;
  /** Marks entries already collected in the current search (equal to generation.value). */
  stamp: Uint32Array;
  generation: { value: number };
}

function push(map: Map<string, number[]>, key: string, value: number): void {
  const list = map.get(key);
  if (!list) map.set(key, [value]);
  else if (list[list.length - 1] !== value) list.push(value);
}

function addTerm(out: TermOccurrence[], term: string, entry: number, slot: number): void {
  if (term !== '') out.push({ term, entry, slot });
}

/** Hits in result order, as parallel arrays (objects are made only for the page returned). */
class Collected {
  readonly entry: number[] = [];
  readonly tier: number[] = [];
  readonly field: number[] = [];
  /** Synonym index for synonym hits, reading index for formula and Hill hits. */
  readonly slot: number[] = [];
  readonly score: number[] = [];
  private readonly mark: number;

  constructor(
    private readonly stamp: Uint32Array,
    generation: { value: number },
  ) {
    // Wrap-around after 2^32 − 1 searches: clear the marks once and start again.
    if (generation.value >= 0xffffffff) {
      stamp.fill(0);
      generation.value = 0;
    }
    this.mark = ++generation.value;
  }

  has(entry: number): boolean {
    return this.stamp[entry] === this.mark;
  }

  add(entry: number, tier: number, field: number, slot: number, score = 0): void {
    this.stamp[entry] = this.mark;
    this.entry.push(entry);
    this.tier.push(tier);
    this.field.push(field);
    this.slot.push(slot);
    this.score.push(score);
  }
}

function search<E extends SpeciesIndexEntry>(
  data: IndexData<E>,
  query: string,
  options: SpeciesSearchOptions | undefined,
): SpeciesSearchResult<E> {
  const checked = checkOptions(options);
  const empty = (queryPhase: SpeciesPhase | null): SpeciesSearchResult<E> => ({
    hits: [],
    total: 0,
    offset: checked.offset,
    limit: checked.limit,
    readings: [],
    queryPhase,
  });
  if (typeof query !== 'string' || query.length > MAX_QUERY_LENGTH) return empty(null);
  const cleaned = stripControl(query);
  if (cleaned === '') return empty(null);
  const { rest, phase: queryPhase, descriptor } = splitPhaseSuffix(cleaned);
  const accept = makeFilter(data, checked, queryPhase, descriptor);
  if (!accept) return empty(queryPhase);

  const hits = new Collected(data.stamp, data.generation);
  const readings = formulaReadings(rest);
  const text = normalizeText(rest);
  // A lower-case word that is a name is read as that name first: "tin" is tin before TiN
  // (titanium nitride), while "TiN", typed in formula case, is TiN first.
  const nameFirst = LOWER_CASE_WORD.test(rest) && findTerm(data.table, text) >= 0 && !readings.some((r) => r.asTyped);
  if (nameFirst) collectExact(data, hits, text, rest, accept);
  const readingHits = collectFormulaHits(data, hits, readings, accept);
  if (text !== '') {
    if (!nameFirst) collectExact(data, hits, text, rest, accept);
    collectPrefixes(data, hits, text, accept);
    if (text.length >= MIN_FUZZY_QUERY_LENGTH) collectFuzzy(data, hits, text, accept);
  }

  const end = Math.min(hits.entry.length, checked.offset + checked.limit);
  const page: SpeciesSearchHit<E>[] = [];
  for (let k = checked.offset; k < end; k++) page.push(makeHit(data, hits, k, readings));
  return {
    hits: page,
    total: hits.entry.length,
    offset: checked.offset,
    limit: checked.limit,
    readings: readings.filter((_, r) => readingHits[r]).map((r) => r.text),
    queryPhase,
  };
}

/** The filter of this search, or null when nothing can pass (the query's phase is excluded by the options). */
function makeFilter(
  data: IndexData<SpeciesIndexEntry>,
  options: CheckedOptions,
  queryPhase: SpeciesPhase | null,
  descriptor: string | null,
): ((entry: number) => boolean) | null {
  let phases = options.phases;
  if (queryPhase) {
    if (phases && !phases.has(queryPhase)) return null;
    phases = new Set([queryPhase]);
  }
  // Without a phase filter every entry passes, even one whose phase is not a library phase (code 255).
  const phaseAllowed = new Uint8Array(256).fill(phases ? 0 : 1);
  if (phases) SPECIES_PHASES.forEach((p, code) => (phaseAllowed[code] = phases.has(p) ? 1 : 0));
  const elementBits: Uint8Array[] = [];
  for (const symbol of options.elements) {
    const bits = data.elementBits.get(symbol);
    if (!bits) return null;
    elementBits.push(bits);
  }
  return (entry) => {
    if (phaseAllowed[data.phaseCode[entry]!] !== 1) return false;
    if (descriptor !== null && data.descriptors[entry] !== descriptor) return false;
    for (const bits of elementBits) if (bits[entry] !== 1) return false;
    return true;
  };
}

/** Formula hits of every reading, then Hill hits; returns which readings found something. */
function collectFormulaHits(
  data: IndexData<SpeciesIndexEntry>,
  hits: Collected,
  readings: readonly FormulaReading[],
  accept: (entry: number) => boolean,
): boolean[] {
  const found = readings.map(() => false);
  const pass = (tier: number, field: number, lookup: (r: FormulaReading) => readonly number[] | undefined): void => {
    readings.forEach((reading, r) => {
      for (const entry of lookup(reading) ?? []) {
        if (hits.has(entry) || !accept(entry)) continue;
        hits.add(entry, tier, field, r);
        found[r] = true;
      }
    });
  };
  pass(T_FORMULA, F_FORMULA, (r) => data.byFormula.get(r.formula));
  // Keyed by Hill formula alone (no key strings to build for 20,000 entries); the charge is checked here.
  pass(T_HILL, F_HILL, (r) => data.byHill.get(r.hill)?.filter((entry) => data.entries[entry]!.charge === r.charge));
  return found;
}

function collectExact(
  data: IndexData<SpeciesIndexEntry>,
  hits: Collected,
  text: string,
  raw: string,
  accept: (entry: number) => boolean,
): void {
  const term = findTerm(data.table, text);
  if (term >= 0) collectTerm(data, hits, term, T_EXACT, accept);
  const add = (list: readonly number[] | undefined, field: number): void => {
    for (const entry of list ?? []) if (!hits.has(entry) && accept(entry)) hits.add(entry, T_EXACT, field, -1);
  };
  const compact = raw.replace(/\s+/g, '');
  if (CAS_QUERY.test(compact)) add(data.byCas.get(compact.replace(/-/g, '')), F_CAS);
  const upper = compact.toUpperCase();
  if (INCHIKEY_FULL.test(upper) || INCHIKEY_BLOCK.test(upper)) add(data.byInchikey.get(upper), F_INCHIKEY);
}

function collectTerm(
  data: IndexData<SpeciesIndexEntry>,
  hits: Collected,
  term: number,
  tier: number,
  accept: (entry: number) => boolean,
): void {
  const { postStart, postEntry, postSlot } = data.table;
  for (let p = postStart[term]!; p < postStart[term + 1]!; p++) {
    const entry = postEntry[p]!;
    if (hits.has(entry) || !accept(entry)) continue;
    const slot = postSlot[p]!;
    hits.add(entry, tier, slot < 0 ? F_NAME : F_SYNONYM, slot);
  }
}

function collectPrefixes(
  data: IndexData<SpeciesIndexEntry>,
  hits: Collected,
  text: string,
  accept: (entry: number) => boolean,
): void {
  forEachTermWithPrefix(data.table, text, (term) => {
    collectTerm(data, hits, term, T_PREFIX, accept);
    return true;
  });
  forEachWordWithPrefix(data.table, text, (term) => {
    collectTerm(data, hits, term, T_WORD, accept);
    return true;
  });
}

function collectFuzzy(
  data: IndexData<SpeciesIndexEntry>,
  hits: Collected,
  text: string,
  accept: (entry: number) => boolean,
): void {
  const { terms, postStart, postEntry, postSlot } = data.table;
  // Only terms that can still add an entry are worth scoring.
  const open = (term: number): boolean => {
    for (let p = postStart[term]!; p < postStart[term + 1]!; p++) {
      const entry = postEntry[p]!;
      if (!hits.has(entry) && accept(entry)) return true;
    }
    return false;
  };
  const candidates = trigramCandidates(data.trigrams, data.scratch, text, FUZZY_CANDIDATE_LIMIT, open);
  const scored = rankFuzzy(
    text,
    candidates.map((t) => terms[t]!),
  );
  // Per entry its best text. fuse.js scores every one-typo match alike ("ethanl" is one edit from
  // both "ethane" and "ethanol"), so ties go to texts the query is a subsequence of (a dropped letter,
  // the commonest typing slip; common practice, no source), then to the length closest to the
  // query's, then to the name before synonyms.
  const best = new Map<number, FuzzyRank>();
  for (const { candidate, score } of scored) {
    const term = candidates[candidate]!;
    const termText = terms[term]!;
    const rankOfText = {
      score,
      dropped: isSubsequence(text, termText) ? 0 : 1,
      lengthGap: Math.abs(termText.length - text.length),
      slot: 0,
    };
    for (let p = postStart[term]!; p < postStart[term + 1]!; p++) {
      const entry = postEntry[p]!;
      if (hits.has(entry) || !accept(entry)) continue;
      const candidateRank = { ...rankOfText, slot: postSlot[p]! };
      const previous = best.get(entry);
      if (!previous || compareFuzzy(candidateRank, previous) < 0) best.set(entry, candidateRank);
    }
  }
  const ranked = [...best].sort((a, b) => compareFuzzy(a[1], b[1]) || data.rank[a[0]]! - data.rank[b[0]]!);
  for (const [entry, { score, slot }] of ranked) hits.add(entry, T_FUZZY, slot < 0 ? F_NAME : F_SYNONYM, slot, score);
}

interface FuzzyRank {
  score: number;
  /** 0 when the query is the text with letters dropped, else 1. */
  dropped: number;
  lengthGap: number;
  slot: number;
}

function compareFuzzy(a: FuzzyRank, b: FuzzyRank): number {
  return a.score - b.score || a.dropped - b.dropped || a.lengthGap - b.lengthGap || a.slot - b.slot;
}

/** True when every character of `short` appears in `long` in order. */
function isSubsequence(short: string, long: string): boolean {
  let at = 0;
  for (let i = 0; i < long.length && at < short.length; i++) if (long.charCodeAt(i) === short.charCodeAt(at)) at++;
  return at === short.length;
}

function makeHit<E extends SpeciesIndexEntry>(
  data: IndexData<E>,
  hits: Collected,
  k: number,
  readings: readonly FormulaReading[],
): SpeciesSearchHit<E> {
  const entry = data.entries[hits.entry[k]!]!;
  const field = hits.field[k]!;
  const slot = hits.slot[k]!;
  const match: SpeciesMatch = {
    tier: TIERS[hits.tier[k]!]!,
    field: FIELDS[field]!,
    text: matchedText(entry, field, slot),
    score: hits.score[k]!,
  };
  if (field === F_FORMULA || field === F_HILL) match.reading = readings[slot]!.text;
  return { entry, match };
}

function matchedText(entry: SpeciesIndexEntry, field: number, slot: number): string {
  switch (field) {
    case F_FORMULA:
      return entry.formula;
    case F_HILL:
      return entry.hill;
    case F_SYNONYM:
      return entry.synonyms[slot] ?? '';
    case F_CAS:
      return entry.cas ?? '';
    case F_INCHIKEY:
      return entry.inchikey ?? '';
    default:
      return entry.name;
  }
}
