import {
  revisionListSchema,
  sourceListSchema,
  type SourceList,
  speciesDetailSchema,
  speciesListSchema,
  type RevisionList,
  type SpeciesDetail,
  type SpeciesList,
} from '@shared/schemas/library';
import { http } from './http';

/** Searches and lists library species (public). `query` as built by `speciesQueryParams`. */
export function listSpecies(
  query: Record<string, string | number | undefined>,
  signal?: AbortSignal,
): Promise<SpeciesList> {
  return http.get('/species', { query, schema: speciesListSchema, ...(signal ? { signal } : {}) });
}

/** One species with every value, model, source and its history; `revision` reads it as it was. */
export function getSpecies(id: string, revision?: number | null, signal?: AbortSignal): Promise<SpeciesDetail> {
  return http.get(`/species/${encodeURIComponent(id)}`, {
    query: { revision: revision ?? undefined },
    schema: speciesDetailSchema,
    ...(signal ? { signal } : {}),
  });
}

/** Every library revision, newest first. */
export function listRevisions(signal?: AbortSignal): Promise<RevisionList> {
  return http.get('/library/revisions', { schema: revisionListSchema, ...(signal ? { signal } : {}) });
}

/** Every source of the library (at a revision), with how many values, models and reactions cite it. */
export function listSources(revision?: number | null, signal?: AbortSignal): Promise<SourceList> {
  return http.get('/sources', {
    query: { revision: revision ?? undefined },
    schema: sourceListSchema,
    ...(signal ? { signal } : {}),
  });
}
