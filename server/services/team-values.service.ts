import type { ServiceContext } from '../context';
import { AppError } from '../errors';
import type { LibrarySnapshot } from '../library/snapshot';
import { teamValuesOf, type TeamValue } from '../library/team-values';
import { teamRoleOf } from './membership.service';

/** A team's derived values, for a caller who belongs to the team (else 401 or 403). */
export async function teamValues(
  ctx: ServiceContext,
  teamId: string,
  snapshot: LibrarySnapshot,
  warnings: { code: string; message: string }[],
): Promise<TeamValue[]> {
  if (!ctx.actor) throw new AppError('unauthenticated', "Sign in to use a team's derived values.");
  if (!(await teamRoleOf(ctx, { teamId }))) throw new AppError('forbidden', 'You are not a member of this team.');
  return teamValuesOf(ctx.db, teamId, snapshot, warnings);
}
