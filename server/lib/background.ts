import type { Logger } from 'pino';

/**
 * Work that must not hold up a reply: it starts after the current request's handler has returned
 * (so the reply is sent first) and its failures are logged, never thrown at the caller. The
 * password-reset e-mail runs here, so the reply takes the same time whether or not the address
 * has an account. `drain()` waits for everything started so far (shutdown and tests).
 */
export class BackgroundJobs {
  private readonly running = new Set<Promise<void>>();

  constructor(private readonly log: Logger) {}

  /** Runs `job` on a later turn of the event loop. */
  run(name: string, job: () => Promise<void>): void {
    const done: Promise<void> = new Promise<void>((resolve) => setImmediate(resolve))
      .then(job)
      .catch((err: unknown) => this.log.error({ err, job: name }, `background job ${name} failed`))
      .finally(() => this.running.delete(done));
    this.running.add(done);
  }

  /** Resolves once every job started so far (and any they started) has finished. */
  async drain(): Promise<void> {
    while (this.running.size > 0) await Promise.all([...this.running]);
  }
}
