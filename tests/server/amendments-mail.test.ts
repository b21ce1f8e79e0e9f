import { sql } from 'drizzle-orm';
import type TestAgent from 'supertest/lib/agent';
import { afterAll, beforeAll, describe, expect, it, vi } from 'vitest';
import { sendDailyDigests } from '../../server/services/notifications.service';
import { demoUsers, lastMailTo, linkIn, startTestApp, type TestApp } from './helpers';
import { proposeOpen } from './amendment-helpers';

// Every test drives several requests (acceptances plan and write whole revisions): room for a loaded machine.
vi.setConfig({ testTimeout: 120_000 });

/** E-mail about amendments, delivered through the fake SMTP server and read back from it. */
let t: TestApp;
let member: TestAgent;
let curator: TestAgent;

beforeAll(async () => {
  t = await startTestApp();
  await t.db.execute(sql`update users set site_roles = '{site_admin,curator}' where id = ${t.ids.users.site_admin}`);
  [member, curator] = await Promise.all([t.signIn('member'), t.signIn('curator')]);
}, 180_000);
afterAll(async () => t?.close());

let n = 0;
const entry = () => {
  n++;
  return {
    kind: 'revise-value',
    species: 'CO2(g)',
    deltaFH: { value: -393.4, uncertainty: 0.2 },
    source: { citation: `Mail test source ${n}`, key: `mail-test-${n}` },
    select: false,
  };
};

describe('amendment e-mail', () => {
  it('tells the curators (not the author) when an amendment is opened, with a link to it', async () => {
    t.mail.clear();
    const id = await proposeOpen(t, [entry()], { author: member, title: 'Mail: opened' });
    await t.settle();
    for (const who of [demoUsers.curator, demoUsers.site_admin]) {
      const mail = lastMailTo(t.mail, who);
      expect(mail.subject).toBe('Amendment to review: Mail: opened');
      expect(linkIn(mail.text, t.config.publicUrl)).toBe(`${t.config.publicUrl}/amendments/${id}`);
    }
    expect(t.mail.list().filter((m) => m.to.includes(demoUsers.member))).toHaveLength(0);
  });

  it('tells the author of comments and decisions, quoting the reason', async () => {
    const id = await proposeOpen(t, [entry()], { author: member, title: 'Mail: decisions' });
    await t.settle();
    t.mail.clear();
    await curator.post(`/api/v1/amendments/${id}/comments`).send({ body: 'Which table?' });
    await t.settle();
    const comment = lastMailTo(t.mail, demoUsers.member);
    expect(comment.subject).toBe('New comment on your amendment: Mail: decisions');
    expect(comment.text).toContain('> Which table?');
    expect(comment.text).toContain(`${t.config.publicUrl}/amendments/${id}`);

    await curator.post(`/api/v1/amendments/${id}/return`).send({ reason: 'Please cite table 3.' });
    await t.settle();
    const returned = lastMailTo(t.mail, demoUsers.member);
    expect(returned.subject).toBe('Your amendment was returned: Mail: decisions');
    expect(returned.text).toContain('> Please cite table 3.');

    await member.post(`/api/v1/amendments/${id}/open`).send({});
    await curator.post(`/api/v1/amendments/${id}/accept`).send({});
    await t.settle();
    const accepted = lastMailTo(t.mail, demoUsers.member);
    expect(accepted.subject).toBe('Your amendment was accepted: Mail: decisions');
    expect(accepted.text).toMatch(/library revision \d+/);
    // The author's own comment tells nobody of their own words.
    t.mail.clear();
    await member.post(`/api/v1/amendments/${id}/comments`).send({ body: 'Thanks.' });
    await t.settle();
    expect(t.mail.list().filter((m) => m.to.includes(demoUsers.member))).toHaveLength(0);
  });

  it('keeps each user’s choice per kind: daily news waits for the digest, never sends nothing', async () => {
    const settings = await member.get('/api/v1/account/notifications');
    expect(settings.body.settings).toEqual({
      'amendment-opened': 'immediate',
      'amendment-comment': 'immediate',
      'amendment-decision': 'immediate',
    });
    const changed = await member
      .patch('/api/v1/account/notifications')
      .send({ settings: { 'amendment-decision': 'daily', 'amendment-comment': 'never' } });
    expect(changed.status).toBe(200);
    expect(changed.body.settings).toEqual({
      'amendment-opened': 'immediate',
      'amendment-comment': 'never',
      'amendment-decision': 'daily',
    });
    const bad = await member
      .patch('/api/v1/account/notifications')
      .send({ settings: { 'amendment-decision': 'hourly' } });
    expect(bad.status).toBe(400);

    const id = await proposeOpen(t, [entry()], { author: member, title: 'Mail: digest' });
    await t.settle();
    t.mail.clear();
    await curator.post(`/api/v1/amendments/${id}/comments`).send({ body: 'Never mailed.' });
    await curator.post(`/api/v1/amendments/${id}/decline`).send({ reason: 'Duplicate of another amendment.' });
    await t.settle();
    expect(t.mail.list().filter((m) => m.to.includes(demoUsers.member))).toHaveLength(0);

    const first = await sendDailyDigests(t.app.locals.deps);
    expect(first.sent).toBeGreaterThanOrEqual(1);
    const digest = lastMailTo(t.mail, demoUsers.member);
    expect(digest.subject).toBe('Thermoledger: 1 amendment update');
    expect(digest.text).toContain('declined your amendment “Mail: digest”');
    expect(digest.text).toContain(`${t.config.publicUrl}/amendments/${id}`);
    expect(digest.text).not.toContain('Never mailed');
    // Sent once: a second run finds nothing waiting for this user.
    t.mail.clear();
    await sendDailyDigests(t.app.locals.deps);
    expect(t.mail.list().filter((m) => m.to.includes(demoUsers.member))).toHaveLength(0);
  });

  it('keeps the change when the mail server fails, and retries the digest on the next run', async () => {
    const id = await proposeOpen(t, [entry()], { author: member, title: 'Mail: failing server' });
    await t.settle();
    t.mailer.mode = 'fail';
    const declined = await curator.post(`/api/v1/amendments/${id}/decline`).send({ reason: 'Mail fails.' });
    expect(declined.status).toBe(200);
    // The decline's news is queued after the reply: wait for it (a slow database server may lag).
    await t.settle();
    const failing = await sendDailyDigests(t.app.locals.deps);
    expect(failing.failed).toBeGreaterThanOrEqual(1);
    t.mailer.mode = 'deliver';
    t.mail.clear();
    await sendDailyDigests(t.app.locals.deps);
    expect(lastMailTo(t.mail, demoUsers.member).text).toContain('Mail: failing server');
  });
});
