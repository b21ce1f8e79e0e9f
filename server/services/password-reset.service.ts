import { and, eq, isNull } from 'drizzle-orm';
import type { CompletePasswordResetInput, RequestPasswordResetInput } from '@shared/schemas/account';
import type { ServiceContext } from '../context';
import { recordAudit } from '../db/queries/audit';
import { endUserSessions, revokeUserTokens } from '../db/queries/credentials';
import { findUserByEmail } from '../db/queries/users';
import { passwordResets, users } from '../db/tables/index';
import { AppError } from '../errors';
import { hashPassword, hashSecret, randomSecret } from '../lib/secrets';
import { passwordResetMail } from '../mail/messages';

/** How long a reset link works. */
export const RESET_LINK_MINUTES = 60;

/**
 * Asks for a reset link. The reply (202) must not tell whether the address has an account, in
 * its status or in its timing: the limits are counted against the address typed (whether or not
 * it exists) and the caller's network address, and everything else — the lookup, the link, the
 * e-mail — happens after the reply has left, as a background job.
 */
export async function requestPasswordReset(ctx: ServiceContext, input: RequestPasswordResetInput): Promise<void> {
  await ctx.limits.takeResetMail(input.email, ctx.meta.ip ?? 'unknown');
  ctx.jobs.run('password-reset-mail', () => sendResetLink(ctx, input.email));
}

async function sendResetLink(ctx: ServiceContext, email: string): Promise<void> {
  const { db, meta, config, mailer, log } = ctx;
  const user = await findUserByEmail(db, email);
  if (!user || user.disabled) return;
  const secret = randomSecret();
  const reset = await db.transaction(async (tx) => {
    const [row] = await tx
      .insert(passwordResets)
      .values({
        userId: user.id,
        tokenHash: hashSecret(secret),
        expiresAt: new Date(Date.now() + RESET_LINK_MINUTES * 60_000),
      })
      .returning({ id: passwordResets.id });
    await recordAudit(tx, { action: 'password_reset.requested', actor: user, meta });
    return row!;
  });
  const link = `${config.publicUrl}/reset-password?token=${encodeURIComponent(secret)}`;
  try {
    await mailer.send(passwordResetMail({ to: user.email, link, minutes: RESET_LINK_MINUTES }));
  } catch (err) {
    // Nobody can use a link that was never delivered: take it back, and leave a trace for the operator.
    await db.transaction(async (tx) => {
      await tx.delete(passwordResets).where(eq(passwordResets.id, reset.id));
      await recordAudit(tx, {
        action: 'password_reset.mail_failed',
        actor: user,
        meta,
        detail: { reason: (err as Error).message },
      });
    });
    log.error({ err, requestId: meta.requestId }, 'password reset e-mail could not be sent');
  }
}

/**
 * Sets the new password from a reset link, once. Every session of the account ends and every
 * API token is revoked, as after a password change.
 */
export async function completePasswordReset(ctx: ServiceContext, input: CompletePasswordResetInput): Promise<void> {
  const { db, meta } = ctx;
  const tokenHash = hashSecret(input.token);
  const [reset] = await db.select().from(passwordResets).where(eq(passwordResets.tokenHash, tokenHash)).limit(1);
  if (!reset) throw new AppError('bad_request', 'This reset link is not valid. Ask for a new one.');
  if (reset.usedAt || reset.expiresAt.getTime() <= Date.now()) {
    throw new AppError('token_expired', 'This reset link has expired or was already used. Ask for a new one.');
  }
  const passwordHash = await hashPassword(input.password);
  await db.transaction(async (tx) => {
    // The guard on used_at makes the link single-use even when two requests race.
    const [claimed] = await tx
      .update(passwordResets)
      .set({ usedAt: new Date() })
      .where(and(eq(passwordResets.id, reset.id), isNull(passwordResets.usedAt)))
      .returning({ id: passwordResets.id });
    if (!claimed) throw new AppError('token_expired', 'This reset link was already used. Ask for a new one.');
    const [user] = await tx
      .update(users)
      .set({ passwordHash, updatedAt: new Date() })
      .where(eq(users.id, reset.userId))
      .returning({ id: users.id, email: users.email });
    await endUserSessions(tx, reset.userId);
    const tokensRevoked = await revokeUserTokens(tx, reset.userId);
    // Other outstanding links for the account stop working too.
    await tx
      .update(passwordResets)
      .set({ usedAt: new Date() })
      .where(and(eq(passwordResets.userId, reset.userId), isNull(passwordResets.usedAt)));
    await recordAudit(tx, { action: 'password_reset.completed', actor: user ?? null, meta, detail: { tokensRevoked } });
  });
}
