/**
 * The enthalpy panel's tables from the reaction-enthalpy reply: one row per species with its net
 * coefficient ν (products positive), the ΔfH° used with its source, ν·ΔfH°, ν·H°(T) as the reply
 * sums it, and its share of the variance of ΔrH°. Pure.
 */
import type { SourceRef } from '@shared/schemas/library';
import type { Provenance } from '@shared/schemas/library-core';
import type { ReactionEnthalpyResult } from '@shared/schemas/reaction-enthalpy';
import { fractionValue, type EnergyBasis } from './reaction-units';

export interface ContributionRow {
  speciesId: string;
  key: string;
  name: string;
  /** Net signed coefficient as text ("-1", "3/2"). */
  coefficient: string;
  deltaFH: { value: number; uncertainty: number | null } | null;
  source: SourceRef | null;
  provenance: Provenance | null;
  /** ν·ΔfH°(298.15 K), kJ/mol; null without a 298.15 K value. */
  atReference: number | null;
  /** ν·ΔfH° or ν·H°(T) as the reply sums it, kJ/mol. */
  atTemperature: number;
  /** |ν|·u, kJ/mol, null when not stated. */
  uncertainty: number | null;
  /** 0–1, null when not stated. */
  varianceShare: number | null;
}

/** Rows in the order of the reply's contributions (species merged). */
export function contributionRows(
  result: ReactionEnthalpyResult,
  provenanceOf: (speciesId: string) => Provenance | null,
): ContributionRow[] {
  return result.contributions.map((c) => {
    const term = result.terms.find((t) => t.speciesId === c.speciesId);
    const nu = fractionValue(c.coefficient);
    const deltaFH = term?.deltaFH ?? null;
    return {
      speciesId: c.speciesId,
      key: c.key,
      name: term?.name ?? c.key,
      coefficient: c.coefficient,
      deltaFH,
      source: term?.source ?? null,
      provenance: provenanceOf(c.speciesId),
      atReference: deltaFH ? nu * deltaFH.value : null,
      atTemperature: c.contribution,
      uncertainty: c.uncertainty,
      varianceShare: c.varianceShare,
    };
  });
}

/** Species keys of the rows whose value was typed from memory. */
export function memoryKeys(rows: readonly ContributionRow[]): string[] {
  return rows.filter((r) => r.provenance === 'memory').map((r) => r.key);
}

/** A share of the variance as text ("71.8 %", "< 0.1 %"). */
export function shareText(share: number | null): string {
  if (share === null) return 'not stated';
  const percent = share * 100;
  if (percent > 0 && percent < 0.1) return '< 0.1 %';
  return `${percent.toFixed(1)} %`;
}

/** The species a per-kg figure may refer to: each term's |ν| in the evaluated equation and its molar mass. */
export function perKgChoices(
  result: ReactionEnthalpyResult,
  molarMassOf: (speciesId: string) => number | null,
): { speciesId: string; key: string; coefficient: number; molarMass: number }[] {
  const out: { speciesId: string; key: string; coefficient: number; molarMass: number }[] = [];
  for (const c of result.contributions) {
    const m = molarMassOf(c.speciesId);
    const nu = Math.abs(fractionValue(c.coefficient));
    if (m !== null && m > 0 && nu > 0) out.push({ speciesId: c.speciesId, key: c.key, coefficient: nu, molarMass: m });
  }
  return out;
}

/** The display basis for the chosen unit; falls back to kJ/mol when the per-kg species is not available. */
export function energyBasis(
  unit: 'kJ/mol' | 'kcal/mol' | 'kJ/kg',
  perKgSpeciesId: string | null,
  choices: ReturnType<typeof perKgChoices>,
): EnergyBasis {
  if (unit === 'kcal/mol') return { unit };
  if (unit === 'kJ/kg') {
    const chosen = choices.find((c) => c.speciesId === perKgSpeciesId) ?? choices[0];
    if (chosen)
      return { unit, species: { key: chosen.key, coefficient: chosen.coefficient, molarMass: chosen.molarMass } };
  }
  return { unit: 'kJ/mol' };
}
