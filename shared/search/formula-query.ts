/**
 * Reading a search query as a formula, whatever its case: "co" may be CO or Co, "c2h5oh" is
 * C2H5OH, "h2o(g)" is H2O in the gas phase. Every case reading that the equation core parses is
 * returned with its Hill formula and charge, so the index can look both up.
 */
import { isElementSymbol, parseFormula } from '../chemistry';
import { normalizeText } from './normalize';
import type { SpeciesPhase } from './types';

/** One way to read the query as a formula. */
export interface FormulaReading {
  /** The reading with element symbols in their proper case, as the user would have typed it (`Co`). */
  text: string;
  /** The formula in the core's caret notation (`Na^+`), comparable with entry formulas. */
  formula: string;
  /** Hill formula without charge. */
  hill: string;
  charge: number;
  /** True when the query was typed exactly like this (case included). */
  asTyped: boolean;
}

/** A phase label written at the end of a query, and its optional descriptor. */
export interface PhaseSuffix {
  /** The query without the phase label. */
  rest: string;
  phase: SpeciesPhase | null;
  /** Normalised descriptor (`graphite` in `C(cr, graphite)`), or null. */
  descriptor: string | null;
}

// "(s)" is how most people write a solid; the library files every crystalline solid as `cr`.
const PHASE_WORDS: Record<string, SpeciesPhase> = { g: 'g', l: 'l', s: 'cr', cr: 'cr', am: 'am', aq: 'aq' };
const PHASE_SUFFIX = /^(.*?)\s*\(\s*(g|l|s|cr|am|aq)\s*(?:,\s*([^()]*?)\s*)?\)$/i;

/** Splits a trailing phase label off a query: `H2O(l)` → `H2O` + `l`; `C(cr, graphite)` → `C` + `cr` + `graphite`. */
export function splitPhaseSuffix(query: string): PhaseSuffix {
  const m = PHASE_SUFFIX.exec(query);
  const rest = m?.[1];
  const word = m?.[2]?.toLowerCase();
  if (!m || !rest || !word) return { rest: query, phase: null, descriptor: null };
  const descriptor = m[3] ? normalizeText(m[3]) : '';
  return { rest, phase: PHASE_WORDS[word] ?? null, descriptor: descriptor === '' ? null : descriptor };
}

/** Longest query still tried as a formula; longer text is a name (or junk). */
export const MAX_FORMULA_QUERY_LENGTH = 64;
/** More case readings than this and the query is not treated as a formula (it is a word that happens to spell symbols). */
export const MAX_FORMULA_READINGS = 32;

// Letters, digits, brackets, hydrate dots, charge signs and super/subscript digits: the formula alphabet.
const FORMULA_CHARS = /^[A-Za-z0-9()[\]{}·•∙⋅*.+\-^⁺⁻⁰¹²³⁴⁵⁶⁷⁸⁹₀₁₂₃₄₅₆₇₈₉]+$/;
const LETTER_RUNS = /[A-Za-z]+|[^A-Za-z]+/g;

/**
 * Every reading of `text` as a formula with element symbols in proper case that the equation
 * core parses, deduplicated by formula; the reading typed exactly as given comes first, the
 * others follow in code-unit order (so separate symbols come before a two-letter symbol: CO before
 * Co). Returns [] for text that cannot be a formula. Never throws.
 */
export function formulaReadings(text: string): FormulaReading[] {
  if (text.length === 0 || text.length > MAX_FORMULA_QUERY_LENGTH || !FORMULA_CHARS.test(text)) return [];
  const candidates = caseReadings(text);
  const readings: FormulaReading[] = [];
  const seen = new Set<string>();
  for (const candidate of candidates) {
    const parsed = tryParse(candidate);
    if (!parsed || seen.has(parsed.formula)) continue;
    seen.add(parsed.formula);
    readings.push({ text: candidate, ...parsed, asTyped: candidate === text });
  }
  return readings.sort(
    (a, b) => Number(b.asTyped) - Number(a.asTyped) || (a.text < b.text ? -1 : a.text > b.text ? 1 : 0),
  );
}

function tryParse(candidate: string): Pick<FormulaReading, 'formula' | 'hill' | 'charge'> | null {
  try {
    const species = parseFormula(candidate);
    // A phase inside the formula part ("H2O(l)(g)") is not a formula query.
    if (species.phase !== null) return null;
    return { formula: species.formula, hill: species.hill, charge: species.charge };
  } catch {
    return null;
  }
}

/** All spellings of `text` whose letter runs split into element symbols; [] when there are too many. */
function caseReadings(text: string): string[] {
  const chunks = text.match(LETTER_RUNS) ?? [];
  const letterRuns = chunks.filter((c) => /^[A-Za-z]/.test(c));
  // The electron: "e-", "E^-".
  if (letterRuns.length === 1 && letterRuns[0]?.toLowerCase() === 'e') return [text.replace(/[Ee]/, 'e')];
  let readings = [''];
  for (const chunk of chunks) {
    const options = /^[A-Za-z]/.test(chunk) ? symbolSplits(chunk) : [chunk];
    if (options.length === 0) return [];
    const next: string[] = [];
    for (const head of readings) for (const tail of options) next.push(head + tail);
    if (next.length > MAX_FORMULA_READINGS) return [];
    readings = next;
  }
  return readings;
}

/** Ways to write a run of letters as element symbols: "co" → ["CO", "Co"]; capped. */
function symbolSplits(run: string): string[] {
  const out: string[] = [];
  const walk = (at: number, sofar: string): void => {
    if (out.length > MAX_FORMULA_READINGS) return;
    if (at === run.length) {
      out.push(sofar);
      return;
    }
    const one = run[at]!.toUpperCase();
    if (isElementSymbol(one)) walk(at + 1, sofar + one);
    if (at + 1 < run.length) {
      const two = one + run[at + 1]!.toLowerCase();
      if (isElementSymbol(two)) walk(at + 2, sofar + two);
    }
  };
  walk(0, '');
  return out;
}
