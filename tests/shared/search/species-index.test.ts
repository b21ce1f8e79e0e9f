import { describe, expect, it } from 'vitest';
import {
  buildSpeciesIndex,
  SpeciesSearchOptionError,
  type SpeciesIndexEntry,
  type SpeciesPhase,
  type SpeciesSearchResult,
} from '@shared/search';

/**
 * A small library of real species. Names, formulas, Hill formulas, CAS RNs and InChIKeys are
 * typed from memory (as PubChem lists them); the CAS RNs are checked for valid check digits
 * below. Hill formulas are written by hand, not computed, so the fixture does not lean on the
 * code it feeds.
 */
function species(
  key: string,
  hill: string,
  name: string,
  more: { synonyms?: string[]; cas?: string; inchikey?: string; charge?: number } = {},
): SpeciesIndexEntry {
  const m = /^(.+)\((g|l|cr|am|aq)(?:, (.+))?\)$/.exec(key);
  if (!m) throw new Error(`bad fixture key ${key}`);
  return {
    id: key,
    key,
    formula: m[1]!,
    hill,
    phase: m[2] as SpeciesPhase,
    descriptor: m[3] ?? null,
    charge: more.charge ?? 0,
    name,
    synonyms: more.synonyms ?? [],
    cas: more.cas ?? null,
    inchikey: more.inchikey ?? null,
    elements: [...new Set(hill.match(/[A-Z][a-z]?/g))],
  };
}

const ETHANOL = { synonyms: ['ethyl alcohol', 'EtOH'], cas: '64-17-5', inchikey: 'LFQSCWFLJHTTHZ-UHFFFAOYSA-N' };
const WATER = { synonyms: ['dihydrogen monoxide'], cas: '7732-18-5', inchikey: 'XLYOFNOQVPJJNP-UHFFFAOYSA-N' };

const FIXTURE: SpeciesIndexEntry[] = [
  species('H2O(l)', 'H2O', 'water', WATER),
  species('H2O(g)', 'H2O', 'water', WATER),
  species('H2O(cr)', 'H2O', 'ice', { cas: '7732-18-5' }),
  species('CO2(g)', 'CO2', 'carbon dioxide', { cas: '124-38-9', inchikey: 'CURLTUGMZLYLDI-UHFFFAOYSA-N' }),
  species('CO(g)', 'CO', 'carbon monoxide', { cas: '630-08-0', inchikey: 'UGFAIRIUMAVXCW-UHFFFAOYSA-N' }),
  species('Co(cr)', 'Co', 'cobalt', { cas: '7440-48-4' }),
  species('Co(g)', 'Co', 'cobalt', { cas: '7440-48-4' }),
  species('Cu(cr)', 'Cu', 'copper', { cas: '7440-50-8' }),
  species('NO(g)', 'NO', 'nitric oxide', { synonyms: ['nitrogen monoxide'], cas: '10102-43-9' }),
  species('HF(g)', 'FH', 'hydrogen fluoride', { cas: '7664-39-3', inchikey: 'KRHYYFGTRYWZRS-UHFFFAOYSA-N' }),
  species('Hf(cr)', 'Hf', 'hafnium', { cas: '7440-58-6' }),
  species('CS(g)', 'CS', 'carbon monosulfide'),
  species('Cs(cr)', 'Cs', 'caesium', { synonyms: ['cesium'], cas: '7440-46-2' }),
  species('Sn(cr, white)', 'Sn', 'tin', { cas: '7440-31-5' }),
  species('Sn(cr, grey)', 'Sn', 'tin', { cas: '7440-31-5' }),
  species('TiN(cr)', 'NTi', 'titanium nitride', { cas: '25583-20-4' }),
  species('C2H5OH(l)', 'C2H6O', 'ethanol', ETHANOL),
  species('C2H5OH(g)', 'C2H6O', 'ethanol', ETHANOL),
  species('CH3OCH3(g)', 'C2H6O', 'dimethyl ether', {
    synonyms: ['methoxymethane'],
    cas: '115-10-6',
    inchikey: 'LCGLNKUTAGEVQW-UHFFFAOYSA-N',
  }),
  species('CH3OH(l)', 'CH4O', 'methanol', {
    synonyms: ['methyl alcohol'],
    cas: '67-56-1',
    inchikey: 'OKKJLVBELUTLKV-UHFFFAOYSA-N',
  }),
  species('HOCH2CH2NH2(l)', 'C2H7NO', 'ethanolamine', {
    synonyms: ['2-aminoethanol'],
    cas: '141-43-5',
    inchikey: 'HZAXFHJVJLSVMW-UHFFFAOYSA-N',
  }),
  species('CH4(g)', 'CH4', 'methane', { cas: '74-82-8', inchikey: 'VNWKTOKETHGBQD-UHFFFAOYSA-N' }),
  species('C2H6(g)', 'C2H6', 'ethane', { cas: '74-84-0', inchikey: 'OTMSDBZUPAUEDD-UHFFFAOYSA-N' }),
  species('C2H4(g)', 'C2H4', 'ethylene', {
    synonyms: ['ethene'],
    cas: '74-85-1',
    inchikey: 'VGGSQFUCUMXWEO-UHFFFAOYSA-N',
  }),
  species('C4H10(g, butane)', 'C4H10', 'butane', {
    synonyms: ['n-butane'],
    cas: '106-97-8',
    inchikey: 'IJDNQMDRQITEOD-UHFFFAOYSA-N',
  }),
  species('C4H10(g, 2-methylpropane)', 'C4H10', '2-methylpropane', {
    synonyms: ['isobutane'],
    cas: '75-28-5',
    inchikey: 'NNPPMTNAJDCUHE-UHFFFAOYSA-N',
  }),
  species('CH3COOH(l)', 'C2H4O2', 'acetic acid', {
    synonyms: ['ethanoic acid'],
    cas: '64-19-7',
    inchikey: 'QTBSBXVTURDRWK-UHFFFAOYSA-N',
  }),
  species('HCOOCH3(l)', 'C2H4O2', 'methyl formate', { synonyms: ['methyl methanoate'], cas: '107-31-3' }),
  species('NaCl(cr)', 'ClNa', 'sodium chloride', {
    synonyms: ['halite', 'rock salt'],
    cas: '7647-14-5',
    inchikey: 'FAPWRFPIFSIZLT-UHFFFAOYSA-M',
  }),
  species('Na^+(aq)', 'Na', 'sodium ion', { charge: 1 }),
  species('HCl(g)', 'ClH', 'hydrogen chloride', { cas: '7647-01-0', inchikey: 'VEXZGXHMUGYJMC-UHFFFAOYSA-N' }),
  species('H2(g)', 'H2', 'hydrogen', { cas: '1333-74-0', inchikey: 'UFHFLCQGNIYNRP-UHFFFAOYSA-N' }),
  species('CH3Cl(g)', 'CH3Cl', 'chloromethane', {
    synonyms: ['methyl chloride'],
    cas: '74-87-3',
    inchikey: 'NEHMKBQYUWJMIP-UHFFFAOYSA-N',
  }),
  species('CH2Cl2(l)', 'CH2Cl2', 'dichloromethane', {
    synonyms: ['methylene chloride'],
    cas: '75-09-2',
    inchikey: 'YMWUJEATGCHHMB-UHFFFAOYSA-N',
  }),
  species('SO2(g)', 'O2S', 'sulfur dioxide', { cas: '7446-09-5', inchikey: 'RAHZWNYVWXNFOC-UHFFFAOYSA-N' }),
  species('SO4^2-(aq)', 'O4S', 'sulfate ion', { charge: -2 }),
  species('C(cr, graphite)', 'C', 'graphite', { cas: '7782-42-5' }),
  species('C(cr, diamond)', 'C', 'diamond', { cas: '7782-40-3' }),
];

const index = buildSpeciesIndex(FIXTURE);
const keysOf = (result: SpeciesSearchResult): string[] => result.hits.map((h) => h.entry.key);

describe('the fixture', () => {
  // CAS RN check digit: Σ (digit × position from the right, check digit excluded) mod 10
  // (CAS Registry Number format, as CAS publishes it; from memory).
  it('has CAS RNs with valid check digits', () => {
    for (const e of FIXTURE) {
      if (!e.cas) continue;
      const digits = e.cas.replace(/-/g, '');
      const body = digits.slice(0, -1).split('').reverse();
      const sum = body.reduce((s, d, i) => s + Number(d) * (i + 1), 0);
      expect(sum % 10, e.cas).toBe(Number(digits.slice(-1)));
    }
  });
});

describe('buildSpeciesIndex: formulas', () => {
  it('finds CO2 from "co2" whatever the case', () => {
    for (const q of ['co2', 'CO2', 'Co2', 'cO2']) {
      const result = index.search(q);
      expect(result.hits[0]?.entry.key, q).toBe('CO2(g)');
      expect(result.hits[0]?.match.tier).toBe('formula');
      expect(result.readings).toEqual(['CO2']);
    }
  });

  it('returns both readings of "co": carbon monoxide first, then cobalt, and says so', () => {
    const result = index.search('co');
    expect(result.readings).toEqual(['CO', 'Co']);
    expect(keysOf(result).slice(0, 3)).toEqual(['CO(g)', 'Co(cr)', 'Co(g)']);
    expect(result.hits.slice(0, 3).map((h) => h.match.reading)).toEqual(['CO', 'Co', 'Co']);
  });

  it('puts the reading typed with its case first ("Co" → cobalt first)', () => {
    const result = index.search('Co');
    expect(result.readings).toEqual(['Co', 'CO']);
    expect(keysOf(result).slice(0, 3)).toEqual(['Co(cr)', 'Co(g)', 'CO(g)']);
  });

  it.each([
    ['no', ['NO']],
    ['hf', ['HF', 'Hf']],
    ['cs', ['CS', 'Cs']],
    ['sn', ['Sn']],
    ['cu', ['Cu']],
  ])('reads "%s" as %j (only readings that find species are listed)', (query, readings) => {
    const result = index.search(query);
    expect(result.readings).toEqual(readings);
    const formulaHits = result.hits.filter((h) => h.match.tier === 'formula');
    expect(new Set(formulaHits.map((h) => h.match.reading))).toEqual(new Set(readings));
  });

  it('groups isomers by Hill formula, exact-formula hits first ("C2H5OH" → ethanol, then dimethyl ether)', () => {
    const result = index.search('C2H5OH');
    expect(keysOf(result).slice(0, 3)).toEqual(['C2H5OH(g)', 'C2H5OH(l)', 'CH3OCH3(g)']);
    expect(result.hits.slice(0, 3).map((h) => h.match.tier)).toEqual(['formula', 'formula', 'hill']);
  });

  it('finds every isomer from a Hill formula typed in lower case', () => {
    const result = index.search('c2h4o2');
    expect(keysOf(result)).toEqual(['CH3COOH(l)', 'HCOOCH3(l)']);
    expect(result.hits.every((h) => h.match.tier === 'hill' && h.match.text === 'C2H4O2')).toBe(true);
    expect(keysOf(index.search('C4H10'))).toEqual(['C4H10(g, 2-methylpropane)', 'C4H10(g, butane)']);
  });

  it('reads a phase written after the formula ("H2O(l)", "h2o(g)", "(s)" as cr)', () => {
    expect(keysOf(index.search('H2O(l)'))).toEqual(['H2O(l)']);
    const gas = index.search('h2o(g)');
    expect(keysOf(gas)).toEqual(['H2O(g)']);
    expect(gas.queryPhase).toBe('g');
    expect(keysOf(index.search('h2o(s)'))).toEqual(['H2O(cr)']);
    expect(keysOf(index.search('c(cr, diamond)'))).toEqual(['C(cr, diamond)']);
  });

  it('reads a lower-case word that is a name as the name first ("tin" → tin, then TiN)', () => {
    const tin = index.search('tin');
    expect(tin.hits.map((h) => [h.entry.key, h.match.tier])).toEqual([
      ['Sn(cr, grey)', 'exact'],
      ['Sn(cr, white)', 'exact'],
      ['TiN(cr)', 'formula'],
    ]);
    expect(tin.readings).toEqual(['TiN']);
    // Typed in formula case, the formula comes first.
    expect(keysOf(index.search('TiN'))[0]).toBe('TiN(cr)');
  });

  it('matches charged species by formula and charge', () => {
    expect(keysOf(index.search('na+'))).toEqual(['Na^+(aq)']);
    expect(keysOf(index.search('SO4^2-(aq)'))).toEqual(['SO4^2-(aq)']);
    // A neutral Na or SO4 would be another species: none in the fixture.
    expect(index.search('SO4').total).toBe(0);
  });
});

describe('buildSpeciesIndex: names, CAS RN and InChIKey', () => {
  it('finds a name and a synonym exactly, case-insensitively', () => {
    const result = index.search('Ethyl Alcohol');
    expect(keysOf(result).slice(0, 2)).toEqual(['C2H5OH(g)', 'C2H5OH(l)']);
    expect(result.hits[0]?.match).toMatchObject({ tier: 'exact', field: 'synonym', text: 'ethyl alcohol' });
  });

  it('finds names by prefix and by the start of an inner word', () => {
    const result = index.search('chlor');
    expect(result.hits.map((h) => [h.entry.key, h.match.tier])).toEqual([
      ['CH3Cl(g)', 'prefix'],
      ['HCl(g)', 'word-prefix'],
      ['CH2Cl2(l)', 'word-prefix'], // "methylene chloride"
      ['NaCl(cr)', 'word-prefix'],
    ]);
  });

  it('finds a name with one typo ("ethanl" → ethanol)', () => {
    const result = index.search('ethanl');
    expect(keysOf(result).slice(0, 2)).toEqual(['C2H5OH(g)', 'C2H5OH(l)']);
    expect(result.hits[0]?.match.tier).toBe('fuzzy');
    expect(result.hits[0]?.match.score).toBeGreaterThan(0);
    expect(keysOf(index.search('dichlormethane'))[0]).toBe('CH2Cl2(l)');
    expect(keysOf(index.search('caesuim'))[0]).toBe('Cs(cr)');
  });

  it('finds a CAS RN with or without hyphens', () => {
    for (const q of ['64-17-5', '64175', ' 64-17-5 ']) {
      const result = index.search(q);
      expect(keysOf(result), q).toEqual(['C2H5OH(g)', 'C2H5OH(l)']);
      expect(result.hits[0]?.match).toMatchObject({ tier: 'exact', field: 'cas', text: '64-17-5' });
    }
  });

  it('finds an InChIKey, full or by its first block, in any case', () => {
    for (const q of ['LFQSCWFLJHTTHZ-UHFFFAOYSA-N', 'LFQSCWFLJHTTHZ', 'lfqscwfljhtthz-uhfffaoysa-n']) {
      const result = index.search(q);
      expect(keysOf(result), q).toEqual(['C2H5OH(g)', 'C2H5OH(l)']);
      expect(result.hits[0]?.match.field).toBe('inchikey');
    }
  });
});

describe('buildSpeciesIndex: filters and paging', () => {
  it('keeps only the phases asked for', () => {
    expect(keysOf(index.search('water', { phase: 'g' }))).toEqual(['H2O(g)']);
    expect(keysOf(index.search('h2o', { phase: ['cr', 'l'] }))).toEqual(['H2O(cr)', 'H2O(l)']);
    // A phase in the query that the options exclude leaves nothing.
    expect(index.search('H2O(g)', { phase: 'l' }).total).toBe(0);
  });

  it('keeps only species containing every element asked for', () => {
    expect(keysOf(index.search('hydrogen', { elements: ['Cl'] }))).toEqual(['HCl(g)']);
    expect(keysOf(index.search('methyl', { elements: ['c', 'CL'] }))).toEqual(['CH3Cl(g)', 'CH2Cl2(l)']);
    expect(index.search('water', { elements: ['Hf'] }).total).toBe(0);
  });

  it('finds an entry whose phase is not a library phase when no phase filter is set', () => {
    const odd = { ...FIXTURE[0]!, id: 'odd', key: 'H2O(s)', phase: 's' as SpeciesPhase };
    const withOdd = buildSpeciesIndex([...FIXTURE, odd]);
    expect(keysOf(withOdd.search('h2o'))).toContain('H2O(s)');
    expect(keysOf(withOdd.search('h2o', { phase: 'cr' }))).toEqual(['H2O(cr)']);
  });

  it('pages with limit and offset and counts every hit in total', () => {
    const all = index.search('meth', { limit: 200 });
    expect(all.total).toBe(all.hits.length);
    expect(all.total).toBeGreaterThan(4);
    const page = index.search('meth', { limit: 2, offset: 2 });
    expect(page.total).toBe(all.total);
    expect(keysOf(page)).toEqual(keysOf(all).slice(2, 4));
    expect(index.search('meth', { offset: 1000 }).hits).toEqual([]);
  });

  it('refuses bad options, naming the field', () => {
    const fieldOf = (fn: () => unknown): string | undefined => {
      try {
        fn();
      } catch (err) {
        if (err instanceof SpeciesSearchOptionError) return err.field;
        throw err;
      }
      return undefined;
    };
    expect(fieldOf(() => index.search('co', { limit: 0 }))).toBe('limit');
    expect(fieldOf(() => index.search('co', { limit: 1.5 }))).toBe('limit');
    expect(fieldOf(() => index.search('co', { offset: -1 }))).toBe('offset');
    expect(fieldOf(() => index.search('co', { phase: 's' as SpeciesPhase }))).toBe('phase');
    expect(fieldOf(() => index.search('co', { elements: ['Xx'] }))).toBe('elements');
  });
});

describe('buildSpeciesIndex: junk', () => {
  it.each([
    ['empty', ''],
    ['blanks', '  \t '],
    ['very long', 'ethanol'.repeat(2000)],
    ['regular-expression characters', '.*[a-z]+(?:x)|^$\\'],
    ['brackets only', '(((([[{'],
    ['control characters', '\u0000\u0001\u0007\u001b[2J\u007f'],
    ['zero-width characters', '\u200b\u200d\ufeff'],
    ['a phase label alone', '(g)'],
  ])('returns nothing for %s without throwing', (_, query) => {
    const result = index.search(query);
    expect(result.hits).toEqual([]);
    expect(result.total).toBe(0);
    expect(result.readings).toEqual([]);
  });

  it('ignores control characters around a real query', () => {
    expect(keysOf(index.search('\u0000co2\u0007'))[0]).toBe('CO2(g)');
  });
});

describe('buildSpeciesIndex: ranking', () => {
  it('orders formula, exact, prefix and fuzzy hits in that order', () => {
    // "co": formula readings CO and Co; "copper" by prefix; too short for fuzzy.
    expect(keysOf(index.search('co'))).toEqual(['CO(g)', 'Co(cr)', 'Co(g)', 'Cu(cr)']);
    // "ethanol": exact name, then "ethanolamine" by prefix, then "methanol", which contains it,
    // then "ethanoic acid" and "methyl methanoate", which contain it with one letter changed.
    const result = index.search('ethanol');
    expect(result.hits.map((h) => [h.entry.key, h.match.tier])).toEqual([
      ['C2H5OH(g)', 'exact'],
      ['C2H5OH(l)', 'exact'],
      ['HOCH2CH2NH2(l)', 'prefix'],
      ['CH3OH(l)', 'fuzzy'],
      ['CH3COOH(l)', 'fuzzy'],
      ['HCOOCH3(l)', 'fuzzy'],
    ]);
    expect(result.hits[3]?.match.score).toBeLessThan(0.01); // fuse.js gives 0.001 to an exact match
    expect(result.hits[4]?.match.score).toBeCloseTo(1 / 7, 10);
  });

  it('orders equal matches by name, then key', () => {
    // "eth": prefix hits in the order of the matched text (ethane, ethanoic acid, ethanol, ethanolamine, ethene, ethyl alcohol).
    expect(keysOf(index.search('eth'))).toEqual([
      'C2H6(g)',
      'CH3COOH(l)',
      'C2H5OH(g)',
      'C2H5OH(l)',
      'HOCH2CH2NH2(l)',
      'C2H4(g)',
      'CH3OCH3(g)', // "ether" in "dimethyl ether", an inner word
    ]);
    // Same name "tin": by key.
    expect(keysOf(index.search('tin')).slice(0, 2)).toEqual(['Sn(cr, grey)', 'Sn(cr, white)']);
  });

  it('gives the same order whatever the order of the entries', () => {
    const reversed = buildSpeciesIndex([...FIXTURE].reverse());
    for (const q of ['co', 'eth', 'ethanl', 'c2h6o', 'chloride', 'water', 'methyl']) {
      expect(keysOf(reversed.search(q)), q).toEqual(keysOf(index.search(q)));
    }
  });
});
