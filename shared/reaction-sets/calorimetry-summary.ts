import type { BombInput, ConstantPressureInput } from '../schemas/calorimetry';
import type { CalorimetryRunValue } from '../schemas/reaction-sets-calorimetry';

/**
 * What a calorimetry run in a set rests on, in words: the method of reduction and each correction
 * with whether it was applied. Read from the run's inputs (what the experimenter supplied) and the
 * server's result (what the reduction did); the set page and the PDF report print the same list.
 */

export interface CorrectionLine {
  name: string;
  applied: boolean;
  detail: string;
}

export interface RunSummary {
  /** "Constant pressure, …" or "Bomb (constant volume), …". */
  method: string;
  corrections: CorrectionLine[];
}

const DRIFT_WORDS = {
  dickinson: 'extrapolated to the Dickinson time t_m',
  'regnault-pfaundler': 'Regnault–Pfaundler correction',
} as const;

function temperatureMethod(t: { series?: unknown; method?: keyof typeof DRIFT_WORDS | undefined }): CorrectionLine {
  return t.series && t.method
    ? { name: 'Drift (heat exchange)', applied: true, detail: `from the readings series, ${DRIFT_WORDS[t.method]}` }
    : { name: 'Drift (heat exchange)', applied: false, detail: 'temperatures typed, no readings series' };
}

function constantPressureSummary(
  inputs: ConstantPressureInput,
  _value: Extract<CalorimetryRunValue, { runKind: 'constant-pressure' }>,
): RunSummary {
  const calibration = inputs.calibration
    ? `calibration: ${inputs.calibration.runs.length} run(s), ${[...new Set(inputs.calibration.runs.map((c) => (c.kind === 'electrical' ? 'electrical (I·V·t)' : 'hot/cold water mixing')))].join(' and ')}`
    : inputs.calorimeterHeatCapacity
      ? 'heat capacity typed'
      : 'none given: the calorimeter is taken to absorb no heat (0 J/K)';
  return {
    method: 'Constant pressure: q = (m·c + C_cal)·ΔT, ΔH = −q/ξ per mole of reaction as written',
    corrections: [
      temperatureMethod(inputs.temperature),
      {
        name: 'Calorimeter heat capacity',
        applied: Boolean(inputs.calibration || inputs.calorimeterHeatCapacity),
        detail: calibration,
      },
      {
        name: 'Specific heat of the solution',
        applied: Boolean(inputs.specificHeat),
        detail: inputs.specificHeat ? 'as stated' : "water's 4.184 J g⁻¹ K⁻¹ assumed",
      },
    ],
  };
}

function bombSummary(inputs: BombInput, value: Extract<CalorimetryRunValue, { runKind: 'bomb' }>): RunSummary {
  const r = value.result;
  const runs = inputs.runs;
  const some = (pick: (run: BombInput['runs'][number]) => unknown) => runs.filter((run) => pick(run)).length;
  const count = (n: number, what: string) =>
    n === 0
      ? `not applied (no ${what} given)`
      : n === runs.length
        ? 'applied to every run'
        : `applied to ${n} of ${runs.length} runs`;
  const energyEquivalent =
    r.energyEquivalent.basis === 'typed'
      ? 'energy equivalent typed'
      : `energy equivalent from ${r.energyEquivalent.runs.length} benzoic-acid calibration run(s); certificate: ${r.energyEquivalent.certificate?.citation ?? '—'}`;
  const series = some((run) => run.temperature.series);
  return {
    method: `Bomb (constant volume): ΔcU from ε·ΔT less the corrections, ΔcH° = ΔcU° + Δn(gas)·R·T (Δn = ${r.combustion.deltaNGas.replace(/^-/, '−')}); ${energyEquivalent}`,
    corrections: [
      {
        name: 'Drift (heat exchange)',
        applied: series > 0,
        detail: series > 0 ? `from readings series (${series} of ${runs.length} runs)` : 'temperature rises typed',
      },
      {
        name: 'Fuse wire',
        applied: some((run) => run.fuse) > 0,
        detail: count(
          some((run) => run.fuse),
          'fuse energy',
        ),
      },
      {
        name: 'Nitric acid',
        applied: some((run) => run.nitricAcid) > 0,
        detail: count(
          some((run) => run.nitricAcid),
          'titration or energy',
        ),
      },
      {
        name: 'Buoyancy (weighing in air)',
        applied: some((run) => run.buoyancy) > 0,
        detail: count(
          some((run) => run.buoyancy),
          'sample density',
        ),
      },
      {
        name: 'Auxiliary substance and ignition',
        applied: some((run) => run.auxiliary ?? run.ignition) > 0,
        detail: count(
          some((run) => run.auxiliary ?? run.ignition),
          'auxiliary or ignition energy',
        ),
      },
      { name: 'Standard state (Washburn)', applied: r.standardState.applied, detail: r.standardState.note },
    ],
  };
}

/** The method and corrections of one evaluated run (`inputs` as kept in the set item). */
export function calorimetryRunSummary(
  inputs: ConstantPressureInput | BombInput,
  value: CalorimetryRunValue,
): RunSummary {
  return value.runKind === 'bomb'
    ? bombSummary(inputs as BombInput, value)
    : constantPressureSummary(inputs as ConstantPressureInput, value);
}
