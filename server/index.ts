// Starts Thermoledger: environment → database (locked, migrated, seeded) → mail → HTTP.
import type { AddressInfo } from 'node:net';
import { createApp } from './app';
import { configFromEnv, EnvError, readEnv } from './env';
import { runMigrations } from './db/migrate';
import { openConfiguredDatabase } from './db/open';
import { DEMO_PASSWORD, loadDemoSeed, seedDemo } from './db/seed';
import { DataDirLockedError } from './db/lock';
import { seedLibrary } from './library/seed-library';
import { startFakeSmtp, type FakeSmtp } from './mail/fake-smtp';
import { createMailer } from './mail/mailer';

async function main(): Promise<void> {
  const env = readEnv();
  const config = configFromEnv(env);
  const { open, release } = await openConfiguredDatabase(env);
  await runMigrations(open);
  // The library's own seed is not demo data: it runs on every installation with an empty library.
  const seededRevision = await seedLibrary(open.db);
  const seed = loadDemoSeed();
  await seedDemo(open.db, seed);

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

  const app = createApp({ db: open.db, mailer, config });
  const server = app.listen(env.PORT);
  await new Promise<void>((resolve, reject) => {
    server.once('listening', resolve);
    server.once('error', reject);
  });
  const port = (server.address() as AddressInfo).port;
  console.log(`Thermoledger is listening on http://localhost:${port} (public URL ${config.publicUrl})`);
  console.log(`Database: ${open.kind === 'pglite' ? `PGlite in ${env.DATA_DIR}` : 'PostgreSQL server (DATABASE_URL)'}`);
  if (seededRevision !== null) console.log(`Library: seeded as revision ${seededRevision} from seeds/library`);
  console.log(
    fakeSmtp
      ? `Mail: development SMTP server on ${fakeSmtp.host}:${fakeSmtp.port}; read it at /api/v1/admin/outbox as a site admin`
      : `Mail: SMTP ${env.SMTP_HOST}:${env.SMTP_PORT}`,
  );
  console.log(`Demo sign-ins (password "${DEMO_PASSWORD}"):`);
  for (const user of seed.users) {
    const roles = [...user.teams.map((t) => `${t.role} of ${t.slug}`), ...user.siteRoles.map((r) => `site role ${r}`)];
    console.log(`  ${user.email.padEnd(34)} ${roles.join(', ')}`);
  }

  let stopping = false;
  const stop = async (signal: string) => {
    if (stopping) return;
    stopping = true;
    console.log(`${signal}: shutting down`);
    server.close();
    server.closeAllConnections();
    await fakeSmtp?.close();
    await open.close();
    release();
    process.exit(0);
  };
  process.on('SIGINT', () => void stop('SIGINT'));
  process.on('SIGTERM', () => void stop('SIGTERM'));
}

main().catch((err: unknown) => {
  if (err instanceof EnvError || err instanceof DataDirLockedError) console.error(err.message);
  else console.error('Thermoledger could not start:', err);
  process.exit(1);
});
