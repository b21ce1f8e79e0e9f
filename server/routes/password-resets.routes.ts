import { completePasswordResetInputSchema, requestPasswordResetInputSchema } from '@shared/schemas/account';
import { completePasswordReset, requestPasswordReset } from '../services/password-reset.service';
import { defineRoute } from './registry';

/** Password reset by e-mailed single-use link. */
export const passwordResetRoutes = [
  defineRoute({
    method: 'post',
    path: '/password-resets',
    summary: 'E-mail a password reset link',
    description:
      'Always 202, whether or not the address has an account, and just as fast either way: the e-mail is sent after the reply. Limited per e-mail address and per network address (RESET_MAILS_PER_ACCOUNT, RESET_MAILS_PER_ADDRESS in RESET_WINDOW_MINUTES): 429 with Retry-After.',
    tags: ['session'],
    access: 'public',
    request: { body: requestPasswordResetInputSchema },
    responses: { 202: null },
    handler: ({ ctx, body }) => requestPasswordReset(ctx, body),
  }),
  defineRoute({
    method: 'post',
    path: '/password-resets/complete',
    summary: 'Set a new password from a reset link',
    description:
      'The link works once, within an hour. Every session of the account ends and all its API tokens are revoked.',
    tags: ['session'],
    access: 'public',
    request: { body: completePasswordResetInputSchema },
    responses: { 204: null },
    handler: ({ ctx, body }) => completePasswordReset(ctx, body),
  }),
];
