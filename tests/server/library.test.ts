import { readFileSync } from 'node:fs';
import path from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { seedLibrary } from '../../server/library/seed-library';
import { startTestApp, type TestApp } from './helpers';
import { acceptEntries } from './amendment-helpers';

let t: TestApp;

beforeAll(async () => {
  t = await startTestApp();
  await seedLibrary(t.db);
});
afterAll(() => t.close());

/**
 * NASA-7 enthalpy H°(T)/(R T) = a1 + a2 T/2 + a3 T²/3 + a4 T³/4 + a5 T⁴/5 + a6/T (McBride, Gordon &
 * Reno, NASA TM-4513, 1993), written out here independently of the product's thermo core.
 */
function nasaEnthalpy(label: string, temperature: number): number {
  const file = path.resolve('seeds/source-data/nasa-tm4513/gas.jsonl');
  const line = readFileSync(file, 'utf8')
    .split('\n')
    .find((l) => l.startsWith(`{"name":"${label}",`));
  if (!line) throw new Error(`no NASA entry ${label}`);
  const entry = JSON.parse(line) as { ranges: number[]; coefficients: number[][] };
  const i = entry.ranges.findIndex((_, k) => temperature <= entry.ranges[k + 1]!);
  const a = entry.coefficients[Math.max(0, i)]!;
  const T = temperature;
  const h = a[0]! + (a[1]! * T) / 2 + (a[2]! * T ** 2) / 3 + (a[3]! * T ** 3) / 4 + (a[4]! * T ** 4) / 5 + a[5]! / T;
  return (h * 8.314462618 * T) / 1000;
}

async function speciesByKey(key: string) {
  const res = await t.anon().get('/api/v1/species').query({ q: key, limit: 50 });
  expect(res.status).toBe(200);
  const item = (res.body.items as { key: string; id: string }[]).find((i) => i.key === key);
  if (!item) throw new Error(`${key} not found`);
  return item;
}

describe('GET /api/v1/species', () => {
  it('finds CO2 typed in lower case, with its selected ΔfH° and source', async () => {
    const res = await t.anon().get('/api/v1/species').query({ q: 'co2' });
    expect(res.status).toBe(200);
    const co2 = res.body.items.find((i: { key: string }) => i.key === 'CO2(g)');
    // CODATA Key Values 1989: ΔfH°(CO2, g) = −393.51 ± 0.13 kJ/mol (from memory; u = 0.13/2 by the interval rule).
    expect(co2.deltaFH.value).toBeCloseTo(-393.51, 2);
    expect(co2.deltaFH.uncertainty).toBeCloseTo(0.065, 3);
    expect(co2.deltaFH.source).toBe('codata-1989');
    expect(res.body.libraryRevision).toBeGreaterThanOrEqual(1);
  });

  it('filters by phase and element, and pages with a total', async () => {
    const res = await t.anon().get('/api/v1/species').query({ phase: 'aq', element: 'Cl', limit: 5 });
    expect(res.status).toBe(200);
    expect(res.body.items.length).toBeLessThanOrEqual(5);
    expect(res.body.total).toBeGreaterThanOrEqual(res.body.items.length);
    for (const item of res.body.items) {
      expect(item.phase).toBe('aq');
      expect(item.hill).toContain('Cl');
    }
  });

  it('holds at least 1,000 species, 150 of them with a stated uncertainty', async () => {
    const all = await t.anon().get('/api/v1/species').query({ limit: 1 });
    expect(all.body.total).toBeGreaterThanOrEqual(1000);
    let withUncertainty = 0;
    for (let offset = 0; offset < all.body.total; offset += 200) {
      const page = await t.anon().get('/api/v1/species').query({ limit: 200, offset, hasValue: 'true' });
      withUncertainty += page.body.items.filter(
        (i: { deltaFH: { uncertainty: number | null } }) => i.deltaFH.uncertainty !== null,
      ).length;
    }
    expect(withUncertainty).toBeGreaterThanOrEqual(150);
  });

  it('refuses a bad phase or element list with 400 naming the field', async () => {
    const res = await t.anon().get('/api/v1/species').query({ element: 'c,o' });
    expect(res.status).toBe(400);
    expect(JSON.stringify(res.body.error.details)).toContain('element');
  });
});

describe('GET /api/v1/species/:speciesId', () => {
  it('shows every value of water vapour with its provenance, the selected one and the history', async () => {
    const h2o = await speciesByKey('H2O(g)');
    const res = await t.anon().get(`/api/v1/species/${h2o.id}`);
    expect(res.status).toBe(200);
    const dfH = res.body.values.filter((v: { property: string }) => v.property === 'dfH298');
    expect(dfH.length).toBeGreaterThanOrEqual(2);
    expect(dfH.filter((v: { selected: boolean }) => v.selected)).toHaveLength(1);
    const nasa = dfH.find((v: { source: { key: string } }) => v.source.key === 'nasa-tm4513');
    // Re-derived from the NASA TM-4513 file itself (H2O polynomial at 298.15 K).
    expect(nasa.value).toBeCloseTo(nasaEnthalpy('H2O', 298.15), 2);
    expect(nasa.provenance).toBe('entered');
    expect(res.body.models[0].range[1]).toBeGreaterThanOrEqual(3000);
    expect(res.body.history[0].revision).toBe(1);
    expect(res.body.sourceDetails.map((s: { key: string }) => s.key)).toContain('nasa-tm4513');
  });

  it('lists the polymorph transition of KOH at 516 K with its enthalpy', async () => {
    const koh = await speciesByKey('KOH(cr)');
    const res = await t.anon().get(`/api/v1/species/${koh.id}`);
    const transition = res.body.models[0].transitions.find((x: { kind: string }) => x.kind === 'transition');
    // NASA TM-4513 KOH(a) → KOH(b) at 516 K; the jump in H between the two fits.
    expect(transition.temperature).toBe(516);
    expect(transition.enthalpy).toBeGreaterThan(5);
    expect(transition.enthalpy).toBeLessThan(8);
  });

  it('answers 404 for an unknown id and 404 for a revision that does not exist', async () => {
    const missing = await t.anon().get('/api/v1/species/00000000-0000-4000-8000-000000000000');
    expect(missing.status).toBe(404);
    const h2o = await speciesByKey('H2O(g)');
    const future = await t.anon().get(`/api/v1/species/${h2o.id}`).query({ revision: 999 });
    expect(future.status).toBe(404);
    expect(future.body.error.message).toMatch(/revision 999/);
  });
});

describe('POST /api/v1/reaction-enthalpy', () => {
  const evaluate = (body: object) => t.anon().post('/api/v1/reaction-enthalpy').send(body);

  it('gives methane combustion to liquid water about −890 kJ/mol with its uncertainty and sources', async () => {
    const res = await evaluate({ equation: 'CH4(g) + 2 O2(g) -> CO2(g) + 2 H2O(l)' });
    expect(res.status).toBe(200);
    // ΔcH°(CH4, g) = −890.3 kJ/mol (NIST Chemistry WebBook / CRC Handbook; common textbook figure, from memory).
    expect(res.body.deltaH.value).toBeCloseTo(-890.3, 0);
    expect(res.body.deltaH.uncertainty).toBeGreaterThan(0);
    expect(res.body.deltaH.uncertainty).toBeLessThan(1);
    expect(res.body.uncertaintyComplete).toBe(true);
    expect(res.body.terms).toHaveLength(4);
    expect(res.body.terms[0].key).toBe('CH4(g)');
    // ΔU = ΔH − Δn(gas)RT with Δn = −2: ΔU = ΔH + 2·8.314462618·298.15/1000 (common practice, no source).
    expect(res.body.deltaU.value).toBeCloseTo(res.body.deltaH.value + (2 * 8.314462618 * 298.15) / 1000, 6);
    const shares = res.body.contributions.map((c: { varianceShare: number }) => c.varianceShare);
    expect(shares.reduce((a: number, b: number) => a + b, 0)).toBeCloseTo(1, 9);
    expect(res.body.sources.length).toBeGreaterThanOrEqual(1);
  });

  it('gives ammonia synthesis about −92 kJ per 2 mol NH3', async () => {
    // N2(g) + 3 H2(g) → 2 NH3(g) releases about 92 kJ (91.9 on CODATA values): common practice, no source.
    const res = await evaluate({ equation: 'N2(g) + 3 H2(g) -> 2 NH3(g)' });
    expect(res.status).toBe(200);
    expect(res.body.deltaH.value).toBeCloseTo(-91.9, 0);
    expect(res.body.deltaS.value).toBeLessThan(0);
  });

  it('gives sodium in water about −369 kJ on ion values', async () => {
    // 2 Na(s) + 2 H2O(l) → 2 NaOH(aq) + H2(g): about −369 kJ (369.0 on CODATA's values): common practice, no source.
    const res = await evaluate({ equation: '2 Na(s) + 2 H2O(l) -> 2 Na^+(aq) + 2 OH^-(aq) + H2(g)' });
    expect(res.status).toBe(200);
    expect(res.body.deltaH.value).toBeGreaterThan(-370);
    expect(res.body.deltaH.value).toBeLessThan(-368);
  });

  it('integrates the NASA models for Kirchhoff at 500 K and 1000 K', async () => {
    for (const temperature of [500, 1000]) {
      const res = await evaluate({
        equation: 'CH4(g) + 2 O2(g) -> CO2(g) + 2 H2O(g)',
        temperature: { value: temperature, unit: 'K' },
      });
      expect(res.status).toBe(200);
      // Σ ν [H(T) − H(298.15 K)] from the NASA polynomials, evaluated in this test.
      const increment = (label: string) => nasaEnthalpy(label, temperature) - nasaEnthalpy(label, 298.15);
      const expected =
        res.body.deltaH298.value + increment('CO2') + 2 * increment('H2O') - increment('CH4') - 2 * increment('O2');
      expect(res.body.deltaH.value).toBeCloseTo(expected, 6);
      expect(res.body.temperature).toEqual({ value: temperature, unit: 'K' });
    }
  });

  it('gives higher and lower heating values of a fuel, labelled', async () => {
    const res = await evaluate({ equation: 'CH4(g) + 2 O2(g) -> CO2(g) + 2 H2O(g)' });
    expect(res.status).toBe(200);
    // Methane: HHV ≈ 55.5 MJ/kg, LHV ≈ 50.0 MJ/kg (engineering handbooks, e.g. Perry's; from memory).
    expect(res.body.heatingValues.fuel).toBe('CH4(g)');
    expect(res.body.heatingValues.higher.perKilogram / 1000).toBeCloseTo(55.5, 0);
    expect(res.body.heatingValues.lower.perKilogram / 1000).toBeCloseTo(50.0, 0);
    expect(res.body.heatingValues.higher.label).toMatch(/higher/);
    const notFuel = await evaluate({ equation: 'N2(g) + 3 H2(g) -> 2 NH3(g)' });
    expect(notFuel.body.heatingValues).toBeNull();
  });

  it('returns a ΔrH°(T) curve and leaves out the temperatures a model does not reach', async () => {
    const res = await evaluate({
      equation: 'H2(g) + 1/2 O2(g) -> H2O(l)',
      curve: { from: 300, to: 700, points: 5 },
    });
    expect(res.status).toBe(200);
    expect(res.body.curve.points.length + res.body.curve.gaps.length).toBe(5);
    expect(res.body.curve.gaps.length).toBeGreaterThan(0);
    expect(res.body.curve.points[0].temperature).toBe(300);
  });

  it('takes °C and °F', async () => {
    const celsius = await evaluate({
      equation: 'CH4(g) + 2 O2(g) -> CO2(g) + 2 H2O(g)',
      temperature: { value: 226.85, unit: 'C' },
    });
    const fahrenheit = await evaluate({
      equation: 'CH4(g) + 2 O2(g) -> CO2(g) + 2 H2O(g)',
      temperature: { value: 440.33, unit: 'F' },
    });
    expect(celsius.body.temperature.value).toBeCloseTo(500, 9);
    expect(fahrenheit.body.temperature.value).toBeCloseTo(500, 9);
  });

  it('flags a constant-Cp estimate only when asked', async () => {
    const body = { equation: 'CH4(g) + 2 O2(g) -> CO2(g) + 2 H2O(g)', temperature: { value: 1000, unit: 'K' } };
    const integrated = await evaluate(body);
    const estimate = await evaluate({ ...body, constantCpEstimate: true });
    expect(integrated.body.constantCpEstimate).toBe(false);
    expect(estimate.body.constantCpEstimate).toBe(true);
    expect(estimate.body.warnings.map((w: { code: string }) => w.code)).toContain('constant_cp_estimate');
    expect(Math.abs(estimate.body.deltaH.value - integrated.body.deltaH.value)).toBeGreaterThan(1);
  });

  it('balances an unbalanced equation first and says so', async () => {
    const res = await evaluate({ equation: 'H2(g) + O2(g) -> H2O(l)' });
    expect(res.status).toBe(200);
    expect(res.body.equation).toBe('2 H2(g) + O2(g) -> 2 H2O(l)');
    expect(res.body.warnings.map((w: { code: string }) => w.code)).toContain('balanced_first');
    // 2 × ΔfH°(H2O, l) = 2 × −285.830 kJ/mol (CODATA 1989, from memory).
    expect(res.body.deltaH.value).toBeCloseTo(-571.66, 2);
  });

  it('reads a condensed formula and takes an element in its reference state', async () => {
    const res = await evaluate({ equation: 'C2H5OH(l) + 3 O2(g) -> 2 CO2(g) + 3 H2O(l)' });
    expect(res.status).toBe(200);
    // ΔcH°(ethanol, l) ≈ −1367 kJ/mol (CRC Handbook heats of combustion, from memory).
    expect(res.body.deltaH.value).toBeCloseTo(-1367, -1);
    const carbon = await evaluate({ equation: 'C(s) + O2(g) -> CO2(g)' });
    expect(carbon.status).toBe(200);
    expect(carbon.body.terms[0].key).toBe('C(cr, graphite)');
    expect(carbon.body.warnings.map((w: { code: string }) => w.code)).toContain('species_resolved');
  });

  it('answers 422 naming a species missing from the library, and the phase choices of H2O', async () => {
    const missing = await evaluate({ equation: 'Xe2F9(g) -> 2 Xe(g) + 9/2 F2(g)' });
    expect(missing.status).toBe(422);
    expect(missing.body.error.message).toMatch(/Xe2F9/);
    const noPhase = await evaluate({ equation: 'H2(g) + 1/2 O2(g) -> H2O' });
    expect(noPhase.status).toBe(422);
    expect(noPhase.body.error.message).toMatch(/H2O\(g\)/);
    expect(noPhase.body.error.message).toMatch(/H2O\(l\)/);
  });

  it('answers 422 when T is past a liquid model, naming its range and the phase that exists at T', async () => {
    const res = await evaluate({
      equation: 'H2(g) + 1/2 O2(g) -> H2O(l)',
      temperature: { value: 1500, unit: 'K' },
    });
    expect(res.status).toBe(422);
    expect(res.body.error.message).toMatch(/H2O\(l\)/);
    expect(res.body.error.message).toMatch(/H2O\(g\)/);
  });

  it('refuses a temperature below absolute zero with 400 naming the field', async () => {
    const res = await evaluate({ equation: 'H2(g) + 1/2 O2(g) -> H2O(g)', temperature: { value: -300, unit: 'C' } });
    expect(res.status).toBe(400);
    expect(JSON.stringify(res.body.error.details)).toContain('temperature');
  });
});

describe('POST /api/v1/reaction-heat', () => {
  it('scales methane combustion to 1 kg of methane, released, with the cautions', async () => {
    const res = await t
      .anon()
      .post('/api/v1/reaction-heat')
      .send({
        equation: 'CH4(g) + 2 O2(g) -> CO2(g) + 2 H2O(l)',
        amounts: [{ term: 0, value: 1, unit: 'kg' }],
      });
    expect(res.status).toBe(200);
    // Higher heating value of methane ≈ 55.5 MJ/kg (engineering handbooks; from memory).
    expect(res.body.heat.value / 1000).toBeCloseTo(-55.5, 0);
    expect(res.body.direction).toBe('released');
    expect(res.body.cautions.length).toBeGreaterThan(0);
  });

  it('finds the limiting reactant and what is left of the other', async () => {
    const res = await t
      .anon()
      .post('/api/v1/reaction-heat')
      .send({
        equation: '2 H2(g) + O2(g) -> 2 H2O(l)',
        amounts: [
          { term: 0, value: 4, unit: 'mol' },
          { term: 1, value: 3, unit: 'mol' },
        ],
      });
    expect(res.status).toBe(200);
    expect(res.body.limitingTerm).toBe(0);
    expect(res.body.extent.value).toBeCloseTo(2, 12);
    expect(res.body.excess[0].left.value).toBeCloseTo(1, 12);
    // 1 mol O2 left = 31.998 g (CIAAW 2021 atomic weights).
    expect(res.body.excess[0].leftMass.value).toBeCloseTo(31.998, 2);
  });

  it('gives the adiabatic rise of a water batch as Q/(m·cp)', async () => {
    const res = await t
      .anon()
      .post('/api/v1/reaction-heat')
      .send({
        equation: 'H^+(aq) + OH^-(aq) -> H2O(l)',
        amounts: [{ term: 0, value: 1, unit: 'mol' }],
        batch: { mass: { value: 1, unit: 'kg' }, cp: { value: 4.184, unit: 'J/(g K)' } },
      });
    expect(res.status).toBe(200);
    // Neutralisation ≈ −55.8 kJ/mol at infinite dilution (common practice, no source); water cp 4.184 J/(g K)
    // (common practice, no source): ΔT = 55.8 kJ / (1000 g × 4.184 J/(g K)) ≈ 13.3 K.
    expect(res.body.adiabaticRise.value).toBeCloseTo(-res.body.heat.value / 4.184, 9);
    expect(res.body.adiabaticRise.value).toBeCloseTo(13.3, 0);
  });

  it('needs T and p with a gas volume (400 naming the amount)', async () => {
    const res = await t
      .anon()
      .post('/api/v1/reaction-heat')
      .send({ equation: 'CH4(g) + 2 O2(g) -> CO2(g) + 2 H2O(l)', amounts: [{ term: 0, value: 24.79, unit: 'L' }] });
    expect(res.status).toBe(400);
    expect(JSON.stringify(res.body.error.details)).toContain('amounts');
  });
});

describe('revisions', () => {
  it('keeps results at an earlier revision when a later revision changes a value', async () => {
    const equation = 'C(s) + O2(g) -> CO2(g)';
    const before = await t.anon().post('/api/v1/reaction-enthalpy').send({ equation });
    const revision = before.body.libraryRevision as number;
    const accepted = await acceptEntries(
      t,
      [
        {
          kind: 'revise-value',
          species: 'CO2(g)',
          deltaFH: { value: -393.0, uncertainty: 0.1 },
          source: { key: 'codata-1989' },
          provenance: 'entered',
        },
      ],
      'Test: a revised CO2 value',
    );
    expect(accepted.revision).toBe(revision + 1);
    const after = await t.anon().post('/api/v1/reaction-enthalpy').send({ equation });
    expect(after.body.libraryRevision).toBe(revision + 1);
    expect(after.body.deltaH.value).toBeCloseTo(-393.0, 6);
    const pinned = await t.anon().post('/api/v1/reaction-enthalpy').send({ equation, revision });
    expect(pinned.body.libraryRevision).toBe(revision);
    expect(pinned.body.deltaH.value).toBe(before.body.deltaH.value);
    const revisions = await t.anon().get('/api/v1/library/revisions');
    expect(revisions.body.current).toBe(revision + 1);
    expect(revisions.body.items[0].summary).toBe('Test: a revised CO2 value');
  });

  it('refuses an amendment with a bad entry, naming entry and field, and makes no revision', async () => {
    const member = await t.signIn('member');
    const before = await t.anon().get('/api/v1/library/revisions');
    const res = await member.post('/api/v1/amendments').send({
      title: 'Test: a bad entry',
      rationale: 'A test.',
      entries: [
        {
          kind: 'revise-value',
          species: 'CO2(g)',
          deltaFH: { value: -393.0, uncertainty: 0.1 },
          source: { key: 'codata-1989' },
        },
        {
          kind: 'revise-value',
          species: 'CO2(g)',
          deltaFH: { value: 'abc', uncertainty: 0.1 },
          source: { key: 'codata-1989' },
        },
      ],
    });
    expect(res.status).toBe(400);
    expect(res.body.error.details.issues[0].path).toEqual(['body', 'entries', 1, 'deltaFH', 'value']);
    const after = await t.anon().get('/api/v1/library/revisions');
    expect(after.body.current).toBe(before.body.current);
  });

  it('has no direct import: even a site admin changes the library only through an amendment', async () => {
    const admin = await t.signIn('site_admin');
    const res = await admin
      .post('/api/v1/library/imports')
      .send({ summary: 'nope', files: [{ name: 'x.csv', text: '' }] });
    expect(res.status).toBe(404);
    // A site admin in no team is not a proposer either.
    const proposed = await admin.post('/api/v1/amendments').send({
      title: 'nope',
      rationale: 'nope',
      entries: [{ kind: 'deprecate', target: 'species', id: crypto.randomUUID(), reason: 'x' }],
    });
    expect(proposed.status).toBe(403);
  });
});
