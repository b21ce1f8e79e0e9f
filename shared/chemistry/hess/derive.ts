import { combineRoutes, type RouteCombination } from './combine';
import { routeCovariance } from './covariance';
import type { HessNetwork } from './network';
import { findRoutes, findRoutesAsync } from './routes';
import type { InputInfo, Route, RouteSearchOptions, RouteSearchResult, SignedTerm } from './types';

/**
 * Derives ΔH of a target reaction by Hess's law: the routes, their agreement, and the headline
 * value — the generalised least-squares combination of the complete routes when they agree, the
 * best-ranked route's value when they do not (or when no route states every uncertainty).
 */
export interface Derivation {
  status: 'derived' | 'unreachable';
  /** kJ/mol, or null when unreachable. */
  deltaH: number | null;
  /** Standard uncertainty of `deltaH` from the stated inputs, kJ/mol. */
  uncertainty: number | null;
  /** How `deltaH` was obtained. */
  basis: 'combined' | 'best-route' | 'single-route' | null;
  /** Inputs without a stated uncertainty behind `deltaH` (empty: the uncertainty is complete). */
  missing: string[];
  routes: Route[];
  /** Per route (same order): within ±2σ of the combination; true when it was not compared. */
  agrees: boolean[];
  /** No disagreement among the complete routes at the 5 % level. */
  consistent: boolean;
  combination: RouteCombination | null;
  search: Omit<RouteSearchResult, 'routes'>;
}

export function deriveEnthalpy(
  network: HessNetwork,
  target: readonly SignedTerm[],
  inputs: ReadonlyMap<string, InputInfo>,
  options: RouteSearchOptions,
): Derivation {
  return assess(findRoutes(network, target, inputs, options), inputs);
}

/** `deriveEnthalpy` with the search in slices separated by `pause()` (see findRoutesAsync). */
export async function deriveEnthalpyAsync(
  network: HessNetwork,
  target: readonly SignedTerm[],
  inputs: ReadonlyMap<string, InputInfo>,
  options: RouteSearchOptions,
  pause: () => Promise<void>,
): Promise<Derivation> {
  return assess(await findRoutesAsync(network, target, inputs, options, pause), inputs);
}

/** Agreement, combination and headline value of the routes a search found. */
function assess(result: RouteSearchResult, inputs: ReadonlyMap<string, InputInfo>): Derivation {
  const { routes, ...search } = result;
  if (routes.length === 0) {
    return {
      status: 'unreachable',
      deltaH: null,
      uncertainty: null,
      basis: null,
      missing: [],
      routes,
      agrees: [],
      consistent: true,
      combination: null,
      search,
    };
  }
  const complete = routes.filter((r) => r.missing.length === 0);
  const best = routes[0]!;
  if (complete.length < 2 || complete.some((r) => r.uncertainty === 0)) {
    return {
      status: 'derived',
      deltaH: best.deltaH.valueOf(),
      uncertainty: best.uncertainty,
      basis: routes.length === 1 ? 'single-route' : 'best-route',
      missing: best.missing,
      routes,
      agrees: routes.map(() => true),
      consistent: true,
      combination: null,
      search,
    };
  }
  const combination = combineRoutes(
    complete.map((r) => r.deltaH.valueOf()),
    routeCovariance(complete, inputs),
  );
  const agreesOf = new Map(complete.map((r, i) => [r, combination.agrees[i]!]));
  const useCombined = combination.consistent;
  return {
    status: 'derived',
    deltaH: useCombined ? combination.value : best.deltaH.valueOf(),
    uncertainty: useCombined ? combination.uncertainty : best.uncertainty,
    basis: useCombined ? 'combined' : 'best-route',
    missing: useCombined ? [] : best.missing,
    routes,
    agrees: routes.map((r) => agreesOf.get(r) ?? true),
    consistent: combination.consistent,
    combination,
    search,
  };
}
