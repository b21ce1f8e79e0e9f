import { JOULES_PER_THERMOCHEMICAL_CALORIE } from '../energy-units';
import { ThermoInputError } from './errors';

/** Temperature units accepted at the edges; the core works in K. */
export type TemperatureUnit = 'K' | '°C' | '°F';

/** 0 °C in K (exact by definition of the Celsius scale). */
export const CELSIUS_ZERO_IN_KELVIN = 273.15;

/**
 * Converts a temperature to kelvin: T/K = t/°C + 273.15; T/K = (t/°F + 459.67) × 5/9 (both exact
 * by definition).
 * @throws ThermoInputError (field `temperature`) unless the result is finite and above 0 K.
 */
export function toKelvin(value: number, unit: TemperatureUnit): number {
  if (typeof value !== 'number' || !Number.isFinite(value))
    throw new ThermoInputError(`temperature must be a finite number (got ${String(value)})`, ['temperature']);
  let kelvin: number;
  switch (unit) {
    case 'K':
      kelvin = value;
      break;
    case '°C':
      kelvin = value + CELSIUS_ZERO_IN_KELVIN;
      break;
    case '°F':
      kelvin = ((value + 459.67) * 5) / 9;
      break;
    default:
      throw new ThermoInputError(`unknown temperature unit '${String(unit)}' (use K, °C or °F)`, ['unit']);
  }
  if (!(kelvin > 0))
    throw new ThermoInputError(`temperature must be above absolute zero (${value} ${unit} is ${kelvin} K)`, [
      'temperature',
    ]);
  return kelvin;
}

/**
 * Converts a temperature in K (finite, above 0 K) to `unit`.
 * @throws ThermoInputError (field `temperature`) otherwise.
 */
export function fromKelvin(kelvin: number, unit: TemperatureUnit): number {
  if (typeof kelvin !== 'number' || !Number.isFinite(kelvin) || kelvin <= 0)
    throw new ThermoInputError(`temperature must be a finite value above 0 K (got ${String(kelvin)})`, ['temperature']);
  switch (unit) {
    case 'K':
      return kelvin;
    case '°C':
      return kelvin - CELSIUS_ZERO_IN_KELVIN;
    case '°F':
      return (kelvin * 9) / 5 - 459.67;
    default:
      throw new ThermoInputError(`unknown temperature unit '${String(unit)}' (use K, °C or °F)`, ['unit']);
  }
}

function finite(value: number, field: string): void {
  if (typeof value !== 'number' || !Number.isFinite(value))
    throw new ThermoInputError(`${field} must be a finite number (got ${String(value)})`, [field]);
}

/** kJ/mol → kcal/mol with the thermochemical calorie (1 cal = 4.184 J exactly). Sign kept. */
export function kilojoulesToKilocalories(kilojoulesPerMole: number): number {
  finite(kilojoulesPerMole, 'value');
  return kilojoulesPerMole / JOULES_PER_THERMOCHEMICAL_CALORIE;
}

/** kcal/mol (thermochemical calorie, 4.184 J exactly) → kJ/mol. Sign kept. */
export function kilocaloriesToKilojoules(kilocaloriesPerMole: number): number {
  finite(kilocaloriesPerMole, 'value');
  return kilocaloriesPerMole * JOULES_PER_THERMOCHEMICAL_CALORIE;
}

function molarMassCheck(molarMass: number): void {
  if (typeof molarMass !== 'number' || !Number.isFinite(molarMass) || molarMass <= 0)
    throw new ThermoInputError(`molar mass must be a finite value above 0 g/mol (got ${String(molarMass)})`, [
      'molarMass',
    ]);
}

/**
 * kJ per mole of a species → kJ per kilogram of that species: value / M × 1000 g/kg, with the
 * molar mass M in g/mol (from the equation core's `molarMass`). Sign kept. For a reaction
 * enthalpy, pass the enthalpy per mole of the chosen species (ΔrH/|ν|).
 */
export function perMoleToPerKilogram(kilojoulesPerMole: number, molarMass: number): number {
  finite(kilojoulesPerMole, 'value');
  molarMassCheck(molarMass);
  return (kilojoulesPerMole / molarMass) * 1000;
}

/** kJ per kilogram of a species → kJ per mole of it (M in g/mol). Sign kept. */
export function perKilogramToPerMole(kilojoulesPerKilogram: number, molarMass: number): number {
  finite(kilojoulesPerKilogram, 'value');
  molarMassCheck(molarMass);
  return (kilojoulesPerKilogram * molarMass) / 1000;
}
