import request from 'supertest';
import { afterAll, beforeAll, beforeEach, describe, expect, it } from 'vitest';
import { errorEnvelopeSchema } from '@shared/schemas/errors';
import { routeKey } from '../../server/routes/registry';
import { startTestApp, type TestApp } from './helpers';

let t: TestApp;
beforeAll(async () => {
  t = await startTestApp();
});
afterAll(async () => t?.close());
beforeEach(async () => t.reset());

describe('error envelope', () => {
  it('answers an unknown API route with a JSON 404', async () => {
    const res = await t.anon().get('/api/v1/no-such-thing');
    expect(res.status).toBe(404);
    expect(res.headers['content-type']).toMatch(/application\/json/);
    expect(errorEnvelopeSchema.parse(res.body).error).toEqual({
      code: 'not_found',
      message: 'There is no API route GET /api/v1/no-such-thing.',
    });
  });

  it('answers malformed JSON with 400 bad_request', async () => {
    const res = await t
      .anon()
      .post('/api/v1/session')
      .set('Content-Type', 'application/json')
      .send('{"email": "a@b.example",');
    expect(res.status).toBe(400);
    expect(res.body.error.code).toBe('bad_request');
    expect(res.body.error.message).toMatch(/not valid JSON/);
  });

  it('answers a body over 1 MB with 413', async () => {
    const big = JSON.stringify({ title: 'x', body: 'y'.repeat(1_100_000) });
    const res = await t.anon().post('/api/v1/session').set('Content-Type', 'application/json').send(big);
    expect(res.status).toBe(413);
    expect(res.body.error.code).toBe('payload_too_large');
  });

  it('accepts a body just under the limit (the limit is 1 MB, not the 100 kB default)', async () => {
    const agent = await t.signIn('member');
    const res = await agent
      .post(`/api/v1/teams/${t.ids.teams.kestrel}/notes`)
      .send({ title: 'Long', body: 'z'.repeat(19_000) + ' '.repeat(0) });
    expect(res.status).toBe(201);
    const nearLimit = await t
      .anon()
      .post('/api/v1/password-resets')
      .send({ email: 'a@b.example', pad: 'p'.repeat(900_000) });
    expect(nearLimit.status).toBe(202);
  });

  it('answers a non-JSON body on a JSON route with 415', async () => {
    const res = await t.anon().post('/api/v1/session').set('Content-Type', 'text/plain').send('email=a@b.example');
    expect(res.status).toBe(415);
    expect(res.body.error.code).toBe('unsupported_media_type');
    const form = await t.anon().post('/api/v1/session').type('form').send({ email: 'a@b.example', password: 'x' });
    expect(form.status).toBe(415);
  });

  it('names the missing field in a 400', async () => {
    const agent = await t.signIn('member');
    const res = await agent.post(`/api/v1/teams/${t.ids.teams.kestrel}/notes`).send({ body: 'no title' });
    expect(res.status).toBe(400);
    expect(res.body.error).toMatchObject({ code: 'validation_failed', message: 'Check body.title: is required.' });
    expect(res.body.error.details.issues).toEqual([
      { path: ['body', 'title'], message: 'is required.', code: 'invalid_type' },
    ]);
  });

  it('reports a bad path parameter as a validation error on params', async () => {
    const agent = await t.signIn('member');
    const res = await agent
      .patch(`/api/v1/teams/${t.ids.teams.kestrel}/notes/not-a-uuid`)
      .send({ title: 'a', body: '' });
    expect(res.status).toBe(400);
    expect(res.body.error.details.issues[0].path).toEqual(['params', 'noteId']);
  });

  it('never sends a stack trace, and quotes a request id', async () => {
    const res = await t.anon().get('/api/v1/session');
    expect(res.headers['x-request-id']).toMatch(/^[0-9a-f-]{36}$/);
    expect(JSON.stringify(res.body)).not.toMatch(/at .*\.ts:\d+/);
  });
});

describe('security headers', () => {
  it('sets nosniff, referrer policy, frame denial and a CSP allowing inline styles only', async () => {
    const res = await t.anon().get('/api/v1/health');
    expect(res.headers['x-content-type-options']).toBe('nosniff');
    expect(res.headers['referrer-policy']).toBe('same-origin');
    expect(res.headers['x-frame-options']).toBe('DENY');
    const csp = res.headers['content-security-policy'] as string;
    expect(csp).toContain("default-src 'self'");
    expect(csp).toContain("style-src 'self' 'unsafe-inline'");
    expect(csp).toContain("script-src 'self'");
    expect(csp).not.toMatch(/script-src[^;]*unsafe-inline/);
    expect(res.headers['x-powered-by']).toBeUndefined();
  });
});

describe('CSRF guard', () => {
  it('rejects a cookie-authenticated write from a foreign Origin with 403 csrf_rejected', async () => {
    const agent = await t.signIn('member');
    const res = await agent
      .post(`/api/v1/teams/${t.ids.teams.kestrel}/notes`)
      .set('Origin', 'https://evil.example')
      .send({ title: 'forged', body: '' });
    expect(res.status).toBe(403);
    expect(res.body.error.code).toBe('csrf_rejected');
    const list = await agent.get(`/api/v1/teams/${t.ids.teams.kestrel}/notes`);
    expect(list.body.notes.map((n: { title: string }) => n.title)).not.toContain('forged');
  });

  it('rejects a cookie-authenticated write with neither Origin nor Sec-Fetch-Site', async () => {
    const agent = await t.signIn('member');
    const cookie = (agent as unknown as { jar: { getCookie(n: string, o: object): { toValueString(): string } } }).jar
      .getCookie('tl_session', { domain: '127.0.0.1', path: '/', secure: false, script: false })
      .toValueString();
    const res = await request(t.url)
      .post(`/api/v1/teams/${t.ids.teams.kestrel}/notes`)
      .set('Cookie', cookie)
      .send({ title: 'x', body: '' });
    expect(res.status).toBe(403);
    expect(res.body.error.code).toBe('csrf_rejected');
    const sameOrigin = await request(t.url)
      .post(`/api/v1/teams/${t.ids.teams.kestrel}/notes`)
      .set('Cookie', cookie)
      .set('Sec-Fetch-Site', 'same-origin')
      .send({ title: 'x', body: '' });
    expect(sameOrigin.status).toBe(201);
  });

  it('lets reads through whatever the Origin', async () => {
    const agent = await t.signIn('member');
    const res = await agent.get(`/api/v1/teams/${t.ids.teams.kestrel}/notes`).set('Origin', 'https://evil.example');
    expect(res.status).toBe(200);
  });

  it('exempts Bearer-token requests, which another site cannot forge', async () => {
    const token = await t.tokenFor('member');
    const res = await request(t.url)
      .post(`/api/v1/teams/${t.ids.teams.kestrel}/notes`)
      .set('Authorization', `Bearer ${token}`)
      .set('Origin', 'https://elsewhere.example')
      .send({ title: 'from a script', body: '' });
    expect(res.status).toBe(201);
  });

  it('accepts the configured public URL as an origin (behind a proxy the Host may differ)', async () => {
    const agent = await t.signIn('member');
    const res = await agent
      .post(`/api/v1/teams/${t.ids.teams.kestrel}/notes`)
      .set('Origin', t.config.publicUrl)
      .send({ title: 'ok', body: '' });
    expect(res.status).toBe(201);
  });
});

describe('roles', () => {
  it('refuses a viewer who tries to write a note with 403 naming the needed role', async () => {
    const agent = await t.signIn('viewer');
    const res = await agent.post(`/api/v1/teams/${t.ids.teams.kestrel}/notes`).send({ title: 'x', body: '' });
    expect(res.status).toBe(403);
    expect(res.body.error).toMatchObject({ code: 'forbidden', details: { required: 'member', held: 'viewer' } });
  });

  it('answers 401, not 400, to an anonymous request with a bad body on a protected route', async () => {
    const res = await t.anon().post(`/api/v1/teams/${t.ids.teams.kestrel}/notes`).send({ nonsense: true });
    expect(res.status).toBe(401);
  });
});

describe('GET /api/v1/openapi.json', () => {
  it('describes every route of the registry as OpenAPI 3.1', async () => {
    const res = await t.anon().get('/api/v1/openapi.json');
    expect(res.status).toBe(200);
    expect(res.body.openapi).toBe('3.1.0');
    const documented = new Set<string>();
    for (const [path, item] of Object.entries(res.body.paths as Record<string, Record<string, unknown>>)) {
      for (const method of Object.keys(item))
        documented.add(`${method.toUpperCase()} ${path.replace(/\{(\w+)\}/g, ':$1')}`);
    }
    const registered = t.app.locals.routes.map(routeKey);
    expect([...documented].sort()).toEqual([...registered].sort());
    expect(res.body.paths['/api/v1/teams/{teamId}/notes'].post['x-access']).toEqual({ team: 'member' });
    expect(res.body.paths['/api/v1/session'].post.requestBody.content['application/json'].schema.required).toEqual([
      'email',
      'password',
    ]);
  });
});

describe('GET /api/v1/health', () => {
  it('reports the server and database as ok', async () => {
    const res = await t.anon().get('/api/v1/health');
    expect(res.status).toBe(200);
    expect(res.body).toEqual({ status: 'ok', database: 'ok', version: 'test' });
  });
});
