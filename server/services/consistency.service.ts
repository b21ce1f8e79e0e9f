import { consistencyFit, UndeterminedFitError, type ConsistencyMeasurement } from '@shared/chemistry/hess/index';
import type { ConsistencyInput, ConsistencyResult } from '@shared/schemas/derive';
import type { ServiceContext } from '../context';
import { AppError, errors } from '../errors';
import { libraryNetworkOf } from '../library/network';
import { selectedValue, type LibrarySnapshot } from '../library/snapshot';
import { snapshotFor } from './library.service';

/** Most measurements one fit takes (the fit is a dense solve on the request thread). */
export const MAX_CONSISTENCY_MEASUREMENTS = 2_000;

/**
 * The independent measured reactions of a snapshot that involve any of `fitted`, each with a
 * stated uncertainty, and the library values of the other species they hold (the measurements
 * a species missing a ΔfH° would need are left out, with the reason).
 */
export function measurementsInvolving(
  snapshot: LibrarySnapshot,
  fitted: ReadonlySet<string>,
): {
  measurements: ConsistencyMeasurement[];
  held: Map<string, { value: number; uncertainty: number | null }>;
  excluded: ConsistencyResult['excluded'];
} {
  const { network, excluded: networkExcluded } = libraryNetworkOf(snapshot);
  const held = new Map<string, { value: number; uncertainty: number | null }>();
  const measurements: ConsistencyMeasurement[] = [];
  const excluded: ConsistencyResult['excluded'] = [];
  for (const reaction of network.reactions) {
    if (reaction.kind !== 'measured') continue;
    if (!reaction.terms.some((t) => fitted.has(t.species))) continue;
    if (reaction.uncertainty === null || reaction.uncertainty <= 0) {
      excluded.push({ reaction: reaction.equation, reason: 'no stated uncertainty' });
      continue;
    }
    const missing = reaction.terms.filter((t) => {
      if (fitted.has(t.species) || held.has(t.species)) return false;
      const entry = snapshot.speciesByKey.get(t.species);
      const value = entry ? selectedValue(snapshot, entry.id, 'dfH298') : null;
      if (!value) return true;
      held.set(t.species, { value: value.value, uncertainty: value.standardUncertainty });
      return false;
    });
    if (missing.length > 0) {
      excluded.push({
        reaction: reaction.equation,
        reason: `${missing.map((t) => t.species).join(', ')} has no ΔfH° in the library and is not in the group`,
      });
      continue;
    }
    measurements.push({
      id: reaction.id,
      label: reaction.equation,
      terms: reaction.terms,
      deltaH: reaction.deltaH.valueOf(),
      uncertainty: reaction.uncertainty,
    });
  }
  for (const e of networkExcluded) excluded.push({ reaction: e.key, reason: e.reason });
  return { measurements, held, excluded };
}

/**
 * The curators' consistency check: a generalised least-squares fit of the picked species' ΔfH° to
 * every independent measured reaction that involves them, the other species held at their library
 * values (their uncertainties entering through the covariance of the measurements that share them).
 */
export async function checkConsistency(ctx: ServiceContext, input: ConsistencyInput): Promise<ConsistencyResult> {
  const snapshot = await snapshotFor(ctx.library, input.revision);
  const unknown = input.species.filter((key) => !snapshot.speciesByKey.has(key));
  if (unknown.length > 0)
    throw errors.validation(['body', 'species'], `Not in the library at this revision: ${unknown.join(', ')}.`);
  const fitted = new Set(input.species);
  const { measurements, held, excluded } = measurementsInvolving(snapshot, fitted);
  if (measurements.length > MAX_CONSISTENCY_MEASUREMENTS)
    throw new AppError(
      'payload_too_large',
      `The group is linked by ${measurements.length} measurements; a fit takes at most ${MAX_CONSISTENCY_MEASUREMENTS}. Pick fewer species.`,
      { limit: 'measurements', max: MAX_CONSISTENCY_MEASUREMENTS, found: measurements.length },
    );
  let fit;
  try {
    fit = consistencyFit([...fitted], measurements, held);
  } catch (error) {
    if (error instanceof UndeterminedFitError)
      throw new AppError(
        'unprocessable',
        `The independent measurements do not determine ${error.species.join(', ')}: add measurements that involve them, or leave them out of the group.`,
        { species: error.species },
      );
    throw error;
  }
  const byId = new Map(measurements.map((m) => [m.id, m]));
  return {
    fitted: fit.fitted.map((f) => {
      const entry = snapshot.speciesByKey.get(f.species)!;
      const value = selectedValue(snapshot, entry.id, 'dfH298');
      return {
        species: f.species,
        value: f.value,
        uncertainty: f.uncertainty,
        library: value ? { value: value.value, uncertainty: value.standardUncertainty } : null,
      };
    }),
    residuals: fit.residuals.map((r) => ({
      reaction: r.id,
      equation: byId.get(r.id)?.label ?? r.label,
      residual: r.residual,
      uncertainty: r.uncertainty,
      normalized: r.normalized,
      flagged: r.flagged,
    })),
    chiSquare: fit.chiSquare,
    degreesOfFreedom: fit.degreesOfFreedom,
    birgeRatio: fit.birgeRatio,
    excluded,
    heldWithoutUncertainty: fit.heldWithoutUncertainty,
    libraryRevision: snapshot.revision,
  };
}
