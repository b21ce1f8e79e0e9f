/**
 * Public API of the chemistry core: the equation language, the exact balancer, formatting,
 * molar masses and equation arithmetic. Everything here is pure (no I/O) and safe to run in the
 * browser and on the server.
 *
 * Conventions: coefficients are exact fractions written as text ("3", "1/2"); energies are kJ per
 * mole of reaction as written; ΔH < 0 means exothermic. Parse errors throw `EquationParseError`
 * with line/column (from 1) and offset (from 0); bad balance requests throw `BalanceInputError`.
 */
export { ChemistryError, EquationParseError, BalanceInputError } from './errors';
export type {
  Phase,
  Side,
  Composition,
  EnergyUnit,
  FormulaFormat,
  SourceSpan,
  FormulaItem,
  FormulaPart,
  ChargeNotation,
  ParsedSpecies,
  ParseWarning,
  SpeciesTerm,
  EnthalpyValue,
  HeatTerm,
  EquationModel,
  ParsedEquation,
} from './types';
export type { BalanceInput, BalanceResult, BalanceTerm, ImbalanceRow, ParseErrorDetails } from '../schemas/balance';

export { parseEquation, parseFormula } from './parse';
export { parseEquationBatch } from './batch';
export type { BatchLine, BatchLineResult, BatchLineError } from './batch';
export { balanceEquationText, balanceParsedEquation } from './balance';
export { formatFormula, formatEquation, formatEnthalpy } from './format';
export { molarMass } from './molar-mass';
export type { MolarMass } from './molar-mass';
export { elementBalanceTable, isBalanced } from './element-table';
export type { BalanceRow, CountedTerm } from './element-table';
export { reverseEquation, scaleEquation, equationFromBalanceResult } from './equation-ops';
export { energyUnits, toKilojoules, fromKilojoules, JOULES_PER_THERMOCHEMICAL_CALORIE } from './energy-units';
export { hillFormula, compositionOf } from './hill';
export { ELEMENT_SYMBOLS, isElementSymbol, atomicNumber } from './elements';
export { standardAtomicWeights, ATOMIC_WEIGHTS_SOURCE } from './atomic-weights';
export type { AtomicWeightEntry } from './atomic-weights';
