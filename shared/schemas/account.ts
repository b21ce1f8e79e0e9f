import { z } from 'zod';
import { emailSchema, idSchema, isoDateTimeSchema, newPasswordSchema } from './common';
import { sessionInfoSchema } from './session';
import { plainText } from './text';

export const updateAccountInputSchema = z.object({
  displayName: plainText().trim().min(1).max(120),
});
export type UpdateAccountInput = z.infer<typeof updateAccountInputSchema>;

export const changePasswordInputSchema = z.object({
  currentPassword: z.string().min(1).max(200),
  newPassword: newPasswordSchema,
});
export type ChangePasswordInput = z.infer<typeof changePasswordInputSchema>;

/** Personal API token as listed; the secret itself is shown only once, at creation. */
export const apiTokenSchema = z.object({
  id: idSchema,
  name: z.string(),
  /** First characters of the token, so the owner can tell tokens apart. */
  prefix: z.string(),
  createdAt: isoDateTimeSchema,
  lastUsedAt: isoDateTimeSchema.nullable(),
  expiresAt: isoDateTimeSchema.nullable(),
});
export type ApiToken = z.infer<typeof apiTokenSchema>;

export const createApiTokenInputSchema = z.object({
  name: plainText().trim().min(1).max(80),
  /** Days until the token stops working; omitted = no expiry. */
  expiresInDays: z.number().int().min(1).max(3650).optional(),
});
export type CreateApiTokenInput = z.infer<typeof createApiTokenInputSchema>;

export const createdApiTokenSchema = apiTokenSchema.extend({
  /** The secret, e.g. "tl_…"; send as `Authorization: Bearer <token>`. Shown once. */
  token: z.string(),
});
export type CreatedApiToken = z.infer<typeof createdApiTokenSchema>;

export const apiTokenListSchema = z.object({ tokens: z.array(apiTokenSchema) });

export const tokenIdParamsSchema = z.object({ tokenId: idSchema });

// Password reset by e-mailed link.
export const requestPasswordResetInputSchema = z.object({ email: emailSchema });
export type RequestPasswordResetInput = z.infer<typeof requestPasswordResetInputSchema>;

export const completePasswordResetInputSchema = z.object({
  token: z.string().min(20).max(200),
  password: newPasswordSchema,
});
export type CompletePasswordResetInput = z.infer<typeof completePasswordResetInputSchema>;

export const sessionReplySchema = sessionInfoSchema;
