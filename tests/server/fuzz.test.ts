// Property-based fuzzing of every JSON endpoint over real HTTP: random and hostile parameters,
// query strings and bodies (schema-shaped objects with hostile values, arbitrary JSON, broken
// JSON, equation-like text for the calculation endpoints). Whatever comes in, the server must
// answer in words with a 4xx (or 2xx), never a 5xx other than the calculation time budget's own
// 503, and never a reply larger than the configured reply limit.
//
// FUZZ_CASES sets the total number of cases (default 10,000, split across the routes); `npm run
// fuzz` runs 100,000 for a longer search. FUZZ_TIMES=1 prints the time spent on each route.
import fc from 'fast-check';
import { z } from 'zod';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { routeKey, type AnyRoute } from '../../server/routes/registry';
import { startTestApp, type TestApp } from './helpers';

const TOTAL_CASES = Number(process.env['FUZZ_CASES'] ?? 10_000);

// Routes that check a password with argon2 (slow on purpose) get fewer cases: their limits are tested elsewhere.
const SLOW_ROUTES = new Set(['POST /api/v1/session', 'POST /api/v1/account/password']);
const SLOW_SHARE = 0.005;

let t: TestApp;
let siteAdminToken: string;
let teamAdminToken: string;
beforeAll(async () => {
  t = await startTestApp({
    config: {
      // The request and line rates are raised so the fuzz reaches the handlers; the work limits stay at their defaults.
      calc: { requestsPerMinute: 10_000_000, linesPerMinute: 10_000_000 },
      signIn: { maxFailuresPerAccount: 2, maxFailuresPerAddress: 3 },
    },
  });
  siteAdminToken = await t.tokenFor('site_admin');
  teamAdminToken = await t.tokenFor('team_admin');
});
afterAll(async () => t?.close());

// Text a person or an attacker might send: control characters, odd Unicode, very long runs.
const hostileString = fc.oneof(
  fc.string({ unit: 'binary', maxLength: 40 }),
  fc.string({ unit: 'grapheme', maxLength: 40 }),
  fc.constantFrom(
    '',
    ' ',
    '\u0000',
    'a\u0000b',
    '\r\n',
    '\u001b[0m',
    '\ud800',
    '🧪',
    '../../etc/passwd',
    "' or 1=1 --",
  ),
  // Just past the limits of equations (10,000) and note bodies (20,000), and random lengths below.
  fc.constantFrom(10_001, 20_001).map((n) => 'x'.repeat(n)),
  fc.nat({ max: 500 }).map((n) => 'x'.repeat(n)),
  fc.constantFrom('2026-01-01T00:00:00Z', 'not-a-date', 'a@b.example', 'tl_' + 'A'.repeat(43)),
);
const hostileNumber = fc.oneof(
  fc.integer(),
  fc.double({ noNaN: true, noDefaultInfinity: true }),
  fc.constantFrom(0, -1, 1e308, -1e308, 2 ** 53 + 1, 1e-320),
);
const leaf = fc.oneof(hostileString, hostileNumber, fc.boolean(), fc.constant(null));
const hostileValue = fc.oneof(
  { weight: 4, arbitrary: leaf },
  { weight: 1, arbitrary: fc.array(leaf, { maxLength: 5 }) },
  { weight: 1, arbitrary: fc.dictionary(fc.string({ maxLength: 8 }), leaf, { maxKeys: 4 }) },
  { weight: 1, arbitrary: fc.jsonValue({ maxDepth: 4 }) },
);

// Pieces of the equation language, so the calculation endpoints are fuzzed past the JSON layer.
const equationPiece = fc.constantFrom(
  'H2',
  'O2',
  'H2O',
  'CH4',
  'CO2',
  'Fe',
  'Fe2O3',
  'Fe^3+',
  'Cu^+',
  'SO4^2-',
  'e-',
  '[Fe(CN)6]^4-',
  'CuSO4·5H2O',
  '(aq)',
  '(g)',
  '(s)',
  '(l)',
  '(cr, graphite)',
  '(plasma)',
  ' + ',
  ' + ',
  ' -> ',
  ' = ',
  ' <=> ',
  '→',
  '2 ',
  '1/2 ',
  '0.5 ',
  '½',
  '0 ',
  '999999999999999999999 ',
  ', ΔH = -890.3 kJ',
  ', ΔH = 1e308 kJ',
  ' + 120 kJ',
  '#',
  '\n',
  '\r\n',
  '(',
  ')',
  '((((((((((',
  '))))))))))',
  '{2-}',
  '⁺',
  'Xx',
  'H' + '+H'.repeat(90),
);
const equationText = fc.array(equationPiece, { maxLength: 30 }).map((parts) => parts.join(''));

function bodyKeys(route: AnyRoute): string[] {
  const body = route.request?.body;
  return body instanceof z.ZodObject ? Object.keys(body.shape) : [];
}

/** Bodies for one route: its own field names with hostile values, anything JSON, or broken JSON. */
function bodyFor(route: AnyRoute): fc.Arbitrary<string | undefined> {
  if (route.method === 'get' || route.method === 'delete') return fc.constant(undefined);
  const keys = bodyKeys(route);
  const calc = route.rateLimit === 'calc';
  const fieldValue = calc
    ? fc.oneof({ weight: 3, arbitrary: equationText }, { weight: 1, arbitrary: hostileValue })
    : hostileValue;
  const shaped =
    keys.length > 0
      ? fc.record(Object.fromEntries(keys.map((k) => [k, fieldValue])), { requiredKeys: [] })
      : fc.dictionary(fc.string({ maxLength: 8 }), hostileValue, { maxKeys: 3 });
  const batchText = fc.array(equationText, { maxLength: 40 }).map((lines) => ({ text: lines.join('\n') }));
  return fc.oneof(
    { weight: 6, arbitrary: shaped.map((v) => JSON.stringify(v)) },
    { weight: calc ? 3 : 0, arbitrary: batchText.map((v) => JSON.stringify(v)) },
    { weight: 1, arbitrary: fc.jsonValue({ maxDepth: 3 }).map((v) => JSON.stringify(v)) },
    {
      weight: 1,
      arbitrary: fc.constantFrom('{', '{"a":', '[1,2', 'null', '"text"', '{"__proto__":{"x":1}}', '\u0000'),
    },
  );
}

/** A concrete path for a route: real ids, random uuids, or hostile text in each parameter. */
function pathFor(route: AnyRoute): fc.Arbitrary<string> {
  const names = [...route.path.matchAll(/:(\w+)/g)].map((m) => m[1]!);
  const param = (name: string) =>
    fc.oneof(
      fc.uuid(),
      fc.constant(name === 'teamId' ? t.ids.teams.kestrel : t.ids.users.member),
      hostileString.filter((s) => s.length > 0 && s.length < 2000),
    );
  return fc.tuple(...names.map(param)).map((values) => {
    let p = route.path;
    // A lone surrogate cannot be percent-encoded; it becomes U+FFFD on the wire anyway.
    names.forEach(
      (name, i) =>
        (p = p.replace(`:${name}`, encodeURIComponent(Buffer.from(values[i] as string, 'utf8').toString('utf8')))),
    );
    return p;
  });
}

const queryFor = fc.option(fc.dictionary(fc.string({ maxLength: 6 }), fc.string({ maxLength: 30 }), { maxKeys: 3 }), {
  nil: undefined,
});

function tokenFor(route: AnyRoute): string | undefined {
  if (route.access === 'public') return undefined;
  if (typeof route.access === 'object' && 'site' in route.access) return siteAdminToken;
  return teamAdminToken;
}

interface Sent {
  path: string;
  query: Record<string, string> | undefined;
  body: string | undefined;
}

async function send(route: AnyRoute, sent: Sent): Promise<{ status: number; text: string }> {
  const url = new URL(`${t.url}/api/v1${sent.path}`);
  for (const [k, v] of Object.entries(sent.query ?? {})) url.searchParams.set(k, v);
  const token = tokenFor(route);
  const res = await fetch(url, {
    method: route.method.toUpperCase(),
    headers: {
      ...(sent.body !== undefined ? { 'Content-Type': 'application/json' } : {}),
      ...(token ? { Authorization: `Bearer ${token}` } : {}),
    },
    body: sent.body,
  });
  return { status: res.status, text: await res.text() };
}

describe('fuzzing every JSON endpoint', () => {
  it(`answers ${TOTAL_CASES.toLocaleString('en')} hostile requests without a server error or an oversized reply`, async () => {
    const routes = t.app.locals.routes.filter((r) => !r.path.startsWith('/test/'));
    const fast = routes.filter((r) => !SLOW_ROUTES.has(routeKey(r)));
    const slowRuns = Math.max(5, Math.round(TOTAL_CASES * SLOW_SHARE));
    const fastRuns = Math.ceil((TOTAL_CASES - slowRuns * (routes.length - fast.length)) / fast.length);
    const maxReply = t.config.calc.limits.maxReplyBytes;
    let cases = 0;
    for (const route of routes) {
      const numRuns = SLOW_ROUTES.has(routeKey(route)) ? slowRuns : fastRuns;
      const started = performance.now();
      await fc.assert(
        fc.asyncProperty(fc.record({ path: pathFor(route), query: queryFor, body: bodyFor(route) }), async (sent) => {
          cases++;
          const { status, text } = await send(route, sent);
          const where = `${routeKey(route)} → ${status} ${text.slice(0, 300)}`;
          expect(Buffer.byteLength(text), where).toBeLessThanOrEqual(maxReply);
          if (status >= 500) {
            // The only 5xx allowed: the calculation time budget's own answer, in words.
            expect(status, where).toBe(503);
            expect(JSON.parse(text).error.details?.limit, where).toBe('timeBudgetMs');
          }
        }),
        { numRuns },
      );
      if (process.env['FUZZ_TIMES']) console.log(routeKey(route), numRuns, Math.round(performance.now() - started));
    }
    expect(cases).toBeGreaterThanOrEqual(TOTAL_CASES);
    // And the server is still there.
    expect((await fetch(`${t.url}/api/v1/health`)).status).toBe(200);
  }, 600_000);
});
