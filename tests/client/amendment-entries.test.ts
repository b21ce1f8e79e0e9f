import { describe, expect, it } from 'vitest';
import { amendmentInputSchema } from '@shared/schemas/amendments';
import {
  addedSourceKeys,
  addedSpeciesKeys,
  deprecationEntry,
  emptyReactionForm,
  emptySourceChoice,
  emptySourceForm,
  emptySpeciesForm,
  entryLine,
  entryMessages,
  reactionEntry,
  selectionEntry,
  sourceEntry,
  speciesEntry,
  valueEntry,
} from '@/lib/amendment-entries';

// Figures below are invented for the form tests; no chemistry is computed here.
const citation = { mode: 'citation' as const, key: null, citation: 'Author, A. J. Invented Thermochem. 1 (2001) 1' };

describe('valueEntry', () => {
  it('makes a revise-value entry with ΔfH° from a library source key', () => {
    const r = valueEntry('dfH298', {
      species: 'CO2(g)',
      value: -393.2,
      uncertainty: 0.2,
      source: { mode: 'key', key: 'codata-1989', citation: '' },
      select: true,
    });
    expect(r).toEqual({
      ok: true,
      entry: {
        kind: 'revise-value',
        species: 'CO2(g)',
        deltaFH: { value: -393.2, uncertainty: 0.2 },
        source: { key: 'codata-1989' },
        select: true,
      },
    });
  });

  it('puts S° in `entropy` (revise-value carries one property per entry) and keeps a missing uncertainty as null', () => {
    const r = valueEntry('S298', { species: 'H2O(l)', value: 70, uncertainty: null, source: citation, select: false });
    expect(r.ok && r.entry).toMatchObject({
      entropy: { value: 70, uncertainty: null },
      source: { citation: citation.citation },
    });
    expect(r.ok && 'deltaFH' in r.entry).toBe(false);
  });

  it('names the form fields that are missing, with the source in words rather than the union’s "Invalid input"', () => {
    const r = valueEntry('dfH298', {
      species: '',
      value: null,
      uncertainty: -1,
      source: emptySourceChoice(),
      select: true,
    });
    expect(r.ok).toBe(false);
    if (r.ok) return;
    expect(Object.keys(r.errors).sort()).toEqual(['source', 'species', 'uncertainty', 'value']);
    expect(r.errors.source).toBe('Pick a source.');
    expect(r.errors.uncertainty).toBe('must not be negative');
    const noCitation = valueEntry('dfH298', {
      species: 'CO2(g)',
      value: 1,
      uncertainty: null,
      source: { mode: 'citation', key: null, citation: '' },
      select: true,
    });
    expect(!noCitation.ok && noCitation.errors.source).toBe('Write the citation.');
  });
});

describe('speciesEntry', () => {
  it('splits synonyms on ";" and leaves out empty optional fields', () => {
    const r = speciesEntry({
      ...emptySpeciesForm(),
      key: 'C9H10O2(l, benzyl acetate)',
      name: 'benzyl acetate',
      synonyms: ' CH3COOCH2C6H5 ; ;phenylmethyl acetate',
    });
    expect(r).toEqual({
      ok: true,
      entry: {
        kind: 'set-species',
        key: 'C9H10O2(l, benzyl acetate)',
        name: 'benzyl acetate',
        synonyms: ['CH3COOCH2C6H5', 'phenylmethyl acetate'],
      },
    });
  });

  it('names key and name when they are empty', () => {
    const r = speciesEntry(emptySpeciesForm());
    expect(!r.ok && Object.keys(r.errors).sort()).toEqual(['key', 'name']);
  });
});

describe('sourceEntry', () => {
  const form = {
    ...emptySourceForm(),
    key: 'author-2001',
    kind: 'journal-article' as const,
    authors: 'Author, A.',
    title: 'Heats of things',
    year: 2001,
  };

  it('makes a new source with its optional fields null', () => {
    const r = sourceEntry(form);
    expect(r.ok && r.entry).toEqual({
      kind: 'set-source',
      source: {
        key: 'author-2001',
        kind: 'journal-article',
        authors: 'Author, A.',
        title: 'Heats of things',
        publication: null,
        year: 2001,
        volume: null,
        pages: null,
        doi: null,
        url: null,
      },
    });
  });

  it('names the source row it corrects by id', () => {
    const r = sourceEntry({ ...form, id: '00000000-0000-4000-8000-00000000000a' });
    expect(r.ok && r.entry).toMatchObject({ id: '00000000-0000-4000-8000-00000000000a' });
  });

  it('maps the nested schema paths (source.key) to the form fields', () => {
    const r = sourceEntry({ ...form, key: 'Not A Slug', kind: null, year: 1200 });
    expect(!r.ok && r.errors).toMatchObject({
      key: 'must be a lower-case slug such as codata-1989',
      kind: expect.any(String),
      year: expect.any(String),
    });
  });
});

describe('selectionEntry', () => {
  it('selects by the source key with a reason', () => {
    const r = selectionEntry({
      species: 'NH3(g)',
      property: 'cp',
      sourceKey: 'nasa-tm4513',
      reason: 'Covers 298.15 K.',
    });
    expect(r.ok && r.entry).toEqual({
      kind: 'select-value',
      species: 'NH3(g)',
      property: 'cp',
      source: { key: 'nasa-tm4513' },
      reason: 'Covers 298.15 K.',
    });
  });

  it('asks for the value to select and the reason', () => {
    const r = selectionEntry({ species: 'NH3(g)', property: 'dfH298', sourceKey: null, reason: '' });
    expect(!r.ok && r.errors).toMatchObject({ source: 'Pick the value to select.', reason: expect.any(String) });
  });
});

describe('reactionEntry', () => {
  it('makes an add-reaction entry with ΔrH, temperature and method', () => {
    const r = reactionEntry({
      ...emptyReactionForm(),
      equation: 'H2(g) + 1/2 O2(g) -> H2O(l)',
      value: -285.8,
      uncertainty: 0.1,
      method: 'combustion-calorimetry',
      source: citation,
    });
    expect(r.ok && r.entry).toEqual({
      kind: 'add-reaction',
      equation: 'H2(g) + 1/2 O2(g) -> H2O(l)',
      deltaH: { value: -285.8, uncertainty: 0.1 },
      temperature: 298.15,
      method: 'combustion-calorimetry',
      source: { citation: citation.citation },
    });
  });

  it('names the equation, ΔrH, method and source when missing, and a temperature not above 0 K', () => {
    const r = reactionEntry({ ...emptyReactionForm(), temperature: 0 });
    expect(!r.ok && Object.keys(r.errors).sort()).toEqual(['equation', 'method', 'source', 'temperature', 'value']);
  });
});

describe('deprecationEntry', () => {
  it('names the row by id with a reason, and asks for the row when none is picked', () => {
    const id = '00000000-0000-4000-8000-00000000000b';
    expect(deprecationEntry({ target: 'value', id, reason: 'A misprint in the source.' })).toEqual({
      ok: true,
      entry: { kind: 'deprecate', target: 'value', id, reason: 'A misprint in the source.' },
    });
    const r = deprecationEntry({ target: 'model', id: null, reason: '' });
    expect(!r.ok && r.errors).toMatchObject({ id: 'Pick the model.', reason: expect.any(String) });
  });
});

describe('the list of entries', () => {
  const entries = [
    {
      kind: 'set-source' as const,
      source: { key: 'author-2001', kind: 'journal-article' as const, authors: 'Author, A.', title: 'Heats of things' },
    },
    { kind: 'set-species' as const, key: 'C9H10O2(l, benzyl acetate)', name: 'benzyl acetate' },
    {
      kind: 'revise-value' as const,
      species: 'C9H10O2(l, benzyl acetate)',
      deltaFH: { value: -300.1, uncertainty: 1.5 },
      source: { key: 'author-2001' },
    },
  ];

  it('is one amendment body the shared schema accepts', () => {
    expect(amendmentInputSchema.safeParse({ title: 'Benzyl acetate', rationale: 'New data.', entries }).success).toBe(
      true,
    );
  });

  it('offers the sources and species earlier entries add', () => {
    expect(addedSourceKeys(entries)).toEqual(['author-2001']);
    expect(addedSpeciesKeys(entries)).toEqual(['C9H10O2(l, benzyl acetate)']);
  });

  it('says each entry in words, with a true minus sign', () => {
    expect(entryLine(entries[2]!)).toBe('ΔfH° of C9H10O2(l, benzyl acetate): −300.1 ± 1.5 kJ/mol, from author-2001');
    expect(entryLine(entries[0]!)).toBe('New source author-2001: Author, A., Heats of things');
    const id = '00000000-0000-4000-8000-00000000000c';
    expect(
      entryLine({ kind: 'deprecate', target: 'source', id, reason: 'Duplicate.' }, new Map([[id, 'nbs-1982']])),
    ).toBe('Deprecate the source nbs-1982: Duplicate.');
  });

  it('groups the server’s messages by entry and leaves the others out', () => {
    const grouped = entryMessages({
      title: 'Give a title.',
      'entries.2.species': 'No species CO3(g).',
      'entries.2': 'Clashes.',
      'entries.0.source.key': 'Unknown source.',
    });
    expect([...grouped.entries()]).toEqual([
      [2, ['species: No species CO3(g).', 'Clashes.']],
      [0, ['source.key: Unknown source.']],
    ]);
  });
});
