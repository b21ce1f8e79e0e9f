import { afterAll, beforeAll, beforeEach, describe, expect, it } from 'vitest';
import { DEMO_PASSWORD, demoUsers, lastMailTo, linkIn, startTestApp, type TestApp } from './helpers';

let t: TestApp;
beforeAll(async () => {
  t = await startTestApp();
});
afterAll(async () => t?.close());
beforeEach(async () => t.reset());

describe('site administration', () => {
  it('lists users with their site roles and teams', async () => {
    const sam = await t.signIn('site_admin');
    const res = await sam.get('/api/v1/admin/users');
    expect(res.status).toBe(200);
    const cora = res.body.users.find((u: { email: string }) => u.email === demoUsers.curator);
    expect(cora).toMatchObject({
      siteRoles: ['curator'],
      disabled: false,
      teams: [{ name: 'Kestrel Bay Process Lab', role: 'member' }],
    });
    expect(JSON.stringify(res.body)).not.toMatch(/argon2/);
  });

  it('grants a site role, and refuses to let a site admin drop their own', async () => {
    const sam = await t.signIn('site_admin');
    const grant = await sam.patch(`/api/v1/admin/users/${t.ids.users.member}`).send({ siteRoles: ['curator'] });
    expect(grant.status).toBe(200);
    expect(grant.body.siteRoles).toEqual(['curator']);
    const self = await sam.patch(`/api/v1/admin/users/${t.ids.users.site_admin}`).send({ siteRoles: [] });
    expect(self.status).toBe(409);
    const empty = await sam.patch(`/api/v1/admin/users/${t.ids.users.member}`).send({});
    expect(empty.status).toBe(400);
  });

  it('disables a user: their sessions end and sign-in fails', async () => {
    const milo = await t.signIn('member');
    const sam = await t.signIn('site_admin');
    const res = await sam.patch(`/api/v1/admin/users/${t.ids.users.member}`).send({ disabled: true });
    expect(res.status).toBe(200);
    expect((await milo.get('/api/v1/session')).body.user).toBeNull();
    expect(
      (await t.anon().post('/api/v1/session').send({ email: demoUsers.member, password: DEMO_PASSWORD })).status,
    ).toBe(401);
    const actions = (await sam.get('/api/v1/admin/audit-log')).body.events.map((e: { action: string }) => e.action);
    expect(actions).toContain('user.disabled');
  });

  it('creates a team whose first admin is invited by e-mail, readable in the outbox', async () => {
    const sam = await t.signIn('site_admin');
    const res = await sam
      .post('/api/v1/admin/teams')
      .send({ name: 'Kestrel Bay Process Lab', adminEmail: 'Owen.Owner@Example.org' });
    expect(res.status).toBe(201);
    expect(res.body).toMatchObject({ slug: 'kestrel-bay-process-lab', memberCount: 0 });
    const again = await sam
      .post('/api/v1/admin/teams')
      .send({ name: 'Kestrel Bay Process Lab', adminEmail: 'x@example.org' });
    expect(again.body.slug).toBe('kestrel-bay-process-lab-2');

    const outbox = await sam.get('/api/v1/admin/outbox');
    expect(outbox.body.enabled).toBe(true);
    expect(outbox.body.messages[0].to).toEqual(['x@example.org']);
    const mail = lastMailTo(t.mail, 'owen.owner@example.org');
    const link = linkIn(mail.text, `${t.config.publicUrl}/invitations/`);
    const token = decodeURIComponent(link.split('/invitations/')[1]!);
    const preview = await t.anon().get(`/api/v1/invitations/${token}`);
    expect(preview.body).toMatchObject({ role: 'team_admin', email: 'owen.owner@example.org' });
    const teams = await sam.get('/api/v1/admin/teams');
    expect(teams.body.teams.map((x: { slug: string }) => x.slug)).toEqual([
      'kestrel-bay',
      'kestrel-bay-process-lab',
      'kestrel-bay-process-lab-2',
      'larchmont',
    ]);
  });

  it('pages the audit log with limit and before', async () => {
    for (let i = 0; i < 3; i++)
      await t
        .anon()
        .post('/api/v1/session')
        .send({ email: demoUsers.viewer, password: `wrong-${i}` });
    const sam = await t.signIn('site_admin');
    const page = await sam.get('/api/v1/admin/audit-log').query({ limit: 2 });
    expect(page.body.events).toHaveLength(2);
    const older = await sam.get('/api/v1/admin/audit-log').query({ limit: 10, before: page.body.events[1].at });
    for (const e of older.body.events) expect(Date.parse(e.at)).toBeLessThan(Date.parse(page.body.events[1].at));
    const bad = await sam.get('/api/v1/admin/audit-log').query({ limit: 0 });
    expect(bad.status).toBe(400);
    expect(bad.body.error.details.issues[0].path).toEqual(['query', 'limit']);
  });
});
