/**
 * Units the enthalpy panel shows a reaction energy in, and the temperature units of its input.
 * Pure, over the thermo core's conversions: kJ/mol of reaction as written is what the API sends;
 * kcal/mol uses the thermochemical calorie (4.184 J exactly); kJ per kg of a chosen species
 * divides by its |ν| and its molar mass.
 */
import { kilojoulesToKilocalories, toKelvin, fromKelvin, type TemperatureUnit } from '@shared/chemistry/thermo/index';

/** How a reaction energy is shown. */
export type EnergyBasis = { unit: 'kJ/mol' } | { unit: 'kcal/mol' } | { unit: 'kJ/kg'; species: SpeciesBasis };

/** The species a per-mass figure refers to. */
export interface SpeciesBasis {
  key: string;
  /** |ν| of the species in the equation as evaluated (from its fraction text). */
  coefficient: number;
  /** g/mol, from the library. */
  molarMass: number;
}

/** Temperature units of the inputs, as the API spells them. */
export type ApiTemperatureUnit = 'K' | 'C' | 'F';

export const temperatureUnitLabels: Record<ApiTemperatureUnit, TemperatureUnit> = { K: 'K', C: '°C', F: '°F' };

/** Reads "3/2", "-1", "0.5" as a number (coefficients travel as fraction text). */
export function fractionValue(text: string): number {
  const [n, d] = text.split('/');
  const value = d === undefined ? Number(n) : Number(n) / Number(d);
  if (!Number.isFinite(value)) throw new Error(`not a number: ${text}`);
  return value;
}

/** The factor that turns kJ per mole of reaction into the basis' unit. */
export function energyFactor(basis: EnergyBasis): number {
  switch (basis.unit) {
    case 'kJ/mol':
      return 1;
    case 'kcal/mol':
      return kilojoulesToKilocalories(1);
    case 'kJ/kg': {
      const { coefficient, molarMass } = basis.species;
      if (!(coefficient > 0) || !(molarMass > 0))
        throw new Error(`${basis.species.key}: a per-kg figure needs a positive coefficient and molar mass`);
      // kJ per mol of reaction → per mol of the species (÷ |ν|) → per g (÷ M) → per kg (× 1000).
      return 1000 / (Math.abs(coefficient) * molarMass);
    }
  }
}

/** A reaction energy in kJ/mol and its standard uncertainty, converted to the basis. Signs kept. */
export function convertEnergy(
  kilojoulesPerMole: number,
  uncertainty: number | null,
  basis: EnergyBasis,
): { value: number; uncertainty: number | null } {
  const factor = energyFactor(basis);
  return { value: kilojoulesPerMole * factor, uncertainty: uncertainty === null ? null : uncertainty * factor };
}

/** The unit text of a basis: "kJ/mol", "kcal/mol", "kJ per kg of C2H6O(l)". */
export function energyUnitText(basis: EnergyBasis): string {
  return basis.unit === 'kJ/kg' ? `kJ per kg of ${basis.species.key}` : basis.unit;
}

/** Temperature in K from a value typed in K, °C or °F; null when it is not a temperature above 0 K. */
export function kelvinFrom(value: number | null, unit: ApiTemperatureUnit): number | null {
  if (value === null || !Number.isFinite(value)) return null;
  try {
    return toKelvin(value, temperatureUnitLabels[unit]);
  } catch {
    return null;
  }
}

/** A temperature in K shown in the user's unit. */
export function kelvinTo(kelvin: number, unit: ApiTemperatureUnit): number {
  return fromKelvin(kelvin, temperatureUnitLabels[unit]);
}
