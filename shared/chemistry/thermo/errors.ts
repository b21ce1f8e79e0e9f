import { ChemistryError } from '../errors';
import type { ValidRange } from './types';

/** A field path inside the caller's input, e.g. `['terms', 2, 'coefficient']`. */
export type FieldPath = (string | number)[];

/** One problem found in a heat-capacity model; `path` is inside the model object. */
export interface ThermoModelIssue {
  path: FieldPath;
  message: string;
}

/**
 * A heat-capacity model that does not satisfy seeds/library/FORMAT.md (wrong number of
 * coefficients, ranges not increasing, forms not sharing their boundaries…). Code
 * `validation_failed`; `issues` name each field.
 */
export class ThermoModelError extends ChemistryError {
  constructor(
    readonly species: string,
    readonly issues: ThermoModelIssue[],
  ) {
    const first = issues[0];
    super(
      'validation_failed',
      `The heat-capacity model of ${species} is not valid: ${first ? `${first.path.join('.') || 'model'}: ${first.message}` : 'unknown problem'}${issues.length > 1 ? ` (and ${issues.length - 1} more)` : ''}.`,
      { species, issues: issues.map((i) => ({ path: i.path, message: i.message })) },
    );
  }
}

/** Bad numeric input to a thermochemistry function (T ≤ 0 K, NaN, negative mass…). Code `validation_failed`. */
export class ThermoInputError extends ChemistryError {
  constructor(
    message: string,
    readonly path: FieldPath,
  ) {
    super('validation_failed', message, { issues: [{ path, message }] });
  }
}

/** One species evaluated outside the range its model covers. Temperatures in K. */
export interface OutOfRangeEntry {
  species: string;
  temperature: number;
  range: ValidRange;
}

/**
 * A temperature outside the valid range of a species' heat-capacity model. Models are never
 * extrapolated (the one exception, fits starting at 300 K used from 298.15 K, is part of the
 * range). Code `unprocessable`; carries the species label, the temperature and the range.
 */
export class TemperatureOutOfRangeError extends ChemistryError {
  constructor(readonly entry: OutOfRangeEntry) {
    super(
      'unprocessable',
      `${entry.species}: ${formatKelvin(entry.temperature)} is outside the range of its heat-capacity model (${formatKelvin(entry.range.min)} to ${formatKelvin(entry.range.max)}).`,
      { species: entry.species, temperature: entry.temperature, range: { ...entry.range } },
    );
  }
}

/** Why a reaction term cannot be evaluated at the requested temperature. */
export type ReactionDataProblem =
  | { kind: 'out-of-range'; species: string; phase: string | null; temperature: number; range: ValidRange }
  | { kind: 'no-model'; species: string; phase: string | null }
  | { kind: 'no-enthalpy'; species: string; phase: string | null };

/**
 * A reaction that cannot be evaluated at the requested temperature: names every species whose
 * model does not cover T (with its range), has no heat-capacity model, or has neither a
 * ΔfH°(298.15 K) nor a formation-scale model valid at T. Code `unprocessable`.
 */
export class ReactionThermoDataError extends ChemistryError {
  constructor(
    readonly temperature: number,
    readonly problems: ReactionDataProblem[],
  ) {
    super(
      'unprocessable',
      `The reaction cannot be evaluated at ${formatKelvin(temperature)}: ${problems.map(describeProblem).join('; ')}.`,
      {
        temperature,
        problems: problems.map((p) => ({ ...p })),
      },
    );
  }
}

function describeProblem(p: ReactionDataProblem): string {
  switch (p.kind) {
    case 'out-of-range':
      return `${p.species} has a heat-capacity model only from ${formatKelvin(p.range.min)} to ${formatKelvin(p.range.max)}`;
    case 'no-model':
      return `${p.species} has no heat-capacity model`;
    case 'no-enthalpy':
      return `${p.species} has no ΔfH°(298.15 K) and no formation-scale model valid at this temperature`;
  }
}

function formatKelvin(t: number): string {
  return `${Number(t.toPrecision(8))} K`;
}
