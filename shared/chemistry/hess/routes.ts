import Fraction from 'fraction.js';
import { integerNullspace } from '../nullspace';
import { gcdNumber } from '../rational';
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

/**
 * A rational n/d on safe integers, normalised (d > 0, gcd(|n|, d) = 1): the fast path for the
 * remainder of a route, whose coefficients are almost always small. Any step that would leave
 * the safe-integer range gives null, and the caller redoes the work with fraction.js.
 */
type SmallRational = readonly [n: number, d: number];

function smallOf(value: Fraction): SmallRational | null {
  const n = Number(value.s * value.n);
  const d = Number(value.d);
  return Number.isSafeInteger(n) && Number.isSafeInteger(d) ? [n, d] : null;
}

/** a − b·c exactly, or null outside the safe-integer range. */
function subProduct(a: SmallRational, b: SmallRational, c: SmallRational): SmallRational | null {
  const pn = b[0] * c[0];
  const pd = b[1] * c[1];
  const left = a[0] * pd;
  const right = pn * a[1];
  const n = left - right;
  const d = a[1] * pd;
  if (
    !Number.isSafeInteger(pn) ||
    !Number.isSafeInteger(pd) ||
    !Number.isSafeInteger(left) ||
    !Number.isSafeInteger(right) ||
    !Number.isSafeInteger(n) ||
    !Number.isSafeInteger(d)
  )
    return null;
  if (n === 0) return [0, 1];
  const g = gcdNumber(n, d);
  return [n / g, d / g];
}

/** A closure amount as a fraction (the same value fraction.js would hold). */
const fractionOf = (value: SmallRational | Fraction): Fraction =>
  value instanceof Fraction ? value : new Fraction(value[0], value[1]);
/** Its nearest double, as `Fraction.valueOf` gives it (n and d are the same normalised pair). */
const numberOf = (value: SmallRational | Fraction): number =>
  value instanceof Fraction ? value.valueOf() : value[0] / value[1];

/**
 * By default the search stops, once a number of reactions per route is done, when it holds this
 * many times `maxRoutes` routes whose every uncertainty is stated (see `RouteSearchOptions`).
 */
export const ENOUGH_ROUTES_PER_ROUTE_ASKED = 4;

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
  // Species without a ΔfH°, per reaction and of the target, in their order: they must cancel.
  const openSpecies = new Map<number, string[]>();
  const openSpeciesAt = (index: number) => {
    let list = openSpecies.get(index);
    if (!list) {
      list = [...vectorAt(index).keys()].filter((species) => !closable(species));
      openSpecies.set(index, list);
    }
    return list;
  };
  const targetOpen = [...targetVector.keys()].filter((species) => !closable(species));
  const uncertaintyRank = (index: number) => network.reactions[index]!.uncertainty ?? Number.POSITIVE_INFINITY;

  const routes = new Map<string, FoundRoute>();
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

  /**
   * Keeps a route found at `chosen` with the solved multipliers, unless it mixes ion conventions
   * or was found before. Only what ranking needs is computed here (its uncertainty and missing
   * inputs); the route's steps, exact ΔH and weights are built for the routes that make the cut
   * (`materialize`), since a search may find thousands of routes and return a handful.
   */
  const smallVectors = new Map<number, Map<string, SmallRational> | null>();
  const smallVectorAt = (index: number) => {
    let v = smallVectors.get(index);
    if (v === undefined) {
      v = new Map<string, SmallRational>();
      for (const [species, coefficient] of vectorAt(index)) {
        const small = smallOf(coefficient);
        if (!small) {
          v = null;
          break;
        }
        v.set(species, small);
      }
      smallVectors.set(index, v);
    }
    return v;
  };
  const smallTarget = (() => {
    const v = new Map<string, SmallRational>();
    for (const [species, coefficient] of targetVector) {
      const small = smallOf(coefficient);
      if (!small) return null;
      v.set(species, small);
    }
    return v;
  })();
  /** target − Σ multiplier·reaction on safe integers, zeros dropped; null when it does not fit. */
  const smallRemainder = (chosen: number[], multipliers: Fraction[]): Map<string, SmallRational> | null => {
    if (!smallTarget) return null;
    const remainder = new Map(smallTarget);
    for (let j = 0; j < chosen.length; j++) {
      const vector = smallVectorAt(chosen[j]!);
      const multiplier = smallOf(multipliers[j]!);
      if (!vector || !multiplier) return null;
      for (const [species, coefficient] of vector) {
        const value = subProduct(remainder.get(species) ?? [0, 1], coefficient, multiplier);
        if (!value) return null;
        if (value[0] === 0) remainder.delete(species);
        else remainder.set(species, value);
      }
    }
    return remainder;
  };
  /** The same remainder with fraction.js (the general case). */
  const fractionRemainder = (chosen: number[], multipliers: Fraction[]): Map<string, Fraction> => {
    const remainder = new Map(targetVector);
    chosen.forEach((index, j) => {
      for (const [species, coefficient] of vectorAt(index)) {
        const value = (remainder.get(species) ?? new Fraction(0)).sub(coefficient.mul(multipliers[j]!));
        if (value.equals(0)) remainder.delete(species);
        else remainder.set(species, value);
      }
    });
    return remainder;
  };

  /**
   * Keeps a route found at `chosen` with the solved multipliers, unless it mixes ion conventions
   * or was found before. Only what ranking needs is computed here (its uncertainty and missing
   * inputs); the route's steps, exact ΔH and weights are built for the routes that make the cut
   * (`materialize`), since a search may find thousands of routes and return a handful.
   */
  const record = (chosen: number[], multipliers: Fraction[]) => {
    const remainder: Map<string, SmallRational | Fraction> =
      smallRemainder(chosen, multipliers) ?? fractionRemainder(chosen, multipliers);
    // Whatever remains is closed by formation reactions; charge closed in the aqueous and gaseous
    // conventions must balance separately, or the route would mix the two ion conventions.
    let aqueousCharge: Fraction | null = null;
    let gaseousCharge: Fraction | null = null;
    const closures: Closure[] = [];
    for (const [species, amount] of [...remainder].sort(([a], [b]) => (a < b ? -1 : a > b ? 1 : 0))) {
      const index = network.formation.get(species);
      if (index === undefined) return; // cannot happen: open species cancel exactly
      closures.push({ index, amount });
      const info = network.species.get(species);
      if (info && info.charge !== 0) {
        const charge = fractionOf(amount).mul(info.charge);
        if (info.phase === 'aq') aqueousCharge = charge.add(aqueousCharge ?? 0);
        else gaseousCharge = charge.add(gaseousCharge ?? 0);
      }
    }
    if ((aqueousCharge && !aqueousCharge.equals(0)) || (gaseousCharge && !gaseousCharge.equals(0))) {
      rejectedMixedConventions++;
      return;
    }
    const ids = chosen.map((index) => network.reactions[index]!.id);
    for (const closure of closures) ids.push(network.reactions[closure.index]!.id);
    const signature = ids.sort().join('|');
    if (routes.has(signature)) return;
    const found: FoundRoute = { chosen, multipliers, closures, uncertainty: 0, missing: [], stepCount: ids.length };
    if (chosen.some(hasBasis) || closures.some((c) => hasBasis(c.index))) {
      // Inputs may be shared between steps and cancel: the general weights.
      const { uncertainty, missing } = routeUncertainty(routeWeights(stepsOf(found)), inputs);
      found.uncertainty = uncertainty;
      found.missing = missing;
    } else {
      // Each step is its own input, once (ids are unique): the same sum as routeUncertainty over
      // routeWeights, in the same order, without building the weights.
      let variance = 0;
      const add = (index: number, multiplier: SmallRational | Fraction) => {
        const id = network.reactions[index]!.id;
        const info = inputs.get(id);
        if (!info || info.uncertainty === null) found.missing.push(info?.label ?? id);
        else variance += (numberOf(multiplier) * info.uncertainty) ** 2;
      };
      chosen.forEach((index, j) => add(index, multipliers[j]!));
      for (const closure of closures) add(closure.index, closure.amount);
      found.uncertainty = Math.sqrt(variance);
    }
    routes.set(signature, found);
  };
  const hasBasis = (index: number) => network.reactions[index]!.basis !== undefined;
  const stepsOf = (found: FoundRoute): RouteStep[] => {
    const steps: RouteStep[] = found.chosen.map((index, j) => {
      const reaction = network.reactions[index]!;
      return { reaction, multiplier: found.multipliers[j]!, deltaH: reaction.deltaH.mul(found.multipliers[j]!) };
    });
    for (const closure of found.closures) {
      const reaction = network.reactions[closure.index]!;
      const multiplier = fractionOf(closure.amount);
      steps.push({ reaction, multiplier, deltaH: reaction.deltaH.mul(multiplier) });
    }
    return steps;
  };
  const materialize = (found: FoundRoute): Route => {
    const steps = stepsOf(found);
    const deltaH = steps.reduce((sum, s) => sum.add(s.deltaH), new Fraction(0));
    const weights = routeWeights(steps);
    const { uncertainty, missing } = routeUncertainty(weights, inputs);
    return { steps, deltaH, weights, uncertainty, missing };
  };

  /** A combination examined and found open, with the reactions that may extend it (ranked). */
  interface Expandable {
    chosen: number[];
    openTarget: ReadonlySet<string>;
    openKey: string;
    candidates: number[];
  }

  /**
   * Examines one combination: records it when it adds up to the target; returns the reactions
   * that may extend it when it is still open and may grow, null otherwise.
   */
  const examine = (chosen: number[], openTarget: ReadonlySet<string>, openKey: string): number[] | null => {
    const key = `${openKey}#${[...chosen].sort((a, b) => a - b).join(',')}`;
    if (visited.has(key)) return null;
    visited.add(key);
    examined++;
    // Species that must cancel exactly: open target species, and every species without a ΔfH°.
    const open = new Set<string>(openTarget);
    for (const species of targetOpen) open.add(species);
    for (const index of chosen) for (const species of openSpeciesAt(index)) open.add(species);
    const rows = [...open];
    const columns = chosen.map(vectorAt);
    const solution = solveExact(rows, columns, targetVector);
    if (solution === 'dependent') return null;
    if (solution) {
      record(chosen, solution);
      return null;
    }
    if (chosen.length >= options.maxSteps) return null;
    // Expand the species with the fewest ways to cancel among those that appear only once.
    const appearances = new Map<string, number>();
    for (const species of rows) {
      let count = targetVector.has(species) ? 1 : 0;
      for (const column of columns) if (column.has(species)) count++;
      appearances.set(species, count);
    }
    // Counted without building the lists: only the expanded species' list is needed.
    const candidateCount = (species: string) => {
      const list = network.bySpecies.get(species) ?? [];
      let count = list.length;
      for (const index of list) if (chosen.includes(index)) count--;
      return count;
    };
    const lonely = rows.filter((species) => appearances.get(species) === 1);
    const pool = lonely.length > 0 ? lonely : rows;
    let nextSpecies: string | undefined;
    let fewest = Number.POSITIVE_INFINITY;
    for (const species of pool) {
      const count = candidateCount(species);
      if (count < fewest || (count === fewest && species < nextSpecies!)) {
        nextSpecies = species;
        fewest = count;
      }
    }
    if (nextSpecies === undefined) return null;
    if (fewest === 0) {
      deadEnds.add(nextSpecies);
      return null;
    }
    const candidates = (network.bySpecies.get(nextSpecies) ?? []).filter((index) => !chosen.includes(index));
    return candidates.sort((a, b) => uncertaintyRank(a) - uncertaintyRank(b) || a - b);
  };

  // Routes whose every input states its uncertainty rank first, so only they count towards
  // having enough routes: a route lacking an uncertainty never stops the search early.
  const enoughRoutes = options.enoughRoutes ?? ENOUGH_ROUTES_PER_ROUTE_ASKED * options.maxRoutes;
  const statedRoutes = () => {
    let count = 0;
    for (const found of routes.values()) if (found.missing.length === 0) count++;
    return count;
  };
  /** Every combination of up to this many measured or given reactions has been examined. */
  let completeUpTo = -1;

  // By number of measured or given reactions: every combination of k reactions is examined before
  // any of k + 1, so the short, well-determined routes are found first. The tree is the one a
  // depth-first walk explores (a combination's extensions depend only on its reactions), so the
  // routes of up to k reactions found here are exactly those a complete search finds.
  // Level 0: every target species with a ΔfH° closed by it (the tabulated route), then with one,
  // two… of them derived through measured reactions instead: independent routes to compare.
  const closableTarget = [...targetVector.keys()].filter(closable).sort();
  let level: Expandable[] = [];
  for (const openTarget of subsetsBySize(closableTarget)) {
    if (stop()) break;
    const set = new Set(openTarget);
    const openKey = [...openTarget].sort().join(',');
    const candidates = examine([], set, openKey);
    if (candidates) level.push({ chosen: [], openTarget: set, openKey, candidates });
  }
  if (!stoppedBy) completeUpTo = 0;
  for (let size = 1; !stoppedBy; size++) {
    if (level.length === 0) {
      completeUpTo = options.maxSteps; // nothing left to extend: the search is complete
      break;
    }
    // Enough routes of up to size − 1 reactions: stop before the longer ones, and say so.
    if (statedRoutes() >= enoughRoutes) {
      stoppedBy = 'routes';
      break;
    }
    const next: Expandable[] = [];
    for (const parent of level) {
      for (const index of parent.candidates) {
        if (stop()) break;
        if ((examined & 127) === 127) yield;
        const chosen = [...parent.chosen, index];
        const candidates = examine(chosen, parent.openTarget, parent.openKey);
        if (candidates) next.push({ chosen, openTarget: parent.openTarget, openKey: parent.openKey, candidates });
      }
      if (stoppedBy) break;
    }
    if (!stoppedBy) completeUpTo = size;
    level = next;
  }

  const ranked = [...routes.values()].sort(compareRanking);
  const unreachable =
    ranked.length === 0 ? [...deadEnds].filter((s) => !closable(s) || targetVector.has(s)).sort() : [];
  return {
    routes: ranked.slice(0, options.maxRoutes).map(materialize),
    examined,
    found: ranked.length,
    stoppedBy,
    completeUpTo,
    unreachable,
    rejectedMixedConventions,
  };
}

/** What ranking needs of a route. */
interface RankedRoute {
  uncertainty: number;
  missing: readonly string[];
  stepCount: number;
}

/** A route as the search keeps it until ranking (see `materialize`). */
interface FoundRoute extends RankedRoute {
  chosen: number[];
  multipliers: Fraction[];
  /** Formation reactions closing what remains, by species key. */
  closures: Closure[];
  missing: string[];
}

interface Closure {
  /** Index of the formation reaction. */
  index: number;
  amount: SmallRational | Fraction;
}

function compareRanking(a: RankedRoute, b: RankedRoute): number {
  const aComplete = a.missing.length === 0;
  const bComplete = b.missing.length === 0;
  if (aComplete !== bComplete) return aComplete ? -1 : 1;
  if (aComplete) return a.uncertainty - b.uncertainty || a.stepCount - b.stepCount;
  return a.stepCount - b.stepCount || a.missing.length - b.missing.length;
}

/** Complete routes first, by uncertainty; then incomplete ones, by fewer steps. */
export function compareRoutes(a: Route, b: Route): number {
  return compareRanking({ ...a, stepCount: a.steps.length }, { ...b, stepCount: b.steps.length });
}
