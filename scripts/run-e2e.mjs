#!/usr/bin/env node
/**
 * Runs the browser tests end to end: builds the client, starts the real server on free ports
 * with a throwaway data directory, waits until it answers, runs the E2E suite against it and
 * always stops the server afterwards. Skips (exit 0) when no Chromium is installed.
 */
import { spawn } from 'node:child_process';
import { existsSync, mkdtempSync, rmSync } from 'node:fs';
import net from 'node:net';
import os from 'node:os';
import path from 'node:path';
import { fileURLToPath } from 'node:url';

const root = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '..');
const chromium = process.env.CHROMIUM_PATH || '/usr/bin/chromium';

if (!existsSync(chromium)) {
  console.log(`E2E tests skipped: no Chromium at ${chromium} (install Debian's chromium package)`);
  process.exit(0);
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
  const buildCode = await run(bin('vite'), ['build']);
  if (buildCode !== 0) throw new Error('vite build failed');

  const [port, smtpPort] = [await freePort(), await freePort()];
  dataDir = mkdtempSync(path.join(os.tmpdir(), 'thermoledger-e2e-'));
  const baseUrl = `http://127.0.0.1:${port}`;
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

  exitCode = await run(bin('vitest'), ['run', '--config', 'tests/e2e/vitest.config.ts'], {
    ...process.env,
    E2E_BASE_URL: baseUrl,
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
