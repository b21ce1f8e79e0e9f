// Starts Thermoledger: environment → database (locked, migrated, demo policy) → mail → HTTP.
import type { AddressInfo } from 'node:net';
import { createApp } from './app';
import { configFromEnv, EnvError, readEnv } from './env';
import { applyDemoPolicy, DemoAccountsInProductionError, type DemoOutcome } from './db/demo-policy';
import { DataDirLockedError } from './db/lock';
import { runMigrations } from './db/migrate';
import { openConfiguredDatabase } from './db/open';
import { createLogger } from './lib/logger';
import { seedLibrary } from './library/seed-library';
import { startFakeSmtp, type FakeSmtp } from './mail/fake-smtp';
import { createMailer } from './mail/mailer';
import { PUBLISHED_DEMO_PASSWORD } from '../seeds/demo/demo-seed';

function demoLines(demo: DemoOutcome): string[] {
  if (!demo.seeded) return [`Demo accounts: not seeded (${demo.reason}).`];
  const password =
    demo.password === 'published' ? `password "${PUBLISHED_DEMO_PASSWORD}"` : 'password from DEMO_PASSWORD';
  return [
    `Demo accounts: seeded (${demo.reason}); sign in with ${password}:`,
    ...demo.accounts.map((a) => `  ${a.email.padEnd(34)} ${a.roles}`),
  ];
}

async function main(): Promise<void> {
  const env = readEnv();
  const config = configFromEnv(env);
  const log = createLogger(config);
  const { open, release } = await openConfiguredDatabase(env);
  await runMigrations(open);
  // The library's own seed is not demo data: it runs on every installation with an empty library.
  const seededRevision = await seedLibrary(open.db);
  const demo = await applyDemoPolicy(open.db, env);

  let fakeSmtp: FakeSmtp | null = null;
  if (!env.SMTP_HOST) fakeSmtp = await startFakeSmtp({ port: env.SMTP_PORT });
  const mailer = fakeSmtp
    ? createMailer({ host: fakeSmtp.host, port: fakeSmtp.port, secure: false, from: env.MAIL_FROM }, fakeSmtp)
    : createMailer(
        {
          host: env.SMTP_HOST!,
          port: env.SMTP_PORT,
          secure: env.SMTP_SECURE,
          user: env.SMTP_USER,
          pass: env.SMTP_PASS,
          from: env.MAIL_FROM,
        },
        null,
      );

  const app = createApp({ db: open.db, mailer, config, logger: log });
  // Load the chemistry core into one worker now, so the first calculation does not wait for it.
  await app.locals.deps.calc.warmUp();
  const server = app.listen(env.PORT, env.HOST);
  await new Promise<void>((resolve, reject) => {
    server.once('listening', resolve);
    server.once('error', reject);
  });
  const port = (server.address() as AddressInfo).port;
  const shownHost = env.HOST.includes(':') ? `[${env.HOST}]` : env.HOST;
  // One write, so a reader that waits for the first line sees the whole start-up summary.
  const summary = [
    `Thermoledger is listening on http://${shownHost}:${port} (public URL ${config.publicUrl})`,
    `Database: ${open.kind === 'pglite' ? `PGlite in ${env.DATA_DIR}` : 'PostgreSQL server (DATABASE_URL)'}; NODE_ENV=${env.NODE_ENV}`,
    ...(seededRevision !== null ? [`Library: seeded as revision ${seededRevision} from seeds/library`] : []),
    fakeSmtp
      ? `Mail: development SMTP server on ${fakeSmtp.host}:${fakeSmtp.port}; read it at /api/v1/admin/outbox as a site admin`
      : `Mail: SMTP ${env.SMTP_HOST}:${env.SMTP_PORT}`,
    ...demoLines(demo),
  ];
  console.log(summary.join('\n'));

  let stopping = false;
  const stop = async (signal: string) => {
    if (stopping) return;
    stopping = true;
    console.log(`${signal}: shutting down`);
    server.close();
    server.closeAllConnections();
    await app.locals.close();
    await fakeSmtp?.close();
    await open.close();
    release();
    process.exit(0);
  };
  process.on('SIGINT', () => void stop('SIGINT'));
  process.on('SIGTERM', () => void stop('SIGTERM'));
}

main().catch((err: unknown) => {
  if (err instanceof EnvError || err instanceof DataDirLockedError || err instanceof DemoAccountsInProductionError)
    console.error(err.message);
  else console.error('Thermoledger could not start:', err);
  process.exit(1);
});
