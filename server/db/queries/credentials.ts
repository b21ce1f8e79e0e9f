import { and, eq, ne } from 'drizzle-orm';
import type { RequestMeta } from '../../context';
import type { AppConfig } from '../../env';
import { hashSecret, randomSecret } from '../../lib/secrets';
import type { Executor } from '../client';
import { apiTokens, sessions } from '../tables/index';

export interface NewSession {
  /** The cookie value; only its hash is stored. */
  secret: string;
  id: string;
  expiresAt: Date;
}

/** Starts a session for a user; returns the secret for the cookie. */
export async function insertSession(
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

/** Ends every session of a user, except `keepSessionId` when given. */
export async function endUserSessions(exec: Executor, userId: string, keepSessionId?: string): Promise<void> {
  await exec
    .delete(sessions)
    .where(
      keepSessionId ? and(eq(sessions.userId, userId), ne(sessions.id, keepSessionId)) : eq(sessions.userId, userId),
    );
}

/** Revokes every API token of a user; returns how many there were. */
export async function revokeUserTokens(exec: Executor, userId: string): Promise<number> {
  const gone = await exec.delete(apiTokens).where(eq(apiTokens.userId, userId)).returning({ id: apiTokens.id });
  return gone.length;
}
