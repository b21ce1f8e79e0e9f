import { checkMeasured, type Measured } from './measured';
import type { FieldPath } from './errors';
import { propagate } from './propagation';

/*
 * Auxiliary corrections of bomb calorimetry, each giving a mass in g or an energy in J.
 * Defaults below are editable inputs, not constants of nature; each says where it comes from.
 */

/** g/cm³: density of air in a laboratory, about 1.2 kg/m³ (common practice, no source). */
export const DEFAULT_AIR_DENSITY = 0.0012;
/** g/cm³: conventional density of the stainless-steel weights a balance is calibrated with (OIML R 111; from memory). */
export const DEFAULT_WEIGHTS_DENSITY = 8.0;
/** g/cm³: density of crystalline benzoic acid used in buoyancy corrections (from memory; editable). */
export const BENZOIC_ACID_DENSITY = 1.32;
/**
 * kJ/mol: energy released when 1 mol of dilute nitric acid forms in the bomb from N₂, O₂ and
 * water, subtracted for the HNO₃ titrated in the washings (about 59.7 kJ/mol; Hubbard, Scott &
 * Waddington 1956; from memory; editable).
 */
export const NITRIC_ACID_MOLAR_ENERGY = 59.7;
/**
 * The calibrant's certified massic energy of combustion under its certificate's bomb conditions:
 * NIST SRM 39j benzoic acid, −26.434 kJ/g (NIST Certificate of Analysis, SRM 39j; from memory —
 * cite your own certificate). It is the calibration value, not ΔcU° of benzoic acid.
 */
export const SRM_39J_MASSIC_ENERGY = -26.434;
export const SRM_39J_CITATION =
  'NIST Standard Reference Material 39j, Benzoic Acid (calorimetric standard), Certificate of Analysis (value from memory: check the certificate you hold)';

/**
 * Mass in vacuum from a weighing in air: m = m_air·(1 − ρ_air/ρ_weights)/(1 − ρ_air/ρ_sample)
 * (the buoyancy of the sample and of the balance's reference weights). Densities in g/cm³; the
 * uncertainty of the mass scales with the same factor (the densities' own uncertainties are
 * negligible at this level and left out).
 */
export function buoyancyCorrected(
  massInAir: Measured,
  densities: { sample: number; air: number; weights: number },
): Measured {
  const factor = (1 - densities.air / densities.weights) / (1 - densities.air / densities.sample);
  return { value: massInAir.value * factor, u: massInAir.u === null ? null : massInAir.u * factor };
}

/** J from the titrated nitric acid: n = c·V (mol/L × mL / 1000) times the molar energy (kJ/mol). */
export function nitricAcidEnergy(
  volume: Measured,
  concentration: Measured,
  molarEnergy: Measured,
  path: FieldPath,
): Measured {
  checkMeasured(volume, [...path, 'volume'], 'the titrant volume', 'non-negative');
  checkMeasured(concentration, [...path, 'concentration'], 'the titrant concentration');
  checkMeasured(molarEnergy, [...path, 'molarEnergy'], 'the molar energy of nitric acid formation');
  const p = propagate(
    [
      { id: 'v', label: 'titrant volume', unit: 'mL', ...volume },
      { id: 'c', label: 'titrant concentration', unit: 'mol/L', ...concentration },
      { id: 'e', label: 'molar energy', unit: 'kJ/mol', ...molarEnergy },
    ],
    (x) => x['v']! * x['c']! * x['e']!,
  );
  return { value: p.value, u: p.missing.length === 3 ? null : p.u };
}

/** J from the length of fuse wire burnt and its energy per length (J/cm). */
export function fuseEnergy(length: Measured, energyPerLength: Measured, path: FieldPath): Measured {
  checkMeasured(length, [...path, 'length'], 'the fuse length burnt', 'non-negative');
  checkMeasured(energyPerLength, [...path, 'energyPerLength'], 'the fuse energy per length');
  const p = propagate(
    [
      { id: 'l', label: 'length', unit: 'cm', ...length },
      { id: 'e', label: 'energy per length', unit: 'J/cm', ...energyPerLength },
    ],
    (x) => x['l']! * x['e']!,
  );
  return { value: p.value, u: p.missing.length === 2 ? null : p.u };
}
