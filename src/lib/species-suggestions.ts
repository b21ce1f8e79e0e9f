/**
 * Turning the library's suggestions into edits of the equation the user typed: the formula stays
 * as written (C2H5OH stays C2H5OH), only its phase label and descriptor become the chosen library
 * key's ("C" → "C(cr, graphite)", "H2O(l)" → "H2O(g)"). Pure, over the equation parser.
 */
import { parseEquation, parseFormula, type ParsedSpecies } from '@shared/chemistry/index';

/** What identifies a species in an equation for matching: Hill formula, charge, phase, descriptor. */
export interface SpeciesIdentity {
  hill: string;
  charge: number;
  phase: string | null;
  descriptor: string | null;
}

/** `s` is how people write a crystalline solid; the library says `cr`. */
function samePhase(a: string | null, b: string | null): boolean {
  const norm = (p: string | null) => (p === 's' ? 'cr' : p);
  return norm(a) === norm(b);
}

function sameDescriptor(a: string | null, b: string | null): boolean {
  return (a ?? '').trim().toLowerCase() === (b ?? '').trim().toLowerCase();
}

export function identityOf(species: Pick<ParsedSpecies, 'hill' | 'charge' | 'phase' | 'descriptor'>): SpeciesIdentity {
  return { hill: species.hill, charge: species.charge, phase: species.phase, descriptor: species.descriptor };
}

/** The identity of a library key (`C2H6O(l)`, `C(cr, graphite)`, `Na^+(aq)`), or null if it cannot be read. */
export function identityOfKey(key: string): SpeciesIdentity | null {
  try {
    return identityOf(parseFormula(key));
  } catch {
    return null;
  }
}

/** The phase label of a library key as it is written after a formula: "(cr, graphite)". */
export function phaseLabelOfKey(key: string): string | null {
  const id = identityOfKey(key);
  if (!id || id.phase === null) return null;
  return id.descriptor ? `(${id.phase}, ${id.descriptor})` : `(${id.phase})`;
}

const PHASE_LABEL = /^[ \t]*\([ \t]*(?:aq|am|cr|s|l|g)(?![A-Za-z])[ \t]*(?:,[^)\n\r]*)?\)/;

/**
 * Rewrites every term of `text` that is the species `target` with the phase label of `key`.
 * Returns the new text, or null when the text cannot be read or holds no such term.
 */
export function rewriteSpeciesPhase(text: string, target: SpeciesIdentity, key: string): string | null {
  const label = phaseLabelOfKey(key);
  if (label === null) return null;
  let parsed;
  try {
    parsed = parseEquation(text);
  } catch {
    return null;
  }
  const edits = parsed.terms
    .map((t) => t.species)
    .filter(
      (s) =>
        s.hill === target.hill &&
        s.charge === target.charge &&
        samePhase(s.phase, target.phase) &&
        sameDescriptor(s.descriptor, target.descriptor),
    )
    .map((s) => {
      const written = PHASE_LABEL.exec(text.slice(s.span.end));
      return { start: s.span.end, end: s.span.end + (written ? written[0].length : 0) };
    })
    .sort((a, b) => b.start - a.start);
  if (edits.length === 0) return null;
  let out = text;
  for (const e of edits) out = out.slice(0, e.start) + label + out.slice(e.end);
  return out;
}
