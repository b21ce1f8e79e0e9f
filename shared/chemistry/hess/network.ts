import type { KnownReaction } from './types';

/** What the combiner needs to know of a species besides its key. */
export interface NetworkSpecies {
  /** Net charge; charged closures must balance within aqueous and within gaseous species. */
  charge: number;
  phase: string | null;
}

/**
 * The known reactions of one library revision (and a request's given reactions), indexed for
 * the route search: which reactions contain each species, and which species can be closed by
 * their formation reaction (they have a ΔfH°). Built once per revision and shared.
 */
export interface HessNetwork {
  reactions: readonly KnownReaction[];
  byId: ReadonlyMap<string, number>;
  /** Indices of the measured and given reactions that contain each species. */
  bySpecies: ReadonlyMap<string, readonly number[]>;
  /** Index of the formation reaction of each species with a ΔfH°. */
  formation: ReadonlyMap<string, number>;
  species: ReadonlyMap<string, NetworkSpecies>;
}

/**
 * Indexes known reactions. A formation reaction must have the single term `+1 species`; the
 * elements in their reference states are left out of every reaction (their ΔfH° is 0 by
 * convention and every reaction balances them), so the search runs in the space of the other
 * species only.
 * @throws Error when two reactions share an id or a formation reaction is malformed.
 */
export function buildHessNetwork(
  reactions: readonly KnownReaction[],
  species: ReadonlyMap<string, NetworkSpecies>,
): HessNetwork {
  const byId = new Map<string, number>();
  const bySpecies = new Map<string, number[]>();
  const formation = new Map<string, number>();
  reactions.forEach((reaction, index) => {
    if (byId.has(reaction.id)) throw new Error(`duplicate known reaction id ${reaction.id}`);
    byId.set(reaction.id, index);
    if (reaction.kind === 'formation') {
      const term = reaction.terms[0];
      if (reaction.terms.length !== 1 || !term || !term.coefficient.equals(1))
        throw new Error(`formation reaction ${reaction.id} must be +1 of its species`);
      formation.set(term.species, index);
      return;
    }
    for (const term of reaction.terms) {
      const list = bySpecies.get(term.species);
      if (list) list.push(index);
      else bySpecies.set(term.species, [index]);
    }
  });
  return { reactions, byId, bySpecies, formation, species };
}

/** A network extended with more reactions (a request's given reactions) without copying the base index. */
export function extendHessNetwork(
  base: HessNetwork,
  extra: readonly KnownReaction[],
  species: ReadonlyMap<string, NetworkSpecies>,
): HessNetwork {
  if (extra.length === 0) return base;
  const reactions = [...base.reactions, ...extra];
  const byId = new Map(base.byId);
  const bySpecies = new Map<string, readonly number[]>(base.bySpecies);
  const formation = new Map(base.formation);
  extra.forEach((reaction, k) => {
    const index = base.reactions.length + k;
    if (byId.has(reaction.id)) throw new Error(`duplicate known reaction id ${reaction.id}`);
    byId.set(reaction.id, index);
    if (reaction.kind === 'formation') {
      formation.set(reaction.terms[0]!.species, index);
      return;
    }
    for (const term of reaction.terms) bySpecies.set(term.species, [...(bySpecies.get(term.species) ?? []), index]);
  });
  const allSpecies = new Map(base.species);
  for (const [key, info] of species) allSpecies.set(key, info);
  return { reactions, byId, bySpecies, formation, species: allSpecies };
}
