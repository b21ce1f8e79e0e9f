/**
 * Public API of the chemistry core: the equation language, the exact balancer, formatting,
 * molar masses and equation arithmetic. Everything here is pure (no I/O) and safe to run in the
 * browser, on the server and in worker threads.
 *
 * The core speaks its own model (`types.ts`): exact rationals (`Rat`) for coefficients and atom
 * counts, positions as data, reasons and warnings as data with words beside them. The API replies
 * are built from it only by the adapter in `balance-reply.ts` (`toBalanceReply`,
 * `toBalanceBatchReply`, and `balanceRequest` / `balanceBatchRequest` from request to reply).
 *
 * Conventions: energies are kJ per mole of reaction as written; ΔH < 0 means exothermic. Parse
 * errors throw `EquationParseError` with line/column (from 1), offset (from 0) and length; bad
 * balance requests throw `BalanceInputError` naming the field; inputs over a work limit throw
 * `WorkLimitError` (code `payload_too_large`) before the work is done.
 */
export { ChemistryError, EquationParseError, BalanceInputError, WorkLimitError } from './errors';
export type { ChemistryErrorCode } from './errors';
export type {
  Rat,
  Phase,
  Side,
  Composition,
  EnergyUnit,
  FormulaFormat,
  SourceSpan,
  ParsePosition,
  FormulaItem,
  FormulaPart,
  ChargeNotation,
  ParsedSpecies,
  WarningCode,
  ParseWarning,
  SpeciesTerm,
  EnthalpyValue,
  HeatTerm,
  EquationModel,
  ParsedEquation,
  BalanceStatus,
  ElementTotals,
  ImpossibleReason,
  Balancing,
} from './types';
export type { ChargeSigns, WorkLimitName } from './messages';

export { DEFAULT_WORK_LIMITS, MAX_NESTING, MAX_COUNT_DIGITS, resolveWorkLimits } from './limits';
export type { WorkLimits } from './limits';
export { parseEquation, parseFormula } from './parse';
export type { ParseOptions } from './parse';
export { balanceEquation, balanceEquationText } from './balance';
export type { BalanceOptions } from './balance';
export { balanceEquationLines, isEquationLine } from './batch';
export type { BatchLine, BalancedLine, RefusedLine, BatchOptions } from './batch';
export { toBalanceReply, toBalanceBatchReply, balanceRequest, balanceBatchRequest } from './balance-reply';
export { compositionMatrix, conserves } from './composition-matrix';
export type { CompositionMatrix } from './composition-matrix';
export { formatFormula, formatEquation, formatEnthalpy } from './format';
export { molarMass } from './molar-mass';
export type { MolarMass } from './molar-mass';
export { elementTotals, isBalanced } from './element-table';
export { reverseEquation, scaleEquation, readFactor } from './equation-ops';
export { energyUnits, toKilojoules, fromKilojoules, JOULES_PER_THERMOCHEMICAL_CALORIE } from './energy-units';
export { hillFormula, compositionOf } from './hill';
export { ELEMENT_SYMBOLS, isElementSymbol, atomicNumber, elementName } from './elements';
export { standardAtomicWeights, ATOMIC_WEIGHTS_SOURCE } from './atomic-weights';
export type { AtomicWeightEntry } from './atomic-weights';
export { rat, ratText, parseRational, ratToNumber, ratOfInteger, gcdBigInt, lcmBigInt, ONE, ZERO } from './rational';
