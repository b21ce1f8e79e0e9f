/**
 * Who may open a route: the same words the server's route registry uses, so a page and the API
 * behind it state their access the same way. Pure — no Vue, no router — so it is tested directly.
 */
import { teamRoleAtLeast, type SiteRole, type TeamRole } from '@shared/schemas/roles';
import type { SessionInfo } from '@shared/schemas/session';

export type RouteAccess = 'public' | 'signed_in' | { team: TeamRole } | { site: SiteRole };

/** allow: show the page; sign_in: send to sign-in first; forbidden: show the not-allowed view. */
export type AccessDecision = 'allow' | 'sign_in' | 'forbidden';

/** True when the session holds the site role itself (roles do not imply each other, as on the server). */
export function hasSiteRole(session: SessionInfo, role: SiteRole): boolean {
  return session.user?.siteRoles.includes(role) ?? false;
}

/** The caller's role in a team, or undefined when not a member. */
export function teamRoleOf(session: SessionInfo, teamId: string | undefined): TeamRole | undefined {
  if (teamId === undefined) return undefined;
  return session.teams.find((t) => t.id === teamId)?.role;
}

/**
 * Decides whether `session` may open a route with `access`. `teamId` is the route's :teamId
 * for team routes. Anonymous callers are always asked to sign in, never told "forbidden",
 * so signing in can still get them there.
 */
export function decideAccess(access: RouteAccess, session: SessionInfo, teamId?: string): AccessDecision {
  if (access === 'public') return 'allow';
  if (session.user === null) return 'sign_in';
  if (access === 'signed_in') return 'allow';
  if ('team' in access) {
    const held = teamRoleOf(session, teamId);
    return held !== undefined && teamRoleAtLeast(held, access.team) ? 'allow' : 'forbidden';
  }
  return hasSiteRole(session, access.site) ? 'allow' : 'forbidden';
}
