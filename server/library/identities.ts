import type { LibraryProperty } from '@shared/schemas/library-core';

/**
 * Identities of the things a library change touches, as the applier matches them (apply-set.ts):
 * sources and species by key, values by (species, property, source), models by (species,
 * source), selections by (species, property), measured reactions by key. Keys, not row ids, so a
 * species two amendments both add is one identity. Each revision records the identities it
 * touched; an amendment based on an earlier revision conflicts with a later one that touched any
 * identity it changes.
 */

export type SelectableProperty = LibraryProperty | 'cp';

export type Identity =
  | { type: 'source'; key: string }
  | { type: 'species'; key: string }
  | { type: 'value'; species: string; property: LibraryProperty; source: string }
  | { type: 'model'; species: string; source: string }
  | { type: 'selection'; species: string; property: SelectableProperty }
  | { type: 'reaction'; key: string };

export const identities = {
  source: (key: string) => `source:${key}`,
  species: (key: string) => `species:${key}`,
  value: (species: string, property: LibraryProperty, source: string) => `value:${species}|${property}|${source}`,
  model: (species: string, source: string) => `model:${species}|${source}`,
  selection: (species: string, property: SelectableProperty) => `selection:${species}|${property}`,
  reaction: (key: string) => `reaction:${key}`,
};

/** Reads an identity string back; null for text that is not one. */
export function parseIdentity(identity: string): Identity | null {
  const colon = identity.indexOf(':');
  if (colon < 0) return null;
  const type = identity.slice(0, colon);
  const parts = identity.slice(colon + 1).split('|');
  switch (type) {
    case 'source':
    case 'species':
    case 'reaction':
      return { type, key: parts.join('|') };
    case 'value':
      if (parts.length !== 3) return null;
      return { type, species: parts[0]!, property: parts[1] as LibraryProperty, source: parts[2]! };
    case 'model':
      if (parts.length !== 2) return null;
      return { type, species: parts[0]!, source: parts[1]! };
    case 'selection':
      if (parts.length !== 2) return null;
      return { type, species: parts[0]!, property: parts[1] as SelectableProperty };
    default:
      return null;
  }
}

export const propertyWords: Record<SelectableProperty, string> = {
  dfH298: 'ΔfH°',
  S298: 'S°',
  cp: 'heat-capacity model',
};

/** An identity in words: "ΔfH° of CO2(g) from codata-1989". */
export function identityLabel(identity: string): string {
  const parsed = parseIdentity(identity);
  if (!parsed) return identity;
  switch (parsed.type) {
    case 'source':
      return `source ${parsed.key}`;
    case 'species':
      return `species ${parsed.key}`;
    case 'reaction':
      return `measured reaction ${parsed.key}`;
    case 'value':
      return `${propertyWords[parsed.property]} of ${parsed.species} from ${parsed.source}`;
    case 'model':
      return `heat-capacity model of ${parsed.species} from ${parsed.source}`;
    case 'selection':
      return `the selected ${propertyWords[parsed.property]} of ${parsed.species}`;
  }
}
