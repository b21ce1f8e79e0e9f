import { and, asc, eq, sql } from 'drizzle-orm';
import type { Team, TeamMember } from '@shared/schemas/teams';
import type { TeamRole } from '@shared/schemas/roles';
import type { Db, Tx } from '../db/client';
import { memberships, teams, users, type TeamRow } from '../db/tables/index';
import { AppError, errors } from '../errors';
import type { Principal, RequestMeta } from '../context';
import { recordAudit } from './audit.service';

export function toTeam(row: TeamRow): Team {
  return { id: row.id, name: row.name, slug: row.slug, createdAt: row.createdAt.toISOString() };
}

export async function getTeam(db: Db, teamId: string): Promise<Team> {
  const [row] = await db.select().from(teams).where(eq(teams.id, teamId)).limit(1);
  if (!row) throw errors.notFound('The team');
  return toTeam(row);
}

/** Members by display name. */
export async function listMembers(db: Db, teamId: string): Promise<TeamMember[]> {
  const rows = await db
    .select({
      userId: users.id,
      email: users.email,
      displayName: users.displayName,
      role: memberships.role,
      joinedAt: memberships.joinedAt,
    })
    .from(memberships)
    .innerJoin(users, eq(users.id, memberships.userId))
    .where(eq(memberships.teamId, teamId))
    .orderBy(asc(users.displayName));
  return rows.map((r) => ({ ...r, joinedAt: r.joinedAt.toISOString() }));
}

/** Locks the team's admin rows and counts them, so two demotions cannot both pass the check. */
async function countAdminsLocked(tx: Tx, teamId: string): Promise<number> {
  const rows = await tx
    .select({ userId: memberships.userId })
    .from(memberships)
    .where(and(eq(memberships.teamId, teamId), eq(memberships.role, 'team_admin')))
    .for('update');
  return rows.length;
}

async function memberOrThrow(tx: Tx, teamId: string, userId: string) {
  const [row] = await tx
    .select({ role: memberships.role, email: users.email })
    .from(memberships)
    .innerJoin(users, eq(users.id, memberships.userId))
    .where(and(eq(memberships.teamId, teamId), eq(memberships.userId, userId)))
    .limit(1);
  if (!row) throw errors.notFound('That member of this team');
  return row;
}

const LAST_ADMIN_MESSAGE = 'A team needs at least one team admin. Make someone else team admin first.';

/** Changes a member's role; the last team admin cannot be demoted (409). */
export async function updateMemberRole(
  db: Db,
  actor: Principal,
  teamId: string,
  userId: string,
  role: TeamRole,
  meta: RequestMeta,
): Promise<TeamMember> {
  await db.transaction(async (tx) => {
    const member = await memberOrThrow(tx, teamId, userId);
    if (member.role === role) return;
    if (member.role === 'team_admin' && (await countAdminsLocked(tx, teamId)) <= 1) {
      throw new AppError('conflict', LAST_ADMIN_MESSAGE);
    }
    await tx
      .update(memberships)
      .set({ role })
      .where(and(eq(memberships.teamId, teamId), eq(memberships.userId, userId)));
    await recordAudit(tx, {
      action: 'member.role_changed',
      actor: actor.user,
      meta,
      detail: { teamId, userId, email: member.email, from: member.role, to: role },
    });
  });
  const member = (await listMembers(db, teamId)).find((m) => m.userId === userId);
  if (!member) throw errors.notFound('That member of this team');
  return member;
}

/** Removes a member; the last team admin cannot be removed (409). */
export async function removeMember(
  db: Db,
  actor: Principal,
  teamId: string,
  userId: string,
  meta: RequestMeta,
): Promise<void> {
  await db.transaction(async (tx) => {
    const member = await memberOrThrow(tx, teamId, userId);
    if (member.role === 'team_admin' && (await countAdminsLocked(tx, teamId)) <= 1) {
      throw new AppError('conflict', LAST_ADMIN_MESSAGE);
    }
    await tx.delete(memberships).where(and(eq(memberships.teamId, teamId), eq(memberships.userId, userId)));
    await recordAudit(tx, {
      action: 'member.removed',
      actor: actor.user,
      meta,
      detail: { teamId, userId, email: member.email },
    });
  });
}

/** Turns a team name into a unique URL slug ("Kestrel Bay Lab" → "kestrel-bay-lab", then "-2"…). */
export async function uniqueSlug(tx: Tx, name: string): Promise<string> {
  const base =
    name
      .normalize('NFKD')
      .replace(/[\u0300-\u036f]/g, '')
      .toLowerCase()
      .replace(/[^a-z0-9]+/g, '-')
      .replace(/^-+|-+$/g, '')
      .slice(0, 60) || 'team';
  const taken = await tx
    .select({ slug: teams.slug })
    .from(teams)
    .where(sql`${teams.slug} = ${base} or ${teams.slug} like ${base + '-%'}`);
  const used = new Set(taken.map((t) => t.slug));
  if (!used.has(base)) return base;
  for (let n = 2; ; n++) if (!used.has(`${base}-${n}`)) return `${base}-${n}`;
}
