import { sessionInfoSchema, signInInputSchema } from '@shared/schemas/session';
import { clearSessionCookie, setSessionCookie } from '../middleware/auth';
import { signIn, signOut } from '../services/session.service';
import { sessionInfo } from '../services/users.service';
import { defineRoute } from './registry';

/** Signing in and out with e-mail and password. */
export const sessionRoutes = [
  defineRoute({
    method: 'post',
    path: '/session',
    summary: 'Sign in',
    description:
      'Checks e-mail and password and sets the tl_session cookie. Attempts are limited per account and per address (SIGNIN_MAX_FAILURES_PER_ACCOUNT, SIGNIN_MAX_FAILURES_PER_ADDRESS in SIGNIN_WINDOW_MINUTES), counted before the password is checked, so parallel attempts cannot get past the limit: 429 with Retry-After.',
    tags: ['session'],
    access: 'public',
    request: { body: signInInputSchema },
    responses: { 200: sessionInfoSchema },
    async handler({ ctx, body, req, res }) {
      const { session, principal } = await signIn(ctx, body);
      setSessionCookie(req, res, session.secret, session.expiresAt);
      return sessionInfo(ctx, { principal });
    },
  }),
  defineRoute({
    method: 'get',
    path: '/session',
    summary: 'Who is signed in',
    tags: ['session'],
    access: 'public',
    responses: { 200: sessionInfoSchema },
    handler: ({ ctx }) => sessionInfo(ctx, {}),
  }),
  defineRoute({
    method: 'delete',
    path: '/session',
    summary: 'Sign out',
    description: 'Ends the session on the server and clears the cookie.',
    tags: ['session'],
    access: 'public',
    responses: { 204: null },
    async handler({ ctx, req, res }) {
      await signOut(ctx, {});
      clearSessionCookie(req, res);
    },
  }),
];
