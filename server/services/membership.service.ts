import { and, eq } from 'drizzle-orm';
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
