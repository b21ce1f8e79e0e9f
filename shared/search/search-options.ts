/**
 * Checks and normalises the options of one search.
 */
import { isElementSymbol } from '../chemistry';
import { SpeciesSearchOptionError } from './errors';
import type { SpeciesPhase, SpeciesSearchOptions } from './types';

export const DEFAULT_LIMIT = 20;
export const MAX_LIMIT = 200;
/** Deeper pages than this are not useful to anyone and only cost time. */
export const MAX_OFFSET = 10_000;

export const SPECIES_PHASES: readonly SpeciesPhase[] = ['g', 'l', 'cr', 'am', 'aq'];

export interface CheckedOptions {
  limit: number;
  offset: number;
  /** null = every phase. */
  phases: ReadonlySet<SpeciesPhase> | null;
  /** Element symbols in proper case, deduplicated. */
  elements: readonly string[];
}

/** Validates `options`; throws `SpeciesSearchOptionError` naming the field. */
export function checkOptions(options: SpeciesSearchOptions = {}): CheckedOptions {
  const limit = options.limit ?? DEFAULT_LIMIT;
  if (!Number.isInteger(limit) || limit < 1 || limit > MAX_LIMIT) {
    throw new SpeciesSearchOptionError(
      'limit',
      `limit must be a whole number from 1 to ${MAX_LIMIT}; got ${String(limit)}`,
    );
  }
  const offset = options.offset ?? 0;
  if (!Number.isInteger(offset) || offset < 0 || offset > MAX_OFFSET) {
    throw new SpeciesSearchOptionError(
      'offset',
      `offset must be a whole number from 0 to ${MAX_OFFSET}; got ${String(offset)}`,
    );
  }
  return { limit, offset, phases: checkPhases(options.phase), elements: checkElements(options.elements) };
}

function checkPhases(phase: SpeciesSearchOptions['phase']): ReadonlySet<SpeciesPhase> | null {
  if (phase === undefined) return null;
  const list: readonly unknown[] = typeof phase === 'string' ? [phase] : phase;
  for (const p of list) {
    if (!SPECIES_PHASES.includes(p as SpeciesPhase)) {
      throw new SpeciesSearchOptionError(
        'phase',
        `phase must be one of ${SPECIES_PHASES.join(', ')}; got ${JSON.stringify(p)}`,
      );
    }
  }
  return new Set(list as SpeciesPhase[]);
}

function checkElements(elements: readonly string[] | undefined): string[] {
  if (elements === undefined) return [];
  const out = new Set<string>();
  for (const raw of elements) {
    const symbol = typeof raw === 'string' ? properCaseSymbol(raw.trim()) : '';
    if (!isElementSymbol(symbol)) {
      throw new SpeciesSearchOptionError(
        'elements',
        `elements must be element symbols; ${JSON.stringify(raw)} is not one`,
      );
    }
    out.add(symbol);
  }
  return [...out];
}

// A single symbol has one proper case: "cl" → "Cl", "O" → "O".
function properCaseSymbol(text: string): string {
  return text.slice(0, 1).toUpperCase() + text.slice(1).toLowerCase();
}
