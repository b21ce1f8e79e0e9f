import { afterAll, beforeAll, beforeEach, describe, expect, it } from 'vitest';
import { demoUsers, lastMailTo, linkIn, startTestApp, type TestApp } from './helpers';

let t: TestApp;
beforeAll(async () => {
  t = await startTestApp();
});
afterAll(async () => t?.close());
beforeEach(async () => t.reset());

async function auditActions(): Promise<string[]> {
  const { auditLog } = await import('../../server/db/tables/index');
  return (await t.db.select({ action: auditLog.action }).from(auditLog)).map((r) => r.action);
}

describe('when the mail server refuses an invitation', () => {
  it('answers 503, makes no invitation, and keeps an earlier invitation to the same address working', async () => {
    const admin = await t.signIn('team_admin');
    const invitations = `/api/v1/teams/${t.ids.teams.kestrel}/invitations`;
    const first = await admin.post(invitations).send({ email: 'rina.new@kestrel.example', role: 'member' });
    expect(first.status).toBe(201);
    const link = linkIn(lastMailTo(t.mail, 'rina.new@kestrel.example').text, `${t.config.publicUrl}/invitations/`);
    const token = decodeURIComponent(link.slice(`${t.config.publicUrl}/invitations/`.length));

    t.mailer.mode = 'fail';
    const again = await admin.post(invitations).send({ email: 'rina.new@kestrel.example', role: 'viewer' });
    expect(again.status).toBe(503);
    expect(again.body.error).toMatchObject({ code: 'unavailable' });
    expect(again.body.error.message).toMatch(/could not be sent, so no invitation was made/);

    const list = (await admin.get(invitations)).body.invitations as { id: string; role: string }[];
    expect(list).toEqual([expect.objectContaining({ id: first.body.id, role: 'member' })]);
    expect((await t.anon().get(`/api/v1/invitations/${token}`)).status).toBe(200);
    const actions = await auditActions();
    expect(actions.filter((a) => a === 'invitation.created')).toHaveLength(1);
    expect(actions).toContain('invitation.mail_failed');
  });

  it('withdraws the earlier invitation only once the new one has gone out', async () => {
    const admin = await t.signIn('team_admin');
    const invitations = `/api/v1/teams/${t.ids.teams.kestrel}/invitations`;
    await admin.post(invitations).send({ email: 'omar.new@kestrel.example', role: 'member' });
    const second = await admin.post(invitations).send({ email: 'omar.new@kestrel.example', role: 'viewer' });
    expect(second.status).toBe(201);
    const list = (await admin.get(invitations)).body.invitations as { id: string }[];
    expect(list.map((i) => i.id)).toEqual([second.body.id]);
  });
});

describe('when the mail server refuses the first admin of a new team', () => {
  it('answers 503 and leaves no team behind', async () => {
    const admin = await t.signIn('site_admin');
    t.mailer.mode = 'fail';
    const res = await admin
      .post('/api/v1/admin/teams')
      .send({ name: 'Harrow Flats Kilo Lab', adminEmail: 'lead@harrow.example' });
    expect(res.status).toBe(503);
    expect(res.body.error.message).toMatch(/team was not created/);
    t.mailer.mode = 'deliver';
    const teams = (await admin.get('/api/v1/admin/teams')).body.teams as { name: string }[];
    expect(teams.map((x) => x.name)).not.toContain('Harrow Flats Kilo Lab');
    const actions = await auditActions();
    expect(actions).not.toContain('team.created');
    expect(actions).toContain('invitation.mail_failed');
    // The same name works once mail is back.
    const retry = await admin
      .post('/api/v1/admin/teams')
      .send({ name: 'Harrow Flats Kilo Lab', adminEmail: 'lead@harrow.example' });
    expect(retry.status).toBe(201);
    expect(retry.body.slug).toBe('harrow-flats-kilo-lab');
  });
});

describe('when the mail server refuses a password reset', () => {
  it('still answers 202, and takes back the link nobody received', async () => {
    t.mailer.mode = 'fail';
    const res = await t.anon().post('/api/v1/password-resets').send({ email: demoUsers.member });
    expect(res.status).toBe(202);
    await t.settle();
    const { passwordResets } = await import('../../server/db/tables/index');
    expect(await t.db.select().from(passwordResets)).toEqual([]);
    expect(await auditActions()).toEqual(
      expect.arrayContaining(['password_reset.requested', 'password_reset.mail_failed']),
    );
  });
});
