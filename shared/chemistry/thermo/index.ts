/**
 * Public API of the thermochemistry core: heat-capacity models (NASA-7, NASA-9, Shomate, Cp
 * tables, constant Cp) with their phase transitions, Kirchhoff's law for reactions, stated →
 * standard uncertainties, unit conversions and batch quantities. Pure (no I/O); runs in the
 * browser and on the server.
 *
 * Conventions: T in K; Cp° and S° in J/(mol K); H° and ΔrH° in kJ/mol (of reaction as written);
 * ΔrH° < 0 exothermic; standard pressure p° = 1 bar; reference temperature 298.15 K; H° on the
 * formation scale has elements in their reference states at H°(298.15 K) = 0.
 */
export { GAS_CONSTANT, REFERENCE_TEMPERATURE, TOLERATED_RANGE_START, JOINT_JUMP_THRESHOLD } from './constants';
export type {
  Nasa7Model,
  Nasa9Model,
  ShomateModel,
  CpTableModel,
  ConstantCpModel,
  HeatCapacityModel,
  HeatCapacityModelKind,
  ThermoScale,
  StatedTransition,
  ThermoForm,
  SpeciesThermoModel,
  ValidRange,
} from './types';
export { ThermoModelError, ThermoInputError, TemperatureOutOfRangeError, ReactionThermoDataError } from './errors';
export type { FieldPath, ThermoModelIssue, OutOfRangeEntry, ReactionDataProblem } from './errors';
export { thermoModelIssues, assertThermoModel, FORMATION_SCALE_KINDS } from './model-check';
export {
  prepareThermoModel,
  isPreparedThermoModel,
  assertTemperature,
  validRange,
  coversTemperature,
  formAt,
  heatCapacity,
  absoluteEnthalpy,
  absoluteEntropy,
  enthalpyChange,
  enthalpyIncrement,
  entropyChange,
  entropy,
  phaseTransitions,
  discontinuousJoints,
  crossingsBetween,
} from './species-model';
export type {
  PreparedThermoModel,
  ThermoModelInput,
  FormName,
  PhaseTransition,
  DiscontinuousJoint,
  ThermoCrossing,
} from './species-model';
export { reactionPropertiesAt, RSS_METHOD_TEXT } from './kirchhoff';
export type {
  FormationEnthalpyInput,
  ReactionThermoTerm,
  KirchhoffMethod,
  ReactionThermoOptions,
  EnthalpyBasis,
  EntropyBasis,
  SpeciesAtTemperature,
  UncertaintyContribution,
  ReactionUncertainty,
  ReactionThermoResult,
} from './kirchhoff';
export { standardUncertainty } from './uncertainty';
export type { StatedUncertainty, DerivedStandardUncertainty } from './uncertainty';
export {
  toKelvin,
  fromKelvin,
  CELSIUS_ZERO_IN_KELVIN,
  kilojoulesToKilocalories,
  kilocaloriesToKilojoules,
  perMoleToPerKilogram,
  perKilogramToPerMole,
} from './units';
export type { TemperatureUnit } from './units';
export {
  KILOGRAMS_PER_POUND,
  massInGrams,
  amountOfSubstance,
  idealGasMolarVolume,
  extentOfReaction,
  limitingReactant,
  reactionHeat,
  fuelHeatingValues,
  batchScreening,
  BATCH_SCREENING_CAUTIONS,
} from './quantities';
export type {
  MassUnit,
  PressureUnit,
  QuantityInput,
  AmountOfSubstance,
  ExtentOfReaction,
  ReactantAmount,
  ReactantBalance,
  LimitingReactantResult,
  ReactionHeat,
  FuelHeatingValueInput,
  HeatingValue,
  FuelHeatingValues,
  BatchScreeningInput,
  BatchScreeningResult,
} from './quantities';
export { monotoneCubic, evaluateMonotoneCubic, integrateMonotoneCubic, integrateMonotoneCubicOverT } from './pchip';
export type { MonotoneCubic } from './pchip';
