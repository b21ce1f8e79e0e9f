import { CalorimetryInputError, type FieldPath } from './errors';
import type { Measured } from './measured';

/*
 * The units the calorimetry API accepts, each converted to the unit the reduction works in:
 * g, mL, g/mL, J/(g K), J/K, K, mol, J, J/g. Uncertainties convert with the same factor (a
 * temperature uncertainty in °F is 5/9 K; offsets do not apply to uncertainties).
 */

export type MassUnit = 'g' | 'kg' | 'mg';
export type VolumeUnit = 'mL' | 'L';
export type AmountUnit = 'mol' | 'mmol';
export type ConcentrationUnit = 'mol/L' | 'mmol/L';
export type EnergyUnit = 'J' | 'kJ' | 'cal';
export type MassicEnergyUnit = 'J/g' | 'kJ/g';
/** K, degrees Celsius (C) or degrees Fahrenheit (F). */
export type TemperatureScale = 'K' | 'C' | 'F';

const GRAMS: Record<MassUnit, number> = { g: 1, kg: 1000, mg: 1e-3 };
const MILLILITRES: Record<VolumeUnit, number> = { mL: 1, L: 1000 };
const MOLES: Record<AmountUnit, number> = { mol: 1, mmol: 1e-3 };
const MOL_PER_L: Record<ConcentrationUnit, number> = { 'mol/L': 1, 'mmol/L': 1e-3 };
/** 1 cal = 4.184 J exactly (thermochemical calorie). */
const JOULES: Record<EnergyUnit, number> = { J: 1, kJ: 1000, cal: 4.184 };
const JOULES_PER_GRAM: Record<MassicEnergyUnit, number> = { 'J/g': 1, 'kJ/g': 1000 };

/** A value as the API receives it: value, unit, optional standard uncertainty in that unit. */
export interface Stated<U extends string> {
  value: number;
  unit: U;
  uncertainty?: number | null | undefined;
}

function scaled<U extends string>(q: Stated<U>, table: Record<U, number>, path: FieldPath): Measured {
  const factor = table[q.unit];
  if (factor === undefined)
    throw new CalorimetryInputError(`Unknown unit '${String(q.unit)}' (use ${Object.keys(table).join(', ')}).`, [
      ...path,
      'unit',
    ]);
  return {
    value: q.value * factor,
    u: q.uncertainty === undefined || q.uncertainty === null ? null : q.uncertainty * factor,
  };
}

export const toGrams = (q: Stated<MassUnit>, path: FieldPath) => scaled(q, GRAMS, path);
export const toMillilitres = (q: Stated<VolumeUnit>, path: FieldPath) => scaled(q, MILLILITRES, path);
export const toMoles = (q: Stated<AmountUnit>, path: FieldPath) => scaled(q, MOLES, path);
export const toMolesPerLitre = (q: Stated<ConcentrationUnit>, path: FieldPath) => scaled(q, MOL_PER_L, path);
export const toJoules = (q: Stated<EnergyUnit>, path: FieldPath) => scaled(q, JOULES, path);
export const toJoulesPerGram = (q: Stated<MassicEnergyUnit>, path: FieldPath) => scaled(q, JOULES_PER_GRAM, path);

/** Kelvin per degree of the scale (for differences and uncertainties). */
export function degreeSize(scale: TemperatureScale): number {
  return scale === 'F' ? 5 / 9 : 1;
}

/**
 * A temperature on the scale in K: T/K = t/°C + 273.15; T/K = (t/°F + 459.67)·5/9 (exact by
 * definition). Uncertainty scaled by the degree size.
 * @throws CalorimetryInputError for a value at or below absolute zero, or an unknown scale.
 */
export function toKelvin(q: Stated<TemperatureScale>, path: FieldPath): Measured {
  let kelvin: number;
  switch (q.unit) {
    case 'K':
      kelvin = q.value;
      break;
    case 'C':
      kelvin = q.value + 273.15;
      break;
    case 'F':
      kelvin = ((q.value + 459.67) * 5) / 9;
      break;
    default:
      throw new CalorimetryInputError(`Unknown temperature unit '${String(q.unit)}' (use K, C or F).`, [
        ...path,
        'unit',
      ]);
  }
  if (!(Number.isFinite(kelvin) && kelvin > 0))
    throw new CalorimetryInputError(`${q.value} ${q.unit} is not a temperature above absolute zero.`, [
      ...path,
      'value',
    ]);
  return {
    value: kelvin,
    u: q.uncertainty === undefined || q.uncertainty === null ? null : q.uncertainty * degreeSize(q.unit),
  };
}
