import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { balanceResultSchema } from '@shared/schemas/balance';
import { balanceBatchResultSchema } from '@shared/schemas/balance-batch';
import { startTestApp, type TestApp } from './helpers';

let t: TestApp;
beforeAll(async () => {
  t = await startTestApp({ config: { calc: { requestsPerMinute: 40 } } });
});
afterAll(async () => t?.close());

const coefficients = (body: { terms: { coefficient: string }[] }) => body.terms.map((x) => x.coefficient);

describe('POST /api/v1/balance', () => {
  it('balances methane combustion as 1, 2, 1, 2 without signing in', async () => {
    // CH4 + 2 O2 → CO2 + 2 H2O: the textbook combustion of methane (e.g. Atkins, Physical Chemistry; from memory).
    const res = await request(t.url).post('/api/v1/balance').send({ equation: 'CH4(g) + O2(g) -> CO2(g) + H2O(l)' });
    expect(res.status).toBe(200);
    const body = balanceResultSchema.parse(res.body);
    expect(body.status).toBe('balanced');
    expect(coefficients(body)).toEqual(['1', '2', '1', '2']);
    expect(body.terms.map((x) => x.phase)).toEqual(['g', 'g', 'g', 'l']);
  });

  it('gives exact fractions when a term is normalised to 1', async () => {
    // H2 + 1/2 O2 → H2O, the formation reaction of water as formation tables write it (common practice, no source).
    const res = await request(t.url).post('/api/v1/balance').send({ equation: 'H2 + O2 -> H2O', normaliseTo: 2 });
    expect(res.status).toBe(200);
    expect(coefficients(res.body)).toEqual(['1', '1/2', '1']);
  });

  it('answers unreadable text with 400 parse_error carrying line, column and what was expected', async () => {
    const res = await request(t.url).post('/api/v1/balance').send({ equation: 'CH4 + O2 => => CO2' });
    expect(res.status).toBe(400);
    expect(res.body.error.code).toBe('parse_error');
    expect(res.body.error.details).toMatchObject({ line: 1, column: 11, offset: 10, excerpt: 'CH4 + O2 => => CO2' });
    expect(res.body.error.details.expected.length).toBeGreaterThan(0);
  });

  it('answers a term index out of range with 400 naming body.fixed.<index>', async () => {
    const res = await request(t.url)
      .post('/api/v1/balance')
      .send({ equation: 'CH4 + O2 -> CO2 + H2O', fixed: { '9': '1' } });
    expect(res.status).toBe(400);
    expect(res.body.error.code).toBe('validation_failed');
    expect(res.body.error.details.issues[0].path).toEqual(['body', 'fixed', '9']);
  });

  it('rejects a missing equation with 400 naming body.equation', async () => {
    const res = await request(t.url).post('/api/v1/balance').send({});
    expect(res.status).toBe(400);
    expect(res.body.error.message).toMatch(/body\.equation/);
  });
});

describe('POST /api/v1/balance/batch', () => {
  it('balances each line, reporting a bad line by its own number without failing the rest', async () => {
    const text = 'H2 + O2 -> H2O\n\n# iron rusting\nNa + Cl2 -> \nFe + O2 -> Fe2O3';
    const res = await request(t.url).post('/api/v1/balance/batch').send({ text });
    expect(res.status).toBe(200);
    const { results } = balanceBatchResultSchema.parse(res.body);
    expect(results.map((r) => r.line)).toEqual([1, 4, 5]);
    const [water, bad, rust] = results;
    // 2 H2 + O2 → 2 H2O and 4 Fe + 3 O2 → 2 Fe2O3 (standard textbook balances; from memory).
    expect(water && 'result' in water && coefficients(water.result)).toEqual(['2', '1', '2']);
    expect(bad && 'error' in bad && bad.error.details.line).toBe(4);
    expect(rust && 'result' in rust && coefficients(rust.result)).toEqual(['4', '3', '2']);
  });
});

describe('calculation rate limit', () => {
  it('answers 429 with Retry-After once an address passes its per-minute allowance', async () => {
    t.app.locals.deps.limits.reset();
    const statuses: number[] = [];
    for (let i = 0; i < 40; i++)
      statuses.push((await request(t.url).post('/api/v1/balance').send({ equation: 'H2 + O2 -> H2O' })).status);
    expect(statuses.every((s) => s === 200)).toBe(true);
    const last = await request(t.url).post('/api/v1/balance').send({ equation: 'H2 + O2 -> H2O' });
    expect(last.status).toBe(429);
    expect(last.body.error.code).toBe('rate_limited');
    expect(Number(last.headers['retry-after'])).toBeGreaterThan(0);
    expect(Number(last.headers['retry-after'])).toBeLessThanOrEqual(60);
  });
});
