import { describe, expect, it } from 'vitest';
import { buildSpeciesIndex } from '@shared/search';
import { generateQueries, generateSpeciesLibrary } from '../../bench/fixtures/generate-species-library';

// The benchmark's synthetic library, checked here so the benchmark measures what it claims, and
// used to check the index on every species rather than a handful.
const { entries } = generateSpeciesLibrary(20_000);
const index = buildSpeciesIndex(entries);

describe('generateSpeciesLibrary', () => {
  it('is the same on every run', () => {
    expect(generateSpeciesLibrary(500)).toEqual(generateSpeciesLibrary(500));
    expect(generateSpeciesLibrary(500, 1)).not.toEqual(generateSpeciesLibrary(500, 2));
    expect(generateQueries(entries, 20)).toEqual(generateQueries(entries, 20));
  });

  it('has 20,000 species with unique keys, isomers and several phases', () => {
    expect(entries).toHaveLength(20_000);
    expect(new Set(entries.map((e) => e.key)).size).toBe(20_000);
    const perHill = new Map<string, number>();
    for (const e of entries) perHill.set(e.hill, (perHill.get(e.hill) ?? 0) + 1);
    expect(Math.max(...perHill.values())).toBeGreaterThan(5);
    expect(new Set(entries.map((e) => e.phase))).toEqual(new Set(['g', 'l', 'cr', 'aq']));
  });

  it('gives CAS-like numbers valid check digits', () => {
    // CAS RN check digit: Σ (digit × position from the right, check digit excluded) mod 10 (from memory).
    const invalid = entries.filter((e) => {
      if (!e.cas) return false;
      if (!/^\d{2,7}-\d{2}-\d$/.test(e.cas)) return true;
      const digits = e.cas.replace(/-/g, '');
      const sum = [...digits.slice(0, -1)].reverse().reduce((s, d, i) => s + Number(d) * (i + 1), 0);
      return sum % 10 !== Number(digits.slice(-1));
    });
    expect(invalid).toEqual([]);
    expect(entries.filter((e) => e.cas).length).toBeGreaterThan(15_000);
  });
});

describe('buildSpeciesIndex over the generated library', () => {
  it('finds each species first by its key (every fifth species)', () => {
    const missed = entries.filter((e, i) => i % 5 === 0 && index.search(e.key, { limit: 1 }).hits[0]?.entry !== e);
    expect(missed.map((e) => e.key)).toEqual([]);
  });

  it('finds each species by its name and by its CAS number, as exact hits (every twentieth species)', () => {
    const sample = entries.filter((_, i) => i % 20 === 0);
    const exact = (query: string, e: (typeof entries)[number], field: string): boolean =>
      index
        .search(query, { limit: 200 })
        .hits.some((h) => h.entry === e && h.match.tier === 'exact' && h.match.field === field);
    expect(sample.filter((e) => !exact(e.name, e, 'name')).map((e) => e.name)).toEqual([]);
    expect(sample.filter((e) => e.cas && !exact(e.cas, e, 'cas')).map((e) => e.cas)).toEqual([]);
  });

  it('finds a species within one typo of each typo query', () => {
    const typos = generateQueries(entries, 200).filter((q) => q.kind === 'typo');
    for (const q of typos) expect(index.search(q.text).total, q.text).toBeGreaterThan(0);
  });
});
