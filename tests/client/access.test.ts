import { describe, expect, it } from 'vitest';
import type { SiteRole } from '@shared/schemas/roles';
import type { SessionInfo } from '@shared/schemas/session';
import { decideAccess } from '@/router/access';
import { guardNavigation, safeRedirect } from '@/router/guard';

const teamA = '11111111-1111-4111-8111-111111111111';
const teamB = '22222222-2222-4222-8222-222222222222';
const user = (siteRoles: SiteRole[] = []) => ({
  id: '33333333-3333-4333-8333-333333333333',
  email: 'someone@lab.example',
  displayName: 'Someone',
  siteRoles,
});

const anonymous: SessionInfo = { user: null, teams: [], via: 'none' };
const viewer: SessionInfo = {
  user: user(),
  teams: [{ id: teamA, name: 'A', slug: 'a', role: 'viewer' }],
  via: 'session',
};
const member: SessionInfo = {
  user: user(),
  teams: [{ id: teamA, name: 'A', slug: 'a', role: 'member' }],
  via: 'session',
};
const teamAdmin: SessionInfo = {
  user: user(),
  teams: [{ id: teamA, name: 'A', slug: 'a', role: 'team_admin' }],
  via: 'session',
};
const siteAdmin: SessionInfo = { user: user(['site_admin']), teams: [], via: 'session' };
const curator: SessionInfo = { user: user(['curator']), teams: [], via: 'session' };

describe('decideAccess', () => {
  it('lets anyone open public pages', () => {
    expect(decideAccess('public', anonymous)).toBe('allow');
    expect(decideAccess('public', viewer)).toBe('allow');
  });

  it('asks anonymous visitors to sign in for every protected page, never "forbidden"', () => {
    expect(decideAccess('signed_in', anonymous)).toBe('sign_in');
    expect(decideAccess({ team: 'viewer' }, anonymous, teamA)).toBe('sign_in');
    expect(decideAccess({ site: 'site_admin' }, anonymous)).toBe('sign_in');
  });

  it('orders team roles viewer < member < team_admin', () => {
    expect(decideAccess({ team: 'viewer' }, viewer, teamA)).toBe('allow');
    expect(decideAccess({ team: 'member' }, viewer, teamA)).toBe('forbidden');
    expect(decideAccess({ team: 'member' }, member, teamA)).toBe('allow');
    expect(decideAccess({ team: 'team_admin' }, member, teamA)).toBe('forbidden');
    expect(decideAccess({ team: 'team_admin' }, teamAdmin, teamA)).toBe('allow');
  });

  it('forbids another team even with a high role in one’s own', () => {
    expect(decideAccess({ team: 'viewer' }, teamAdmin, teamB)).toBe('forbidden');
    expect(decideAccess({ team: 'viewer' }, teamAdmin, undefined)).toBe('forbidden');
  });

  it('gives site admins no automatic team access', () => {
    expect(decideAccess({ team: 'viewer' }, siteAdmin, teamA)).toBe('forbidden');
  });

  it('checks site roles exactly', () => {
    expect(decideAccess({ site: 'site_admin' }, siteAdmin)).toBe('allow');
    expect(decideAccess({ site: 'site_admin' }, curator)).toBe('forbidden');
    expect(decideAccess({ site: 'curator' }, curator)).toBe('allow');
    expect(decideAccess({ site: 'site_admin' }, teamAdmin)).toBe('forbidden');
  });
});

describe('guardNavigation', () => {
  const target = (
    access: Parameters<typeof decideAccess>[0] | undefined,
    extra: Partial<{ guestOnly: boolean; teamId: string }> = {},
  ) => ({
    fullPath: '/admin/users?x=1',
    access,
    guestOnly: extra.guestOnly ?? false,
    teamId: extra.teamId,
  });

  it('sends anonymous visitors to sign-in with the way back', () => {
    expect(guardNavigation(target({ site: 'site_admin' }), anonymous)).toEqual({
      kind: 'redirect',
      to: { name: 'sign-in', query: { redirect: '/admin/users?x=1' } },
    });
  });

  it('shows not-allowed for a signed-in user without the role', () => {
    expect(guardNavigation(target({ site: 'site_admin' }), viewer)).toEqual({ kind: 'forbidden' });
  });

  it('treats a route without access as needing sign-in (closed by default)', () => {
    expect(guardNavigation(target(undefined), anonymous).kind).toBe('redirect');
    expect(guardNavigation(target(undefined), viewer).kind).toBe('proceed');
  });

  it('sends signed-in users away from the sign-in page', () => {
    expect(guardNavigation(target('public', { guestOnly: true }), viewer)).toEqual({
      kind: 'redirect',
      to: { name: 'workbench' },
    });
    expect(guardNavigation(target('public', { guestOnly: true }), anonymous)).toEqual({ kind: 'proceed' });
  });
});

describe('safeRedirect', () => {
  it('keeps in-app paths', () => expect(safeRedirect('/teams/x/notes?a=1')).toBe('/teams/x/notes?a=1'));
  it('refuses other hosts and odd values', () => {
    expect(safeRedirect('https://elsewhere.example/')).toBe('/');
    expect(safeRedirect('//elsewhere.example/')).toBe('/');
    expect(safeRedirect('/\\elsewhere.example')).toBe('/');
    expect(safeRedirect(['/a'])).toBe('/');
    expect(safeRedirect(undefined)).toBe('/');
  });
});
