import { CalorimetryInputError, type FieldPath } from './errors';
import { checkMeasured, type Measured } from './measured';
import { propagate, type ModelInput, type Propagation } from './propagation';
import { replicateStatistics, type ReplicateOptions, type ReplicateStatistics } from './replicates';

/*
 * Calibration of a constant-pressure calorimeter: the heat capacity C of the calorimeter itself
 * (vessel, stirrer, thermometer), in J/K, without its contents.
 * - Electrical: a heater delivers q = I·V·t (J, with I in A, V in V, t in s); the calorimeter and
 *   its contents warm by ΔT, so C = I·V·t/ΔT − m·c of the contents.
 * - Hot and cold water: hot water (m_h, T_h) poured onto cold water (m_c, T_c) in the calorimeter
 *   settles at T_f; the heat the hot water gives up warms the cold water and the calorimeter:
 *   m_h·c·(T_h − T_f) = (m_c·c + C)(T_f − T_c), so C = m_h·c·(T_h − T_f)/(T_f − T_c) − m_c·c.
 * Several runs: C is their mean, with u = s/√n (the scatter of the calibrations, a Type A
 * evaluation); one run: the uncertainty propagated from its stated inputs.
 */

export interface ElectricalCalibrationRun {
  kind: 'electrical';
  /** A */
  current: Measured;
  /** V */
  voltage: Measured;
  /** s */
  duration: Measured;
  /** K: corrected temperature change of the calorimeter and its contents. */
  deltaT: Measured;
  /** What was in the calorimeter: g and J/(g K). */
  contents: { mass: Measured; specificHeat: Measured };
}

export interface MixingCalibrationRun {
  kind: 'mixing';
  /** g and K */
  hot: { mass: Measured; temperature: Measured };
  /** g and K: the cold water already in the calorimeter, at the calorimeter's temperature. */
  cold: { mass: Measured; temperature: Measured };
  /** K */
  finalTemperature: Measured;
  /** J/(g K), the water's. */
  specificHeat: Measured;
}

export type CalibrationRun = ElectricalCalibrationRun | MixingCalibrationRun;

/** The calibration from all runs: C with its uncertainty and how it was obtained. */
export interface CalorimeterCalibration {
  /** Each run's C (J/K) with its uncertainty propagated from that run's stated inputs. */
  runs: Propagation[];
  /** J/K */
  value: number;
  /** J/K, standard uncertainty; null when one run states no uncertainty at all. */
  u: number | null;
  basis: 'one-run' | 'replicates';
  /** Replicate statistics of the runs' C (null for one run). */
  replicates: ReplicateStatistics | null;
  /** Warnings in words (negative C, a single run…). */
  notes: string[];
}

type X = Readonly<Record<string, number>>;

function inputs(entries: [string, string, Measured, string][]): ModelInput[] {
  return entries.map(([id, label, q, unit]) => ({ id, label, unit, ...q }));
}

/**
 * C (J/K) of one calibration run with its propagated uncertainty (GUM 5.1.2).
 * @throws CalorimetryInputError naming the field (under `path`) for non-positive quantities, a
 * zero ΔT, or a final temperature outside the hot and cold ones.
 */
export function calibrationRunHeatCapacity(run: CalibrationRun, path: FieldPath = []): Propagation {
  if (run.kind === 'electrical') {
    checkMeasured(run.current, [...path, 'current'], 'the heater current');
    checkMeasured(run.voltage, [...path, 'voltage'], 'the heater voltage');
    checkMeasured(run.duration, [...path, 'duration'], 'the heating time');
    checkMeasured(run.deltaT, [...path, 'temperature'], 'the temperature change', 'positive');
    checkMeasured(run.contents.mass, [...path, 'contents', 'mass'], 'the mass of the contents', 'non-negative');
    checkMeasured(
      run.contents.specificHeat,
      [...path, 'contents', 'specificHeat'],
      'the specific heat of the contents',
    );
    const model = (x: X) =>
      (x['current']! * x['voltage']! * x['duration']!) / x['temperature']! -
      x['contents.mass']! * x['contents.specificHeat']!;
    return propagate(
      inputs([
        ['current', 'Heater current', run.current, 'A'],
        ['voltage', 'Heater voltage', run.voltage, 'V'],
        ['duration', 'Heating time', run.duration, 's'],
        ['temperature', 'Corrected temperature change', run.deltaT, 'K'],
        ['contents.mass', 'Mass of the contents', run.contents.mass, 'g'],
        ['contents.specificHeat', 'Specific heat of the contents', run.contents.specificHeat, 'J/(g K)'],
      ]),
      model,
    );
  }
  checkMeasured(run.hot.mass, [...path, 'hot', 'mass'], 'the mass of the hot water');
  checkMeasured(run.cold.mass, [...path, 'cold', 'mass'], 'the mass of the cold water');
  checkMeasured(run.specificHeat, [...path, 'specificHeat'], 'the specific heat of water');
  const { hot, cold, finalTemperature: final } = run;
  if (!(hot.temperature.value > final.value && final.value > cold.temperature.value))
    throw new CalorimetryInputError('The final temperature must lie between the cold and the hot water temperatures.', [
      ...path,
      'final',
      'value',
    ]);
  const model = (x: X) =>
    (x['hot.mass']! * x['specificHeat']! * (x['hot.temperature']! - x['final']!)) /
      (x['final']! - x['cold.temperature']!) -
    x['cold.mass']! * x['specificHeat']!;
  return propagate(
    inputs([
      ['hot.mass', 'Mass of the hot water', hot.mass, 'g'],
      ['hot.temperature', 'Temperature of the hot water', hot.temperature, 'K'],
      ['cold.mass', 'Mass of the cold water', cold.mass, 'g'],
      ['cold.temperature', 'Temperature of the cold water', cold.temperature, 'K'],
      ['final', 'Final temperature', final, 'K'],
      ['specificHeat', 'Specific heat of water', run.specificHeat, 'J/(g K)'],
    ]),
    model,
  );
}

/**
 * The calorimeter's heat capacity from one or more calibration runs (see the module comment).
 * @throws CalorimetryInputError naming the run's field for bad input, or `runs` when empty.
 */
export function calorimeterCalibration(
  runs: readonly CalibrationRun[],
  options: ReplicateOptions = {},
  path: FieldPath = ['runs'],
): CalorimeterCalibration {
  if (runs.length === 0) throw new CalorimetryInputError('Give at least one calibration run.', path);
  const results = runs.map((run, i) => calibrationRunHeatCapacity(run, [...path, i]));
  const notes: string[] = [];
  results.forEach((r, i) => {
    if (r.value <= 0)
      notes.push(
        `Calibration run ${i + 1} gives C = ${Number(r.value.toPrecision(4))} J/K, not above zero: the contents take up more heat than was measured. Check the masses and readings.`,
      );
  });
  if (results.length === 1) {
    const only = results[0]!;
    notes.push(
      'One calibration run: its uncertainty comes from its stated inputs alone; repeat it to see the scatter.',
    );
    return {
      runs: results,
      value: only.value,
      u: only.missing.length === only.contributions.length ? null : only.u,
      basis: 'one-run',
      replicates: null,
      notes,
    };
  }
  const replicates = replicateStatistics(
    results.map((r) => r.value),
    options,
    path,
  );
  if (replicates.outlier.flagged)
    notes.push(
      `Calibration run ${replicates.outlier.candidate! + 1} is a suspected outlier (Grubbs' test); it is kept in the mean.`,
    );
  return {
    runs: results,
    value: replicates.mean,
    u: replicates.standardUncertainty,
    basis: 'replicates',
    replicates,
    notes,
  };
}
