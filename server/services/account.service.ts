import { and, desc, eq } from 'drizzle-orm';
import type { ApiToken, ChangePasswordInput, CreateApiTokenInput, CreatedApiToken } from '@shared/schemas/account';
import type { Db } from '../db/client';
import { apiTokens, users, type ApiTokenRow } from '../db/tables/index';
import { AppError, errors } from '../errors';
import type { Principal, RequestMeta } from '../context';
import { hashPassword, hashSecret, newApiTokenSecret, verifyPassword } from '../lib/secrets';
import { recordAudit } from './audit.service';
import { endUserSessions } from './session.service';
import { findUserById, toSessionUser } from './users.service';

/** Changes the display name; returns the updated principal's user. */
export async function updateDisplayName(db: Db, principal: Principal, displayName: string): Promise<Principal> {
  const [row] = await db
    .update(users)
    .set({ displayName, updatedAt: new Date() })
    .where(eq(users.id, principal.user.id))
    .returning();
  if (!row) throw errors.notFound('Your account');
  return { ...principal, user: toSessionUser(row) };
}

/** Changes the password after checking the current one; ends the user's other sessions. */
export async function changePassword(
  db: Db,
  principal: Principal,
  input: ChangePasswordInput,
  meta: RequestMeta,
): Promise<void> {
  const user = await findUserById(db, principal.user.id);
  if (!user) throw errors.notFound('Your account');
  if (!(await verifyPassword(user.passwordHash, input.currentPassword))) {
    throw errors.validation(['body', 'currentPassword'], 'The current password is wrong.');
  }
  const passwordHash = await hashPassword(input.newPassword);
  await db.transaction(async (tx) => {
    await tx.update(users).set({ passwordHash, updatedAt: new Date() }).where(eq(users.id, user.id));
    await endUserSessions(tx, user.id, principal.sessionId);
    await recordAudit(tx, { action: 'password.changed', actor: user, meta });
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
export async function listApiTokens(db: Db, userId: string): Promise<ApiToken[]> {
  const rows = await db.select().from(apiTokens).where(eq(apiTokens.userId, userId)).orderBy(desc(apiTokens.createdAt));
  return rows.map(toApiToken);
}

/** Creates a token; the secret is returned this once and stored only as a hash. */
export async function createApiToken(
  db: Db,
  principal: Principal,
  input: CreateApiTokenInput,
  meta: RequestMeta,
): Promise<CreatedApiToken> {
  const secret = newApiTokenSecret();
  const expiresAt = input.expiresInDays ? new Date(Date.now() + input.expiresInDays * 86_400_000) : null;
  return db.transaction(async (tx) => {
    const [row] = await tx
      .insert(apiTokens)
      .values({
        userId: principal.user.id,
        name: input.name,
        prefix: secret.slice(0, 10),
        tokenHash: hashSecret(secret),
        expiresAt,
      })
      .returning();
    await recordAudit(tx, {
      action: 'token.created',
      actor: principal.user,
      meta,
      detail: { tokenId: row!.id, name: input.name },
    });
    return { ...toApiToken(row!), token: secret };
  });
}

/** Revokes one of the caller's tokens (404 for someone else's: ids are not confirmed). */
export async function revokeApiToken(db: Db, principal: Principal, tokenId: string, meta: RequestMeta): Promise<void> {
  await db.transaction(async (tx) => {
    const [row] = await tx
      .delete(apiTokens)
      .where(and(eq(apiTokens.id, tokenId), eq(apiTokens.userId, principal.user.id)))
      .returning({ id: apiTokens.id, name: apiTokens.name });
    if (!row) throw new AppError('not_found', 'That API token was not found among yours.');
    await recordAudit(tx, {
      action: 'token.revoked',
      actor: principal.user,
      meta,
      detail: { tokenId: row.id, name: row.name },
    });
  });
}
