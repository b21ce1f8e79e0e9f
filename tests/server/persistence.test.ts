import { spawn, type ChildProcess } from 'node:child_process';
import { existsSync, mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import request from 'supertest';
import { afterAll, describe, expect, it } from 'vitest';
import { openDatabase } from '../../server/db/client';
import { DataDirLockedError, LOCK_FILE, lockDataDir, processStartTime } from '../../server/db/lock';
import { runMigrations } from '../../server/db/migrate';
import { DEMO_PASSWORD, demoUsers, startTestApp } from './helpers';

const root = path.resolve(import.meta.dirname, '../..');
const dirs: string[] = [];
const children: ChildProcess[] = [];
function tempDir(): string {
  const dir = mkdtempSync(path.join(tmpdir(), 'tl-persist-'));
  dirs.push(dir);
  return dir;
}
afterAll(() => {
  for (const child of children) if (child.exitCode === null && child.signalCode === null) child.kill('SIGKILL');
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

/** Starts the real server (node + tsx, no wrapper process) on `dataDir`; resolves with its base URL. */
function startServer(dataDir: string): Promise<{ child: ChildProcess; url: string; output: () => string }> {
  const env: NodeJS.ProcessEnv = {
    ...process.env,
    NODE_ENV: 'development',
    DATA_DIR: dataDir,
    HOST: '127.0.0.1',
    PORT: '0',
    SMTP_PORT: '0',
    SEED_DEMO: '1',
    LOG_LEVEL: 'warn',
    CALC_WORKERS: '1',
  };
  delete env['DATABASE_URL'];
  delete env['SMTP_HOST'];
  const child = spawn(process.execPath, ['--import', 'tsx', 'server/index.ts'], {
    cwd: root,
    env,
    stdio: ['ignore', 'pipe', 'pipe'],
  });
  children.push(child);
  let out = '';
  return new Promise((resolve, reject) => {
    const onData = (chunk: Buffer) => {
      out += chunk.toString();
      const match = /listening on (http:\/\/127\.0\.0\.1:\d+)/.exec(out);
      // The summary ends with the demo-account lines; wait for them as well.
      if (match && /Demo accounts: .*\n/.test(out)) resolve({ child, url: match[1]!, output: () => out });
    };
    child.stdout!.on('data', onData);
    child.stderr!.on('data', onData);
    child.once('exit', (code, signal) =>
      reject(new Error(`server exited (${code ?? signal}) before listening:\n${out}`)),
    );
  });
}

describe('the real server killed with SIGKILL', () => {
  it('restarts on the same data directory with everything written before the kill', async () => {
    const dataDir = tempDir();
    const first = await startServer(dataDir);
    const agent = request.agent(first.url).set('Origin', first.url);
    const signIn = await agent.post('/api/v1/session').send({ email: demoUsers.member, password: DEMO_PASSWORD });
    expect(signIn.status).toBe(200);
    const teamId = signIn.body.teams[0].id as string;
    const written = await agent
      .post(`/api/v1/teams/${teamId}/notes`)
      .send({ title: 'Written just before the crash', body: 'Jacket temperature log, run 7.' });
    expect(written.status).toBe(201);

    const exited = new Promise((resolve) => first.child.once('exit', resolve));
    first.child.kill('SIGKILL');
    await exited;
    // The lock file is left behind by the killed process: the restart must not need a person.
    expect(existsSync(path.join(dataDir, LOCK_FILE))).toBe(true);

    const second = await startServer(dataDir);
    try {
      expect(second.output()).toMatch(/Demo accounts: seeded \(SEED_DEMO=1\)/);
      const again = request.agent(second.url).set('Origin', second.url);
      expect(
        (await again.post('/api/v1/session').send({ email: demoUsers.member, password: DEMO_PASSWORD })).status,
      ).toBe(200);
      const notes = await again.get(`/api/v1/teams/${teamId}/notes`);
      expect(notes.status).toBe(200);
      expect(notes.body.notes.map((n: { title: string }) => n.title)).toContain('Written just before the crash');
    } finally {
      const stopped = new Promise((resolve) => second.child.once('exit', resolve));
      second.child.kill('SIGTERM');
      await stopped;
    }
    // A clean shutdown removes its own lock.
    expect(existsSync(path.join(dataDir, LOCK_FILE))).toBe(false);
  }, 300_000);
});

describe('lockDataDir', () => {
  it('refuses a data directory held by another live server, naming its process', async () => {
    const dir = tempDir();
    const holder = spawn(process.execPath, ['-e', 'setTimeout(() => {}, 60000)'], { stdio: 'ignore' });
    children.push(holder);
    await new Promise((resolve) => holder.once('spawn', resolve));
    writeFileSync(
      path.join(dir, LOCK_FILE),
      JSON.stringify({ pid: holder.pid, startTime: processStartTime(holder.pid!) }),
    );
    try {
      expect(() => lockDataDir(dir)).toThrow(DataDirLockedError);
      expect(() => lockDataDir(dir)).toThrow(new RegExp(`process ${holder.pid}\\)`));
    } finally {
      holder.kill('SIGKILL');
    }
  });

  it('takes over a lock whose pid now belongs to an unrelated live process', () => {
    const dir = tempDir();
    // The test runner's parent is alive, but it did not start at this time: the pid was reused.
    writeFileSync(path.join(dir, LOCK_FILE), JSON.stringify({ pid: process.ppid, startTime: '1' }));
    const release = lockDataDir(dir);
    expect(JSON.parse(readFileSync(path.join(dir, LOCK_FILE), 'utf8')).pid).toBe(process.pid);
    release();
  });

  it('takes over a lock left by a dead process (also in the old bare-pid form), and releases it', () => {
    for (const content of [JSON.stringify({ pid: 2147483646, startTime: '12345' }), '2147483646']) {
      const dir = tempDir();
      writeFileSync(path.join(dir, LOCK_FILE), content);
      const release = lockDataDir(dir);
      expect(JSON.parse(readFileSync(path.join(dir, LOCK_FILE), 'utf8'))).toEqual({
        pid: process.pid,
        startTime: processStartTime(process.pid),
      });
      release();
      expect(existsSync(path.join(dir, LOCK_FILE))).toBe(false);
    }
  });
});
