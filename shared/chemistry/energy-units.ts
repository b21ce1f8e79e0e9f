import type { EnergyUnit } from './types';

/**
 * Energy units the equation language accepts, as kJ per unit. The calorie is the
 * thermochemical calorie, 1 cal = 4.184 J exactly (IUPAC Green Book, 3rd ed., 2007, §7.2; from memory).
 */
export const JOULES_PER_THERMOCHEMICAL_CALORIE = 4.184;

/** kJ per unit. Internal energies are kJ (per mole of reaction as written). */
export const energyUnits: Readonly<Record<EnergyUnit, number>> = {
  kJ: 1,
  J: 1e-3,
  kcal: JOULES_PER_THERMOCHEMICAL_CALORIE,
  cal: JOULES_PER_THERMOCHEMICAL_CALORIE / 1000,
};

/** Converts a value in `unit` to kJ. */
export function toKilojoules(value: number, unit: EnergyUnit): number {
  return value * energyUnits[unit];
}

/** Converts a value in kJ to `unit`. */
export function fromKilojoules(valueKj: number, unit: EnergyUnit): number {
  return valueKj / energyUnits[unit];
}

/** True when `text` is one of the accepted unit names (case-sensitive: kJ, J, kcal, cal). */
export function isEnergyUnit(text: string): text is EnergyUnit {
  return text === 'kJ' || text === 'J' || text === 'kcal' || text === 'cal';
}
