// Runs in a worker thread of the calculation pool (see calc-pool.ts): the chemistry core's CPU
// work happens here, so a long batch never blocks the request thread. Replies cross the thread
// boundary as plain data: the JSON text of the result, or an error with its API code.
import { ChemistryError } from '@shared/chemistry/index';
import type { BalanceInput } from '@shared/schemas/balance';
import type { BombInput, ConstantPressureInput } from '@shared/schemas/calorimetry';
import type { CalcLimits } from '../env';
import type { SetReportInput } from '../reports/set-pdf';
import { reduceBombRequest, reduceConstantPressureRequest, type AuxiliaryLookup } from './calorimetry-calls';
import { balanceLines, balanceOne } from './core-calls';
import { assertReplyWithinLimit, WorkLimitExceeded } from './work-limits';

/** A calculation the pool can run. */
export type CalcTask =
  | { kind: 'balance'; input: BalanceInput; limits: CalcLimits }
  | { kind: 'batch'; text: string; limits: CalcLimits }
  | { kind: 'constant-pressure'; input: ConstantPressureInput; limits: CalcLimits }
  | {
      kind: 'bomb';
      input: BombInput;
      auxiliary: AuxiliaryLookup[];
      libraryRevision: number | null;
      limits: CalcLimits;
    }
  /** The printable report of a reaction set (typesetting a large set takes seconds of CPU). */
  | { kind: 'set-pdf'; input: SetReportInput; limits: CalcLimits };

type JsonTask = Exclude<CalcTask, { kind: 'set-pdf' }>;

/** What comes back: the reply body already serialised (so the request thread does not), or a client error. */
export type CalcOutcome =
  | { ok: true; json: string }
  /** A file (the PDF report): bytes, copied to the request thread. */
  | { ok: true; bytes: Uint8Array }
  | { ok: false; error: { code: string; message: string; details?: Record<string, unknown> } };

function compute(task: JsonTask): unknown {
  switch (task.kind) {
    case 'balance':
      return balanceOne(task.input, task.limits);
    case 'batch':
      return balanceLines(task.text, task.limits);
    case 'constant-pressure':
      return reduceConstantPressureRequest(task.input);
    case 'bomb':
      return reduceBombRequest(task.input, task.auxiliary, task.libraryRevision);
  }
}

/**
 * The PDF report. pdfkit is loaded by the first report a worker makes, so workers that only
 * calculate start without it; the fonts are read once per worker (set-pdf.ts keeps them).
 */
async function report(task: Extract<CalcTask, { kind: 'set-pdf' }>): Promise<CalcOutcome> {
  try {
    const { setPdf } = await import('../reports/set-pdf');
    const bytes = await setPdf(task.input);
    assertReplyWithinLimit(bytes.byteLength, task.limits, 'Split the set, or export it as CSV or JSON.');
    return { ok: true, bytes };
  } catch (err) {
    if (err instanceof WorkLimitExceeded) return { ok: false, error: err.problem };
    throw err;
  }
}

/** The worker's entry point. Errors that are not the caller's fault are thrown (500 in the server, logged). */
export default function runCalcTask(task: CalcTask): CalcOutcome | Promise<CalcOutcome> {
  if (task.kind === 'set-pdf') return report(task);
  try {
    const json = JSON.stringify(compute(task));
    assertReplyWithinLimit(Buffer.byteLength(json, 'utf8'), task.limits);
    return { ok: true, json };
  } catch (err) {
    if (err instanceof WorkLimitExceeded) return { ok: false, error: err.problem };
    if (err instanceof ChemistryError) {
      return {
        ok: false,
        error: { code: err.code, message: err.message, ...(err.details ? { details: err.details } : {}) },
      };
    }
    if (err instanceof RangeError && /call stack/i.test(err.message)) {
      // Safety net: input nested deeper than the parser can follow is the input's problem, not a crash.
      return {
        ok: false,
        error: { code: 'unprocessable', message: 'The equation is nested too deeply to read. Simplify the brackets.' },
      };
    }
    throw err;
  }
}
