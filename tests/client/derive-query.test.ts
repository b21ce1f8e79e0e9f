import { describe, expect, it } from 'vitest';
import {
  defaultDeriveState,
  deriveRequest,
  sameQuery,
  stateFromQuery,
  stateFromRequest,
  stateToQuery,
  type DeriveFormState,
} from '@/lib/derive-query';
import { emptyRow, fromGivenReaction } from '@/lib/given-reactions';

const TEAM = '3f2b9c1e-8d4a-4b6f-9e2d-1a2b3c4d5e6f';

const givenState = (): DeriveFormState => ({
  ...defaultDeriveState(),
  target: ' C(cr, graphite) + 1/2 O2(g) -> CO(g) ',
  using: 'given',
  reactions: [
    { ...emptyRow(), equation: 'C(cr, graphite) + O2(g) -> CO2(g)', deltaH: -393.51, uncertainty: 0.13 },
    emptyRow(),
    { ...emptyRow(), equation: 'CO(g) + 1/2 O2(g) -> CO2(g)', deltaH: -282.98, temperature: 25, temperatureUnit: 'C' },
  ],
});

describe('stateToQuery', () => {
  it('leaves out defaults, so an empty form has an empty address', () => {
    expect(stateToQuery(defaultDeriveState())).toEqual({});
  });

  it('keeps the target, the source, one r per filled row and the options', () => {
    const state = { ...givenState(), maxRoutes: 3, revision: 2, teamId: TEAM };
    expect(stateToQuery(state)).toEqual({
      t: 'C(cr, graphite) + 1/2 O2(g) -> CO(g)',
      from: 'given',
      r: [
        'C(cr, graphite) + O2(g) -> CO2(g) ; -393.51 ; 0.13',
        'CO(g) + 1/2 O2(g) -> CO2(g) ; -282.98 ;  ; kJ/mol ; 25 °C',
      ],
      routes: '3',
      rev: '2',
      team: TEAM,
    });
  });
});

describe('stateFromQuery', () => {
  it('reads back the state an address was made from (blank rows dropped)', () => {
    const state = { ...givenState(), maxRoutes: 3, revision: 2, teamId: TEAM };
    const back = stateFromQuery(stateToQuery(state));
    expect(back.problems).toEqual([]);
    expect(back.state).toEqual({
      ...state,
      target: state.target.trim(),
      reactions: state.reactions.filter((r) => r.equation !== ''),
    });
  });

  it('falls back to defaults for values it cannot use', () => {
    const { state } = stateFromQuery({ t: 'A(g) -> B(g)', from: 'elsewhere', routes: '99', rev: '-1', team: 'nope' });
    expect(state).toEqual({ ...defaultDeriveState(), target: 'A(g) -> B(g)' });
  });

  it('takes the first of repeated single values and reports unreadable reactions by their r number', () => {
    const { state, problems } = stateFromQuery({
      t: ['A(g) -> B(g)', 'ignored'],
      r: ['A(g) -> C(g) ; 1', 'C(g) -> B(g) ; lots'],
      team: TEAM.toUpperCase(),
    });
    expect(state.target).toBe('A(g) -> B(g)');
    expect(state.teamId).toBe(TEAM);
    expect(state.reactions.map((r) => r.equation)).toEqual(['A(g) -> C(g)']);
    expect(problems).toEqual([{ line: 2, column: 16, field: 'deltaH', message: '“lots” is not a number.' }]);
  });
});

describe('sameQuery', () => {
  it('ignores key order, empty values and single values given as lists', () => {
    expect(sameQuery({ t: 'x', from: 'given' }, { from: ['given'], t: 'x', r: [] })).toBe(true);
    expect(sameQuery({ t: 'x' }, { t: 'y' })).toBe(false);
    expect(sameQuery({ r: ['a', 'b'] }, { r: ['b', 'a'] })).toBe(false);
  });
});

describe('deriveRequest', () => {
  it('sends the filled given reactions only when they are used', () => {
    const state = givenState();
    expect(deriveRequest(state)).toEqual({
      target: 'C(cr, graphite) + 1/2 O2(g) -> CO(g)',
      using: 'given',
      reactions: [
        {
          equation: 'C(cr, graphite) + O2(g) -> CO2(g)',
          deltaH: { value: -393.51, uncertainty: 0.13, unit: 'kJ/mol' },
        },
        {
          equation: 'CO(g) + 1/2 O2(g) -> CO2(g)',
          deltaH: { value: -282.98, unit: 'kJ/mol' },
          temperature: { value: 25, unit: 'C' },
        },
      ],
    });
    expect(deriveRequest({ ...state, using: 'library' })).toEqual({
      target: 'C(cr, graphite) + 1/2 O2(g) -> CO(g)',
      using: 'library',
    });
  });

  it('carries routes, revision and team when they are not the defaults', () => {
    const request = deriveRequest({
      ...defaultDeriveState(),
      target: 'A(g) -> B(g)',
      maxRoutes: 8,
      revision: 1,
      teamId: TEAM,
    });
    expect(request).toEqual({ target: 'A(g) -> B(g)', using: 'library', maxRoutes: 8, revision: 1, teamId: TEAM });
  });
});

describe('stateFromRequest', () => {
  it('turns a saved request back into the form, with "both" when reactions were given without a source', () => {
    const request = deriveRequest(givenState());
    delete request.using;
    const rows = (request.reactions ?? []).map(fromGivenReaction);
    const state = stateFromRequest(request, rows);
    expect(state.using).toBe('both');
    expect(deriveRequest({ ...state, using: 'given' })).toEqual(deriveRequest(givenState()));
    expect(stateFromRequest({ target: 'A(g) -> B(g)' }, []).using).toBe('library');
  });
});
