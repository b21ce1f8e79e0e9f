import { and, asc, eq } from 'drizzle-orm';
import type { Team, TeamMember, UpdateMemberInput } from '@shared/schemas/teams';
import type { ActorContext, ServiceContext } from '../context';
import type { Tx } from '../db/client';
import { recordAudit } from '../db/queries/audit';
import { memberships, teams, users, type TeamRow } from '../db/tables/index';
import { AppError, errors } from '../errors';

function toTeam(row: TeamRow): Team {
  return { id: row.id, name: row.name, slug: row.slug, createdAt: row.createdAt.toISOString() };
}

export async function getTeam(ctx: ServiceContext, input: { teamId: string }): Promise<Team> {
  const [row] = await ctx.db.select().from(teams).where(eq(teams.id, input.teamId)).limit(1);
  if (!row) throw errors.notFound('The team');
  return toTeam(row);
}

/** Members by display name. */
export async function listMembers(ctx: ServiceContext, input: { teamId: string }): Promise<{ members: TeamMember[] }> {
  const rows = await ctx.db
    .select({
      userId: users.id,
      email: users.email,
      displayName: users.displayName,
      role: memberships.role,
      joinedAt: memberships.joinedAt,
    })
    .from(memberships)
    .innerJoin(users, eq(users.id, memberships.userId))
    .where(eq(memberships.teamId, input.teamId))
    .orderBy(asc(users.displayName));
  return { members: rows.map((r) => ({ ...r, joinedAt: r.joinedAt.toISOString() })) };
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
  ctx: ActorContext,
  input: UpdateMemberInput & { teamId: string; userId: string },
): Promise<TeamMember> {
  const { teamId, userId, role } = input;
  await ctx.db.transaction(async (tx) => {
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
      actor: ctx.actor.user,
      meta: ctx.meta,
      detail: { teamId, userId, email: member.email, from: member.role, to: role },
    });
  });
  const member = (await listMembers(ctx, { teamId })).members.find((m) => m.userId === userId);
  if (!member) throw errors.notFound('That member of this team');
  return member;
}

/** Removes a member; the last team admin cannot be removed (409). */
export async function removeMember(ctx: ActorContext, input: { teamId: string; userId: string }): Promise<void> {
  const { teamId, userId } = input;
  await ctx.db.transaction(async (tx) => {
    const member = await memberOrThrow(tx, teamId, userId);
    if (member.role === 'team_admin' && (await countAdminsLocked(tx, teamId)) <= 1) {
      throw new AppError('conflict', LAST_ADMIN_MESSAGE);
    }
    await tx.delete(memberships).where(and(eq(memberships.teamId, teamId), eq(memberships.userId, userId)));
    await recordAudit(tx, {
      action: 'member.removed',
      actor: ctx.actor.user,
      meta: ctx.meta,
      detail: { teamId, userId, email: member.email },
    });
  });
}
