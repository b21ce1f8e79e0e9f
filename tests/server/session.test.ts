import { afterAll, beforeAll, beforeEach, describe, expect, it } from 'vitest';
import { DEMO_PASSWORD, demoUsers, startTestApp, type TestApp } from './helpers';

let t: TestApp;
beforeAll(async () => {
  t = await startTestApp();
});
afterAll(async () => t?.close());
beforeEach(async () => t.reset());

function sessionCookie(res: { headers: Record<string, unknown> }): string | undefined {
  const raw = res.headers['set-cookie'];
  const list = Array.isArray(raw) ? (raw as string[]) : typeof raw === 'string' ? [raw] : [];
  return list.find((c) => c.startsWith('tl_session='));
}

describe('POST /api/v1/session', () => {
  it('signs in with the demo password and reports the teams and roles', async () => {
    const agent = t.anon();
    const res = await agent.post('/api/v1/session').send({ email: demoUsers.member, password: DEMO_PASSWORD });
    expect(res.status).toBe(200);
    expect(res.body.user.email).toBe(demoUsers.member);
    expect(res.body.via).toBe('session');
    expect(res.body.teams).toEqual([
      { id: t.ids.teams.kestrel, name: 'Kestrel Bay Process Lab', slug: 'kestrel-bay', role: 'member' },
    ]);
    const me = await agent.get('/api/v1/session');
    expect(me.body.user.id).toBe(t.ids.users.member);
  });

  it('accepts the e-mail in any letter case', async () => {
    const res = await t
      .anon()
      .post('/api/v1/session')
      .send({ email: demoUsers.member.toUpperCase(), password: DEMO_PASSWORD });
    expect(res.status).toBe(200);
  });

  it('sets an HttpOnly, SameSite=Lax, Path=/ cookie, not Secure over plain HTTP', async () => {
    const res = await t.anon().post('/api/v1/session').send({ email: demoUsers.member, password: DEMO_PASSWORD });
    const cookie = sessionCookie(res);
    expect(cookie).toBeDefined();
    expect(cookie).toMatch(/HttpOnly/i);
    expect(cookie).toMatch(/SameSite=Lax/i);
    expect(cookie).toMatch(/Path=\//);
    expect(cookie).toMatch(/Expires=/);
    expect(cookie).not.toMatch(/Secure/i);
  });

  it('marks the cookie Secure when the request came over HTTPS through a trusted proxy', async () => {
    const { startTestApp: start } = await import('./helpers');
    // Reuse this file's database; only the proxy setting differs.
    const proxied = await start({ open: { ...t.open, close: async () => {} }, config: { trustProxy: 1 } });
    try {
      const res = await proxied
        .anon()
        .post('/api/v1/session')
        .set('X-Forwarded-Proto', 'https')
        .send({ email: demoUsers.member, password: DEMO_PASSWORD });
      expect(res.status).toBe(200);
      expect(sessionCookie(res)).toMatch(/; Secure/i);
    } finally {
      await proxied.close();
    }
  });

  it('answers a wrong password with 401 and one clear message that does not reveal whether the account exists', async () => {
    const wrong = await t
      .anon()
      .post('/api/v1/session')
      .send({ email: demoUsers.member, password: 'not the password' });
    const unknown = await t
      .anon()
      .post('/api/v1/session')
      .send({ email: 'nobody@kestrel.example', password: 'not the password' });
    for (const res of [wrong, unknown]) {
      expect(res.status).toBe(401);
      expect(res.body).toEqual({ error: { code: 'invalid_credentials', message: 'E-mail or password is wrong.' } });
      expect(sessionCookie(res)).toBeUndefined();
    }
  });

  it('gives a new session id at each sign-in and ends the one the browser came with', async () => {
    const agent = t.anon();
    const first = await agent.post('/api/v1/session').send({ email: demoUsers.member, password: DEMO_PASSWORD });
    const firstCookie = sessionCookie(first)!.split(';')[0]!;
    const second = await agent.post('/api/v1/session').send({ email: demoUsers.member, password: DEMO_PASSWORD });
    const secondCookie = sessionCookie(second)!.split(';')[0]!;
    expect(secondCookie).not.toBe(firstCookie);
    const old = await t.anon().get('/api/v1/session').set('Cookie', firstCookie);
    expect(old.body.user).toBeNull();
    const fresh = await t.anon().get('/api/v1/session').set('Cookie', secondCookie);
    expect(fresh.body.user.email).toBe(demoUsers.member);
  });

  it('locks an account with 429 and Retry-After after repeated failures, even for the right password', async () => {
    for (let i = 0; i < 5; i++) {
      const res = await t
        .anon()
        .post('/api/v1/session')
        .send({ email: demoUsers.viewer, password: `wrong-${i}` });
      expect(res.status).toBe(401);
    }
    const blocked = await t.anon().post('/api/v1/session').send({ email: demoUsers.viewer, password: DEMO_PASSWORD });
    expect(blocked.status).toBe(429);
    expect(blocked.body.error.code).toBe('rate_limited');
    expect(blocked.body.error.message).toMatch(/Too many failed sign-ins for this account/);
    expect(Number(blocked.headers['retry-after'])).toBeGreaterThan(0);
    expect(Number(blocked.headers['retry-after'])).toBeLessThanOrEqual(900);
    // Another account from the same address is not locked yet.
    const other = await t.anon().post('/api/v1/session').send({ email: demoUsers.member, password: DEMO_PASSWORD });
    expect(other.status).toBe(200);
  });

  it('records sign-in success and failure in the audit log', async () => {
    await t.anon().post('/api/v1/session').send({ email: demoUsers.member, password: 'not the password' });
    await t.anon().post('/api/v1/session').send({ email: demoUsers.member, password: DEMO_PASSWORD });
    const admin = await t.signIn('site_admin');
    const res = await admin.get('/api/v1/admin/audit-log');
    expect(res.status).toBe(200);
    const forMilo = res.body.events.filter((e: { actorEmail: string }) => e.actorEmail === demoUsers.member);
    expect(forMilo.map((e: { action: string }) => e.action).sort()).toEqual(['sign_in.failed', 'sign_in.succeeded']);
  });

  it('rejects a missing field with 400 naming it', async () => {
    const res = await t.anon().post('/api/v1/session').send({ email: demoUsers.member });
    expect(res.status).toBe(400);
    expect(res.body.error.code).toBe('validation_failed');
    expect(res.body.error.message).toMatch(/body\.password/);
    expect(res.body.error.details.issues[0].path).toEqual(['body', 'password']);
  });
});

describe('GET /api/v1/session', () => {
  it('reports nobody for an anonymous request', async () => {
    const res = await t.anon().get('/api/v1/session');
    expect(res.status).toBe(200);
    expect(res.body).toEqual({ user: null, teams: [], via: 'none' });
  });

  it('reports via "token" for a Bearer request', async () => {
    const token = await t.tokenFor('member');
    const res = await t.anon().get('/api/v1/session').set('Authorization', `Bearer ${token}`);
    expect(res.body.via).toBe('token');
    expect(res.body.user.email).toBe(demoUsers.member);
  });

  it('answers 401 for an unknown Bearer token rather than treating it as anonymous', async () => {
    const res = await t.anon().get('/api/v1/session').set('Authorization', 'Bearer tl_madeup');
    expect(res.status).toBe(401);
    expect(res.body.error.code).toBe('unauthenticated');
  });
});

describe('DELETE /api/v1/session', () => {
  it('ends the session on the server and clears the cookie', async () => {
    const agent = await t.signIn('member');
    const before = await agent.get('/api/v1/session');
    expect(before.body.user).not.toBeNull();
    const res = await agent.delete('/api/v1/session');
    expect(res.status).toBe(204);
    expect(sessionCookie(res)).toMatch(/Expires=Thu, 01 Jan 1970/);
    const after = await agent.get('/api/v1/session');
    expect(after.body.user).toBeNull();
  });

  it('makes the old cookie useless even if a copy was kept', async () => {
    const agent = t.anon();
    const signIn = await agent.post('/api/v1/session').send({ email: demoUsers.member, password: DEMO_PASSWORD });
    const cookie = sessionCookie(signIn)!.split(';')[0]!;
    await agent.delete('/api/v1/session');
    const replay = await t.anon().get('/api/v1/account').set('Cookie', cookie);
    expect(replay.status).toBe(401);
  });
});

describe('POST /api/v1/session under parallel attempts', () => {
  const attempt = (email: string, password: string) => t.anon().post('/api/v1/session').send({ email, password });

  async function failedSignInsFor(email: string): Promise<number> {
    const { auditLog } = await import('../../server/db/tables/index');
    const rows = await t.db.select().from(auditLog);
    return rows.filter((r) => r.action === 'sign_in.failed' && r.actorEmail === email).length;
  }

  it('checks no more than the account limit of wrong passwords when 30 arrive at once', async () => {
    const replies = await Promise.all(Array.from({ length: 30 }, (_, i) => attempt(demoUsers.viewer, `wrong-${i}`)));
    const statuses = replies.map((r) => r.status);
    expect(statuses.filter((s) => s === 401)).toHaveLength(5);
    expect(statuses.filter((s) => s === 429)).toHaveLength(25);
    // Only the five reserved attempts reached the password check.
    expect(await failedSignInsFor(demoUsers.viewer)).toBe(5);
  }, 120_000);

  it('does not let the right password through when it arrives among 60 parallel guesses', async () => {
    const replies = await Promise.all(
      Array.from({ length: 60 }, (_, i) => attempt(demoUsers.member, i === 49 ? DEMO_PASSWORD : `guess-${i}`)),
    );
    const statuses = replies.map((r) => r.status);
    // At most five attempts were checked; unless the right one was among them, nobody got in.
    expect(statuses.filter((s) => s !== 429).length).toBeLessThanOrEqual(5);
    const checked = replies.filter((r) => r.status !== 429);
    expect(checked.length).toBeGreaterThan(0);
    if (replies[49]!.status === 429) expect(statuses).not.toContain(200);
    expect(statuses.filter((s) => s === 200).length).toBeLessThanOrEqual(1);
  }, 120_000);

  /** The same database, with small sign-in limits (argon2 is slow on purpose, so fewer attempts keep the test short). */
  async function withSmallLimits(run: (app: TestApp) => Promise<void>): Promise<void> {
    const { startTestApp: start } = await import('./helpers');
    const small = await start({
      open: { ...t.open, close: async () => {} },
      config: { signIn: { maxFailuresPerAccount: 2, maxFailuresPerAddress: 4 } },
    });
    try {
      await run(small);
    } finally {
      await small.close();
    }
  }

  it('checks no more than the address limit across many accounts from one address', async () => {
    await withSmallLimits(async (small) => {
      const emails = Array.from({ length: 12 }, (_, i) => `guess.${i}@kestrel.example`);
      const replies = await Promise.all(
        emails.map((email) => small.anon().post('/api/v1/session').send({ email, password: 'not the password' })),
      );
      const statuses = replies.map((r) => r.status);
      expect(statuses.filter((s) => s === 401)).toHaveLength(4);
      expect(statuses.filter((s) => s === 429)).toHaveLength(8);
      expect(replies.find((r) => r.status === 429)!.body.error.message).toMatch(/your network address/);
    });
  }, 120_000);

  it('gives a successful sign-in its attempt back, so a user who types the password right is never counted', async () => {
    await withSmallLimits(async (small) => {
      for (let i = 0; i < 6; i++) {
        const res = await small
          .anon()
          .post('/api/v1/session')
          .send({ email: demoUsers.member, password: DEMO_PASSWORD });
        expect(res.status).toBe(200);
      }
    });
  }, 120_000);
});
