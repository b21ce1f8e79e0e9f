import type Fraction from 'fraction.js';
import { CalorimetryInputError } from './errors';
import { checkMeasured, type Measured } from './measured';
import { propagate, type ModelInput, type Propagation } from './propagation';

/*
 * A constant-pressure run (solution, neutralisation, mixing, dilution): the heat taken up by the
 * solution and the calorimeter, q = (m·c + C)·ΔT, and the enthalpy per mole of reaction as
 * written, ΔH = −q/ξ, ξ = n/|ν| of the limiting reactant.
 *
 * Units: m in g, c in J/(g K), C in J/K, ΔT in K, q in kJ, n and ξ in mol, ΔH in kJ/mol.
 * Sign: q > 0 when the solution and calorimeter warm; the reaction then releases that heat, so
 * ΔH < 0 (exothermic). A fall in temperature gives q < 0 and ΔH > 0 (endothermic).
 * The result is the enthalpy change at the run's temperature and concentrations, not ΔrH° at
 * infinite dilution (the standard state of aqueous solutes): enthalpies of dilution separate them.
 */

/** The solution in the calorimeter: weighed, or measured by volume with its density. */
export type SolutionQuantity =
  | { kind: 'mass'; /** g */ mass: Measured }
  | { kind: 'volume'; /** mL */ volume: Measured; /** g/mL */ density: Measured };

/** The amount of the limiting reactant: in mol, as a mass with its molar mass, or as c·V of a solution. */
export type LimitingQuantity =
  | { kind: 'amount'; /** mol */ amount: Measured }
  | { kind: 'mass'; /** g */ mass: Measured; /** g/mol */ molarMass: Measured }
  | { kind: 'solution'; /** mol/L */ concentration: Measured; /** mL */ volume: Measured };

export interface ConstantPressureRun {
  solution: SolutionQuantity;
  /** J/(g K) */
  specificHeat: Measured;
  /** J/K: the calorimeter itself (vessel, stirrer, thermometer), without its contents. */
  calorimeterHeatCapacity: Measured;
  /** K: the corrected temperature change (final − initial). */
  deltaT: Measured;
  limiting: {
    /** The limiting reactant's coefficient in the balanced equation (its magnitude is used). */
    coefficient: Fraction;
    /** Its name for the budget, e.g. "HCl(aq)". */
    species: string;
    quantity: LimitingQuantity;
  };
}

/** Each result of the run, with its propagated uncertainty and budget over the same inputs. */
export interface ConstantPressureReduction {
  /** g */
  solutionMass: Propagation;
  /** J/K: m·c + C, what absorbs the heat. */
  heatCapacity: Propagation;
  /** kJ: heat taken up by the solution and the calorimeter (> 0 for a rise). */
  q: Propagation;
  /** mol of the limiting reactant. */
  amount: Propagation;
  /** mol of reaction as written. */
  extent: Propagation;
  /** kJ per mole of reaction as written (< 0 for a rise). */
  deltaH: Propagation;
}

type X = Readonly<Record<string, number>>;

/** The model's inputs with their request paths as ids, in the order of the form. */
function inputsOf(run: ConstantPressureRun): ModelInput[] {
  const inputs: ModelInput[] = [];
  const add = (id: string, label: string, q: Measured, unit: string) => inputs.push({ id, label, unit, ...q });
  if (run.solution.kind === 'mass') add('solution.mass', 'Mass of the solution', run.solution.mass, 'g');
  else {
    add('solution.volume', 'Volume of the solution', run.solution.volume, 'mL');
    add('solution.density', 'Density of the solution', run.solution.density, 'g/mL');
  }
  add('specificHeat', 'Specific heat of the solution', run.specificHeat, 'J/(g K)');
  add('calorimeterHeatCapacity', 'Heat capacity of the calorimeter', run.calorimeterHeatCapacity, 'J/K');
  add('deltaT', 'Corrected temperature change', run.deltaT, 'K');
  const q = run.limiting.quantity;
  const who = run.limiting.species;
  if (q.kind === 'amount') add('reaction.limiting.amount', `Amount of ${who}`, q.amount, 'mol');
  else if (q.kind === 'mass') {
    add('reaction.limiting.amount', `Mass of ${who}`, q.mass, 'g');
    add('reaction.limiting.molarMass', `Molar mass of ${who}`, q.molarMass, 'g/mol');
  } else {
    add('reaction.limiting.concentration', `Concentration of ${who}`, q.concentration, 'mol/L');
    add('reaction.limiting.volume', `Volume of the ${who} solution`, q.volume, 'mL');
  }
  return inputs;
}

function checkRun(run: ConstantPressureRun): void {
  const s = run.solution;
  if (s.kind === 'mass') checkMeasured(s.mass, ['solution', 'mass'], 'the mass of the solution');
  else {
    checkMeasured(s.volume, ['solution', 'volume'], 'the volume of the solution');
    checkMeasured(s.density, ['solution', 'density'], 'the density of the solution');
  }
  checkMeasured(run.specificHeat, ['specificHeat'], 'the specific heat');
  checkMeasured(run.calorimeterHeatCapacity, ['calorimeterHeatCapacity'], "the calorimeter's heat capacity", 'finite');
  checkMeasured(run.deltaT, ['temperature'], 'the temperature change', 'finite');
  const path = ['reaction', 'limiting'];
  const q = run.limiting.quantity;
  if (q.kind === 'amount') checkMeasured(q.amount, [...path, 'amount'], 'the amount of the limiting reactant');
  else if (q.kind === 'mass') {
    checkMeasured(q.mass, [...path, 'amount'], 'the mass of the limiting reactant');
    checkMeasured(q.molarMass, [...path, 'molarMass'], 'the molar mass');
  } else {
    checkMeasured(q.concentration, [...path, 'concentration'], 'the concentration of the limiting reactant');
    checkMeasured(q.volume, [...path, 'volume'], 'the volume of the limiting reactant solution');
  }
  if (run.limiting.coefficient.equals(0))
    throw new CalorimetryInputError('The limiting reactant has a zero coefficient.', [...path, 'term']);
}

/**
 * Reduces one constant-pressure run: m (from the mass, or V·ρ), C_total = m·c + C,
 * q = C_total·ΔT/1000, n of the limiting reactant (n, m/M or c·V/1000), ξ = n/|ν| and
 * ΔH = −q/ξ, each with its uncertainty propagated from the stated inputs (independent; GUM 5.1.2)
 * and the contribution of each input.
 * @throws CalorimetryInputError naming the field for a non-positive mass, volume, density, specific
 * heat or amount, a non-finite ΔT or a zero temperature change.
 */
export function reduceConstantPressureRun(run: ConstantPressureRun): ConstantPressureReduction {
  checkRun(run);
  if (run.deltaT.value === 0)
    throw new CalorimetryInputError(
      'The temperature did not change, so no heat can be measured.',
      ['temperature'],
      'unprocessable',
    );
  const nu = run.limiting.coefficient.abs().valueOf();
  const mass = (x: X) =>
    run.solution.kind === 'mass' ? x['solution.mass']! : x['solution.volume']! * x['solution.density']!;
  const heatCapacity = (x: X) => mass(x) * x['specificHeat']! + x['calorimeterHeatCapacity']!;
  const q = (x: X) => (heatCapacity(x) * x['deltaT']!) / 1000;
  const amount = (x: X) => {
    switch (run.limiting.quantity.kind) {
      case 'amount':
        return x['reaction.limiting.amount']!;
      case 'mass':
        return x['reaction.limiting.amount']! / x['reaction.limiting.molarMass']!;
      case 'solution':
        return (x['reaction.limiting.concentration']! * x['reaction.limiting.volume']!) / 1000;
    }
  };
  const extent = (x: X) => amount(x) / nu;
  const inputs = inputsOf(run);
  return {
    solutionMass: propagate(inputs, mass),
    heatCapacity: propagate(inputs, heatCapacity),
    q: propagate(inputs, q),
    amount: propagate(inputs, amount),
    extent: propagate(inputs, extent),
    deltaH: propagate(inputs, (x) => -q(x) / extent(x)),
  };
}
