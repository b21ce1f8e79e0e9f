import type { SessionInfo } from '@shared/schemas/session';
import type { Principal, ServiceContext } from '../context';
import { listMemberships } from '../db/queries/users';

/**
 * Who is signed in, with their teams (the reply of GET /session and friends). `principal`
 * defaults to the caller; sign-in and invitation acceptance pass the one they just created.
 */
export async function sessionInfo(
  ctx: ServiceContext,
  input: { principal?: Principal | null } = {},
): Promise<SessionInfo> {
  const principal = input.principal === undefined ? ctx.actor : input.principal;
  if (!principal) return { user: null, teams: [], via: 'none' };
  return { user: principal.user, teams: await listMemberships(ctx.db, principal.user.id), via: principal.via };
}
