import { describe, expect, it } from 'vitest';
import {
  defaultSearchState,
  pageSummary,
  readElements,
  readingsSentence,
  speciesQueryParams,
  stateFromRouteQuery,
  stateToRouteQuery,
} from '@/lib/library-query';

describe('readElements', () => {
  it('writes symbols with a capital first letter, in a comma list', () => {
    expect(readElements('c o')).toEqual({ ok: true, value: 'C,O' });
    expect(readElements('cl, NA;  c')).toEqual({ ok: true, value: 'Cl,Na,C' });
    expect(readElements('  ')).toEqual({ ok: true, value: undefined });
  });

  it('names words that are not element symbols', () => {
    expect(readElements('C, Xx, carbon')).toEqual({ ok: false, unknown: ['Xx', 'Carbon'] });
  });
});

describe('speciesQueryParams', () => {
  it('leaves out empty filters and the relevance order', () => {
    expect(speciesQueryParams({ ...defaultSearchState, q: '  ethanol ' })).toEqual({
      q: 'ethanol',
      phase: undefined,
      element: undefined,
      source: undefined,
      provenance: undefined,
      sort: undefined,
      order: undefined,
      limit: 25,
      offset: 0,
      revision: undefined,
    });
  });

  it('sends filters, sort and paging', () => {
    const params = speciesQueryParams({
      ...defaultSearchState,
      phase: 'aq',
      elements: 'cl',
      source: 'codata-1989',
      provenance: 'memory',
      sort: 'deltaFH',
      order: 'desc',
      offset: 50,
      revision: 2,
    });
    expect(params).toMatchObject({
      phase: 'aq',
      element: 'Cl',
      source: 'codata-1989',
      provenance: 'memory',
      sort: 'deltaFH',
      order: 'desc',
      offset: 50,
      revision: 2,
    });
  });
});

describe('address-bar state', () => {
  it('round-trips what differs from the defaults', () => {
    const state = { ...defaultSearchState, q: 'co', phase: 'g' as const, sort: 'name' as const, offset: 25 };
    const query = stateToRouteQuery(state);
    expect(query).toEqual({ q: 'co', phase: 'g', sort: 'name', order: 'asc', offset: '25' });
    expect(stateFromRouteQuery(query)).toEqual(state);
  });

  it('falls back to defaults for anything unreadable', () => {
    expect(stateFromRouteQuery({ phase: 'plasma', sort: 'mass', limit: '7', offset: '-3', revision: '0' })).toEqual(
      defaultSearchState,
    );
  });
});

describe('page words', () => {
  it('says which rows are shown', () => {
    expect(pageSummary(25, 25, 1318)).toBe('Showing 26–50 of 1318');
    expect(pageSummary(0, 0, 0)).toBe('No species match');
  });

  it('says when a query reads as several formulas', () => {
    expect(readingsSentence('co', ['CO', 'Co'])).toBe(
      '“co” can be read as CO or Co: species of each reading are listed.',
    );
    expect(readingsSentence('co', ['CO'])).toBeNull();
    expect(readingsSentence('x', undefined)).toBeNull();
  });
});
