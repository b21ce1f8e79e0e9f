import { z } from 'zod';

/** Reads "true"/"false"/"1"/"0" the way people write them in environment files. */
const booleanText = z
  .enum(['true', 'false', '1', '0', 'yes', 'no'], { message: 'Write true or false.' })
  .transform((v) => v === 'true' || v === '1' || v === 'yes');

const port = (fallback: number) =>
  z.coerce.number({ message: 'Write a port number.' }).int().min(0).max(65535).default(fallback);

const positiveInt = (fallback: number) => z.coerce.number().int().min(1).default(fallback);

/** The environment variables the server understands, each with its default. */
export const envSchema = z.object({
  NODE_ENV: z.enum(['development', 'test', 'production']).default('development'),
  PORT: port(3000),
  DATA_DIR: z.string().min(1).default('./data'),
  DATABASE_URL: z
    .string()
    .regex(/^postgres(ql)?:\/\//, 'Write a postgres:// connection URL.')
    .optional(),
  PUBLIC_URL: z.url({ message: 'Write a full URL such as https://thermoledger.example.' }).optional(),
  SMTP_HOST: z.string().min(1).optional(),
  SMTP_PORT: port(2525),
  SMTP_USER: z.string().optional(),
  SMTP_PASS: z.string().optional(),
  SMTP_SECURE: booleanText.default(false),
  MAIL_FROM: z.string().min(3).default('Thermoledger <no-reply@thermoledger.invalid>'),
  /** Express "trust proxy": false, true, a hop count, or a list of addresses/subnets. */
  TRUST_PROXY: z.string().default('false'),
  SIGNIN_MAX_FAILURES_PER_ACCOUNT: positiveInt(5),
  SIGNIN_MAX_FAILURES_PER_ADDRESS: positiveInt(20),
  SIGNIN_WINDOW_MINUTES: positiveInt(15),
  CALC_RATE_LIMIT_PER_MINUTE: positiveInt(600),
  /** Absolute session lifetime. */
  SESSION_TTL_DAYS: positiveInt(30),
  /** A session unused for this long ends. */
  SESSION_IDLE_HOURS: positiveInt(72),
});
export type Env = z.infer<typeof envSchema>;

/** Runtime configuration derived from the environment; tests build one directly. */
export interface AppConfig {
  nodeEnv: Env['NODE_ENV'];
  publicUrl: string;
  trustProxy: boolean | number | string;
  signIn: { maxFailuresPerAccount: number; maxFailuresPerAddress: number; windowSeconds: number };
  calcRateLimitPerMinute: number;
  session: { ttlMs: number; idleMs: number };
  /** Check every reply against its declared schema (off in production for speed). */
  checkResponses: boolean;
  version: string;
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

function parseTrustProxy(value: string): boolean | number | string {
  if (value === 'true') return true;
  if (value === 'false') return false;
  if (/^\d+$/.test(value)) return Number(value);
  return value;
}

/** Turns validated environment values into the app's configuration. */
export function configFromEnv(env: Env): AppConfig {
  return {
    nodeEnv: env.NODE_ENV,
    publicUrl: (env.PUBLIC_URL ?? `http://localhost:${env.PORT}`).replace(/\/+$/, ''),
    trustProxy: parseTrustProxy(env.TRUST_PROXY),
    signIn: {
      maxFailuresPerAccount: env.SIGNIN_MAX_FAILURES_PER_ACCOUNT,
      maxFailuresPerAddress: env.SIGNIN_MAX_FAILURES_PER_ADDRESS,
      windowSeconds: env.SIGNIN_WINDOW_MINUTES * 60,
    },
    calcRateLimitPerMinute: env.CALC_RATE_LIMIT_PER_MINUTE,
    session: { ttlMs: env.SESSION_TTL_DAYS * 86_400_000, idleMs: env.SESSION_IDLE_HOURS * 3_600_000 },
    checkResponses: env.NODE_ENV !== 'production',
    version: '0.1.0',
  };
}
