import {
  apiTokenListSchema,
  changePasswordInputSchema,
  createApiTokenInputSchema,
  createdApiTokenSchema,
  sessionReplySchema,
  tokenIdParamsSchema,
  updateAccountInputSchema,
} from '@shared/schemas/account';
import { requireActor } from '../context';
import {
  changePassword,
  createApiToken,
  listApiTokens,
  revokeApiToken,
  updateDisplayName,
} from '../services/account.service';
import { sessionInfo } from '../services/users.service';
import { defineRoute } from './registry';

/** The caller's own account and API tokens. */
export const accountRoutes = [
  defineRoute({
    method: 'get',
    path: '/account',
    summary: 'Your account',
    tags: ['account'],
    access: 'signed_in',
    responses: { 200: sessionReplySchema },
    handler: ({ ctx }) => sessionInfo(ctx, {}),
  }),
  defineRoute({
    method: 'patch',
    path: '/account',
    summary: 'Change your display name',
    tags: ['account'],
    access: 'signed_in',
    request: { body: updateAccountInputSchema },
    responses: { 200: sessionReplySchema },
    handler: ({ ctx, body }) => updateDisplayName(requireActor(ctx), body),
  }),
  defineRoute({
    method: 'post',
    path: '/account/password',
    summary: 'Change your password',
    description:
      'Needs the current password. Your other sessions end and all your API tokens are revoked (scripts need a new token).',
    tags: ['account'],
    access: 'signed_in',
    request: { body: changePasswordInputSchema },
    responses: { 204: null },
    handler: ({ ctx, body }) => changePassword(requireActor(ctx), body),
  }),
  defineRoute({
    method: 'get',
    path: '/account/tokens',
    summary: 'Your API tokens',
    tags: ['account'],
    access: 'signed_in',
    responses: { 200: apiTokenListSchema },
    handler: ({ ctx }) => listApiTokens(requireActor(ctx), {}),
  }),
  defineRoute({
    method: 'post',
    path: '/account/tokens',
    summary: 'Create an API token',
    description:
      'The secret is in this reply only. The token acts with your roles. Only a password sign-in may create tokens: a request made with a token gets 403.',
    tags: ['account'],
    access: 'signed_in',
    request: { body: createApiTokenInputSchema },
    responses: { 201: createdApiTokenSchema },
    handler: ({ ctx, body }) => createApiToken(requireActor(ctx), body),
  }),
  defineRoute({
    method: 'delete',
    path: '/account/tokens/:tokenId',
    summary: 'Revoke an API token',
    tags: ['account'],
    access: 'signed_in',
    request: { params: tokenIdParamsSchema },
    responses: { 204: null },
    handler: ({ ctx, params }) => revokeApiToken(requireActor(ctx), params),
  }),
];
