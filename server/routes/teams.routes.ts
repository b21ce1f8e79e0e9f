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
import { requireActor } from '../context';
import { createInvitation, listInvitations, revokeInvitation } from '../services/invitations.service';
import { getTeam, listMembers, removeMember, updateMemberRole } from '../services/teams.service';
import { defineRoute } from './registry';

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
    handler: ({ ctx, params }) => getTeam(ctx, params),
  }),
  defineRoute({
    method: 'get',
    path: '/teams/:teamId/members',
    summary: 'Team members',
    tags: ['teams'],
    access: { team: 'viewer' },
    request: { params: teamIdParamsSchema },
    responses: { 200: teamMemberListSchema },
    handler: ({ ctx, params }) => listMembers(ctx, params),
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
    handler: ({ ctx, params, body }) => updateMemberRole(requireActor(ctx), { ...body, ...params }),
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
    handler: ({ ctx, params }) => removeMember(requireActor(ctx), params),
  }),
  defineRoute({
    method: 'get',
    path: '/teams/:teamId/invitations',
    summary: 'Invitations of the team',
    tags: ['teams'],
    access: { team: 'team_admin' },
    request: { params: teamIdParamsSchema },
    responses: { 200: invitationListSchema },
    handler: ({ ctx, params }) => listInvitations(ctx, params),
  }),
  defineRoute({
    method: 'post',
    path: '/teams/:teamId/invitations',
    summary: 'Invite someone by e-mail',
    description:
      'E-mails a link valid for 7 days; an earlier open invitation for the same address is withdrawn once the new one is sent. If the e-mail cannot be sent nothing changes (503).',
    tags: ['teams'],
    access: { team: 'team_admin' },
    request: { params: teamIdParamsSchema, body: createInvitationInputSchema },
    responses: { 201: invitationSchema },
    handler: ({ ctx, params, body }) => createInvitation(requireActor(ctx), { ...body, ...params }),
  }),
  defineRoute({
    method: 'delete',
    path: '/teams/:teamId/invitations/:invitationId',
    summary: 'Withdraw an invitation',
    tags: ['teams'],
    access: { team: 'team_admin' },
    request: { params: invitationParamsSchema },
    responses: { 204: null },
    handler: ({ ctx, params }) => revokeInvitation(requireActor(ctx), params),
  }),
];
