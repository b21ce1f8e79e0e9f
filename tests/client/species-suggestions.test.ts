import { describe, expect, it } from 'vitest';
import { identityOfKey, phaseLabelOfKey, rewriteSpeciesPhase } from '@/lib/species-suggestions';
import { enthalpyProblems } from '@/lib/enthalpy-problems';
import { evaluatedEquation } from '@/lib/evaluated-equation';
import { parseEquation } from '@shared/chemistry/index';

describe('rewriteSpeciesPhase', () => {
  it('adds the chosen phase and descriptor to a species written without one', () => {
    const target = { hill: 'C', charge: 0, phase: null, descriptor: null };
    expect(rewriteSpeciesPhase('C + O2(g) -> CO2(g)', target, 'C(cr, graphite)')).toBe(
      'C(cr, graphite) + O2(g) -> CO2(g)',
    );
  });

  it('replaces the phase label as written and keeps the formula as typed', () => {
    const target = identityOfKey('C2H6O(l)')!;
    expect(rewriteSpeciesPhase('C2H5OH(l) + 3 O2(g) -> 2 CO2(g) + 3 H2O(l)', target, 'C2H6O(g, ethanol)')).toBe(
      'C2H5OH(g, ethanol) + 3 O2(g) -> 2 CO2(g) + 3 H2O(l)',
    );
  });

  it('treats s and cr as the same phase, and rewrites every term of the species', () => {
    const target = identityOfKey('H2O(l)')!;
    expect(rewriteSpeciesPhase('2 H2(g) + O2(g) -> H2O(l) + H2O (l)', target, 'H2O(g)')).toBe(
      '2 H2(g) + O2(g) -> H2O(g) + H2O(g)',
    );
    const lime = identityOfKey('CaO(cr)')!;
    expect(rewriteSpeciesPhase('CaO(s) + H2O(l) -> Ca(OH)2(s)', lime, 'CaO(cr)')).toBe(
      'CaO(cr) + H2O(l) -> Ca(OH)2(s)',
    );
  });

  it('keeps ions and their charges', () => {
    expect(phaseLabelOfKey('Na^+(aq)')).toBe('(aq)');
    const target = { hill: 'Na', charge: 1, phase: null, descriptor: null };
    expect(rewriteSpeciesPhase('Na+ + Cl- -> NaCl(cr)', target, 'Na^+(aq)')).toBe('Na+(aq) + Cl- -> NaCl(cr)');
  });
});

describe('enthalpyProblems', () => {
  const sent = evaluatedEquation(parseEquation('H2(g) + 1/2 O2(g) -> H2O')).terms;

  it('reads species problems and points each at the term as sent', () => {
    const details = {
      species: [
        {
          term: 2,
          species: 'H2O',
          reason: 'phase-missing',
          message: 'H2O needs a phase label.',
          candidates: ['H2O(cr)', 'H2O(g)', 'H2O(l)'],
        },
      ],
      libraryRevision: 1,
    };
    const [p] = enthalpyProblems(details, sent);
    expect(p).toMatchObject({ species: 'H2O', reason: 'phase-missing', candidates: ['H2O(cr)', 'H2O(g)', 'H2O(l)'] });
    expect(p!.target).toEqual({ hill: 'H2O', charge: 0, phase: null, descriptor: null });
  });

  it('reads the phases offered when a model ends before T', () => {
    const details = { temperature: 1500, problems: [], alternatives: { 'H2O(l)': ['H2O(g)'] }, libraryRevision: 1 };
    expect(enthalpyProblems(details, sent)).toEqual([
      {
        species: 'H2O(l)',
        reason: 'out-of-range',
        message: null,
        target: { hill: 'H2O', charge: 0, phase: 'l', descriptor: null },
        candidates: ['H2O(g)'],
      },
    ]);
  });

  it('gives nothing for other details', () => {
    expect(enthalpyProblems({ status: 'multiple' }, sent)).toEqual([]);
  });
});

describe('evaluatedEquation', () => {
  it('drops a typed ΔH and lists reactants then products', () => {
    const e = evaluatedEquation(parseEquation('2 H2(g) + O2(g) -> 2 H2O(l); ΔH = -571.6 kJ'));
    expect(e.text).toBe('2 H2(g) + O2(g) -> 2 H2O(l)');
    expect(e.terms.map((t) => t.hill)).toEqual(['H2', 'O2', 'H2O']);
  });
});
