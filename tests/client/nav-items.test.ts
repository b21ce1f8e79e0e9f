import { describe, expect, it } from 'vitest';
import type { SessionInfo } from '@shared/schemas/session';
import { navItems, visibleNavItems } from '@/components/layout/nav-items';

const team = '11111111-1111-4111-8111-111111111111';
const person = { id: '33333333-3333-4333-8333-333333333333', email: 'p@lab.example', displayName: 'P' };
const keys = (session: SessionInfo, current: string | null) =>
  visibleNavItems(navItems, session, current).map((i) => i.key);

describe('visibleNavItems', () => {
  it('shows only the public areas (workbench, library, derive, calorimetry) to anonymous visitors', () => {
    expect(keys({ user: null, teams: [], via: 'none' }, null)).toEqual([
      'workbench',
      'library',
      'derive',
      'calorimetry',
    ]);
  });

  it('shows team areas to a viewer, linked to the current team, but no Admin', () => {
    const viewer: SessionInfo = {
      user: { ...person, siteRoles: [] },
      teams: [{ id: team, name: 'T', slug: 't', role: 'viewer' }],
      via: 'session',
    };
    const items = visibleNavItems(navItems, viewer, team);
    expect(items.map((i) => i.key)).toEqual([
      'workbench',
      'library',
      'derive',
      'calorimetry',
      'sets',
      'notes',
      'members',
    ]);
    expect(items.find((i) => i.key === 'notes')?.params).toEqual({ teamId: team });
    expect(items.find((i) => i.key === 'workbench')?.params).toEqual({});
  });

  it('shows Admin to a site admin without teams, and no team areas', () => {
    const admin: SessionInfo = { user: { ...person, siteRoles: ['site_admin'] }, teams: [], via: 'session' };
    expect(keys(admin, null)).toEqual(['workbench', 'library', 'derive', 'calorimetry', 'admin']);
  });

  it('hides Admin from a curator', () => {
    const curator: SessionInfo = {
      user: { ...person, siteRoles: ['curator'] },
      teams: [{ id: team, name: 'T', slug: 't', role: 'member' }],
      via: 'session',
    };
    expect(keys(curator, team)).toEqual([
      'workbench',
      'library',
      'derive',
      'calorimetry',
      'sets',
      'amendments',
      'notes',
      'members',
    ]);
  });

  it('shows Amendments to a team member (a proposer) but not to a viewer', () => {
    const member: SessionInfo = {
      user: { ...person, siteRoles: [] },
      teams: [{ id: team, name: 'T', slug: 't', role: 'member' }],
      via: 'session',
    };
    expect(keys(member, team)).toContain('amendments');
    const viewer: SessionInfo = { ...member, teams: [{ id: team, name: 'T', slug: 't', role: 'viewer' }] };
    expect(keys(viewer, team)).not.toContain('amendments');
  });

  it('drops team areas when the current team is not one of the user’s', () => {
    const viewer: SessionInfo = {
      user: { ...person, siteRoles: [] },
      teams: [{ id: team, name: 'T', slug: 't', role: 'viewer' }],
      via: 'session',
    };
    expect(keys(viewer, '99999999-9999-4999-8999-999999999999')).toEqual([
      'workbench',
      'library',
      'derive',
      'calorimetry',
    ]);
  });
});
