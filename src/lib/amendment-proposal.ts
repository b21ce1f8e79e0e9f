/**
 * A saved calorimeter run turned into the body of a library amendment (POST /api/v1/amendments):
 * one "add-reaction" entry with the run's ΔH, its standard uncertainty, temperature, method and
 * the team, run and date as its source. Pure, no Vue.
 */
import { calorimetryRunSummary } from '@shared/reaction-sets/calorimetry-summary';
import type { CalorimetryRun } from '@shared/schemas/calorimetry-runs';
import type { CalorimetryRunValue } from '@shared/schemas/reaction-sets-calorimetry';

export interface AmendmentEntry {
  kind: 'add-reaction';
  equation: string;
  /** kJ/mol, standard uncertainty (k = 1). */
  deltaH: { value: number; uncertainty: number | null };
  /** K */
  temperature: number;
  method: 'combustion-calorimetry' | 'solution-calorimetry';
  /** mol/kg of the run, when recorded so. */
  molality?: number;
  source: { citation: string };
  provenance: 'entered';
  note: string;
}

export interface AmendmentBody {
  title: string;
  rationale: string;
  entries: AmendmentEntry[];
}

const fixed = (x: number, digits = 4) => Number(x.toPrecision(digits)).toString();

/** K of a run's final reading or 298.15 K (the reference temperature) when the run has none. */
function temperatureOf(run: CalorimetryRun): number {
  if (run.kind === 'bomb') {
    const t = run.inputs.temperature;
    if (!t) return 298.15;
    return t.unit === 'K' ? t.value : t.unit === 'C' ? t.value + 273.15 : ((t.value + 459.67) * 5) / 9;
  }
  const final = run.inputs.temperature.final;
  if (!final) return 298.15;
  return final.unit === 'K'
    ? final.value
    : final.unit === 'C'
      ? final.value + 273.15
      : ((final.value + 459.67) * 5) / 9;
}

/** Each correction of the run and whether it was applied, as one sentence. */
function correctionsOf(run: CalorimetryRun): string {
  const value = (
    run.kind === 'bomb'
      ? { runKind: 'bomb', equation: run.result.combustion.equation, deltaH: run.result.deltaCH, result: run.result }
      : { runKind: 'constant-pressure', equation: run.result.equation, deltaH: run.result.deltaH, result: run.result }
  ) as CalorimetryRunValue;
  const summary = calorimetryRunSummary(run.inputs, { ...value, sources: [] });
  return `Corrections: ${summary.corrections.map((c) => `${c.name} ${c.applied ? 'applied' : 'not applied'} (${c.detail})`).join('; ')}.`;
}

const u = (x: { uncertainty: number | null }) => (x.uncertainty !== null ? ` ± ${fixed(x.uncertainty, 2)}` : '');

/** The amendment body for one run of `teamName`. */
export function amendmentFromRun(run: CalorimetryRun, teamName: string): AmendmentBody {
  const date = run.createdAt.slice(0, 10);
  const citation = `${teamName}, calorimeter run “${run.label}” (${run.id}), ${date}`;
  if (run.kind === 'bomb') {
    const r = run.result;
    const corrections = [
      `energy equivalent ${fixed(r.energyEquivalent.value, 6)} J/K (${r.energyEquivalent.basis})`,
      `${r.runs.length} sample run(s)`,
      r.standardState.note,
    ];
    return {
      title: `ΔcH° of ${run.inputs.sample.formula}(${run.inputs.sample.phase}) from bomb calorimetry`,
      rationale: [
        `Measured by the team in a combustion bomb. ${corrections.join('; ')}.`,
        r.energyEquivalent.certificate
          ? `Calibration: ${r.energyEquivalent.runs.length} benzoic-acid run(s) against ${r.energyEquivalent.certificate.citation} (certified massic energy ${fixed(r.energyEquivalent.certificate.value, 6)} J/g): ε = ${fixed(r.energyEquivalent.value, 6)}${u(r.energyEquivalent)} J/K.`
          : `Calibration: energy equivalent typed, ε = ${fixed(r.energyEquivalent.value, 6)}${u(r.energyEquivalent)} J/K.`,
        `Derivation: massic energy ${fixed(r.massicEnergy.value, 6)}${u(r.massicEnergy)} J/g × M = ${fixed(r.combustion.molarMass, 6)} g/mol → ΔcU = ${fixed(r.deltaCU.value, 6)}${u(r.deltaCU)} kJ/mol; ΔcH° = ΔcU + Δn(gas)·RT = ΔcU + (${r.combustion.deltaNGas}) × ${fixed(r.rt, 5)} kJ/mol = ${fixed(r.deltaCH.value, 6)}${u(r.deltaCH)} kJ/mol${r.deltaFH ? `; ΔfH° of the sample by Hess's law ${fixed(r.deltaFH.value, 6)}${u(r.deltaFH)} kJ/mol` : ''}.`,
        correctionsOf(run),
        `Readings and inputs are kept with the run${run.evidence ? ` (file ${run.evidence.fileName}, attached as evidence)` : ''}; auxiliary ΔfH° from library revision ${r.libraryRevision ?? '—'}.`,
      ].join('\n\n'),
      entries: [
        {
          kind: 'add-reaction',
          equation: r.combustion.equation,
          deltaH: { value: r.deltaCH.value, uncertainty: r.deltaCH.uncertainty },
          temperature: temperatureOf(run),
          method: 'combustion-calorimetry',
          source: { citation },
          provenance: 'entered',
          note: `Massic energy ${fixed(r.massicEnergy.value, 6)} J/g; Δn(gas) = ${r.combustion.deltaNGas}; ${r.standardState.note}`,
        },
      ],
    };
  }
  const r = run.result;
  const molal = run.inputs.concentrations?.find((c) => c.unit === 'mol/kg');
  return {
    title: `ΔH of ${r.equation} from solution calorimetry`,
    rationale: [
      `Measured by the team in a constant-pressure calorimeter; ΔT ${r.deltaT.source === 'series' ? `corrected for drift (${r.deltaT.drift?.method})` : 'from initial and final readings'}. ${r.basis}`,
      r.heatCapacity
        ? `Calibration: calorimeter heat capacity ${fixed(r.heatCapacity.value)}${u(r.heatCapacity)} J/K${r.calibration ? ` from ${r.calibration.runs.length} calibration run(s)` : ''}.`
        : '',
      `Derivation: q = ${fixed(r.q.value)}${u(r.q)} kJ from ΔT = ${fixed(r.deltaT.value)}${u(r.deltaT)} K; n(${r.limiting.species}) = ${fixed(r.limiting.amount.value)} mol, ξ = n/ν = ${fixed(r.extent.value)} mol (ν = ${r.limiting.coefficient}); ΔH = −q/ξ = ${fixed(r.deltaH.value)}${u(r.deltaH)} kJ/mol.`,
      correctionsOf(run),
      `Readings and inputs are kept with the run${run.evidence ? ` (file ${run.evidence.fileName}, attached as evidence)` : ''}.`,
    ]
      .filter(Boolean)
      .join('\n\n'),
    entries: [
      {
        kind: 'add-reaction',
        equation: r.equation,
        deltaH: { value: r.deltaH.value, uncertainty: r.deltaH.uncertainty },
        temperature: temperatureOf(run),
        method: 'solution-calorimetry',
        ...(molal ? { molality: molal.value } : {}),
        source: { citation },
        provenance: 'entered',
        note: `q = ${fixed(r.q.value)} kJ; ΔT = ${fixed(r.deltaT.value)} K; extent ${fixed(r.extent.value)} mol; ${r.concentrations.map((c) => `${c.species} ${c.value} ${c.unit}`).join(', ') || 'concentrations not recorded'}.`,
      },
    ],
  };
}

/**
 * The run's readings as an evidence file for the amendment: the text as uploaded, named .csv so the
 * server checks it as UTF-8 CSV (it refuses anything else).
 */
export function readingsFile(evidence: { fileName: string; text: string }): File {
  const name = /\.(csv|txt)$/i.test(evidence.fileName) ? evidence.fileName : `${evidence.fileName}.csv`;
  return new File([evidence.text], name, { type: name.endsWith('.txt') ? 'text/plain' : 'text/csv' });
}
