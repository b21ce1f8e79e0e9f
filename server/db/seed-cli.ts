// Seeds the configured database (DATA_DIR, or DATABASE_URL) and exits.
//
//   npx tsx server/db/seed-cli.ts --demo
//
// --demo: the invented demo teams, accounts and notes. New accounts get the password in
// DEMO_PASSWORD (default: the published demo password, which a production server refuses).
// Safe to run repeatedly; the server must not be running on the same DATA_DIR.
import { parseArgs } from 'node:util';
import { PUBLISHED_DEMO_PASSWORD } from '../../seeds/demo/demo-seed';
import { EnvError, readEnv } from '../env';
import { DataDirLockedError } from './lock';
import { runMigrations } from './migrate';
import { openConfiguredDatabase } from './open';
import { seedDemo } from './seed';

const USAGE = 'Usage: npx tsx server/db/seed-cli.ts --demo   (password from DEMO_PASSWORD)';

async function main(): Promise<number> {
  const { values } = parseArgs({ options: { demo: { type: 'boolean' }, help: { type: 'boolean' } }, strict: true });
  if (values.help || !values.demo) {
    console.log(USAGE);
    return values.help ? 0 : 2;
  }
  const env = readEnv();
  if (env.NODE_ENV === 'production' && !env.DEMO_PASSWORD) {
    console.error(
      `With NODE_ENV=production the demo accounts need a password of your own in DEMO_PASSWORD; the published one ("${PUBLISHED_DEMO_PASSWORD}") is refused.`,
    );
    return 1;
  }
  const { open, release } = await openConfiguredDatabase(env);
  try {
    await runMigrations(open);
    const { created } = await seedDemo(open.db, { password: env.DEMO_PASSWORD });
    console.log(
      `Demo data is in place (${created} new account${created === 1 ? '' : 's'}, password ${env.DEMO_PASSWORD ? 'from DEMO_PASSWORD' : `"${PUBLISHED_DEMO_PASSWORD}"`}).`,
    );
    return 0;
  } finally {
    await open.close();
    release();
  }
}

main().then(
  (code) => process.exit(code),
  (err: unknown) => {
    if (err instanceof EnvError || err instanceof DataDirLockedError) console.error(err.message);
    else console.error('Seeding failed:', err);
    process.exit(1);
  },
);
