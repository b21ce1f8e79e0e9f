import {
  revisionListSchema,
  speciesDetailQuerySchema,
  speciesDetailSchema,
  speciesListSchema,
  speciesParamsSchema,
  speciesQuerySchema,
  sourceListQuerySchema,
  sourceListSchema,
} from '@shared/schemas/library';
import { getSpecies, listRevisions, listSources, listSpecies } from '../services/library.service';
import { defineRoute } from './registry';

/** Reading the library: public, like the calculations, and rate-limited the same way. Changes go through amendments. */
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
    handler: ({ ctx, query }) => listSpecies(ctx, query),
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
    handler: ({ ctx, params, query }) => getSpecies(ctx, { speciesId: params.speciesId, revision: query.revision }),
  }),
  defineRoute({
    method: 'get',
    path: '/sources',
    summary: 'Every source of the library, with how many values, models and reactions cite it',
    tags: ['library'],
    access: 'public',
    rateLimit: 'calc',
    request: { query: sourceListQuerySchema },
    responses: { 200: sourceListSchema },
    handler: ({ ctx, query }) => listSources(ctx, { revision: query.revision }),
  }),
  defineRoute({
    method: 'get',
    path: '/library/revisions',
    summary: 'Every library revision, newest first',
    description:
      'Each revision after the seed was made by accepting an amendment: `amendmentId`, `acceptedBy`, `acceptedAt`, `proposedBy`, `rationale` and `changes` say who, when, why and how much. There is no other way to change the library.',
    tags: ['library'],
    access: 'public',
    rateLimit: 'calc',
    responses: { 200: revisionListSchema },
    handler: ({ ctx }) => listRevisions(ctx, {}),
  }),
];
