import { eq } from 'drizzle-orm';
import type { SignInInput } from '@shared/schemas/session';
import type { Principal, ServiceContext } from '../context';
import { recordAudit } from '../db/queries/audit';
import { insertSession, type NewSession } from '../db/queries/credentials';
import { findUserByEmail, toSessionUser } from '../db/queries/users';
import { apiTokens, sessions, users } from '../db/tables/index';
import { AppError } from '../errors';
import { API_TOKEN_PREFIX, burnPasswordCheck, hashSecret, verifyPassword } from '../lib/secrets';

/** Sessions and tokens are touched at most this often, so reads do not all turn into writes. */
const TOUCH_INTERVAL_MS = 60_000;

/** The principal for a session cookie, or null when it is unknown, expired, idle too long or its user disabled. */
export async function resolveSession(ctx: ServiceContext, input: { secret: string }): Promise<Principal | null> {
  const { db, config } = ctx;
  const [row] = await db
    .select({ session: sessions, user: users })
    .from(sessions)
    .innerJoin(users, eq(users.id, sessions.userId))
    .where(eq(sessions.tokenHash, hashSecret(input.secret)))
    .limit(1);
  if (!row) return null;
  const now = Date.now();
  const idleFor = now - row.session.lastSeenAt.getTime();
  if (row.user.disabled || row.session.expiresAt.getTime() <= now || idleFor > config.session.idleMs) {
    await db.delete(sessions).where(eq(sessions.id, row.session.id));
    return null;
  }
  if (idleFor > TOUCH_INTERVAL_MS) {
    await db
      .update(sessions)
      .set({ lastSeenAt: new Date(now) })
      .where(eq(sessions.id, row.session.id));
  }
  return { user: toSessionUser(row.user), via: 'session', sessionId: row.session.id };
}

/** The principal for a Bearer API token, or null when it is unknown, expired or its user disabled. */
export async function resolveApiToken(ctx: ServiceContext, input: { secret: string }): Promise<Principal | null> {
  const { db } = ctx;
  if (!input.secret.startsWith(API_TOKEN_PREFIX)) return null;
  const [row] = await db
    .select({ token: apiTokens, user: users })
    .from(apiTokens)
    .innerJoin(users, eq(users.id, apiTokens.userId))
    .where(eq(apiTokens.tokenHash, hashSecret(input.secret)))
    .limit(1);
  if (!row || row.user.disabled) return null;
  const now = Date.now();
  if (row.token.expiresAt && row.token.expiresAt.getTime() <= now) return null;
  if (!row.token.lastUsedAt || now - row.token.lastUsedAt.getTime() > TOUCH_INTERVAL_MS) {
    await db
      .update(apiTokens)
      .set({ lastUsedAt: new Date(now) })
      .where(eq(apiTokens.id, row.token.id));
  }
  return { user: toSessionUser(row.user), via: 'token', tokenId: row.token.id };
}

/** The one message for every failed sign-in, so replies do not reveal which accounts exist. */
export const INVALID_CREDENTIALS_MESSAGE = 'E-mail or password is wrong.';

/**
 * Checks the password and opens a new session. An attempt is reserved against the account's and
 * the address's allowance before the password is checked and given back only on success, so
 * parallel guesses cannot outrun the limit. Any session the request came with is ended (a fresh
 * id at every sign-in).
 */
export async function signIn(
  ctx: ServiceContext,
  input: SignInInput,
): Promise<{ session: NewSession; principal: Principal }> {
  const { db, limits, meta } = ctx;
  const reservation = await limits.reserveSignIn(input.email, meta.ip ?? 'unknown');
  const user = await findUserByEmail(db, input.email);
  // Hashing happens outside any transaction: PGlite has one connection.
  const ok = user
    ? await verifyPassword(user.passwordHash, input.password)
    : (await burnPasswordCheck(input.password), false);
  if (!user || !ok || user.disabled) {
    reservation.failed();
    await recordAudit(db, {
      action: 'sign_in.failed',
      actor: user ? { id: user.id, email: user.email } : null,
      actorEmail: input.email,
      meta,
      detail: { reason: !user ? 'unknown_email' : !ok ? 'wrong_password' : 'disabled' },
    });
    throw new AppError('invalid_credentials', INVALID_CREDENTIALS_MESSAGE);
  }
  await reservation.succeeded();
  const previousSessionId = ctx.actor?.via === 'session' ? ctx.actor.sessionId : undefined;
  const session = await db.transaction(async (tx) => {
    if (previousSessionId) await tx.delete(sessions).where(eq(sessions.id, previousSessionId));
    const created = await insertSession(tx, user.id, meta, ctx.config);
    await recordAudit(tx, { action: 'sign_in.succeeded', actor: user, meta, detail: { sessionId: created.id } });
    return created;
  });
  return { session, principal: { user: toSessionUser(user), via: 'session', sessionId: session.id } };
}

/** Ends the caller's session server-side (nothing to do for tokens or anonymous callers). */
export async function signOut(ctx: ServiceContext, _input: object = {}): Promise<void> {
  const actor = ctx.actor;
  const sessionId = actor?.via === 'session' ? actor.sessionId : undefined;
  if (!actor || !sessionId) return;
  await ctx.db.transaction(async (tx) => {
    await tx.delete(sessions).where(eq(sessions.id, sessionId));
    await recordAudit(tx, { action: 'sign_out', actor: actor.user, meta: ctx.meta, detail: { sessionId } });
  });
}
