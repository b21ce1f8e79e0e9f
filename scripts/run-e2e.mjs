#!/usr/bin/env node
/**
 * Runs the browser tests end to end, the way production runs:
 *   1. builds the client, unless dist/ is newer than every client source (`--build` forces it);
 *   2. makes a throwaway data directory and seeds the demo teams and users into it with
 *      `tsx server/db/seed-cli.ts --demo`, under a random password (DEMO_PASSWORD);
 *   3. starts the real server on free ports with NODE_ENV=production, waits until it answers and
 *      checks that a seeded account signs in with that password;
 *   4. runs the E2E suite against it, handing over the URL and the password (E2E_BASE_URL,
 *      E2E_PASSWORD); every other argument goes to vitest (e.g. `--sequence.shuffle`, a file name);
 *   5. always stops the server and deletes the data directory.
 * Skips (exit 0) when no Chromium is installed. Set DEMO_PASSWORD to seed with a known password.
 */
import { spawn } from 'node:child_process';
import { randomBytes } from 'node:crypto';
import { existsSync, mkdtempSync, readdirSync, rmSync, statSync } from 'node:fs';
import net from 'node:net';
import os from 'node:os';
import path from 'node:path';
import { fileURLToPath } from 'node:url';

const root = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '..');
const chromium = process.env.CHROMIUM_PATH || '/usr/bin/chromium';
const forceBuild = process.argv.includes('--build');
const vitestArgs = process.argv.slice(2).filter((arg) => arg !== '--build');

if (!existsSync(chromium)) {
  console.log(`E2E tests skipped: no Chromium at ${chromium} (install Debian's chromium package)`);
  process.exit(0);
}

/** What `vite build` reads: when none of it changed since dist/ was written, the build is skipped. */
const clientInputs = [
  'src',
  'shared',
  'public',
  'index.html',
  'vite.config.ts',
  'package.json',
  'package-lock.json',
  'tsconfig.base.json',
  'tsconfig.client.json',
];

/** Latest modification time (ms) of a file or of any file below a directory; 0 when missing. */
function newestChange(target) {
  if (!existsSync(target)) return 0;
  const stat = statSync(target);
  if (!stat.isDirectory()) return stat.mtimeMs;
  let newest = stat.mtimeMs; // a deleted file changes its directory's time
  for (const entry of readdirSync(target)) newest = Math.max(newest, newestChange(path.join(target, entry)));
  return newest;
}

/** Why the client must be (re)built, or null when dist/ is current. */
function buildReason() {
  if (forceBuild) return '--build given';
  const builtAt = newestChange(path.join(root, 'dist', 'index.html'));
  if (builtAt === 0) return 'no dist/ yet';
  const changedAt = Math.max(...clientInputs.map((p) => newestChange(path.join(root, p))));
  return changedAt > builtAt ? 'sources changed since the last build' : null;
}

/** A port nobody listens on right now (the OS picks it). */
function freePort() {
  return new Promise((resolve, reject) => {
    const server = net.createServer();
    server.unref();
    server.on('error', reject);
    server.listen(0, '127.0.0.1', () => {
      const address = server.address();
      server.close(() => resolve(typeof address === 'object' && address ? address.port : 0));
    });
  });
}

/** Runs a command to completion with inherited output; resolves with its exit code. */
function run(command, args, env = process.env) {
  return new Promise((resolve) => {
    const child = spawn(command, args, { cwd: root, env, stdio: 'inherit' });
    child.on('exit', (code, signal) => resolve(code ?? (signal ? 1 : 0)));
    child.on('error', () => resolve(1));
  });
}

async function waitForHealth(url, server, timeoutMs = 90_000) {
  const deadline = Date.now() + timeoutMs;
  while (Date.now() < deadline) {
    if (server.exitCode !== null) throw new Error(`the server exited early with code ${server.exitCode}`);
    try {
      const reply = await fetch(url);
      if (reply.ok) return;
    } catch {
      // Not listening yet.
    }
    await new Promise((r) => setTimeout(r, 300));
  }
  throw new Error(`the server did not answer ${url} within ${timeoutMs / 1000} s`);
}

/**
 * Fails fast, in one clear sentence, when the seeded accounts do not take the password the tests
 * will use (a seed command that ignores DEMO_PASSWORD), instead of every test failing to sign in.
 */
async function checkDemoSignIn(baseUrl, password) {
  const reply = await fetch(`${baseUrl}/api/v1/session`, {
    method: 'POST',
    headers: { 'content-type': 'application/json', origin: baseUrl },
    body: JSON.stringify({ email: 'vera.viewer@kestrel.example', password }),
  });
  if (!reply.ok) {
    throw new Error(
      `the seeded demo viewer cannot sign in with the DEMO_PASSWORD given to the seed (HTTP ${reply.status}): ` +
        'does `tsx server/db/seed-cli.ts --demo` seed the demo users with DEMO_PASSWORD?',
    );
  }
}

const bin = (name) => path.join(root, 'node_modules', '.bin', name);
let server = null;
let dataDir = null;

function cleanUp() {
  if (server && server.exitCode === null) {
    // The server runs in its own process group: stop tsx and the node process it started.
    try {
      process.kill(-server.pid, 'SIGTERM');
    } catch {
      server.kill('SIGTERM');
    }
  }
  if (dataDir) rmSync(dataDir, { recursive: true, force: true });
}

for (const signal of ['SIGINT', 'SIGTERM']) {
  process.on(signal, () => {
    cleanUp();
    process.exit(130);
  });
}

let exitCode = 1;
try {
  // The grammar module is generated; it is rewritten only when it changes, so this keeps dist/ current.
  if ((await run(process.execPath, ['scripts/build-grammar.mjs'])) !== 0) throw new Error('grammar build failed');
  const reason = buildReason();
  if (reason) {
    console.log(`E2E: building the client (${reason})`);
    if ((await run(bin('vite'), ['build'])) !== 0) throw new Error('vite build failed');
  } else {
    console.log('E2E: dist/ is newer than the client sources; not rebuilding (pass --build to force)');
  }

  const [port, smtpPort] = [await freePort(), await freePort()];
  dataDir = mkdtempSync(path.join(os.tmpdir(), 'thermoledger-e2e-'));
  const baseUrl = `http://127.0.0.1:${port}`;
  const password = process.env.DEMO_PASSWORD || randomBytes(18).toString('base64url');
  const env = {
    ...process.env,
    NODE_ENV: 'production',
    PORT: String(port),
    SMTP_PORT: String(smtpPort),
    DATA_DIR: dataDir,
    PUBLIC_URL: baseUrl,
  };
  delete env.SMTP_HOST;
  delete env.DATABASE_URL;
  delete env.DEMO_PASSWORD;

  // Production has no demo accounts: the seed command puts them into this throwaway directory only.
  const seedCode = await run(bin('tsx'), ['server/db/seed-cli.ts', '--demo'], { ...env, DEMO_PASSWORD: password });
  if (seedCode !== 0) throw new Error(`seeding the demo accounts failed (exit ${seedCode})`);

  server = spawn(bin('tsx'), ['server/index.ts'], {
    cwd: root,
    env,
    stdio: ['ignore', 'pipe', 'pipe'],
    detached: true,
  });
  const log = [];
  const keep = (chunk) => {
    log.push(chunk.toString());
    if (log.length > 200) log.shift();
  };
  server.stdout.on('data', keep);
  server.stderr.on('data', keep);

  try {
    await waitForHealth(`${baseUrl}/api/v1/health`, server);
  } catch (error) {
    console.error(`E2E: ${error.message}. Server output:\n${log.join('')}`);
    throw error;
  }
  console.log(`E2E: server up at ${baseUrl} (data in ${dataDir})`);
  await checkDemoSignIn(baseUrl, password);

  exitCode = await run(bin('vitest'), ['run', '--config', 'tests/e2e/vitest.config.ts', ...vitestArgs], {
    ...process.env,
    E2E_BASE_URL: baseUrl,
    E2E_PASSWORD: password,
    CHROMIUM_PATH: chromium,
  });
  if (exitCode !== 0) console.error(`E2E: tests failed. Last server output:\n${log.slice(-40).join('')}`);
} catch (error) {
  console.error(`E2E run failed: ${error instanceof Error ? error.message : error}`);
  exitCode = exitCode || 1;
} finally {
  cleanUp();
}
process.exit(exitCode);
