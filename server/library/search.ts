import { buildSpeciesIndex, type SpeciesIndex, type SpeciesIndexEntry } from '@shared/search/index';
import type { LibrarySnapshot, SpeciesEntry } from './snapshot';

/** A search entry that keeps its library species. */
export interface IndexedSpecies extends SpeciesIndexEntry {
  species: SpeciesEntry;
}

const indexes = new WeakMap<LibrarySnapshot, SpeciesIndex<IndexedSpecies>>();

/** Element symbols of a Hill formula ("C2H6O" → C, H, O). */
export function elementsOfHill(hill: string): string[] {
  return [...new Set(hill.match(/[A-Z][a-z]?/g) ?? [])];
}

/** The search index of a snapshot, built on first use and kept as long as the snapshot is. */
export function speciesIndexOf(snapshot: LibrarySnapshot): SpeciesIndex<IndexedSpecies> {
  let index = indexes.get(snapshot);
  if (!index) {
    index = buildSpeciesIndex(
      [...snapshot.species.values()].map((s) => ({
        id: s.id,
        key: s.key,
        formula: s.formula,
        hill: s.hill,
        phase: s.phase,
        descriptor: s.descriptor,
        charge: s.charge,
        name: s.name,
        synonyms: s.synonyms,
        cas: s.cas,
        inchikey: s.inchikey,
        elements: elementsOfHill(s.hill),
        species: s,
      })),
    );
    indexes.set(snapshot, index);
  }
  return index;
}
