// Accepting an amendment of 1,000 entries (each a new ΔfH° of a different species from the
// amendment's own new source): the whole accept request over HTTP, on in-memory PGlite — plan
// against the current snapshot, conflict check, one transaction writing every value, the new
// revision and the amendment's history. Each iteration accepts a different amendment prepared
// beforehand (an accepted amendment cannot be accepted twice), so iterations are few and fixed.
import { afterAll, bench, describe } from 'vitest';
import { openTestDatabase, startTestApp } from '../server/helpers';
import { currentRevision } from '../../server/library/revisions';
import { seedLibrary } from '../../server/library/seed-library';

const ENTRIES = 1_000;
const ITERATIONS = 4;

const open = await openTestDatabase();
// Outside the test run's global set-up the database starts empty: seed the library as start-up does.
if ((await currentRevision(open.db)) === null) await seedLibrary(open.db);
const t = await startTestApp({ open, config: { calc: { requestsPerMinute: 10_000_000, linesPerMinute: 10_000_000 } } });
afterAll(async () => t.close());

const member = await t.signIn('member');
const curator = await t.signIn('curator');

// Species with a non-zero selected ΔfH° (a reference state's is 0 by definition and cannot be revised).
const species: { id: string; value: number }[] = [];
for (let offset = 0; species.length < ENTRIES; offset += 200) {
  const page = await t.anon().get('/api/v1/species').query({ limit: 200, offset });
  const items = page.body.items as { id: string; deltaFH: { value: number } | null }[];
  if (items.length === 0) throw new Error(`the library has fewer than ${ENTRIES} species with a ΔfH°`);
  for (const item of items)
    if (item.deltaFH && item.deltaFH.value !== 0 && species.length < ENTRIES)
      species.push({ id: item.id, value: item.deltaFH.value });
}

const prepared: string[] = [];
for (let k = 0; k < ITERATIONS; k++) {
  const entries = species.map(({ id, value }) => ({
    kind: 'revise-value',
    species: id,
    // Near the selected value: a revision as a new data set would propose it.
    deltaFH: { value: Math.round((value + 0.1 + k / 100) * 1000) / 1000, uncertainty: 0.5 },
    source: { citation: `Benchmark data set ${k}, invented for the accept benchmark`, key: `bench-accept-${k}` },
    provenance: 'entered',
    select: false,
  }));
  const created = await member
    .post('/api/v1/amendments')
    .send({ title: `Benchmark ${k}`, rationale: 'Benchmark.', entries });
  if (created.status !== 201)
    throw new Error(`create: ${created.status} ${JSON.stringify(created.body).slice(0, 500)}`);
  await member.post(`/api/v1/amendments/${created.body.id}/open`).send({});
  prepared.push(created.body.id as string);
}

describe('amendments', () => {
  bench(
    `POST /api/v1/amendments/:id/accept (${ENTRIES} entries)`,
    async () => {
      const id = prepared.shift();
      if (!id) throw new Error('no prepared amendment left');
      const res = await curator.post(`/api/v1/amendments/${id}/accept`).send({});
      if (res.status !== 200) throw new Error(`accept: ${res.status} ${JSON.stringify(res.body).slice(0, 500)}`);
    },
    { iterations: ITERATIONS, time: 0, warmupIterations: 0, warmupTime: 0 },
  );
});
