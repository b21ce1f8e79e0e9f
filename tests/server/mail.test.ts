import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { startFakeSmtp, type FakeSmtp } from '../../server/mail/fake-smtp';
import { createMailer } from '../../server/mail/mailer';
import { parseMessage } from '../../server/mail/parse-message';

describe('parseMessage', () => {
  it('decodes quoted-printable soft breaks and UTF-8 bytes (RFC 2045 §6.7)', () => {
    const raw =
      'Subject: =?UTF-8?Q?R=C3=A9sum=C3=A9?=\r\nContent-Transfer-Encoding: quoted-printable\r\n\r\nhttp://x.example/a=\r\nbc?t=3D1 caf=C3=A9\r\n';
    expect(parseMessage(raw)).toMatchObject({ subject: 'Résumé', text: 'http://x.example/abc?t=1 café' });
  });

  it('decodes base64 bodies and B-encoded subjects (RFC 2047)', () => {
    const raw = `Subject: =?UTF-8?B?${Buffer.from('ΔfH° check').toString('base64')}?=\nContent-Transfer-Encoding: base64\n\n${Buffer.from('ΔrH = −802 kJ/mol').toString('base64')}\n`;
    expect(parseMessage(raw)).toMatchObject({ subject: 'ΔfH° check', text: 'ΔrH = −802 kJ/mol' });
  });
});

describe('fake SMTP server with nodemailer', () => {
  let smtp: FakeSmtp;
  beforeAll(async () => {
    smtp = await startFakeSmtp({ port: 0, limit: 3 });
  });
  afterAll(async () => smtp?.close());

  it('captures what nodemailer sends, long links intact, keeping only the last messages', async () => {
    const mailer = createMailer(
      { host: smtp.host, port: smtp.port, secure: false, from: 'TL <no-reply@tl.test>' },
      smtp,
    );
    const link = `http://localhost:3000/reset-password?token=${'A1b2_C3d4-'.repeat(12)}`;
    await mailer.send({ to: 'ana@example.org', subject: 'Réinitialiser — test', text: `Open:\n${link}\nBye ✓` });
    const [message] = smtp.list();
    expect(message).toMatchObject({
      from: 'no-reply@tl.test',
      to: ['ana@example.org'],
      subject: 'Réinitialiser — test',
    });
    expect(message!.text.split('\n')).toContain(link);
    expect(message!.text).toContain('Bye ✓');
    for (let i = 0; i < 4; i++) await mailer.send({ to: `n${i}@example.org`, subject: `n${i}`, text: 'x' });
    expect(smtp.list().map((m) => m.subject)).toEqual(['n1', 'n2', 'n3']);
  });
});
