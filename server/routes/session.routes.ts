import { sessionInfoSchema, signInInputSchema } from '@shared/schemas/session';
import { clearSessionCookie, setSessionCookie } from '../middleware/auth';
import { signIn, signOut } from '../services/session.service';
import { sessionInfoFor } from '../services/users.service';
import { defineRoute } from './registry';

/** Signing in and out with e-mail and password. */
export const sessionRoutes = [
  defineRoute({
    method: 'post',
    path: '/session',
    summary: 'Sign in',
    description:
      'Checks e-mail and password and sets the tl_session cookie. Failed attempts are limited per account and per address.',
    tags: ['session'],
    access: 'public',
    request: { body: signInInputSchema },
    responses: { 200: sessionInfoSchema },
    async handler({ body, deps, meta, req, res, principal }) {
      const { session, principal: signedIn } = await signIn(deps, body, meta, principal?.sessionId);
      setSessionCookie(req, res, session.secret, session.expiresAt);
      return sessionInfoFor(deps.db, signedIn);
    },
  }),
  defineRoute({
    method: 'get',
    path: '/session',
    summary: 'Who is signed in',
    tags: ['session'],
    access: 'public',
    responses: { 200: sessionInfoSchema },
    handler: ({ deps, principal }) => sessionInfoFor(deps.db, principal),
  }),
  defineRoute({
    method: 'delete',
    path: '/session',
    summary: 'Sign out',
    description: 'Ends the session on the server and clears the cookie.',
    tags: ['session'],
    access: 'public',
    responses: { 204: null },
    async handler({ deps, principal, meta, req, res }) {
      await signOut(deps.db, principal, principal?.via === 'session' ? principal.sessionId : undefined, meta);
      clearSessionCookie(req, res);
    },
  }),
];
