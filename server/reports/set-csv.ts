import Papa from 'papaparse';
import { GAS_CONSTANT } from '@shared/chemistry/thermo/constants';
import { itemLabel } from '@shared/reaction-sets/diff';
import type { ItemResult, SetEvaluation, SetItem } from '@shared/schemas/reaction-sets';

/**
 * Every result of a set as CSV, one row per item (papaparse writes it). Numbers are written as
 * numbers, negative ones included. Text cells that a spreadsheet would run as a formula (starting
 * with = + - @, a tab or a carriage return) get a leading apostrophe: the set's text is typed by
 * people, and an export must never run in a reader's spreadsheet (OWASP, "CSV Injection").
 */

export const CSV_COLUMNS = [
  'item',
  'kind',
  'label',
  'equation',
  'temperature_K',
  'deltaH_kJ_per_mol',
  'uncertainty_kJ_per_mol',
  'deltaH_298K_kJ_per_mol',
  'basis',
  'given_deltaH_kJ_per_mol',
  'library_deltaH_kJ_per_mol',
  'heat_kJ',
  'heat_uncertainty_kJ',
  'heat_direction',
  'adiabatic_rise_K',
  'library_revision',
  'sources',
  'problem',
  'calorimetry_run',
  'deltaT_K',
  'q_kJ',
  'deltaFH_kJ_per_mol',
  'deltaFH_uncertainty_kJ_per_mol',
] as const;

type Row = Record<(typeof CSV_COLUMNS)[number], string | number | null>;

/** Anything a spreadsheet reads as a formula: the first character is enough, whatever follows. */
const FORMULA_START = /^[=+\-@\t\r]/;

function row(item: SetItem, result: ItemResult, revision: number, position: number): Row {
  const out: Row = Object.fromEntries(CSV_COLUMNS.map((c) => [c, null])) as Row;
  out.item = position;
  out.kind = item.kind;
  out.label = item.label ?? itemLabel(item);
  out.library_revision = revision;
  out.problem = result.error?.message ?? null;
  if ('equation' in item && typeof item.equation === 'string') out.equation = item.equation;
  if (item.kind === 'derivation') out.equation = item.target;
  if (item.kind === 'note') out.problem = null;
  if (!result.value) return out;
  switch (result.kind) {
    case 'reaction': {
      const r = result.value!;
      out.equation = r.equation;
      out.temperature_K = r.temperature;
      out.deltaH_kJ_per_mol = r.deltaH.value;
      out.uncertainty_kJ_per_mol = r.deltaH.uncertainty;
      out.deltaH_298K_kJ_per_mol = r.deltaH298?.value ?? null;
      out.sources = r.sources.join('; ');
      break;
    }
    case 'given-reaction': {
      const g = result.value!;
      out.temperature_K = g.temperature;
      out.given_deltaH_kJ_per_mol = g.given.value;
      out.uncertainty_kJ_per_mol = g.given.uncertainty;
      out.library_deltaH_kJ_per_mol = g.library?.value ?? null;
      out.sources = [g.source, ...g.sources].filter(Boolean).join('; ');
      out.problem = g.libraryProblem;
      break;
    }
    case 'derivation': {
      const d = result.value!;
      out.equation = d.target;
      out.temperature_K = 298.15;
      out.deltaH_kJ_per_mol = d.deltaH?.value ?? null;
      out.uncertainty_kJ_per_mol = d.deltaH?.uncertainty ?? null;
      out.basis = d.basis;
      out.sources = d.sources.join('; ');
      break;
    }
    case 'quantities': {
      const q = result.value!;
      out.equation = q.equation;
      out.temperature_K = q.temperature;
      out.deltaH_kJ_per_mol = q.deltaH.value;
      out.uncertainty_kJ_per_mol = q.deltaH.uncertainty;
      out.heat_kJ = q.heat.value;
      out.heat_uncertainty_kJ = q.heat.uncertainty;
      out.heat_direction = q.direction;
      out.adiabatic_rise_K = q.adiabaticRise;
      out.sources = q.sources.join('; ');
      break;
    }
    case 'calorimetry-run': {
      // ΔH per mole of reaction as written (constant pressure) or ΔcH° of the sample (bomb).
      const c = result.value!;
      out.equation = c.equation;
      out.calorimetry_run = c.runKind;
      out.deltaH_kJ_per_mol = c.deltaH.value;
      out.uncertainty_kJ_per_mol = c.deltaH.uncertainty;
      out.sources = c.sources.join('; ');
      if (c.runKind === 'constant-pressure') {
        out.deltaT_K = c.result.deltaT.value;
        out.q_kJ = c.result.q.value;
      } else {
        // The temperature of Δn(gas)·R·T, read back from RT (kJ/mol).
        out.temperature_K = (c.result.rt * 1000) / GAS_CONSTANT;
        out.deltaFH_kJ_per_mol = c.result.deltaFH?.value ?? null;
        out.deltaFH_uncertainty_kJ_per_mol = c.result.deltaFH?.uncertainty ?? null;
      }
      break;
    }
  }
  return out;
}

export function setCsv(items: readonly SetItem[], evaluation: SetEvaluation): string {
  const byId = new Map(evaluation.results.map((r) => [r.itemId, r]));
  const rows = items.map((item, i) =>
    row(
      item,
      byId.get(item.id) ?? { itemId: item.id, kind: 'note', error: null, value: null },
      evaluation.libraryRevision,
      i + 1,
    ),
  );
  return Papa.unparse(
    { fields: [...CSV_COLUMNS], data: rows.map((r) => CSV_COLUMNS.map((c) => r[c])) },
    { escapeFormulae: FORMULA_START, newline: '\r\n', quotes: false },
  );
}
