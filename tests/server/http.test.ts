import { mkdirSync, mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import request from 'supertest';
import { z } from 'zod';
import { afterAll, beforeAll, beforeEach, describe, expect, it } from 'vitest';
import { errorEnvelopeSchema } from '@shared/schemas/errors';
import { defineRoute, routeKey } from '../../server/routes/registry';
import { openTestDatabase, startTestApp, type TestApp } from './helpers';

// Registered only in this file: a route whose handler fails the way a bug would.
const failingRoute = defineRoute({
  method: 'get',
  path: '/test/broken',
  summary: 'Test-only route that throws',
  tags: ['test'],
  access: 'public',
  responses: { 200: z.object({}) },
  handler: () => {
    const rows: { title: string }[] = [];
    return { title: rows[0]!.title }; // TypeError: reading 'title' of undefined
  },
});

let t: TestApp;
beforeAll(async () => {
  t = await startTestApp({ extraRoutes: [failingRoute], captureLog: true });
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
    const big = JSON.stringify({ email: 'a@b.example', password: 'y'.repeat(1_100_000) });
    const res = await t.anon().post('/api/v1/session').set('Content-Type', 'application/json').send(big);
    expect(res.status).toBe(413);
    expect(res.body.error.code).toBe('payload_too_large');
    expect(res.body.error.message).toMatch(/limit is 1024 kB/);
  });

  it('accepts bodies well over the 100 kB default of express.json (the limit is 1 MB)', async () => {
    // 900 kB: over express.json's default of 100 kB, under our 1 MB. An unknown field is ignored.
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

  it('answers a real server error with 500, a request id and no stack; the log keeps the stack', async () => {
    const res = await t.anon().get('/api/v1/test/broken');
    expect(res.status).toBe(500);
    const requestId = res.headers['x-request-id'] as string;
    expect(requestId).toMatch(/^[0-9a-f-]{36}$/);
    expect(res.body).toEqual({
      error: {
        code: 'internal',
        message: `Something went wrong on our side. Quote request id ${requestId} when reporting it.`,
        details: { requestId },
      },
    });
    expect(res.text).not.toMatch(/TypeError|\.ts:\d+|at /);
    const logged = t.logLines().find((l) => l['requestId'] === requestId && l['err']);
    expect(logged).toBeDefined();
    expect(JSON.stringify(logged)).toMatch(/TypeError/);
    expect(JSON.stringify(logged)).toMatch(/http\.test\.ts/);
  });

  it('logs each request with its id, without query strings or invitation tokens', async () => {
    await t.anon().get('/api/v1/invitations/' + 's'.repeat(43) + '?token=secret-value');
    const line = t.logLines().find((l) => JSON.stringify(l).includes('/api/v1/invitations/'));
    expect(line).toBeDefined();
    expect(JSON.stringify(line)).not.toMatch(/s{43}|secret-value/);
    expect((line!['req'] as { id: string }).id).toMatch(/^[0-9a-f-]{36}$/);
  });
});

describe('security headers', () => {
  it('sets nosniff, referrer policy, frame denial, a Permissions-Policy and a CSP allowing inline styles only', async () => {
    const res = await t.anon().get('/api/v1/health');
    expect(res.headers['x-content-type-options']).toBe('nosniff');
    expect(res.headers['referrer-policy']).toBe('same-origin');
    expect(res.headers['x-frame-options']).toBe('DENY');
    expect(res.headers['cross-origin-opener-policy']).toBe('same-origin');
    expect(res.headers['permissions-policy']).toMatch(/camera=\(\)/);
    expect(res.headers['permissions-policy']).toMatch(/geolocation=\(\)/);
    const csp = res.headers['content-security-policy'] as string;
    expect(csp).toContain("default-src 'self'");
    expect(csp).toContain("style-src 'self' 'unsafe-inline'");
    expect(csp).toContain("script-src 'self'");
    expect(csp).toContain("frame-ancestors 'none'");
    expect(csp).not.toMatch(/script-src[^;]*unsafe-inline/);
    expect(res.headers['x-powered-by']).toBeUndefined();
  });

  it('sends HSTS for a year only when the request came over HTTPS through a trusted proxy', async () => {
    const plain = await t.anon().get('/api/v1/health').set('X-Forwarded-Proto', 'https');
    expect(plain.headers['strict-transport-security']).toBeUndefined(); // no proxy is trusted here
    const proxied = await startTestApp({ open: { ...t.open, close: async () => {} }, config: { trustProxy: 1 } });
    try {
      const https = await proxied.anon().get('/api/v1/health').set('X-Forwarded-Proto', 'https');
      const hsts = https.headers['strict-transport-security'] as string;
      expect(Number(/max-age=(\d+)/.exec(hsts)?.[1])).toBeGreaterThanOrEqual(31_536_000);
      const http = await proxied.anon().get('/api/v1/health').set('X-Forwarded-Proto', 'http');
      expect(http.headers['strict-transport-security']).toBeUndefined();
    } finally {
      await proxied.close();
    }
  });
});

describe('the address behind a trusted proxy', () => {
  it('takes the address the one trusted proxy saw, not what the client wrote in X-Forwarded-For', async () => {
    const proxied = await startTestApp({ open: { ...t.open, close: async () => {} }, config: { trustProxy: 1 } });
    try {
      await proxied
        .anon()
        .post('/api/v1/session')
        .set('X-Forwarded-For', '203.0.113.9, 198.51.100.7')
        .send({ email: 'spoof@kestrel.example', password: 'not the password' });
      const { auditLog } = await import('../../server/db/tables/index');
      const rows = await t.db.select().from(auditLog);
      const failed = rows.find((r) => r.actorEmail === 'spoof@kestrel.example');
      expect(failed?.ip).toBe('198.51.100.7');
    } finally {
      await proxied.close();
    }
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

  it('compares the scheme too: the same host and port over another scheme is another origin', async () => {
    const agent = await t.signIn('member');
    const otherScheme = t.url.replace('http://', 'https://');
    const res = await agent
      .post(`/api/v1/teams/${t.ids.teams.kestrel}/notes`)
      .set('Origin', otherScheme)
      .send({ title: 'forged over https', body: '' });
    expect(res.status).toBe(403);
    expect(res.body.error.code).toBe('csrf_rejected');
    const publicOtherScheme = await agent
      .post(`/api/v1/teams/${t.ids.teams.kestrel}/notes`)
      .set('Origin', t.config.publicUrl.replace('http://', 'https://'))
      .send({ title: 'forged', body: '' });
    expect(publicOtherScheme.status).toBe(403);
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

  it('answers 503 with database "down" when the database is gone', async () => {
    const open = await openTestDatabase();
    const orphan = await startTestApp({ open });
    try {
      await open.close(); // the database goes away under the running server
      const res = await request(orphan.url).get('/api/v1/health');
      expect(res.status).toBe(503);
      expect(res.body).toEqual({ status: 'degraded', database: 'down', version: 'test' });
    } finally {
      await orphan.close().catch(() => {}); // closing twice is expected to complain
    }
  });
});

describe('the built client', () => {
  it('serves the app shell with one caching policy whatever the URL, and hashed assets for a year', async () => {
    const dir = mkdtempSync(path.join(tmpdir(), 'tl-dist-'));
    mkdirSync(path.join(dir, 'assets'));
    writeFileSync(path.join(dir, 'index.html'), '<!doctype html><title>Thermoledger</title>');
    writeFileSync(path.join(dir, 'assets', 'index-3f9a1c.js'), 'console.log(1)');
    writeFileSync(path.join(dir, 'favicon.svg'), '<svg/>');
    const served = await startTestApp({ open: { ...t.open, close: async () => {} }, clientDir: dir });
    try {
      const shells = await Promise.all(['/', '/index.html', '/account'].map((p) => request(served.url).get(p)));
      for (const res of shells) {
        expect(res.status).toBe(200);
        expect(res.text).toContain('<title>Thermoledger</title>');
        expect(res.headers['cache-control']).toBe('no-cache');
      }
      const asset = await request(served.url).get('/assets/index-3f9a1c.js');
      expect(asset.headers['cache-control']).toBe('public, max-age=31536000, immutable');
      const icon = await request(served.url).get('/favicon.svg');
      expect(icon.headers['cache-control']).toBe('public, max-age=3600');
    } finally {
      await served.close();
      rmSync(dir, { recursive: true, force: true });
    }
  });
});
