import { randomUUID } from 'node:crypto';
import { z } from 'zod';
import type TestAgent from 'supertest/lib/agent';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { teamRoleAtLeast, type SiteRole, type TeamRole } from '@shared/schemas/roles';
import type { Access } from '@shared/schemas/access';
import { seedLibrary } from '../../server/library/seed-library';
import { defineRoute, routeKey, type AnyRoute } from '../../server/routes/registry';
import { startTestApp, type TestApp } from './helpers';

// The library (curator routes) does not exist yet; this route exercises {site:'curator'} meanwhile.
const curatorProbe = defineRoute({
  method: 'get',
  path: '/test/curator-probe',
  summary: 'Test-only curator route',
  tags: ['test'],
  access: { site: 'curator' },
  responses: { 200: z.object({ ok: z.literal(true) }) },
  handler: () => ({ ok: true as const }),
});

/**
 * The expected access of every route, written out by hand. Changing a route's access, adding a
 * route or removing one must be mirrored here, or this test fails.
 */
const expectedAccess: Record<string, Access> = {
  'GET /api/v1/health': 'public',
  'GET /api/v1/openapi.json': 'public',
  'POST /api/v1/session': 'public',
  'GET /api/v1/session': 'public',
  'DELETE /api/v1/session': 'public',
  'POST /api/v1/password-resets': 'public',
  'POST /api/v1/password-resets/complete': 'public',
  'GET /api/v1/invitations/:token': 'public',
  'POST /api/v1/invitations/:token/accept': 'public',
  'GET /api/v1/account': 'signed_in',
  'PATCH /api/v1/account': 'signed_in',
  'POST /api/v1/account/password': 'signed_in',
  'GET /api/v1/account/tokens': 'signed_in',
  'POST /api/v1/account/tokens': 'signed_in',
  'DELETE /api/v1/account/tokens/:tokenId': 'signed_in',
  'GET /api/v1/teams/:teamId': { team: 'viewer' },
  'GET /api/v1/teams/:teamId/members': { team: 'viewer' },
  'PATCH /api/v1/teams/:teamId/members/:userId': { team: 'team_admin' },
  'DELETE /api/v1/teams/:teamId/members/:userId': { team: 'team_admin' },
  'GET /api/v1/teams/:teamId/invitations': { team: 'team_admin' },
  'POST /api/v1/teams/:teamId/invitations': { team: 'team_admin' },
  'DELETE /api/v1/teams/:teamId/invitations/:invitationId': { team: 'team_admin' },
  'GET /api/v1/teams/:teamId/notes': { team: 'viewer' },
  'POST /api/v1/teams/:teamId/notes': { team: 'member' },
  'PATCH /api/v1/teams/:teamId/notes/:noteId': { team: 'member' },
  'DELETE /api/v1/teams/:teamId/notes/:noteId': { team: 'member' },
  'GET /api/v1/admin/users': { site: 'site_admin' },
  'PATCH /api/v1/admin/users/:userId': { site: 'site_admin' },
  'GET /api/v1/admin/teams': { site: 'site_admin' },
  'POST /api/v1/admin/teams': { site: 'site_admin' },
  'GET /api/v1/admin/outbox': { site: 'site_admin' },
  'GET /api/v1/admin/audit-log': { site: 'site_admin' },
  'POST /api/v1/balance': 'public',
  'POST /api/v1/balance/batch': 'public',
  'GET /api/v1/species': 'public',
  'GET /api/v1/species/:speciesId': 'public',
  'GET /api/v1/library/revisions': 'public',
  'GET /api/v1/sources': 'public',
  'GET /api/v1/amendments': 'signed_in',
  'GET /api/v1/amendments/counts': 'signed_in',
  'POST /api/v1/amendments': 'proposer',
  'POST /api/v1/amendments/imports': 'proposer',
  'GET /api/v1/amendments/imports/limits': 'proposer',
  'GET /api/v1/amendments/imports/:jobId': 'proposer',
  'GET /api/v1/library/export.json': 'public',
  'GET /api/v1/library/export.csv': 'public',
  'GET /api/v1/amendments/:amendmentId': 'signed_in',
  'PUT /api/v1/amendments/:amendmentId': 'proposer',
  'POST /api/v1/amendments/:amendmentId/open': 'proposer',
  'POST /api/v1/amendments/:amendmentId/accept': { site: 'curator' },
  'POST /api/v1/amendments/:amendmentId/return': { site: 'curator' },
  'POST /api/v1/amendments/:amendmentId/decline': { site: 'curator' },
  'POST /api/v1/amendments/:amendmentId/withdraw': 'proposer',
  'POST /api/v1/amendments/:amendmentId/rebase': 'proposer',
  'POST /api/v1/amendments/:amendmentId/revert': 'proposer',
  'POST /api/v1/amendments/:amendmentId/comments': 'proposer',
  'GET /api/v1/account/notifications': 'signed_in',
  'PATCH /api/v1/account/notifications': 'signed_in',
  'GET /api/v1/amendments/:amendmentId/files': 'signed_in',
  'POST /api/v1/amendments/:amendmentId/files': 'proposer',
  'GET /api/v1/amendments/:amendmentId/files/:fileId': 'signed_in',
  'DELETE /api/v1/amendments/:amendmentId/files/:fileId': 'proposer',
  'POST /api/v1/reaction-enthalpy': 'public',
  'POST /api/v1/reaction-heat': 'public',
  'POST /api/v1/derive': 'public',
  'POST /api/v1/library/consistency': { site: 'curator' },
  'GET /api/v1/teams/:teamId/derived-values': { team: 'viewer' },
  'POST /api/v1/teams/:teamId/derived-values': { team: 'member' },
  'DELETE /api/v1/teams/:teamId/derived-values/:valueId': { team: 'member' },
  'GET /api/v1/teams/:teamId/sets': { team: 'viewer' },
  'POST /api/v1/teams/:teamId/sets': { team: 'member' },
  'POST /api/v1/teams/:teamId/sets/import': { team: 'member' },
  'GET /api/v1/teams/:teamId/sets/:setId': { team: 'viewer' },
  'PUT /api/v1/teams/:teamId/sets/:setId': { team: 'member' },
  'DELETE /api/v1/teams/:teamId/sets/:setId': { team: 'member' },
  'GET /api/v1/teams/:teamId/sets/:setId/results': { team: 'viewer' },
  'GET /api/v1/teams/:teamId/sets/:setId/versions': { team: 'viewer' },
  'GET /api/v1/teams/:teamId/sets/:setId/versions/:version': { team: 'viewer' },
  'GET /api/v1/teams/:teamId/sets/:setId/diff': { team: 'viewer' },
  'POST /api/v1/teams/:teamId/sets/:setId/versions/:version/restore': { team: 'member' },
  'GET /api/v1/teams/:teamId/sets/:setId/revision-changes': { team: 'viewer' },
  'POST /api/v1/teams/:teamId/sets/:setId/move-to-latest': { team: 'member' },
  'GET /api/v1/teams/:teamId/sets/:setId/links': { team: 'member' },
  'POST /api/v1/teams/:teamId/sets/:setId/links': { team: 'member' },
  'DELETE /api/v1/teams/:teamId/sets/:setId/links/:linkId': { team: 'member' },
  'GET /api/v1/teams/:teamId/sets/:setId/export.csv': { team: 'viewer' },
  'GET /api/v1/teams/:teamId/sets/:setId/export.json': { team: 'viewer' },
  'GET /api/v1/teams/:teamId/sets/:setId/export.bib': { team: 'viewer' },
  'GET /api/v1/teams/:teamId/sets/:setId/export.pdf': { team: 'viewer' },
  'GET /api/v1/shared/:token': 'public',
  'GET /api/v1/shared/:token/export.csv': 'public',
  'GET /api/v1/shared/:token/export.json': 'public',
  'GET /api/v1/shared/:token/export.bib': 'public',
  'GET /api/v1/shared/:token/export.pdf': 'public',
  'POST /api/v1/shared/:token/copy': 'signed_in',
  'POST /api/v1/calorimetry/constant-pressure': 'public',
  'POST /api/v1/calorimetry/bomb': 'public',
  'GET /api/v1/teams/:teamId/calorimetry/runs': { team: 'viewer' },
  'POST /api/v1/teams/:teamId/calorimetry/runs': { team: 'member' },
  'GET /api/v1/teams/:teamId/calorimetry/runs/:runId': { team: 'viewer' },
  'PATCH /api/v1/teams/:teamId/calorimetry/runs/:runId': { team: 'member' },
  'DELETE /api/v1/teams/:teamId/calorimetry/runs/:runId': { team: 'member' },
  'GET /api/v1/test/curator-probe': { site: 'curator' },
};

/** What each caller holds, as the demo seed sets it up (kestrel-bay is the team whose routes are called). */
interface Caller {
  name: string;
  signedIn: boolean;
  kestrelRole: TeamRole | null;
  siteRoles: SiteRole[];
  /** Member or team admin of some team (any team, not only kestrel-bay). */
  proposesInSomeTeam: boolean;
}
const callers: Caller[] = [
  { name: 'anonymous', signedIn: false, kestrelRole: null, siteRoles: [], proposesInSomeTeam: false },
  { name: 'viewer', signedIn: true, kestrelRole: 'viewer', siteRoles: [], proposesInSomeTeam: false },
  { name: 'member', signedIn: true, kestrelRole: 'member', siteRoles: [], proposesInSomeTeam: true },
  { name: 'team_admin', signedIn: true, kestrelRole: 'team_admin', siteRoles: [], proposesInSomeTeam: true },
  { name: 'curator', signedIn: true, kestrelRole: 'member', siteRoles: ['curator'], proposesInSomeTeam: true },
  { name: 'site_admin', signedIn: true, kestrelRole: null, siteRoles: ['site_admin'], proposesInSomeTeam: false },
  // Team admin of larchmont: a proposer through another team.
  { name: 'other_team', signedIn: true, kestrelRole: null, siteRoles: [], proposesInSomeTeam: true },
  { name: 'member_token', signedIn: true, kestrelRole: 'member', siteRoles: [], proposesInSomeTeam: true },
];

function mayCall(access: Access, caller: Caller): boolean {
  if (access === 'public') return true;
  if (!caller.signedIn) return false;
  if (access === 'signed_in') return true;
  if (access === 'proposer') return caller.proposesInSomeTeam || caller.siteRoles.includes('curator');
  if ('site' in access) return caller.siteRoles.includes(access.site);
  return caller.kestrelRole !== null && teamRoleAtLeast(caller.kestrelRole, access.team);
}

let t: TestApp;
let routes: AnyRoute[];
beforeAll(async () => {
  t = await startTestApp({ extraRoutes: [curatorProbe] });
  // Library routes answer 503 while the library is empty; seeded, every route reaches its access check and beyond.
  await seedLibrary(t.db);
  routes = t.app.locals.routes;
});
afterAll(async () => t?.close());

/** A concrete URL for a route: the demo team's id, made-up ids elsewhere (their 404 still means "allowed"). */
function urlFor(route: AnyRoute): string {
  const path = route.path
    .replace(':teamId', t.ids.teams.kestrel)
    .replace(':token', 'x'.repeat(43))
    .replace(':version', '1')
    .replace(/:(userId|noteId|invitationId|tokenId|setId|linkId|valueId|amendmentId|fileId|runId|jobId)/g, () =>
      randomUUID(),
    );
  return `/api/v1${path}`;
}

describe('route access table', () => {
  it('lists every route in the registry, and nothing else', () => {
    const registered = routes.map(routeKey).sort();
    expect(registered).toEqual(Object.keys(expectedAccess).sort());
  });

  it('matches the access each route declares', () => {
    for (const route of routes)
      expect({ route: routeKey(route), access: route.access }).toEqual({
        route: routeKey(route),
        access: expectedAccess[routeKey(route)],
      });
  });
});

describe('every route, for every kind of caller', () => {
  async function agentFor(caller: Caller): Promise<{ agent: TestAgent; headers: Record<string, string> }> {
    if (caller.name === 'anonymous') return { agent: t.anon(), headers: {} };
    if (caller.name === 'member_token')
      return { agent: t.anon(), headers: { Authorization: `Bearer ${await t.tokenFor('member')}` } };
    return { agent: await t.signIn(caller.name as Parameters<TestApp['signIn']>[0]), headers: {} };
  }

  for (const caller of callers) {
    it(`gives ${caller.name} exactly the declared access`, async () => {
      const { agent, headers } = await agentFor(caller);
      // Signing out would end the caller's session for the rest of the walk: do it last.
      const ordered = [...routes].sort(
        (a, b) => Number(routeKey(a) === 'DELETE /api/v1/session') - Number(routeKey(b) === 'DELETE /api/v1/session'),
      );
      const mismatches: string[] = [];
      for (const route of ordered) {
        // An empty body: allowed callers get past the access check and stop at validation (400), so nothing changes.
        let req = agent[route.method](urlFor(route)).set(headers);
        if (route.method !== 'get' && route.method !== 'delete') req = req.send({});
        const res = await req;
        const allowed = mayCall(expectedAccess[routeKey(route)]!, caller);
        const ok = allowed ? res.status !== 401 && res.status !== 403 : res.status === (caller.signedIn ? 403 : 401);
        if (!ok)
          mismatches.push(
            `${routeKey(route)} → ${res.status} ${JSON.stringify(res.body?.error ?? {})} (expected ${allowed ? 'allowed' : 'denied'})`,
          );
        if (res.status >= 500) mismatches.push(`${routeKey(route)} → server error ${JSON.stringify(res.body)}`);
      }
      expect(mismatches).toEqual([]);
    });
  }
});
