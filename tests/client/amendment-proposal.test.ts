import { describe, expect, it } from 'vitest';
import type { CalorimetryRun } from '@shared/schemas/calorimetry-runs';
import { amendmentFromRun } from '@/lib/amendment-proposal';

const run = {
  kind: 'constant-pressure',
  id: '11111111-1111-4111-8111-111111111111',
  teamId: '22222222-2222-4222-8222-222222222222',
  label: 'Neutralisation 1',
  note: null,
  authorName: 'A. Chemist',
  libraryRevision: null,
  createdAt: '2026-12-02T10:00:00.000Z',
  updatedAt: '2026-12-02T10:00:00.000Z',
  evidence: { fileName: 'run1.csv', text: '0,22.5\n' },
  inputs: {
    solution: { mass: { value: 200, unit: 'g' } },
    temperature: { initial: { value: 22.5, unit: 'C' }, final: { value: 25.86, unit: 'C' } },
    reaction: {
      equation: 'HCl(aq) + NaOH(aq) -> NaCl(aq) + H2O(l)',
      limiting: { term: 0, amount: { value: 0.05, unit: 'mol' } },
    },
    concentrations: [{ species: 'HCl(aq)', value: 0.25, unit: 'mol/kg' }],
  },
  result: {
    equation: 'HCl(aq) + NaOH(aq) -> NaCl(aq) + H2O(l)',
    deltaT: { value: 3.36, uncertainty: 0.01, unit: 'K', source: 'readings', drift: null },
    q: { value: 2.81, uncertainty: 0.01, unit: 'kJ' },
    deltaH: { value: -56.2, uncertainty: 0.2, unit: 'kJ/mol' },
    extent: { value: 0.05, uncertainty: null, unit: 'mol' },
    limiting: {
      term: 0,
      species: 'HCl(aq)',
      coefficient: '1',
      amount: { value: 0.05, uncertainty: null, unit: 'mol' },
    },
    heatCapacity: { value: 0, uncertainty: null, unit: 'J/K' },
    calibration: null,
    concentrations: [{ species: 'HCl(aq)', value: 0.25, unit: 'mol/kg' }],
    basis: 'ΔH at the run’s concentrations.',
  },
} as unknown as CalorimetryRun;

describe('amendmentFromRun', () => {
  it('carries ΔH, its standard uncertainty, temperature, method, molality and the run as source', () => {
    const body = amendmentFromRun(run, 'Kestrel Bay');
    expect(body.entries).toHaveLength(1);
    const entry = body.entries[0]!;
    expect(entry).toMatchObject({
      kind: 'add-reaction',
      equation: 'HCl(aq) + NaOH(aq) -> NaCl(aq) + H2O(l)',
      deltaH: { value: -56.2, uncertainty: 0.2 },
      method: 'solution-calorimetry',
      molality: 0.25,
      provenance: 'entered',
    });
    expect(entry.temperature).toBeCloseTo(299.01, 2);
    expect(entry.source.citation).toContain('Kestrel Bay');
    expect(entry.source.citation).toContain('Neutralisation 1');
    expect(entry.source.citation).toContain('2026-12-02');
    expect(body.rationale).toContain('run1.csv');
  });

  it('carries the derivation (q, n, ξ, ΔH) and each correction applied or not in the rationale', () => {
    const body = amendmentFromRun(run, 'Kestrel Bay');
    // q = 2.81 kJ, ξ = 0.05 mol: ΔH = −2.81/0.05 = −56.2 kJ/mol (Chang's worked neutralisation, from memory).
    expect(body.rationale).toContain('q = 2.81 ± 0.01 kJ');
    expect(body.rationale).toContain('n(HCl(aq)) = 0.05 mol');
    expect(body.rationale).toContain('ΔH = −q/ξ = -56.2 ± 0.2 kJ/mol');
    expect(body.rationale).toMatch(/Drift \(heat exchange\) not applied/);
    expect(body.rationale).toMatch(/Specific heat of the solution not applied \(water's 4\.184/);
  });
});
