import type { BombInput, ConstantPressureInput } from '@shared/schemas/calorimetry';
import { COMBUSTION_PRODUCTS, type AuxiliaryLookup } from '../calc/calorimetry-calls';
import type { ServiceContext } from '../context';
import { sourceOf, sourceRef } from '../library/present';
import { selectedValue } from '../library/snapshot';
import { RawJson } from '../lib/raw-json';
import { snapshotFor } from './library.service';

/** Reduces a constant-pressure run in the calculation pool (stateless; nothing is stored). */
export async function reduceConstantPressure(ctx: ServiceContext, input: ConstantPressureInput): Promise<RawJson> {
  return new RawJson(await ctx.calc.run({ kind: 'constant-pressure', input }));
}

/**
 * Reduces bomb runs in the calculation pool. The library's selected ΔfH° of the combustion
 * products (with sources) are read here, on the request thread, from the cached snapshot, and
 * handed to the worker with the revision they belong to.
 */
export async function reduceBomb(ctx: ServiceContext, input: BombInput): Promise<RawJson> {
  const snapshot = await snapshotFor(ctx.library, input.revision);
  const auxiliary: AuxiliaryLookup[] = [];
  for (const key of COMBUSTION_PRODUCTS) {
    const species = snapshot.speciesByKey.get(key);
    const value = species ? selectedValue(snapshot, species.id, 'dfH298') : null;
    if (!value) continue;
    auxiliary.push({
      key,
      value: value.value,
      uncertainty: value.standardUncertainty,
      source: sourceRef(sourceOf(snapshot, value.sourceId)),
      provenance: value.provenance,
    });
  }
  return new RawJson(await ctx.calc.run({ kind: 'bomb', input, auxiliary, libraryRevision: snapshot.revision }));
}
