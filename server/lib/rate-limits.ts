import { RateLimiterMemory, RateLimiterRes } from 'rate-limiter-flexible';
import type { AppConfig } from '../env';
import { AppError } from '../errors';

function retryAfterSeconds(res: RateLimiterRes): number {
  return Math.max(1, Math.ceil(res.msBeforeNext / 1000));
}

function tooMany(message: string, seconds: number, details: Record<string, unknown> = {}): AppError {
  return new AppError(
    'rate_limited',
    message,
    { ...details, retryAfterSeconds: seconds },
    { 'Retry-After': String(seconds) },
  );
}

function minutesText(seconds: number): string {
  const minutes = Math.ceil(seconds / 60);
  return minutes <= 1 ? 'a minute' : `${minutes} minutes`;
}

interface Counter {
  limiter: RateLimiterMemory;
  key: string;
  points: number;
  /** Words for the 429 message: "this account", "your network address". */
  what: string;
}

/**
 * Takes `points` from every counter at once, or from none: consume() updates the in-memory
 * counter synchronously, so parallel requests cannot all slip under the limit between a check
 * and a later record. When any counter is out of points, what was taken is given back and the
 * first exhausted counter is returned.
 */
async function takeAll(counters: Counter[], points: number): Promise<{ blocked: Counter; res: RateLimiterRes } | null> {
  const outcomes = await Promise.allSettled(counters.map((c) => c.limiter.consume(c.key, points)));
  const rejected = outcomes.findIndex((o) => o.status === 'rejected');
  if (rejected === -1) return null;
  const reason = (outcomes[rejected] as PromiseRejectedResult).reason as unknown;
  if (!(reason instanceof RateLimiterRes)) throw reason;
  // consume() counts even when it refuses; give every point back so the counters stay exact.
  await Promise.all(counters.map((c) => c.limiter.reward(c.key, points)));
  return { blocked: counters[rejected]!, res: reason };
}

/** A sign-in attempt that holds one point of the account's and the address's allowance. */
export interface SignInReservation {
  /** The password was right: the account's failures are forgotten and the address gets its point back. */
  succeeded(): Promise<void>;
  /** The attempt failed: the points stay taken. */
  failed(): void;
}

/**
 * Counters that slow down password guessing (attempts per account and per address), reset-mail
 * floods (mails per account and per address) and scripted floods of the public calculation
 * endpoints (requests and equation lines per address and minute). Kept in memory: one server
 * process holds them.
 */
export class RateLimits {
  private signInAccount!: RateLimiterMemory;
  private signInAddress!: RateLimiterMemory;
  private resetAccount!: RateLimiterMemory;
  private resetAddress!: RateLimiterMemory;
  private calcRequests!: RateLimiterMemory;
  private calcLines!: RateLimiterMemory;

  constructor(private readonly config: Pick<AppConfig, 'signIn' | 'passwordReset' | 'calc'>) {
    this.reset();
  }

  /** Forgets every counter (tests call this between cases). */
  reset(): void {
    const { signIn, passwordReset, calc } = this.config;
    this.signInAccount = new RateLimiterMemory({
      points: signIn.maxFailuresPerAccount,
      duration: signIn.windowSeconds,
    });
    this.signInAddress = new RateLimiterMemory({
      points: signIn.maxFailuresPerAddress,
      duration: signIn.windowSeconds,
    });
    this.resetAccount = new RateLimiterMemory({
      points: passwordReset.maxPerAccount,
      duration: passwordReset.windowSeconds,
    });
    this.resetAddress = new RateLimiterMemory({
      points: passwordReset.maxPerAddress,
      duration: passwordReset.windowSeconds,
    });
    this.calcRequests = new RateLimiterMemory({ points: calc.requestsPerMinute, duration: 60 });
    this.calcLines = new RateLimiterMemory({ points: calc.linesPerMinute, duration: 60 });
  }

  /**
   * Reserves one sign-in attempt before the password is checked (consume first, refund on
   * success), so no more than the configured number of wrong passwords per account and per
   * address is ever checked, however many requests arrive at once. Throws 429 otherwise.
   */
  async reserveSignIn(email: string, ip: string): Promise<SignInReservation> {
    const account: Counter = {
      limiter: this.signInAccount,
      key: email,
      points: this.config.signIn.maxFailuresPerAccount,
      what: 'this account',
    };
    const address: Counter = {
      limiter: this.signInAddress,
      key: ip,
      points: this.config.signIn.maxFailuresPerAddress,
      what: 'your network address',
    };
    const blocked = await takeAll([account, address], 1);
    if (blocked) {
      const seconds = retryAfterSeconds(blocked.res);
      throw tooMany(
        `Too many failed sign-ins for ${blocked.blocked.what}. Try again in ${minutesText(seconds)}, or reset the password.`,
        seconds,
      );
    }
    return {
      succeeded: async () => {
        await Promise.all([this.signInAccount.delete(email), this.signInAddress.reward(ip, 1)]);
      },
      failed: () => {},
    };
  }

  /** Counts one password-reset e-mail against the address asked for and the caller's address (429 beyond). */
  async takeResetMail(email: string, ip: string): Promise<void> {
    const { maxPerAccount, maxPerAddress } = this.config.passwordReset;
    const blocked = await takeAll(
      [
        { limiter: this.resetAccount, key: email, points: maxPerAccount, what: 'this e-mail address' },
        { limiter: this.resetAddress, key: ip, points: maxPerAddress, what: 'your network address' },
      ],
      1,
    );
    if (blocked) {
      const seconds = retryAfterSeconds(blocked.res);
      throw tooMany(
        `Too many reset e-mails asked for ${blocked.blocked.what} (at most ${blocked.blocked.points} in ${minutesText(this.config.passwordReset.windowSeconds)}). Check the inbox, or try again in ${minutesText(seconds)}.`,
        seconds,
      );
    }
  }

  /** One more calculation request from `ip` (429 beyond the per-minute allowance); returns what is left. */
  async takeCalcRequest(ip: string): Promise<{ limit: number; remaining: number }> {
    const limit = this.config.calc.requestsPerMinute;
    try {
      const res = await this.calcRequests.consume(ip, 1);
      return { limit, remaining: res.remainingPoints };
    } catch (err) {
      if (!(err instanceof RateLimiterRes)) throw err;
      const seconds = retryAfterSeconds(err);
      throw tooMany(
        `Too many calculation requests from your address (limit ${limit} a minute). Try again in ${seconds} s.`,
        seconds,
      );
    }
  }

  /**
   * Weighs a calculation by its equation lines against the per-minute line budget of `ip`.
   * A refused batch gives its lines back, so a smaller one may still pass.
   */
  async takeCalcLines(ip: string, lines: number): Promise<void> {
    const limit = this.config.calc.linesPerMinute;
    const blocked = await takeAll(
      [{ limiter: this.calcLines, key: ip, points: limit, what: 'your network address' }],
      lines,
    );
    if (blocked) {
      const seconds = retryAfterSeconds(blocked.res);
      throw tooMany(
        `Your address has used its budget of ${limit} equation lines a minute; this request has ${lines}. Try again in ${seconds} s.`,
        seconds,
        { limit: 'linesPerMinute', max: limit, found: lines },
      );
    }
  }
}
