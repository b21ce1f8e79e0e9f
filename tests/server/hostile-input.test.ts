import { brotliCompressSync, gzipSync } from 'node:zlib';
import type request from 'supertest';
import { afterAll, beforeAll, beforeEach, describe, expect, it } from 'vitest';
import { lastMailTo, linkIn, startTestApp, type TestApp } from './helpers';

let t: TestApp;
beforeAll(async () => {
  t = await startTestApp();
});
afterAll(async () => t?.close());
beforeEach(async () => t.reset());

const NUL = '\u0000';

async function invitationToken(email: string): Promise<string> {
  const admin = await t.signIn('team_admin');
  await admin.post(`/api/v1/teams/${t.ids.teams.kestrel}/invitations`).send({ email, role: 'viewer' });
  const link = linkIn(lastMailTo(t.mail, email).text, `${t.config.publicUrl}/invitations/`);
  return decodeURIComponent(link.slice(`${t.config.publicUrl}/invitations/`.length));
}

describe('control characters in text fields', () => {
  // Every free-text field of the API, with where it lives and how to send it.
  const fields: { name: string; path: string[]; send: (text: string) => Promise<request.Response> }[] = [
    {
      name: 'note title',
      path: ['body', 'title'],
      send: async (text) =>
        (await t.signIn('member')).post(`/api/v1/teams/${t.ids.teams.kestrel}/notes`).send({ title: text, body: 'x' }),
    },
    {
      name: 'note body',
      path: ['body', 'body'],
      send: async (text) =>
        (await t.signIn('member')).post(`/api/v1/teams/${t.ids.teams.kestrel}/notes`).send({ title: 'x', body: text }),
    },
    {
      name: 'display name',
      path: ['body', 'displayName'],
      send: async (text) => (await t.signIn('member')).patch('/api/v1/account').send({ displayName: text }),
    },
    {
      name: 'token name',
      path: ['body', 'name'],
      send: async (text) => (await t.signIn('member')).post('/api/v1/account/tokens').send({ name: text }),
    },
    {
      name: 'team name',
      path: ['body', 'name'],
      send: async (text) =>
        (await t.signIn('site_admin')).post('/api/v1/admin/teams').send({ name: text, adminEmail: 'x@y.example' }),
    },
    {
      name: 'invitation display name',
      path: ['body', 'displayName'],
      send: async (text) =>
        t
          .anon()
          .post(`/api/v1/invitations/${await invitationToken('ctrl@kestrel.example')}/accept`)
          .send({ displayName: text, password: 'a-long-new-password' }),
    },
  ];

  for (const field of fields) {
    it(`rejects a NUL byte in the ${field.name} with 400 naming ${field.path.join('.')}`, async () => {
      const res = await field.send(`Reflux${NUL}log`);
      expect(res.status).toBe(400);
      expect(res.body.error.code).toBe('validation_failed');
      expect(res.body.error.details.issues[0].path).toEqual(field.path);
      expect(res.body.error.message).toMatch(/U\+0000 at position 7/);
    });
  }

  it('rejects escape and DEL characters too, but keeps tabs and CRLF line breaks', async () => {
    const member = await t.signIn('member');
    const notes = `/api/v1/teams/${t.ids.teams.kestrel}/notes`;
    for (const bad of ['\u001b[31mred', 'a\u007fb', 'a\u0085b']) {
      expect((await member.post(notes).send({ title: 'x', body: bad })).status).toBe(400);
    }
    const body = 'Charge:\r\n\t4.0 kg acetic acid\r\n\t1.2 eq ethanol\n';
    const ok = await member.post(notes).send({ title: 'Batch\tsheet', body });
    expect(ok.status).toBe(201);
    expect(ok.body.body).toBe(body);
  });
});

describe('compressed request bodies', () => {
  const valid = JSON.stringify({ equation: 'H2 + O2 -> H2O' });
  // fetch sends the bytes exactly as given (supertest would re-encode a Buffer body).
  const post = async (encoding: string, body: Buffer | string) => {
    const res = await fetch(`${t.url}/api/v1/balance`, {
      method: 'POST',
      headers: { 'Content-Type': 'application/json', 'Content-Encoding': encoding },
      body: typeof body === 'string' ? body : new Blob([new Uint8Array(body)]),
    });
    return { status: res.status, body: (await res.json()) as { error?: { code: string; message: string } } };
  };

  it('reads a correct gzip body', async () => {
    expect((await post('gzip', gzipSync(valid))).status).toBe(200);
  });

  for (const encoding of ['gzip', 'deflate', 'br']) {
    it(`answers a corrupt ${encoding} body with 400 in words, not 500`, async () => {
      const res = await post(encoding, Buffer.from('this is not compressed at all, just bytes \u0001\u0002'));
      expect(res.status).toBe(400);
      expect(res.body.error?.code).toBe('bad_request');
      expect(res.body.error?.message).toMatch(/could not be decompressed/);
    });
  }

  it('answers a truncated brotli body with 400', async () => {
    const whole = brotliCompressSync(Buffer.from(valid.repeat(50)));
    expect((await post('br', whole.subarray(0, Math.floor(whole.length / 2)))).status).toBe(400);
  });

  it('answers an unknown Content-Encoding with 415', async () => {
    expect((await post('zstd-ish', valid)).status).toBe(415);
  });
});
