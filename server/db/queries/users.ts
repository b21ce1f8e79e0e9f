import { asc, eq } from 'drizzle-orm';
import type { SessionUser, TeamMembership } from '@shared/schemas/session';
import type { Executor } from '../client';
import { memberships, teams, users, type UserRow } from '../tables/index';

/** The public face of a user row. */
export function toSessionUser(row: Pick<UserRow, 'id' | 'email' | 'displayName' | 'siteRoles'>): SessionUser {
  return { id: row.id, email: row.email, displayName: row.displayName, siteRoles: [...row.siteRoles].sort() };
}

export async function findUserByEmail(exec: Executor, email: string): Promise<UserRow | undefined> {
  const [row] = await exec.select().from(users).where(eq(users.email, email.trim().toLowerCase())).limit(1);
  return row;
}

export async function findUserById(exec: Executor, id: string): Promise<UserRow | undefined> {
  const [row] = await exec.select().from(users).where(eq(users.id, id)).limit(1);
  return row;
}

/** The teams a user belongs to, by name. */
export async function listMemberships(exec: Executor, userId: string): Promise<TeamMembership[]> {
  return exec
    .select({ id: teams.id, name: teams.name, slug: teams.slug, role: memberships.role })
    .from(memberships)
    .innerJoin(teams, eq(teams.id, memberships.teamId))
    .where(eq(memberships.userId, userId))
    .orderBy(asc(teams.name));
}
