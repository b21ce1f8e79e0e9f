import Fraction from 'fraction.js';
import { integerNullspace } from '../nullspace';
import type { HessNetwork } from './network';
import { routeWeights, routeUncertainty } from './covariance';
import type {
  InputInfo,
  KnownReaction,
  Route,
  RouteSearchOptions,
  RouteSearchResult,
  RouteStep,
  SignedTerm,
} from './types';

/**
 * The route search: exact combinations of known reactions that add up to a target reaction.
 *
 * A route is minimal: no smaller subset of its reactions adds up to the target. In the space of
 * species other than the elements' reference states, the formation reaction of a species with a
 * ΔfH° is that species alone, so a route is a set M of measured or given reactions plus the
 * formation reactions that close what M leaves of species with a ΔfH°.
 *
 * The search walks outward from the target's species: a species without ΔfH° (or one of the
 * target's own species chosen to be derived rather than taken from its ΔfH°) must cancel
 * through reactions that contain it; every other species a reaction brings in and that has a
 * ΔfH° is closed by its formation reaction, and the walk stops there. At each step the species
 * that can cancel nowhere else is expanded first, over the reactions containing it, so the
 * search stays on the small part of the network around the target. Exactness: the multipliers
 * come from an exact integer nullspace (Bareiss elimination), never from floating point.
 */

/** Signed target terms → species → exact coefficient (zero terms dropped, repeats merged). */
function toVector(terms: readonly SignedTerm[]): Map<string, Fraction> {
  const vector = new Map<string, Fraction>();
  for (const term of terms) {
    const sum = (vector.get(term.species) ?? new Fraction(0)).add(term.coefficient);
    if (sum.equals(0)) vector.delete(term.species);
    else vector.set(term.species, sum);
  }
  return vector;
}

function lcmBig(a: bigint, b: bigint): bigint {
  let x = a;
  let y = b;
  while (y !== 0n) [x, y] = [y, x % y];
  return (a / x) * b;
}

/**
 * Solves target = Σ c_j · column_j over the given rows, exactly. Returns the unique solution
 * when the columns are independent and it exists, `dependent` when a solution exists but the
 * columns are dependent or some c_j would be 0 (so the set is not minimal), or null when there is
 * no solution.
 */
function solveExact(
  rows: readonly string[],
  columns: readonly Map<string, Fraction>[],
  target: Map<string, Fraction>,
): Fraction[] | 'dependent' | null {
  const all = [...columns, target];
  // Scale each column to integers (its denominators' lcm), remembering the scale.
  const scales = all.map((column) => {
    let lcm = 1n;
    for (const species of rows) {
      const value = column.get(species);
      if (value) lcm = lcmBig(lcm, BigInt(value.d));
    }
    return lcm;
  });
  const matrix = rows.map((species) =>
    all.map((column, j) => {
      const value = column.get(species);
      if (!value) return 0;
      const scaled = (BigInt(value.s) * BigInt(value.n) * scales[j]!) / BigInt(value.d);
      return Number(scaled);
    }),
  );
  if (matrix.some((row) => row.some((v) => !Number.isSafeInteger(v)))) return null;
  const { basis } = integerNullspace(matrix, all.length);
  const last = all.length - 1;
  const withTarget = basis.filter((v) => v[last] !== 0n);
  if (withTarget.length === 0) return null;
  if (basis.length > 1) return 'dependent';
  const v = withTarget[0]!;
  if (v.slice(0, last).some((x) => x === 0n)) return 'dependent';
  // Σ v_j s_j A_j + v_t s_t t = 0  ⇒  c_j = −v_j s_j / (v_t s_t).
  return v.slice(0, last).map((x, j) => new Fraction(-x * scales[j]!).div(new Fraction(v[last]! * scales[last]!)));
}

function vectorOf(reaction: KnownReaction): Map<string, Fraction> {
  return toVector(reaction.terms);
}

/** Subsets of `items` in order of size, smallest first (the empty set first). */
function* subsetsBySize<T>(items: readonly T[]): Generator<T[]> {
  for (let size = 0; size <= items.length; size++) yield* combinations(items, size, 0);
}

function* combinations<T>(items: readonly T[], size: number, start: number): Generator<T[]> {
  if (size === 0) {
    yield [];
    return;
  }
  for (let i = start; i <= items.length - size; i++)
    for (const rest of combinations(items, size - 1, i + 1)) yield [items[i]!, ...rest];
}

/**
 * Finds routes from known reactions to `target`, ranked: routes whose every input states its
 * uncertainty first, by standard uncertainty; then the others, by number of steps.
 */
export function findRoutes(
  network: HessNetwork,
  target: readonly SignedTerm[],
  inputs: ReadonlyMap<string, InputInfo>,
  options: RouteSearchOptions,
): RouteSearchResult {
  const run = routeSearch(network, target, inputs, options);
  for (;;) {
    const step = run.next();
    if (step.done) return step.value;
  }
}

/**
 * `findRoutes` in slices: after every slice of work it awaits `pause()`, so a server can answer
 * other requests while a long search runs (the time budget still bounds the whole search).
 */
export async function findRoutesAsync(
  network: HessNetwork,
  target: readonly SignedTerm[],
  inputs: ReadonlyMap<string, InputInfo>,
  options: RouteSearchOptions,
  pause: () => Promise<void>,
): Promise<RouteSearchResult> {
  const run = routeSearch(network, target, inputs, options);
  for (;;) {
    const step = run.next();
    if (step.done) return step.value;
    await pause();
  }
}

function* routeSearch(
  network: HessNetwork,
  target: readonly SignedTerm[],
  inputs: ReadonlyMap<string, InputInfo>,
  options: RouteSearchOptions,
): Generator<void, RouteSearchResult, void> {
  const targetVector = toVector(target);
  const vectors = new Map<number, Map<string, Fraction>>();
  const vectorAt = (index: number) => {
    let v = vectors.get(index);
    if (!v) {
      v = vectorOf(network.reactions[index]!);
      vectors.set(index, v);
    }
    return v;
  };
  const closable = (species: string) => network.formation.has(species);
  const uncertaintyRank = (index: number) => network.reactions[index]!.uncertainty ?? Number.POSITIVE_INFINITY;

  const routes = new Map<string, Route>();
  const visited = new Set<string>();
  const deadEnds = new Set<string>();
  let examined = 0;
  let stoppedBy: RouteSearchResult['stoppedBy'] = null;
  let rejectedMixedConventions = 0;

  const stop = (): boolean => {
    if (stoppedBy) return true;
    if (examined >= options.maxExamined) stoppedBy = 'examined';
    else if ((examined & 63) === 0 && options.outOfTime()) stoppedBy = 'time';
    return stoppedBy !== null;
  };

  const record = (chosen: number[], multipliers: Fraction[]) => {
    const remainder = new Map(targetVector);
    chosen.forEach((index, j) => {
      for (const [species, coefficient] of vectorAt(index)) {
        const value = (remainder.get(species) ?? new Fraction(0)).sub(coefficient.mul(multipliers[j]!));
        if (value.equals(0)) remainder.delete(species);
        else remainder.set(species, value);
      }
    });
    const steps: RouteStep[] = chosen.map((index, j) => {
      const reaction = network.reactions[index]!;
      return { reaction, multiplier: multipliers[j]!, deltaH: reaction.deltaH.mul(multipliers[j]!) };
    });
    // Whatever remains is closed by formation reactions; charge closed in the aqueous and gaseous
    // conventions must balance separately, or the route would mix the two ion conventions.
    let aqueousCharge = new Fraction(0);
    let gaseousCharge = new Fraction(0);
    for (const [species, amount] of [...remainder].sort(([a], [b]) => (a < b ? -1 : a > b ? 1 : 0))) {
      const index = network.formation.get(species);
      if (index === undefined) return; // cannot happen: open species cancel exactly
      const reaction = network.reactions[index]!;
      steps.push({ reaction, multiplier: amount, deltaH: reaction.deltaH.mul(amount) });
      const info = network.species.get(species);
      if (info && info.charge !== 0) {
        const charge = amount.mul(info.charge);
        if (info.phase === 'aq') aqueousCharge = aqueousCharge.add(charge);
        else gaseousCharge = gaseousCharge.add(charge);
      }
    }
    if (!aqueousCharge.equals(0) || !gaseousCharge.equals(0)) {
      rejectedMixedConventions++;
      return;
    }
    const signature = steps
      .map((s) => s.reaction.id)
      .sort()
      .join('|');
    if (routes.has(signature)) return;
    const deltaH = steps.reduce((sum, s) => sum.add(s.deltaH), new Fraction(0));
    const weights = routeWeights(steps);
    const { uncertainty, missing } = routeUncertainty(weights, inputs);
    routes.set(signature, { steps, deltaH, weights, uncertainty, missing });
  };

  // A generator so that a caller can pause between slices of work (see findRoutesAsync).
  function* search(chosen: number[], openTarget: ReadonlySet<string>): Generator<void, void, void> {
    if (stop()) return;
    if ((examined & 127) === 127) yield;
    const key = `${[...openTarget].sort().join(',')}#${[...chosen].sort((a, b) => a - b).join(',')}`;
    if (visited.has(key)) return;
    visited.add(key);
    examined++;
    // Species that must cancel exactly: open target species, and every species without a ΔfH°.
    const open = new Set<string>(openTarget);
    for (const species of targetVector.keys()) if (!closable(species)) open.add(species);
    for (const index of chosen) for (const species of vectorAt(index).keys()) if (!closable(species)) open.add(species);
    const rows = [...open];
    const columns = chosen.map(vectorAt);
    const solution = solveExact(rows, columns, targetVector);
    if (solution === 'dependent') return;
    if (solution) {
      record(chosen, solution);
      return;
    }
    if (chosen.length >= options.maxSteps) return;
    // Expand the species with the fewest ways to cancel among those that appear only once.
    const appearances = new Map<string, number>();
    for (const species of rows) {
      let count = targetVector.has(species) ? 1 : 0;
      for (const column of columns) if (column.has(species)) count++;
      appearances.set(species, count);
    }
    const candidatesOf = (species: string) =>
      (network.bySpecies.get(species) ?? []).filter((index) => !chosen.includes(index));
    const pick = (pool: string[]) =>
      pool
        .map((species) => ({ species, candidates: candidatesOf(species) }))
        .sort((a, b) => a.candidates.length - b.candidates.length || (a.species < b.species ? -1 : 1))[0];
    const lonely = rows.filter((species) => appearances.get(species) === 1);
    const next = pick(lonely.length > 0 ? lonely : rows);
    if (!next) return;
    if (next.candidates.length === 0) {
      deadEnds.add(next.species);
      return;
    }
    const ordered = [...next.candidates].sort((a, b) => uncertaintyRank(a) - uncertaintyRank(b) || a - b);
    for (const index of ordered) {
      yield* search([...chosen, index], openTarget);
      if (stoppedBy) return;
    }
  }

  // First every target species with a ΔfH° closed by it (the tabulated route), then with one,
  // two… of them derived through measured reactions instead: independent routes to compare.
  const closableTarget = [...targetVector.keys()].filter(closable).sort();
  for (const openTarget of subsetsBySize(closableTarget)) {
    yield* search([], new Set(openTarget));
    if (stoppedBy) break;
  }

  const ranked = [...routes.values()].sort(compareRoutes);
  const unreachable =
    ranked.length === 0 ? [...deadEnds].filter((s) => !closable(s) || targetVector.has(s)).sort() : [];
  return {
    routes: ranked.slice(0, options.maxRoutes),
    examined,
    found: ranked.length,
    stoppedBy,
    unreachable,
    rejectedMixedConventions,
  };
}

/** Complete routes first, by uncertainty; then incomplete ones, by fewer steps. */
export function compareRoutes(a: Route, b: Route): number {
  const aComplete = a.missing.length === 0;
  const bComplete = b.missing.length === 0;
  if (aComplete !== bComplete) return aComplete ? -1 : 1;
  if (aComplete) return a.uncertainty - b.uncertainty || a.steps.length - b.steps.length;
  return a.steps.length - b.steps.length || a.missing.length - b.missing.length;
}
