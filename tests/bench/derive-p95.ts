/**
 * The Hess combiner on a generated library (tests/bench/fixtures/generate-hess-library.ts):
 * 10,000 species, 90 % with a ΔfH°, 20,000 measured reactions of 2–6 species. Reports:
 *
 * - the first request after a new revision: the known reactions read from their text (as
 *   server/library/network.ts does) and `buildHessNetwork`, for the benchmark library and for one
 *   of 30,000 known reactions;
 * - `deriveEnthalpy` of the formation of species without a ΔfH°, with the server's bounds
 *   (derive.service.ts: maxSteps 6, maxExamined 20,000, maxRoutes 5, 2 s time budget, and the search
 *   stops after the step count that gave 4 × maxRoutes routes with stated uncertainties):
 *   p50/p95/p99 per kind of target — reachable species of the main network (target p95 ≤ 50 ms),
 *   those of them in 20 or more reactions (many routes to rank), species whose every route needs
 *   a second unknown, and the unreachable: species in no reaction, and species reachable only
 *   through other unknowns (trees of unknowns);
 * - the same reachable targets through `deriveEnthalpyAsync` with a setImmediate pause between
 *   slices, as the service runs it;
 * - exactness: every route found must add up to the generator's true value exactly (fractions),
 *   and the headline (a floating-point combination when routes agree) must lie within 1e-9.
 *
 * - the curators' consistency fit (`consistencyFit`) over 1,000 measured reactions of the same
 *   library (target ≤ 1 s).
 *
 * Run: npm run bench:derive   (= node --expose-gc --import tsx tests/bench/derive-p95.ts)
 * ROUNDS (default 1) timed rounds over the targets; TARGETS (default 60) caps the targets of each
 * kind (an evenly spaced sample; 0 = all); MAX_EXAMINED replaces the server's bound on combinations
 * examined (to see what another bound would give); ENOUGH_ROUTES (default 20 = 4 × maxRoutes;
 * Infinity: no early stop) the routes after which longer ones are not searched; FIT_ROUNDS (default 5) timed fits; PROFILE_DIR=<dir>
 * writes CPU profiles.
 */
import Fraction from 'fraction.js';
import {
  buildHessNetwork,
  consistencyFit,
  deriveEnthalpy,
  deriveEnthalpyAsync,
  type ConsistencyMeasurement,
  type Derivation,
  type HeldValue,
  type HessNetwork,
  type InputInfo,
  type RouteSearchOptions,
} from '@shared/chemistry/hess';
import { defaultDeriveLimits } from '../../server/services/derive.service';
import { heapMb, loadText, profiled, reportLine } from './fixtures/bench-report';
import {
  generateHessLibrary,
  knownReactionsOf,
  type GeneratedHessLibrary,
  type GeneratedReaction,
} from './fixtures/generate-hess-library';
import { percentile } from './fixtures/species-search-measure';

const ROUNDS = Number(process.env.ROUNDS ?? 1);
const TARGETS = Number(process.env.TARGETS ?? 60);
/** The server's bound on combinations examined, or another to compare (MAX_EXAMINED). */
const MAX_EXAMINED = Number(process.env.MAX_EXAMINED ?? defaultDeriveLimits.maxExamined);
// Routes with stated uncertainties after which longer routes are not searched ("Infinity": only the bounds stop it).
const ENOUGH_ROUTES = Number(process.env.ENOUGH_ROUTES ?? defaultDeriveLimits.enoughRoutesPerRouteAsked * 5);
const FIT_ROUNDS = Number(process.env.FIT_ROUNDS ?? 5);
/** At most TARGETS keys, evenly spaced over the list (all when TARGETS is 0). */
const sample = (keys: readonly string[]): string[] => {
  if (TARGETS <= 0 || keys.length <= TARGETS) return [...keys];
  const step = keys.length / TARGETS;
  return Array.from({ length: TARGETS }, (_, i) => keys[Math.floor(i * step)]!);
};
const now = () => performance.now();

console.log(`load average at start: ${loadText()}`);
let started = now();
const library = generateHessLibrary();
console.log(
  `library: ${library.species.length} species (${library.species.filter((s) => s.known).length} with ΔfH°), ` +
    `${library.reactions.length} measured reactions, generated in ${(now() - started).toFixed(0)} ms`,
);

// ------------------------------------------------------------ first request after a new revision

/** Known reactions from text and the network over them, timed apart; fresh objects each time. */
function buildTimed(lib: GeneratedHessLibrary): {
  readMs: number;
  buildMs: number;
  network: HessNetwork;
  inputs: Map<string, InputInfo>;
} {
  const t0 = now();
  const known = knownReactionsOf(lib);
  const t1 = now();
  const network = buildHessNetwork(known.reactions, known.species);
  return { readMs: t1 - t0, buildMs: now() - t1, network, inputs: known.inputs };
}

const options = (): RouteSearchOptions => {
  const start = Date.now();
  return {
    maxSteps: defaultDeriveLimits.maxSteps,
    maxExamined: MAX_EXAMINED,
    maxRoutes: 5,
    enoughRoutes: ENOUGH_ROUTES,
    outOfTime: () => Date.now() - start > defaultDeriveLimits.timeBudgetMs,
  };
};
const target = (key: string) => [{ species: key, coefficient: new Fraction(1) }];

const heapBefore = heapMb();
const first = buildTimed(library);
const heapNetwork = heapMb() - heapBefore;
started = now();
const firstDerivation = deriveEnthalpy(first.network, target(library.unknown.main[0]!), first.inputs, options());
const firstDeriveMs = now() - started;
console.log(
  `\nfirst request after a new revision (${first.network.reactions.length} known reactions; cold code):\n` +
    `  read reactions from text ${first.readMs.toFixed(0)} ms + buildHessNetwork ${first.buildMs.toFixed(0)} ms ` +
    `+ first derivation ${firstDeriveMs.toFixed(1)} ms (${firstDerivation.status})` +
    `  heap held by the network and inputs ${heapNetwork.toFixed(0)} MB  load ${loadText()}`,
);
const knownCount = library.species.filter((s) => s.known).length;
const big = generateHessLibrary({ reactions: 30_000 - knownCount });
for (let round = 0; round < 3; round++) {
  const b = buildTimed(big);
  console.log(
    `  ${b.network.reactions.length} known reactions, round ${round + 1}: read from text ${b.readMs.toFixed(0)} ms, ` +
      `buildHessNetwork ${b.buildMs.toFixed(0)} ms  load ${loadText()}`,
  );
}

// ------------------------------------------------------------ derivations

const { network, inputs } = first;
const many = library.unknown.main.filter((k) => library.byKey.get(k)!.reactions >= 20);
const kinds: [string, string[], string?][] = [
  ['reachable (main network)', sample(library.unknown.main), 'p95 ≤ 50 ms'],
  ['  of them in 20+ reactions (many routes)', sample(many)],
  ['needs a second unknown (two-step)', sample(library.unknown.twoStep)],
  ['unreachable: in no reaction', sample(library.unknown.isolated)],
  ['unreachable: only through unknowns (trees)', sample(library.unknown.tree)],
];
console.log(
  `\ntargets without ΔfH°: ${library.unknown.main.length} reachable (${many.length} of them in 20+ reactions), ` +
    `${library.unknown.twoStep.length} two-step, ${library.unknown.isolated.length} isolated, ` +
    `${library.unknown.tree.length} in trees of unknowns; timed: ${kinds.map(([, keys]) => keys.length).join(', ')}`,
);

interface Outcome {
  ms: number;
  derivation: Derivation;
}
function runAll(keys: readonly string[]): Outcome[] {
  return keys.map((key) => {
    const start = now();
    const derivation = deriveEnthalpy(network, target(key), inputs, options());
    return { ms: now() - start, derivation };
  });
}

// Warm-up: one pass over a sample of every kind.
for (const [, keys] of kinds) runAll(keys.filter((_, i) => i % 5 === 0));

console.log(
  `\nderiveEnthalpy, ${ROUNDS} round(s) over the targets, at most ${MAX_EXAMINED} combinations examined, enough at ${ENOUGH_ROUTES} routes (ms per derivation, wall clock):`,
);
const lastRound = new Map<string, Outcome[]>();
for (const [label, keys, goal] of kinds) {
  const samples: number[] = [];
  const cpu = process.cpuUsage();
  await profiled(`derive ${label.trim()}`, async () => {
    for (let round = 0; round < ROUNDS; round++) {
      const outcomes = runAll(keys);
      samples.push(...outcomes.map((o) => o.ms));
      lastRound.set(label, outcomes);
    }
  });
  const used = process.cpuUsage(cpu);
  const outcomes = lastRound.get(label)!;
  const examined = outcomes.map((o) => o.derivation.search.examined);
  const found = outcomes.map((o) => o.derivation.search.found);
  const stoppedBy = (why: string) => outcomes.filter((o) => o.derivation.search.stoppedBy === why).length;
  const stopped = stoppedBy('examined') + stoppedBy('time');
  const derived = outcomes.filter((o) => o.derivation.status === 'derived').length;
  console.log(reportLine(`${label} (${keys.length})`, samples, goal));
  console.log(
    `${''.padEnd(44)} CPU ${((used.user + used.system) / 1000 / samples.length).toFixed(2)} ms/derivation; ` +
      `derived ${derived}/${keys.length}; examined p50 ${percentile(examined, 50)} max ${Math.max(...examined)}; ` +
      `routes found p50 ${percentile(found, 50)} max ${Math.max(...found)}; stopped by a bound ${stopped}; stopped with enough routes ${stoppedBy('routes')}`,
  );
}

// The service's way: the same search in slices with a setImmediate pause between them.
{
  const keys = kinds[0]![1];
  const samples: number[] = [];
  for (let round = 0; round < ROUNDS; round++)
    for (const key of keys) {
      const start = now();
      await deriveEnthalpyAsync(
        network,
        target(key),
        inputs,
        options(),
        () => new Promise<void>((resolve) => setImmediate(resolve)),
      );
      samples.push(now() - start);
    }
  console.log(reportLine(`reachable, deriveEnthalpyAsync (${keys.length})`, samples, 'p95 ≤ 50 ms'));
}

// ------------------------------------------------------------ exactness

let routesChecked = 0;
let routesExact = 0;
let headlines = 0;
let worstHeadline = 0;
const basisCount = new Map<string, number>();
// Check against the true value of the target each derivation was for.
for (const [label, keys] of [kinds[0]!, kinds[2]!]) {
  lastRound.get(label)!.forEach(({ derivation }, i) => {
    if (derivation.status !== 'derived') return;
    const truth = library.byKey.get(keys[i]!)!.value;
    for (const route of derivation.routes) {
      routesChecked++;
      if (route.deltaH.equals(truth)) routesExact++;
    }
    headlines++;
    worstHeadline = Math.max(worstHeadline, Math.abs(derivation.deltaH! - truth.valueOf()));
    basisCount.set(derivation.basis!, (basisCount.get(derivation.basis!) ?? 0) + 1);
  });
}
console.log(
  `\nexactness: ${routesExact}/${routesChecked} routes equal the true ΔfH° exactly (fractions); ` +
    `${headlines} headline values, largest |headline − true| ${worstHeadline.toExponential(2)} kJ/mol ` +
    `(${[...basisCount].map(([b, n]) => `${b} ${n}`).join(', ')})`,
);
if (routesExact !== routesChecked || worstHeadline > 1e-9)
  console.log('  MISMATCH: a derived value differs from the truth');
// ------------------------------------------------------------ consistency fit

const FIT_MEASUREMENTS = 1_000;
/**
 * A curator's group: species without ΔfH° of the main network, one after another, each bringing
 * the measured reactions whose other species all have a ΔfH° or are in the group, until 1,000
 * reactions link them. The other species are held at their values with their uncertainties (so
 * the popular ones correlate many measurements). One measurement is off by ten of its standard
 * deviations (its own u and those of the held values it rests on).
 */
function fitGroup(size: number) {
  const reactionsOf = new Map<string, GeneratedReaction[]>();
  for (const r of library.reactions)
    for (const t of r.terms) {
      const list = reactionsOf.get(t.key);
      if (list) list.push(r);
      else reactionsOf.set(t.key, [r]);
    }
  const group = new Set<string>();
  const chosen = new Set<GeneratedReaction>();
  for (const key of library.unknown.main) {
    group.add(key);
    for (const r of reactionsOf.get(key) ?? [])
      if (!chosen.has(r) && r.terms.every((t) => library.byKey.get(t.key)!.known || group.has(t.key))) chosen.add(r);
    if (chosen.size >= size) break;
  }
  const picked = [...chosen].slice(0, size);
  const fitted = [...group].filter((key) => picked.some((r) => r.terms.some((t) => t.key === key)));
  const held = new Map<string, HeldValue>();
  const corruptAt = Math.floor(size / 2);
  const measurements: ConsistencyMeasurement[] = picked.map((r, i) => {
    // The measurement's whole standard deviation: its own u and the held values' it rests on.
    let variance = r.uncertainty ** 2;
    for (const t of r.terms) {
      const s = library.byKey.get(t.key)!;
      if (!s.known) continue;
      held.set(t.key, { value: s.value.valueOf(), uncertainty: s.uncertainty });
      variance += (Number(new Fraction(t.coefficient)) * s.uncertainty) ** 2;
    }
    return {
      id: r.id,
      label: r.id,
      terms: r.terms.map((t) => ({ species: t.key, coefficient: new Fraction(t.coefficient) })),
      deltaH: Number(r.deltaHText) + (i === corruptAt ? 10 * Math.sqrt(variance) : 0),
      uncertainty: r.uncertainty,
    };
  });
  return { fitted, measurements, held, corrupted: picked[corruptAt]!.id };
}

{
  const { fitted, measurements, held, corrupted } = fitGroup(FIT_MEASUREMENTS);
  console.log(
    `\nconsistencyFit: ${fitted.length} species fitted to ${measurements.length} measured reactions, ` +
      `${held.size} species held at their values (one measurement off by 10 of its standard deviations):`,
  );
  const samples: number[] = [];
  let result = consistencyFit(fitted, measurements, held); // warm-up
  const cpu = process.cpuUsage();
  await profiled('consistency fit', async () => {
    for (let round = 0; round < FIT_ROUNDS; round++) {
      const start = now();
      result = consistencyFit(fitted, measurements, held);
      samples.push(now() - start);
    }
  });
  const used = process.cpuUsage(cpu);
  console.log(reportLine(`consistencyFit, ${measurements.length} reactions`, samples, '≤ 1 s'));
  console.log(`${''.padEnd(44)} CPU ${((used.user + used.system) / 1000 / FIT_ROUNDS).toFixed(0)} ms/fit`);
  const flagged = result.residuals.filter((r) => r.flagged).map((r) => r.id);
  const worst = Math.max(
    ...result.fitted.map((f) => Math.abs(f.value - library.byKey.get(f.species)!.value.valueOf())),
  );
  console.log(
    `${''.padEnd(44)} Birge ratio ${result.birgeRatio?.toFixed(2)}; flagged ${flagged.length} ` +
      `(the corrupted one ${flagged.includes(corrupted) ? 'among them' : 'NOT among them'}); ` +
      `largest |fitted − true| ${worst.toFixed(3)} kJ/mol`,
  );
}

console.log(`\nload average at end: ${loadText()}`);
