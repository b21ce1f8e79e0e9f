import { Piscina } from 'piscina';
import type { Logger } from 'pino';
import { errorStatusByCode, type ErrorCode } from '@shared/schemas/errors';
import type { CalcSettings } from '../env';
import { AppError } from '../errors';
import type { SetReportInput } from '../reports/set-pdf';
import type { CalcOutcome, CalcTask } from './calc.worker';

type TaskWithoutLimits = CalcTask extends infer T ? (T extends CalcTask ? Omit<T, 'limits'> : never) : never;

function isErrorCode(code: string): code is ErrorCode {
  return Object.hasOwn(errorStatusByCode, code);
}

/** How the pool's refusals name the work they stopped. */
interface WorkWords {
  subject: string;
  smaller: string;
  log: string;
}
const CALCULATION: WorkWords = {
  subject: 'The calculation',
  smaller: 'Send fewer or smaller equations',
  log: 'calculation',
};
const REPORT: WorkWords = {
  subject: 'The PDF report',
  smaller: 'Split the set into smaller ones or export it as CSV',
  log: 'PDF report',
};

/**
 * A pool of worker threads for the chemistry core's CPU work and the PDF reports (piscina), so
 * long calculations and typesetting never stall the request thread: health checks, sign-ins and other users stay answered.
 * Each calculation gets a wall-clock budget (queueing included) and a heap ceiling; past either
 * the worker is stopped and the caller hears why, in words.
 */
export class CalcPool {
  private readonly pool: Piscina<CalcTask, CalcOutcome>;
  private running = 0;

  constructor(
    private readonly settings: CalcSettings,
    private readonly log: Logger,
  ) {
    this.pool = new Piscina({
      filename: new URL('./worker-entry.mjs', import.meta.url).href,
      // Threads start on demand (tests build many apps); index.ts warms one up before listening.
      minThreads: 0,
      maxThreads: settings.workers,
      idleTimeout: 60_000,
      maxQueue: settings.queueLimit,
      resourceLimits: { maxOldGenerationSizeMb: settings.workerHeapMb },
    });
  }

  /** Runs a calculation; resolves with the reply's JSON text, or throws the AppError to answer with. */
  async run(task: TaskWithoutLimits): Promise<string> {
    const outcome = await this.execute({ ...task, limits: this.settings.limits } as CalcTask, CALCULATION);
    if (!('json' in outcome)) throw new Error('calculation worker answered a calculation with a file');
    return outcome.json;
  }

  /**
   * Typesets a reaction set's PDF report in a worker, under the same time budget, heap ceiling
   * and queue as the calculations (503 with Retry-After, 413); resolves with the PDF's bytes.
   */
  async runReport(input: SetReportInput): Promise<Buffer> {
    const outcome = await this.execute({ kind: 'set-pdf', input, limits: this.settings.limits }, REPORT);
    if (!('bytes' in outcome)) throw new Error('calculation worker answered a report with JSON');
    return Buffer.from(outcome.bytes.buffer, outcome.bytes.byteOffset, outcome.bytes.byteLength);
  }

  private async execute(task: CalcTask, words: WorkWords): Promise<Extract<CalcOutcome, { ok: true }>> {
    const { timeBudgetMs, workerHeapMb } = this.settings;
    let outcome: CalcOutcome;
    this.running++;
    try {
      outcome = await this.pool.run(task, { signal: AbortSignal.timeout(timeBudgetMs) });
    } catch (err) {
      throw this.translate(err, timeBudgetMs, workerHeapMb, words);
    } finally {
      this.running--;
    }
    if (outcome.ok) return outcome;
    const { code, message, details } = outcome.error;
    if (!isErrorCode(code)) throw new Error(`calculation worker answered with unknown error code ${code}`);
    throw new AppError(code, message, details);
  }

  private translate(err: unknown, timeBudgetMs: number, workerHeapMb: number, words: WorkWords): unknown {
    const seconds = Math.ceil(timeBudgetMs / 1000);
    if (err instanceof Error && err.name === 'AbortError') {
      this.log.warn({ budgetMs: timeBudgetMs, work: words.log }, `${words.log} stopped at its time budget`);
      return new AppError(
        'unavailable',
        `${words.subject} did not finish within its time budget of ${seconds} s and was stopped. ${words.smaller}, or try again when the server is less busy.`,
        { limit: 'timeBudgetMs', max: timeBudgetMs },
        { 'Retry-After': String(seconds) },
      );
    }
    if (err instanceof Error && err.message === 'Task queue is at limit') {
      return new AppError(
        'unavailable',
        'The server is busy with other calculations. Try again in a few seconds.',
        { limit: 'queue', max: this.settings.queueLimit },
        { 'Retry-After': '5' },
      );
    }
    if ((err as NodeJS.ErrnoException | undefined)?.code === 'ERR_WORKER_OUT_OF_MEMORY') {
      this.log.warn({ heapMb: workerHeapMb, work: words.log }, `${words.log} stopped at its memory ceiling`);
      return new AppError(
        'payload_too_large',
        `${words.subject} needed more than the ${workerHeapMb} MB one request may use and was stopped. ${words.smaller}.`,
        { limit: 'memoryMb', max: workerHeapMb },
      );
    }
    return err;
  }

  /** Calculations submitted and not yet answered (queued or running). */
  get inFlight(): number {
    return this.running;
  }

  /**
   * Starts one worker and loads the core, so the first request does not pay for it. Not bound by
   * the time budget (loading the core on a busy machine can take longer than one calculation may)
   * and never fatal: a worker that fails to warm up is started again by the first request.
   */
  async warmUp(): Promise<void> {
    try {
      const task = { kind: 'balance', input: { equation: 'H2 + O2 -> H2O' }, limits: this.settings.limits };
      await this.pool.run(task as CalcTask);
    } catch (err) {
      this.log.warn({ err }, 'calculation worker did not warm up; the first calculation will start one');
    }
  }

  /** Stops every worker (at shutdown). */
  async close(): Promise<void> {
    await this.pool.destroy();
  }
}
