import { mkdtempSync, readFileSync, rmSync, writeFileSync, existsSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import request from 'supertest';
import { afterAll, describe, expect, it } from 'vitest';
import { openDatabase } from '../../server/db/client';
import { DataDirLockedError, lockDataDir } from '../../server/db/lock';
import { runMigrations } from '../../server/db/migrate';
import { DEMO_PASSWORD, demoUsers, startTestApp } from './helpers';

const dirs: string[] = [];
function tempDir(): string {
  const dir = mkdtempSync(path.join(tmpdir(), 'tl-persist-'));
  dirs.push(dir);
  return dir;
}
afterAll(() => {
  for (const dir of dirs) rmSync(dir, { recursive: true, force: true });
});

describe('PGlite on disk', () => {
  it('keeps a session across a server restart', async () => {
    const dataDir = tempDir();
    const open1 = await openDatabase({ kind: 'pglite', dataDir });
    await runMigrations(open1);
    const first = await startTestApp({ open: open1 });
    const signIn = await request(first.url)
      .post('/api/v1/session')
      .send({ email: demoUsers.member, password: DEMO_PASSWORD });
    expect(signIn.status).toBe(200);
    const cookie = (signIn.headers['set-cookie'] as unknown as string[])[0]!.split(';')[0]!;
    await first.close(); // closes PGlite too

    const open2 = await openDatabase({ kind: 'pglite', dataDir });
    await runMigrations(open2); // a no-op on an up-to-date database
    const second = await startTestApp({ open: open2 });
    try {
      const me = await request(second.url).get('/api/v1/session').set('Cookie', cookie);
      expect(me.body.user?.email).toBe(demoUsers.member);
    } finally {
      await second.close();
    }
  });
});

describe('lockDataDir', () => {
  it('refuses a data directory held by another live process, naming it', () => {
    const dir = tempDir();
    // The parent process (the test runner) is alive and is not us.
    writeFileSync(path.join(dir, 'thermoledger.lock'), String(process.ppid));
    expect(() => lockDataDir(dir)).toThrow(DataDirLockedError);
    expect(() => lockDataDir(dir)).toThrow(new RegExp(`in use by process ${process.ppid}`));
  });

  it('takes over a lock left by a dead process, and releases it', () => {
    const dir = tempDir();
    writeFileSync(path.join(dir, 'thermoledger.lock'), '2147483646');
    const release = lockDataDir(dir);
    expect(readFileSync(path.join(dir, 'thermoledger.lock'), 'utf8')).toBe(String(process.pid));
    release();
    expect(existsSync(path.join(dir, 'thermoledger.lock'))).toBe(false);
  });
});
