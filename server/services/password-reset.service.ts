import { and, eq, isNull } from 'drizzle-orm';
import type { CompletePasswordResetInput } from '@shared/schemas/account';
import type { AppDeps, RequestMeta } from '../context';
import { passwordResets, users } from '../db/tables/index';
import { AppError } from '../errors';
import { hashPassword, hashSecret, randomSecret } from '../lib/secrets';
import { passwordResetMail } from '../mail/messages';
import { recordAudit } from './audit.service';
import { endUserSessions } from './session.service';
import { findUserByEmail } from './users.service';

/** How long a reset link works. */
export const RESET_LINK_MINUTES = 60;

/**
 * E-mails a single-use reset link when the address belongs to an active account. The caller
 * answers 202 either way, so the reply does not reveal which addresses have accounts.
 */
export async function requestPasswordReset(deps: AppDeps, email: string, meta: RequestMeta): Promise<void> {
  const user = await findUserByEmail(deps.db, email);
  if (!user || user.disabled) return;
  const secret = randomSecret();
  await deps.db.transaction(async (tx) => {
    await tx.insert(passwordResets).values({
      userId: user.id,
      tokenHash: hashSecret(secret),
      expiresAt: new Date(Date.now() + RESET_LINK_MINUTES * 60_000),
    });
    await recordAudit(tx, { action: 'password_reset.requested', actor: user, meta });
  });
  const link = `${deps.config.publicUrl}/reset-password?token=${encodeURIComponent(secret)}`;
  try {
    await deps.mailer.send(passwordResetMail({ to: user.email, link, minutes: RESET_LINK_MINUTES }));
  } catch (err) {
    // Still 202: the user can ask again; the operator sees why in the log.
    console.error('[mail] password reset e-mail failed:', (err as Error).message);
  }
}

/** Sets the new password from a reset link, once; ends every session of the account. */
export async function completePasswordReset(
  deps: AppDeps,
  input: CompletePasswordResetInput,
  meta: RequestMeta,
): Promise<void> {
  const tokenHash = hashSecret(input.token);
  const [reset] = await deps.db.select().from(passwordResets).where(eq(passwordResets.tokenHash, tokenHash)).limit(1);
  if (!reset) throw new AppError('bad_request', 'This reset link is not valid. Ask for a new one.');
  if (reset.usedAt || reset.expiresAt.getTime() <= Date.now()) {
    throw new AppError('token_expired', 'This reset link has expired or was already used. Ask for a new one.');
  }
  const passwordHash = await hashPassword(input.password);
  await deps.db.transaction(async (tx) => {
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
    // Other outstanding links for the account stop working too.
    await tx
      .update(passwordResets)
      .set({ usedAt: new Date() })
      .where(and(eq(passwordResets.userId, reset.userId), isNull(passwordResets.usedAt)));
    await recordAudit(tx, { action: 'password_reset.completed', actor: user ?? null, meta });
  });
}
