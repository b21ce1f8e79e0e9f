import { spawn } from 'node:child_process';
import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { count, eq } from 'drizzle-orm';
import { afterAll, beforeAll, beforeEach, describe, expect, it } from 'vitest';
import { demoAccounts, PUBLISHED_DEMO_PASSWORD } from '../../seeds/demo/demo-seed';
import { openDatabase, type OpenDatabase } from '../../server/db/client';
import { applyDemoPolicy, DemoAccountsInProductionError } from '../../server/db/demo-policy';
import { runMigrations } from '../../server/db/migrate';
import { seedDemo } from '../../server/db/seed';
import { users } from '../../server/db/tables/index';
import { readEnv } from '../../server/env';
import { verifyPassword } from '../../server/lib/secrets';
import { openTestDatabase } from './helpers';

const root = path.resolve(import.meta.dirname, '../..');

let open: OpenDatabase;
beforeAll(async () => {
  open = await openTestDatabase();
});
afterAll(async () => open?.close());
beforeEach(async () => {
  await open.db.delete(users);
});

const userCount = async () => Number((await open.db.select({ n: count() }).from(users))[0]!.n);

describe('demo accounts at start-up', () => {
  it('seeds an empty development database by default, and says why', async () => {
    const outcome = await applyDemoPolicy(open.db, readEnv({}));
    expect(outcome).toMatchObject({ seeded: true, password: 'published' });
    expect(outcome.reason).toMatch(/empty/);
    expect(outcome.accounts.map((a) => a.email)).toContain(demoAccounts.site_admin);
    expect(await userCount()).toBe(6);
  });

  it('leaves a development database that already has accounts alone unless SEED_DEMO=1', async () => {
    await open.db.insert(users).values({ email: 'real@lab.example', displayName: 'Real', passwordHash: 'x' });
    expect((await applyDemoPolicy(open.db, readEnv({}))).seeded).toBe(false);
    expect(await userCount()).toBe(1);
    expect((await applyDemoPolicy(open.db, readEnv({ SEED_DEMO: '1' }))).seeded).toBe(true);
    expect(await userCount()).toBe(7);
  });

  it('never seeds with SEED_DEMO=0', async () => {
    expect((await applyDemoPolicy(open.db, readEnv({ SEED_DEMO: '0' }))).seeded).toBe(false);
    expect(await userCount()).toBe(0);
  });

  it('never creates them with NODE_ENV=production, even on an empty database', async () => {
    const outcome = await applyDemoPolicy(open.db, readEnv({ NODE_ENV: 'production' }));
    expect(outcome.seeded).toBe(false);
    expect(await userCount()).toBe(0);
  });

  it('refuses to start in production while demo accounts accept the published password', async () => {
    await seedDemo(open.db);
    const start = applyDemoPolicy(open.db, readEnv({ NODE_ENV: 'production' }));
    await expect(start).rejects.toThrow(DemoAccountsInProductionError);
    await expect(applyDemoPolicy(open.db, readEnv({ NODE_ENV: 'production' }))).rejects.toThrow(
      new RegExp(demoAccounts.site_admin.replace('.', '\\.')),
    );
    // Disabling them (Admin → Users) is enough.
    await open.db.update(users).set({ disabled: true });
    expect((await applyDemoPolicy(open.db, readEnv({ NODE_ENV: 'production' }))).seeded).toBe(false);
  });

  it('starts in production when the demo accounts were seeded with a password of their own', async () => {
    await seedDemo(open.db, { password: 'e2e-random-3f9c1a77' });
    expect((await applyDemoPolicy(open.db, readEnv({ NODE_ENV: 'production' }))).seeded).toBe(false);
  });
});

/** Runs a command-line tool of the server (node + tsx) with `env` and optional stdin. */
function runCli(script: string, args: string[], env: Record<string, string>, stdin?: string) {
  return new Promise<{ code: number | null; out: string }>((resolve) => {
    const childEnv: NodeJS.ProcessEnv = { ...process.env, ...env };
    delete childEnv['DATABASE_URL'];
    const child = spawn(process.execPath, ['--import', 'tsx', script, ...args], { cwd: root, env: childEnv });
    let out = '';
    child.stdout.on('data', (c: Buffer) => (out += c.toString()));
    child.stderr.on('data', (c: Buffer) => (out += c.toString()));
    child.on('exit', (code) => resolve({ code, out }));
    child.stdin.end(stdin ?? '');
  });
}

describe('seed-cli --demo and create-admin on a data directory', () => {
  it('seeds demo accounts with DEMO_PASSWORD, and creates a site admin from a password on stdin', async () => {
    const dataDir = mkdtempSync(path.join(tmpdir(), 'tl-cli-'));
    try {
      const env = { DATA_DIR: dataDir, DEMO_PASSWORD: 'e2e-random-9b2d4f10' };
      const seeded = await runCli('server/db/seed-cli.ts', ['--demo'], env);
      expect(seeded.out).toMatch(/Demo data is in place \(6 new accounts, password from DEMO_PASSWORD\)/);
      expect(seeded.code).toBe(0);

      const admin = await runCli(
        'server/cli/create-admin.ts',
        ['--email', 'Ops.Lead@Lab.example', '--name', 'Ops Lead', '--password-stdin'],
        { DATA_DIR: dataDir },
        'a-long-admin-password\n',
      );
      expect(admin.out).toMatch(/Site admin ops\.lead@lab\.example created/);
      expect(admin.code).toBe(0);
      const again = await runCli(
        'server/cli/create-admin.ts',
        ['--email', 'ops.lead@lab.example', '--name', 'Ops Lead', '--password-stdin'],
        { DATA_DIR: dataDir },
        'another-long-password\n',
      );
      expect(again.code).toBe(1);
      expect(again.out).toMatch(/already has an account/);
      const short = await runCli(
        'server/cli/create-admin.ts',
        ['--email', 'x@lab.example', '--name', 'X', '--password-stdin'],
        { DATA_DIR: dataDir },
        'short\n',
      );
      expect(short.code).toBe(1);
      expect(short.out).toMatch(/Password: Use at least 10 characters/);
      const published = await runCli('server/db/seed-cli.ts', ['--demo'], {
        DATA_DIR: dataDir,
        NODE_ENV: 'production',
      });
      expect(published.code).toBe(1);
      expect(published.out).toMatch(/need a password of your own in DEMO_PASSWORD/);

      const db = await openDatabase({ kind: 'pglite', dataDir });
      try {
        await runMigrations(db);
        const [siteAdmin] = await db.db.select().from(users).where(eq(users.email, 'ops.lead@lab.example'));
        expect(siteAdmin?.siteRoles).toEqual(['site_admin']);
        expect(await verifyPassword(siteAdmin!.passwordHash, 'a-long-admin-password')).toBe(true);
        const [demo] = await db.db.select().from(users).where(eq(users.email, demoAccounts.member));
        expect(await verifyPassword(demo!.passwordHash, 'e2e-random-9b2d4f10')).toBe(true);
        expect(await verifyPassword(demo!.passwordHash, PUBLISHED_DEMO_PASSWORD)).toBe(false);
        // This data directory may start in production: no demo account has the published password.
        expect((await applyDemoPolicy(db.db, readEnv({ NODE_ENV: 'production' }))).seeded).toBe(false);
      } finally {
        await db.close();
      }
    } finally {
      rmSync(dataDir, { recursive: true, force: true });
    }
  }, 300_000);
});
