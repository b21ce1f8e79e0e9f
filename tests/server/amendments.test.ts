import { sql } from 'drizzle-orm';
import type TestAgent from 'supertest/lib/agent';
import { afterAll, beforeAll, describe, expect, it, vi } from 'vitest';
import { startTestApp, type TestApp } from './helpers';
import { acceptEntries, proposeOpen } from './amendment-helpers';

// Every test drives several requests (acceptances plan and write whole revisions): room for a loaded machine.
vi.setConfig({ testTimeout: 120_000 });

let t: TestApp;
let member: TestAgent;
let curator: TestAgent;
/** The site admin, made a curator too: the second reviewer, and a site admin bound by four eyes. */
let adminCurator: TestAgent;
let viewer: TestAgent;

beforeAll(async () => {
  t = await startTestApp();
  await t.db.execute(sql`update users set site_roles = '{site_admin,curator}' where id = ${t.ids.users.site_admin}`);
  [member, curator, adminCurator, viewer] = await Promise.all([
    t.signIn('member'),
    t.signIn('curator'),
    t.signIn('site_admin'),
    t.signIn('viewer'),
  ]);
}, 180_000);
afterAll(async () => t?.close());

let counter = 0;
/** A revise-value entry of ΔfH°(species) from a fresh test source (not selected, so amendments do not collide). */
function freshValue(species = 'CO2(g)', value = -393.4) {
  counter++;
  return {
    kind: 'revise-value',
    species,
    deltaFH: { value, uncertainty: 0.2 },
    source: {
      citation: `A. Tester, J. Test Thermochem. ${counter} (2026) 1.`,
      key: `test-${Date.now().toString(36)}-${counter}`,
    },
    provenance: 'entered',
    select: false,
  };
}

async function currentRevision(): Promise<number> {
  const res = await t.anon().get('/api/v1/library/revisions');
  return res.body.current as number;
}

async function selectedDfH(key: string, revision?: number): Promise<number> {
  const list = await t
    .anon()
    .get('/api/v1/species')
    .query({ q: key, limit: 50, ...(revision ? { revision } : {}) });
  return (list.body.items as { key: string; deltaFH: { value: number } }[]).find((i) => i.key === key)!.deltaFH.value;
}

describe('POST /api/v1/amendments', () => {
  it('creates a draft on the current revision with its diff, seen by its author only', async () => {
    const base = await currentRevision();
    const res = await member.post('/api/v1/amendments').send({
      title: 'Revise ΔfH° of CO2(g)',
      rationale: 'A newer measurement.',
      entries: [
        {
          kind: 'revise-value',
          species: 'CO2(g)',
          deltaFH: { value: -393.47, uncertainty: 0.05 },
          source: { citation: 'B. Example, J. Invented Data 12 (2026) 34.' },
        },
      ],
    });
    expect(res.status).toBe(201);
    expect(res.body).toMatchObject({ state: 'draft', baseRevision: base, entryCount: 1 });
    expect(res.body.diff[0]).toMatchObject({
      kind: 'revise-value',
      target: { speciesKey: 'CO2(g)', property: 'dfH298' },
      new: { value: -393.47, uncertainty: 0.05 },
    });
    // The new citation becomes a new source; the selection moves to it.
    expect(res.body.diff[0].selection.to.value).toBe(-393.47);
    expect(res.body.sources.some((s: { isNew: boolean }) => s.isNew)).toBe(true);
    expect((await curator.get(`/api/v1/amendments/${res.body.id}`)).status).toBe(404);
    expect((await member.get(`/api/v1/amendments/${res.body.id}`)).status).toBe(200);
    expect(await currentRevision()).toBe(base);
  });

  it('refuses a viewer (403) and anonymous callers (401)', async () => {
    const body = { title: 'Not allowed', rationale: 'x', entries: [freshValue()] };
    expect((await viewer.post('/api/v1/amendments').send(body)).status).toBe(403);
    expect((await t.anon().post('/api/v1/amendments').send(body)).status).toBe(401);
  });

  it('names the entry and field of a species that is not in the library (400), saving nothing', async () => {
    const res = await member
      .post('/api/v1/amendments')
      .send({ title: 'Unknown species', rationale: 'x', entries: [freshValue(), freshValue('Xe9Q2(g)')] });
    expect(res.status).toBe(400);
    expect(res.body.error.details.issues[0].path.slice(0, 3)).toEqual(['body', 'entries', 1]);
  });
});

describe('the review flow', () => {
  it('opens, lists by state, comments, returns, reopens and accepts into one new revision', async () => {
    const before = await currentRevision();
    const created = await member
      .post('/api/v1/amendments')
      .send({ title: 'Flow test', rationale: 'Checking the flow.', entries: [freshValue('H2O(l)', -285.9)] });
    const id = created.body.id as string;
    const opened = await member.post(`/api/v1/amendments/${id}/open`).send({});
    expect(opened.status).toBe(200);
    expect(opened.body.state).toBe('open');

    const queue = await curator.get('/api/v1/amendments').query({ state: 'open' });
    expect(queue.status).toBe(200);
    expect(queue.body.total).toBeGreaterThanOrEqual(1);
    expect(queue.body.items.map((i: { id: string }) => i.id)).toContain(id);
    expect(queue.body.items.every((i: { state: string }) => i.state === 'open')).toBe(true);

    const comment = await curator.post(`/api/v1/amendments/${id}/comments`).send({ body: 'Which table is it from?' });
    expect(comment.status).toBe(201);
    const returned = await curator.post(`/api/v1/amendments/${id}/return`).send({ reason: 'Name the table, please.' });
    expect(returned.body.state).toBe('returned');
    const edited = await member.put(`/api/v1/amendments/${id}`).send({
      title: 'Flow test',
      rationale: 'Checking the flow (table 3).',
      entries: [{ ...freshValue('H2O(l)', -285.9), table: 'Table 3' }],
    });
    expect(edited.status).toBe(200);
    expect((await member.post(`/api/v1/amendments/${id}/open`).send({})).body.state).toBe('open');

    const detail = await curator.get(`/api/v1/amendments/${id}`);
    expect(detail.body.comments).toHaveLength(1);
    expect(detail.body.history.map((h: { action: string }) => h.action)).toEqual([
      'create',
      'open',
      'return',
      'edit',
      'open',
    ]);
    expect(detail.body.impact).not.toBeNull();
    expect(detail.body.allowed).toMatchObject({ accept: true, return: true, decline: true, edit: false });

    const accepted = await curator.post(`/api/v1/amendments/${id}/accept`).send({});
    expect(accepted.status).toBe(200);
    expect(accepted.body).toMatchObject({ state: 'accepted', resultRevision: before + 1 });

    const revisions = await t.anon().get('/api/v1/library/revisions');
    expect(revisions.body.current).toBe(before + 1);
    expect(revisions.body.items[0]).toMatchObject({
      number: before + 1,
      amendmentId: id,
      acceptedBy: 'Cora Curator',
      summary: 'Flow test',
    });
    expect(Date.parse(revisions.body.items[0].acceptedAt)).not.toBeNaN();
  });

  it('answers an illegal transition with 409 naming the current state', async () => {
    const id = await proposeOpen(t, [freshValue()], { author: member });
    expect((await member.post(`/api/v1/amendments/${id}/open`).send({})).status).toBe(409);
    const declined = await curator.post(`/api/v1/amendments/${id}/decline`).send({ reason: 'Not needed.' });
    expect(declined.body.state).toBe('declined');
    for (const action of ['accept', 'return', 'decline']) {
      const res = await curator.post(`/api/v1/amendments/${id}/${action}`).send({ reason: 'Again.' });
      expect(res.status).toBe(409);
      expect(res.body.error.details.state).toBe('declined');
      expect(res.body.error.message).toContain('declined');
    }
    const withdraw = await member.post(`/api/v1/amendments/${id}/withdraw`).send({});
    expect(withdraw.status).toBe(409);
    expect(withdraw.body.error.details.state).toBe('declined');
  });

  it('lets the author withdraw, and nobody else', async () => {
    const id = await proposeOpen(t, [freshValue()], { author: member });
    expect((await curator.post(`/api/v1/amendments/${id}/withdraw`).send({})).status).toBe(403);
    const res = await member.post(`/api/v1/amendments/${id}/withdraw`).send({});
    expect(res.body.state).toBe('withdrawn');
  });
});

describe('four-eyes rule', () => {
  it('keeps a curator and a site admin from accepting or declining their own amendment', async () => {
    for (const [author, other] of [
      [curator, adminCurator],
      [adminCurator, curator],
    ] as const) {
      const before = await currentRevision();
      const id = await proposeOpen(t, [freshValue()], { author });
      for (const action of ['accept', 'decline', 'return']) {
        const res = await author.post(`/api/v1/amendments/${id}/${action}`).send({ reason: 'My own.' });
        expect(res.status).toBe(403);
        expect(res.body.error.details).toMatchObject({ rule: 'four-eyes' });
      }
      expect(await currentRevision()).toBe(before);
      expect((await other.post(`/api/v1/amendments/${id}/accept`).send({})).status).toBe(200);
    }
  });
});

describe('concurrency', () => {
  it('lets exactly one of two curators accepting conflicting amendments win, over many racing pairs; the loser rebases', async () => {
    const pairs = 6;
    for (let i = 0; i < pairs; i++) {
      const before = await currentRevision();
      // Both revise the same value (ΔfH° of CO(g) from codata-1989), to different numbers.
      const entry = (value: number) => ({
        kind: 'revise-value',
        species: 'CO(g)',
        deltaFH: { value, uncertainty: 0.2 },
        source: { key: 'codata-1989' },
        provenance: 'entered',
      });
      const a = await proposeOpen(t, [entry(-110.4 - i / 100)], { author: member, title: `Race ${i} A` });
      const b = await proposeOpen(t, [entry(-110.6 - i / 100)], { author: member, title: `Race ${i} B` });
      const [ra, rb] = await Promise.all([
        curator.post(`/api/v1/amendments/${a}/accept`).send({}),
        adminCurator.post(`/api/v1/amendments/${b}/accept`).send({}),
      ]);
      const statuses = [ra.status, rb.status].sort();
      expect(statuses).toEqual([200, 409]);
      const loser = ra.status === 409 ? ra : rb;
      expect(loser.body.error.details).toMatchObject({ reason: 'stale_base', state: 'open' });
      expect(loser.body.error.details.rebase).toMatch(/\/api\/v1\/amendments\/.+\/rebase$/);
      expect(await currentRevision()).toBe(before + 1);
      if (i === pairs - 1) {
        const loserId = loser === ra ? a : b;
        const rebased = await member.post(`/api/v1/amendments/${loserId}/rebase`).send({});
        expect(rebased.status).toBe(200);
        expect(rebased.body.baseRevision).toBe(before + 1);
        // The diff is recomputed against the winner's value.
        const winnerValue = (loser === ra ? rb : ra).body.diff[0].new.value;
        expect(rebased.body.diff[0].old.value).toBe(winnerValue);
        const reviewer = loser === ra ? curator : adminCurator;
        expect((await reviewer.post(`/api/v1/amendments/${loserId}/accept`).send({})).status).toBe(200);
        expect(await currentRevision()).toBe(before + 2);
      }
    }
  }, 240_000);
});

describe('atomicity', () => {
  it('leaves library and revision unchanged when the last entry no longer applies (409 naming it)', async () => {
    // The last entry marks a value checked; another amendment deprecates that value first.
    const species = await t.anon().get('/api/v1/species').query({ q: 'CH4(g)', limit: 50 });
    const ch4 = (species.body.items as { id: string; key: string }[]).find((s) => s.key === 'CH4(g)')!;
    const detail = await t.anon().get(`/api/v1/species/${ch4.id}`);
    const values = (detail.body.values as { id: string; property: string; selected: boolean }[]).filter(
      (v) => v.property === 'dfH298' && !v.selected,
    );
    expect(values.length).toBeGreaterThan(0);
    const target = values[0]!.id;
    const id = await proposeOpen(
      t,
      [freshValue('CH4(g)', -74.8), { kind: 'mark-checked', target: 'value', id: target }],
      {
        author: member,
      },
    );
    await acceptEntries(t, [{ kind: 'deprecate', target: 'value', id: target, reason: 'Superseded (test).' }]);
    const before = await currentRevision();
    const ch4Before = await selectedDfH('CH4(g)');
    const res = await curator.post(`/api/v1/amendments/${id}/accept`).send({});
    expect(res.status).toBe(409);
    expect(JSON.stringify(res.body.error)).toContain('entries.1');
    expect(await currentRevision()).toBe(before);
    expect(await selectedDfH('CH4(g)')).toBe(ch4Before);
    expect((await curator.get(`/api/v1/amendments/${id}`)).body.state).toBe('open');
  });

  it('rolls back every entry when the database refuses the last one', async () => {
    // A trigger made for this test refuses one value, as a failing disk or constraint would.
    await t.db.execute(
      sql.raw(`create or replace function tl_test_refuse() returns trigger language plpgsql as $$
        begin if new.value = -4321.5 then raise exception 'refused by the test trigger'; end if; return new; end $$`),
    );
    await t.db.execute(
      sql.raw(
        'create trigger tl_test_refuse before insert or update on library_values for each row execute function tl_test_refuse()',
      ),
    );
    try {
      const before = await currentRevision();
      const co2 = await selectedDfH('CO2(g)');
      const id = await proposeOpen(
        t,
        [{ ...freshValue('CO2(g)', -393.3), select: true }, freshValue('CH4(g)', -74.7), freshValue('H2O(g)', -4321.5)],
        { author: member },
      );
      const res = await curator.post(`/api/v1/amendments/${id}/accept`).send({});
      expect(res.status).toBe(500);
      expect(await currentRevision()).toBe(before);
      expect(await selectedDfH('CO2(g)')).toBe(co2);
      // (impact=false: the impact's dry run writes the same rows, and the trigger refuses it too.)
      expect((await curator.get(`/api/v1/amendments/${id}`).query({ impact: 'false' })).body.state).toBe('open');
    } finally {
      await t.db.execute(sql.raw('drop trigger tl_test_refuse on library_values'));
    }
  });
});

describe('impact', () => {
  it('shows old → new ΔrH° of the demo scenario reactions that use a revised species', async () => {
    // Raising the selected ΔfH°(H2O, l) by 1 kJ/mol raises ΔrH° of the nitrobenzene hydrogenation
    // (2 H2O(l) among the products) by 2 kJ/mol: Hess's law, ΔrH° = Σν ΔfH°(products) − Σν ΔfH°(reactants).
    const water = await selectedDfH('H2O(l)');
    const id = await proposeOpen(
      t,
      [
        {
          kind: 'revise-value',
          species: 'H2O(l)',
          deltaFH: { value: water + 1, uncertainty: 0.1 },
          source: { citation: 'Impact test source (invented).', key: 'impact-test' },
        },
      ],
      { author: member },
    );
    const detail = await curator.get(`/api/v1/amendments/${id}`);
    expect(detail.status).toBe(200);
    const nitro = (
      detail.body.impact.reactions as { id: string; old: { value: number }; new: { value: number }; change: number }[]
    ).find((r) => r.id === 'kestrel-nitro-hydrogenation');
    expect(nitro).toBeDefined();
    expect(nitro!.change).toBeCloseTo(2, 6);
    expect(nitro!.new.value - nitro!.old.value).toBeCloseTo(2, 6);
    await member.post(`/api/v1/amendments/${id}/withdraw`).send({});
  });
});

describe('team-value entries', () => {
  it("proposes a team's derived value with a new species, and the accepted value keeps its derivation", async () => {
    // Invented combustion result for benzyl acetate (a test figure, not a measurement).
    const saved = await member.post(`/api/v1/teams/${t.ids.teams.kestrel}/derived-values`).send({
      derivation: {
        target: '9 C(s) + 5 H2(g) + O2(g) -> C9H10O2(l)',
        reactions: [
          { equation: 'C9H10O2(l) + 21/2 O2(g) -> 9 CO2(g) + 5 H2O(l)', deltaH: { value: -4657.0, uncertainty: 1.5 } },
        ],
      },
      note: 'from our combustion run',
    });
    expect(saved.status).toBe(201);
    const entries = [
      { kind: 'set-species', key: 'C9H10O2(l)', name: 'benzyl acetate' },
      { kind: 'team-value', teamId: t.ids.teams.kestrel, derivedValueId: saved.body.id },
    ];
    // Only members of the team may propose its values.
    const stranger = await t.signIn('other_team');
    const refused = await stranger.post('/api/v1/amendments').send({ title: 'Not my team', rationale: 'x', entries });
    expect(refused.status).toBe(400);
    expect(refused.body.error.details.issues[0].path).toEqual(['body', 'entries', 1, 'derivedValueId']);

    const { revision } = await acceptEntries(t, entries, 'Benzyl acetate from our combustion run');
    const found = await t.anon().get('/api/v1/species').query({ q: 'benzyl acetate', limit: 10 });
    const species = (found.body.items as { id: string; key: string; deltaFH: { value: number } | null }[]).find(
      (s) => s.key === 'C9H10O2(l)',
    )!;
    expect(species.deltaFH!.value).toBeCloseTo(saved.body.deltaFH.value, 9);
    const detail = await t.anon().get(`/api/v1/species/${species.id}`);
    const value = (detail.body.values as { provenance: string; selected: boolean }[]).find((v) => v.selected)!;
    expect(value.provenance).toBe('derived');
    expect((await t.anon().get('/api/v1/library/revisions')).body.current).toBe(revision);
  });
});

describe('reverting', () => {
  it('proposes a pre-filled draft that restores the earlier values, applied only when accepted', async () => {
    const original = await selectedDfH('NH3(g)');
    const { id, revision } = await acceptEntries(t, [
      {
        kind: 'revise-value',
        species: 'NH3(g)',
        deltaFH: { value: -45.5, uncertainty: 0.4 },
        source: { key: 'codata-1989' },
      },
    ]);
    expect(await selectedDfH('NH3(g)')).toBe(-45.5);
    const revert = await member.post(`/api/v1/amendments/${id}/revert`).send({});
    expect(revert.status).toBe(201);
    expect(revert.body).toMatchObject({ state: 'draft', revertOf: id, baseRevision: revision });
    expect(revert.body.entries.length).toBeGreaterThan(0);
    expect(await selectedDfH('NH3(g)')).toBe(-45.5);
    await member.post(`/api/v1/amendments/${revert.body.id}/open`).send({});
    expect((await curator.post(`/api/v1/amendments/${revert.body.id}/accept`).send({})).status).toBe(200);
    expect(await selectedDfH('NH3(g)')).toBe(original);
    // The earlier revision still reads the value it had.
    expect(await selectedDfH('NH3(g)', revision)).toBe(-45.5);
  });
});
