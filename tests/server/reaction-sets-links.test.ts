import { afterAll, beforeAll, beforeEach, describe, expect, it } from 'vitest';
import { eq, sql } from 'drizzle-orm';
import type TestAgent from 'supertest/lib/agent';
import { reactionSetLinks } from '../../server/db/tables/index';
import { lastMailTo, linkIn, startTestApp, type TestApp } from './helpers';

let t: TestApp;
let member: TestAgent;
beforeAll(async () => {
  t = await startTestApp();
});
afterAll(() => t?.close());
beforeEach(async () => {
  await t.reset();
  member = await t.signIn('member');
});

const COMBUSTION = 'C3H8(g) + 5 O2(g) -> 3 CO2(g) + 4 H2O(l)';
const setsUrl = () => `/api/v1/teams/${t.ids.teams.kestrel}/sets`;

async function makeSet(title = 'Burner feed') {
  const res = await member.post(setsUrl()).send({
    title,
    tags: ['burner'],
    items: [
      { kind: 'reaction', equation: COMBUSTION },
      { kind: 'note', text: 'Internal remark' },
    ],
  });
  expect(res.status).toBe(201);
  return res.body as { id: string; version: number };
}

async function makeLink(setId: string, body: Record<string, unknown> = {}) {
  const res = await member.post(`${setsUrl()}/${setId}/links`).send(body);
  expect(res.status).toBe(201);
  return res.body as { id: string; url: string; token: string };
}

async function notFoundBody(path: string) {
  const res = await t.anon().get(path);
  expect(res.status).toBe(404);
  return res.body as unknown;
}

describe('POST /api/v1/teams/:teamId/sets/:setId/links', () => {
  it('gives a token of at least 128 random bits once, and keeps only its hashes', async () => {
    const set = await makeSet();
    const link = await makeLink(set.id);
    // 65 base64url characters: 16 bytes of selector and 32 bytes (256 bits) of verifier.
    expect(link.token).toMatch(/^[A-Za-z0-9_-]{65}$/);
    expect(link.url).toBe(`${t.config.publicUrl}/shared/${link.token}`);
    const stored = await t.db.execute(sql`select * from reaction_set_links`);
    const text = JSON.stringify((stored as { rows: unknown[] }).rows);
    expect(text).not.toContain(link.token);
    expect(text).not.toContain(link.token.slice(0, 22));
    expect(text).not.toContain(link.token.slice(22));
    const list = await member.get(`${setsUrl()}/${set.id}/links`);
    expect(list.body.items).toHaveLength(1);
    expect(JSON.stringify(list.body)).not.toContain(link.token);
    expect(list.body.items[0]).toMatchObject({ state: 'active', lastUsedAt: null, expiresAt: null });
  });

  it('makes a different token every time', async () => {
    const set = await makeSet();
    const tokens = new Set<string>();
    for (let i = 0; i < 20; i++) tokens.add((await makeLink(set.id)).token);
    expect(tokens.size).toBe(20);
  });

  it('sends the link by e-mail through the mailer', async () => {
    const set = await makeSet('Quench study');
    const link = await makeLink(set.id, { email: 'reviewer@example.org' });
    const mail = lastMailTo(t.mail, 'reviewer@example.org');
    expect(mail.subject).toContain('Quench study');
    expect(linkIn(mail.text, `${t.config.publicUrl}/shared/`)).toBe(link.url);
    const list = await member.get(`${setsUrl()}/${set.id}/links`);
    expect(list.body.items[0].emailedTo).toBe('reviewer@example.org');
  });

  it('makes no link when the e-mail cannot be sent (503)', async () => {
    const set = await makeSet();
    t.mailer.mode = 'fail';
    const res = await member.post(`${setsUrl()}/${set.id}/links`).send({ email: 'reviewer@example.org' });
    expect(res.status).toBe(503);
    const list = await member.get(`${setsUrl()}/${set.id}/links`);
    expect(list.body.items).toHaveLength(0);
  });

  it('refuses an expiry in the past, naming the field', async () => {
    const set = await makeSet();
    const res = await member
      .post(`${setsUrl()}/${set.id}/links`)
      .send({ expiresAt: new Date(Date.now() - 60_000).toISOString() });
    expect(res.status).toBe(400);
    expect(res.body.error.details.issues[0].path).toEqual(['body', 'expiresAt']);
  });

  it('is for members: a viewer may neither make nor list links', async () => {
    const set = await makeSet();
    const viewer = await t.signIn('viewer');
    expect((await viewer.post(`${setsUrl()}/${set.id}/links`).send({})).status).toBe(403);
    expect((await viewer.get(`${setsUrl()}/${set.id}/links`)).status).toBe(403);
  });
});

describe('GET /api/v1/shared/:token (the share-link matrix)', () => {
  it('opens a valid link without an account: the set, its ΔH at its revision, sources and cautions', async () => {
    const set = await makeSet();
    const link = await makeLink(set.id);
    const res = await t.anon().get(`/api/v1/shared/${link.token}`);
    expect(res.status).toBe(200);
    expect(res.headers['referrer-policy']).toBe('no-referrer');
    expect(res.headers['x-robots-tag']).toContain('noindex');
    expect(res.body.title).toBe('Burner feed');
    const reaction = res.body.evaluation.results[0];
    expect(reaction.kind).toBe('reaction');
    // Propane burnt to liquid water: ΔcH° = −2219.2 ± 0.5 kJ/mol (NIST Chemistry WebBook, propane,
    // ΔcH°gas; value from memory); the library's own ΔfH° values must land within a few kJ/mol of it.
    expect(reaction.value.deltaH.value).toBeGreaterThan(-2225);
    expect(reaction.value.deltaH.value).toBeLessThan(-2213);
    expect(res.body.evaluation.sources.length).toBeGreaterThan(0);
    expect(res.body.evaluation.cautions.length).toBeGreaterThan(0);
    expect(res.body.evaluation.libraryRevision).toBe(res.body.revision);
    // Nothing about the team or its people.
    const text = JSON.stringify(res.body);
    expect(text).not.toContain(t.ids.teams.kestrel);
    expect(text).not.toContain(set.id);
    expect(res.body).not.toHaveProperty('owner');
    expect(res.body).not.toHaveProperty('updatedBy');
    expect(res.body).not.toHaveProperty('teamId');
  });

  it('records the last use', async () => {
    const set = await makeSet();
    const link = await makeLink(set.id);
    await t.anon().get(`/api/v1/shared/${link.token}`).expect(200);
    const list = await member.get(`${setsUrl()}/${set.id}/links`);
    expect(list.body.items[0].lastUsedAt).not.toBeNull();
  });

  it('answers revoked, expired, wrong, malformed and spliced tokens with the same 404', async () => {
    const set = await makeSet();
    const other = await makeSet('Another set');
    const revoked = await makeLink(set.id);
    const expired = await makeLink(set.id, { expiresAt: new Date(Date.now() + 3_600_000).toISOString() });
    const valid = await makeLink(set.id);
    const otherLink = await makeLink(other.id);
    expect((await member.delete(`${setsUrl()}/${set.id}/links/${revoked.id}`)).status).toBe(204);
    await t.db
      .update(reactionSetLinks)
      .set({ expiresAt: new Date(Date.now() - 1000) })
      .where(eq(reactionSetLinks.id, expired.id));

    const flip = (s: string) => s.slice(0, -1) + (s.endsWith('A') ? 'B' : 'A');
    const bodies = [
      await notFoundBody(`/api/v1/shared/${revoked.token}`),
      await notFoundBody(`/api/v1/shared/${expired.token}`),
      // Right selector, wrong verifier.
      await notFoundBody(`/api/v1/shared/${flip(valid.token)}`),
      // The selector of one link with the verifier of another set's link.
      await notFoundBody(`/api/v1/shared/${valid.token.slice(0, 22)}${otherLink.token.slice(22)}`),
      await notFoundBody(`/api/v1/shared/${'A'.repeat(65)}`),
      await notFoundBody('/api/v1/shared/not-a-token'),
      await notFoundBody(`/api/v1/shared/${revoked.token}/export.csv`),
      await notFoundBody(`/api/v1/shared/${expired.token}/export.pdf`),
    ];
    for (const body of bodies) expect(body).toEqual(bodies[0]);

    const list = await member.get(`${setsUrl()}/${set.id}/links`);
    const states = Object.fromEntries((list.body.items as { id: string; state: string }[]).map((l) => [l.id, l.state]));
    expect(states).toEqual({ [revoked.id]: 'revoked', [expired.id]: 'expired', [valid.id]: 'active' });
    // The valid link still works, and a token of another set opens that set only.
    expect((await t.anon().get(`/api/v1/shared/${valid.token}`)).body.title).toBe('Burner feed');
    expect((await t.anon().get(`/api/v1/shared/${otherLink.token}`)).body.title).toBe('Another set');
  });

  it('stops working when its set is deleted', async () => {
    const set = await makeSet();
    const link = await makeLink(set.id);
    expect((await member.delete(`${setsUrl()}/${set.id}`)).status).toBe(204);
    await notFoundBody(`/api/v1/shared/${link.token}`);
  });

  it('opens no write route: a share token is no credential anywhere', async () => {
    const set = await makeSet();
    const link = await makeLink(set.id);
    const anon = t.anon();
    const bearer = { Authorization: `Bearer ${link.token}` };
    const setUrl = `${setsUrl()}/${set.id}`;
    const attempts = [
      anon.put(setUrl).set(bearer).send({ version: 1, title: 'Changed' }),
      anon.delete(setUrl).set(bearer),
      anon.post(setsUrl()).set(bearer).send({ title: 'x' }),
      anon.post(`${setUrl}/links`).set(bearer).send({}),
      anon.post(`${setUrl}/versions/1/restore`).set(bearer).send({ version: 1 }),
      anon.post(`${setUrl}/move-to-latest`).set(bearer).send({ version: 1 }),
      anon.get(setUrl).set(bearer),
      anon.get(setsUrl()).set(bearer),
    ];
    for (const res of await Promise.all(attempts)) expect(res.status).toBe(401);
    // Without the header the same routes want a sign-in.
    expect((await t.anon().put(setUrl).send({ version: 1, title: 'Changed' })).status).toBe(401);
    // Write methods on the share path do not exist.
    for (const method of ['put', 'post', 'delete', 'patch'] as const) {
      const res = await t.anon()[method](`/api/v1/shared/${link.token}`).send({ title: 'Changed' });
      expect([404, 405]).toContain(res.status);
    }
    // Copying needs a sign-in.
    expect(
      (await t.anon().post(`/api/v1/shared/${link.token}/copy`).send({ teamId: t.ids.teams.kestrel })).status,
    ).toBe(401);
    const after = await member.get(setUrl);
    expect(after.body).toMatchObject({ title: 'Burner feed', version: 1 });
  });

  it('is rate-limited with the calculation endpoints', async () => {
    const limited = await startTestApp({
      open: { ...t.open, close: async () => {} },
      config: { calc: { requestsPerMinute: 3 } },
    });
    try {
      const set = await makeSet();
      const link = await makeLink(set.id);
      const statuses: number[] = [];
      for (let i = 0; i < 5; i++) statuses.push((await limited.anon().get(`/api/v1/shared/${link.token}`)).status);
      expect(statuses.slice(0, 3)).toEqual([200, 200, 200]);
      expect(statuses.slice(3)).toEqual([429, 429]);
    } finally {
      await limited.close();
    }
  });
});

describe('POST /api/v1/shared/:token/copy', () => {
  it("copies the set into the caller's own team, pinned to the revision the link shows", async () => {
    const set = await makeSet();
    const link = await makeLink(set.id);
    const outsider = await t.signIn('other_team');
    const res = await outsider.post(`/api/v1/shared/${link.token}/copy`).send({ teamId: t.ids.teams.larchmont });
    expect(res.status).toBe(201);
    expect(res.body.teamId).toBe(t.ids.teams.larchmont);
    expect(res.body.version).toBe(1);
    const shared = await t.anon().get(`/api/v1/shared/${link.token}`);
    expect(res.body.revision).toBe(shared.body.evaluation.libraryRevision);
    expect(res.body.items).toEqual(shared.body.items);
  });

  it('refuses a team where the caller is not a member or above', async () => {
    const set = await makeSet();
    const link = await makeLink(set.id);
    const viewer = await t.signIn('viewer');
    const asViewer = await viewer.post(`/api/v1/shared/${link.token}/copy`).send({ teamId: t.ids.teams.kestrel });
    expect(asViewer.status).toBe(403);
    const outsider = await t.signIn('other_team');
    const foreign = await outsider.post(`/api/v1/shared/${link.token}/copy`).send({ teamId: t.ids.teams.kestrel });
    expect(foreign.status).toBe(403);
  });

  it('is 404 for a revoked link', async () => {
    const set = await makeSet();
    const link = await makeLink(set.id);
    await member.delete(`${setsUrl()}/${set.id}/links/${link.id}`).expect(204);
    const res = await member.post(`/api/v1/shared/${link.token}/copy`).send({ teamId: t.ids.teams.kestrel });
    expect(res.status).toBe(404);
  });
});
