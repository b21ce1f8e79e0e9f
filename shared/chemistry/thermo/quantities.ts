import Fraction from 'fraction.js';
import { GAS_CONSTANT, REFERENCE_TEMPERATURE } from './constants';
import { ThermoInputError, type FieldPath } from './errors';
import { assertTemperature } from './species-model';

/*
 * From amounts of substance to heat: extent of reaction, limiting reactant, heat of a batch,
 * fuel heating values and an adiabatic-rise screening. Energies in kJ (kJ/mol of reaction as
 * written for ΔrH); ΔrH < 0 is exothermic and its heat is "released". Molar masses in g/mol come
 * from the caller (the equation core's `molarMass`).
 */

/** Mass units. 1 lb = 0.453 592 37 kg exactly (international yard and pound agreement, 1959). */
export type MassUnit = 'g' | 'kg' | 'lb';

/** kg per international avoirdupois pound, exact. */
export const KILOGRAMS_PER_POUND = 0.45359237;

/** Pressure units for gas volumes. 1 atm = 101 325 Pa and 1 bar = 10⁵ Pa, both exact. */
export type PressureUnit = 'Pa' | 'kPa' | 'bar' | 'atm';

const PASCALS: Readonly<Record<PressureUnit, number>> = { Pa: 1, kPa: 1000, bar: 1e5, atm: 101325 };
const GRAMS: Readonly<Record<MassUnit, number>> = { g: 1, kg: 1000, lb: KILOGRAMS_PER_POUND * 1000 };

/** An amount of one species as the user has it: a mass, an amount in mol, or a gas volume at T and p. */
export type QuantityInput =
  | { kind: 'mass'; value: number; unit: MassUnit; /** g/mol */ molarMass: number }
  | { kind: 'amount'; value: number; unit: 'mol' }
  | {
      kind: 'gas-volume';
      value: number;
      unit: 'L';
      /** K */ temperature: number;
      pressure: number;
      pressureUnit: PressureUnit;
    };

/** An amount of substance in mol, with how it was obtained in words. */
export interface AmountOfSubstance {
  /** mol */
  amount: number;
  basis: string;
}

function positive(value: number, path: FieldPath, what: string, allowZero = false): void {
  if (typeof value !== 'number' || !Number.isFinite(value) || value < 0 || (!allowZero && value === 0))
    throw new ThermoInputError(
      `${what} must be a finite number ${allowZero ? '≥ 0' : 'above 0'} (got ${String(value)})`,
      path,
    );
}

/** Mass in grams from a value in g, kg or lb (lb exact: 453.592 37 g). */
export function massInGrams(value: number, unit: MassUnit, path: FieldPath = ['mass']): number {
  positive(value, [...path, 'value'], 'mass', true);
  const factor = GRAMS[unit];
  if (factor === undefined)
    throw new ThermoInputError(`unknown mass unit '${String(unit)}' (use g, kg or lb)`, [...path, 'unit']);
  return value * factor;
}

/**
 * Amount of substance n in mol: mass / M; the amount itself; or for a gas volume the ideal-gas
 * law n = pV/(RT) (stated in `basis`; real gases deviate, most at high pressure and low T).
 * @throws ThermoInputError naming the field for negative, non-finite or zero-denominator input.
 */
export function amountOfSubstance(input: QuantityInput, path: FieldPath = ['quantity']): AmountOfSubstance {
  switch (input.kind) {
    case 'mass': {
      const grams = massInGrams(input.value, input.unit, path);
      positive(input.molarMass, [...path, 'molarMass'], 'molar mass');
      return { amount: grams / input.molarMass, basis: `n = m/M with M = ${input.molarMass} g/mol` };
    }
    case 'amount':
      positive(input.value, [...path, 'value'], 'amount', true);
      return { amount: input.value, basis: 'amount given in mol' };
    case 'gas-volume': {
      positive(input.value, [...path, 'value'], 'gas volume', true);
      assertTemperature(input.temperature, [...path, 'temperature']);
      positive(input.pressure, [...path, 'pressure'], 'pressure');
      const pascals = PASCALS[input.pressureUnit];
      if (pascals === undefined)
        throw new ThermoInputError(`unknown pressure unit '${String(input.pressureUnit)}' (use Pa, kPa, bar or atm)`, [
          ...path,
          'pressureUnit',
        ]);
      const amount = (input.pressure * pascals * input.value * 1e-3) / (GAS_CONSTANT * input.temperature);
      return {
        amount,
        basis: `ideal-gas law n = pV/(RT) at ${input.temperature} K and ${input.pressure} ${input.pressureUnit}`,
      };
    }
    default:
      throw new ThermoInputError(`unknown quantity kind '${String((input as { kind?: unknown }).kind)}'`, [
        ...path,
        'kind',
      ]);
  }
}

/** Ideal-gas molar volume RT/p in L/mol at T (K) and p (Pa); 24.79 L/mol at 298.15 K and 1 bar. */
export function idealGasMolarVolume(temperature: number, pressurePascals: number): number {
  assertTemperature(temperature);
  positive(pressurePascals, ['pressure'], 'pressure');
  return ((GAS_CONSTANT * temperature) / pressurePascals) * 1000;
}

function magnitude(coefficient: Fraction, path: FieldPath): number {
  if (!(coefficient instanceof Fraction) || coefficient.equals(0))
    throw new ThermoInputError('coefficient must be a non-zero exact fraction', path);
  return coefficient.abs().valueOf();
}

/** Extent of reaction ξ (mol of reaction as written) from an amount of one term, with the amount behind it. */
export interface ExtentOfReaction {
  /** ξ in mol, ≥ 0 */
  extent: number;
  /** n of the term in mol */
  amount: number;
  basis: string;
}

/**
 * ξ = n/|ν| for a term with coefficient ν (reactant or product, either sign): the reaction as
 * written run ξ times forward consumes or forms that amount.
 * @throws ThermoInputError for a zero coefficient or bad quantity.
 */
export function extentOfReaction(coefficient: Fraction, quantity: QuantityInput): ExtentOfReaction {
  const nu = magnitude(coefficient, ['coefficient']);
  const { amount, basis } = amountOfSubstance(quantity);
  return { extent: amount / nu, amount, basis };
}

/** A reactant with the amount available. */
export interface ReactantAmount {
  species: string;
  /** Coefficient in the equation; its magnitude is used. */
  coefficient: Fraction;
  /** mol available */
  amount: number;
}

/** What is used and left of one reactant when the reaction runs to the limiting extent. */
export interface ReactantBalance {
  species: string;
  coefficient: Fraction;
  /** mol */
  initial: number;
  consumed: number;
  remaining: number;
  limiting: boolean;
}

/** The limiting reactant(s), the extent they allow and what is left of the others. */
export interface LimitingReactantResult {
  /** ξ in mol of reaction as written */
  extent: number;
  /** Species that run out (several when they run out together). */
  limiting: string[];
  reactants: ReactantBalance[];
}

/**
 * With amounts of several reactants, the limiting one is the smallest nᵢ/|νᵢ|; the reaction
 * runs to that extent and the others keep nᵢ − |νᵢ|ξ (their excess). Reactants that run out
 * together (within 1 part in 10¹²) are all named.
 * @throws ThermoInputError for no reactants, a zero coefficient or a bad amount.
 */
export function limitingReactant(reactants: readonly ReactantAmount[]): LimitingReactantResult {
  if (!Array.isArray(reactants) || reactants.length === 0)
    throw new ThermoInputError('give the amount of at least one reactant', ['reactants']);
  const ratios = reactants.map((r, i) => {
    positive(r.amount, ['reactants', i, 'amount'], `amount of ${r.species}`, true);
    return r.amount / magnitude(r.coefficient, ['reactants', i, 'coefficient']);
  });
  const extent = Math.min(...ratios);
  const together = (x: number) => x - extent <= 1e-12 * Math.max(extent, Number.MIN_VALUE);
  const balances = reactants.map((r, i) => {
    const limiting = together(ratios[i]!);
    const consumed = limiting ? r.amount : r.coefficient.abs().valueOf() * extent;
    return {
      species: r.species,
      coefficient: r.coefficient,
      initial: r.amount,
      consumed,
      remaining: limiting ? 0 : r.amount - consumed,
      limiting,
    };
  });
  return { extent, limiting: balances.filter((b) => b.limiting).map((b) => b.species), reactants: balances };
}

/** Heat of running a reaction to extent ξ. */
export interface ReactionHeat {
  /** Q = ξ·ΔrH in kJ, with the sign of ΔrH (< 0: heat leaves the system). */
  heat: number;
  /** kJ, |Q| */
  magnitude: number;
  direction: 'released' | 'absorbed' | 'none';
  /** u(Q) = ξ·u(ΔrH) in kJ (ξ taken as exact), or null when ΔrH has no stated uncertainty. */
  standardUncertainty: number | null;
  /** e.g. "1234.5 kJ released" (for display; numbers above are for computation). */
  statement: string;
}

/**
 * Heat of a batch: Q = ξ·ΔrH (kJ, ξ in mol, ΔrH in kJ/mol of reaction as written), "released"
 * when ΔrH < 0 (exothermic), "absorbed" when ΔrH > 0.
 */
export function reactionHeat(
  extent: number,
  reactionEnthalpy: number,
  standardUncertainty: number | null = null,
): ReactionHeat {
  positive(extent, ['extent'], 'extent of reaction', true);
  if (typeof reactionEnthalpy !== 'number' || !Number.isFinite(reactionEnthalpy))
    throw new ThermoInputError('ΔrH must be a finite value in kJ/mol', ['reactionEnthalpy']);
  if (standardUncertainty !== null)
    positive(standardUncertainty, ['standardUncertainty'], 'standard uncertainty', true);
  const heat = extent * reactionEnthalpy;
  const direction = heat < 0 ? 'released' : heat > 0 ? 'absorbed' : 'none';
  return {
    heat,
    magnitude: Math.abs(heat),
    direction,
    standardUncertainty: standardUncertainty === null ? null : extent * standardUncertainty,
    statement: direction === 'none' ? 'no heat exchanged' : `${Number(Math.abs(heat).toPrecision(6))} kJ ${direction}`,
  };
}

/** Inputs of `fuelHeatingValues`, all at 298.15 K and p° = 1 bar. */
export interface FuelHeatingValueInput {
  /** ΔcH° of the combustion equation as written, kJ/mol of reaction (< 0). */
  combustionEnthalpy: number;
  /** Phase of the water in that equation: `l` (higher value basis) or `g` (lower value basis). */
  waterPhase: 'l' | 'g';
  /** Coefficient of the fuel in the equation (magnitude used). */
  fuelCoefficient: Fraction;
  /** Coefficient of water in the equation (magnitude used; 0 for a fuel without hydrogen). */
  waterCoefficient: Fraction;
  /** g/mol */
  fuelMolarMass: number;
  /** ΔvapH°(H2O, 298.15 K) = ΔfH°(H2O, g) − ΔfH°(H2O, l), kJ/mol, from the library. */
  waterVaporizationEnthalpy: number;
  /** u(ΔcH°) in kJ/mol of reaction, or null. */
  standardUncertainty?: number | null;
}

/** One heating value, positive for heat given off. */
export interface HeatingValue {
  label: string;
  /** kJ per mol of fuel */
  perMole: number;
  /** kJ per kg of fuel */
  perKilogram: number;
  /** u in kJ/mol of fuel, or null (the vaporization enthalpy taken as exact). */
  standardUncertaintyPerMole: number | null;
}

/** Higher and lower heating values of a fuel at 298.15 K. */
export interface FuelHeatingValues {
  /** Water as liquid (gross value). */
  higher: HeatingValue;
  /** Water as vapour (net value). */
  lower: HeatingValue;
  /** K */
  temperature: number;
}

/**
 * Heating values of a fuel, positive numbers for heat given off, per mol and per kg of fuel:
 * higher (gross: the water formed is liquid) and lower (net: the water stays vapour), at
 * 298.15 K: value per mol = −ΔcH°/|ν(fuel)|; the two differ by (|ν(H2O)|/|ν(fuel)|)·ΔvapH°(H2O).
 * @throws ThermoInputError for ΔcH° ≥ 0 or other bad input.
 */
export function fuelHeatingValues(input: FuelHeatingValueInput): FuelHeatingValues {
  const { combustionEnthalpy: dc, waterVaporizationEnthalpy: vap } = input;
  if (typeof dc !== 'number' || !Number.isFinite(dc) || dc >= 0)
    throw new ThermoInputError('the combustion enthalpy must be a finite negative value in kJ/mol (heat given off)', [
      'combustionEnthalpy',
    ]);
  positive(vap, ['waterVaporizationEnthalpy'], 'vaporization enthalpy of water');
  positive(input.fuelMolarMass, ['fuelMolarMass'], 'molar mass of the fuel');
  if (input.waterPhase !== 'l' && input.waterPhase !== 'g')
    throw new ThermoInputError("waterPhase must be 'l' or 'g'", ['waterPhase']);
  const nuFuel = magnitude(input.fuelCoefficient, ['fuelCoefficient']);
  if (!(input.waterCoefficient instanceof Fraction))
    throw new ThermoInputError('waterCoefficient must be an exact fraction', ['waterCoefficient']);
  const waterPerFuel = input.waterCoefficient.abs().valueOf() / nuFuel;
  const u = input.standardUncertainty ?? null;
  if (u !== null) positive(u, ['standardUncertainty'], 'standard uncertainty', true);
  const stated = -dc / nuFuel;
  const higher = input.waterPhase === 'l' ? stated : stated + waterPerFuel * vap;
  const lower = input.waterPhase === 'g' ? stated : stated - waterPerFuel * vap;
  const value = (label: string, perMole: number): HeatingValue => ({
    label,
    perMole,
    perKilogram: (perMole / input.fuelMolarMass) * 1000,
    standardUncertaintyPerMole: u === null ? null : u / nuFuel,
  });
  return {
    higher: value('higher heating value (gross; water formed as liquid)', higher),
    lower: value('lower heating value (net; water formed as vapour)', lower),
    temperature: REFERENCE_TEMPERATURE,
  };
}

/**
 * The cautions shown with every heat-at-scale result, in our own words (after the practice
 * summarised in CCPS, *Guidelines for Chemical Reactivity Evaluation*, 1995, and Stoessel,
 * *Thermal Safety of Chemical Processes*, 2008; from memory).
 */
export const BATCH_SCREENING_CAUTIONS: readonly string[] = [
  'Screening estimate only: it assumes the whole charge reacts and every joule stays in the batch, with no cooling and no losses.',
  'Thermodynamics tells how much heat the reaction can give off at most, not how fast; the rate, and the cooling it demands, must be measured.',
  'Not covered: gas or vapour given off and the pressure it builds, decomposition of products or intermediates, reagent that accumulates unreacted during a feed, and the cooling capacity per unit volume that shrinks as the vessel grows.',
  'Before any scale-up, confirm with reaction calorimetry and thermal-stability tests, and have people qualified in process safety review the process.',
  'Local codes, site procedures and licensed engineering practice take precedence over these figures.',
];

/** Inputs of the adiabatic-rise screening. */
export interface BatchScreeningInput {
  /** Q = ξ·ΔrH in kJ with the sign of ΔrH (e.g. `reactionHeat(...).heat`). */
  heat: number;
  /** Mass of the whole reacting batch. */
  batchMass: { value: number; unit: MassUnit };
  /** Specific heat capacity of the batch, J/(g K). */
  specificHeatCapacity: number;
}

/** Result of the adiabatic-rise screening; always flagged `screeningOnly`. */
export interface BatchScreeningResult {
  /** kJ, −Q: positive when heat is released. */
  heatReleased: number;
  /** Heat released per kg of batch, kJ/kg. */
  specificHeatReleased: number;
  /** ΔT_ad = heatReleased/(m·cp) in K; negative (a fall) for an endothermic reaction. */
  adiabaticTemperatureRise: number;
  screeningOnly: true;
  cautions: readonly string[];
}

/**
 * Adiabatic temperature rise of a batch, ΔT_ad = Q/(m·cp) with Q the heat released (kJ),
 * m the batch mass and cp its specific heat capacity (J/(g K)), all heat kept in the batch.
 * Screening only: the result carries the cautions of `BATCH_SCREENING_CAUTIONS`.
 * @throws ThermoInputError naming the field for a zero or negative mass or heat capacity.
 */
export function batchScreening(input: BatchScreeningInput): BatchScreeningResult {
  if (typeof input.heat !== 'number' || !Number.isFinite(input.heat))
    throw new ThermoInputError('heat must be a finite value in kJ', ['heat']);
  const grams = massInGrams(input.batchMass.value, input.batchMass.unit, ['batchMass']);
  if (grams === 0) throw new ThermoInputError('batch mass must be above 0', ['batchMass', 'value']);
  positive(input.specificHeatCapacity, ['specificHeatCapacity'], 'specific heat capacity');
  const heatReleased = -input.heat;
  return {
    heatReleased,
    specificHeatReleased: heatReleased / (grams / 1000),
    adiabaticTemperatureRise: (heatReleased * 1000) / (grams * input.specificHeatCapacity),
    screeningOnly: true,
    cautions: BATCH_SCREENING_CAUTIONS,
  };
}
