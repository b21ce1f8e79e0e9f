// Request → calorimetry core → reply, for POST /calorimetry/constant-pressure and /calorimetry/bomb.
// Runs in the calculation worker. Units are converted here (the core works in g, mL, K, J);
// every core error is re-addressed to the request field it came from (path under "body").
import { ChemistryError, molarMass, parseFormula } from '@shared/chemistry/index';
import {
  BOMB_CAUTIONS,
  CalorimetryInputError,
  CONSTANT_PRESSURE_CAUTIONS,
  DEFAULT_AIR_DENSITY,
  DEFAULT_WEIGHTS_DENSITY,
  NITRIC_ACID_MOLAR_ENERGY,
  PROPAGATION_METHOD,
  buoyancyCorrected,
  calorimeterCalibration,
  combustionReaction,
  degreeSize,
  driftCorrection,
  fuseEnergy,
  nitricAcidEnergy,
  reduceBombCalorimetry,
  reduceConstantPressureRun,
  toGrams,
  toJoules,
  toJoulesPerGram,
  toKelvin,
  toMillilitres,
  toMoles,
  type BombRun,
  type CalibrationRun,
  type DriftCorrection,
  type FieldPath,
  type FormationValue,
  type Measured,
  type Propagation,
  type ReplicateStatistics,
  type SeriesPoint,
  type Stated,
} from '@shared/chemistry/calorimetry/index';
import type {
  AuxiliaryValue,
  BombInput,
  BombResult,
  BombRunInput,
  CalibrationRunInput,
  ConstantPressureInput,
  ConstantPressureResult,
  Contribution,
  DriftReply,
} from '@shared/schemas/calorimetry';
import { readBalancedReaction } from '../library/read-reaction';

type Warning = { code: string; message: string; term?: number };
type StatedAny = { value: number; unit: string; uncertainty?: number | null | undefined };

/** Water's specific heat, 4.184 J/(g K) near 25 °C (common practice, no source). */
const WATER_SPECIFIC_HEAT = 4.184;

/** Runs a core call; a CalorimetryInputError is re-addressed under `body` so the 400 names the request field. */
function atBody<T>(run: () => T, prefix: FieldPath = []): T {
  try {
    return run();
  } catch (error) {
    if (error instanceof CalorimetryInputError) {
      const path = ['body', ...prefix, ...error.path];
      throw new ChemistryError(error.code as 'validation_failed', `${path.slice(1).join('.')}: ${error.message}`, {
        issues: [{ path, message: error.message }],
      });
    }
    throw error;
  }
}

const fieldError = (
  path: FieldPath,
  message: string,
  code: 'validation_failed' | 'unprocessable' = 'validation_failed',
) => new ChemistryError(code, `${path.join('.')}: ${message}`, { issues: [{ path: ['body', ...path], message }] });

const stated = (q: StatedAny) => q as Stated<never>;

function measuredOf(q: StatedAny | undefined, fallback: Measured): Measured {
  return q ? { value: q.value, u: q.uncertainty ?? null } : fallback;
}

/** The series in K (and the reading uncertainty in K), from readings on °C, °F or K. */
function seriesInKelvin(
  t: { series?: [number, number][] | undefined; unit?: 'K' | 'C' | 'F' | undefined },
  path: FieldPath,
): SeriesPoint[] {
  const unit = t.unit ?? 'K';
  return (t.series ?? []).map(([time, reading], i) => [
    time,
    atBody(() => toKelvin({ value: reading, unit }, [...path, 'series', i, 1]).value),
  ]);
}

interface SeriesRequest {
  series?: [number, number][] | undefined;
  unit?: 'K' | 'C' | 'F' | undefined;
  mixingTime?: number | undefined;
  method?: 'dickinson' | 'regnault-pfaundler' | undefined;
  afterPeriodStart?: number | null | undefined;
  readingUncertainty?: number | null | undefined;
}

function correctSeries(t: SeriesRequest, path: FieldPath): DriftCorrection {
  const points = seriesInKelvin(t, path);
  return atBody(
    () =>
      driftCorrection(
        points,
        {
          method: t.method!,
          mixingTime: t.mixingTime!,
          afterPeriodStart: t.afterPeriodStart ?? null,
          readingUncertainty:
            t.readingUncertainty === undefined || t.readingUncertainty === null
              ? null
              : t.readingUncertainty * degreeSize(t.unit ?? 'K'),
        },
        [],
      ),
    path,
  );
}

function driftReply(d: DriftCorrection): DriftReply {
  const line = (l: DriftCorrection['fore']) => ({
    slope: l.slope,
    anchor: l.anchor,
    from: l.from,
    to: l.to,
    points: l.points,
    residualSd: l.residualSd,
  });
  return {
    method: d.method,
    fore: line(d.fore),
    after: line(d.after),
    mainPeriod: d.mainPeriod,
    afterPeriodFound: d.afterPeriodFound,
    observedDeltaT: d.observedDeltaT,
    correctedDeltaT: d.correctedDeltaT,
    tMid: d.tMid,
    riseFractionAtTMid: d.riseFractionAtTMid,
    notes: d.notes,
  };
}

function contributionsOf(p: Propagation): Contribution[] {
  return p.contributions.map((c) => ({
    id: c.id,
    label: c.label,
    value: c.value,
    unit: c.unit,
    uncertainty: c.u,
    sensitivity: c.sensitivity,
    contribution: c.contribution,
    varianceShare: c.varianceShare,
  }));
}

function replicateReply(s: ReplicateStatistics) {
  return {
    n: s.n,
    mean: s.mean,
    standardDeviation: s.standardDeviation,
    standardUncertainty: s.standardUncertainty,
    degreesOfFreedom: s.degreesOfFreedom,
    confidence: s.confidence,
    coverageFactor: s.coverageFactor,
    expandedUncertainty: s.expandedUncertainty,
    outlier: {
      applicable: s.outlier.applicable,
      statistic: s.outlier.statistic,
      critical: s.outlier.critical,
      candidate: s.outlier.candidate,
      flagged: s.outlier.flagged,
      rule: s.outlier.rule,
    },
  };
}

/** The inputs without a stated uncertainty, in words ("the volume of the solution, …"). */
function missingLabels(p: Propagation): string {
  return p.contributions
    .filter((c) => p.missing.includes(c.id))
    .map((c) => c.label.charAt(0).toLowerCase() + c.label.slice(1))
    .join(', ');
}

/** u of a propagation, or null when no input stated one. */
const uOf = (p: Propagation) => (p.missing.length === p.contributions.length ? null : p.u);

function calibrationRunOf(run: CalibrationRunInput, path: FieldPath): CalibrationRun {
  if (run.kind === 'electrical')
    return {
      kind: 'electrical',
      current: measuredOf(run.current, { value: 0, u: null }),
      voltage: measuredOf(run.voltage, { value: 0, u: null }),
      duration: measuredOf(run.duration, { value: 0, u: null }),
      deltaT: measuredOf(run.deltaT, { value: 0, u: null }),
      contents: {
        mass: atBody(() => toGrams(stated(run.contents.mass), [...path, 'contents', 'mass'])),
        specificHeat: measuredOf(run.contents.specificHeat, { value: 0, u: null }),
      },
    };
  return {
    kind: 'mixing',
    hot: {
      mass: atBody(() => toGrams(stated(run.hot.mass), [...path, 'hot', 'mass'])),
      temperature: atBody(() => toKelvin(stated(run.hot.temperature), [...path, 'hot', 'temperature'])),
    },
    cold: {
      mass: atBody(() => toGrams(stated(run.cold.mass), [...path, 'cold', 'mass'])),
      temperature: atBody(() => toKelvin(stated(run.cold.temperature), [...path, 'cold', 'temperature'])),
    },
    finalTemperature: atBody(() => toKelvin(stated(run.finalTemperature), [...path, 'finalTemperature'])),
    specificHeat: measuredOf(run.specificHeat, { value: WATER_SPECIFIC_HEAT, u: null }),
  };
}

/** POST /calorimetry/constant-pressure, request to reply. */
export function reduceConstantPressureRequest(input: ConstantPressureInput): ConstantPressureResult {
  const warnings: Warning[] = [];
  const reaction = readBalancedReaction(input.reaction.equation);
  warnings.push(...reaction.warnings);
  const index = input.reaction.limiting.term;
  const term = reaction.terms[index];
  if (!term)
    throw fieldError(
      ['reaction', 'limiting', 'term'],
      `The equation has ${reaction.terms.length} terms, numbered from 0; there is no term ${index}.`,
    );
  if (term.side !== 'reactant')
    throw fieldError(
      ['reaction', 'limiting', 'term'],
      `Term ${index} (${term.formula}) is a product: the limiting term must be a reactant.`,
    );
  const species = `${term.formula}${term.phase ? `(${term.phase})` : ''}`;
  const amount = input.reaction.limiting.amount;
  const amountPath = ['reaction', 'limiting', 'amount'];
  const quantity =
    amount.unit === 'g'
      ? (() => {
          const m = molarMass(parseFormula(term.formula).composition);
          return {
            kind: 'mass' as const,
            mass: { value: amount.value, u: amount.uncertainty ?? null },
            molarMass: { value: m.value, u: m.uncertainty },
          };
        })()
      : {
          kind: 'amount' as const,
          amount: atBody(() => toMoles(stated(amount), amountPath)),
        };

  // The calorimeter's heat capacity: typed, from calibration runs, or taken as 0 (and said so).
  let calibration: ConstantPressureResult['calibration'] = null;
  let heatCapacity: Measured;
  if (input.calibration) {
    if (input.calorimeterHeatCapacity)
      throw fieldError(['calorimeterHeatCapacity'], 'Give either a heat capacity or calibration runs, not both.');
    const runs = input.calibration.runs.map((r, i) => calibrationRunOf(r, ['calibration', 'runs', i]));
    const c = atBody(() => calorimeterCalibration(runs, input.replicates ?? {}, ['runs']), ['calibration']);
    heatCapacity = { value: c.value, u: c.u };
    calibration = {
      value: c.value,
      uncertainty: c.u,
      basis: c.basis,
      runs: c.runs.map((r) => r.value),
      replicates: c.replicates ? replicateReply(c.replicates) : null,
    };
    for (const note of c.notes) warnings.push({ code: 'calibration', message: note });
  } else if (input.calorimeterHeatCapacity) {
    heatCapacity = measuredOf(input.calorimeterHeatCapacity, { value: 0, u: null });
  } else {
    heatCapacity = { value: 0, u: 0 };
    warnings.push({
      code: 'calorimeter_neglected',
      message:
        'No heat capacity of the calorimeter was given: it is taken as 0 J/K, so the heat taken up by the vessel is missing from q. Calibrate the calorimeter (electrical or hot and cold water) or type its heat capacity.',
    });
  }
  if (!input.specificHeat)
    warnings.push({
      code: 'specific_heat_default',
      message: "The solution's specific heat is taken as water's, 4.184 J/(g K).",
    });

  // The corrected temperature change.
  let deltaT: Measured;
  let drift: DriftCorrection | null = null;
  const t = input.temperature;
  if (t.series) {
    drift = correctSeries(t, ['temperature']);
    deltaT = { value: drift.correctedDeltaT, u: drift.u };
    for (const note of drift.notes) warnings.push({ code: 'drift', message: note });
  } else {
    const initial = atBody(() => toKelvin(stated(t.initial!), ['temperature', 'initial']));
    const final = atBody(() => toKelvin(stated(t.final!), ['temperature', 'final']));
    const u = initial.u === null && final.u === null ? null : Math.sqrt((initial.u ?? 0) ** 2 + (final.u ?? 0) ** 2);
    deltaT = { value: final.value - initial.value, u };
    warnings.push({
      code: 'no_drift_correction',
      message:
        'Initial and final readings only: no correction for heat exchange with the surroundings was made. Upload the time–temperature series to correct for drift.',
    });
  }

  const solution = input.solution.mass
    ? { kind: 'mass' as const, mass: atBody(() => toGrams(stated(input.solution.mass!), ['solution', 'mass'])) }
    : {
        kind: 'volume' as const,
        volume: atBody(() => toMillilitres(stated(input.solution.volume!), ['solution', 'volume'])),
        density: measuredOf(input.solution.density, { value: 0, u: null }),
      };
  const r = atBody(() =>
    reduceConstantPressureRun({
      solution,
      specificHeat: measuredOf(input.specificHeat, { value: WATER_SPECIFIC_HEAT, u: null }),
      calorimeterHeatCapacity: heatCapacity,
      deltaT,
      limiting: { coefficient: term.coefficient, species, quantity },
    }),
  );
  if (r.deltaH.missing.length > 0)
    warnings.push({
      code: 'uncertainty_incomplete',
      message: `No uncertainty was stated for ${missingLabels(r.deltaH)}: the uncertainty shown covers the other inputs only.`,
    });
  const concentrations = input.concentrations ?? [];
  const aqueous = reaction.terms.some((x) => x.phase === 'aq');
  const basis =
    concentrations.length > 0 || aqueous
      ? `ΔH at the run's temperature and concentrations${concentrations.length ? ` (${concentrations.map((c) => `${c.species} ${c.value} ${c.unit}`).join(', ')})` : ''}, per mole of reaction as written: not ΔrH° at infinite dilution, from which it differs by the enthalpies of dilution.`
      : "ΔH at the run's temperature and composition, per mole of reaction as written; not a standard value.";
  if (aqueous && concentrations.length === 0)
    warnings.push({
      code: 'concentrations_not_recorded',
      message:
        'The reaction has dissolved species but no concentrations were recorded: record them, since ΔH depends on them.',
    });
  const p = (x: Propagation) => ({ value: x.value, uncertainty: uOf(x) });
  return {
    equation: reaction.equation,
    limiting: {
      term: index,
      species,
      coefficient: term.coefficient.toFraction(),
      amount: { ...p(r.amount), unit: 'mol' },
    },
    extent: { ...p(r.extent), unit: 'mol' },
    solutionMass: { ...p(r.solutionMass), unit: 'g' },
    heatCapacity: { ...p(r.heatCapacity), unit: 'J/K' },
    calibration,
    deltaT: {
      value: deltaT.value,
      uncertainty: deltaT.u,
      unit: 'K',
      source: drift ? 'series' : 'readings',
      drift: drift ? driftReply(drift) : null,
    },
    q: { ...p(r.q), unit: 'kJ' },
    deltaH: { ...p(r.deltaH), unit: 'kJ/mol' },
    contributions: contributionsOf(r.deltaH),
    uncertaintyComplete: r.deltaH.missing.length === 0,
    uncertaintyMethod: PROPAGATION_METHOD,
    concentrations,
    basis,
    warnings,
    cautions: [...CONSTANT_PRESSURE_CAUTIONS],
  };
}

// ---- Bomb ----------------------------------------------------------------------------------

/** A library value for the Hess cycle, as the request thread looked it up. */
export interface AuxiliaryLookup {
  key: string;
  value: number;
  uncertainty: number | null;
  source: AuxiliaryValue['source'];
  provenance: AuxiliaryValue['provenance'];
}

/** The library species a combustion may need (the request thread looks them up before the worker runs). */
export const COMBUSTION_PRODUCTS = ['CO2(g)', 'H2O(l)', 'N2(g)', 'SO2(g)', 'H2SO4(aq)'] as const;

const ZERO: Measured = { value: 0, u: 0 };

interface ReducedRun {
  run: BombRun;
  deltaT: BombResult['runs'][number]['deltaT'];
}

function bombRunOf(run: BombRunInput, path: FieldPath, warnings: Warning[]): ReducedRun {
  let mass = atBody(() => toGrams(stated(run.mass), [...path, 'mass']));
  if (run.buoyancy)
    mass = buoyancyCorrected(mass, {
      sample: run.buoyancy.sampleDensity,
      air: run.buoyancy.airDensity ?? DEFAULT_AIR_DENSITY,
      weights: run.buoyancy.weightsDensity ?? DEFAULT_WEIGHTS_DENSITY,
    });
  let deltaT: Measured;
  let drift: DriftCorrection | null = null;
  const t = run.temperature;
  if (t.series) {
    drift = correctSeries(t, [...path, 'temperature']);
    deltaT = { value: drift.correctedDeltaT, u: drift.u };
    for (const note of drift.notes) warnings.push({ code: 'drift', message: `${path.join('.')}: ${note}` });
  } else {
    const rise = t.rise!;
    const size = degreeSize(rise.unit);
    deltaT = {
      value: rise.value * size,
      u: rise.uncertainty === undefined || rise.uncertainty === null ? null : rise.uncertainty * size,
    };
  }
  const energy = (q: StatedAny | undefined, p: FieldPath) => (q ? atBody(() => toJoules(stated(q), p)) : ZERO);
  const f = run.fuse;
  const fuse = !f
    ? ZERO
    : f.energy
      ? energy(f.energy, [...path, 'fuse', 'energy'])
      : atBody(
          () => fuseEnergy(measuredOf(f.length, ZERO), measuredOf(f.energyPerLength, ZERO), [...path, 'fuse']),
          [],
        );
  const n = run.nitricAcid;
  const nitricAcid = !n
    ? ZERO
    : n.energy
      ? energy(n.energy, [...path, 'nitricAcid', 'energy'])
      : atBody(() => {
          // c·V·E: mL × mol/L × kJ/mol = J.
          return nitricAcidEnergy(
            measuredOf(n.titrantVolume, ZERO),
            measuredOf(n.titrantConcentration, ZERO),
            measuredOf(n.molarEnergy, { value: NITRIC_ACID_MOLAR_ENERGY, u: null }),
            [...path, 'nitricAcid'],
          );
        });
  return {
    run: {
      mass,
      deltaT,
      fuse,
      nitricAcid,
      auxiliary: energy(run.auxiliary, [...path, 'auxiliary']),
      ignition: energy(run.ignition, [...path, 'ignition']),
    },
    deltaT: {
      value: deltaT.value,
      uncertainty: deltaT.u,
      unit: 'K',
      source: drift ? 'series' : 'readings',
      drift: drift ? driftReply(drift) : null,
    },
  };
}

function runReply(reduced: ReducedRun, p: Propagation): BombResult['runs'][number] {
  return {
    value: p.value,
    uncertainty: uOf(p),
    mass: reduced.run.mass.value,
    deltaT: reduced.deltaT,
    corrections: {
      fuse: reduced.run.fuse.value,
      nitricAcid: reduced.run.nitricAcid.value,
      auxiliary: reduced.run.auxiliary.value,
      ignition: reduced.run.ignition.value,
    },
  };
}

/**
 * POST /calorimetry/bomb, request to reply. `auxiliary` holds the library's selected ΔfH° of the
 * combustion products at `revision` (null when the library is empty).
 */
export function reduceBombRequest(
  input: BombInput,
  auxiliary: readonly AuxiliaryLookup[],
  revision: number | null,
): BombResult {
  const warnings: Warning[] = [];
  let parsed;
  try {
    parsed = parseFormula(input.sample.formula);
  } catch (error) {
    if (error instanceof ChemistryError) throw fieldError(['sample', 'formula'], error.message);
    throw error;
  }
  const reaction = atBody(() =>
    combustionReaction(parsed, input.sample.phase, input.sample.sulfurProduct ?? 'H2SO4(aq)', ['sample']),
  );
  const samples = input.runs.map((r, i) => bombRunOf(r, ['runs', i], warnings));
  const calibrationRuns = input.calibration?.runs.map((r, i) => bombRunOf(r, ['calibration', 'runs', i], warnings));
  const temperature = input.temperature
    ? atBody(() => toKelvin(stated(input.temperature!), ['temperature'])).value
    : 298.15;

  // Formation values from the library for the species of the combustion equation (O2 is 0 by definition).
  const byKey = new Map(auxiliary.map((a) => [a.key, a]));
  const neededKeys = reaction.terms.filter((t) => t.role === 'product').map((t) => t.key);
  const missing = neededKeys.filter((k) => !byKey.has(k));
  let formation: Map<string, FormationValue> | null = null;
  if (missing.length === 0)
    formation = new Map(neededKeys.map((k) => [k, { value: byKey.get(k)!.value, u: byKey.get(k)!.uncertainty }]));
  else
    warnings.push({
      code: 'formation_not_available',
      message: `The library holds no selected ΔfH° for ${missing.join(', ')}: ΔfH° of the sample is not given.`,
    });

  const certificate = input.calibration
    ? atBody(() =>
        toJoulesPerGram(stated(input.calibration!.certificate.massicEnergy), [
          'calibration',
          'certificate',
          'massicEnergy',
        ]),
      )
    : null;
  const energyEquivalent = input.energyEquivalent
    ? {
        kind: 'typed' as const,
        value: {
          value: input.energyEquivalent.value * (input.energyEquivalent.unit === 'kJ/K' ? 1000 : 1),
          u:
            input.energyEquivalent.uncertainty === undefined || input.energyEquivalent.uncertainty === null
              ? null
              : input.energyEquivalent.uncertainty * (input.energyEquivalent.unit === 'kJ/K' ? 1000 : 1),
        },
      }
    : { kind: 'calibration' as const, certificate: certificate!, runs: calibrationRuns!.map((r) => r.run) };
  const r = atBody(() =>
    reduceBombCalorimetry({
      energyEquivalent,
      runs: samples.map((s) => s.run),
      reaction,
      standardStateCorrection: input.standardStateCorrection ? measuredOf(input.standardStateCorrection, ZERO) : null,
      temperature,
      formation,
      replicates: input.replicates ?? {},
    }),
  );
  for (const note of r.notes) warnings.push({ code: 'note', message: note });
  const final = r.deltaFH ?? r.deltaCH;
  if (final.missing.length > 0)
    warnings.push({
      code: 'uncertainty_incomplete',
      message: `No uncertainty was stated for ${missingLabels(final)}: the uncertainty shown covers the other inputs only.`,
    });
  const used: AuxiliaryValue[] = formation
    ? reaction.terms
        .filter((t) => t.role === 'product')
        .map((t) => {
          const a = byKey.get(t.key)!;
          return {
            key: a.key,
            coefficient: t.coefficient.toFraction(),
            value: a.value,
            uncertainty: a.uncertainty,
            source: a.source,
            provenance: a.provenance,
          };
        })
    : [];
  const e = (p: Propagation, unit: string) => ({ value: p.value, uncertainty: uOf(p), unit });
  return {
    combustion: {
      equation: reaction.equation,
      deltaNGas: reaction.deltaNGas.toFraction(),
      molarMass: reaction.sample.molarMass.value,
    },
    energyEquivalent: {
      value: r.energyEquivalent.value,
      uncertainty: r.energyEquivalent.u,
      unit: 'J/K',
      basis: r.energyEquivalent.basis,
      certificate:
        certificate && input.calibration
          ? { value: certificate.value, uncertainty: certificate.u, citation: input.calibration.certificate.citation }
          : null,
      runs: calibrationRuns ? calibrationRuns.map((c, i) => runReply(c, r.energyEquivalent.runs[i]!)) : [],
      replicates: r.energyEquivalent.replicates ? replicateReply(r.energyEquivalent.replicates) : null,
    },
    runs: samples.map((s, i) => runReply(s, r.runs[i]!)),
    replicates: replicateReply(r.replicates),
    massicEnergy: e(r.massicEnergy, 'J/g') as BombResult['massicEnergy'],
    standardMassicEnergy: r.standardMassicEnergy
      ? (e(r.standardMassicEnergy, 'J/g') as BombResult['massicEnergy'])
      : null,
    deltaCU: e(r.deltaCU, 'kJ/mol') as BombResult['deltaCU'],
    deltaCH: e(r.deltaCH, 'kJ/mol') as BombResult['deltaCH'],
    deltaFH: r.deltaFH ? (e(r.deltaFH, 'kJ/mol') as BombResult['deltaCH']) : null,
    standardState: input.standardStateCorrection
      ? { applied: true, note: 'Standard-state (Washburn) corrections applied as supplied.' }
      : {
          applied: false,
          note: 'Standard-state (Washburn) corrections not applied: ΔcU refers to the bomb process, not to standard states.',
        },
    rt: r.rt,
    auxiliary: used,
    libraryRevision: revision,
    contributions: contributionsOf(final),
    uncertaintyMethod: PROPAGATION_METHOD,
    warnings,
    cautions: [...BOMB_CAUTIONS],
  };
}
