import Fraction from 'fraction.js';
import type { InputInfo, Route, RouteStep } from './types';

/**
 * A route's ΔH as a weighted sum of independent inputs: each step contributes its multiplier
 * times the inputs its ΔH rests on (itself, or the measurements a derived value came from).
 * Inputs used by several steps add up exactly, so one that cancels within a route drops out.
 */
export function routeWeights(steps: readonly RouteStep[]): Map<string, Fraction> {
  const weights = new Map<string, Fraction>();
  for (const step of steps) {
    const basis = step.reaction.basis ?? [{ input: step.reaction.id, weight: new Fraction(1) }];
    for (const { input, weight } of basis) {
      const sum = (weights.get(input) ?? new Fraction(0)).add(weight.mul(step.multiplier));
      if (sum.equals(0)) weights.delete(input);
      else weights.set(input, sum);
    }
  }
  return weights;
}

/**
 * Standard uncertainty of a weighted sum of independent inputs, u² = Σ (w·u)² (GUM, JCGM
 * 100:2008, 5.1.2, uncorrelated inputs). Inputs without a stated uncertainty are listed in
 * `missing` and left out of u, never counted as zero silently.
 */
export function routeUncertainty(
  weights: ReadonlyMap<string, Fraction>,
  inputs: ReadonlyMap<string, InputInfo>,
): { uncertainty: number; missing: string[] } {
  let variance = 0;
  const missing: string[] = [];
  for (const [input, weight] of weights) {
    const info = inputs.get(input);
    if (!info || info.uncertainty === null) {
      missing.push(info?.label ?? input);
      continue;
    }
    variance += (weight.valueOf() * info.uncertainty) ** 2;
  }
  return { uncertainty: Math.sqrt(variance), missing };
}

/**
 * Covariance matrix of several routes' ΔH from the inputs they share:
 * cov(a, b) = Σ_k w_ak w_bk u_k² (GUM 5.2, with independent inputs k). kJ²/mol².
 */
export function routeCovariance(routes: readonly Route[], inputs: ReadonlyMap<string, InputInfo>): number[][] {
  return routes.map((a) =>
    routes.map((b) => {
      let sum = 0;
      for (const [input, wa] of a.weights) {
        const wb = b.weights.get(input);
        const u = inputs.get(input)?.uncertainty;
        if (wb && u !== null && u !== undefined) sum += wa.valueOf() * wb.valueOf() * u * u;
      }
      return sum;
    }),
  );
}
