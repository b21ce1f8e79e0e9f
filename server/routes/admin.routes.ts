import {
  adminTeamListSchema,
  adminTeamSchema,
  adminUserListSchema,
  adminUserSchema,
  auditEventListSchema,
  auditQuerySchema,
  createTeamInputSchema,
  outboxSchema,
  updateUserInputSchema,
  userParamsSchema,
} from '@shared/schemas/admin';
import { requireActor } from '../context';
import { createTeam, listTeams, listUsers, readOutbox, updateUser } from '../services/admin.service';
import { listAuditEvents } from '../services/audit.service';
import { defineRoute } from './registry';

const siteAdmin = { site: 'site_admin' } as const;

/** Installation administration: users, teams, the development outbox, the audit log. */
export const adminRoutes = [
  defineRoute({
    method: 'get',
    path: '/admin/users',
    summary: 'All users',
    tags: ['admin'],
    access: siteAdmin,
    responses: { 200: adminUserListSchema },
    handler: ({ ctx }) => listUsers(ctx, {}),
  }),
  defineRoute({
    method: 'patch',
    path: '/admin/users/:userId',
    summary: "Change a user's site roles or disable them",
    description: 'You cannot remove your own site_admin role or disable yourself (409).',
    tags: ['admin'],
    access: siteAdmin,
    request: { params: userParamsSchema, body: updateUserInputSchema },
    responses: { 200: adminUserSchema },
    handler: ({ ctx, params, body }) => updateUser(requireActor(ctx), { ...body, userId: params.userId }),
  }),
  defineRoute({
    method: 'get',
    path: '/admin/teams',
    summary: 'All teams',
    tags: ['admin'],
    access: siteAdmin,
    responses: { 200: adminTeamListSchema },
    handler: ({ ctx }) => listTeams(ctx, {}),
  }),
  defineRoute({
    method: 'post',
    path: '/admin/teams',
    summary: 'Create a team',
    description:
      'E-mails its first team admin an invitation. If that e-mail cannot be sent the team is not created (503).',
    tags: ['admin'],
    access: siteAdmin,
    request: { body: createTeamInputSchema },
    responses: { 201: adminTeamSchema },
    handler: ({ ctx, body }) => createTeam(requireActor(ctx), body),
  }),
  defineRoute({
    method: 'get',
    path: '/admin/outbox',
    summary: 'E-mails caught by the development mail server',
    description: 'enabled is false when real SMTP is configured.',
    tags: ['admin'],
    access: siteAdmin,
    responses: { 200: outboxSchema },
    handler: ({ ctx }) => readOutbox(ctx, {}),
  }),
  defineRoute({
    method: 'get',
    path: '/admin/audit-log',
    summary: 'Security events, newest first',
    tags: ['admin'],
    access: siteAdmin,
    request: { query: auditQuerySchema },
    responses: { 200: auditEventListSchema },
    handler: ({ ctx, query }) => listAuditEvents(ctx, query),
  }),
];
