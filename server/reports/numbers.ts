/**
 * Numbers as reports print them: the uncertainty to two significant digits and the value to the
 * same decimal place (GUM, JCGM 100:2008, 7.2.6), the minus sign as U+2212, and a plain figure of
 * six significant digits when no uncertainty is stated.
 */

const MINUS = '\u2212';

function decimalsFor(uncertainty: number): number {
  if (!(uncertainty > 0) || !Number.isFinite(uncertainty)) return 2;
  const exponent = Math.floor(Math.log10(uncertainty));
  return Math.max(0, 1 - exponent);
}

/** A number with U+2212 for negatives ("−890.4"), never "-0". */
export function withMinus(text: string): string {
  if (/^-0(\.0*)?$/.test(text)) return text.slice(1);
  return text.startsWith('-') ? MINUS + text.slice(1) : text;
}

/** Six significant digits, trailing zeros of the fraction dropped. */
export function plainFigure(value: number, digits = 6): string {
  if (value === 0) return '0';
  const text = Number(value.toPrecision(digits)).toString();
  return withMinus(text.includes('e') ? value.toPrecision(digits) : text);
}

/** "−890.36 ± 0.31" (or "−890.356" without an uncertainty). */
export function valueWithUncertainty(value: number, uncertainty: number | null): string {
  if (uncertainty === null || !(uncertainty > 0)) return plainFigure(value);
  const decimals = Math.min(12, decimalsFor(uncertainty));
  return `${withMinus(value.toFixed(decimals))} ± ${uncertainty.toFixed(decimals)}`;
}

/** A temperature in K, as few digits as it needs ("298.15", "350"). */
export function kelvin(value: number): string {
  return Number(value.toFixed(2)).toString();
}
