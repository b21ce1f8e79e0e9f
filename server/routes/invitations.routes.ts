import { sessionInfoSchema } from '@shared/schemas/session';
import {
  acceptInvitationInputSchema,
  invitationPreviewSchema,
  invitationTokenParamsSchema,
} from '@shared/schemas/teams';
import { setSessionCookie } from '../middleware/auth';
import { acceptInvitation, previewInvitation } from '../services/invitations.service';
import { sessionInfo } from '../services/users.service';
import { defineRoute } from './registry';

/** Opening and accepting an e-mailed invitation link. */
export const invitationRoutes = [
  defineRoute({
    method: 'get',
    path: '/invitations/:token',
    summary: 'Preview an invitation',
    tags: ['invitations'],
    access: 'public',
    request: { params: invitationTokenParamsSchema },
    responses: { 200: invitationPreviewSchema },
    handler: ({ ctx, params }) => previewInvitation(ctx, params),
  }),
  defineRoute({
    method: 'post',
    path: '/invitations/:token/accept',
    summary: 'Accept an invitation',
    description:
      'A new address creates its account (displayName and password); an existing account must be signed in as the invited address. Signs the invitee in.',
    tags: ['invitations'],
    access: 'public',
    request: { params: invitationTokenParamsSchema, body: acceptInvitationInputSchema },
    responses: { 200: sessionInfoSchema },
    async handler({ ctx, params, body, req, res }) {
      const accepted = await acceptInvitation(ctx, { ...body, token: params.token });
      setSessionCookie(req, res, accepted.session.secret, accepted.session.expiresAt);
      return sessionInfo(ctx, { principal: accepted.principal });
    },
  }),
];
