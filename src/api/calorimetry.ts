import { z } from 'zod';
import {
  bombResultSchema,
  constantPressureResultSchema,
  type BombInput,
  type BombResult,
  type ConstantPressureInput,
  type ConstantPressureResult,
} from '@shared/schemas/calorimetry';
import {
  calorimetryRunListSchema,
  calorimetryRunSchema,
  type CalorimetryRun,
  type CalorimetryRunInput,
  type CalorimetryRunSummary,
} from '@shared/schemas/calorimetry-runs';
import type { AmendmentBody } from '@/lib/amendment-proposal';
import { http } from './http';

/** Reduces a constant-pressure run (public, nothing stored). */
export function reduceConstantPressureRun(input: ConstantPressureInput): Promise<ConstantPressureResult> {
  return http.post('/calorimetry/constant-pressure', input, { schema: constantPressureResultSchema });
}

/** Reduces bomb runs (public, nothing stored). */
export function reduceBombRuns(input: BombInput): Promise<BombResult> {
  return http.post('/calorimetry/bomb', input, { schema: bombResultSchema });
}

export async function listCalorimetryRuns(teamId: string): Promise<CalorimetryRunSummary[]> {
  return (await http.get(`/teams/${teamId}/calorimetry/runs`, { schema: calorimetryRunListSchema })).runs;
}

export function getCalorimetryRun(teamId: string, runId: string): Promise<CalorimetryRun> {
  return http.get(`/teams/${teamId}/calorimetry/runs/${runId}`, { schema: calorimetryRunSchema });
}

/** Saves a run with its readings; the server reduces it again and keeps its own result. */
export function saveCalorimetryRun(teamId: string, input: CalorimetryRunInput): Promise<CalorimetryRun> {
  return http.post(`/teams/${teamId}/calorimetry/runs`, input, { schema: calorimetryRunSchema });
}

export function deleteCalorimetryRun(teamId: string, runId: string): Promise<void> {
  return http.delete(`/teams/${teamId}/calorimetry/runs/${runId}`);
}

const openApiPathsSchema = z.object({ paths: z.record(z.string(), z.record(z.string(), z.unknown())) });

/**
 * Whether the server takes library amendments (POST /amendments): read from its own OpenAPI
 * document, so the "propose" action appears as soon as the curation routes are deployed.
 */
export async function amendmentsAvailable(): Promise<boolean> {
  const doc = await http.get('/openapi.json', { schema: openApiPathsSchema });
  const entry = Object.entries(doc.paths).find(([path]) => path.endsWith('/amendments'));
  return entry !== undefined && 'post' in entry[1];
}

/** Opens a library amendment carrying the run (curators review it); the draft's id for its evidence. */
export function proposeAmendment(body: AmendmentBody): Promise<{ id: string }> {
  return http.post('/amendments', body, { schema: z.looseObject({ id: z.string() }) });
}
