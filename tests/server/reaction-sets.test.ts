import { afterAll, beforeAll, beforeEach, describe, expect, it } from 'vitest';
import type TestAgent from 'supertest/lib/agent';
import { seedLibrary } from '../../server/library/seed-library';
import { startTestApp, type TestApp } from './helpers';

let t: TestApp;
let member: TestAgent;
beforeAll(async () => {
  t = await startTestApp();
  await seedLibrary(t.db);
});
afterAll(() => t?.close());
beforeEach(async () => {
  await t.reset();
  member = await t.signIn('member');
});

const setsUrl = () => `/api/v1/teams/${t.ids.teams.kestrel}/sets`;

async function createSet(body: Record<string, unknown> = {}) {
  const res = await member.post(setsUrl()).send({ title: 'Propane burner', ...body });
  expect(res.status).toBe(201);
  return res.body as { id: string; version: number; items: { id: string }[]; revision: number | 'latest' };
}

describe('POST /api/v1/teams/:teamId/sets', () => {
  it('creates version 1, pinned to the newest revision, with an id for every item', async () => {
    const revisions = await t.anon().get('/api/v1/library/revisions');
    const set = await createSet({
      description: 'Heat of the burner feed',
      tags: ['burner', 'screening'],
      items: [
        { kind: 'reaction', equation: 'C3H8(g) + 5 O2(g) -> 3 CO2(g) + 4 H2O(l)' },
        { kind: 'note', id: 'my-note', text: 'Check the feed rate.' },
      ],
    });
    expect(set.version).toBe(1);
    expect(set.revision).toBe(revisions.body.current);
    expect(set.items).toHaveLength(2);
    expect(set.items[0]!.id).toMatch(/^[0-9a-f-]{36}$/);
    expect(set.items[1]!.id).toBe('my-note');
  });

  it('follows the newest revision when asked for "latest"', async () => {
    const set = await createSet({ revision: 'latest' });
    expect(set.revision).toBe('latest');
  });

  it('refuses bad input naming the field, and saves nothing', async () => {
    const res = await member.post(setsUrl()).send({
      title: 'x',
      items: [{ kind: 'reaction', equation: '' }, { kind: 'teleport' }],
    });
    expect(res.status).toBe(400);
    const paths = (res.body.error.details.issues as { path: (string | number)[] }[]).map((i) => i.path.join('.'));
    expect(paths).toContain('body.items.0.equation');
    expect(paths.some((p) => p.startsWith('body.items.1'))).toBe(true);
    const list = await member.get(setsUrl());
    expect(list.body.total).toBe(0);
  });

  it('refuses a revision the library does not have', async () => {
    const res = await member.post(setsUrl()).send({ title: 'x', revision: 999 });
    expect(res.status).toBe(400);
    expect(res.body.error.details.issues[0].path).toEqual(['body', 'revision']);
  });

  it('refuses duplicate item ids and more derivations than the limit', async () => {
    const derivation = { kind: 'derivation', target: 'C(s) + 2 H2(g) -> CH4(g)' };
    const res = await member.post(setsUrl()).send({
      title: 'x',
      items: [
        { kind: 'note', id: 'a', text: '' },
        { kind: 'note', id: 'a', text: '' },
        ...Array.from({ length: 11 }, () => derivation),
      ],
    });
    expect(res.status).toBe(400);
    const messages = (res.body.error.details.issues as { message: string }[]).map((i) => i.message).join(' ');
    expect(messages).toContain('used twice');
    expect(messages).toContain('up to 10 derivations');
  });

  it('is not open to viewers', async () => {
    const viewer = await t.signIn('viewer');
    const res = await viewer.post(setsUrl()).send({ title: 'x' });
    expect(res.status).toBe(403);
  });
});

describe('GET /api/v1/teams/:teamId/sets', () => {
  it('searches, filters by tag and sorts by title, owner and updated', async () => {
    await createSet({ title: 'Bravo hydrogenation', tags: ['pilot'] });
    const admin = await t.signIn('team_admin');
    expect((await admin.post(setsUrl()).send({ title: 'Alpha esterification', tags: ['pilot', 'lab'] })).status).toBe(
      201,
    );
    await createSet({ title: 'Charlie quench', tags: ['lab'] });
    const byTitle = await member.get(setsUrl()).query({ sort: 'title' });
    expect(byTitle.body.items.map((s: { title: string }) => s.title)).toEqual([
      'Alpha esterification',
      'Bravo hydrogenation',
      'Charlie quench',
    ]);
    expect(byTitle.body.total).toBe(3);
    const pilot = await member.get(setsUrl()).query({ tag: 'pilot', sort: 'title' });
    expect(pilot.body.items.map((s: { title: string }) => s.title)).toEqual([
      'Alpha esterification',
      'Bravo hydrogenation',
    ]);
    const search = await member.get(setsUrl()).query({ q: 'QUENCH' });
    expect(search.body.items).toHaveLength(1);
    const byOwner = await member.get(setsUrl()).query({ sort: 'owner' });
    expect(byOwner.body.items[0].owner).toBe(byOwner.body.items.map((s: { owner: string }) => s.owner).sort()[0]);
    const updated = await member.get(setsUrl());
    expect(updated.body.items[0].title).toBe('Charlie quench');
    expect(updated.body.items[0].itemCount).toBe(0);
  });

  it("never lists another team's sets", async () => {
    await createSet();
    const other = await t.signIn('other_team');
    const res = await other.get(`/api/v1/teams/${t.ids.teams.larchmont}/sets`);
    expect(res.status).toBe(200);
    expect(res.body.total).toBe(0);
  });
});

describe('PUT /api/v1/teams/:teamId/sets/:setId', () => {
  it('saves an edit as the next version, and keeps fields left out', async () => {
    const set = await createSet({ tags: ['a'] });
    const res = await member.put(`${setsUrl()}/${set.id}`).send({ version: 1, title: 'Propane burner, revised' });
    expect(res.status).toBe(200);
    expect(res.body.version).toBe(2);
    expect(res.body.tags).toEqual(['a']);
    expect(res.body.title).toBe('Propane burner, revised');
  });

  it('refuses a stale version with 409 and the set as it is now', async () => {
    const set = await createSet();
    await member.put(`${setsUrl()}/${set.id}`).send({ version: 1, title: 'First edit' });
    const stale = await member.put(`${setsUrl()}/${set.id}`).send({ version: 1, title: 'Second edit' });
    expect(stale.status).toBe(409);
    expect(stale.body.error.code).toBe('conflict');
    expect(stale.body.error.details.currentVersion).toBe(2);
    expect(stale.body.error.details.current.title).toBe('First edit');
    const now = await member.get(`${setsUrl()}/${set.id}`);
    expect(now.body.title).toBe('First edit');
  });

  it('makes no new version for a save that changes nothing', async () => {
    const set = await createSet();
    const res = await member.put(`${setsUrl()}/${set.id}`).send({ version: 1, title: 'Propane burner' });
    expect(res.body.version).toBe(1);
  });

  it('lets exactly one of two racing saves of the same version win, 100 times over, and loses no edit', async () => {
    const set = await createSet();
    let version = 1;
    const winners: string[] = [];
    for (let round = 0; round < 100; round++) {
      const titles = [`round ${round} by A`, `round ${round} by B`];
      const replies = await Promise.all(
        titles.map((title) => member.put(`${setsUrl()}/${set.id}`).send({ version, title })),
      );
      const statuses = replies.map((r) => r.status).sort();
      expect(statuses).toEqual([200, 409]);
      const winner = replies.find((r) => r.status === 200)!;
      const loser = replies.find((r) => r.status === 409)!;
      expect(winner.body.version).toBe(version + 1);
      // The loser is told what won, so its edit can be shown and applied again, not lost.
      expect(loser.body.error.details.currentVersion).toBe(version + 1);
      expect(loser.body.error.details.current.title).toBe(winner.body.title);
      winners.push(winner.body.title);
      version += 1;
    }
    const history = await member.get(`${setsUrl()}/${set.id}/versions`);
    expect(history.body.total).toBe(101);
    // Every winning edit is in the history, in order.
    const checks = await Promise.all(
      [2, 50, 101].map((v) => member.get(`${setsUrl()}/${set.id}/versions/${v}`).then((r) => r.body.state.title)),
    );
    expect(checks).toEqual([winners[0], winners[48], winners[99]]);
  }, 120_000);

  it("is 404 for another team's set", async () => {
    const set = await createSet();
    const other = await t.signIn('other_team');
    const res = await other
      .put(`/api/v1/teams/${t.ids.teams.larchmont}/sets/${set.id}`)
      .send({ version: 1, title: 'x' });
    expect(res.status).toBe(404);
  });
});

describe('versions, diff and restore', () => {
  it('lists who and when, diffs two versions item by item, and restores as a new version', async () => {
    const set = await createSet({
      items: [
        { kind: 'reaction', id: 'r1', equation: 'C(s) + O2(g) -> CO2(g)' },
        { kind: 'note', id: 'n1', text: 'first' },
      ],
    });
    const edit = await member.put(`${setsUrl()}/${set.id}`).send({
      version: 1,
      tags: ['new'],
      items: [
        { kind: 'reaction', id: 'r1', equation: 'C(s) + O2(g) -> CO2(g)', temperature: { value: 350, unit: 'K' } },
        { kind: 'given-reaction', id: 'g1', equation: 'A(g) -> B(g)', deltaH: { value: -12, unit: 'kJ/mol' } },
      ],
    });
    expect(edit.status).toBe(200);
    const versions = await member.get(`${setsUrl()}/${set.id}/versions`);
    expect(versions.body.items.map((v: { version: number }) => v.version)).toEqual([2, 1]);
    expect(versions.body.items[0].by).toBe('Milo Member');
    expect(versions.body.items[0].summary).toBe('Tags changed; items 1 added, 1 changed, 1 removed');
    const diff = await member.get(`${setsUrl()}/${set.id}/diff`).query({ from: 1, to: 2 });
    expect(diff.status).toBe(200);
    expect(diff.body.fields).toEqual([{ field: 'tags', before: [], after: ['new'] }]);
    const changes = Object.fromEntries(
      (diff.body.items as { id: string; change: string; fields: string[] }[]).map((i) => [i.id, i]),
    );
    expect(changes.r1).toMatchObject({ change: 'changed', fields: ['temperature'] });
    expect(changes.g1).toMatchObject({ change: 'added' });
    expect(changes.n1).toMatchObject({ change: 'removed' });

    const restored = await member.post(`${setsUrl()}/${set.id}/versions/1/restore`).send({ version: 2 });
    expect(restored.status).toBe(200);
    expect(restored.body.version).toBe(3);
    expect(restored.body.tags).toEqual([]);
    expect(restored.body.items.map((i: { id: string }) => i.id)).toEqual(['r1', 'n1']);
    const after = await member.get(`${setsUrl()}/${set.id}/versions`);
    expect(after.body.items[0].summary).toBe('Restored version 1');
    const stale = await member.post(`${setsUrl()}/${set.id}/versions/1/restore`).send({ version: 2 });
    expect(stale.status).toBe(409);
  });

  it('is 404 for a version that does not exist', async () => {
    const set = await createSet();
    expect((await member.get(`${setsUrl()}/${set.id}/versions/7`)).status).toBe(404);
    expect((await member.get(`${setsUrl()}/${set.id}/diff`).query({ from: 1, to: 7 })).status).toBe(404);
  });
});

describe('GET /api/v1/teams/:teamId/sets/:setId/results', () => {
  it('evaluates every kind of item at the set revision, and names the problem of an item it cannot evaluate', async () => {
    const set = await createSet({
      items: [
        { kind: 'reaction', id: 'r', equation: 'C(s) + O2(g) -> CO2(g)' },
        { kind: 'reaction', id: 'hot', equation: 'C(s) + O2(g) -> CO2(g)', temperature: { value: 500, unit: 'K' } },
        {
          kind: 'given-reaction',
          id: 'g',
          equation: 'H2(g) + 1/2 O2(g) -> H2O(l)',
          deltaH: { value: -68.3, uncertainty: 0.01, unit: 'kcal/mol' },
          source: 'lab notebook 12, p. 4',
        },
        { kind: 'derivation', id: 'd', target: 'C(s) + 2 H2(g) -> CH4(g)' },
        {
          kind: 'quantities',
          id: 'q',
          equation: 'CH4(g) + 2 O2(g) -> CO2(g) + 2 H2O(l)',
          amounts: [{ term: 0, value: 16.043, unit: 'g' }],
          batch: { mass: { value: 1, unit: 'kg' }, cp: { value: 4.18, unit: 'J/(g K)' } },
        },
        { kind: 'reaction', id: 'bad', equation: 'Xq2(g) -> Xq(g)' },
        { kind: 'note', id: 'n', text: 'remember' },
        {
          kind: 'calorimetry-run',
          id: 'cal',
          label: 'Run 7',
          runKind: 'bomb',
          inputs: {
            sample: { formula: 'C10H8', phase: 'cr' },
            energyEquivalent: { value: 10.17, unit: 'kJ/K' },
            runs: [{ mass: { value: 1.435, unit: 'g' }, temperature: { rise: { value: 5.67, unit: 'K' } } }],
          },
          // A result sent with the item is dropped: the server reduces the inputs itself.
          result: { deltaCH: { value: 1, uncertainty: 0, unit: 'kJ/mol' } },
        },
      ],
    });
    const res = await member.get(`${setsUrl()}/${set.id}/results`);
    expect(res.status).toBe(200);
    const byId = Object.fromEntries(
      (res.body.results as { itemId: string; value: Record<string, unknown>; error: unknown }[]).map((r) => [
        r.itemId,
        r,
      ]),
    );
    // CODATA Key Values 1989: ΔfH°(CO2, g) = −393.51 ± 0.13 kJ/mol (from memory).
    expect((byId.r!.value.deltaH as { value: number }).value).toBeCloseTo(-393.51, 2);
    expect(byId.hot!.value.temperature).toBe(500);
    // 1 kcal = 4.184 kJ exactly (thermochemical calorie): −68.3 kcal/mol = −285.7672 kJ/mol.
    expect((byId.g!.value.given as { value: number }).value).toBeCloseTo(-285.7672, 4);
    // CODATA 1989: ΔfH°(H2O, l) = −285.830 ± 0.040 kJ/mol (from memory).
    expect((byId.g!.value.library as { value: number }).value).toBeCloseTo(-285.83, 2);
    // ΔfH°(CH4, g) = −74.87 kJ/mol (NIST-JANAF / CODATA-consistent, from memory): within 0.3 kJ/mol.
    expect(Math.abs((byId.d!.value.deltaH as { value: number }).value - -74.87)).toBeLessThan(0.3);
    // One mole of methane burnt to liquid water releases about 890 kJ (ΔcH° = −890.3 kJ/mol, from memory).
    expect((byId.q!.value.heat as { value: number }).value).toBeCloseTo(-890.3, 0);
    expect(byId.q!.value.direction).toBe('released');
    expect(byId.bad!.error).toMatchObject({ code: expect.any(String), message: expect.stringContaining('Xq') });
    expect(byId.n!.value).toBeNull();
    // 1.435 g of naphthalene raise a 10.17 kJ/°C bomb by 5.67 °C: ΔcU = −5.15 × 10³ kJ/mol (Chang, from memory).
    expect((byId.cal!.value.result as { deltaCU: { value: number } }).deltaCU.value / 1000).toBeCloseTo(-5.15, 2);
    expect(res.body.sources.map((s: { key: string }) => s.key)).toContain('codata-1989');
    expect(res.body.cautions.join(' ')).toMatch(/screening/i);
    expect(res.body.cautions.join(' ')).toMatch(/qualified/i);
    // The calorimetry run is stored as its inputs, without the result it was sent with.
    const stored = await member.get(`${setsUrl()}/${set.id}`);
    const cal = stored.body.items.find((i: { id: string }) => i.id === 'cal');
    expect(cal).toMatchObject({ kind: 'calorimetry-run', id: 'cal', label: 'Run 7', runKind: 'bomb' });
    expect(cal).not.toHaveProperty('result');
  });
});

describe('DELETE /api/v1/teams/:teamId/sets/:setId', () => {
  it('deletes the set with its versions; viewers may not', async () => {
    const set = await createSet();
    const viewer = await t.signIn('viewer');
    expect((await viewer.delete(`${setsUrl()}/${set.id}`)).status).toBe(403);
    expect((await member.delete(`${setsUrl()}/${set.id}`)).status).toBe(204);
    expect((await member.get(`${setsUrl()}/${set.id}`)).status).toBe(404);
    expect((await member.get(`${setsUrl()}/${set.id}/versions`)).status).toBe(404);
  });
});
