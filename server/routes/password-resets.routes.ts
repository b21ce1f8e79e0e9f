import { completePasswordResetInputSchema, requestPasswordResetInputSchema } from '@shared/schemas/account';
import { completePasswordReset, requestPasswordReset } from '../services/password-reset.service';
import { defineRoute } from './registry';

/** Password reset by e-mailed single-use link. */
export const passwordResetRoutes = [
  defineRoute({
    method: 'post',
    path: '/password-resets',
    summary: 'E-mail a password reset link',
    description: 'Always 202, whether or not the address has an account.',
    tags: ['session'],
    access: 'public',
    request: { body: requestPasswordResetInputSchema },
    responses: { 202: null },
    handler: ({ deps, body, meta }) => requestPasswordReset(deps, body.email, meta),
  }),
  defineRoute({
    method: 'post',
    path: '/password-resets/complete',
    summary: 'Set a new password from a reset link',
    description: 'The link works once, within an hour; every session of the account ends.',
    tags: ['session'],
    access: 'public',
    request: { body: completePasswordResetInputSchema },
    responses: { 204: null },
    handler: ({ deps, body, meta }) => completePasswordReset(deps, body, meta),
  }),
];
