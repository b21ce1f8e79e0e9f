/**
 * Every sentence the chemistry core shows to people: parse problems, refused requests, reasons a
 * reaction cannot be balanced, warnings and work limits. Code never reads these texts back: the
 * data they describe travels beside them (positions, term indexes, limits).
 *
 * Parse problems are templates: "{at}" marks where the place ("at line 2, column 5") goes;
 * without it the place is appended.
 */
import { elementName } from './elements';
import type { Side } from './types';

/** "11,000": digits grouped by three with commas, independent of the locale. */
export function groupedNumber(value: number): string {
  const text = String(Math.abs(value));
  const grouped = text.includes('e') ? text : text.replace(/\B(?=(\d{3})+(?!\d))/g, ',');
  return value < 0 ? `-${grouped}` : grouped;
}

function listWords(words: readonly string[], last = 'and'): string {
  return words.length <= 1 ? (words[0] ?? '') : `${words.slice(0, -1).join(', ')} ${last} ${words[words.length - 1]}`;
}

/** "Oxygen (O)"; the charge row is "the charge". */
export function elementLabel(key: string): string {
  if (key === 'charge') return 'the charge';
  const name = elementName(key);
  return name ? `${name} (${key})` : key;
}

// ----- Places -----------------------------------------------------------------------------

/** "column 7" on the first line, "line 2, column 7" after it. */
export function placeWords(line: number, column: number): string {
  return line > 1 ? `line ${line}, column ${column}` : `column ${column}`;
}

function capitalised(text: string): string {
  return text.charAt(0).toUpperCase() + text.slice(1);
}

/** The problem as a sentence with its place: "Unknown element symbol 'Xx' at column 7". */
export function placedProblem(template: string, line: number, column: number): string {
  const at = `at ${placeWords(line, column)}`;
  return capitalised(template.includes('{at}') ? template.replace('{at}', at) : `${template} ${at}`);
}

/** The problem as a sentence without its place (for tables that show the place in a column of their own). */
export function unplacedProblem(template: string): string {
  return capitalised(template.replace(/ ?\{at\}/, ''));
}

// ----- Reading equations (templates for EquationParseError) --------------------------------

export const parseMessages = {
  lowercaseSymbol: (word: string) => `element symbols start with a capital letter, but '${word}' does not`,
  electronNeedsCharge: () => 'the electron needs its charge: write e- or e^-',
  electronCharge: () => 'the electron has charge 1−: write e- or e^-',
  unknownElement: (symbol: string) => `unknown element symbol '${symbol}'`,
  subscriptAtLeastOne: () => 'a subscript must be at least 1',
  multiplierPositive: () => 'a hydrate or adduct multiplier must be greater than zero',
  zeroDenominator: () => 'a fraction cannot have 0 as its denominator',
  tooManyDigits: (max: number) =>
    `a number in a formula (subscript, charge or multiplier) has more than ${max} digits; no formula needs that many`,
  chargeNeedsSign: () => 'a charge needs a sign: write for example ^2+ or ^-',
  unknownPhase: (word: string) => `unknown phase label '${word}': use (s), (l), (g), (aq), (cr) or (am)`,
  unknownEnergyUnit: (unit: string) => `unknown energy unit '${unit}'`,
  enthalpyNotFinite: () => 'the enthalpy is too large to be a finite number of kJ/mol',
  heatTermNotFinite: () => 'the heat term is too large to be a finite number of kJ',
  coefficientUnreadable: (text: string) => `cannot read the coefficient '${text}'`,
  coefficientZero: () => 'a coefficient must be greater than zero',
  sideNeedsSpecies: (side: Side) => `the ${side === 'reactant' ? 'reactants' : 'products'} need at least one species`,
  lineBreak: () => 'found a line break {at}: only one equation per line here (use the batch input for several)',
  missingArrow: () =>
    'the equation ends {at} without an arrow: write the reactants, an arrow (->, →, =, <=> or ⇌), then the products',
  missingUnit: () => 'the energy value ending {at} needs a unit: kJ, J, kcal or cal',
  expectedButFound: (expected: readonly string[], found: string) =>
    `expected ${listWords(expected, 'or')}, but found ${found}`,
  tooDeeplyNested: (max: number) =>
    `brackets are nested more than ${max} levels deep {at}; real formulas need far fewer (check for a missing closing bracket)`,
} as const;

/** How the parser describes what it found at the faulty spot. */
export function foundWords(found: string | null): string {
  if (found === null) return 'the end of the text';
  if (found === '\n' || found === '\r') return 'a line break';
  if (/\s/.test(found)) return 'a space';
  return `'${found}'`;
}

// ----- Refused balance requests (BalanceInputError) ----------------------------------------

/** "H2O(l) (term 2)". */
export function termLabel(formula: string, phase: string | null, index: number): string {
  return `${formula}${phase ? `(${phase})` : ''} (term ${index})`;
}

/** Refused balance requests (texts of `BalanceInputError`). */
export const requestMessages = {
  termIndexNotWhole: (key: string) => `Term index '${key}' is not a whole number from 0.`,
  noSuchTerm: (index: number, terms: number) => `There is no term ${index}: the equation has terms 0 to ${terms - 1}.`,
  notExact: (text: string) => `'${text}' is not an exact number such as 2, 1/2 or 0.5.`,
  fixedZero: (index: number) => `A coefficient cannot be zero (term ${index}).`,
  fixedNegative: (index: number) =>
    `A coefficient must be positive (term ${index}); move the species to the other side instead.`,
  noBalancingWithFixed: (value: string, term: string, others: readonly string[]) =>
    `No balancing has coefficient ${value} for ${term}${others.length ? ` together with ${listWords(others)}` : ''}.`,
  fixedForcesNonPositive: (value: string, term: string, others: readonly string[]) =>
    `With coefficient ${value} for ${term}${others.length ? ` together with ${listWords(others)}` : ''}, some other coefficient would have to be zero or negative.`,
  enthalpyOverflow: (what: string) =>
    `${what} makes ΔH too large to represent (beyond ±1.8e308 kJ/mol); state ΔH for a smaller amount of reaction.`,
} as const;

// ----- Bad arguments to the equation arithmetic and molar masses (RangeError) ----------------

export const argumentMessages = {
  notExactFactor: (factor: string) => `'${factor}' is not an exact number such as 2, 1/2 or 0.5`,
  zeroFactor: () => 'cannot scale an equation by zero',
  scaledEnthalpyNotFinite: () => 'scaling makes ΔH too large to represent',
  unknownSymbol: (symbol: string) => `unknown element symbol '${symbol}'`,
  badWorkLimit: (name: string) => `work limit ${name} must be a whole number ≥ 1`,
} as const;

// ----- Why no balancing exists --------------------------------------------------------------

/** Sign of the charges found on one side of an equation. */
export type ChargeSigns = 'none' | 'positive' | 'negative';

/** Why an equation cannot be balanced with every coefficient positive. */
export const impossibleMessages = {
  elementOnOneSide: (element: string, side: Side) =>
    `${elementLabel(element)} appears only among the ${side === 'reactant' ? 'reactants' : 'products'}, so it cannot balance.`,
  chargeOnOneSide: (reactants: ChargeSigns, products: ChargeSigns) => {
    const words = (who: string, s: ChargeSigns): string =>
      s === 'none' ? `the ${who} carry no charge` : `the ${who} carry only ${s} charge`;
    return `The charge cannot balance: ${words('reactants', reactants)} and ${words('products', products)}.`;
  },
  onlyZero: (keys: readonly string[]) =>
    `No balancing exists: the only coefficients that balance ${listWords(keys.map((k) => (k === 'charge' ? 'the charge' : k)))} together are all zero.`,
  mustVanish: (terms: readonly string[]) =>
    `${listWords(terms)} would have to vanish: every balancing gives ${terms.length > 1 ? 'them' : 'it'} coefficient 0.`,
  mustChangeSide: (terms: readonly string[]) =>
    `${listWords(terms)} would have to change side (the only balancing gives ${terms.length > 1 ? 'them' : 'it'} a negative coefficient).`,
  noPositiveBalancing: () => 'No balancing has every coefficient positive: some species would have to change side.',
} as const;

// ----- Warnings ------------------------------------------------------------------------------

export const warningMessages = {
  ambiguousCharge: (typed: string, reading: string, atoms: string | null, sign: '+' | '-', suggestion: string | null) =>
    `Read '${typed}' as ${reading}${atoms ? ` (${atoms})` : ''}, with charge ${sign}1${suggestion ? `; if you meant charge ${suggestion}` : ''}.`,
  heatTermDisagrees: (fromHeat: number, stated: number) =>
    `The heat term gives ΔH = ${+fromHeat.toPrecision(12)} kJ/mol but the stated ΔH is ${+stated.toPrecision(12)} kJ/mol; the stated ΔH is used.`,
  enthalpyNotCarried: () =>
    'ΔH was stated for the equation as typed, which is not a multiple of the balanced equation; it is not carried over.',
  otherBalancings: (dimension: number) =>
    `The coefficients as typed balance, but ${dimension} independent balancings exist for these species; see the basis.`,
  basisTruncated: (dimension: number, shown: number) =>
    `There are ${groupedNumber(dimension)} independent balancings; only the first ${groupedNumber(shown)} are listed. Fix coefficients to narrow the choice.`,
} as const;

// ----- Work limits ---------------------------------------------------------------------------

/** The bounded quantities; see `WorkLimits`. */
export type WorkLimitName = 'terms' | 'species' | 'lines' | 'characters';

/** The text of a `WorkLimitError`: the quantity, what was found and the limit, in words. */
export function workLimitMessage(limit: WorkLimitName, max: number, found: number): string {
  switch (limit) {
    case 'terms':
      return `This equation has ${groupedNumber(found)} terms; the limit is ${groupedNumber(max)}.`;
    case 'species':
      return `This equation has ${groupedNumber(found)} distinct species; the limit is ${groupedNumber(max)}.`;
    case 'lines':
      return `This batch has ${groupedNumber(found)} equation lines; the limit is ${groupedNumber(max)}. Split it into smaller batches.`;
    case 'characters':
      return `This batch has ${groupedNumber(found)} characters; the limit is ${groupedNumber(max)}. Split it into smaller batches.`;
  }
}
