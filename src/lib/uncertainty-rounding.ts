/**
 * Rounding a value to its uncertainty for display, after the GUM (JCGM 100:2008, §7.2.6): the
 * uncertainty to two significant digits, the value to the same decimal place. Rounding is to
 * the nearest digit, halves away from zero. The full figure is always kept by the caller: these
 * strings are for reading, never for computing again.
 */

/** U+2212, the minus sign of typeset numbers (a hyphen is too short beside tabular digits). */
export const MINUS = '\u2212';

/**
 * Rounds |x| at 10^place, halves away from zero, without the binary drift of `x * 10^d`
 * (1.005 rounds to 1.01 at two decimals): the shift goes through the decimal exponent text.
 */
function roundAtPlace(x: number, place: number): number {
  const sign = x < 0 ? -1 : 1;
  const shifted = Math.round(Number(`${Math.abs(x)}e${-place}`));
  return sign * Number(`${shifted}e${place}`);
}

/** A number as text with a fixed number of decimals (≥ 0) and a true minus sign; never "−0". */
export function formatFixed(x: number, decimals: number): string {
  const text = Math.abs(x).toFixed(Math.max(0, decimals));
  const isZero = Number(text) === 0;
  return x < 0 && !isZero ? `${MINUS}${text}` : text;
}

/** The power of ten of the second significant digit of u after rounding (u > 0, finite). */
export function uncertaintyPlace(u: number): number {
  let place = Math.floor(Math.log10(u)) - 1;
  // 0.0996 → 0.100 at the third decimal has three digits: one place coarser gives 0.10.
  if (Math.abs(roundAtPlace(u, place)) >= 100 * 10 ** place) place += 1;
  return place;
}

export interface RoundedFigure {
  /** The value rounded to the uncertainty's last digit, with a true minus sign. */
  value: string;
  /** The uncertainty to two significant digits, or null when none is stated. */
  uncertainty: string | null;
  /** Decimals shown (0 when the uncertainty's last digit is a ten or coarser). */
  decimals: number;
}

/**
 * The value rounded to its standard uncertainty u: u to two significant digits (GUM §7.2.6), the
 * value to the same decimal place. −241.826 ± 0.042 stays as is; −393.5147 ± 0.13 gives
 * "−393.51" ± "0.13"; 12 345.6 ± 1234 gives "12300" ± "1200".
 * Without a usable uncertainty (null, 0, not finite) it returns null: show the figure as the
 * source prints it and say that no uncertainty is stated.
 */
export function roundToUncertainty(value: number, u: number | null): RoundedFigure | null {
  if (u === null || !Number.isFinite(u) || u <= 0 || !Number.isFinite(value)) return null;
  const place = uncertaintyPlace(u);
  const decimals = Math.max(0, -place);
  return {
    value: formatFixed(roundAtPlace(value, place), decimals),
    uncertainty: formatFixed(roundAtPlace(u, place), decimals),
    decimals,
  };
}

/** "−393.51 ± 0.13" or, with no usable uncertainty, the fallback text as given. */
export function formatWithStandardUncertainty(value: number, u: number | null, fallback: string): string {
  const r = roundToUncertainty(value, u);
  return r ? `${r.value} ± ${r.uncertainty}` : fallback;
}

/**
 * A figure with no uncertainty, for display: `significant` significant digits but never fewer
 * decimals than needed to show `minDecimals` (ΔrH° of −3.102 kJ/mol with 4 digits: "−3.102").
 */
export function formatSignificant(x: number, significant = 4, minDecimals = 0): string {
  if (!Number.isFinite(x)) return String(x);
  if (x === 0) return formatFixed(0, minDecimals);
  const place = Math.floor(Math.log10(Math.abs(x))) - (significant - 1);
  const decimals = Math.max(minDecimals, -place);
  return formatFixed(roundAtPlace(x, Math.min(place, -minDecimals)), decimals);
}

/** The full figure as stored (shortest round-trip text), with a true minus sign. */
export function formatFull(x: number): string {
  return x < 0 ? `${MINUS}${String(-x)}` : String(x);
}

/** A temperature in K for labels: at most two decimals, no trailing zeros (298.15, 350, 516.5). */
export function formatTemperature(kelvin: number): string {
  return formatFull(Number(kelvin.toFixed(2)));
}
