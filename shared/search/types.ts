/**
 * Types of the species search. Pure data, no behaviour.
 */

/** Phases of library species (see seeds/library/FORMAT.md): every crystalline solid is `cr`. */
export type SpeciesPhase = 'g' | 'l' | 'cr' | 'am' | 'aq';

/** One library species as the search index reads it (a row of the species files plus derived fields). */
export interface SpeciesIndexEntry {
  /** Stable id of the species in its library revision (database id or key). */
  id: string;
  /** Species key in the equation language, e.g. `C4H10(g, 2-methylpropane)`. */
  key: string;
  /** Formula in caret notation as the equation core writes it (`Na^+`, `CuSO4·5H2O`, `C2H5OH`). */
  formula: string;
  /** Hill-order formula without charge (`C2H6O`), as `hillFormula` gives it. */
  hill: string;
  phase: SpeciesPhase;
  /** Descriptor of the key (`graphite`, `ethanol`), or null. */
  descriptor: string | null;
  /** Net charge in units of the elementary charge. */
  charge: number;
  /** Proper chemical name in English. */
  name: string;
  synonyms: readonly string[];
  /** CAS Registry Number with hyphens (`64-17-5`), when known. */
  cas?: string | null;
  /** Standard InChIKey (`LFQSCWFLJHTTHZ-UHFFFAOYSA-N`), when known. */
  inchikey?: string | null;
  /** Element symbols of the species (`['C', 'H', 'O']`); D and T count as their own symbols. */
  elements: readonly string[];
}

/**
 * How a hit matched, best first. The ranking sorts by this tier before anything else (one
 * exception: a lower-case word that is exactly a name, such as "tin", lists those `exact` hits
 * before the hits of its formula readings, TiN):
 * - `formula`: the entry's formula is one reading of the query (`co2` → CO2);
 * - `hill`: same Hill formula and charge, written differently (`C2H5OH` → CH3OCH3, an isomer);
 * - `exact`: the whole name, a synonym, the CAS RN or the InChIKey (full or first block);
 * - `prefix`: the name or a synonym starts with the query;
 * - `word-prefix`: a word inside the name or a synonym starts with the query (`chlor` → sodium chloride);
 * - `fuzzy`: close to the name or a synonym (one typo), scored by fuse.js.
 */
export type SpeciesMatchTier = 'formula' | 'hill' | 'exact' | 'prefix' | 'word-prefix' | 'fuzzy';

/** Which field of the entry matched. */
export type SpeciesMatchField = 'formula' | 'hill' | 'name' | 'synonym' | 'cas' | 'inchikey';

/** Why an entry is in the result. */
export interface SpeciesMatch {
  tier: SpeciesMatchTier;
  field: SpeciesMatchField;
  /** The entry's value that matched, as stored (the synonym's own spelling, the formula, the CAS RN). */
  text: string;
  /** For formula and Hill hits: the reading of the query that found it (`CO` or `Co` for "co"). */
  reading?: string;
  /** Score of a fuzzy hit: typos ÷ query length as fuse.js counts them (about 0 when the text contains the query as is); 0 for every other tier. */
  score: number;
}

/** One hit: the entry as given to `buildSpeciesIndex`, and why it matched. */
export interface SpeciesSearchHit<E extends SpeciesIndexEntry = SpeciesIndexEntry> {
  entry: E;
  match: SpeciesMatch;
}

/** Filters and paging of one search. */
export interface SpeciesSearchOptions {
  /** Hits to return, 1–200; default 20. */
  limit?: number;
  /** Hits to skip, ≥ 0; default 0. */
  offset?: number;
  /** Keep only these phases. A phase written in the query (`H2O(l)`) narrows this further. */
  phase?: SpeciesPhase | readonly SpeciesPhase[];
  /** Keep only species that contain every one of these elements (`['C', 'Cl']`); case-insensitive. */
  elements?: readonly string[];
}

/** The answer to one search. */
export interface SpeciesSearchResult<E extends SpeciesIndexEntry = SpeciesIndexEntry> {
  /** The hits of the requested page, best first. */
  hits: SpeciesSearchHit<E>[];
  /** Number of distinct species that matched (all pages), after filters. */
  total: number;
  offset: number;
  limit: number;
  /**
   * Formula readings of the query that found species, in rank order. Two or more mean the query
   * was ambiguous in case: "co" → `['CO', 'Co']` (carbon monoxide and cobalt).
   */
  readings: string[];
  /** Phase written in the query (`h2o(g)` → `g`; `(s)` counts as `cr`), else null. */
  queryPhase: SpeciesPhase | null;
}

/** Figures about a built index, for logs and the benchmark. */
export interface SpeciesIndexStats {
  entries: number;
  /** Distinct normalised names and synonyms. */
  terms: number;
  /** Word starts inside names and synonyms (the word-prefix index). */
  wordStarts: number;
  /** Distinct character trigrams. */
  trigrams: number;
  /** Entries in all trigram posting lists. */
  trigramPostings: number;
}

/** A built index over one set of entries (one library revision). Immutable; searches are synchronous. */
export interface SpeciesIndex<E extends SpeciesIndexEntry = SpeciesIndexEntry> {
  readonly size: number;
  readonly stats: SpeciesIndexStats;
  search(query: string, options?: SpeciesSearchOptions): SpeciesSearchResult<E>;
}
