import { and, eq, inArray } from 'drizzle-orm';
import { idSchema } from '@shared/schemas/common';
import type { TeamRole } from '@shared/schemas/roles';
import type { ServiceContext } from '../context';
import { memberships } from '../db/tables/index';

/** The caller's role in a team, or null when they are not a member (or nobody is signed in). */
export async function teamRoleOf(ctx: ServiceContext, input: { teamId: string }): Promise<TeamRole | null> {
  if (!ctx.actor) return null;
  // A malformed id cannot name a team the caller belongs to; skip the query (Postgres would reject it).
  if (!idSchema.safeParse(input.teamId).success) return null;
  const [row] = await ctx.db
    .select({ role: memberships.role })
    .from(memberships)
    .where(and(eq(memberships.teamId, input.teamId), eq(memberships.userId, ctx.actor.user.id)))
    .limit(1);
  return row?.role ?? null;
}

/**
 * Whether the caller may propose library changes: a curator, or a member or team admin of at
 * least one team (viewers only read).
 */
export async function isProposer(ctx: ServiceContext, _input: Record<string, never> = {}): Promise<boolean> {
  if (!ctx.actor) return false;
  if (ctx.actor.user.siteRoles.includes('curator')) return true;
  const [row] = await ctx.db
    .select({ role: memberships.role })
    .from(memberships)
    .where(and(eq(memberships.userId, ctx.actor.user.id), inArray(memberships.role, ['member', 'team_admin'])))
    .limit(1);
  return row !== undefined;
}

/** The teams the caller belongs to, with the role held in each (empty for anonymous callers). */
export async function teamRolesOf(
  ctx: ServiceContext,
  _input: Record<string, never> = {},
): Promise<Map<string, TeamRole>> {
  if (!ctx.actor) return new Map();
  const rows = await ctx.db
    .select({ teamId: memberships.teamId, role: memberships.role })
    .from(memberships)
    .where(eq(memberships.userId, ctx.actor.user.id));
  return new Map(rows.map((r) => [r.teamId, r.role]));
}
