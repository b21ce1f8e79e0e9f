import { Piscina } from 'piscina';
import type { Logger } from 'pino';
import { errorStatusByCode, type ErrorCode } from '@shared/schemas/errors';
import type { CalcSettings } from '../env';
import { AppError } from '../errors';
import type { CalcOutcome, CalcTask } from './calc.worker';

type TaskWithoutLimits = CalcTask extends infer T ? (T extends CalcTask ? Omit<T, 'limits'> : never) : never;

function isErrorCode(code: string): code is ErrorCode {
  return Object.hasOwn(errorStatusByCode, code);
}

/**
 * A pool of worker threads for the chemistry core's CPU work (piscina), so long calculations
 * never stall the request thread: health checks, sign-ins and other users stay answered.
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
    const { timeBudgetMs, workerHeapMb, limits } = this.settings;
    let outcome: CalcOutcome;
    this.running++;
    try {
      outcome = await this.pool.run({ ...task, limits } as CalcTask, { signal: AbortSignal.timeout(timeBudgetMs) });
    } catch (err) {
      throw this.translate(err, timeBudgetMs, workerHeapMb);
    } finally {
      this.running--;
    }
    if (outcome.ok) return outcome.json;
    const { code, message, details } = outcome.error;
    if (!isErrorCode(code)) throw new Error(`calculation worker answered with unknown error code ${code}`);
    return Promise.reject(new AppError(code, message, details));
  }

  private translate(err: unknown, timeBudgetMs: number, workerHeapMb: number): unknown {
    const seconds = Math.ceil(timeBudgetMs / 1000);
    if (err instanceof Error && err.name === 'AbortError') {
      this.log.warn({ budgetMs: timeBudgetMs }, 'calculation stopped at its time budget');
      return new AppError(
        'unavailable',
        `The calculation did not finish within its time budget of ${seconds} s and was stopped. Send fewer or smaller equations, or try again when the server is less busy.`,
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
      this.log.warn({ heapMb: workerHeapMb }, 'calculation stopped at its memory ceiling');
      return new AppError(
        'payload_too_large',
        `The calculation needed more than the ${workerHeapMb} MB one request may use and was stopped. Send fewer or smaller equations.`,
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
