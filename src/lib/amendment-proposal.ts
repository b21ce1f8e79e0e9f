/**
 * A saved calorimeter run turned into the body of a library amendment (POST /api/v1/amendments):
 * one "add-reaction" entry with the run's ΔH, its standard uncertainty, temperature, method and
 * the team, run and date as its source. Pure, no Vue.
 */
import type { CalorimetryRun } from '@shared/schemas/calorimetry-runs';

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
      rationale: `Measured by the team in a combustion bomb. ${corrections.join('; ')}. Readings and inputs are kept with the run${run.evidence ? ` (file ${run.evidence.fileName})` : ''}; auxiliary ΔfH° from library revision ${r.libraryRevision ?? '—'}.`,
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
    rationale: `Measured by the team in a constant-pressure calorimeter; ΔT ${r.deltaT.source === 'series' ? `corrected for drift (${r.deltaT.drift?.method})` : 'from initial and final readings'}. ${r.basis} Readings and inputs are kept with the run${run.evidence ? ` (file ${run.evidence.fileName})` : ''}.`,
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
