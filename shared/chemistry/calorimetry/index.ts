/**
 * Public API of the calorimetry core: reduction of calorimeter readings to heats and enthalpies —
 * drift correction of time–temperature curves (Dickinson, Regnault–Pfaundler), calibration
 * (electrical, hot and cold water, certified benzoic acid in a bomb), constant-pressure runs to
 * ΔH per mole of reaction as written, bomb runs to ΔcU°, ΔcH° and ΔfH° by Hess's law, replicate
 * statistics with Student's t and Grubbs' test, and first-order uncertainty propagation with the
 * contribution of each input. Pure (no I/O); runs in the browser and on the server.
 *
 * Conventions: masses in g, volumes in mL, temperatures in K, times in s, heat capacities in J/K,
 * specific heats in J/(g K), energies of a run in J (q reported in kJ), massic energies in J/g,
 * molar energies in kJ/mol. ΔH < 0 and ΔcU < 0 mean energy leaves the reacting system
 * (exothermic); the heat q taken up by a constant-pressure calorimeter is > 0 for a rise.
 * Uncertainties are standard uncertainties (k = 1) unless named expanded. A constant-pressure
 * result is at the run's concentrations and temperature, not a standard value; a bomb result is
 * at standard states only when the standard-state (Washburn) corrections are supplied.
 */
export { CalorimetryInputError } from './errors';
export type { FieldPath } from './errors';
export { exactly } from './measured';
export type { Measured } from './measured';
export { propagate, inQuadrature, PROPAGATION_METHOD } from './propagation';
export type { ModelInput, InputContribution, Propagation } from './propagation';
export { driftCorrection, lineAt } from './drift';
export type { SeriesPoint, DriftMethod, DriftOptions, DriftLine, DriftCorrection } from './drift';
export { replicateStatistics, studentCoverageFactor, grubbsCritical } from './replicates';
export type { OutlierCheck, ReplicateSummary, ReplicateStatistics, ReplicateOptions } from './replicates';
export { reduceConstantPressureRun } from './constant-pressure';
export type {
  SolutionQuantity,
  LimitingQuantity,
  ConstantPressureRun,
  ConstantPressureReduction,
} from './constant-pressure';
export { calibrationRunHeatCapacity, calorimeterCalibration } from './calibration';
export type {
  ElectricalCalibrationRun,
  MixingCalibrationRun,
  CalibrationRun,
  CalorimeterCalibration,
} from './calibration';
export { combustionReaction, formationEnthalpy, formationFromCombustion, REFERENCE_OXYGEN } from './combustion';
export type { SulfurProduct, SamplePhase, CombustionTerm, CombustionReaction, FormationValue } from './combustion';
export { reduceBombCalorimetry } from './bomb';
export type { BombRun, EnergyEquivalentSource, BombInput, EnergyEquivalentResult, BombReduction } from './bomb';
export {
  buoyancyCorrected,
  nitricAcidEnergy,
  fuseEnergy,
  DEFAULT_AIR_DENSITY,
  DEFAULT_WEIGHTS_DENSITY,
  BENZOIC_ACID_DENSITY,
  NITRIC_ACID_MOLAR_ENERGY,
  SRM_39J_MASSIC_ENERGY,
  SRM_39J_CITATION,
} from './corrections';
export {
  toGrams,
  toMillilitres,
  toMoles,
  toMolesPerLitre,
  toJoules,
  toJoulesPerGram,
  toKelvin,
  degreeSize,
} from './units';
export type {
  Stated,
  MassUnit,
  VolumeUnit,
  AmountUnit,
  ConcentrationUnit,
  EnergyUnit,
  MassicEnergyUnit,
  TemperatureScale,
} from './units';
export { BOMB_CAUTIONS, CONSTANT_PRESSURE_CAUTIONS } from './cautions';
