import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';
import { z } from 'zod';
import { errorFromReply, parseRetryAfter, request, http } from '@/api/http';
import { ApiError } from '@/api/api-error';

function reply(status: number, body: string, headers: Record<string, string> = {}): Response {
  return new Response(body === '' ? null : body, { status, headers });
}

describe('errorFromReply', () => {
  it('turns the error envelope into an ApiError with code, message and details', () => {
    const body = JSON.stringify({
      error: {
        code: 'validation_failed',
        message: 'email: Invalid email address',
        details: { issues: [{ path: ['body', 'email'], message: 'Invalid email address' }] },
      },
    });
    const error = errorFromReply(400, null, body);
    expect(error).toBeInstanceOf(ApiError);
    expect(error.status).toBe(400);
    expect(error.code).toBe('validation_failed');
    expect(error.message).toBe('email: Invalid email address');
    expect(error.details.issues).toEqual([{ path: ['body', 'email'], message: 'Invalid email address' }]);
  });

  it('adds the Retry-After wait to a rate_limited error', () => {
    const body = JSON.stringify({ error: { code: 'rate_limited', message: 'Too many sign-in attempts.' } });
    const error = errorFromReply(429, '42', body);
    expect(error.code).toBe('rate_limited');
    expect(error.details.retryAfterSeconds).toBe(42);
  });

  it('keeps a wait the server already put in details', () => {
    const body = JSON.stringify({
      error: { code: 'rate_limited', message: 'Slow down.', details: { retryAfterSeconds: 7 } },
    });
    expect(errorFromReply(429, '42', body).details.retryAfterSeconds).toBe(7);
  });

  it('reports a non-JSON 502 page as unexpected_reply with words about the server', () => {
    const error = errorFromReply(502, null, '<html><body>Bad Gateway</body></html>');
    expect(error.status).toBe(502);
    expect(error.code).toBe('unexpected_reply');
    expect(error.message).toMatch(/not answering properly.*502/);
  });

  it('does not trust JSON that is not the envelope (unknown code)', () => {
    const error = errorFromReply(500, null, JSON.stringify({ error: { code: 'kaboom', message: 'x' } }));
    expect(error.code).toBe('unexpected_reply');
    expect(error.message).toContain('500');
  });

  it('handles an empty body', () => {
    const error = errorFromReply(404, null, '');
    expect(error.code).toBe('unexpected_reply');
    expect(error.message).toContain('404');
  });
});

describe('parseRetryAfter', () => {
  it('reads delta-seconds', () => expect(parseRetryAfter('120')).toBe(120));
  it('reads an HTTP date relative to now', () => {
    const now = Date.parse('2025-03-01T10:00:00Z');
    expect(parseRetryAfter('Sat, 01 Mar 2025 10:00:30 GMT', now)).toBe(30);
  });
  it('gives undefined for junk or absence', () => {
    expect(parseRetryAfter('soon')).toBeUndefined();
    expect(parseRetryAfter(null)).toBeUndefined();
  });
});

describe('request', () => {
  const fetchMock = vi.fn<typeof fetch>();
  beforeEach(() => {
    fetchMock.mockReset();
    vi.stubGlobal('fetch', fetchMock);
  });
  afterEach(() => vi.unstubAllGlobals());

  it('sends JSON same-origin under /api/v1 and parses the reply with the schema', async () => {
    fetchMock.mockResolvedValueOnce(
      reply(200, JSON.stringify({ n: 3, extra: true }), { 'Content-Type': 'application/json' }),
    );
    const result = await http.post('/things', { a: 1 }, { schema: z.object({ n: z.number() }) });
    expect(result).toEqual({ n: 3 });
    const [url, init] = fetchMock.mock.calls[0]!;
    expect(url).toBe('/api/v1/things');
    expect(init?.method).toBe('POST');
    expect(init?.credentials).toBe('same-origin');
    expect(init?.body).toBe('{"a":1}');
    expect((init?.headers as Record<string, string>)['Content-Type']).toBe('application/json');
  });

  it('adds defined query parameters only', async () => {
    fetchMock.mockResolvedValueOnce(reply(200, '{}'));
    await request('GET', '/admin/audit-log', { query: { limit: 100, before: undefined } });
    expect(fetchMock.mock.calls[0]![0]).toBe('/api/v1/admin/audit-log?limit=100');
  });

  it('resolves undefined for a 204 without a schema', async () => {
    fetchMock.mockResolvedValueOnce(reply(204, ''));
    await expect(http.delete('/session')).resolves.toBeUndefined();
  });

  it('rejects with the envelope as ApiError', async () => {
    fetchMock.mockResolvedValueOnce(
      reply(401, JSON.stringify({ error: { code: 'invalid_credentials', message: 'E-mail or password is wrong.' } })),
    );
    await expect(http.post('/session', {})).rejects.toMatchObject({
      status: 401,
      code: 'invalid_credentials',
      message: 'E-mail or password is wrong.',
    });
  });

  it('reads Retry-After from the response headers', async () => {
    fetchMock.mockResolvedValueOnce(
      reply(429, JSON.stringify({ error: { code: 'rate_limited', message: 'Too many attempts.' } }), {
        'Retry-After': '90',
      }),
    );
    await expect(http.post('/session', {})).rejects.toMatchObject({
      code: 'rate_limited',
      details: { retryAfterSeconds: 90 },
    });
  });

  it('turns a network failure into ApiError status 0', async () => {
    fetchMock.mockRejectedValueOnce(new TypeError('Failed to fetch'));
    const error = await http.get('/session').catch((e: unknown) => e);
    expect(error).toBeInstanceOf(ApiError);
    expect(error).toMatchObject({ status: 0, code: 'network_error' });
    expect((error as ApiError).message).toMatch(/Cannot reach the server/);
  });

  it('turns a 502 HTML page into ApiError', async () => {
    fetchMock.mockResolvedValueOnce(reply(502, '<h1>Bad Gateway</h1>', { 'Content-Type': 'text/html' }));
    await expect(http.get('/session')).rejects.toMatchObject({ status: 502, code: 'unexpected_reply' });
  });

  it('rejects a 200 reply that is not JSON', async () => {
    fetchMock.mockResolvedValueOnce(reply(200, '<!doctype html><title>app</title>'));
    await expect(http.get('/session', { schema: z.object({}) })).rejects.toMatchObject({
      code: 'unexpected_reply',
      message: expect.stringMatching(/not JSON/),
    });
  });

  it('rejects a reply of the wrong shape, naming where', async () => {
    fetchMock.mockResolvedValueOnce(reply(200, JSON.stringify({ user: 5 })));
    const error = (await http
      .get('/session', { schema: z.object({ user: z.string() }) })
      .catch((e: unknown) => e)) as ApiError;
    expect(error.code).toBe('unexpected_reply');
    expect(error.message).toContain('user');
  });
});
