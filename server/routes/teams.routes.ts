import { teamIdParamsSchema } from '@shared/schemas/common';
import {
  createInvitationInputSchema,
  invitationListSchema,
  invitationParamsSchema,
  invitationSchema,
  memberParamsSchema,
  teamMemberListSchema,
  teamMemberSchema,
  teamSchema,
  updateMemberInputSchema,
} from '@shared/schemas/teams';
import { createInvitation, listInvitations, revokeInvitation } from '../services/invitations.service';
import { getTeam, listMembers, removeMember, updateMemberRole } from '../services/teams.service';
import { defineRoute, signedIn } from './registry';

/** A team, its members and its invitations. */
export const teamRoutes = [
  defineRoute({
    method: 'get',
    path: '/teams/:teamId',
    summary: 'The team',
    tags: ['teams'],
    access: { team: 'viewer' },
    request: { params: teamIdParamsSchema },
    responses: { 200: teamSchema },
    handler: ({ deps, params }) => getTeam(deps.db, params.teamId),
  }),
  defineRoute({
    method: 'get',
    path: '/teams/:teamId/members',
    summary: 'Team members',
    tags: ['teams'],
    access: { team: 'viewer' },
    request: { params: teamIdParamsSchema },
    responses: { 200: teamMemberListSchema },
    handler: async ({ deps, params }) => ({ members: await listMembers(deps.db, params.teamId) }),
  }),
  defineRoute({
    method: 'patch',
    path: '/teams/:teamId/members/:userId',
    summary: "Change a member's role",
    description: 'The last team admin cannot be demoted (409).',
    tags: ['teams'],
    access: { team: 'team_admin' },
    request: { params: memberParamsSchema, body: updateMemberInputSchema },
    responses: { 200: teamMemberSchema },
    handler: (ctx) =>
      updateMemberRole(ctx.deps.db, signedIn(ctx), ctx.params.teamId, ctx.params.userId, ctx.body.role, ctx.meta),
  }),
  defineRoute({
    method: 'delete',
    path: '/teams/:teamId/members/:userId',
    summary: 'Remove a member',
    description: 'The last team admin cannot be removed (409).',
    tags: ['teams'],
    access: { team: 'team_admin' },
    request: { params: memberParamsSchema },
    responses: { 204: null },
    handler: (ctx) => removeMember(ctx.deps.db, signedIn(ctx), ctx.params.teamId, ctx.params.userId, ctx.meta),
  }),
  defineRoute({
    method: 'get',
    path: '/teams/:teamId/invitations',
    summary: 'Invitations of the team',
    tags: ['teams'],
    access: { team: 'team_admin' },
    request: { params: teamIdParamsSchema },
    responses: { 200: invitationListSchema },
    handler: async ({ deps, params }) => ({ invitations: await listInvitations(deps, params.teamId) }),
  }),
  defineRoute({
    method: 'post',
    path: '/teams/:teamId/invitations',
    summary: 'Invite someone by e-mail',
    description: 'E-mails a link valid for 7 days.',
    tags: ['teams'],
    access: { team: 'team_admin' },
    request: { params: teamIdParamsSchema, body: createInvitationInputSchema },
    responses: { 201: invitationSchema },
    handler: (ctx) => createInvitation(ctx.deps, signedIn(ctx), ctx.params.teamId, ctx.body, ctx.meta),
  }),
  defineRoute({
    method: 'delete',
    path: '/teams/:teamId/invitations/:invitationId',
    summary: 'Withdraw an invitation',
    tags: ['teams'],
    access: { team: 'team_admin' },
    request: { params: invitationParamsSchema },
    responses: { 204: null },
    handler: (ctx) => revokeInvitation(ctx.deps, signedIn(ctx), ctx.params.teamId, ctx.params.invitationId, ctx.meta),
  }),
];
