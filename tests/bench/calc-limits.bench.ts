// Worst cases of the public calculation endpoints at the configured (default) work limits.
//
// Time: over real HTTP, through the worker pool, as a caller sees it (read max and p99 from
// `npm run bench`; the time budget is 10 s, past which the server answers 503).
// Memory: each case once more in a fresh worker thread, reporting the heap the thread had to
// commit for it (a close upper estimate of the request's peak heap), printed after the run.
import { Worker } from 'node:worker_threads';
import { afterAll, bench, describe } from 'vitest';
import { MAX_SERIES_POINTS } from '@shared/schemas/calorimetry';
import { configFromEnv, readEnv } from '../../server/env';
import { startTestApp } from '../server/helpers';
import { newtonianReadings } from '../shared/chemistry/calorimetry/support';

const limits = configFromEnv(readEnv({})).calc.limits;
const alkane = (n: number) => (n === 1 ? 'CH4' : `C${n}H${2 * n + 2}`);

// One equation at the term limit (all H: width without chemistry).
const maxTerms = `${Array<string>(limits.maxTermsPerEquation - 1)
  .fill('H')
  .join('+')}->H2`;
// One equation at the species limit: 57 alkanes burning, 57 independent balancings for the exact simplex.
const maxSpecies = `${Array.from({ length: limits.maxDistinctSpecies - 3 }, (_, i) => alkane(i + 1)).join(' + ')} + O2 -> CO2 + H2O`;
// A batch at the line limit, of typical equations.
const maxLinesTypical = Array.from({ length: limits.maxBatchLines }, (_, i) =>
  i % 2 ? 'C3H8(g) + O2(g) -> CO2(g) + H2O(l)' : 'Fe2O3(s) + CO(g) -> Fe(s) + CO2(g)',
).join('\n');
// A batch at the byte limit, filled with the heaviest line (the species-limit equation).
const maxBytesHeavy = Array<string>(Math.floor(limits.maxBatchBytes / (maxSpecies.length + 1)))
  .fill(maxSpecies)
  .join('\n');

// A constant-pressure run with one series at the per-series limit (a reading a second), corrected by
// Regnault–Pfaundler, the method that integrates over every reading of the main period.
const longSeries = newtonianReadings({
  k: 1e-4,
  convergence: 295.05,
  start: 294,
  rise: 3,
  release: 0.002,
  mixingTime: 1000,
  step: 1,
  end: MAX_SERIES_POINTS - 1,
});
const maxSeries = {
  solution: { mass: { value: 200, unit: 'g', uncertainty: 0.01 } },
  temperature: { series: longSeries, unit: 'K', mixingTime: 1000, method: 'regnault-pfaundler' },
  reaction: {
    equation: 'HCl(aq) + NaOH(aq) -> NaCl(aq) + H2O(l)',
    limiting: { term: 0, amount: { value: 0.05, unit: 'mol' } },
  },
};

const cases = {
  'POST /balance, 80 terms': { path: '/balance', body: { equation: maxTerms } },
  'POST /balance, 60 species': { path: '/balance', body: { equation: maxSpecies } },
  'POST /balance/batch, 2,000 typical lines': { path: '/balance/batch', body: { text: maxLinesTypical } },
  [`POST /balance/batch, ${maxBytesHeavy.split('\n').length} lines of 60 species (200 kB)`]: {
    path: '/balance/batch',
    body: { text: maxBytesHeavy },
  },
  [`POST /calorimetry/constant-pressure, ${MAX_SERIES_POINTS.toLocaleString('en')} readings`]: {
    path: '/calorimetry/constant-pressure',
    body: maxSeries,
  },
} as const;

const t = await startTestApp({ config: { calc: { requestsPerMinute: 1e9, linesPerMinute: 1e9 } } });
const statuses = new Map<string, Set<number>>();

afterAll(async () => {
  await t.close();
  const rows: Record<string, unknown>[] = [];
  for (const [name, c] of Object.entries(cases)) {
    const task =
      c.path === '/balance'
        ? { kind: 'balance', input: c.body, limits }
        : c.path === '/calorimetry/constant-pressure'
          ? { kind: 'constant-pressure', input: c.body, limits }
          : { kind: 'batch', text: (c.body as { text: string }).text, limits };
    const stats = await new Promise<Record<string, unknown>>((resolve, reject) => {
      const worker = new Worker(new URL('./heap-probe.mjs', import.meta.url), {
        workerData: { task },
        resourceLimits: { maxOldGenerationSizeMb: 2048 },
      });
      worker.once('message', resolve);
      worker.once('error', reject);
    });
    rows.push({
      case: name,
      'HTTP status': [...(statuses.get(name) ?? [])].join('/'),
      'compute ms (fresh thread)': Math.round(stats['ms'] as number),
      'reply kB': Math.round((stats['replyBytes'] as number) / 1024),
      'heap committed MB': (stats['heapCommittedMb'] as number).toFixed(1),
      'heap used after MB': (stats['heapUsedMb'] as number).toFixed(1),
    });
  }
  console.log('\nWorst cases at the default work limits (memory per request):');
  console.table(rows);
});

describe('calculation endpoints at the default work limits (over HTTP, worker pool)', () => {
  for (const [name, c] of Object.entries(cases)) {
    bench(
      name,
      async () => {
        const res = await fetch(`${t.url}/api/v1${c.path}`, {
          method: 'POST',
          headers: { 'Content-Type': 'application/json' },
          body: JSON.stringify(c.body),
        });
        await res.arrayBuffer();
        if (!statuses.has(name)) statuses.set(name, new Set());
        statuses.get(name)!.add(res.status);
        if (![200, 413, 503].includes(res.status)) throw new Error(`${name}: status ${res.status}`);
      },
      { time: 0, iterations: 5, warmupIterations: 1, warmupTime: 0 },
    );
  }
});
