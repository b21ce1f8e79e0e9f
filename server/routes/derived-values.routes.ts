import { teamIdParamsSchema } from '@shared/schemas/common';
import {
  derivedValueInputSchema,
  derivedValueListSchema,
  derivedValueParamsSchema,
  derivedValueSchema,
} from '@shared/schemas/derived-values';
import { requireActor } from '../context';
import { deleteDerivedValue, listDerivedValues, saveDerivedValue } from '../services/derived-values.service';
import { defineRoute } from './registry';

/** A team's derived formation enthalpies: viewers read, members save and delete. */
export const derivedValueRoutes = [
  defineRoute({
    method: 'get',
    path: '/teams/:teamId/derived-values',
    summary: "The team's derived ΔfH° values, newest first",
    tags: ['derive', 'teams'],
    access: { team: 'viewer' },
    request: { params: teamIdParamsSchema },
    responses: { 200: derivedValueListSchema },
    handler: ({ ctx, params }) => listDerivedValues(ctx, params),
  }),
  defineRoute({
    method: 'post',
    path: '/teams/:teamId/derived-values',
    summary: "Save a derived ΔfH° in the team's values (the derivation is run again on the server)",
    description:
      'The target must be the formation of one species the library has no ΔfH° for (409 when it has one). The same work limits as POST /derive apply.',
    tags: ['derive', 'teams'],
    access: { team: 'member' },
    request: { params: teamIdParamsSchema, body: derivedValueInputSchema },
    responses: { 201: derivedValueSchema },
    handler: ({ ctx, params, body }) => saveDerivedValue(requireActor(ctx), { ...body, ...params }),
  }),
  defineRoute({
    method: 'delete',
    path: '/teams/:teamId/derived-values/:valueId',
    summary: 'Delete a derived value of the team',
    tags: ['derive', 'teams'],
    access: { team: 'member' },
    request: { params: derivedValueParamsSchema },
    responses: { 204: null },
    handler: ({ ctx, params }) => deleteDerivedValue(requireActor(ctx), params),
  }),
];
