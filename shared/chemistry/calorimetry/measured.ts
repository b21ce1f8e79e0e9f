import { requireNumber, type FieldPath } from './errors';

/**
 * A measured or stated quantity: its value and standard uncertainty u (k = 1), both in the unit
 * the caller documents for the field. `u` is null when no uncertainty was stated: the quantity
 * then adds nothing to a propagated uncertainty, which is reported as incomplete.
 */
export interface Measured {
  value: number;
  u: number | null;
}

/** A quantity known exactly (u = 0), e.g. a defined constant. */
export function exactly(value: number): Measured {
  return { value, u: 0 };
}

/** Checks a measured quantity: finite value (positive when asked) and u ≥ 0 when stated. */
export function checkMeasured(
  q: Measured,
  path: FieldPath,
  what: string,
  rule: 'finite' | 'positive' | 'non-negative' = 'positive',
): void {
  requireNumber(q.value, [...path, 'value'], what, rule);
  if (q.u !== null) requireNumber(q.u, [...path, 'uncertainty'], `the uncertainty of ${what}`, 'non-negative');
}
