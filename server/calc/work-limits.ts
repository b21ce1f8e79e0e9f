import { balanceInputSchema } from '@shared/schemas/balance';
import type { CalcLimits } from '../env';

/** Names of the work limits, as they appear in `details.limit` of a 413 reply. */
export type WorkLimitName =
  | 'termsPerEquation'
  | 'distinctSpecies'
  | 'batchLines'
  | 'batchBytes'
  | 'equationLength'
  | 'replyBytes'
  | 'seriesReadings';

/** A request over one of the work limits: 413 payload_too_large with `{limit, max, found}` (and the line in a batch). */
export interface WorkLimitProblem {
  code: 'payload_too_large';
  message: string;
  details: { limit: WorkLimitName; max: number; found: number; line?: number };
}

/** Thrown inside the calculation worker (and by the cheap checks on the request thread). */
export class WorkLimitExceeded extends Error {
  constructor(readonly problem: WorkLimitProblem) {
    super(problem.message);
    this.name = 'WorkLimitExceeded';
  }
}

function exceeded(limit: WorkLimitName, max: number, found: number, message: string, line?: number): never {
  throw new WorkLimitExceeded({
    code: 'payload_too_large',
    message,
    details: line === undefined ? { limit, max, found } : { limit, max, found, line },
  });
}

/** The longest equation the single-equation endpoint accepts; a batch line may be no longer. */
export const MAX_EQUATION_CHARS = balanceInputSchema.shape.equation.maxLength ?? 10_000;

/** What a batch text asks for, measured without parsing it. */
export interface BatchMeasure {
  /** Equation lines: not blank and not a `#` comment (the same lines the core balances). */
  equationLines: number;
  /**
   * Equation lines that may hold more terms or species than allowed (species ≤ terms ≤ '+' signs + 2);
   * only these need a parse to count exactly.
   */
  suspectLines: number[];
}

/**
 * The cheap checks of a batch, done on the request thread before any parsing: total size in
 * UTF-8 bytes, length of each line, number of equation lines. Throws WorkLimitExceeded naming
 * the limit and what was found.
 */
export function measureBatchText(text: string, limits: CalcLimits): BatchMeasure {
  const bytes = Buffer.byteLength(text, 'utf8');
  if (bytes > limits.maxBatchBytes) {
    exceeded(
      'batchBytes',
      limits.maxBatchBytes,
      bytes,
      `The batch is ${bytes.toLocaleString('en')} bytes; at most ${limits.maxBatchBytes.toLocaleString('en')} are allowed. Split it into smaller batches.`,
    );
  }
  let equationLines = 0;
  const suspectLines: number[] = [];
  let start = 0;
  for (let lineNo = 1; start <= text.length; lineNo++) {
    let end = text.indexOf('\n', start);
    if (end === -1) end = text.length;
    const chars = end - start;
    if (chars > MAX_EQUATION_CHARS) {
      exceeded(
        'equationLength',
        MAX_EQUATION_CHARS,
        chars,
        `Line ${lineNo} is ${chars.toLocaleString('en')} characters long; one equation may have at most ${MAX_EQUATION_CHARS.toLocaleString('en')}.`,
        lineNo,
      );
    }
    const trimmed = text.slice(start, end).trim();
    if (trimmed !== '' && !trimmed.startsWith('#')) {
      equationLines++;
      // One arrow splits two sides, each a '+'-separated list: terms ≤ plus signs + 2.
      let plus = 0;
      for (let i = trimmed.indexOf('+'); i !== -1; i = trimmed.indexOf('+', i + 1)) plus++;
      if (plus + 2 > Math.min(limits.maxTermsPerEquation, limits.maxDistinctSpecies)) suspectLines.push(lineNo);
    }
    start = end + 1;
  }
  if (equationLines > limits.maxBatchLines) {
    exceeded(
      'batchLines',
      limits.maxBatchLines,
      equationLines,
      `The batch has ${equationLines.toLocaleString('en')} equation lines; at most ${limits.maxBatchLines.toLocaleString('en')} are allowed in one batch. Split it into smaller batches.`,
    );
  }
  return { equationLines, suspectLines };
}

/** 413 for a reply that would be larger than allowed. */
export function assertReplyWithinLimit(
  bytes: number,
  limits: CalcLimits,
  advice = 'Send fewer equations at a time.',
): void {
  if (bytes > limits.maxReplyBytes) {
    exceeded(
      'replyBytes',
      limits.maxReplyBytes,
      bytes,
      `The answer would be ${(bytes / 1e6).toFixed(1)} MB; replies are limited to ${(limits.maxReplyBytes / 1e6).toFixed(1)} MB. ${advice}`,
    );
  }
}

/** The most time–temperature readings one calorimetry request may carry, over all its series. */
export const MAX_CALORIMETRY_READINGS = 20_000;

/** `value[key]` when value is a non-null object; the body is untrusted JSON (null, arrays, numbers). */
function field(value: unknown, key: string): unknown {
  return typeof value === 'object' && value !== null ? (value as Record<string, unknown>)[key] : undefined;
}

function seriesLength(temperature: unknown): number {
  const series = field(temperature, 'series');
  return Array.isArray(series) ? series.length : 0;
}

function runsReadings(runs: unknown): number {
  if (!Array.isArray(runs)) return 0;
  return runs.reduce<number>((sum, run) => sum + seriesLength(field(run, 'temperature')), 0);
}

/**
 * Cheap check of a calorimetry request before parsing: the readings of all its series together
 * (a bomb request may carry one per run). 413 naming the limit; counts as one line.
 */
export function measureCalorimetryWork(body: unknown): number {
  const found =
    seriesLength(field(body, 'temperature')) +
    runsReadings(field(body, 'runs')) +
    runsReadings(field(field(body, 'calibration'), 'runs'));
  if (found > MAX_CALORIMETRY_READINGS)
    exceeded(
      'seriesReadings',
      MAX_CALORIMETRY_READINGS,
      found,
      `The request carries ${found.toLocaleString('en')} temperature readings; the limit is ${MAX_CALORIMETRY_READINGS.toLocaleString('en')} per request. Thin the series or send the runs separately.`,
    );
  return 1;
}
