// Loads the demo scenario into the configured database: `npm run seed`. Safe to run repeatedly.
import { configFromEnv, readEnv } from '../env';
import { openConfiguredDatabase } from './open';
import { runMigrations } from './migrate';
import { seedDemo } from './seed';

const env = readEnv();
void configFromEnv(env);
const { open, release } = await openConfiguredDatabase(env);
try {
  await runMigrations(open);
  await seedDemo(open.db);
  console.log('Demo data is in place.');
} finally {
  await open.close();
  release();
}
