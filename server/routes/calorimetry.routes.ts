import {
  bombInputSchema,
  bombResultSchema,
  constantPressureInputSchema,
  constantPressureResultSchema,
  MAX_BOMB_RUNS,
  MAX_CALIBRATION_RUNS,
  MAX_SERIES_POINTS,
} from '@shared/schemas/calorimetry';
import type { AppConfig } from '../env';
import { reduceBomb, reduceConstantPressure } from '../services/calorimetry.service';
import { defineRoute } from './registry';

const n = (value: number) => value.toLocaleString('en');

function limits(config: AppConfig): string[] {
  const { timeBudgetMs, requestsPerMinute } = config.calc;
  return [
    `At most ${n(MAX_SERIES_POINTS)} readings in one series, ${n(MAX_BOMB_RUNS)} sample or calibration runs and ${n(MAX_CALIBRATION_RUNS)} calibration runs of a constant-pressure calorimeter (400 validation_failed naming the field); the request body is at most 1 MB.`,
    `The reduction runs off the request thread within ${n(timeBudgetMs)} ms, waiting included (CALC_TIME_BUDGET_MS): past it, or with the queue full, 503 unavailable with Retry-After.`,
    `Per network address: ${n(requestsPerMinute)} requests a minute (CALC_RATE_LIMIT_PER_MINUTE), shared with the other calculations: 429 with Retry-After.`,
  ];
}

/** Reductions of calorimeter readings: public and stateless, like the other calculations. */
export const calorimetryRoutes = [
  defineRoute({
    method: 'post',
    path: '/calorimetry/constant-pressure',
    summary: 'Reduce a constant-pressure (solution) calorimeter run to q and ΔH per mole of reaction as written',
    description:
      'q in kJ taken up by the solution and the calorimeter (> 0 for a rise); ΔH = −q/ξ in kJ/mol with ξ = n/|ν| of the limiting reactant (term index from 0 in the equation as written). Temperatures as initial and final readings, or a time–temperature series corrected for drift (Dickinson or Regnault–Pfaundler). Standard uncertainties (k = 1) propagated from the stated ones, with the contribution of each input. The result is at the run’s concentrations, not at infinite dilution. Each bad field gives 400 validation_failed with its path.',
    tags: ['calculations', 'calorimetry'],
    access: 'public',
    rateLimit: 'calc',
    describeLimits: limits,
    request: { body: constantPressureInputSchema },
    responses: { 200: constantPressureResultSchema },
    handler: ({ ctx, body }) => reduceConstantPressure(ctx, body),
  }),
  defineRoute({
    method: 'post',
    path: '/calorimetry/bomb',
    summary: 'Reduce bomb (constant-volume) combustion runs to ΔcU, ΔcH° and ΔfH° of the sample',
    description:
      'Energy equivalent typed or from calibration runs with the calibrant’s certificate; fuse, nitric-acid and buoyancy corrections; massic energy in J/g, ΔcU and ΔcH° = ΔcU + Δn(gas)RT in kJ/mol of sample; ΔfH° of the sample by Hess’s law from the library’s selected ΔfH° of CO2(g), H2O(l) (N2(g), SO2(g) or H2SO4(aq) as needed), with their sources and the library revision. Standard-state (Washburn) corrections are applied only when supplied.',
    tags: ['calculations', 'calorimetry'],
    access: 'public',
    rateLimit: 'calc',
    describeLimits: limits,
    request: { body: bombInputSchema },
    responses: { 200: bombResultSchema },
    handler: ({ ctx, body }) => reduceBomb(ctx, body),
  }),
];
