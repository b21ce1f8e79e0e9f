import { inject } from 'vitest';
import { randomBytes } from 'node:crypto';
import { readFileSync } from 'node:fs';
import type { Server } from 'node:http';
import type { AddressInfo } from 'node:net';
import { sql } from 'drizzle-orm';
import pg from 'pg';
import request from 'supertest';
import type TestAgent from 'supertest/lib/agent';
import { createApp, type ThermoledgerApp } from '../../server/app';
import { openDatabase, type OpenDatabase } from '../../server/db/client';
import { runMigrations } from '../../server/db/migrate';
import pino from 'pino';
import { demoAccounts, PUBLISHED_DEMO_PASSWORD, type DemoAccountKey } from '../../seeds/demo/demo-seed';
import { seedDemo } from '../../server/db/seed';
import { configFromEnv, readEnv, type AppConfig } from '../../server/env';
import { startFakeSmtp, type FakeSmtp } from '../../server/mail/fake-smtp';
import { createMailer, type Mailer, type MailMessage } from '../../server/mail/mailer';
import type { AnyRoute } from '../../server/routes/registry';
import { DUMP_ENV, TEMPLATE_ENV } from '../setup/seeded-database';

/** The demo accounts by the role they play in tests (seeds/demo is the one list). */
export const demoUsers = demoAccounts;
export type DemoRole = DemoAccountKey;
/** Tests seed the demo accounts explicitly, with the published password. */
export const DEMO_PASSWORD = PUBLISHED_DEMO_PASSWORD;

type DeepPartial<T> = {
  [K in keyof T]?: T[K] extends object ? (T[K] extends unknown[] ? T[K] : DeepPartial<T[K]>) : T[K];
};

function merge<T>(base: T, overrides: DeepPartial<T>): T {
  const out = { ...base } as Record<string, unknown>;
  for (const [key, value] of Object.entries(overrides as Record<string, unknown>)) {
    const current = out[key];
    out[key] =
      value && typeof value === 'object' && !Array.isArray(value) && current && typeof current === 'object'
        ? merge(current, value as DeepPartial<typeof current>)
        : value;
  }
  return out as T;
}

/** Configuration for tests: the documented defaults, quiet logs, two calculation workers; tests override parts. */
export function testConfig(overrides: DeepPartial<AppConfig> = {}): AppConfig {
  const defaults = configFromEnv(
    readEnv({ NODE_ENV: 'test', PUBLIC_URL: 'http://thermoledger.test', CALC_WORKERS: '2' }),
  );
  return merge({ ...defaults, logLevel: 'silent', version: 'test' }, overrides);
}

/**
 * A mailer wrapper whose delivery a test can steer: deliver (default), fail every message, or
 * hold messages until released (to show that a reply does not wait for its e-mail).
 */
export class SteerableMailer implements Mailer {
  mode: 'deliver' | 'fail' | 'hold' = 'deliver';
  private held: { message: MailMessage; resolve: () => void; reject: (e: Error) => void }[] = [];
  constructor(private readonly inner: Mailer) {}
  get outbox() {
    return this.inner.outbox;
  }
  send(message: MailMessage): Promise<void> {
    if (this.mode === 'fail') return Promise.reject(new Error('SMTP 451: mail server unavailable (test)'));
    if (this.mode === 'hold') return new Promise((resolve, reject) => this.held.push({ message, resolve, reject }));
    return this.inner.send(message);
  }
  /** Messages waiting in 'hold' mode. */
  get waiting(): number {
    return this.held.length;
  }
  /** Sends what was held and goes back to delivering. */
  async release(): Promise<void> {
    this.mode = 'deliver';
    const held = this.held.splice(0);
    for (const h of held) await this.inner.send(h.message).then(h.resolve, h.reject);
  }
}

/** A value the run's global set-up provided, or undefined outside vitest (scripts, benchmarks). */
function provided(key: typeof DUMP_ENV | typeof TEMPLATE_ENV): string | undefined {
  try {
    return inject(key);
  } catch {
    return undefined;
  }
}

/**
 * A fresh database for one test file, migrated and with the library seeded (revision 1): in-memory
 * PGlite loaded from the run's seeded dump, or (DATABASE_URL set) a new database on that server
 * created from the run's template (tests/setup/seeded-database.ts). A `dataDir` gives an empty,
 * migrated PGlite on disk instead (persistence tests).
 */
export async function openTestDatabase(dataDir: string | 'memory://' = 'memory://'): Promise<OpenDatabase> {
  const baseUrl = process.env['DATABASE_URL'];
  if (!baseUrl) {
    const dump = provided(DUMP_ENV);
    if (dataDir === 'memory://' && dump) {
      const loadDataDir = new Blob([readFileSync(dump)]);
      const open = await openDatabase({ kind: 'pglite', dataDir, loadDataDir });
      await runMigrations(open);
      return open;
    }
    const open = await openDatabase({ kind: 'pglite', dataDir });
    await runMigrations(open);
    return open;
  }
  // Test files run in parallel forks: each gets its own database, dropped at close.
  const name = `tl_test_${process.pid}_${randomBytes(4).toString('hex')}`;
  const template = provided(TEMPLATE_ENV);
  const admin = new pg.Client({ connectionString: baseUrl });
  await admin.connect();
  await admin.query(template ? `create database ${name} template ${template}` : `create database ${name}`);
  await admin.end();
  const url = new URL(baseUrl);
  url.pathname = `/${name}`;
  const open = await openDatabase({ kind: 'postgres', url: url.toString() });
  await runMigrations(open);
  return {
    ...open,
    async close() {
      await open.close();
      const dropper = new pg.Client({ connectionString: baseUrl });
      await dropper.connect();
      await dropper.query(`drop database if exists ${name} with (force)`);
      await dropper.end();
    },
  };
}

export interface DemoIds {
  teams: { kestrel: string; larchmont: string };
  users: Record<DemoRole, string>;
}

export interface TestApp {
  app: ThermoledgerApp;
  /** Base URL of the listening server, e.g. http://127.0.0.1:40123. */
  url: string;
  open: OpenDatabase;
  db: OpenDatabase['db'];
  /** The fake SMTP server (port 0) capturing every message the app sends. */
  mail: FakeSmtp;
  /** The mailer the app uses: set `mailer.mode` to make sending fail or wait. */
  mailer: SteerableMailer;
  /** Log lines written so far (JSON objects), when started with captureLog. */
  logLines(): Record<string, unknown>[];
  /** Waits for work queued after replies (e-mails) to finish. */
  settle(): Promise<void>;
  config: AppConfig;
  ids: DemoIds;
  /** Empties every table, reseeds the demo data, clears mail, mail steering and rate-limit counters. */
  reset(): Promise<void>;
  /** An agent signed in as the demo user, sending our own Origin header (as a browser would). */
  signIn(role: DemoRole): Promise<TestAgent>;
  /** An agent with no cookies, sending our own Origin header. */
  anon(): TestAgent;
  /** A fresh API token of the demo user. */
  tokenFor(role: DemoRole): Promise<string>;
  close(): Promise<void>;
}

const TABLES = 'audit_log, notes, password_resets, invitations, api_tokens, sessions, memberships, teams, users';

async function readIds(open: OpenDatabase): Promise<DemoIds> {
  const { teams, users } = await import('../../server/db/tables/index');
  const teamRows = await open.db.select({ id: teams.id, slug: teams.slug }).from(teams);
  const userRows = await open.db.select({ id: users.id, email: users.email }).from(users);
  const team = (slug: string) => teamRows.find((t) => t.slug === slug)?.id ?? '';
  const user = (email: string) => userRows.find((u) => u.email === email)?.id ?? '';
  return {
    teams: { kestrel: team('kestrel-bay'), larchmont: team('larchmont') },
    users: Object.fromEntries(Object.entries(demoUsers).map(([role, email]) => [role, user(email)])) as Record<
      DemoRole,
      string
    >,
  };
}

/**
 * Starts the real app on a real database over real HTTP (port 0), with a fake SMTP server.
 * Call once per test file (beforeAll) and `reset()` between tests.
 */
export async function startTestApp(
  options: {
    config?: DeepPartial<AppConfig>;
    extraRoutes?: readonly AnyRoute[];
    open?: OpenDatabase;
    clientDir?: string | null;
    captureLog?: boolean;
  } = {},
): Promise<TestApp> {
  const open = options.open ?? (await openTestDatabase());
  const mail = await startFakeSmtp({ port: 0 });
  const mailer = new SteerableMailer(
    createMailer(
      { host: mail.host, port: mail.port, secure: false, from: 'Thermoledger <no-reply@thermoledger.test>' },
      mail,
    ),
  );
  const config = testConfig(options.config);
  const lines: string[] = [];
  const logger = options.captureLog
    ? pino({ level: 'info', base: undefined }, { write: (line: string) => void lines.push(line) })
    : undefined;
  const app = createApp({
    db: open.db,
    mailer,
    config,
    clientDir: options.clientDir ?? null,
    extraRoutes: options.extraRoutes ?? [],
    logger,
  });
  const server: Server = await new Promise((resolve) => {
    const s = app.listen(0, '127.0.0.1', () => resolve(s));
  });
  const url = `http://127.0.0.1:${(server.address() as AddressInfo).port}`;
  await seedDemo(open.db);

  const anon = () => request.agent(url).set('Origin', url);
  const t: TestApp = {
    app,
    url,
    open,
    db: open.db,
    mail,
    mailer,
    config,
    ids: await readIds(open),
    logLines: () => lines.map((l) => JSON.parse(l) as Record<string, unknown>),
    settle: () => app.locals.deps.jobs.drain(),
    async reset() {
      await app.locals.deps.jobs.drain();
      await open.db.execute(sql.raw(`truncate ${TABLES} restart identity cascade`));
      await seedDemo(open.db);
      t.ids = await readIds(open);
      mail.clear();
      mailer.mode = 'deliver';
      app.locals.deps.limits.reset();
    },
    anon,
    async signIn(role) {
      const agent = anon();
      const res = await agent.post('/api/v1/session').send({ email: demoUsers[role], password: DEMO_PASSWORD });
      if (res.status !== 200) throw new Error(`sign-in as ${role} failed: ${res.status} ${JSON.stringify(res.body)}`);
      return agent;
    },
    async tokenFor(role) {
      const agent = await t.signIn(role);
      const res = await agent.post('/api/v1/account/tokens').send({ name: `test token ${role}` });
      if (res.status !== 201) throw new Error(`token for ${role} failed: ${res.status} ${JSON.stringify(res.body)}`);
      return res.body.token as string;
    },
    async close() {
      server.closeAllConnections();
      await new Promise<void>((resolve) => server.close(() => resolve()));
      await app.locals.close();
      await mail.close();
      await open.close();
    },
  };
  return t;
}

/** The last captured message to `to`, or an error listing what did arrive. */
export function lastMailTo(mail: FakeSmtp, to: string) {
  const found = mail
    .list()
    .filter((m) => m.to.includes(to))
    .at(-1);
  if (!found)
    throw new Error(
      `no mail to ${to}; got: ${
        mail
          .list()
          .map((m) => m.to.join(','))
          .join('; ') || 'none'
      }`,
    );
  return found;
}

/** The first URL in a text that starts with `prefix`. */
export function linkIn(text: string, prefix: string): string {
  const match = text.split(/\s+/).find((w) => w.startsWith(prefix));
  if (!match) throw new Error(`no link starting ${prefix} in:\n${text}`);
  return match;
}
