import path from 'node:path';
import { isIP } from 'node:net';
import os from 'node:os';
import { z } from 'zod';

/** Reads "true"/"false"/"1"/"0" the way people write them in environment files. */
const booleanText = z
  .enum(['true', 'false', '1', '0', 'yes', 'no'], { message: 'Write true or false.' })
  .transform((v) => v === 'true' || v === '1' || v === 'yes');

const port = (fallback: number) =>
  z.coerce.number({ message: 'Write a port number.' }).int().min(0).max(65535).default(fallback);

const positiveInt = (fallback: number) =>
  z.coerce.number({ message: 'Write a whole number.' }).int().min(1, 'Write a whole number from 1.').default(fallback);

const NAMED_SUBNETS = new Set(['loopback', 'linklocal', 'uniquelocal']);

/** One entry of TRUST_PROXY's address list: an IP, an IP/prefix, or one of Express's named subnets. */
function isProxyAddress(entry: string): boolean {
  if (NAMED_SUBNETS.has(entry)) return true;
  const [address, prefix, ...rest] = entry.split('/');
  const version = isIP(address ?? '');
  if (version === 0 || rest.length > 0) return false;
  if (prefix === undefined) return true;
  if (!/^\d+$/.test(prefix)) return false;
  return Number(prefix) <= (version === 4 ? 32 : 128);
}

/**
 * TRUST_PROXY: unset or "false" (no proxy), a hop count ("1": one proxy in front), or a comma
 * list of proxy addresses. "true" is refused: it would believe any X-Forwarded-For a client sends.
 */
const trustProxySchema = z
  .string()
  .default('false')
  .transform((value, ctx): false | number | string[] => {
    const text = value.trim();
    if (text === 'false' || text === '0') return false;
    if (/^\d+$/.test(text)) return Number(text);
    if (text === 'true') {
      ctx.addIssue({
        code: 'custom',
        message:
          'true would trust any X-Forwarded-For header a client sends, so anyone could pick their own address. Give the number of proxies in front of the server (e.g. 1) or their addresses (e.g. 10.0.0.5, loopback).',
      });
      return z.NEVER;
    }
    const entries = text.split(',').map((e) => e.trim());
    const bad = entries.filter((e) => !isProxyAddress(e));
    if (bad.length > 0) {
      ctx.addIssue({
        code: 'custom',
        message: `${bad.join(', ')} is not a proxy address. Write a hop count, or addresses and subnets such as 10.0.0.5, 10.0.0.0/8, loopback.`,
      });
      return z.NEVER;
    }
    return entries;
  });

/** The environment variables the server understands, each with its default. */
export const envSchema = z
  .object({
    NODE_ENV: z.enum(['development', 'test', 'production']).default('development'),
    /** Interface to listen on: loopback by default, so a development install is not reachable from the network. */
    HOST: z.string().min(1).default('127.0.0.1'),
    PORT: port(3000),
    DATA_DIR: z.string().min(1).default('./data'),
    DATABASE_URL: z
      .string()
      .regex(/^postgres(ql)?:\/\//, 'Write a postgres:// connection URL.')
      .optional(),
    PUBLIC_URL: z.url({ message: 'Write a full URL such as https://thermoledger.example.' }).optional(),
    /** Demo teams and accounts: unset = only into an empty development database; 1 = always (not in production); 0 = never. */
    SEED_DEMO: booleanText.optional(),
    /** Password of seeded demo accounts (default: the published one). */
    DEMO_PASSWORD: z.string().min(10, 'Use at least 10 characters.').max(200).optional(),
    LOG_LEVEL: z.enum(['fatal', 'error', 'warn', 'info', 'debug', 'trace', 'silent']).default('info'),
    SMTP_HOST: z.string().min(1).optional(),
    SMTP_PORT: port(2525),
    SMTP_USER: z.string().optional(),
    SMTP_PASS: z.string().optional(),
    SMTP_SECURE: booleanText.default(false),
    MAIL_FROM: z.string().min(3).default('Thermoledger <no-reply@thermoledger.invalid>'),
    TRUST_PROXY: trustProxySchema,
    SIGNIN_MAX_FAILURES_PER_ACCOUNT: positiveInt(5),
    SIGNIN_MAX_FAILURES_PER_ADDRESS: positiveInt(20),
    SIGNIN_WINDOW_MINUTES: positiveInt(15),
    RESET_MAILS_PER_ACCOUNT: positiveInt(3),
    RESET_MAILS_PER_ADDRESS: positiveInt(10),
    RESET_WINDOW_MINUTES: positiveInt(60),
    CALC_RATE_LIMIT_PER_MINUTE: positiveInt(600),
    CALC_LINES_PER_MINUTE: positiveInt(6000),
    CALC_MAX_TERMS: positiveInt(80),
    CALC_MAX_SPECIES: positiveInt(60),
    CALC_MAX_BATCH_LINES: positiveInt(2000),
    CALC_MAX_BATCH_BYTES: positiveInt(200_000),
    CALC_MAX_REPLY_BYTES: positiveInt(8_000_000),
    CALC_TIME_BUDGET_MS: positiveInt(10_000),
    CALC_WORKERS: positiveInt(Math.max(2, os.availableParallelism() - 1)),
    CALC_WORKER_HEAP_MB: positiveInt(256),
    CALC_QUEUE_LIMIT: positiveInt(32),
    /** Absolute session lifetime. */
    SESSION_TTL_DAYS: positiveInt(30),
    /** A session unused for this long ends. */
    SESSION_IDLE_HOURS: positiveInt(72),
    /** Largest evidence file of an amendment, in MB. */
    EVIDENCE_MAX_FILE_MB: positiveInt(10),
    /** Most evidence files in one upload request, and on one amendment. */
    EVIDENCE_MAX_FILES_PER_UPLOAD: positiveInt(5),
    EVIDENCE_MAX_FILES_PER_AMENDMENT: positiveInt(20),
    /** Hour (UTC, 0–23) at which the daily digest of amendment news is sent. */
    DIGEST_HOUR_UTC: z.coerce.number().int().min(0).max(23).default(7),
  })
  .superRefine((env, ctx) => {
    if (env.CALC_LINES_PER_MINUTE < env.CALC_MAX_BATCH_LINES) {
      ctx.addIssue({
        code: 'custom',
        path: ['CALC_LINES_PER_MINUTE'],
        message: `must be at least CALC_MAX_BATCH_LINES (${env.CALC_MAX_BATCH_LINES}), or a batch of the largest allowed size could never run.`,
      });
    }
    if (env.NODE_ENV === 'production' && env.SEED_DEMO === true) {
      ctx.addIssue({
        code: 'custom',
        path: ['SEED_DEMO'],
        message:
          'demo accounts are never created with NODE_ENV=production. Seed a staging copy with `npx tsx server/db/seed-cli.ts --demo` and a DEMO_PASSWORD of your own.',
      });
    }
  });
export type Env = z.infer<typeof envSchema>;

/**
 * Work limits of the public calculation endpoints. Anonymous callers reach them, so every one
 * is bounded before the work starts and reported by name when exceeded.
 */
export interface CalcLimits {
  /** Terms (species written, both sides) in one equation. */
  maxTermsPerEquation: number;
  /** Distinct species in one equation. */
  maxDistinctSpecies: number;
  /** Equation lines (not blank, not # comments) in one batch. */
  maxBatchLines: number;
  /** UTF-8 bytes of one batch text. */
  maxBatchBytes: number;
  /** Bytes of one calculation reply. */
  maxReplyBytes: number;
}

/** How calculations run: off the request thread, in a pool of worker threads, each within a budget. */
export interface CalcSettings {
  limits: CalcLimits;
  /** Wall-clock budget of one calculation, queueing included. */
  timeBudgetMs: number;
  workers: number;
  workerHeapMb: number;
  /** Calculations waiting for a worker beyond this are refused at once (503). */
  queueLimit: number;
  /** Requests per minute and address to the calculation endpoints. */
  requestsPerMinute: number;
  /** Equation lines per minute and address (a batch weighs its lines). */
  linesPerMinute: number;
}

/** Runtime configuration derived from the environment; tests build one directly. */
export interface AppConfig {
  nodeEnv: Env['NODE_ENV'];
  publicUrl: string;
  /** Express "trust proxy": false, a hop count, or proxy addresses. Never `true`. */
  trustProxy: false | number | string[];
  logLevel: Env['LOG_LEVEL'];
  signIn: { maxFailuresPerAccount: number; maxFailuresPerAddress: number; windowSeconds: number };
  passwordReset: { maxPerAccount: number; maxPerAddress: number; windowSeconds: number };
  calc: CalcSettings;
  session: { ttlMs: number; idleMs: number };
  /** Check every reply against its declared schema (off in production for speed). */
  checkResponses: boolean;
  version: string;
  /**
   * Evidence files of amendments: stored under generated names in `dir` (inside DATA_DIR, never
   * served statically), with the size and count limits of uploads.
   */
  evidence: { dir: string; maxFileBytes: number; maxFilesPerUpload: number; maxFilesPerAmendment: number };
  /** Hour (UTC) of the daily digest of amendment news. */
  digestHourUtc: number;
}

/** Thrown when an environment variable holds a value the server cannot use. */
export class EnvError extends Error {}

/** Validates `source` (default process.env); the error names each bad variable. */
export function readEnv(source: Record<string, string | undefined> = process.env): Env {
  // Empty strings in .env files mean "not set".
  const cleaned = Object.fromEntries(Object.entries(source).filter(([, v]) => v !== undefined && v !== ''));
  const parsed = envSchema.safeParse(cleaned);
  if (!parsed.success) {
    const lines = parsed.error.issues.map((i) => `  ${i.path.join('.')}: ${i.message}`);
    throw new EnvError(`Invalid environment:\n${lines.join('\n')}`);
  }
  return parsed.data;
}

/** Turns validated environment values into the app's configuration. */
export function configFromEnv(env: Env): AppConfig {
  return {
    nodeEnv: env.NODE_ENV,
    publicUrl: (env.PUBLIC_URL ?? `http://localhost:${env.PORT}`).replace(/\/+$/, ''),
    trustProxy: env.TRUST_PROXY,
    logLevel: env.LOG_LEVEL,
    signIn: {
      maxFailuresPerAccount: env.SIGNIN_MAX_FAILURES_PER_ACCOUNT,
      maxFailuresPerAddress: env.SIGNIN_MAX_FAILURES_PER_ADDRESS,
      windowSeconds: env.SIGNIN_WINDOW_MINUTES * 60,
    },
    passwordReset: {
      maxPerAccount: env.RESET_MAILS_PER_ACCOUNT,
      maxPerAddress: env.RESET_MAILS_PER_ADDRESS,
      windowSeconds: env.RESET_WINDOW_MINUTES * 60,
    },
    calc: {
      limits: {
        maxTermsPerEquation: env.CALC_MAX_TERMS,
        maxDistinctSpecies: env.CALC_MAX_SPECIES,
        maxBatchLines: env.CALC_MAX_BATCH_LINES,
        maxBatchBytes: env.CALC_MAX_BATCH_BYTES,
        maxReplyBytes: env.CALC_MAX_REPLY_BYTES,
      },
      timeBudgetMs: env.CALC_TIME_BUDGET_MS,
      workers: env.CALC_WORKERS,
      workerHeapMb: env.CALC_WORKER_HEAP_MB,
      queueLimit: env.CALC_QUEUE_LIMIT,
      requestsPerMinute: env.CALC_RATE_LIMIT_PER_MINUTE,
      linesPerMinute: env.CALC_LINES_PER_MINUTE,
    },
    session: { ttlMs: env.SESSION_TTL_DAYS * 86_400_000, idleMs: env.SESSION_IDLE_HOURS * 3_600_000 },
    checkResponses: env.NODE_ENV !== 'production',
    version: '0.1.0',
    evidence: {
      dir: path.resolve(env.DATA_DIR, 'evidence'),
      maxFileBytes: env.EVIDENCE_MAX_FILE_MB * 1024 * 1024,
      maxFilesPerUpload: env.EVIDENCE_MAX_FILES_PER_UPLOAD,
      maxFilesPerAmendment: env.EVIDENCE_MAX_FILES_PER_AMENDMENT,
    },
    digestHourUtc: env.DIGEST_HOUR_UTC,
  };
}
