import { count } from 'drizzle-orm';
import { loadDemoSeed, PUBLISHED_DEMO_PASSWORD } from '../../seeds/demo/demo-seed';
import type { Env } from '../env';
import type { Db } from './client';
import { demoAccountsWithPublishedPassword, seedDemo } from './seed';
import { users } from './tables/index';

/** Thrown at start-up in production while demo accounts still accept the published password. */
export class DemoAccountsInProductionError extends Error {}

/** What happened to the demo data at start-up, in words for the start-up lines. */
export interface DemoOutcome {
  seeded: boolean;
  /** Why, e.g. "SEED_DEMO=1" or "the database was empty". */
  reason: string;
  /** Demo sign-ins to print (only when the password is the published one). */
  accounts: { email: string; roles: string }[];
  password: 'published' | 'DEMO_PASSWORD';
}

/**
 * Decides about the demo teams and accounts at start-up. Never in production: there, demo
 * accounts that still accept the published password stop the start. Otherwise SEED_DEMO=1 seeds,
 * SEED_DEMO=0 does not, and unset seeds only an empty database (the README's first `npm start`).
 * The library's own seed is not demo data and is never decided here.
 */
export async function applyDemoPolicy(db: Db, env: Env): Promise<DemoOutcome> {
  const seed = loadDemoSeed();
  const password = env.DEMO_PASSWORD ? 'DEMO_PASSWORD' : 'published';
  const outcome = (seeded: boolean, reason: string): DemoOutcome => ({
    seeded,
    reason,
    password,
    accounts: seeded
      ? seed.users.map((u) => ({
          email: u.email,
          roles: [...u.teams.map((t) => `${t.role} of ${t.slug}`), ...u.siteRoles.map((r) => `site role ${r}`)].join(
            ', ',
          ),
        }))
      : [],
  });

  if (env.NODE_ENV === 'production') {
    const open = await demoAccountsWithPublishedPassword(db, seed);
    if (open.length > 0) {
      throw new DemoAccountsInProductionError(
        `Refusing to start with NODE_ENV=production: these demo accounts still sign in with the published password "${PUBLISHED_DEMO_PASSWORD}": ${open.join(', ')}. ` +
          'Start once without NODE_ENV=production and disable them under Admin → Users (or change their passwords), or use a fresh database; then create the first real administrator with `npm run create-admin`.',
      );
    }
    return outcome(false, 'never with NODE_ENV=production');
  }
  if (env.SEED_DEMO === false) return outcome(false, 'SEED_DEMO=0');
  if (env.SEED_DEMO === true) {
    await seedDemo(db, { seed, password: env.DEMO_PASSWORD });
    return outcome(true, 'SEED_DEMO=1');
  }
  const [row] = await db.select({ n: count() }).from(users);
  if (Number(row?.n ?? 0) > 0) return outcome(false, 'the database already has accounts; SEED_DEMO=1 adds them');
  await seedDemo(db, { seed, password: env.DEMO_PASSWORD });
  return outcome(true, 'the development database was empty; SEED_DEMO=0 turns this off');
}
