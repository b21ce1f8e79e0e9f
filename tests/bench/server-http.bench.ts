// Throughput of the API's hot paths over real HTTP on in-memory PGlite:
// a public balance call, a cookie-authenticated read, and a Bearer-token team read.
import { afterAll, bench, describe } from 'vitest';
import { DEMO_PASSWORD, demoUsers, startTestApp } from '../server/helpers';

const t = await startTestApp({ config: { calc: { requestsPerMinute: 10_000_000, linesPerMinute: 10_000_000 } } });
const signIn = await fetch(`${t.url}/api/v1/session`, {
  method: 'POST',
  headers: { 'Content-Type': 'application/json' },
  body: JSON.stringify({ email: demoUsers.member, password: DEMO_PASSWORD }),
});
const cookie = (signIn.headers.get('set-cookie') ?? '').split(';')[0]!;
const token = await t.tokenFor('member');
afterAll(async () => t.close());

describe('API over HTTP (in-memory PGlite)', () => {
  bench(
    'POST /api/v1/balance (esterification, public)',
    async () => {
      const res = await fetch(`${t.url}/api/v1/balance`, {
        method: 'POST',
        headers: { 'Content-Type': 'application/json' },
        body: JSON.stringify({ equation: 'C2H5OH(l) + CH3COOH(l) -> CH3COOC2H5(l) + H2O(l)' }),
      });
      if (res.status !== 200) throw new Error(`status ${res.status}`);
      await res.arrayBuffer();
    },
    { time: 3000 },
  );

  bench(
    'GET /api/v1/session (session cookie)',
    async () => {
      const res = await fetch(`${t.url}/api/v1/session`, { headers: { Cookie: cookie } });
      if (res.status !== 200) throw new Error(`status ${res.status}`);
      await res.arrayBuffer();
    },
    { time: 3000 },
  );

  bench(
    'GET /api/v1/teams/:teamId/notes (Bearer token, team check)',
    async () => {
      const res = await fetch(`${t.url}/api/v1/teams/${t.ids.teams.kestrel}/notes`, {
        headers: { Authorization: `Bearer ${token}` },
      });
      if (res.status !== 200) throw new Error(`status ${res.status}`);
      await res.arrayBuffer();
    },
    { time: 3000 },
  );
});
