import { afterAll, beforeAll, beforeEach, describe, expect, it } from 'vitest';
import { DEMO_PASSWORD, demoUsers, lastMailTo, linkIn, startTestApp, type TestApp } from './helpers';

let t: TestApp;
beforeAll(async () => {
  t = await startTestApp();
});
afterAll(async () => t?.close());
beforeEach(async () => t.reset());

async function requestReset(email: string): Promise<string> {
  const res = await t.anon().post('/api/v1/password-resets').send({ email });
  expect(res.status).toBe(202);
  await t.settle(); // the e-mail goes out after the reply
  const mail = lastMailTo(t.mail, email);
  expect(mail.subject).toBe('Reset your Thermoledger password');
  const link = linkIn(mail.text, `${t.config.publicUrl}/reset-password?token=`);
  return decodeURIComponent(new URL(link).searchParams.get('token')!);
}

describe('password reset by e-mail', () => {
  it('sets a new password from the e-mailed link and ends every session of the account', async () => {
    const oldSession = await t.signIn('member');
    const token = await requestReset(demoUsers.member);
    const done = await t
      .anon()
      .post('/api/v1/password-resets/complete')
      .send({ token, password: 'a-brand-new-password' });
    expect(done.status).toBe(204);

    expect((await oldSession.get('/api/v1/session')).body.user).toBeNull();
    const oldPassword = await t
      .anon()
      .post('/api/v1/session')
      .send({ email: demoUsers.member, password: DEMO_PASSWORD });
    expect(oldPassword.status).toBe(401);
    const newPassword = await t
      .anon()
      .post('/api/v1/session')
      .send({ email: demoUsers.member, password: 'a-brand-new-password' });
    expect(newPassword.status).toBe(200);
  });

  it('works once only (410 the second time)', async () => {
    const token = await requestReset(demoUsers.member);
    expect(
      (await t.anon().post('/api/v1/password-resets/complete').send({ token, password: 'a-brand-new-password' }))
        .status,
    ).toBe(204);
    const again = await t
      .anon()
      .post('/api/v1/password-resets/complete')
      .send({ token, password: 'another-new-password' });
    expect(again.status).toBe(410);
    expect(again.body.error.code).toBe('token_expired');
  });

  it('stops working after an hour', async () => {
    const token = await requestReset(demoUsers.member);
    const { passwordResets } = await import('../../server/db/tables/index');
    // Move the expiry an hour back, as if the link had sat unused.
    await t.db.update(passwordResets).set({ expiresAt: new Date(Date.now() - 1) });
    const res = await t
      .anon()
      .post('/api/v1/password-resets/complete')
      .send({ token, password: 'a-brand-new-password' });
    expect(res.status).toBe(410);
  });

  it('answers 202 for an unknown address too, and sends nothing', async () => {
    const res = await t.anon().post('/api/v1/password-resets').send({ email: 'nobody@nowhere.example' });
    expect(res.status).toBe(202);
    await t.settle();
    expect(t.mail.list()).toHaveLength(0);
  });

  it('rejects a made-up token with 400 and a short password with a field error', async () => {
    const bad = await t
      .anon()
      .post('/api/v1/password-resets/complete')
      .send({ token: 'x'.repeat(43), password: 'a-brand-new-password' });
    expect(bad.status).toBe(400);
    expect(bad.body.error.code).toBe('bad_request');
    const short = await t
      .anon()
      .post('/api/v1/password-resets/complete')
      .send({ token: 'x'.repeat(43), password: 'short' });
    expect(short.status).toBe(400);
    expect(short.body.error.details.issues[0]).toMatchObject({
      path: ['body', 'password'],
      message: 'Use at least 10 characters.',
    });
  });

  it('stores only a hash of the token', async () => {
    const token = await requestReset(demoUsers.member);
    const { passwordResets } = await import('../../server/db/tables/index');
    const rows = await t.db.select().from(passwordResets);
    expect(rows).toHaveLength(1);
    expect(rows[0]!.tokenHash).not.toContain(token);
    expect(rows[0]!.tokenHash).toMatch(/^[0-9a-f]{64}$/);
  });
});

describe('POST /api/v1/password-resets does not tell who has an account', () => {
  it('replies before the e-mail is sent, the same way for a known and an unknown address', async () => {
    t.mailer.mode = 'hold'; // the mail server accepts nothing until released
    const known = await t.anon().post('/api/v1/password-resets').send({ email: demoUsers.member });
    const unknown = await t.anon().post('/api/v1/password-resets').send({ email: 'nobody@kestrel.example' });
    for (const res of [known, unknown]) {
      expect(res.status).toBe(202);
      expect(res.text).toBe('');
    }
    expect(Object.keys(known.headers).sort()).toEqual(Object.keys(unknown.headers).sort());
    // The reply for the real account came back while its e-mail was still waiting to be sent.
    while (t.mailer.waiting === 0) await new Promise((r) => setTimeout(r, 10));
    expect(t.mail.list()).toHaveLength(0);
    await t.mailer.release();
    await t.settle();
    expect(t.mail.list().map((m) => m.to)).toEqual([[demoUsers.member]]);
  });

  it('limits reset e-mails per account: 100 requests put 3 mails in the outbox, then 429', async () => {
    const statuses: number[] = [];
    for (let i = 0; i < 100; i++) {
      statuses.push((await t.anon().post('/api/v1/password-resets').send({ email: demoUsers.member })).status);
    }
    await t.settle();
    expect(statuses.slice(0, 3)).toEqual([202, 202, 202]);
    expect(statuses.slice(3).every((s) => s === 429)).toBe(true);
    expect(t.mail.list().filter((m) => m.to.includes(demoUsers.member))).toHaveLength(3);
  });

  it('limits reset e-mails per network address across accounts, counting unknown addresses too', async () => {
    const replies = await Promise.all(
      Array.from({ length: 30 }, (_, i) =>
        t
          .anon()
          .post('/api/v1/password-resets')
          .send({ email: `someone.${i}@kestrel.example` }),
      ),
    );
    const statuses = replies.map((r) => r.status);
    expect(statuses.filter((s) => s === 202)).toHaveLength(10);
    expect(statuses.filter((s) => s === 429)).toHaveLength(20);
    const refused = replies.find((r) => r.status === 429)!;
    expect(refused.body.error.message).toMatch(/your network address/);
    expect(Number(refused.headers['retry-after'])).toBeGreaterThan(0);
  });
});
