import type { RequestHandler } from 'express';
import { RateLimiterMemory, RateLimiterRes } from 'rate-limiter-flexible';
import { AppError } from '../errors';
import type { AppConfig } from '../env';

function retryAfterSeconds(res: RateLimiterRes): number {
  return Math.max(1, Math.ceil(res.msBeforeNext / 1000));
}

function tooMany(message: string, seconds: number): AppError {
  return new AppError('rate_limited', message, { retryAfterSeconds: seconds }, { 'Retry-After': String(seconds) });
}

function minutesText(seconds: number): string {
  const minutes = Math.ceil(seconds / 60);
  return minutes <= 1 ? 'a minute' : `${minutes} minutes`;
}

/**
 * Counters that slow down password guessing (failures per account and per address) and
 * scripted floods of the public calculation endpoints (requests per address per minute).
 * Kept in memory: one server process holds them.
 */
export class RateLimits {
  private accountFailures: RateLimiterMemory;
  private addressFailures: RateLimiterMemory;
  private calc: RateLimiterMemory;

  constructor(private readonly config: Pick<AppConfig, 'signIn' | 'calcRateLimitPerMinute'>) {
    this.accountFailures = this.makeSignIn(config.signIn.maxFailuresPerAccount);
    this.addressFailures = this.makeSignIn(config.signIn.maxFailuresPerAddress);
    this.calc = new RateLimiterMemory({ keyPrefix: 'calc', points: config.calcRateLimitPerMinute, duration: 60 });
  }

  private makeSignIn(points: number): RateLimiterMemory {
    return new RateLimiterMemory({ points, duration: this.config.signIn.windowSeconds });
  }

  /** Throws 429 when the account or the address has used up its failed sign-ins. */
  async checkSignIn(email: string, ip: string): Promise<void> {
    const [byAccount, byAddress] = await Promise.all([this.accountFailures.get(email), this.addressFailures.get(ip)]);
    const blocked = [
      { res: byAccount, limit: this.config.signIn.maxFailuresPerAccount, what: 'this account' },
      { res: byAddress, limit: this.config.signIn.maxFailuresPerAddress, what: 'your network address' },
    ].find((b) => b.res !== null && b.res.consumedPoints >= b.limit);
    if (blocked?.res) {
      const seconds = retryAfterSeconds(blocked.res);
      throw tooMany(
        `Too many failed sign-ins for ${blocked.what}. Try again in ${minutesText(seconds)}, or reset the password.`,
        seconds,
      );
    }
  }

  /** Counts one failed sign-in against both the account and the address. */
  async recordSignInFailure(email: string, ip: string): Promise<void> {
    // consume() rejects once points run out; the next checkSignIn reports that, so ignore it here.
    await Promise.allSettled([this.accountFailures.consume(email), this.addressFailures.consume(ip)]);
  }

  /** A successful sign-in clears the account's failures (not the address's). */
  async recordSignInSuccess(email: string): Promise<void> {
    await this.accountFailures.delete(email);
  }

  /** Express middleware for calculation endpoints: N requests per address per minute. */
  calcLimiter(): RequestHandler {
    return async (req, res, next) => {
      try {
        const r = await this.calc.consume(req.ip ?? 'unknown');
        res.setHeader('RateLimit-Limit', String(this.config.calcRateLimitPerMinute));
        res.setHeader('RateLimit-Remaining', String(r.remainingPoints));
        next();
      } catch (err) {
        if (!(err instanceof RateLimiterRes)) return next(err);
        const seconds = retryAfterSeconds(err);
        next(
          tooMany(
            `Too many calculation requests from your address (limit ${this.config.calcRateLimitPerMinute} a minute). Try again in ${seconds} s.`,
            seconds,
          ),
        );
      }
    };
  }

  /** Forgets every counter (tests call this between cases). */
  reset(): void {
    this.accountFailures = this.makeSignIn(this.config.signIn.maxFailuresPerAccount);
    this.addressFailures = this.makeSignIn(this.config.signIn.maxFailuresPerAddress);
    this.calc = new RateLimiterMemory({ keyPrefix: 'calc', points: this.config.calcRateLimitPerMinute, duration: 60 });
  }
}
