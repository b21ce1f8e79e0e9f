import { and, eq, ne } from 'drizzle-orm';
import type { SignInInput } from '@shared/schemas/session';
import type { Db, Executor } from '../db/client';
import { apiTokens, sessions, users } from '../db/tables/index';
import type { AppConfig } from '../env';
import { AppError } from '../errors';
import type { Principal, RequestMeta } from '../context';
import type { RateLimits } from '../middleware/rate-limit';
import { API_TOKEN_PREFIX, burnPasswordCheck, hashSecret, randomSecret, verifyPassword } from '../lib/secrets';
import { recordAudit } from './audit.service';
import { findUserByEmail, toSessionUser } from './users.service';

/** Sessions are touched at most this often, so reads do not all turn into writes. */
const TOUCH_INTERVAL_MS = 60_000;

export interface NewSession {
  /** The cookie value; only its hash is stored. */
  secret: string;
  id: string;
  expiresAt: Date;
}

/** Starts a session for a user; returns the secret for the cookie. */
export async function createSession(
  exec: Executor,
  userId: string,
  meta: RequestMeta,
  config: Pick<AppConfig, 'session'>,
): Promise<NewSession> {
  const secret = randomSecret();
  const expiresAt = new Date(Date.now() + config.session.ttlMs);
  const [row] = await exec
    .insert(sessions)
    .values({
      tokenHash: hashSecret(secret),
      userId,
      expiresAt,
      ip: meta.ip,
      userAgent: meta.userAgent?.slice(0, 300) ?? null,
    })
    .returning({ id: sessions.id });
  return { secret, id: row!.id, expiresAt };
}

/** The principal for a session cookie, or null when it is unknown, expired, idle too long or its user disabled. */
export async function resolveSession(
  db: Db,
  secret: string,
  config: Pick<AppConfig, 'session'>,
): Promise<Principal | null> {
  const [row] = await db
    .select({ session: sessions, user: users })
    .from(sessions)
    .innerJoin(users, eq(users.id, sessions.userId))
    .where(eq(sessions.tokenHash, hashSecret(secret)))
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
export async function resolveApiToken(db: Db, secret: string): Promise<Principal | null> {
  if (!secret.startsWith(API_TOKEN_PREFIX)) return null;
  const [row] = await db
    .select({ token: apiTokens, user: users })
    .from(apiTokens)
    .innerJoin(users, eq(users.id, apiTokens.userId))
    .where(eq(apiTokens.tokenHash, hashSecret(secret)))
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
 * Checks the password and opens a new session. Any session the request came with is ended
 * (a fresh id at every sign-in). Failures count against the account and the address.
 */
export async function signIn(
  deps: { db: Db; config: Pick<AppConfig, 'session'>; limits: RateLimits },
  input: SignInInput,
  meta: RequestMeta,
  previousSessionId: string | undefined,
): Promise<{ session: NewSession; principal: Principal }> {
  const { db, limits } = deps;
  const ip = meta.ip ?? 'unknown';
  await limits.checkSignIn(input.email, ip);
  const user = await findUserByEmail(db, input.email);
  // Hashing happens outside any transaction: PGlite has one connection.
  const ok = user
    ? await verifyPassword(user.passwordHash, input.password)
    : (await burnPasswordCheck(input.password), false);
  if (!user || !ok || user.disabled) {
    await limits.recordSignInFailure(input.email, ip);
    await recordAudit(db, {
      action: 'sign_in.failed',
      actor: user ? { id: user.id, email: user.email } : null,
      actorEmail: input.email,
      meta,
      detail: { reason: !user ? 'unknown_email' : !ok ? 'wrong_password' : 'disabled' },
    });
    throw new AppError('invalid_credentials', INVALID_CREDENTIALS_MESSAGE);
  }
  await limits.recordSignInSuccess(input.email);
  const session = await db.transaction(async (tx) => {
    if (previousSessionId) await tx.delete(sessions).where(eq(sessions.id, previousSessionId));
    const created = await createSession(tx, user.id, meta, deps.config);
    await recordAudit(tx, { action: 'sign_in.succeeded', actor: user, meta, detail: { sessionId: created.id } });
    return created;
  });
  return { session, principal: { user: toSessionUser(user), via: 'session', sessionId: session.id } };
}

/** Ends one session server-side. */
export async function signOut(
  db: Db,
  principal: Principal | null,
  sessionId: string | undefined,
  meta: RequestMeta,
): Promise<void> {
  if (!sessionId) return;
  await db.transaction(async (tx) => {
    await tx.delete(sessions).where(eq(sessions.id, sessionId));
    if (principal) await recordAudit(tx, { action: 'sign_out', actor: principal.user, meta, detail: { sessionId } });
  });
}

/** Ends every session of a user, except `keepSessionId` when given. */
export async function endUserSessions(exec: Executor, userId: string, keepSessionId?: string): Promise<void> {
  await exec
    .delete(sessions)
    .where(
      keepSessionId ? and(eq(sessions.userId, userId), ne(sessions.id, keepSessionId)) : eq(sessions.userId, userId),
    );
}
