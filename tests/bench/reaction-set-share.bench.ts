/**
 * Opening a 200-item reaction set by its share link, and its PDF, over real HTTP on in-memory
 * PGlite (loopback, so the time is the server's plus a local round trip). Three cases:
 *   - cold: the set was just saved, so its results are computed (every item evaluated);
 *   - warm: the same version again, served from the per-version cache;
 *   - PDF: export.pdf of a version just saved (results computed and the PDF typeset in a worker
 *     of the calculation pool; a PDF fetched again is served from a small cache, which this case
 *     avoids on purpose). The first PDFs after start are warm-up: each worker thread loads pdfkit
 *     and the fonts on its first report; they are printed apart ("pdf first").
 * Besides vitest's own table, p50/p95 of the request alone are printed from our samples (the cold
 * case also saves the set before each sample; that save is not in the sample).
 *
 *   npx vitest bench --run tests/bench/reaction-set-share.bench.ts
 */
import { loadavg } from 'node:os';
import { afterAll, bench, describe } from 'vitest';
import { seedLibrary } from '../../server/library/seed-library';
import { DEMO_PASSWORD, demoUsers, startTestApp } from '../server/helpers';

const t = await startTestApp({ config: { calc: { requestsPerMinute: 10_000_000, linesPerMinute: 10_000_000 } } });
await seedLibrary(t.db);
const signIn = await fetch(`${t.url}/api/v1/session`, {
  method: 'POST',
  headers: { 'Content-Type': 'application/json', Origin: t.url },
  body: JSON.stringify({ email: demoUsers.member, password: DEMO_PASSWORD }),
});
const cookie = (signIn.headers.get('set-cookie') ?? '').split(';')[0]!;
const headers = { 'Content-Type': 'application/json', Origin: t.url, Cookie: cookie };

// Reactions of library species, at temperatures the species' models cover.
const EQUATIONS = [
  'CH4(g) + 2 O2(g) -> CO2(g) + 2 H2O(g)',
  'C3H8(g) + 5 O2(g) -> 3 CO2(g) + 4 H2O(g)',
  '2 H2(g) + O2(g) -> 2 H2O(g)',
  'N2(g) + 3 H2(g) <=> 2 NH3(g)',
  'CO(g) + 1/2 O2(g) -> CO2(g)',
  '2 C2H6(g) + 7 O2(g) -> 4 CO2(g) + 6 H2O(g)',
  'CO(g) + H2O(g) -> CO2(g) + H2(g)',
  '2 SO2(g) + O2(g) -> 2 SO3(g)',
  'C2H4(g) + H2(g) -> C2H6(g)',
  'CH4(g) + H2O(g) -> CO(g) + 3 H2(g)',
];
const TEMPERATURES = [298.15, 350, 400, 500, 600, 700, 800, 900, 1000];

function items(): unknown[] {
  const out: unknown[] = [];
  for (let i = 0; out.length < 170; i++)
    out.push({
      kind: 'reaction',
      equation: EQUATIONS[i % EQUATIONS.length],
      temperature: { value: TEMPERATURES[Math.floor(i / EQUATIONS.length) % TEMPERATURES.length], unit: 'K' },
    });
  for (let i = 0; i < 10; i++)
    out.push({ kind: 'quantities', equation: EQUATIONS[i], amounts: [{ term: 0, value: 10 + i, unit: 'mol' }] });
  for (let i = 0; i < 5; i++) out.push({ kind: 'derivation', target: EQUATIONS[i + 4] });
  while (out.length < 200) out.push({ kind: 'note', text: `Remark ${out.length}` });
  return out;
}

const created = await fetch(`${t.url}/api/v1/teams/${t.ids.teams.kestrel}/sets`, {
  method: 'POST',
  headers,
  body: JSON.stringify({ title: 'Two hundred items', items: items() }),
});
if (created.status !== 201) throw new Error(`create: ${created.status} ${await created.text()}`);
const set = (await created.json()) as { id: string; version: number };
const setUrl = `${t.url}/api/v1/teams/${t.ids.teams.kestrel}/sets/${set.id}`;
const link = (await (await fetch(`${setUrl}/links`, { method: 'POST', headers, body: '{}' })).json()) as {
  token: string;
};
const sharedUrl = `${t.url}/api/v1/shared/${link.token}`;
let version = set.version;

const samples: Record<string, number[]> = { cold: [], warm: [], pdf: [] };
/** Warm-up runs (vitest's warmupIterations below) are timed too; the report leaves them out. */
const WARMUPS: Record<string, number> = { cold: 1, warm: 2, pdf: 4 };
async function timed(kind: string, url: string): Promise<void> {
  const start = performance.now();
  const res = await fetch(url);
  const body = await res.arrayBuffer();
  samples[kind]!.push(performance.now() - start);
  if (res.status !== 200) throw new Error(`${url}: ${res.status} ${Buffer.from(body).toString()}`);
}

/** A new version of the set (another title), so its results are computed afresh on the next open. */
async function save(): Promise<void> {
  const saved = await fetch(setUrl, {
    method: 'PUT',
    headers,
    body: JSON.stringify({ version, title: `Two hundred items (${version})` }),
  });
  if (saved.status !== 200) throw new Error(`save: ${saved.status}`);
  version = ((await saved.json()) as { version: number }).version;
}

function percentile(values: number[], p: number): number {
  const sorted = [...values].sort((a, b) => a - b);
  return sorted[Math.min(sorted.length - 1, Math.ceil((p / 100) * sorted.length) - 1)] ?? NaN;
}

afterAll(async () => {
  console.log(
    `load average at the end: ${loadavg()
      .map((l) => l.toFixed(1))
      .join(' ')} on ${process.platform}`,
  );
  const firstPdfs = samples.pdf!.slice(0, WARMUPS.pdf);
  if (firstPdfs.length > 0)
    console.log(`pdf first (workers warming up): ${firstPdfs.map((v) => v.toFixed(0)).join(', ')} ms`);
  for (const [kind, all] of Object.entries(samples)) {
    const values = all.slice(WARMUPS[kind] ?? 0);
    if (values.length > 0)
      console.log(
        `${kind}: n=${values.length} p50=${percentile(values, 50).toFixed(0)} ms p95=${percentile(values, 95).toFixed(0)} ms max=${Math.max(...values).toFixed(0)} ms`,
      );
  }
  await t.close();
});

describe('a 200-item set by share link (in-memory PGlite, loopback HTTP)', () => {
  bench(
    'GET /shared/:token, cold (saved just before: every item evaluated)',
    async () => {
      await save();
      await timed('cold', sharedUrl);
    },
    { iterations: 12, time: 0, warmupIterations: 1 },
  );

  bench('GET /shared/:token, warm (same version)', () => timed('warm', sharedUrl), {
    iterations: 40,
    time: 0,
    warmupIterations: 2,
  });

  bench(
    'GET /shared/:token/export.pdf, just saved (results computed, PDF typeset)',
    async () => {
      await save();
      await timed('pdf', `${sharedUrl}/export.pdf`);
    },
    { iterations: 12, time: 0, warmupIterations: 4 },
  );
});
