import { afterAll, beforeAll, beforeEach, describe, expect, it } from 'vitest';
import { startTestApp, type TestApp } from './helpers';

let t: TestApp;
beforeAll(async () => {
  t = await startTestApp();
});
afterAll(async () => t?.close());
beforeEach(async () => t.reset());

describe('team notes', () => {
  it('lets a member add, edit and delete notes that viewers can read', async () => {
    const milo = await t.signIn('member');
    const base = `/api/v1/teams/${t.ids.teams.kestrel}/notes`;
    const created = await milo.post(base).send({ title: '  Condenser duty  ', body: 'Check the reflux load.' });
    expect(created.status).toBe(201);
    expect(created.body).toMatchObject({
      title: 'Condenser duty',
      authorName: 'Milo Member',
      teamId: t.ids.teams.kestrel,
    });

    const edited = await milo
      .patch(`${base}/${created.body.id}`)
      .send({ title: 'Condenser duty (rev. 2)', body: 'Reflux load checked.' });
    expect(edited.status).toBe(200);
    expect(Date.parse(edited.body.updatedAt)).toBeGreaterThanOrEqual(Date.parse(created.body.updatedAt));

    const vera = await t.signIn('viewer');
    const list = await vera.get(base);
    expect(list.body.notes[0].title).toBe('Condenser duty (rev. 2)');
    expect(list.body.notes.length).toBe(3); // two demo notes + this one

    expect((await milo.delete(`${base}/${created.body.id}`)).status).toBe(204);
    expect((await milo.delete(`${base}/${created.body.id}`)).status).toBe(404);
  });

  it("keeps teams apart: another team's note id is not found through this team", async () => {
    const lena = await t.signIn('other_team');
    const larchNotes = await lena.get(`/api/v1/teams/${t.ids.teams.larchmont}/notes`);
    expect(larchNotes.status).toBe(200);
    const larchNoteId = larchNotes.body.notes[0].id as string;

    const milo = await t.signIn('member');
    expect((await milo.get(`/api/v1/teams/${t.ids.teams.larchmont}/notes`)).status).toBe(403);
    const sneaky = await milo
      .patch(`/api/v1/teams/${t.ids.teams.kestrel}/notes/${larchNoteId}`)
      .send({ title: 'mine now', body: '' });
    expect(sneaky.status).toBe(404);
    const still = await lena.get(`/api/v1/teams/${t.ids.teams.larchmont}/notes`);
    expect(still.body.notes[0].title).not.toBe('mine now');
  });
});

describe('team members', () => {
  it('lists members with roles', async () => {
    const vera = await t.signIn('viewer');
    const res = await vera.get(`/api/v1/teams/${t.ids.teams.kestrel}/members`);
    expect(res.status).toBe(200);
    const roles = Object.fromEntries(res.body.members.map((m: { email: string; role: string }) => [m.email, m.role]));
    expect(roles).toEqual({
      'vera.viewer@kestrel.example': 'viewer',
      'milo.member@kestrel.example': 'member',
      'tara.admin@kestrel.example': 'team_admin',
      'cora.curator@kestrel.example': 'member',
    });
  });

  it('lets a team admin change roles and remove members, and audits it', async () => {
    const tara = await t.signIn('team_admin');
    const base = `/api/v1/teams/${t.ids.teams.kestrel}/members`;
    const promoted = await tara.patch(`${base}/${t.ids.users.viewer}`).send({ role: 'member' });
    expect(promoted.status).toBe(200);
    expect(promoted.body.role).toBe('member');
    expect((await tara.delete(`${base}/${t.ids.users.viewer}`)).status).toBe(204);
    const vera = await t.signIn('viewer');
    expect((await vera.get(base)).status).toBe(403);
    const admin = await t.signIn('site_admin');
    const actions = (await admin.get('/api/v1/admin/audit-log')).body.events.map((e: { action: string }) => e.action);
    expect(actions).toEqual(expect.arrayContaining(['member.role_changed', 'member.removed']));
  });

  it('refuses to demote or remove the last team admin (409)', async () => {
    const tara = await t.signIn('team_admin');
    const base = `/api/v1/teams/${t.ids.teams.kestrel}/members`;
    const demote = await tara.patch(`${base}/${t.ids.users.team_admin}`).send({ role: 'member' });
    expect(demote.status).toBe(409);
    expect(demote.body.error.message).toMatch(/at least one team admin/);
    expect((await tara.delete(`${base}/${t.ids.users.team_admin}`)).status).toBe(409);
    // With a second admin, the first may step down.
    await tara.patch(`${base}/${t.ids.users.member}`).send({ role: 'team_admin' });
    expect((await tara.patch(`${base}/${t.ids.users.team_admin}`).send({ role: 'member' })).status).toBe(200);
  });

  it('returns the team itself to any member', async () => {
    const vera = await t.signIn('viewer');
    const res = await vera.get(`/api/v1/teams/${t.ids.teams.kestrel}`);
    expect(res.body).toMatchObject({ id: t.ids.teams.kestrel, slug: 'kestrel-bay', name: 'Kestrel Bay Process Lab' });
  });
});
