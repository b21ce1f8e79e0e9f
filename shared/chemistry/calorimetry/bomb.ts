import { GAS_CONSTANT } from '../thermo/constants';
import { formationFromCombustion, type CombustionReaction, type FormationValue } from './combustion';
import { CalorimetryInputError, type FieldPath } from './errors';
import { checkMeasured, type Measured } from './measured';
import { propagate, type ModelInput, type Propagation } from './propagation';
import { replicateStatistics, type ReplicateOptions, type ReplicateStatistics } from './replicates';

/*
 * Constant-volume (bomb) combustion calorimetry (domain notes §4; Hubbard, Scott & Waddington,
 * ch. 5 in Experimental Thermochemistry vol. 1, 1956; from memory).
 *
 * Energies in J (per run), massic energies in J/g, molar energies in kJ/mol, ε in J/K.
 * Sign: energies of combustion are negative (energy leaves the bomb process); the corrections
 * (fuse, nitric acid, auxiliary material, ignition) are positive amounts of energy that were
 * released in the bomb by something other than the sample, and are subtracted.
 *
 * Calibration run k:  ε_k = (m_k·|Δcu_cal| + q_fuse + q_HNO₃ + q_aux + q_ign) / ΔT_k
 * Sample run k:       Δcu_k = −(ε·ΔT_k − q_fuse − q_HNO₃ − q_aux − q_ign) / m_k
 * Standard states:    Δcu° = Δcu(bomb) + ΔU_Σ/m (the Washburn corrections, when supplied)
 * Molar:              ΔcU° = M·Δcu° / 1000;  ΔcH° = ΔcU° + Δn(gas)·R·T / 1000
 * Formation:          ΔfH°(sample) = Σ νᵢ ΔfH°ᵢ − ΔcH° (combustion.ts)
 *
 * Uncertainty: the scatter of the sample runs (s/√n; one run: its stated inputs), the energy
 * equivalent (the scatter of the calibration runs and the certificate value, which every run
 * shares), the standard-state correction, the molar mass and the auxiliary formation enthalpies,
 * combined as independent inputs (GUM 5.1.2). The certified value is the calibrant's massic
 * energy under the certificate's bomb conditions, not the calibrant's ΔcU°.
 */

/** One bomb run, calibration or sample. Masses in g (buoyancy-corrected by the caller), energies in J. */
export interface BombRun {
  /** g */
  mass: Measured;
  /** K: corrected temperature rise. */
  deltaT: Measured;
  /** J: energy of the fuse (ignition wire or thread) that burnt. */
  fuse: Measured;
  /** J: energy of formation of the nitric acid found in the bomb washings. */
  nitricAcid: Measured;
  /** J: energy of combustion of auxiliary material (combustion aid, bag, thread counted separately). */
  auxiliary: Measured;
  /** J: electrical ignition energy and any other energy put in. */
  ignition: Measured;
}

/** Where the energy equivalent ε comes from. */
export type EnergyEquivalentSource =
  | { kind: 'typed'; /** J/K */ value: Measured }
  | {
      kind: 'calibration';
      /** J/g, negative: the certified massic energy of combustion under the certificate's bomb conditions. */
      certificate: Measured;
      runs: BombRun[];
    };

export interface BombInput {
  energyEquivalent: EnergyEquivalentSource;
  /** Sample runs (replicates of one experiment). */
  runs: BombRun[];
  reaction: CombustionReaction;
  /** J/g added to the bomb massic energy to reach standard states (Washburn), or null when not applied. */
  standardStateCorrection: Measured | null;
  /** K, for Δn(gas)·R·T (298.15 K for values at the reference temperature). */
  temperature: number;
  /** ΔfH° of the other species of the combustion equation; null to stop at ΔcH°. */
  formation: ReadonlyMap<string, FormationValue> | null;
  replicates?: ReplicateOptions;
}

export interface EnergyEquivalentResult {
  /** J/K */
  value: number;
  /** J/K, standard uncertainty (scatter and certificate). */
  u: number;
  basis: 'typed' | 'one-run' | 'replicates';
  /** Each calibration run's ε from its own stated inputs (the certificate held fixed); empty when typed. */
  runs: Propagation[];
  replicates: ReplicateStatistics | null;
  /** J/K: the part from the calibration runs' scatter, and from the certificate. */
  scatterU: number | null;
  certificateU: number | null;
}

export interface BombReduction {
  energyEquivalent: EnergyEquivalentResult;
  /** Each sample run's massic energy (J/g) from its own stated inputs, ε held fixed. */
  runs: Propagation[];
  /** Statistics of the runs' massic energies (J/g). */
  replicates: ReplicateStatistics;
  /** J/g: massic energy of the bomb process, the mean of the runs, with the full budget. */
  massicEnergy: Propagation;
  /** J/g: reduced to standard states, or null when no correction was supplied. */
  standardMassicEnergy: Propagation | null;
  /** kJ/mol of sample: ΔcU° (or the bomb-process value when no standard-state correction was supplied). */
  deltaCU: Propagation;
  /** kJ/mol of sample: ΔcH° = ΔcU° + Δn(gas)·R·T. */
  deltaCH: Propagation;
  /** kJ/mol: ΔfH° of the sample, or null when no formation values were given. */
  deltaFH: Propagation | null;
  /** kJ/mol: R·T used. */
  rt: number;
  notes: string[];
}

type X = Readonly<Record<string, number>>;

function checkRun(run: BombRun, path: FieldPath): void {
  checkMeasured(run.mass, [...path, 'mass'], 'the mass');
  checkMeasured(run.deltaT, [...path, 'temperature'], 'the temperature rise');
  checkMeasured(run.fuse, [...path, 'fuse'], 'the fuse energy', 'non-negative');
  checkMeasured(run.nitricAcid, [...path, 'nitricAcid'], 'the nitric acid energy', 'non-negative');
  checkMeasured(run.auxiliary, [...path, 'auxiliary'], 'the auxiliary energy', 'non-negative');
  checkMeasured(run.ignition, [...path, 'ignition'], 'the ignition energy', 'non-negative');
}

const extra = (x: X) => x['run.fuse']! + x['run.nitricAcid']! + x['run.auxiliary']! + x['run.ignition']!;

function runInputs(run: BombRun, prefix: string): ModelInput[] {
  const entries: [keyof BombRun, string, string][] = [
    ['mass', 'Mass', 'g'],
    ['deltaT', 'Corrected temperature rise', 'K'],
    ['fuse', 'Fuse energy', 'J'],
    ['nitricAcid', 'Nitric acid energy', 'J'],
    ['auxiliary', 'Auxiliary material energy', 'J'],
    ['ignition', 'Ignition energy', 'J'],
  ];
  return entries.map(([key, label, unit]) => ({ id: `${prefix}.${key}`, label, unit, ...run[key] }));
}

/** ε of one calibration run (J/K), the certificate's massic energy (J/g, < 0) held at `certificate`. */
function calibrationRun(run: BombRun, certificate: number): Propagation {
  return propagate(runInputs(run, 'run'), (x) => (x['run.mass']! * -certificate + extra(x)) / x['run.deltaT']!);
}

/** Δcu of one sample run (J/g), ε held at `epsilon`. */
function sampleRun(run: BombRun, epsilon: number): Propagation {
  return propagate(runInputs(run, 'run'), (x) => -(epsilon * x['run.deltaT']! - extra(x)) / x['run.mass']!);
}

/** The type A part of a mean: s/√n for several values, the one run's propagated u for one. */
function scatterOf(stats: ReplicateStatistics, runs: readonly Propagation[]): number {
  return stats.n > 1 ? stats.standardUncertainty! : runs[0]!.u;
}

/**
 * Reduces bomb runs to the energy equivalent, the massic energy of combustion of the sample, ΔcU°,
 * ΔcH° and (with the auxiliary formation enthalpies) ΔfH° of the sample; see the module comment
 * for the equations and the uncertainty budget.
 * @throws CalorimetryInputError naming the field for a bad run, a positive certificate value or
 * a missing formation value.
 */
export function reduceBombCalorimetry(input: BombInput): BombReduction {
  const notes: string[] = [];
  if (input.runs.length === 0) throw new CalorimetryInputError('Give at least one sample run.', ['runs']);
  input.runs.forEach((run, i) => checkRun(run, ['runs', i]));
  const options = input.replicates ?? {};
  const source = input.energyEquivalent;

  // The energy equivalent, from its source.
  let energyEquivalent: EnergyEquivalentResult;
  const modelInputs: ModelInput[] = [];
  let epsilonOf: (x: X) => number;
  if (source.kind === 'typed') {
    checkMeasured(source.value, ['energyEquivalent'], 'the energy equivalent');
    modelInputs.push({ id: 'energyEquivalent', label: 'Energy equivalent (as given)', unit: 'J/K', ...source.value });
    epsilonOf = (x) => x['energyEquivalent']!;
    energyEquivalent = {
      value: source.value.value,
      u: source.value.u ?? 0,
      basis: 'typed',
      runs: [],
      replicates: null,
      scatterU: null,
      certificateU: null,
    };
  } else {
    const certificate = source.certificate;
    checkMeasured(certificate, ['calibration', 'certificate', 'massicEnergy'], 'the certified massic energy', 'finite');
    if (!(certificate.value < 0))
      throw new CalorimetryInputError(
        'The certified massic energy of combustion is negative (energy leaves the bomb process), e.g. −26.434 kJ/g.',
        ['calibration', 'certificate', 'massicEnergy', 'value'],
      );
    if (source.runs.length === 0)
      throw new CalorimetryInputError('Give at least one calibration run.', ['calibration', 'runs']);
    source.runs.forEach((run, i) => checkRun(run, ['calibration', 'runs', i]));
    const runs = source.runs.map((run) => calibrationRun(run, certificate.value));
    const stats = replicateStatistics(
      runs.map((r) => r.value),
      options,
      ['calibration', 'runs'],
    );
    const scatter = scatterOf(stats, runs);
    // ∂ε/∂Δcu_cal = −mean(m_k/ΔT_k): every run shares the certificate value.
    const perCertificate = source.runs.reduce((sum, r) => sum + r.mass.value / r.deltaT.value, 0) / source.runs.length;
    const certificateU = certificate.u === null ? null : perCertificate * certificate.u;
    modelInputs.push(
      { id: 'calibration.runs', label: 'Calibration runs (scatter of ε)', unit: 'J/K', value: 0, u: scatter },
      {
        id: 'calibration.certificate',
        label: 'Certified massic energy of the calibrant',
        unit: 'J/g',
        value: certificate.value,
        u: certificate.u,
      },
    );
    epsilonOf = (x) =>
      source.runs.reduce(
        (sum, run) => sum + (run.mass.value * -x['calibration.certificate']! + otherEnergies(run)) / run.deltaT.value,
        0,
      ) /
        source.runs.length +
      x['calibration.runs']!;
    energyEquivalent = {
      value: stats.mean,
      u: Math.sqrt(scatter ** 2 + (certificateU ?? 0) ** 2),
      basis: runs.length > 1 ? 'replicates' : 'one-run',
      runs,
      replicates: stats,
      scatterU: scatter,
      certificateU,
    };
    if (source.runs.length < 6)
      notes.push(
        `${source.runs.length} calibration run${source.runs.length === 1 ? '' : 's'}: six or more are usual for an energy equivalent whose scatter can be trusted.`,
      );
    if (stats.outlier.flagged)
      notes.push(
        `Calibration run ${stats.outlier.candidate! + 1} is a suspected outlier (Grubbs' test); it is kept in the mean.`,
      );
  }

  // The sample runs.
  const runs = input.runs.map((run) => sampleRun(run, energyEquivalent.value));
  const replicates = replicateStatistics(
    runs.map((r) => r.value),
    options,
    ['runs'],
  );
  if (input.runs.length === 1)
    notes.push('One sample run: its uncertainty comes from its stated inputs alone; repeat it to see the scatter.');
  if (replicates.outlier.flagged)
    notes.push(
      `Sample run ${replicates.outlier.candidate! + 1} is a suspected outlier (Grubbs' test); it is kept in the mean.`,
    );
  modelInputs.push({
    id: 'runs',
    label: 'Sample runs (scatter of the massic energy)',
    unit: 'J/g',
    value: 0,
    u: scatterOf(replicates, runs),
  });
  const bombMassic = (x: X) =>
    input.runs.reduce((sum, run) => sum - (epsilonOf(x) * run.deltaT.value - otherEnergies(run)) / run.mass.value, 0) /
      input.runs.length +
    x['runs']!;

  const correction = input.standardStateCorrection;
  if (correction) {
    checkMeasured(correction, ['standardStateCorrection'], 'the standard-state correction', 'finite');
    modelInputs.push({
      id: 'standardStateCorrection',
      label: 'Standard-state (Washburn) correction',
      unit: 'J/g',
      ...correction,
    });
  }
  const standardMassic = (x: X) => bombMassic(x) + (correction ? x['standardStateCorrection']! : 0);
  const M = input.reaction.sample.molarMass;
  modelInputs.push({
    id: 'sample.molarMass',
    label: `Molar mass of ${input.reaction.sample.formula}`,
    unit: 'g/mol',
    ...M,
  });
  const rt = (GAS_CONSTANT * input.temperature) / 1000;
  const dn = input.reaction.deltaNGas.valueOf();
  const deltaCU = (x: X) => (standardMassic(x) * x['sample.molarMass']!) / 1000;
  const deltaCH = (x: X) => deltaCU(x) + dn * rt;

  let deltaFH: Propagation | null = null;
  const formation = input.formation;
  if (formation) {
    const { terms } = formationFromCombustion(input.reaction, formation);
    const withFormation = [
      ...modelInputs,
      ...terms.map((t) => ({
        id: `formation.${t.key}`,
        label: `ΔfH° of ${t.key}`,
        unit: 'kJ/mol',
        ...formation.get(t.key)!,
      })),
    ];
    deltaFH = propagate(
      withFormation,
      (x) => terms.reduce((sum, t) => sum + t.coefficient.valueOf() * x[`formation.${t.key}`]!, 0) - deltaCH(x),
    );
  }
  if (!correction)
    notes.push(
      'Standard-state (Washburn) corrections not applied: ΔcU refers to the bomb process (about 3 MPa of O₂, real gases, CO₂ dissolved in the bomb water), which typically differs from ΔcU° by 0.01–0.1 %.',
    );
  return {
    energyEquivalent,
    runs,
    replicates,
    massicEnergy: propagate(modelInputs, bombMassic),
    standardMassicEnergy: correction ? propagate(modelInputs, standardMassic) : null,
    deltaCU: propagate(modelInputs, deltaCU),
    deltaCH: propagate(modelInputs, deltaCH),
    deltaFH,
    rt,
    notes,
  };
}

/** J: the energies released in a run by anything but the sample or calibrant (their uncertainties are in the runs' scatter). */
function otherEnergies(run: BombRun): number {
  return run.fuse.value + run.nitricAcid.value + run.auxiliary.value + run.ignition.value;
}
