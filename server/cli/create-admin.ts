// Creates a site admin account: the first administrator of a real installation.
//
//   npm run create-admin                        asks for e-mail, name and password (not echoed)
//   npm run create-admin -- --email ops@lab.example --name "Site Ops" --password-stdin < secret.txt
//
// With --password-stdin the password is the first line of standard input (for scripts); it is
// never taken from the command line or the environment, where other users could read it.
// Works on DATA_DIR (stop the server first: PGlite allows one process) or on DATABASE_URL.
import { randomUUID } from 'node:crypto';
import { createInterface } from 'node:readline';
import { parseArgs } from 'node:util';
import { read } from 'read';
import type { z } from 'zod';
import { emailSchema, newPasswordSchema } from '@shared/schemas/common';
import { updateAccountInputSchema } from '@shared/schemas/account';
import { CalcPool } from '../calc/calc-pool';
import type { ServiceContext } from '../context';
import { DataDirLockedError } from '../db/lock';
import { LibraryCache } from '../library/snapshot';
import { runMigrations } from '../db/migrate';
import { openConfiguredDatabase } from '../db/open';
import { configFromEnv, EnvError, readEnv } from '../env';
import { AppError } from '../errors';
import { BackgroundJobs } from '../lib/background';
import { createLogger } from '../lib/logger';
import { RateLimits } from '../lib/rate-limits';
import { createSiteAdmin } from '../services/admin.service';

const displayNameSchema = updateAccountInputSchema.shape.displayName;

/** Thrown for input the operator has to correct; printed without a stack. */
class UsageError extends Error {}

function check<T>(schema: z.ZodType<T>, value: unknown, what: string): T {
  const parsed = schema.safeParse(value);
  if (!parsed.success) throw new UsageError(`${what}: ${parsed.error.issues[0]?.message ?? 'not valid'}`);
  return parsed.data;
}

async function firstLineOfStdin(): Promise<string> {
  const lines = createInterface({ input: process.stdin, crlfDelay: Infinity });
  for await (const line of lines) {
    lines.close();
    return line;
  }
  throw new UsageError('--password-stdin: standard input was empty.');
}

async function ask(prompt: string, silent = false): Promise<string> {
  return String(await read({ prompt, silent, replace: silent ? '' : undefined }));
}

async function collect(): Promise<{ email: string; displayName: string; password: string }> {
  const { values } = parseArgs({
    options: {
      email: { type: 'string' },
      name: { type: 'string' },
      'password-stdin': { type: 'boolean' },
      help: { type: 'boolean' },
    },
    strict: true,
  });
  if (values.help) {
    console.log(
      'Usage: npm run create-admin [-- --email <address> --name <display name> [--password-stdin]]\nWithout --password-stdin the password is asked for and not echoed.',
    );
    process.exit(0);
  }
  const interactive = !values['password-stdin'];
  if (interactive && !process.stdin.isTTY) {
    throw new UsageError('No terminal to ask for the password: pass --password-stdin and pipe the password in.');
  }
  if (!interactive && (!values.email || !values.name)) {
    throw new UsageError('With --password-stdin, give --email and --name too.');
  }
  const email = check(emailSchema, values.email ?? (await ask('E-mail of the site admin: ')), 'E-mail');
  const displayName = check(displayNameSchema, values.name ?? (await ask('Display name: ')), 'Display name');
  let password: string;
  if (interactive) {
    password = check(newPasswordSchema, await ask('Password (not shown): ', true), 'Password');
    const again = await ask('The same password again: ', true);
    if (again !== password) throw new UsageError('The two passwords differ; nothing was created.');
  } else {
    password = check(newPasswordSchema, (await firstLineOfStdin()).replace(/\r$/, ''), 'Password');
  }
  return { email, displayName, password };
}

async function main(): Promise<void> {
  const input = await collect();
  const env = readEnv();
  const config = configFromEnv({ ...env, LOG_LEVEL: 'warn' });
  const log = createLogger(config);
  const { open, release } = await openConfiguredDatabase(env);
  const calc = new CalcPool(config.calc, log);
  try {
    await runMigrations(open);
    const ctx: ServiceContext = {
      db: open.db,
      config,
      log,
      calc,
      limits: new RateLimits(config),
      jobs: new BackgroundJobs(log),
      library: new LibraryCache(open.db),
      mailer: {
        outbox: null,
        send: () => Promise.reject(new Error('create-admin sends no e-mail')),
      },
      actor: null,
      meta: { ip: null, userAgent: 'create-admin', requestId: randomUUID() },
    };
    const created = await createSiteAdmin(ctx, input);
    console.log(`Site admin ${created.email} created. Sign in with that e-mail and the password you chose.`);
  } finally {
    await calc.close();
    await open.close();
    release();
  }
}

main().then(
  () => process.exit(0),
  (err: unknown) => {
    if (err instanceof UsageError || err instanceof EnvError || err instanceof DataDirLockedError)
      console.error(err.message);
    else if (err instanceof AppError) console.error(err.message);
    else console.error('create-admin failed:', err);
    process.exit(1);
  },
);
