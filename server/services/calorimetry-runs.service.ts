import { and, desc, eq } from 'drizzle-orm';
import type {
  CalorimetryRun,
  CalorimetryRunInput,
  CalorimetryRunPatch,
  CalorimetryRunSummary,
} from '@shared/schemas/calorimetry-runs';
import type { BombResult, ConstantPressureResult } from '@shared/schemas/calorimetry';
import type { ActorContext, ServiceContext } from '../context';
import { calorimetryRuns } from '../db/tables/index';
import { AppError, errors } from '../errors';
import { reduceBomb, reduceConstantPressure } from './calorimetry.service';

type RunRow = typeof calorimetryRuns.$inferSelect;

function header(row: RunRow) {
  return {
    id: row.id,
    teamId: row.teamId,
    label: row.label,
    note: row.note,
    authorName: row.authorName,
    libraryRevision: row.libraryRevision,
    createdAt: row.createdAt.toISOString(),
    updatedAt: row.updatedAt.toISOString(),
  };
}

function toRun(row: RunRow): CalorimetryRun {
  return {
    ...header(row),
    kind: row.kind,
    inputs: row.inputs,
    result: row.result,
    evidence: row.evidence ?? null,
  } as CalorimetryRun;
}

function toSummary(row: RunRow): CalorimetryRunSummary {
  if (row.kind === 'bomb') {
    const result = row.result as unknown as BombResult;
    return { ...header(row), kind: 'bomb', equation: result.combustion.equation, deltaH: result.deltaCH };
  }
  const result = row.result as unknown as ConstantPressureResult;
  return { ...header(row), kind: 'constant-pressure', equation: result.equation, deltaH: result.deltaH };
}

/** The team's runs, most recently changed first, without their readings. */
export async function listCalorimetryRuns(
  ctx: ServiceContext,
  input: { teamId: string },
): Promise<{ runs: CalorimetryRunSummary[] }> {
  const rows = await ctx.db
    .select()
    .from(calorimetryRuns)
    .where(eq(calorimetryRuns.teamId, input.teamId))
    .orderBy(desc(calorimetryRuns.updatedAt));
  return { runs: rows.map(toSummary) };
}

export async function getCalorimetryRun(
  ctx: ServiceContext,
  input: { teamId: string; runId: string },
): Promise<CalorimetryRun> {
  const [row] = await ctx.db
    .select()
    .from(calorimetryRuns)
    .where(and(eq(calorimetryRuns.id, input.runId), eq(calorimetryRuns.teamId, input.teamId)));
  if (!row) throw errors.notFound('The run');
  return toRun(row);
}

/** Runs a reduction of a run's inputs; a field named in its error is re-addressed under body.inputs. */
async function underInputs<T>(reduce: () => Promise<T>): Promise<T> {
  try {
    return await reduce();
  } catch (error) {
    const issues = (error as AppError | undefined)?.details?.['issues'];
    if (!(error instanceof AppError) || !Array.isArray(issues)) throw error;
    const moved = (issues as { path: (string | number)[]; message: string }[]).map((i) => ({
      ...i,
      path: ['body', 'inputs', ...i.path.slice(1)],
    }));
    throw new AppError(error.code, `inputs.${error.message}`, { ...error.details, issues: moved });
  }
}

/**
 * Saves a run: its inputs are reduced again here (in the calculation pool, before any write), so
 * the stored result is the server's; bad inputs give the reduction's 400/422 and nothing is saved.
 */
export async function createCalorimetryRun(
  ctx: ActorContext,
  input: CalorimetryRunInput & { teamId: string },
): Promise<CalorimetryRun> {
  const reply = await underInputs(() =>
    input.kind === 'bomb' ? reduceBomb(ctx, input.inputs) : reduceConstantPressure(ctx, input.inputs),
  );
  const result = JSON.parse(reply.text) as Record<string, unknown>;
  const revision = typeof result['libraryRevision'] === 'number' ? result['libraryRevision'] : null;
  const [row] = await ctx.db
    .insert(calorimetryRuns)
    .values({
      teamId: input.teamId,
      authorId: ctx.actor.user.id,
      authorName: ctx.actor.user.displayName,
      kind: input.kind,
      label: input.label,
      note: input.note ?? null,
      inputs: input.inputs as Record<string, unknown>,
      evidence: input.evidence ?? null,
      result,
      libraryRevision: revision,
    })
    .returning();
  return toRun(row!);
}

/** Changes a run's label or note; the readings and the result stay as saved. */
export async function updateCalorimetryRun(
  ctx: ActorContext,
  input: CalorimetryRunPatch & { teamId: string; runId: string },
): Promise<CalorimetryRun> {
  const [row] = await ctx.db
    .update(calorimetryRuns)
    .set({
      ...(input.label !== undefined ? { label: input.label } : {}),
      ...(input.note !== undefined ? { note: input.note } : {}),
      updatedAt: new Date(),
    })
    .where(and(eq(calorimetryRuns.id, input.runId), eq(calorimetryRuns.teamId, input.teamId)))
    .returning();
  if (!row) throw errors.notFound('The run');
  return toRun(row);
}

export async function deleteCalorimetryRun(ctx: ActorContext, input: { teamId: string; runId: string }): Promise<void> {
  const [row] = await ctx.db
    .delete(calorimetryRuns)
    .where(and(eq(calorimetryRuns.id, input.runId), eq(calorimetryRuns.teamId, input.teamId)))
    .returning({ id: calorimetryRuns.id });
  if (!row) throw errors.notFound('The run');
}
