import request from 'supertest';
import { afterAll, beforeAll, beforeEach, describe, expect, it } from 'vitest';
import { balanceBatchResultSchema } from '@shared/schemas/balance-batch';
import { balanceResultSchema } from '@shared/schemas/balance';
import { startTestApp, type TestApp } from './helpers';

/** `H + H + … + H -> H2` with `n` terms on the left: the probe's payload. */
const hydrogenChain = (n: number) => `${Array<string>(n).fill('H').join('+')}->H2`;

// 40 species: a fuel blend burnt in air with by-products (an invented stress case, not a real process).
const FORTY_SPECIES =
  'CH4 + C2H6 + C3H8 + C4H10 + C5H12 + C6H14 + C7H16 + C8H18 + C9H20 + C10H22 + C2H4 + C3H6 + C6H6 + C7H8 + CH3OH + C2H5OH + H2S + NH3 + O2 + N2 + C2H2 + C4H8 + CH2O + HCOOH + CH3CHO ' +
  '-> CO2 + H2O + SO2 + NO + NO2 + CO + N2O + SO3 + H2 + HNO3 + H2SO4 + HCN + NH4NO3 + CH3NO2 + C2N2';

let t: TestApp;
beforeAll(async () => {
  // The documented default limits; only the request rate is raised so the file's own traffic passes.
  t = await startTestApp({ config: { calc: { requestsPerMinute: 10_000 } } });
});
afterAll(async () => t?.close());
beforeEach(() => t.app.locals.deps.limits.reset());

const balance = (equation: string) => request(t.url).post('/api/v1/balance').send({ equation });
const batch = (text: string) => request(t.url).post('/api/v1/balance/batch').send({ text });

describe('work limits of POST /api/v1/balance', () => {
  it('balances a 40-species equation within the default limits', async () => {
    const res = await balance(FORTY_SPECIES);
    expect(res.status).toBe(200);
    expect(balanceResultSchema.parse(res.body).terms).toHaveLength(40);
  });

  it("answers the probe's 4,995-term equation with 413 naming the term limit and the count found", async () => {
    const res = await balance(hydrogenChain(4994));
    expect(res.status).toBe(413);
    expect(res.body.error.code).toBe('payload_too_large');
    expect(res.body.error.details).toMatchObject({ limit: expect.stringMatching(/term/i), max: 80, found: 4995 });
    expect(res.body.error.message).toMatch(/4,995 terms; the limit is 80/);
  });

  it('allows exactly the configured number of terms, and not one more', async () => {
    expect((await balance(hydrogenChain(79))).status).toBe(200); // 79 + H2 = 80 terms
    const over = await balance(hydrogenChain(80));
    expect(over.status).toBe(413);
    expect(over.body.error.details).toMatchObject({ max: 80, found: 81 });
  });
});

describe('work limits of POST /api/v1/balance/batch', () => {
  it('balances a 2,000-line batch in one request (and the line budget lets it through at once)', async () => {
    const text = Array.from({ length: 2000 }, (_, i) => (i % 2 ? 'CH4 + O2 -> CO2 + H2O' : 'H2 + O2 -> H2O')).join(
      '\n',
    );
    const res = await batch(text);
    expect(res.status).toBe(200);
    const { results } = balanceBatchResultSchema.parse(res.body);
    expect(results).toHaveLength(2000);
    expect(results.every((r) => 'result' in r)).toBe(true);
  });

  it('answers 2,001 equation lines with 413 naming the line limit; blank and comment lines do not count', async () => {
    const lines = Array<string>(2001).fill('H2 + O2 -> H2O');
    const res = await batch(lines.join('\n'));
    expect(res.status).toBe(413);
    expect(res.body.error.details).toEqual({ limit: 'batchLines', max: 2000, found: 2001 });
    const padded = await batch(['# plan', ...lines.slice(1), '', '   ', '# end'].join('\n'));
    expect(padded.status).toBe(200);
  });

  it('answers a batch over the byte limit with 413 before parsing, not the schema 400', async () => {
    const line = '# ' + 'x'.repeat(9000);
    const res = await batch(Array<string>(23).fill(line).join('\n')); // ≈ 207 kB of comments
    expect(res.status).toBe(413);
    expect(res.body.error.details).toMatchObject({ limit: 'batchBytes', max: 200_000 });
    expect(res.body.error.details.found).toBeGreaterThan(200_000);
  });

  it("answers the probe's one-line 11,000-term batch at once with 413 naming the line", async () => {
    const res = await batch(hydrogenChain(11_000));
    expect(res.status).toBe(413);
    expect(res.body.error.details).toMatchObject({ limit: 'equationLength', line: 1, found: 22_003 });
  });

  it('gives a line with too many terms its own error, naming the limit, and balances the other lines', async () => {
    const res = await batch(['H2 + O2 -> H2O', '', hydrogenChain(100)].join('\n'));
    expect(res.status).toBe(200);
    const { results } = balanceBatchResultSchema.parse(res.body);
    expect(results).toHaveLength(2);
    expect('result' in results[0]!).toBe(true);
    const over = results[1]!;
    expect(over.line).toBe(3);
    expect('error' in over && over.error.message).toMatch(/101 terms; the limit is 80/);
  });

  it('does not count charges as terms: an ion-heavy line well within the limit passes', async () => {
    // 30 terms with 28 '+' signs in charges: a lexical count would say 58+ terms.
    const ions = Array.from({ length: 14 }, () => 'Fe^3+ + Cu^+').join(' + ');
    const res = await batch(`${ions} -> Fe^2+ + Cu^2+`);
    expect(res.status).toBe(200);
  });
});

describe('the distinct-species limit', () => {
  it('counts species, not terms: a species written twice counts once', async () => {
    const narrow = await startTestApp({
      open: { ...t.open, close: async () => {} },
      config: { calc: { limits: { maxDistinctSpecies: 5 } } },
    });
    try {
      const post = (equation: string) => request(narrow.url).post('/api/v1/balance').send({ equation });
      // 6 terms, 5 species (H2O on both sides).
      expect((await post('CH4 + O2 + H2O -> CO2 + H2O + H2')).status).toBe(200);
      const six = await post('CH4 + O2 + N2 -> CO2 + H2O + NO2');
      expect(six.status).toBe(413);
      expect(six.body.error.details).toMatchObject({ limit: expect.stringMatching(/species/i), max: 5, found: 6 });
    } finally {
      await narrow.close();
    }
  });
});

describe('a calculation reply over the size limit', () => {
  it('is refused with 413 naming the reply limit', async () => {
    const small = await startTestApp({
      open: { ...t.open, close: async () => {} },
      config: { calc: { limits: { maxReplyBytes: 5_000 } } },
    });
    try {
      const res = await request(small.url)
        .post('/api/v1/balance/batch')
        .send({ text: Array<string>(50).fill('CH4 + O2 -> CO2 + H2O').join('\n') });
      expect(res.status).toBe(413);
      expect(res.body.error.details).toMatchObject({ limit: 'replyBytes', max: 5_000 });
    } finally {
      await small.close();
    }
  });
});

describe('the per-address line budget', () => {
  it('weighs a batch by its lines, refuses the batch that does not fit, and gives its lines back', async () => {
    const tight = await startTestApp({
      open: { ...t.open, close: async () => {} },
      config: { calc: { requestsPerMinute: 10_000, linesPerMinute: 3000 } },
    });
    try {
      const full = Array<string>(2000).fill('H2 + O2 -> H2O').join('\n');
      expect((await request(tight.url).post('/api/v1/balance/batch').send({ text: full })).status).toBe(200);
      const refused = await request(tight.url).post('/api/v1/balance/batch').send({ text: full });
      expect(refused.status).toBe(429);
      expect(refused.body.error.details).toMatchObject({ limit: 'linesPerMinute', max: 3000, found: 2000 });
      expect(Number(refused.headers['retry-after'])).toBeGreaterThan(0);
      // The refused batch's lines were given back: 1,000 remain for smaller work.
      const small = Array<string>(999).fill('H2 + O2 -> H2O').join('\n');
      expect((await request(tight.url).post('/api/v1/balance/batch').send({ text: small })).status).toBe(200);
      expect((await request(tight.url).post('/api/v1/balance').send({ equation: 'H2 + O2 -> H2O' })).status).toBe(200);
      expect((await request(tight.url).post('/api/v1/balance').send({ equation: 'H2 + O2 -> H2O' })).status).toBe(429);
    } finally {
      await tight.close();
    }
  });
});

describe('the time budget', () => {
  it('stops a calculation that runs past its budget with 503 in words and Retry-After', async () => {
    const hasty = await startTestApp({
      open: { ...t.open, close: async () => {} },
      config: { calc: { timeBudgetMs: 1 } },
    });
    try {
      const res = await request(hasty.url)
        .post('/api/v1/balance/batch')
        .send({ text: Array<string>(2000).fill('C57H110O6 + O2 -> CO2 + H2O').join('\n') });
      expect(res.status).toBe(503);
      expect(res.body.error.code).toBe('unavailable');
      expect(res.body.error.message).toMatch(/did not finish within its time budget/);
      expect(res.headers['retry-after']).toBeDefined();
    } finally {
      await hasty.close();
    }
  });
});

describe('a long calculation does not hold up other requests', () => {
  it('answers health checks and sign-in reads while a slow batch is still running', async () => {
    // Warm a worker first, so the batch below is computing (not loading) while health is asked.
    expect((await balance('H2 + O2 -> H2O')).status).toBe(200);
    const slow = Array.from({ length: 2000 }, (_, i) =>
      i % 3 === 0
        ? FORTY_SPECIES.split(' + ').slice(0, 12).join(' + ') + ' -> CO2 + H2O + SO2 + NO2'
        : 'C57H110O6 + O2 -> CO2 + H2O',
    ).join('\n');
    const order: string[] = [];
    const batchDone = batch(slow).then((res) => {
      order.push(`batch ${res.status}`);
      return res;
    });
    const calc = t.app.locals.deps.calc;
    while (calc.inFlight === 0) await new Promise((r) => setImmediate(r));
    for (let i = 0; i < 5; i++) {
      const health = await request(t.url).get('/api/v1/health');
      const session = await request(t.url).get('/api/v1/session');
      order.push(`health ${health.status}`, `session ${session.status}`);
    }
    const stillRunning = calc.inFlight > 0;
    await batchDone;
    // Every health and session reply came back while the batch was still being computed.
    expect(stillRunning).toBe(true);
    expect(order.at(-1)).toBe('batch 200');
    expect(order.slice(0, 10)).toEqual(Array.from({ length: 5 }, () => ['health 200', 'session 200']).flat());
  });

  it('survives a burst of parallel calculations: every answer is a result, a limit or the busy reply', async () => {
    const replies = await Promise.all(
      Array.from({ length: 60 }, (_, i) =>
        i % 4 === 0 ? batch(Array<string>(200).fill('Fe + O2 -> Fe2O3').join('\n')) : balance(FORTY_SPECIES),
      ),
    );
    for (const res of replies) expect([200, 503]).toContain(res.status);
    expect(replies.filter((r) => r.status === 200).length).toBeGreaterThan(0);
    expect((await request(t.url).get('/api/v1/health')).status).toBe(200);
  });
});

describe('work limits of POST /api/v1/calorimetry/*', () => {
  it('answers readings over the per-request limit with 413 before parsing, naming the limit and the count', async () => {
    const series = Array.from({ length: 7000 }, (_, i) => [i, 295]);
    const run = {
      mass: { value: 1, unit: 'g' },
      temperature: { series, unit: 'K', mixingTime: 10, method: 'dickinson' },
    };
    const res = await request(t.url)
      .post('/api/v1/calorimetry/bomb')
      .send({
        sample: { formula: 'C10H8', phase: 'cr' },
        energyEquivalent: { value: 1, unit: 'J/K' },
        runs: [run, run, run],
      });
    expect(res.status).toBe(413);
    expect(res.body.error.details).toEqual({ limit: 'seriesReadings', max: 20_000, found: 21_000 });
  });
});
