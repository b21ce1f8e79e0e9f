/**
 * Text normalisation shared by the index and the queries, so both sides compare alike.
 */

// Control and format characters (NUL, BEL, zero-width joiners, BOM…) never belong to a name.
const CONTROL = /[\p{Cc}\p{Cf}]+/gu;
const COMBINING_MARKS = /\p{M}+/gu;
// Hyphen, non-breaking hyphen, figure dash, en dash, em dash, minus sign: chemists type all of them.
const DASHES = /[\u2010-\u2015\u2212]/g;
const QUOTES = /[\u2018\u2019\u2032]/g;
const SPACES = /\s+/g;
const PRINTABLE_ASCII = /^[\x20-\x7e]*$/;

/**
 * Lower-case, accents stripped (`é` → `e`), dashes and quotes unified, control characters
 * dropped, runs of white space collapsed to one space, trimmed. Greek letters stay (`α-pinene`).
 */
export function normalizeText(text: string): string {
  // Most names are printable ASCII: lower-casing and spacing is all they need.
  if (PRINTABLE_ASCII.test(text)) return text.toLowerCase().replace(SPACES, ' ').trim();
  return text
    .replace(CONTROL, ' ')
    .normalize('NFKD')
    .replace(COMBINING_MARKS, '')
    .toLowerCase()
    .replace(DASHES, '-')
    .replace(QUOTES, "'")
    .replace(SPACES, ' ')
    .trim();
}

/** The query text with control characters replaced by spaces and trimmed; case kept (formulas need it). */
export function stripControl(text: string): string {
  return text.replace(CONTROL, ' ').replace(SPACES, ' ').trim();
}

const LETTER = /\p{L}/u;

/**
 * Offsets (> 0) where a word starts inside a normalised term: a letter after anything that is
 * not a letter or digit. "1,2-dichloroethane" → [4]; "sodium chloride" → [7]. Offset 0 is the
 * whole term and is left out.
 */
export function wordStarts(term: string): number[] {
  const starts: number[] = [];
  let previousIsWordChar = true;
  for (let i = 0; i < term.length; i++) {
    const code = term.charCodeAt(i);
    const letter = isLetter(code, term, i);
    if (i > 0 && letter && !previousIsWordChar) starts.push(i);
    previousIsWordChar = letter || (code >= 48 && code <= 57);
  }
  return starts;
}

// ASCII without a regular expression (this runs for every character of every name at build).
function isLetter(code: number, text: string, at: number): boolean {
  if (code < 128) return (code >= 97 && code <= 122) || (code >= 65 && code <= 90);
  return LETTER.test(text[at] ?? '');
}

/** Plain code-unit order: the same on every machine and locale (localeCompare is not). */
export function compareCodeUnits(a: string, b: string): number {
  return a < b ? -1 : a > b ? 1 : 0;
}
