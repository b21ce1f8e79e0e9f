import {
  apiTokenListSchema,
  changePasswordInputSchema,
  createApiTokenInputSchema,
  createdApiTokenSchema,
  sessionReplySchema,
  tokenIdParamsSchema,
  updateAccountInputSchema,
} from '@shared/schemas/account';
import {
  changePassword,
  createApiToken,
  listApiTokens,
  revokeApiToken,
  updateDisplayName,
} from '../services/account.service';
import { sessionInfoFor } from '../services/users.service';
import { defineRoute, signedIn } from './registry';

/** The caller's own account and API tokens. */
export const accountRoutes = [
  defineRoute({
    method: 'get',
    path: '/account',
    summary: 'Your account',
    tags: ['account'],
    access: 'signed_in',
    responses: { 200: sessionReplySchema },
    handler: (ctx) => sessionInfoFor(ctx.deps.db, signedIn(ctx)),
  }),
  defineRoute({
    method: 'patch',
    path: '/account',
    summary: 'Change your display name',
    tags: ['account'],
    access: 'signed_in',
    request: { body: updateAccountInputSchema },
    responses: { 200: sessionReplySchema },
    async handler(ctx) {
      const updated = await updateDisplayName(ctx.deps.db, signedIn(ctx), ctx.body.displayName);
      return sessionInfoFor(ctx.deps.db, updated);
    },
  }),
  defineRoute({
    method: 'post',
    path: '/account/password',
    summary: 'Change your password',
    description: 'Needs the current password; your other sessions end.',
    tags: ['account'],
    access: 'signed_in',
    request: { body: changePasswordInputSchema },
    responses: { 204: null },
    handler: (ctx) => changePassword(ctx.deps.db, signedIn(ctx), ctx.body, ctx.meta),
  }),
  defineRoute({
    method: 'get',
    path: '/account/tokens',
    summary: 'Your API tokens',
    tags: ['account'],
    access: 'signed_in',
    responses: { 200: apiTokenListSchema },
    handler: async (ctx) => ({ tokens: await listApiTokens(ctx.deps.db, signedIn(ctx).user.id) }),
  }),
  defineRoute({
    method: 'post',
    path: '/account/tokens',
    summary: 'Create an API token',
    description: 'The secret is in this reply only. The token acts with your roles.',
    tags: ['account'],
    access: 'signed_in',
    request: { body: createApiTokenInputSchema },
    responses: { 201: createdApiTokenSchema },
    handler: (ctx) => createApiToken(ctx.deps.db, signedIn(ctx), ctx.body, ctx.meta),
  }),
  defineRoute({
    method: 'delete',
    path: '/account/tokens/:tokenId',
    summary: 'Revoke an API token',
    tags: ['account'],
    access: 'signed_in',
    request: { params: tokenIdParamsSchema },
    responses: { 204: null },
    handler: (ctx) => revokeApiToken(ctx.deps.db, signedIn(ctx), ctx.params.tokenId, ctx.meta),
  }),
];
