/**
 * The header's area links as data: a new area (Library, Cycles, Calorimetry…) is one more line
 * here once its pages exist. Pure, so the role filter is tested without Vue.
 */
import type { SessionInfo } from '@shared/schemas/session';
import { decideAccess, type RouteAccess } from '@/router/access';
import { canPropose } from '@/lib/amendment-words';

export interface NavItem {
  key: string;
  label: string;
  /** Route name the link opens. */
  routeName: string;
  access: RouteAccess;
  /** A further condition beyond the route's access (Amendments: only those who may propose). */
  when?: (session: SessionInfo) => boolean;
}

/** The areas built so far, in header order. */
export const navItems: readonly NavItem[] = [
  { key: 'workbench', label: 'Workbench', routeName: 'workbench', access: 'public' },
  { key: 'library', label: 'Library', routeName: 'library', access: 'public' },
  { key: 'derive', label: 'Derive', routeName: 'derive', access: 'public' },
  { key: 'calorimetry', label: 'Calorimetry', routeName: 'calorimetry', access: 'public' },
  { key: 'sets', label: 'Sets', routeName: 'team-sets', access: { team: 'viewer' } },
  { key: 'amendments', label: 'Amendments', routeName: 'amendments', access: 'signed_in', when: canPropose },
  { key: 'notes', label: 'Team notes', routeName: 'team-notes', access: { team: 'viewer' } },
  { key: 'members', label: 'Members', routeName: 'team-members', access: { team: 'viewer' } },
  { key: 'admin', label: 'Admin', routeName: 'admin-users', access: { site: 'site_admin' } },
];

export interface ResolvedNavItem extends NavItem {
  /** Route params to open the link with (the team for team areas). */
  params: Record<string, string>;
}

/**
 * The links this session may use. Team areas need a current team and link to it; an area the
 * role may not open is left out rather than shown disabled.
 */
export function visibleNavItems(
  items: readonly NavItem[],
  session: SessionInfo,
  currentTeamId: string | null,
): ResolvedNavItem[] {
  const out: ResolvedNavItem[] = [];
  for (const item of items) {
    const isTeamArea = typeof item.access === 'object' && 'team' in item.access;
    if (isTeamArea && currentTeamId === null) continue;
    if (decideAccess(item.access, session, currentTeamId ?? undefined) !== 'allow') continue;
    if (item.when && !item.when(session)) continue;
    out.push({ ...item, params: isTeamArea && currentTeamId !== null ? { teamId: currentTeamId } : {} });
  }
  return out;
}
