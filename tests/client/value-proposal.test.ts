import { describe, expect, it } from 'vitest';
import { amendmentInputSchema } from '@shared/schemas/amendments';
import { proposalFieldOf, valueProposalBody, type ValueProposalForm } from '@/lib/value-proposal';
import { canPropose, diffSideText, signed } from '@/lib/amendment-words';

const form: ValueProposalForm = {
  title: 'Revised ΔfH° of NH3(g)',
  species: 'NH3(g)',
  value: -45.77,
  uncertainty: 0.3,
  sourceMode: 'citation',
  sourceId: null,
  citation: 'A. Author, J. Chem. Thermodyn. 1 (2000) 1',
  rationale: 'A re-measurement.',
};

describe('valueProposalBody', () => {
  it('makes one revise-value entry the shared schema accepts, with a citation as source', () => {
    const body = amendmentInputSchema.parse(valueProposalBody(form));
    expect(body.entries).toEqual([
      {
        kind: 'revise-value',
        species: 'NH3(g)',
        deltaFH: { value: -45.77, uncertainty: 0.3 },
        source: { citation: 'A. Author, J. Chem. Thermodyn. 1 (2000) 1' },
      },
    ]);
  });

  it('sends an existing source by its id', () => {
    const id = '44444444-4444-4444-8444-444444444444';
    const body = amendmentInputSchema.parse(valueProposalBody({ ...form, sourceMode: 'existing', sourceId: id }));
    expect(body.entries[0]).toMatchObject({ source: id });
  });

  it('keeps an empty uncertainty as null (the source states none)', () => {
    const body = amendmentInputSchema.parse(valueProposalBody({ ...form, uncertainty: null }));
    expect(body.entries[0]).toMatchObject({ deltaFH: { value: -45.77, uncertainty: null } });
  });

  it('fails the schema without a value, and the message goes under the value field', () => {
    const result = amendmentInputSchema.safeParse(valueProposalBody({ ...form, value: null }));
    expect(result.success).toBe(false);
    const path = result.error!.issues[0]!.path.join('.');
    expect(proposalFieldOf(path)).toBe('value');
  });
});

describe('amendment words', () => {
  it('writes a true minus and the sign of a change', () => {
    expect(signed(-1.5)).toBe('−1.50');
    expect(signed(0.25)).toBe('+0.25');
  });

  it('describes a diff side by value, uncertainty and unit', () => {
    const side = {
      value: -45.94,
      valueText: null,
      uncertainty: 0.35,
      unit: 'kJ/mol',
      source: null,
      provenance: null,
      text: null,
    };
    expect(diffSideText(side)).toBe('−45.94 ± 0.35 kJ/mol');
    expect(diffSideText(null)).toBe('—');
  });

  it('lets members, team admins and curators propose, not viewers or anonymous visitors', () => {
    const person = { id: '33333333-3333-4333-8333-333333333333', email: 'p@lab.example', displayName: 'P' };
    const t = (role: 'viewer' | 'member' | 'team_admin') => [{ id: person.id, name: 'T', slug: 't', role }];
    expect(canPropose({ user: null, teams: [], via: 'none' })).toBe(false);
    expect(canPropose({ user: { ...person, siteRoles: [] }, teams: t('viewer'), via: 'session' })).toBe(false);
    expect(canPropose({ user: { ...person, siteRoles: [] }, teams: t('member'), via: 'session' })).toBe(true);
    expect(canPropose({ user: { ...person, siteRoles: [] }, teams: t('team_admin'), via: 'session' })).toBe(true);
    expect(canPropose({ user: { ...person, siteRoles: ['curator'] }, teams: [], via: 'session' })).toBe(true);
  });
});
