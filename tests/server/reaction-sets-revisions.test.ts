import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { applyLibrarySet } from '../../server/library/apply-set';
import { withNewRevision } from '../../server/library/revisions';
import { readLibraryFolder } from '../../server/library/seed-library';
import { readLibrarySet } from '../../server/library/seed-set';
import { startTestApp, type TestApp } from './helpers';

/**
 * A set pinned to a library revision keeps its numbers when a later revision changes a value it
 * uses, and says what moving would change. The later revision is made here directly through the
 * library's own functions (as a curator's accepted change would make it): ΔfH°(CO2, g) moves from
 * the seeded −393.51 kJ/mol to an invented −390.00 kJ/mol.
 */

let t: TestApp;
beforeAll(async () => {
  t = await startTestApp();
});
afterAll(() => t?.close());

const PROPANE = 'C3H8(g) + 5 O2(g) -> 3 CO2(g) + 4 H2O(l)';
const CHANGED_CO2 = -390.0;

async function publishChangedCo2(): Promise<number> {
  const files = readLibraryFolder().map((f) =>
    f.name === 'values-codata.csv'
      ? { ...f, text: f.text.replace(/^CO2\(g\),dfH298,-393\.51,/m, `CO2(g),dfH298,${CHANGED_CO2.toFixed(2)},`) }
      : f,
  );
  expect(files.find((f) => f.name === 'values-codata.csv')!.text).toContain(`CO2(g),dfH298,${CHANGED_CO2.toFixed(2)},`);
  const { set, problems } = readLibrarySet(files);
  expect(problems).toEqual([]);
  const { number } = await withNewRevision(
    t.db,
    { kind: 'seed', summary: 'Test: a later revision with another ΔfH° of CO2(g)' },
    (tx, revision) => applyLibrarySet(tx, set, revision),
  );
  return number;
}

describe('a pinned set after a later library revision', () => {
  it('shows the same ΔH, reports the difference, and moves to the newest revision in one recorded step', async () => {
    const member = await t.signIn('member');
    const setsUrl = `/api/v1/teams/${t.ids.teams.kestrel}/sets`;
    const items = [
      { kind: 'reaction', id: 'propane', equation: PROPANE },
      { kind: 'note', id: 'n', text: 'unchanged by revisions' },
    ];
    const pinned = (await member.post(setsUrl).send({ title: 'Pinned', items })).body;
    const following = (await member.post(setsUrl).send({ title: 'Following', items, revision: 'latest' })).body;
    const pinnedRevision = pinned.revision as number;
    const link = (await member.post(`${setsUrl}/${pinned.id}/links`).send({})).body;

    const before = (await member.get(`${setsUrl}/${pinned.id}/results`)).body;
    const oldDeltaH = before.results[0].value.deltaH.value as number;
    // Propane burnt to liquid water: −2219.2 ± 0.5 kJ/mol (NIST Chemistry WebBook, propane ΔcH°gas; from memory).
    expect(oldDeltaH).toBeCloseTo(-2219.2, -1);

    const latest = await publishChangedCo2();
    expect(latest).toBe(pinnedRevision + 1);

    // The pinned set: the same number at its revision, and the newer one named.
    const after = (await member.get(`${setsUrl}/${pinned.id}/results`)).body;
    expect(after.libraryRevision).toBe(pinnedRevision);
    expect(after.latestRevision).toBe(latest);
    expect(after.results[0].value.deltaH.value).toBe(oldDeltaH);
    const shared = (await t.anon().get(`/api/v1/shared/${link.token}`)).body;
    expect(shared.evaluation.libraryRevision).toBe(pinnedRevision);
    expect(shared.evaluation.results[0].value.deltaH.value).toBe(oldDeltaH);

    // What moving would change: 3 mol CO2 per mole of reaction, each 3.51 kJ/mol less negative.
    const expectedShift = 3 * (CHANGED_CO2 - -393.51);
    const changes = (await member.get(`${setsUrl}/${pinned.id}/revision-changes`)).body;
    expect(changes).toMatchObject({ pinned: pinnedRevision, latest, changed: 1 });
    expect(changes.items).toHaveLength(1);
    expect(changes.items[0].itemId).toBe('propane');
    expect(changes.items[0].before.value).toBe(oldDeltaH);
    expect(changes.items[0].after.value).toBeCloseTo(oldDeltaH + expectedShift, 6);
    expect(changes.items[0].difference).toBeCloseTo(expectedShift, 6);

    // A set that follows the newest revision has the new value already.
    const followingResults = (await member.get(`${setsUrl}/${following.id}/results`)).body;
    expect(followingResults.libraryRevision).toBe(latest);
    expect(followingResults.results[0].value.deltaH.value).toBeCloseTo(oldDeltaH + expectedShift, 6);

    // Moving is a version of its own; a stale move is refused like a stale save.
    const renamed = await member
      .put(`${setsUrl}/${pinned.id}`)
      .send({ version: pinned.version, title: 'Pinned burner' });
    expect(renamed.status).toBe(200);
    const stale = await member.post(`${setsUrl}/${pinned.id}/move-to-latest`).send({ version: pinned.version });
    expect(stale.status).toBe(409);
    expect(stale.body.error.details.currentVersion).toBe(renamed.body.version);
    const moved = await member.post(`${setsUrl}/${pinned.id}/move-to-latest`).send({ version: renamed.body.version });
    expect(moved.status).toBe(200);
    expect(moved.body).toMatchObject({ version: renamed.body.version + 1, revision: latest });
    const versions = (await member.get(`${setsUrl}/${pinned.id}/versions`)).body;
    expect(versions.items[0].summary).toBe(`Moved from library revision ${pinnedRevision} to ${latest}`);
    const movedResults = (await member.get(`${setsUrl}/${pinned.id}/results`)).body;
    expect(movedResults.results[0].value.deltaH.value).toBeCloseTo(oldDeltaH + expectedShift, 6);
    const nothingLeft = (await member.get(`${setsUrl}/${pinned.id}/revision-changes`)).body;
    expect(nothingLeft.changed).toBe(0);
  });
});
