import {
  revisionListSchema,
  speciesDetailQuerySchema,
  speciesDetailSchema,
  speciesListSchema,
  speciesParamsSchema,
  speciesQuerySchema,
} from '@shared/schemas/library';
import { getSpecies, listRevisions, listSpecies } from '../services/library.service';
import { defineRoute } from './registry';

/** Reading the library: public, like the calculations, and rate-limited the same way. */
export const libraryRoutes = [
  defineRoute({
    method: 'get',
    path: '/species',
    summary: 'Search and list library species',
    description:
      'Searches names, synonyms, formulas (case-insensitive; "co" gives both CO and Co, listed in `readings`), CAS RN and InChIKey; filters by phase, element (all of them), source and provenance; pages with limit (≤ 200) and offset. `revision` reads the library as it was.',
    tags: ['library'],
    access: 'public',
    rateLimit: 'calc',
    request: { query: speciesQuerySchema },
    responses: { 200: speciesListSchema },
    handler: ({ deps, query }) => listSpecies(deps.library, query),
  }),
  defineRoute({
    method: 'get',
    path: '/species/:speciesId',
    summary: 'One species with every value, model, source and its history',
    tags: ['library'],
    access: 'public',
    rateLimit: 'calc',
    request: { params: speciesParamsSchema, query: speciesDetailQuerySchema },
    responses: { 200: speciesDetailSchema },
    handler: ({ deps, params, query }) => getSpecies(deps.db, deps.library, params.speciesId, query.revision),
  }),
  defineRoute({
    method: 'get',
    path: '/library/revisions',
    summary: 'Every library revision, newest first',
    tags: ['library'],
    access: 'public',
    rateLimit: 'calc',
    responses: { 200: revisionListSchema },
    handler: ({ deps }) => listRevisions(deps.db),
  }),
];
