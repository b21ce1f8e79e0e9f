import { and, desc, eq } from 'drizzle-orm';
import type {
  ApiToken,
  ChangePasswordInput,
  CreateApiTokenInput,
  CreatedApiToken,
  UpdateAccountInput,
} from '@shared/schemas/account';
import type { SessionInfo } from '@shared/schemas/session';
import type { ActorContext } from '../context';
import { recordAudit } from '../db/queries/audit';
import { endUserSessions, revokeUserTokens } from '../db/queries/credentials';
import { findUserById, toSessionUser } from '../db/queries/users';
import { apiTokens, users, type ApiTokenRow } from '../db/tables/index';
import { AppError, errors } from '../errors';
import { hashPassword, hashSecret, newApiTokenSecret, verifyPassword } from '../lib/secrets';
import { sessionInfo } from './users.service';

/** Changes the caller's display name; returns the updated session info. */
export async function updateDisplayName(ctx: ActorContext, input: UpdateAccountInput): Promise<SessionInfo> {
  const [row] = await ctx.db
    .update(users)
    .set({ displayName: input.displayName, updatedAt: new Date() })
    .where(eq(users.id, ctx.actor.user.id))
    .returning();
  if (!row) throw errors.notFound('Your account');
  return sessionInfo(ctx, { principal: { ...ctx.actor, user: toSessionUser(row) } });
}

/**
 * Changes the password after checking the current one. Every other session ends and every API
 * token is revoked: whoever knew the old password may have made one.
 */
export async function changePassword(ctx: ActorContext, input: ChangePasswordInput): Promise<void> {
  const { db, actor, meta } = ctx;
  const user = await findUserById(db, actor.user.id);
  if (!user) throw errors.notFound('Your account');
  if (!(await verifyPassword(user.passwordHash, input.currentPassword))) {
    throw errors.validation(['body', 'currentPassword'], 'The current password is wrong.');
  }
  const passwordHash = await hashPassword(input.newPassword);
  await db.transaction(async (tx) => {
    await tx.update(users).set({ passwordHash, updatedAt: new Date() }).where(eq(users.id, user.id));
    await endUserSessions(tx, user.id, actor.via === 'session' ? actor.sessionId : undefined);
    const tokensRevoked = await revokeUserTokens(tx, user.id);
    await recordAudit(tx, { action: 'password.changed', actor: user, meta, detail: { tokensRevoked } });
  });
}

function toApiToken(row: ApiTokenRow): ApiToken {
  return {
    id: row.id,
    name: row.name,
    prefix: row.prefix,
    createdAt: row.createdAt.toISOString(),
    lastUsedAt: row.lastUsedAt?.toISOString() ?? null,
    expiresAt: row.expiresAt?.toISOString() ?? null,
  };
}

/** The caller's API tokens, newest first. */
export async function listApiTokens(ctx: ActorContext, _input: object = {}): Promise<{ tokens: ApiToken[] }> {
  const rows = await ctx.db
    .select()
    .from(apiTokens)
    .where(eq(apiTokens.userId, ctx.actor.user.id))
    .orderBy(desc(apiTokens.createdAt));
  return { tokens: rows.map(toApiToken) };
}

/**
 * Creates a token; the secret is returned this once and stored only as a hash. Only a password
 * sign-in may do this: a leaked token must not be able to mint replacements that outlive its revocation.
 */
export async function createApiToken(ctx: ActorContext, input: CreateApiTokenInput): Promise<CreatedApiToken> {
  const { db, actor, meta } = ctx;
  if (actor.via !== 'session') {
    throw new AppError('forbidden', 'An API token cannot create tokens. Sign in with your password to make one.');
  }
  const secret = newApiTokenSecret();
  const expiresAt = input.expiresInDays ? new Date(Date.now() + input.expiresInDays * 86_400_000) : null;
  return db.transaction(async (tx) => {
    const [row] = await tx
      .insert(apiTokens)
      .values({
        userId: actor.user.id,
        name: input.name,
        prefix: secret.slice(0, 10),
        tokenHash: hashSecret(secret),
        expiresAt,
      })
      .returning();
    await recordAudit(tx, {
      action: 'token.created',
      actor: actor.user,
      meta,
      detail: { tokenId: row!.id, name: input.name },
    });
    return { ...toApiToken(row!), token: secret };
  });
}

/** Revokes one of the caller's tokens (404 for someone else's: ids are not confirmed). */
export async function revokeApiToken(ctx: ActorContext, input: { tokenId: string }): Promise<void> {
  const { db, actor, meta } = ctx;
  await db.transaction(async (tx) => {
    const [row] = await tx
      .delete(apiTokens)
      .where(and(eq(apiTokens.id, input.tokenId), eq(apiTokens.userId, actor.user.id)))
      .returning({ id: apiTokens.id, name: apiTokens.name });
    if (!row) throw new AppError('not_found', 'That API token was not found among yours.');
    await recordAudit(tx, {
      action: 'token.revoked',
      actor: actor.user,
      meta,
      detail: { tokenId: row.id, name: row.name },
    });
  });
}
