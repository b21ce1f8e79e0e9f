import {
  bombInputSchema,
  bombResultSchema,
  constantPressureInputSchema,
  constantPressureResultSchema,
  MAX_BOMB_RUNS,
  MAX_CALIBRATION_RUNS,
  MAX_SERIES_POINTS,
} from '@shared/schemas/calorimetry';
import {
  calorimetryRunInputSchema,
  calorimetryRunListSchema,
  calorimetryRunParamsSchema,
  calorimetryRunPatchSchema,
  calorimetryRunSchema,
} from '@shared/schemas/calorimetry-runs';
import { teamIdParamsSchema } from '@shared/schemas/common';
import { requireActor } from '../context';
import { MAX_CALORIMETRY_READINGS, measureCalorimetryWork } from '../calc/work-limits';
import type { AppConfig } from '../env';
import {
  createCalorimetryRun,
  deleteCalorimetryRun,
  getCalorimetryRun,
  listCalorimetryRuns,
  updateCalorimetryRun,
} from '../services/calorimetry-runs.service';
import { reduceBomb, reduceConstantPressure } from '../services/calorimetry.service';
import { defineRoute } from './registry';

const n = (value: number) => value.toLocaleString('en');

function limits(config: AppConfig): string[] {
  const { timeBudgetMs, requestsPerMinute } = config.calc;
  return [
    `At most ${n(MAX_CALORIMETRY_READINGS)} temperature readings in one request over all its series, checked before parsing: 413 payload_too_large with details {limit: "seriesReadings", max, found}.`,
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
    measureWork: measureCalorimetryWork,
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
    measureWork: measureCalorimetryWork,
    describeLimits: limits,
    request: { body: bombInputSchema },
    responses: { 200: bombResultSchema },
    handler: ({ ctx, body }) => reduceBomb(ctx, body),
  }),
];

/** A team's saved runs: viewers read, members write. */
export const calorimetryRunRoutes = [
  defineRoute({
    method: 'get',
    path: '/teams/:teamId/calorimetry/runs',
    summary: "The team's calorimeter runs, newest change first (without their readings)",
    tags: ['calorimetry'],
    access: { team: 'viewer' },
    request: { params: teamIdParamsSchema },
    responses: { 200: calorimetryRunListSchema },
    handler: ({ ctx, params }) => listCalorimetryRuns(ctx, params),
  }),
  defineRoute({
    method: 'post',
    path: '/teams/:teamId/calorimetry/runs',
    summary: 'Save a run: its readings and inputs, reduced again on the server',
    description:
      'The inputs are the body of POST /calorimetry/constant-pressure or /calorimetry/bomb; they are reduced again before saving (same 400/422 as those routes, nothing saved). The uploaded readings file may be kept with the run as evidence.',
    tags: ['calorimetry'],
    access: { team: 'member' },
    request: { params: teamIdParamsSchema, body: calorimetryRunInputSchema },
    responses: { 201: calorimetryRunSchema },
    handler: ({ ctx, params, body }) => createCalorimetryRun(requireActor(ctx), { ...body, ...params }),
  }),
  defineRoute({
    method: 'get',
    path: '/teams/:teamId/calorimetry/runs/:runId',
    summary: 'One run with its inputs, readings, evidence and result',
    tags: ['calorimetry'],
    access: { team: 'viewer' },
    request: { params: calorimetryRunParamsSchema },
    responses: { 200: calorimetryRunSchema },
    handler: ({ ctx, params }) => getCalorimetryRun(ctx, params),
  }),
  defineRoute({
    method: 'patch',
    path: '/teams/:teamId/calorimetry/runs/:runId',
    summary: "Change a run's label or note",
    tags: ['calorimetry'],
    access: { team: 'member' },
    request: { params: calorimetryRunParamsSchema, body: calorimetryRunPatchSchema },
    responses: { 200: calorimetryRunSchema },
    handler: ({ ctx, params, body }) => updateCalorimetryRun(requireActor(ctx), { ...body, ...params }),
  }),
  defineRoute({
    method: 'delete',
    path: '/teams/:teamId/calorimetry/runs/:runId',
    summary: 'Delete a run',
    tags: ['calorimetry'],
    access: { team: 'member' },
    request: { params: calorimetryRunParamsSchema },
    responses: { 204: null },
    handler: ({ ctx, params }) => deleteCalorimetryRun(requireActor(ctx), params),
  }),
];
