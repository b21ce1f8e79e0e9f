/**
 * Public API of the species search: build one index per library revision with
 * `buildSpeciesIndex(entries)`, then call `index.search(query, options)`. Pure (no I/O), runs in
 * the browser and on the server.
 */
export { buildSpeciesIndex, MAX_QUERY_LENGTH, MIN_FUZZY_QUERY_LENGTH, FUZZY_CANDIDATE_LIMIT } from './species-index';
export { SpeciesSearchOptionError } from './errors';
export type { SpeciesSearchOptionField } from './errors';
export { DEFAULT_LIMIT, MAX_LIMIT, MAX_OFFSET, SPECIES_PHASES } from './search-options';
export { formulaReadings, splitPhaseSuffix } from './formula-query';
export type { FormulaReading, PhaseSuffix } from './formula-query';
export { normalizeText } from './normalize';
export type {
  SpeciesPhase,
  SpeciesIndexEntry,
  SpeciesMatchTier,
  SpeciesMatchField,
  SpeciesMatch,
  SpeciesSearchHit,
  SpeciesSearchOptions,
  SpeciesSearchResult,
  SpeciesIndexStats,
  SpeciesIndex,
} from './types';
