import { afterAll, beforeAll, beforeEach, describe, expect, it } from 'vitest';
import { DEMO_PASSWORD, demoUsers, lastMailTo, linkIn, startTestApp, type TestApp } from './helpers';

let t: TestApp;
beforeAll(async () => {
  t = await startTestApp();
});
afterAll(async () => t?.close());
beforeEach(async () => t.reset());

/** Invites `email` as the Kestrel team admin and returns the token from the e-mailed link. */
async function invite(email: string, role: 'viewer' | 'member' | 'team_admin' = 'member'): Promise<string> {
  const admin = await t.signIn('team_admin');
  const res = await admin.post(`/api/v1/teams/${t.ids.teams.kestrel}/invitations`).send({ email, role });
  expect(res.status).toBe(201);
  expect(res.body).toMatchObject({ email, role, invitedBy: 'Tara Admin', acceptedAt: null });
  const mail = lastMailTo(t.mail, email);
  expect(mail.subject).toBe('You are invited to Kestrel Bay Process Lab on Thermoledger');
  const link = linkIn(mail.text, `${t.config.publicUrl}/invitations/`);
  return decodeURIComponent(link.slice(`${t.config.publicUrl}/invitations/`.length));
}

describe('team invitations, end to end through the e-mail', () => {
  it('lets a new person accept from the e-mailed link, creating the account and signing in', async () => {
    const token = await invite('nadia.new@kestrel.example', 'viewer');
    const preview = await t.anon().get(`/api/v1/invitations/${token}`);
    expect(preview.status).toBe(200);
    expect(preview.body).toMatchObject({
      teamName: 'Kestrel Bay Process Lab',
      email: 'nadia.new@kestrel.example',
      role: 'viewer',
      accountExists: false,
    });

    const browser = t.anon();
    const missing = await browser.post(`/api/v1/invitations/${token}/accept`).send({ displayName: 'Nadia New' });
    expect(missing.status).toBe(400);
    expect(missing.body.error.details.issues[0].path).toEqual(['body', 'password']);

    const accepted = await browser
      .post(`/api/v1/invitations/${token}/accept`)
      .send({ displayName: 'Nadia New', password: 'a-long-new-password' });
    expect(accepted.status).toBe(200);
    expect(accepted.body.user).toMatchObject({ email: 'nadia.new@kestrel.example', displayName: 'Nadia New' });
    expect(accepted.body.teams).toEqual([expect.objectContaining({ id: t.ids.teams.kestrel, role: 'viewer' })]);
    const notes = await browser.get(`/api/v1/teams/${t.ids.teams.kestrel}/notes`);
    expect(notes.status).toBe(200);

    // The new password works for a later sign-in.
    const again = await t
      .anon()
      .post('/api/v1/session')
      .send({ email: 'nadia.new@kestrel.example', password: 'a-long-new-password' });
    expect(again.status).toBe(200);
  });

  it('works once only', async () => {
    const token = await invite('once@kestrel.example');
    const first = await t
      .anon()
      .post(`/api/v1/invitations/${token}/accept`)
      .send({ displayName: 'Once', password: 'a-long-new-password' });
    expect(first.status).toBe(200);
    const second = await t
      .anon()
      .post(`/api/v1/invitations/${token}/accept`)
      .send({ displayName: 'Twice', password: 'a-long-new-password' });
    expect(second.status).toBe(410);
    expect(second.body.error.code).toBe('token_expired');
    const preview = await t.anon().get(`/api/v1/invitations/${token}`);
    expect(preview.status).toBe(410);
  });

  it('requires an existing account to be signed in as the invited address', async () => {
    const token = await invite(demoUsers.other_team, 'member');
    const preview = await t.anon().get(`/api/v1/invitations/${token}`);
    expect(preview.body.accountExists).toBe(true);

    const anonymous = await t.anon().post(`/api/v1/invitations/${token}/accept`).send({});
    expect(anonymous.status).toBe(401);
    expect(anonymous.body.error.message).toContain(demoUsers.other_team);

    const wrongPerson = await t.signIn('viewer');
    const wrong = await wrongPerson.post(`/api/v1/invitations/${token}/accept`).send({});
    expect(wrong.status).toBe(403);

    const lena = await t.signIn('other_team');
    const ok = await lena.post(`/api/v1/invitations/${token}/accept`).send({});
    expect(ok.status).toBe(200);
    expect(ok.body.teams.map((m: { slug: string; role: string }) => `${m.slug}:${m.role}`).sort()).toEqual([
      'kestrel-bay:member',
      'larchmont:team_admin',
    ]);
  });

  it('refuses to invite someone who is already a member (409)', async () => {
    const admin = await t.signIn('team_admin');
    const res = await admin
      .post(`/api/v1/teams/${t.ids.teams.kestrel}/invitations`)
      .send({ email: demoUsers.member, role: 'viewer' });
    expect(res.status).toBe(409);
    expect(t.mail.list()).toHaveLength(0);
  });

  it('lists and withdraws invitations; a withdrawn link no longer works', async () => {
    const token = await invite('maybe@kestrel.example');
    const admin = await t.signIn('team_admin');
    const list = await admin.get(`/api/v1/teams/${t.ids.teams.kestrel}/invitations`);
    expect(list.body.invitations).toHaveLength(1);
    const id = list.body.invitations[0].id as string;
    const del = await admin.delete(`/api/v1/teams/${t.ids.teams.kestrel}/invitations/${id}`);
    expect(del.status).toBe(204);
    const preview = await t.anon().get(`/api/v1/invitations/${token}`);
    expect(preview.status).toBe(404);
    // Another team's admin cannot withdraw Kestrel's invitations even with the id.
    await invite('other@kestrel.example');
    const otherId = (await admin.get(`/api/v1/teams/${t.ids.teams.kestrel}/invitations`)).body.invitations[0]
      .id as string;
    const lena = await t.signIn('other_team');
    const cross = await lena.delete(`/api/v1/teams/${t.ids.teams.larchmont}/invitations/${otherId}`);
    expect(cross.status).toBe(404);
  });

  it('rejects an expired invitation with 410', async () => {
    const token = await invite('late@kestrel.example');
    const { invitations } = await import('../../server/db/tables/index');
    await t.db.update(invitations).set({ expiresAt: new Date(Date.now() - 1000) });
    const res = await t
      .anon()
      .post(`/api/v1/invitations/${token}/accept`)
      .send({ displayName: 'Late', password: 'a-long-new-password' });
    expect(res.status).toBe(410);
    expect(res.body.error.message).toMatch(/expired/);
  });

  it('records the invitation and its acceptance in the audit log', async () => {
    const token = await invite('audited@kestrel.example');
    await t
      .anon()
      .post(`/api/v1/invitations/${token}/accept`)
      .send({ displayName: 'Audited', password: 'a-long-new-password' });
    const admin = await t.signIn('site_admin');
    const actions = (await admin.get('/api/v1/admin/audit-log')).body.events.map((e: { action: string }) => e.action);
    expect(actions).toEqual(expect.arrayContaining(['invitation.created', 'invitation.accepted']));
  });

  it('signs in with the demo password after all this (sanity of the seed)', async () => {
    const res = await t.anon().post('/api/v1/session').send({ email: demoUsers.team_admin, password: DEMO_PASSWORD });
    expect(res.status).toBe(200);
  });
});
