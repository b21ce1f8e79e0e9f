import {
  apiTokenListSchema,
  createdApiTokenSchema,
  sessionReplySchema,
  type ApiToken,
  type ChangePasswordInput,
  type CompletePasswordResetInput,
  type CreateApiTokenInput,
  type CreatedApiToken,
  type RequestPasswordResetInput,
  type UpdateAccountInput,
} from '@shared/schemas/account';
import type { SessionInfo } from '@shared/schemas/session';
import { http } from './http';

/** The signed-in account, as session info. */
export function getAccount(): Promise<SessionInfo> {
  return http.get('/account', { schema: sessionReplySchema });
}

/** Changes the display name; replies with the updated session. */
export function updateAccount(input: UpdateAccountInput): Promise<SessionInfo> {
  return http.patch('/account', input, { schema: sessionReplySchema });
}

/** Changes the password; the current one must be given. */
export async function changePassword(input: ChangePasswordInput): Promise<void> {
  await http.post('/account/password', input);
}

/** The account's personal API tokens (without secrets). */
export async function listApiTokens(): Promise<ApiToken[]> {
  return (await http.get('/account/tokens', { schema: apiTokenListSchema })).tokens;
}

/** Creates a token; the reply holds the secret, shown once. */
export function createApiToken(input: CreateApiTokenInput): Promise<CreatedApiToken> {
  return http.post('/account/tokens', input, { schema: createdApiTokenSchema });
}

/** Revokes a token at once. */
export function revokeApiToken(tokenId: string): Promise<void> {
  return http.delete(`/account/tokens/${encodeURIComponent(tokenId)}`);
}

/** Asks for a reset link by e-mail; the server answers the same whether or not the account exists. */
export async function requestPasswordReset(input: RequestPasswordResetInput): Promise<void> {
  await http.post('/password-resets', input);
}

/** Sets a new password with the e-mailed single-use token. */
export async function completePasswordReset(input: CompletePasswordResetInput): Promise<void> {
  await http.post('/password-resets/complete', input);
}
