import { and, desc, eq, isNull } from 'drizzle-orm';
import type {
  AcceptInvitationInput,
  CreateInvitationInput,
  Invitation,
  InvitationPreview,
} from '@shared/schemas/teams';
import { roleLabels } from '@shared/schemas/roles';
import type { ActorContext, Principal, ServiceContext } from '../context';
import type { Executor } from '../db/client';
import { recordAudit } from '../db/queries/audit';
import { insertSession, type NewSession } from '../db/queries/credentials';
import { dropSupersededInvitations, insertInvitation } from '../db/queries/invitations';
import { findUserByEmail, toSessionUser } from '../db/queries/users';
import { invitations, memberships, sessions, teams, users, type InvitationRow } from '../db/tables/index';
import { AppError, errors } from '../errors';
import { hashPassword, hashSecret } from '../lib/secrets';
import { invitationMail } from '../mail/messages';

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
export async function listInvitations(
  ctx: ServiceContext,
  input: { teamId: string },
): Promise<{ invitations: Invitation[] }> {
  const rows = await ctx.db
    .select()
    .from(invitations)
    .where(eq(invitations.teamId, input.teamId))
    .orderBy(desc(invitations.createdAt));
  return { invitations: rows.map(toInvitation) };
}

/**
 * E-mails an invitation that was just inserted, then settles it: on success the older open
 * invitations for the same address are withdrawn and the invitation is recorded in the audit log;
 * if sending fails the new invitation is deleted again (the older ones keep working), the failure
 * is recorded, and the caller gets 503. Either way nothing is left half-done.
 */
export async function deliverInvitation(
  ctx: ActorContext,
  input: { invitation: InvitationRow; secret: string; teamName: string; teamCreated?: boolean },
): Promise<void> {
  const { db, mailer, config, actor, meta, log } = ctx;
  const { invitation, secret, teamName } = input;
  const detail = {
    teamId: invitation.teamId,
    invitationId: invitation.id,
    email: invitation.email,
    role: invitation.role,
  };
  const link = `${config.publicUrl}/invitations/${encodeURIComponent(secret)}`;
  try {
    await mailer.send(
      invitationMail({
        to: invitation.email,
        teamName,
        inviterName: actor.user.displayName,
        role: roleLabels[invitation.role].toLowerCase(),
        link,
        expiresAt: invitation.expiresAt,
      }),
    );
  } catch (err) {
    log.error({ err, requestId: meta.requestId }, 'invitation e-mail could not be sent');
    await db.transaction(async (tx) => {
      await tx.delete(invitations).where(eq(invitations.id, invitation.id));
      await recordAudit(tx, {
        action: 'invitation.mail_failed',
        actor: actor.user,
        meta,
        detail: { ...detail, reason: (err as Error).message },
      });
    });
    throw new AppError(
      'unavailable',
      input.teamCreated
        ? 'The invitation e-mail to the first team admin could not be sent, so the team was not created. Try again later.'
        : 'The invitation e-mail could not be sent, so no invitation was made. Try again later.',
      undefined,
      { 'Retry-After': '60' },
    );
  }
  await db.transaction(async (tx) => {
    await dropSupersededInvitations(tx, invitation);
    await recordAudit(tx, { action: 'invitation.created', actor: actor.user, meta, detail });
  });
}

/** Invites someone to a team by e-mail (409 when they are already a member, 503 when the e-mail cannot be sent). */
export async function createInvitation(
  ctx: ActorContext,
  input: CreateInvitationInput & { teamId: string },
): Promise<Invitation> {
  const { row, secret, teamName } = await ctx.db.transaction(async (tx) => {
    const [team] = await tx.select().from(teams).where(eq(teams.id, input.teamId)).limit(1);
    if (!team) throw errors.notFound('The team');
    const [existing] = await tx
      .select({ userId: users.id })
      .from(memberships)
      .innerJoin(users, eq(users.id, memberships.userId))
      .where(and(eq(memberships.teamId, input.teamId), eq(users.email, input.email)))
      .limit(1);
    if (existing) throw errors.conflict(`${input.email} is already a member of this team.`);
    const made = await insertInvitation(tx, {
      teamId: input.teamId,
      email: input.email,
      role: input.role,
      invitedBy: { id: ctx.actor.user.id, name: ctx.actor.user.displayName },
    });
    return { ...made, teamName: team.name };
  });
  await deliverInvitation(ctx, { invitation: row, secret, teamName });
  return toInvitation(row);
}

/** Withdraws an open or accepted invitation record of this team. */
export async function revokeInvitation(
  ctx: ActorContext,
  input: { teamId: string; invitationId: string },
): Promise<void> {
  await ctx.db.transaction(async (tx) => {
    const [row] = await tx
      .delete(invitations)
      .where(and(eq(invitations.id, input.invitationId), eq(invitations.teamId, input.teamId)))
      .returning({ id: invitations.id, email: invitations.email });
    if (!row) throw errors.notFound('The invitation');
    await recordAudit(tx, {
      action: 'invitation.revoked',
      actor: ctx.actor.user,
      meta: ctx.meta,
      detail: { teamId: input.teamId, invitationId: input.invitationId, email: row.email },
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
export async function previewInvitation(ctx: ServiceContext, input: { token: string }): Promise<InvitationPreview> {
  const { invitation, teamName } = await findUsable(ctx.db, input.token);
  const account = await findUserByEmail(ctx.db, invitation.email);
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
  ctx: ServiceContext,
  input: AcceptInvitationInput & { token: string },
): Promise<{ principal: Principal; session: NewSession }> {
  const { db, actor, meta } = ctx;
  const { invitation } = await findUsable(db, input.token);
  const account = await findUserByEmail(db, invitation.email);
  let passwordHash: string | null = null;
  if (account) {
    if (!actor) throw new AppError('unauthenticated', `Sign in as ${invitation.email} to accept this invitation.`);
    if (actor.user.id !== account.id) {
      throw new AppError(
        'forbidden',
        `This invitation is for ${invitation.email}; you are signed in as ${actor.user.email}.`,
      );
    }
  } else {
    if (!input.displayName) throw errors.validation(['body', 'displayName'], 'Give your name to create the account.');
    if (!input.password) throw errors.validation(['body', 'password'], 'Choose a password to create the account.');
    passwordHash = await hashPassword(input.password); // outside the transaction: it is slow
  }

  return db.transaction(async (tx) => {
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
    if (actor?.sessionId) {
      await tx.delete(sessions).where(eq(sessions.id, actor.sessionId));
    }
    const session = await insertSession(tx, user.id, meta, ctx.config);
    await recordAudit(tx, {
      action: 'invitation.accepted',
      actor: user,
      meta,
      detail: { teamId: invitation.teamId, invitationId: invitation.id, role: invitation.role, newAccount: !account },
    });
    return { principal: { user: toSessionUser(user), via: 'session' as const, sessionId: session.id }, session };
  });
}
