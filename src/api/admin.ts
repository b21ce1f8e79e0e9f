import {
  adminTeamListSchema,
  adminTeamSchema,
  adminUserSchema,
  adminUserListSchema,
  auditEventListSchema,
  outboxSchema,
  type AdminTeam,
  type AdminUser,
  type AuditEvent,
  type CreateTeamInput,
  type UpdateUserInput,
} from '@shared/schemas/admin';
import type { z } from 'zod';
import { http } from './http';

/** The development outbox: whether it is on, and the messages it caught. */
export type Outbox = z.infer<typeof outboxSchema>;

/** Every user account (site admin only). */
export async function listUsers(): Promise<AdminUser[]> {
  return (await http.get('/admin/users', { schema: adminUserListSchema })).users;
}

/** Sets a user's site roles or disables the account. */
export function updateUser(userId: string, input: UpdateUserInput): Promise<AdminUser> {
  return http.patch(`/admin/users/${encodeURIComponent(userId)}`, input, { schema: adminUserSchema });
}

/** Every team. */
export async function listTeams(): Promise<AdminTeam[]> {
  return (await http.get('/admin/teams', { schema: adminTeamListSchema })).teams;
}

/** Creates a team and invites its first team admin by e-mail. */
export function createTeam(input: CreateTeamInput): Promise<AdminTeam> {
  return http.post('/admin/teams', input, { schema: adminTeamSchema });
}

/** Messages caught by the fake SMTP server (enabled false when real SMTP is configured). */
export function getOutbox(): Promise<Outbox> {
  return http.get('/admin/outbox', { schema: outboxSchema });
}

/** Security events, newest first. */
export async function listAuditEvents(query: { limit?: number; before?: string } = {}): Promise<AuditEvent[]> {
  return (await http.get('/admin/audit-log', { schema: auditEventListSchema, query })).events;
}
