import { and, desc, eq, isNull } from 'drizzle-orm';
import type {
  AcceptInvitationInput,
  CreateInvitationInput,
  Invitation,
  InvitationPreview,
} from '@shared/schemas/teams';
import type { TeamRole } from '@shared/schemas/roles';
import { roleLabels } from '@shared/schemas/roles';
import type { AppDeps, Principal, RequestMeta } from '../context';
import type { Executor } from '../db/client';
import { invitations, memberships, sessions, teams, users, type InvitationRow } from '../db/tables/index';
import { AppError, errors } from '../errors';
import { hashPassword, hashSecret, randomSecret } from '../lib/secrets';
import { invitationMail } from '../mail/messages';
import { recordAudit } from './audit.service';
import { createSession, type NewSession } from './session.service';
import { findUserByEmail, toSessionUser } from './users.service';

/** How long an invitation link works. */
export const INVITATION_DAYS = 7;

function toInvitation(row: InvitationRow): Invitation {
  return {
    id: row.id,
    email: row.email,
    role: row.role,
    invitedBy: row.invitedByName,
    createdAt: row.createdAt.toISOString(),
    expiresAt: row.expiresAt.toISOString(),
    acceptedAt: row.acceptedAt?.toISOString() ?? null,
  };
}

/** A team's invitations, newest first (accepted ones included, for the record). */
export async function listInvitations(deps: AppDeps, teamId: string): Promise<Invitation[]> {
  const rows = await deps.db
    .select()
    .from(invitations)
    .where(eq(invitations.teamId, teamId))
    .orderBy(desc(invitations.createdAt));
  return rows.map(toInvitation);
}

/** Inserts an invitation (replacing an open one for the same address) and returns its link secret. */
export async function insertInvitation(
  tx: Executor,
  args: { teamId: string; email: string; role: TeamRole; invitedBy: { id: string; name: string } | null },
): Promise<{ row: InvitationRow; secret: string }> {
  await tx
    .delete(invitations)
    .where(and(eq(invitations.teamId, args.teamId), eq(invitations.email, args.email), isNull(invitations.acceptedAt)));
  const secret = randomSecret();
  const [row] = await tx
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

/**
 * E-mails the invitation link. If sending fails the invitation is withdrawn again, so nothing is
 * left half-done, and the caller gets 503.
 */
export async function mailInvitation(
  deps: AppDeps,
  args: { row: InvitationRow; secret: string; teamName: string; inviterName: string },
): Promise<void> {
  const link = `${deps.config.publicUrl}/invitations/${encodeURIComponent(args.secret)}`;
  try {
    await deps.mailer.send(
      invitationMail({
        to: args.row.email,
        teamName: args.teamName,
        inviterName: args.inviterName,
        role: roleLabels[args.row.role].toLowerCase(),
        link,
        expiresAt: args.row.expiresAt,
      }),
    );
  } catch (err) {
    await deps.db.delete(invitations).where(eq(invitations.id, args.row.id));
    console.error('[mail] invitation e-mail failed:', (err as Error).message);
    throw new AppError(
      'unavailable',
      'The invitation e-mail could not be sent, so no invitation was made. Try again later.',
    );
  }
}

/** Invites someone to a team by e-mail (409 when they are already a member). */
export async function createInvitation(
  deps: AppDeps,
  actor: Principal,
  teamId: string,
  input: CreateInvitationInput,
  meta: RequestMeta,
): Promise<Invitation> {
  const { row, secret, teamName } = await deps.db.transaction(async (tx) => {
    const [team] = await tx.select().from(teams).where(eq(teams.id, teamId)).limit(1);
    if (!team) throw errors.notFound('The team');
    const [existing] = await tx
      .select({ userId: users.id })
      .from(memberships)
      .innerJoin(users, eq(users.id, memberships.userId))
      .where(and(eq(memberships.teamId, teamId), eq(users.email, input.email)))
      .limit(1);
    if (existing) throw errors.conflict(`${input.email} is already a member of this team.`);
    const made = await insertInvitation(tx, {
      teamId,
      email: input.email,
      role: input.role,
      invitedBy: { id: actor.user.id, name: actor.user.displayName },
    });
    await recordAudit(tx, {
      action: 'invitation.created',
      actor: actor.user,
      meta,
      detail: { teamId, invitationId: made.row.id, email: input.email, role: input.role },
    });
    return { ...made, teamName: team.name };
  });
  await mailInvitation(deps, { row, secret, teamName, inviterName: actor.user.displayName });
  return toInvitation(row);
}

/** Withdraws an open or accepted invitation record of this team. */
export async function revokeInvitation(
  deps: AppDeps,
  actor: Principal,
  teamId: string,
  invitationId: string,
  meta: RequestMeta,
): Promise<void> {
  await deps.db.transaction(async (tx) => {
    const [row] = await tx
      .delete(invitations)
      .where(and(eq(invitations.id, invitationId), eq(invitations.teamId, teamId)))
      .returning({ id: invitations.id, email: invitations.email });
    if (!row) throw errors.notFound('The invitation');
    await recordAudit(tx, {
      action: 'invitation.revoked',
      actor: actor.user,
      meta,
      detail: { teamId, invitationId, email: row.email },
    });
  });
}

async function findUsable(exec: Executor, secret: string) {
  const [row] = await exec
    .select({ invitation: invitations, teamName: teams.name })
    .from(invitations)
    .innerJoin(teams, eq(teams.id, invitations.teamId))
    .where(eq(invitations.tokenHash, hashSecret(secret)))
    .limit(1);
  if (!row) throw new AppError('not_found', 'This invitation link is not valid. Ask the team admin for a new one.');
  if (row.invitation.acceptedAt) throw new AppError('token_expired', 'This invitation was already accepted.');
  if (row.invitation.expiresAt.getTime() <= Date.now()) {
    throw new AppError('token_expired', 'This invitation has expired. Ask the team admin for a new one.');
  }
  return row;
}

/** What the invitee sees before accepting. */
export async function previewInvitation(deps: AppDeps, secret: string): Promise<InvitationPreview> {
  const { invitation, teamName } = await findUsable(deps.db, secret);
  const account = await findUserByEmail(deps.db, invitation.email);
  return {
    teamName,
    email: invitation.email,
    role: invitation.role,
    expiresAt: invitation.expiresAt.toISOString(),
    accountExists: account !== undefined,
  };
}

/**
 * Accepts an invitation. An existing account must be signed in as the invited address; a new
 * address creates the account from displayName + password. Either way the invitee ends up
 * signed in with a fresh session (returned for the cookie).
 */
export async function acceptInvitation(
  deps: AppDeps,
  secret: string,
  input: AcceptInvitationInput,
  principal: Principal | null,
  meta: RequestMeta,
): Promise<{ principal: Principal; session: NewSession }> {
  const { invitation } = await findUsable(deps.db, secret);
  const account = await findUserByEmail(deps.db, invitation.email);
  let passwordHash: string | null = null;
  if (account) {
    if (!principal) throw new AppError('unauthenticated', `Sign in as ${invitation.email} to accept this invitation.`);
    if (principal.user.id !== account.id) {
      throw new AppError(
        'forbidden',
        `This invitation is for ${invitation.email}; you are signed in as ${principal.user.email}.`,
      );
    }
  } else {
    if (!input.displayName) throw errors.validation(['body', 'displayName'], 'Give your name to create the account.');
    if (!input.password) throw errors.validation(['body', 'password'], 'Choose a password to create the account.');
    passwordHash = await hashPassword(input.password); // outside the transaction: it is slow
  }

  return deps.db.transaction(async (tx) => {
    // Claiming with "accepted_at is null" keeps the link single-use under concurrent clicks.
    const [claimed] = await tx
      .update(invitations)
      .set({ acceptedAt: new Date() })
      .where(and(eq(invitations.id, invitation.id), isNull(invitations.acceptedAt)))
      .returning({ id: invitations.id });
    if (!claimed) throw new AppError('token_expired', 'This invitation was already accepted.');
    let user = account;
    if (!user) {
      const [created] = await tx
        .insert(users)
        .values({ email: invitation.email, displayName: input.displayName!, passwordHash: passwordHash! })
        .onConflictDoNothing({ target: users.email })
        .returning();
      if (!created)
        throw errors.conflict(`An account for ${invitation.email} was just created. Sign in and open the link again.`);
      user = created;
    }
    if (user.disabled) throw errors.forbidden('This account is disabled.');
    await tx
      .insert(memberships)
      .values({ teamId: invitation.teamId, userId: user.id, role: invitation.role })
      .onConflictDoUpdate({ target: [memberships.teamId, memberships.userId], set: { role: invitation.role } });
    if (principal?.sessionId) {
      await tx.delete(sessions).where(eq(sessions.id, principal.sessionId));
    }
    const session = await createSession(tx, user.id, meta, deps.config);
    await recordAudit(tx, {
      action: 'invitation.accepted',
      actor: user,
      meta,
      detail: { teamId: invitation.teamId, invitationId: invitation.id, role: invitation.role, newAccount: !account },
    });
    return { principal: { user: toSessionUser(user), via: 'session' as const, sessionId: session.id }, session };
  });
}
