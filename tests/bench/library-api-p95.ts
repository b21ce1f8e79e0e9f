/**
 * The library endpoints over real HTTP on the seeded library (in-memory PGlite, the real app on
 * port 0, client and server in this one process): p50/p95/p99 of
 *
 *   - POST /api/v1/reaction-enthalpy, a 10-species gas-phase network at 1000 K (target p95 ≤ 5 ms)
 *     and at 298.15 K;
 *   - POST /api/v1/reaction-heat, the same network scaled to 1 kg of methane at 1000 K;
 *   - GET /api/v1/species?q=…, formulas, name prefixes and names with one typo made from the
 *     seeded species themselves; then again at 20,000 species (the seeded ones and generated ones,
 *     tests/bench/fixtures/generate-species-library.ts, added as a new revision), with the first
 *     search after that revision (which builds its snapshot and search index) timed apart;
 *   - GET /api/v1/health (one `select 1`): the floor of a request through the whole middleware
 *     stack, for comparison.
 *
 * Run (one benchmark at a time on a shared machine):
 *
 *   npm run bench:library            (= node --expose-gc --import tsx tests/bench/library-api-p95.ts)
 *
 * The seed step itself (revision 1 on the empty database) is timed at start-up.
 * REQUESTS (default 600) sets the number of timed requests per case; SPECIES (default 20,000) the
 * size of the larger library; CASES=<word of a label> runs
 * only the matching cases; PROFILE_DIR=<dir> writes a CPU profile of each case's timed requests
 * (read it with tests/bench/cpu-profile-summary.ts). Figures, never assertions.
 */
import { reactionEnthalpyInputSchema, reactionEnthalpyResultSchema } from '@shared/schemas/reaction-enthalpy';
import type { ServiceContext } from '../../server/context';
import { readBalancedReaction } from '../../server/library/read-reaction';
import { randomUUID } from 'node:crypto';
import { librarySpecies } from '../../server/db/tables/index';
import { currentRevision, withNewRevision } from '../../server/library/revisions';
import { seedLibrary } from '../../server/library/seed-library';
import { evaluateReactionEnthalpy } from '../../server/services/reaction-enthalpy.service';
import { startTestApp } from '../server/helpers';
import { loadText, profiled, reportLine, timeSequential } from './fixtures/bench-report';
import { generateQueries, generateSpeciesLibrary } from './fixtures/generate-species-library';
import type { SpeciesIndexEntry } from '@shared/search';

const REQUESTS = Number(process.env.REQUESTS ?? 600);
const WARMUP = 100;

/**
 * Partial oxidation of methane, combustion of ethane and oxidation and cracking of ammonia, added
 * up and doubled (balanced as written: C 6, H 44, N 8, O 26 on each side). Every species has a
 * NASA TM-4513 model over 200–6000 K in the seeded library.
 */
export const TEN_SPECIES =
  '2 CH4(g) + 2 C2H6(g) + 8 NH3(g) + 13 O2(g) -> 2 CO(g) + 4 CO2(g) + 12 H2O(g) + 10 H2(g) + 2 N2(g) + 4 NO(g)';

console.log(`load average at start: ${loadText()}`);
let started = performance.now();
const t = await startTestApp({ config: { calc: { requestsPerMinute: 10_000_000, linesPerMinute: 10_000_000 } } });
console.log(`app started on in-memory PGlite in ${(performance.now() - started).toFixed(0)} ms`);
started = performance.now();
await seedLibrary(t.db);
console.log(`library seeded in ${(performance.now() - started).toFixed(0)} ms`);

async function post(path: string, body: unknown): Promise<Record<string, unknown>> {
  const res = await fetch(`${t.url}${path}`, {
    method: 'POST',
    headers: { 'Content-Type': 'application/json' },
    body: JSON.stringify(body),
  });
  const json = (await res.json()) as Record<string, unknown>;
  if (res.status !== 200) throw new Error(`${path}: status ${res.status} ${JSON.stringify(json).slice(0, 400)}`);
  return json;
}

async function get(pathAndQuery: string): Promise<Record<string, unknown>> {
  // A kept-alive connection the server closed while idle (5 s) fails once: send it again.
  const res = await fetch(`${t.url}${pathAndQuery}`).catch(() => fetch(`${t.url}${pathAndQuery}`));
  const json = (await res.json()) as Record<string, unknown>;
  if (res.status !== 200)
    throw new Error(`${pathAndQuery}: status ${res.status} ${JSON.stringify(json).slice(0, 400)}`);
  return json;
}

const at1000 = { equation: TEN_SPECIES, temperature: { value: 1000, unit: 'K' } };
const at298 = { equation: TEN_SPECIES };
const heat = {
  equation: TEN_SPECIES,
  temperature: { value: 1000, unit: 'K' },
  amounts: [{ term: 0, value: 1, unit: 'kg' }],
};

// The first request builds the snapshot of the revision (and the prepared models); time it apart.
started = performance.now();
const first = await post('/api/v1/reaction-enthalpy', at1000);
console.log(`first evaluation (builds the snapshot): ${(performance.now() - started).toFixed(0)} ms`);
const deltaH = first['deltaH'] as { value: number; uncertainty: number };
const terms = first['terms'] as { key: string; modelRange: [number, number] | null }[];
console.log(
  `ΔrH°(1000 K) = ${deltaH.value.toFixed(2)} ± ${deltaH.uncertainty.toFixed(2)} kJ/mol over ${terms.length} species: ` +
    terms.map((term) => `${term.key} [${term.modelRange?.join('–') ?? 'no model'} K]`).join(', '),
);
const heatReply = await post('/api/v1/reaction-heat', heat);
console.log(`heat for 1 kg CH4 at 1000 K: ${(heatReply['heat'] as { value: number }).value.toFixed(0)} kJ`);

// Species queries from the seeded species: formulas, name prefixes and one-typo names.
const listed = (await get('/api/v1/species?limit=200&offset=0')) as { total: number };
const entries: SpeciesIndexEntry[] = [];
for (let offset = 0; offset < listed.total; offset += 200) {
  const page = (await get(`/api/v1/species?limit=200&offset=${offset}`)) as {
    items: { id: string; key: string; formula: string; hill: string; phase: string; name: string }[];
  };
  for (const item of page.items)
    entries.push({
      id: item.id,
      key: item.key,
      formula: item.formula,
      hill: item.hill,
      phase: item.phase as SpeciesIndexEntry['phase'],
      descriptor: null,
      charge: 0,
      name: item.name,
      synonyms: [],
      cas: null,
      inchikey: null,
      elements: [],
    });
}
const queries = generateQueries(entries, 100, 11);
console.log(`species search: ${entries.length} species in the seeded library, ${queries.length} queries`);

interface Case {
  label: string;
  target?: string;
  call: (i: number) => Promise<unknown>;
}
const cases: Case[] = [
  { label: 'GET /health (floor: middleware + select 1)', call: () => get('/api/v1/health') },
  {
    label: 'POST /reaction-enthalpy, 10 species, 1000 K',
    target: 'p95 ≤ 5 ms',
    call: () => post('/api/v1/reaction-enthalpy', at1000),
  },
  { label: 'POST /reaction-enthalpy, 10 species, 298.15 K', call: () => post('/api/v1/reaction-enthalpy', at298) },
  { label: 'POST /reaction-heat, 10 species, 1000 K, 1 kg', call: () => post('/api/v1/reaction-heat', heat) },
  {
    label: 'GET /species?q= (formula, prefix, typo)',
    call: (i) => get(`/api/v1/species?q=${encodeURIComponent(queries[i % queries.length]!.text)}`),
  },
];
for (const kind of ['formula', 'prefix', 'typo'] as const) {
  const some = queries.filter((q) => q.kind === kind);
  cases.push({
    label: `GET /species?q= (${kind} only)`,
    call: (i) => get(`/api/v1/species?q=${encodeURIComponent(some[i % some.length]!.text)}`),
  });
}

// CASES=enthalpy (a word of the labels) runs only the matching cases, e.g. under --cpu-prof.
const only = process.env.CASES;
console.log(
  `\n${REQUESTS} sequential requests per case after ${WARMUP} warm-up requests; wall clock per request, ` +
    `then the process's CPU time per request (client and server both run here, so it holds both sides):`,
);
for (const c of cases.filter((c) => !only || c.label.includes(only))) {
  for (let i = 0; i < WARMUP; i++) await c.call(i);
  const cpu = process.cpuUsage();
  const samples = await profiled(c.label, () => timeSequential(REQUESTS, async (i) => void (await c.call(i))));
  const used = process.cpuUsage(cpu);
  console.log(reportLine(c.label, samples, c.target));
  console.log(`${''.padEnd(44)} CPU ${((used.user + used.system) / 1000 / REQUESTS).toFixed(2)} ms/request`);
}

// Where a request's time goes: the parts of the enthalpy request called in this process, without HTTP.
if (!only || 'breakdown'.includes(only)) {
  const ctx: ServiceContext = {
    ...t.app.locals.deps,
    actor: null,
    meta: { ip: null, userAgent: null, requestId: 'bench' },
  };
  const input = reactionEnthalpyInputSchema.parse(at1000);
  const reply = await evaluateReactionEnthalpy(ctx, input);
  const parts: [string, () => Promise<unknown> | unknown][] = [
    ['  newest revision (one select on PGlite)', () => currentRevision(t.db)],
    ['  parse + balance the equation', () => readBalancedReaction(TEN_SPECIES)],
    ['  service evaluateReactionEnthalpy, 1000 K', () => evaluateReactionEnthalpy(ctx, input)],
    ['  request schema parse', () => reactionEnthalpyInputSchema.parse(at1000)],
    ['  reply schema check (safeParse)', () => reactionEnthalpyResultSchema.safeParse(reply)],
    ['  JSON.stringify of the reply', () => JSON.stringify(reply)],
  ];
  console.log(
    `\nthe enthalpy request at 1000 K in parts, called in this process (reply ${JSON.stringify(reply).length} bytes):`,
  );
  for (const [label, call] of parts) {
    for (let i = 0; i < WARMUP; i++) await call();
    const cpu = process.cpuUsage();
    const samples = await profiled(`part ${label.trim()}`, () =>
      timeSequential(REQUESTS, async () => void (await call())),
    );
    const used = process.cpuUsage(cpu);
    console.log(reportLine(label, samples));
    console.log(`${''.padEnd(44)} CPU ${((used.user + used.system) / 1000 / REQUESTS).toFixed(3)} ms/call`);
  }
}

// ------------------------------------------------------------ search at 20,000 species

const SIZE = Number(process.env.SPECIES ?? 20_000);
const bigLabel = (kind: string) => `GET /species?q= at ${SIZE} (${kind})`;
const bigKinds = ['formula, prefix, typo', 'formula only', 'prefix only', 'typo only'];
if (bigKinds.some((kind) => !only || bigLabel(kind).includes(only))) {
  // Generated species whose keys the seeded library does not hold, as one new revision (written
  // straight into the species table: search reads nothing else of them).
  const seededKeys = new Set(entries.map((e) => e.key));
  const generated = generateSpeciesLibrary(SIZE)
    .entries.filter((e) => !seededKeys.has(e.key))
    .slice(0, SIZE - entries.length);
  started = performance.now();
  await withNewRevision(t.db, { kind: 'import', summary: 'Benchmark: generated species' }, async (tx, number) => {
    for (let i = 0; i < generated.length; i += 1_000)
      await tx.insert(librarySpecies).values(
        generated.slice(i, i + 1_000).map((e) => ({
          id: randomUUID(),
          key: e.key,
          formula: e.formula,
          hill: e.hill,
          charge: e.charge,
          phase: e.phase,
          descriptor: e.descriptor,
          name: e.name,
          synonyms: [...e.synonyms],
          cas: e.cas,
          inchikey: e.inchikey,
          molarMass: 0, // not read by search
          note: 'generated for a benchmark',
          validFrom: number,
        })),
      );
  });
  console.log(
    `\n${generated.length} generated species written as a new revision in ${(performance.now() - started).toFixed(0)} ms`,
  );
  started = performance.now();
  const firstBig = (await get('/api/v1/species?q=benzene')) as { total: number };
  console.log(
    `first search after that revision (builds the snapshot and the search index): ` +
      `${(performance.now() - started).toFixed(0)} ms  load ${loadText()}`,
  );
  const all = [...entries, ...generated];
  const bigQueries = generateQueries(all, 100, 13);
  const total = ((await get('/api/v1/species?limit=1')) as { total: number }).total;
  console.log(
    `species search: ${total} species in the library, ${bigQueries.length} queries (${firstBig.total} hits for benzene)`,
  );
  for (const kind of bigKinds) {
    const label = bigLabel(kind);
    if (only && !label.includes(only)) continue;
    const some = kind.endsWith('only') ? bigQueries.filter((q) => kind.startsWith(q.kind)) : bigQueries;
    const call = (i: number) => get(`/api/v1/species?q=${encodeURIComponent(some[i % some.length]!.text)}`);
    for (let i = 0; i < WARMUP; i++) await call(i);
    const cpu = process.cpuUsage();
    const samples = await profiled(label, () => timeSequential(REQUESTS, async (i) => void (await call(i))));
    const used = process.cpuUsage(cpu);
    console.log(reportLine(label, samples, 'p95 ≤ 20 ms'));
    console.log(`${''.padEnd(44)} CPU ${((used.user + used.system) / 1000 / REQUESTS).toFixed(2)} ms/request`);
  }
}

await t.close();
console.log(`\nload average at end: ${loadText()}`);
