import { ChemistryError } from '../errors';

/** A field path inside the caller's input, e.g. `['runs', 2, 'mass', 'value']`. */
export type FieldPath = (string | number)[];

/**
 * Input a calorimetric reduction cannot use. Carries the path of the field at fault, so the API
 * can name it. Code `validation_failed` (400) for a bad value, `unprocessable` (422) for readings
 * that are readable but cannot be reduced (no after-period, a curve outside its drift lines…).
 */
export class CalorimetryInputError extends ChemistryError {
  constructor(
    message: string,
    readonly path: FieldPath,
    code: 'validation_failed' | 'unprocessable' = 'validation_failed',
  ) {
    super(code, message, { issues: [{ path, message }] });
  }
}

/** Throws unless `value` is a finite number (and, as asked, positive or non-negative). */
export function requireNumber(
  value: number,
  path: FieldPath,
  what: string,
  rule: 'finite' | 'positive' | 'non-negative' = 'finite',
): void {
  const ok =
    typeof value === 'number' &&
    Number.isFinite(value) &&
    (rule === 'finite' || (rule === 'positive' ? value > 0 : value >= 0));
  if (!ok) {
    const wanted = rule === 'finite' ? 'a finite number' : rule === 'positive' ? 'above 0' : '0 or more';
    throw new CalorimetryInputError(`${what} must be ${wanted} (got ${String(value)}).`, path);
  }
}
