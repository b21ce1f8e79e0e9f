import request from 'supertest';
import { afterAll, beforeAll, beforeEach, describe, expect, it } from 'vitest';
import { DEMO_PASSWORD, demoUsers, startTestApp, type TestApp } from './helpers';

let t: TestApp;
beforeAll(async () => {
  t = await startTestApp();
});
afterAll(async () => t?.close());
beforeEach(async () => t.reset());

describe('API tokens', () => {
  it('creates a tl_ token shown once, lists it without the secret, and revokes it', async () => {
    const agent = await t.signIn('member');
    const created = await agent.post('/api/v1/account/tokens').send({ name: 'plant historian', expiresInDays: 30 });
    expect(created.status).toBe(201);
    expect(created.body.token).toMatch(/^tl_[A-Za-z0-9_-]{43}$/);
    expect(created.body.prefix).toBe(created.body.token.slice(0, 10));
    expect(Date.parse(created.body.expiresAt) - Date.now()).toBeGreaterThan(29 * 86_400_000);

    const list = await agent.get('/api/v1/account/tokens');
    expect(list.body.tokens).toHaveLength(1);
    expect(list.body.tokens[0]).not.toHaveProperty('token');
    expect(JSON.stringify(list.body)).not.toContain(created.body.token);

    const bearer = { Authorization: `Bearer ${created.body.token}` };
    const used = await request(t.url).get(`/api/v1/teams/${t.ids.teams.kestrel}/notes`).set(bearer);
    expect(used.status).toBe(200);
    const afterUse = await agent.get('/api/v1/account/tokens');
    expect(afterUse.body.tokens[0].lastUsedAt).not.toBeNull();

    const revoked = await agent.delete(`/api/v1/account/tokens/${created.body.id}`);
    expect(revoked.status).toBe(204);
    const refused = await request(t.url).get(`/api/v1/teams/${t.ids.teams.kestrel}/notes`).set(bearer);
    expect(refused.status).toBe(401);
    expect((await agent.get('/api/v1/account/tokens')).body.tokens).toEqual([]);
  });

  it("carries its owner's roles: a viewer's token cannot write", async () => {
    const token = await t.tokenFor('viewer');
    const res = await request(t.url)
      .post(`/api/v1/teams/${t.ids.teams.kestrel}/notes`)
      .set('Authorization', `Bearer ${token}`)
      .send({ title: 'x', body: '' });
    expect(res.status).toBe(403);
  });

  it("cannot revoke someone else's token (404)", async () => {
    const milo = await t.signIn('member');
    const created = await milo.post('/api/v1/account/tokens').send({ name: 'mine' });
    const vera = await t.signIn('viewer');
    const res = await vera.delete(`/api/v1/account/tokens/${created.body.id}`);
    expect(res.status).toBe(404);
    expect((await milo.get('/api/v1/account/tokens')).body.tokens).toHaveLength(1);
  });

  it('stops an expired token', async () => {
    const agent = await t.signIn('member');
    const created = await agent.post('/api/v1/account/tokens').send({ name: 'short-lived', expiresInDays: 1 });
    const { apiTokens } = await import('../../server/db/tables/index');
    await t.db.update(apiTokens).set({ expiresAt: new Date(Date.now() - 1000) });
    const res = await request(t.url).get('/api/v1/account').set('Authorization', `Bearer ${created.body.token}`);
    expect(res.status).toBe(401);
  });

  it('records creation and revocation in the audit log', async () => {
    const agent = await t.signIn('member');
    const created = await agent.post('/api/v1/account/tokens').send({ name: 'audited' });
    await agent.delete(`/api/v1/account/tokens/${created.body.id}`);
    const admin = await t.signIn('site_admin');
    const actions = (await admin.get('/api/v1/admin/audit-log')).body.events.map((e: { action: string }) => e.action);
    expect(actions).toEqual(expect.arrayContaining(['token.created', 'token.revoked']));
  });
});

describe('PATCH /api/v1/account', () => {
  it('changes the display name and trims it', async () => {
    const agent = await t.signIn('member');
    const res = await agent.patch('/api/v1/account').send({ displayName: '  Milo M.  ' });
    expect(res.status).toBe(200);
    expect(res.body.user.displayName).toBe('Milo M.');
    expect((await agent.get('/api/v1/account')).body.user.displayName).toBe('Milo M.');
  });
});

describe('POST /api/v1/account/password', () => {
  it('needs the current password, then ends the other sessions but keeps this one', async () => {
    const here = await t.signIn('member');
    const elsewhere = await t.signIn('member');
    const wrong = await here
      .post('/api/v1/account/password')
      .send({ currentPassword: 'nope', newPassword: 'a-brand-new-password' });
    expect(wrong.status).toBe(400);
    expect(wrong.body.error.details.issues[0].path).toEqual(['body', 'currentPassword']);

    const ok = await here
      .post('/api/v1/account/password')
      .send({ currentPassword: DEMO_PASSWORD, newPassword: 'a-brand-new-password' });
    expect(ok.status).toBe(204);
    expect((await here.get('/api/v1/session')).body.user.email).toBe(demoUsers.member);
    expect((await elsewhere.get('/api/v1/session')).body.user).toBeNull();
  });
});

describe('API tokens and credential changes', () => {
  it('refuses to create a token with a token (403), so a leaked token cannot mint replacements', async () => {
    const token = await t.tokenFor('member');
    const res = await request(t.url)
      .post('/api/v1/account/tokens')
      .set('Authorization', `Bearer ${token}`)
      .send({ name: 'minted by a token' });
    expect(res.status).toBe(403);
    expect(res.body.error.message).toMatch(/API token cannot create tokens/);
    const agent = await t.signIn('member');
    expect((await agent.get('/api/v1/account/tokens')).body.tokens.map((x: { name: string }) => x.name)).not.toContain(
      'minted by a token',
    );
  });

  it('revokes every API token of the account when the password is changed', async () => {
    const token = await t.tokenFor('member');
    const bearer = { Authorization: `Bearer ${token}` };
    expect((await request(t.url).get('/api/v1/account').set(bearer)).status).toBe(200);
    const agent = await t.signIn('member');
    const changed = await agent
      .post('/api/v1/account/password')
      .send({ currentPassword: DEMO_PASSWORD, newPassword: 'a-brand-new-password' });
    expect(changed.status).toBe(204);
    expect((await request(t.url).get('/api/v1/account').set(bearer)).status).toBe(401);
    expect((await agent.get('/api/v1/account/tokens')).body.tokens).toEqual([]);
  });

  it('revokes every API token of the account when the password is reset by e-mail', async () => {
    const token = await t.tokenFor('member');
    const bearer = { Authorization: `Bearer ${token}` };
    expect((await t.anon().post('/api/v1/password-resets').send({ email: demoUsers.member })).status).toBe(202);
    await t.settle();
    const mail = t.mail.list().find((m) => m.to.includes(demoUsers.member))!;
    expect(mail.text).toMatch(/revokes all its API tokens/);
    const resetToken = new URL(
      mail.text.split(/\s+/).find((w) => w.includes('/reset-password?token='))!,
    ).searchParams.get('token')!;
    const done = await t
      .anon()
      .post('/api/v1/password-resets/complete')
      .send({ token: resetToken, password: 'a-brand-new-password' });
    expect(done.status).toBe(204);
    expect((await request(t.url).get('/api/v1/account').set(bearer)).status).toBe(401);
  });
});
