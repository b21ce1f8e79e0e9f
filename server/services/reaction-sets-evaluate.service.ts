import { ChemistryError } from '@shared/chemistry/index';
import { BATCH_SCREENING_CAUTIONS } from '@shared/chemistry/thermo/index';
import { itemLabel } from '@shared/reaction-sets/diff';
import type { BombResult, ConstantPressureResult } from '@shared/schemas/calorimetry';
import type { DeriveResult } from '@shared/schemas/derive';
import type { Source } from '@shared/schemas/library';
import type { ReactionEnthalpyResult } from '@shared/schemas/reaction-enthalpy';
import type { ItemResult, RevisionChanges, RouteChoice, SetEvaluation, SetItem } from '@shared/schemas/reaction-sets';
import type { ServiceContext } from '../context';
import type { ReactionSetRow } from '../db/tables/index';
import { AppError } from '../errors';
import { presentSource } from '../library/present';
import { selectedValue, type LibraryCache, type LibrarySnapshot } from '../library/snapshot';
import { reduceBomb, reduceConstantPressure } from './calorimetry.service';
import { deriveReactionEnthalpy } from './derive.service';
import { snapshotFor } from './library.service';
import { evaluateReactionEnthalpy, evaluateReactionHeat, temperatureOf } from './reaction-enthalpy.service';
import { findSet } from './reaction-sets.service';

/**
 * Evaluates a set's items at one library revision with the same services as the calculation
 * endpoints (reaction enthalpy, reaction heat, derive). Sets use the library and their own given
 * reactions only — not a team's derived values, which have no revisions — so a link shows the
 * same numbers to anyone, whenever it is opened. An item that cannot be evaluated carries the
 * error in words; the others still evaluate.
 */

type Energy = { value: number; uncertainty: number | null; unit: 'kJ/mol' };

/** The revision a set reads: its pinned one, or the newest. */
export async function revisionOf(
  ctx: ServiceContext,
  pinned: number | null,
): Promise<{ revision: number; latest: number }> {
  const latest = await ctx.library.latestRevision();
  if (latest === null) throw new AppError('unavailable', 'The library is empty: it has not been seeded yet.');
  return { revision: pinned ?? latest, latest };
}

/**
 * The library as one evaluation sees it: the newest revision read once, not once per item (the
 * snapshots themselves stay in the app's cache).
 */
function libraryAt(library: LibraryCache, latest: number): LibraryCache {
  const view = Object.create(library) as LibraryCache;
  view.latestRevision = () => Promise.resolve(latest);
  return view;
}

function itemError(error: unknown): { code: string; message: string } {
  if (error instanceof AppError || error instanceof ChemistryError) return { code: error.code, message: error.message };
  throw error;
}

const KJ_PER = { 'kJ/mol': 1, 'kcal/mol': 4.184, 'J/mol': 0.001 } as const;

/** Whether a derive route has exactly these steps (the same reactions with the same multipliers). */
function sameRoute(route: DeriveResult['routes'][number], choice: RouteChoice): boolean {
  const key = (s: { kind: string; id?: string | undefined; index?: number | undefined; multiplier: string }) =>
    `${s.kind}|${s.id ?? ''}|${s.index ?? ''}|${s.multiplier}`;
  const a = route.steps.map((s) => key({ ...s.ref, multiplier: s.multiplier })).sort();
  const b = choice.steps.map(key).sort();
  return a.length === b.length && a.every((k, i) => k === b[i]);
}

/** Library source ids the steps of a route rest on. */
function routeSourceIds(snapshot: LibrarySnapshot, route: DeriveResult['routes'][number]): string[] {
  const ids: string[] = [];
  for (const step of route.steps) {
    const { kind, id } = step.ref;
    if (!id) continue;
    if (kind === 'formation' || kind === 'derived') {
      const value = selectedValue(snapshot, id, 'dfH298');
      if (value) ids.push(value.sourceId);
    } else if (kind === 'measured') {
      const reaction = snapshot.reactions.find((r) => r.id === id);
      if (reaction) ids.push(reaction.sourceId);
    }
  }
  return ids;
}

interface Evaluated {
  result: ItemResult;
  /** Library source ids the result uses. */
  sourceIds: string[];
  /** Species whose ΔfH° used here was typed from memory. */
  fromMemory: string[];
}

function reactionValue(r: ReactionEnthalpyResult) {
  return {
    equation: r.equation,
    temperature: r.temperature.value,
    deltaH: r.deltaH,
    deltaH298: r.deltaH298,
    uncertaintyComplete: r.uncertaintyComplete,
    uncertaintyMissing: r.uncertaintyMissing,
    terms: r.terms.map((t) => ({
      key: t.key,
      name: t.name,
      coefficient: t.coefficient,
      side: t.side,
      deltaFH: t.deltaFH,
      source: t.source?.key ?? null,
      provenance: t.provenance,
    })),
    sources: r.sources.map((s) => s.key),
    warnings: r.warnings,
  };
}

const memoryKeys = (r: ReactionEnthalpyResult) => r.terms.filter((t) => t.provenance === 'memory').map((t) => t.key);

async function evaluateItem(ctx: ServiceContext, snapshot: LibrarySnapshot, item: SetItem): Promise<Evaluated> {
  const revision = snapshot.revision;
  const base = { itemId: item.id };
  try {
    switch (item.kind) {
      case 'reaction': {
        const r = await evaluateReactionEnthalpy(ctx, {
          equation: item.equation,
          revision,
          ...(item.temperature ? { temperature: item.temperature } : {}),
        });
        return {
          result: { ...base, kind: 'reaction', error: null, value: reactionValue(r) },
          sourceIds: r.sources.map((s) => s.id),
          fromMemory: memoryKeys(r),
        };
      }
      case 'given-reaction': {
        const factor = KJ_PER[item.deltaH.unit];
        const temperature = temperatureOf(item.temperature);
        let library: Energy | null = null;
        let libraryProblem: string | null = null;
        let sources: ReactionEnthalpyResult['sources'] = [];
        try {
          const r = await evaluateReactionEnthalpy(ctx, {
            equation: item.equation,
            revision,
            ...(item.temperature ? { temperature: item.temperature } : {}),
          });
          library = r.deltaH;
          sources = r.sources;
        } catch (error) {
          libraryProblem = itemError(error).message;
        }
        return {
          result: {
            ...base,
            kind: 'given-reaction',
            error: null,
            value: {
              equation: item.equation,
              given: {
                value: item.deltaH.value * factor,
                uncertainty: item.deltaH.uncertainty === undefined ? null : item.deltaH.uncertainty * factor,
                unit: 'kJ/mol',
              },
              temperature,
              source: item.source ?? null,
              library,
              libraryProblem,
              sources: sources.map((s) => s.key),
            },
          },
          sourceIds: sources.map((s) => s.id),
          fromMemory: [],
        };
      }
      case 'derivation': {
        const maxRoutes = Math.min(20, Math.max(item.maxRoutes ?? 5, (item.route?.index ?? 0) + 1));
        const d = await deriveReactionEnthalpy(ctx, {
          target: item.target,
          revision,
          maxRoutes,
          ...(item.using ? { using: item.using } : {}),
          ...(item.reactions ? { reactions: item.reactions } : {}),
        });
        const rank = item.route ? d.routes.findIndex((r) => sameRoute(r, item.route!)) : -1;
        const chosen = rank >= 0 ? d.routes[rank]! : null;
        const used = chosen
          ? [chosen]
          : d.basis === 'combined'
            ? d.routes.filter((r) => r.agrees && r.uncertaintyComplete)
            : d.routes.slice(0, 1);
        const sourceIds = used.flatMap((r) => routeSourceIds(snapshot, r));
        return {
          result: {
            ...base,
            kind: 'derivation',
            error: null,
            value: {
              target: d.target,
              status: d.status,
              deltaH: chosen ? chosen.deltaH : d.deltaH,
              basis: chosen ? 'chosen-route' : d.basis,
              headline: d.deltaH,
              route: chosen
                ? {
                    rank,
                    steps: chosen.steps.map((s) => ({
                      equation: s.equation,
                      multiplier: s.multiplier,
                      deltaH: s.deltaH,
                      kind: s.ref.kind,
                      source: s.source,
                    })),
                  }
                : null,
              routeMissing: (item.route ?? null) !== null && !chosen,
              routes: d.routes.length,
              consistent: d.consistent,
              uncertaintyComplete: chosen ? chosen.uncertaintyComplete : d.uncertaintyComplete,
              sources: [...new Set(sourceIds)].map((id) => snapshot.sources.get(id)?.key ?? id),
              warnings: [
                ...(item.route && !chosen
                  ? [
                      {
                        code: 'route_not_found',
                        message: `The chosen route is not among the routes at library revision ${revision}: the derivation's headline value is shown instead.`,
                      },
                    ]
                  : []),
                ...d.warnings,
              ],
            },
          },
          sourceIds,
          fromMemory: [],
        };
      }
      case 'quantities': {
        const input = {
          equation: item.equation,
          revision,
          ...(item.temperature ? { temperature: item.temperature } : {}),
        };
        const heat = await evaluateReactionHeat(ctx, {
          ...input,
          amounts: item.amounts,
          ...(item.batch ? { batch: item.batch } : {}),
        });
        // The heat reply names no sources; the enthalpy of the same equation does (and is cached work).
        const r = await evaluateReactionEnthalpy(ctx, input);
        const limiting = r.terms[heat.limitingTerm];
        return {
          result: {
            ...base,
            kind: 'quantities',
            error: null,
            value: {
              equation: heat.equation,
              temperature: heat.temperature.value,
              deltaH: heat.deltaH,
              extent: heat.extent.value,
              limiting: limiting?.key ?? `term ${heat.limitingTerm}`,
              heat: heat.heat,
              direction: heat.direction,
              adiabaticRise: heat.adiabaticRise?.value ?? null,
              cautions: heat.cautions,
              sources: r.sources.map((s) => s.key),
              warnings: heat.warnings,
            },
          },
          sourceIds: r.sources.map((s) => s.id),
          fromMemory: memoryKeys(r),
        };
      }
      case 'note':
        return { result: { ...base, kind: 'note', error: null, value: null }, sourceIds: [], fromMemory: [] };
      case 'calorimetry-run':
        return await evaluateCalorimetryRun(ctx, revision, item);
    }
  } catch (error) {
    return {
      result: { ...base, kind: item.kind, error: itemError(error), value: null } as ItemResult,
      sourceIds: [],
      fromMemory: [],
    };
  }
}

/**
 * A calorimetry run reduced again from its inputs (never from a stored result), a bomb run with
 * the library's product values at the set's revision whatever revision its inputs name.
 */
async function evaluateCalorimetryRun(
  ctx: ServiceContext,
  revision: number,
  item: Extract<SetItem, { kind: 'calorimetry-run' }>,
): Promise<Evaluated> {
  const base = { itemId: item.id, kind: 'calorimetry-run' as const, error: null };
  if (item.runKind === 'constant-pressure') {
    const reply = await reduceConstantPressure(ctx, item.inputs);
    const result = JSON.parse(reply.text) as ConstantPressureResult;
    return {
      result: {
        ...base,
        value: { runKind: 'constant-pressure', equation: result.equation, deltaH: result.deltaH, result, sources: [] },
      },
      sourceIds: [],
      fromMemory: [],
    };
  }
  const reply = await reduceBomb(ctx, { ...item.inputs, revision });
  const result = JSON.parse(reply.text) as BombResult;
  const used = result.deltaFH === null ? [] : result.auxiliary;
  return {
    result: {
      ...base,
      value: {
        runKind: 'bomb',
        equation: result.combustion.equation,
        deltaH: result.deltaCH,
        result,
        sources: [...new Set(used.map((a) => a.source.key))],
      },
    },
    sourceIds: [...new Set(used.map((a) => a.source.id))],
    fromMemory: used.filter((a) => a.provenance === 'memory').map((a) => a.key),
  };
}

/** The cautions every reader of a set sees, whatever it holds. */
function cautionsFor(evaluated: Evaluated[], revision: number): string[] {
  const cautions = [
    'Heat figures here are thermodynamic screening values: they give the heat a reaction can release, not how fast, and say nothing about gas evolution, decomposition or heat removal at scale.',
    ...BATCH_SCREENING_CAUTIONS.slice(3),
  ];
  // Calorimetry runs bring their own: high-pressure oxygen, runaway at scale, the maker's instructions.
  for (const e of evaluated)
    if (e.result.kind === 'calorimetry-run' && e.result.value)
      for (const caution of e.result.value.result.cautions) if (!cautions.includes(caution)) cautions.push(caution);
  const memory = [...new Set(evaluated.flatMap((e) => e.fromMemory))].sort();
  if (memory.length > 0)
    cautions.push(
      `ΔfH° of ${memory.join(', ')} (library revision ${revision}) ${memory.length === 1 ? 'was' : 'were'} typed from memory and await a curator's check against the source.`,
    );
  const incomplete = evaluated.filter((e) => {
    const v = e.result.value as { uncertaintyComplete?: boolean } | null;
    return v !== null && v.uncertaintyComplete === false;
  }).length;
  if (incomplete > 0)
    cautions.push(
      `${incomplete} result(s) have an incomplete uncertainty: some values used state none, so the ± shown covers the others only.`,
    );
  const failed = evaluated.filter((e) => e.result.error !== null).length;
  if (failed > 0) cautions.push(`${failed} item(s) could not be evaluated at revision ${revision}; each says why.`);
  return cautions;
}

/** Evaluates items at a revision (the caller has checked the revision exists). */
export async function evaluateItems(
  ctx: ServiceContext,
  input: { items: readonly SetItem[]; revision: number; latest: number; version: number },
): Promise<SetEvaluation> {
  // Library data only, whoever asks: no team values, nothing that depends on the caller.
  const libCtx: ServiceContext = { ...ctx, actor: null, library: libraryAt(ctx.library, input.latest) };
  const snapshot = await snapshotFor(libCtx.library, input.revision);
  const evaluated: Evaluated[] = [];
  for (const item of input.items) evaluated.push(await evaluateItem(libCtx, snapshot, item));
  const sourceIds = [...new Set(evaluated.flatMap((e) => e.sourceIds))];
  const sources: Source[] = sourceIds
    .map((id) => snapshot.sources.get(id))
    .filter((s) => s !== undefined)
    .map(presentSource)
    .sort((a, b) => a.key.localeCompare(b.key));
  return {
    version: input.version,
    libraryRevision: snapshot.revision,
    latestRevision: input.latest,
    evaluatedAt: new Date().toISOString(),
    results: evaluated.map((e) => e.result),
    sources,
    cautions: cautionsFor(evaluated, snapshot.revision),
  };
}

/**
 * Recent evaluations per app (keyed by its library cache), by set, version and revision: a set's
 * numbers at a revision never change, so a link opened again costs a lookup. Concurrent first
 * opens share one evaluation.
 */
const EVALUATION_CACHE_SIZE = 64;
const evaluationCaches = new WeakMap<LibraryCache, Map<string, Promise<SetEvaluation>>>();

/** The results of a stored set at its revision (pinned, or the newest), cached. */
export async function evaluationOfSet(
  ctx: ServiceContext,
  row: ReactionSetRow,
  at?: { revision: number; latest: number },
): Promise<SetEvaluation> {
  const { revision, latest } = at ?? (await revisionOf(ctx, row.pinnedRevision));
  let cache = evaluationCaches.get(ctx.library);
  if (!cache) evaluationCaches.set(ctx.library, (cache = new Map()));
  const key = `${row.id}|${row.version}|${revision}|${latest}`;
  let evaluation = cache.get(key);
  if (evaluation) {
    cache.delete(key);
    cache.set(key, evaluation);
    return evaluation;
  }
  evaluation = evaluateItems(ctx, { items: row.items, revision, latest, version: row.version });
  evaluation.catch(() => cache.delete(key));
  cache.set(key, evaluation);
  while (cache.size > EVALUATION_CACHE_SIZE) cache.delete(cache.keys().next().value as string);
  return evaluation;
}

/** GET /teams/:teamId/sets/:setId/results. */
export async function evaluateSet(
  ctx: ServiceContext,
  input: { teamId: string; setId: string },
): Promise<SetEvaluation> {
  return evaluationOfSet(ctx, await findSet(ctx.db, input.teamId, input.setId));
}

/** The value an item reports, for comparisons between revisions. */
function headlineOf(result: ItemResult): Energy | null {
  if (!result.value) return null;
  switch (result.kind) {
    case 'reaction':
    case 'quantities':
      return result.value.deltaH;
    case 'given-reaction':
      return result.value.library;
    case 'derivation':
      return result.value.deltaH;
    case 'calorimetry-run':
      // A bomb run's ΔfH° is what a revision can change (its ΔcH° rests on the readings alone).
      return result.value.runKind === 'bomb'
        ? (result.value.result.deltaFH ?? result.value.deltaH)
        : result.value.deltaH;
    default:
      return null;
  }
}

/**
 * What moving a pinned set to the newest revision would change: each item's value at the pinned
 * revision and at the newest, and the difference (after − before, kJ/mol).
 */
export async function revisionChanges(
  ctx: ServiceContext,
  input: { teamId: string; setId: string },
): Promise<RevisionChanges> {
  const row = await findSet(ctx.db, input.teamId, input.setId);
  const { revision, latest } = await revisionOf(ctx, row.pinnedRevision);
  const [before, after] = await Promise.all([
    evaluationOfSet(ctx, row, { revision, latest }),
    revision === latest ? null : evaluationOfSet(ctx, row, { revision: latest, latest }),
  ]);
  const byItem = new Map(row.items.map((i) => [i.id, i]));
  const afterById = new Map((after?.results ?? []).map((r) => [r.itemId, r]));
  const items = before.results
    .filter((r) => r.kind !== 'note')
    .map((b) => {
      const a = afterById.get(b.itemId) ?? b;
      const old = headlineOf(b);
      const next = headlineOf(a);
      return {
        itemId: b.itemId,
        kind: b.kind,
        label: itemLabel(byItem.get(b.itemId)!),
        before: old,
        after: next,
        difference: old && next ? next.value - old.value : null,
        problem: b.error?.message ?? a.error?.message ?? null,
      };
    });
  const changed = items.filter(
    (i) =>
      (i.before === null) !== (i.after === null) ||
      (i.difference !== null && (i.difference !== 0 || i.before?.uncertainty !== i.after?.uncertainty)),
  ).length;
  return { pinned: revision, latest, items, changed };
}
