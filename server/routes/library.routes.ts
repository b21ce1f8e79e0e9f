import {
  revisionListSchema,
  speciesDetailQuerySchema,
  speciesDetailSchema,
  speciesListSchema,
  speciesParamsSchema,
  speciesQuerySchema,
  libraryImportInputSchema,
  libraryImportResultSchema,
  sourceListQuerySchema,
  sourceListSchema,
} from '@shared/schemas/library';
import { getSpecies, importLibraryFiles, listRevisions, listSources, listSpecies } from '../services/library.service';
import { requireActor } from '../context';
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
    tags: ['library'],
    access: 'public',
    rateLimit: 'calc',
    responses: { 200: revisionListSchema },
    handler: ({ ctx }) => listRevisions(ctx, {}),
  }),

  defineRoute({
    method: 'post',
    path: '/library/imports',
    summary: 'Import library files (seed format) as a new revision',
    description:
      'Site admins only, until library changes go through review. Files are CSV/JSON Lines as in seeds/library/FORMAT.md; records match the current library by key and replace what differs. Any problem → 400 naming file, line and column, and nothing is applied.',
    tags: ['library'],
    access: { site: 'site_admin' },
    request: { body: libraryImportInputSchema },
    responses: { 201: libraryImportResultSchema },
    handler: ({ ctx, body }) => importLibraryFiles(requireActor(ctx), body),
  }),
];
