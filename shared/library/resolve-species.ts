/**
 * Species resolution: which library entry a species written in an equation means. Pure; the
 * caller supplies the library's entries for a Hill formula and charge.
 *
 * Rules (in this order):
 * - entries are matched by Hill formula and charge, so `CH3COOH` and `C2H4O2` find the same entries;
 * - a phase narrows them (`s` matches crystalline `cr` entries); a descriptor picks one among
 *   isomers and coexisting forms (`C4H10(g, 2-methylpropane)`, `C(cr, diamond)`), matched against
 *   the entry's descriptor, name or synonyms, case-insensitive;
 * - without a descriptor, several entries of one phase resolve only when exactly one of them is
 *   written with the same formula text, as its formula or a synonym (`C2H5OH` is ethanol, not
 *   dimethyl ether), or when the
 *   species is an element and one entry is its reference state — both said in a warning;
 * - without a phase, a single entry is used with a warning; several are never guessed.
 */

export interface ResolvableEntry {
  id: string;
  key: string;
  formula: string;
  phase: string;
  descriptor: string | null;
  name: string;
  synonyms: readonly string[];
  /** Element symbol when the entry is that element's reference state. */
  referenceState: string | null;
}

/** A species as written in an equation. */
export interface WrittenSpecies {
  formula: string;
  hill: string;
  charge: number;
  phase: string | null;
  descriptor: string | null;
  /** Element symbols it contains. */
  elements: readonly string[];
}

export type Resolution<E extends ResolvableEntry> =
  | { ok: true; entry: E; warning: string | null }
  | { ok: false; reason: 'missing' | 'ambiguous' | 'phase-missing'; message: string; candidates: E[] };

function keys(entries: readonly ResolvableEntry[]): string {
  return entries.map((e) => e.key).join(', ');
}

const phaseWords: Record<string, string> = {
  g: 'gas',
  l: 'liquid',
  cr: 'crystalline solid',
  am: 'amorphous solid',
  aq: 'aqueous solution',
};

function matchesDescriptor(entry: ResolvableEntry, descriptor: string): boolean {
  const d = descriptor.trim().toLowerCase();
  return (
    entry.descriptor?.toLowerCase() === d ||
    entry.name.toLowerCase() === d ||
    entry.synonyms.some((s) => s.toLowerCase() === d)
  );
}

/** Writes a species back as the user wrote it, for messages. */
function written(species: WrittenSpecies): string {
  const inside = [species.phase, species.descriptor].filter(Boolean).join(', ');
  return inside ? `${species.formula}(${inside})` : species.formula;
}

/**
 * Picks the library entry a written species means.
 * @param entries every library entry with the species' Hill formula and charge (any phase).
 */
export function resolveSpecies<E extends ResolvableEntry>(
  species: WrittenSpecies,
  entries: readonly E[],
): Resolution<E> {
  const label = written(species);
  if (entries.length === 0) {
    return {
      ok: false,
      reason: 'missing',
      message: `${label} is not in the library (no entry with formula ${species.hill}${species.charge ? ` and charge ${species.charge}` : ''}).`,
      candidates: [],
    };
  }
  const phase = species.phase === 's' ? 'cr' : species.phase;
  const pool: E[] = phase === null ? [...entries] : entries.filter((e) => e.phase === phase);
  if (pool.length === 0) {
    const held = [...new Set(entries.map((e) => phaseWords[e.phase] ?? e.phase))].join(', ');
    return {
      ok: false,
      reason: 'missing',
      message: `${label}: the library holds this formula only as ${held} (${keys(entries)}).`,
      candidates: [...entries],
    };
  }
  if (species.descriptor) {
    const chosen = pool.filter((e) => matchesDescriptor(e, species.descriptor!));
    if (chosen.length === 1) return { ok: true, entry: chosen[0]!, warning: null };
    return {
      ok: false,
      reason: chosen.length === 0 ? 'missing' : 'ambiguous',
      message:
        chosen.length === 0
          ? `${label}: no entry is called '${species.descriptor}'; the library has ${keys(pool)}.`
          : `${label} matches several entries: ${keys(chosen)}.`,
      candidates: chosen.length === 0 ? pool : chosen,
    };
  }
  if (pool.length === 1) {
    const entry = pool[0]!;
    const warning =
      phase === null ? `${label} has no phase label; the only library entry, ${entry.key}, was used.` : null;
    return { ok: true, entry, warning };
  }
  if (phase === null) {
    const phases = [...new Set(pool.map((e) => phaseWords[e.phase] ?? e.phase))];
    return {
      ok: false,
      reason: 'phase-missing',
      message: `${label} needs a phase label: the library has it as ${phases.join(', ')} (${keys(pool)}).`,
      candidates: pool,
    };
  }
  // Several entries of one phase: isomers or coexisting forms. The text as written (C2H5OH,
  // CH3OCH3) names one when it is that entry's formula or one of its formula synonyms.
  const sameText = pool.filter((e) => e.formula === species.formula || e.synonyms.includes(species.formula));
  if (sameText.length === 1) {
    const entry = sameText[0]!;
    return {
      ok: true,
      entry,
      warning: `${label} was read as ${entry.key} (${entry.name}), the entry written ${species.formula}; add a descriptor to choose another of ${keys(pool)}.`,
    };
  }
  if (species.elements.length === 1) {
    const reference = pool.find((e) => e.referenceState === species.elements[0]);
    if (reference) {
      return {
        ok: true,
        entry: reference,
        warning: `${label} was taken in its reference state, ${reference.key}; write a descriptor for another form (${keys(pool)}).`,
      };
    }
  }
  return {
    ok: false,
    reason: 'ambiguous',
    message: `${label} is ambiguous: add a descriptor naming one of ${keys(pool)}.`,
    candidates: pool,
  };
}
