import { and, eq, isNull, ne } from 'drizzle-orm';
import type { TeamRole } from '@shared/schemas/roles';
import { hashSecret, randomSecret } from '../../lib/secrets';
import type { Executor } from '../client';
import { invitations, type InvitationRow } from '../tables/index';

/** How long an invitation link works. */
export const INVITATION_DAYS = 7;

/**
 * Inserts an invitation and returns its link secret. An open invitation for the same address
 * stays valid until this one has been e-mailed (see `dropSupersededInvitations`), so a failed
 * send never costs the invitee a link that worked.
 */
export async function insertInvitation(
  exec: Executor,
  args: { teamId: string; email: string; role: TeamRole; invitedBy: { id: string; name: string } | null },
): Promise<{ row: InvitationRow; secret: string }> {
  const secret = randomSecret();
  const [row] = await exec
    .insert(invitations)
    .values({
      teamId: args.teamId,
      email: args.email,
      role: args.role,
      tokenHash: hashSecret(secret),
      invitedById: args.invitedBy?.id ?? null,
      invitedByName: args.invitedBy?.name ?? 'Thermoledger',
      expiresAt: new Date(Date.now() + INVITATION_DAYS * 86_400_000),
    })
    .returning();
  return { row: row!, secret };
}

/** Withdraws the older open invitations of the same team and address once `current` went out. */
export async function dropSupersededInvitations(exec: Executor, current: InvitationRow): Promise<void> {
  await exec
    .delete(invitations)
    .where(
      and(
        eq(invitations.teamId, current.teamId),
        eq(invitations.email, current.email),
        isNull(invitations.acceptedAt),
        ne(invitations.id, current.id),
      ),
    );
}
