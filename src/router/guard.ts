/**
 * The navigation decision as a pure function of the target route and the session, so it is
 * tested without a router: go ahead, send to sign-in with a way back, or show "not allowed".
 */
import type { SessionInfo } from '@shared/schemas/session';
import { decideAccess, type RouteAccess } from './access';

export interface GuardTarget {
  fullPath: string;
  access: RouteAccess | undefined;
  guestOnly: boolean;
  teamId: string | undefined;
}

export type GuardOutcome =
  | { kind: 'proceed' }
  | { kind: 'forbidden' }
  | { kind: 'redirect'; to: { name: string; query?: Record<string, string> } };

/** Closed by default: a route that forgot its access needs a signed-in user. */
export function guardNavigation(target: GuardTarget, session: SessionInfo): GuardOutcome {
  if (target.guestOnly && session.user !== null) return { kind: 'redirect', to: { name: 'workbench' } };
  const decision = decideAccess(target.access ?? 'signed_in', session, target.teamId);
  if (decision === 'sign_in')
    return { kind: 'redirect', to: { name: 'sign-in', query: { redirect: target.fullPath } } };
  if (decision === 'forbidden') return { kind: 'forbidden' };
  return { kind: 'proceed' };
}

/**
 * Where to go after signing in: the `redirect` query when it is a path inside this app,
 * otherwise home. Refuses "//host" and absolute URLs so the link cannot send users elsewhere.
 */
export function safeRedirect(value: unknown): string {
  if (typeof value !== 'string') return '/';
  if (!value.startsWith('/') || value.startsWith('//') || value.startsWith('/\\')) return '/';
  return value;
}
