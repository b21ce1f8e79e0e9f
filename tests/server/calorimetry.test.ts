import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { bombResultSchema, constantPressureResultSchema } from '@shared/schemas/calorimetry';
import { newtonianReadings, trueRise, type NewtonianRun } from '../shared/chemistry/calorimetry/support';
import { startTestApp, type TestApp } from './helpers';

let t: TestApp;
beforeAll(async () => {
  t = await startTestApp({ config: { calc: { requestsPerMinute: 100 } } });
  // Start a worker and load the core once, so the first test does not pay for it within the time budget.
  await t.app.locals.deps.calc.warmUp();
});
afterAll(async () => t?.close());

/**
 * Chang, Chemistry (McGraw-Hill), the worked example on constant-pressure calorimetry (from memory;
 * example number not checked): 100 mL of 0.500 M HCl and 100 mL of 0.500 M NaOH at 22.50 °C reach
 * 25.86 °C; density 1.00 g/mL, 4.184 J/(g °C), calorimeter neglected: ΔH = −56.2 kJ/mol.
 */
const neutralisation = {
  solution: { volume: { value: 200, unit: 'mL' }, density: { value: 1.0, unit: 'g/mL' } },
  specificHeat: { value: 4.184, unit: 'J/(g K)' },
  calorimeterHeatCapacity: { value: 0, unit: 'J/K' },
  temperature: { initial: { value: 22.5, unit: 'C' }, final: { value: 25.86, unit: 'C' } },
  reaction: {
    equation: 'HCl(aq) + NaOH(aq) -> NaCl(aq) + H2O(l)',
    limiting: { term: 0, amount: { value: 0.05, unit: 'mol' } },
  },
  concentrations: [
    { species: 'HCl(aq)', value: 0.25, unit: 'mol/L' },
    { species: 'NaOH(aq)', value: 0.25, unit: 'mol/L' },
  ],
};

const cp = (body: unknown) =>
  request(t.url)
    .post('/api/v1/calorimetry/constant-pressure')
    .send(body as object);
const bomb = (body: unknown) =>
  request(t.url)
    .post('/api/v1/calorimetry/bomb')
    .send(body as object);
const paths = (res: request.Response) =>
  (res.body.error.details.issues as { path: (string | number)[] }[]).map((i) => i.path.join('.'));

describe('POST /api/v1/calorimetry/constant-pressure', () => {
  it('reproduces the worked neutralisation without signing in: q = 2.81 kJ, ΔH = −56.2 kJ/mol (Chang, from memory)', async () => {
    const res = await cp(neutralisation);
    expect(res.status).toBe(200);
    const body = constantPressureResultSchema.parse(res.body);
    expect(body.q.value).toBeCloseTo(2.81, 2);
    expect(body.deltaH.value).toBeCloseTo(-56.2, 1);
    // −55.8 kJ per mol of water at infinite dilution (common practice, no source); near 0.25 M more negative.
    expect(body.deltaH.value).toBeLessThan(-55.8);
    expect(body.limiting).toMatchObject({ species: 'HCl(aq)', coefficient: '1' });
    expect(body.basis).toMatch(/not ΔrH° at infinite dilution/);
    expect(body.concentrations).toHaveLength(2);
    expect(body.cautions.length).toBeGreaterThan(0);
  });

  it('gives ΔH per mole of reaction as written, through the equation core', async () => {
    const doubled = {
      ...neutralisation,
      reaction: { ...neutralisation.reaction, equation: '2 HCl(aq) + 2 NaOH(aq) -> 2 NaCl(aq) + 2 H2O(l)' },
    };
    const res = await cp(doubled);
    expect(res.status).toBe(200);
    expect(res.body.deltaH.value).toBeCloseTo(-112.4, 0);
    expect(res.body.limiting.coefficient).toBe('2');
  });

  it('takes the limiting amount in grams with the molar mass of its formula', async () => {
    // 0.0500 mol of NaOH is 2.000 g at M = 39.997 g/mol (CIAAW weights; hand-computed).
    const res = await cp({
      ...neutralisation,
      reaction: { ...neutralisation.reaction, limiting: { term: 1, amount: { value: 1.99985, unit: 'g' } } },
    });
    expect(res.status).toBe(200);
    expect(res.body.limiting.amount.value).toBeCloseTo(0.05, 4);
  });

  it('corrects a time–temperature series in °C for drift by both methods (synthetic curve with a known answer)', async () => {
    // Newton's law with a first-order release, solved exactly in the test support (not by the code under test).
    const run: NewtonianRun = {
      k: 1e-4,
      convergence: 295.05,
      start: 294.0,
      rise: 3,
      release: 0.1,
      mixingTime: 300,
      step: 5,
      end: 900,
    };
    const series = newtonianReadings(run).map(([time, kelvin]) => [time, kelvin - 273.15]);
    for (const method of ['dickinson', 'regnault-pfaundler'] as const) {
      const res = await cp({
        ...neutralisation,
        temperature: { series, unit: 'C', mixingTime: 300, method, afterPeriodStart: 400 },
      });
      expect(res.status).toBe(200);
      const body = constantPressureResultSchema.parse(res.body);
      expect(body.deltaT.source).toBe('series');
      expect(Math.abs(body.deltaT.value - trueRise(run, 400))).toBeLessThan(1e-3);
      if (method === 'dickinson') expect(body.deltaT.drift!.tMid! - 300).toBeCloseTo(1 / run.release, 0);
      else expect(body.deltaT.drift!.tMid).toBeNull();
    }
  });

  it('answers 400 naming each bad field', async () => {
    const res = await cp({
      solution: { volume: { value: 200, unit: 'mL' } },
      temperature: { initial: { value: 22.5, unit: 'X' } },
      reaction: { equation: 'HCl(aq) + NaOH(aq) -> NaCl(aq) + H2O(l)', limiting: { term: -1 } },
    });
    expect(res.status).toBe(400);
    expect(res.body.error.code).toBe('validation_failed');
    expect(paths(res)).toEqual(
      expect.arrayContaining([
        'body.solution.density',
        'body.temperature.initial.unit',
        'body.temperature.final',
        'body.reaction.limiting.term',
        'body.reaction.limiting.amount',
      ]),
    );
  });

  it('names the limiting term when it does not exist or is a product', async () => {
    for (const term of [7, 3]) {
      const res = await cp({
        ...neutralisation,
        reaction: { ...neutralisation.reaction, limiting: { term, amount: { value: 0.05, unit: 'mol' } } },
      });
      expect(res.status).toBe(400);
      expect(paths(res)).toEqual(['body.reaction.limiting.term']);
    }
  });
});

describe('POST /api/v1/calorimetry/bomb', () => {
  // An invented bomb of ε = 10 000 J/K; each rise is computed from it and the certificate value.
  const epsilon = 10_000;
  const certificate = -26_434; // J/g, NIST SRM 39j benzoic acid (from memory).
  const run = (grams: number, massic = certificate) => ({
    mass: { value: grams, unit: 'g', uncertainty: 0.00002 },
    temperature: { rise: { value: (grams * -massic + 90) / epsilon, unit: 'K', uncertainty: 0.0003 } },
    fuse: { energy: { value: 50, unit: 'J', uncertainty: 2 } },
    nitricAcid: { energy: { value: 40, unit: 'J', uncertainty: 4 } },
  });
  const calibration = {
    certificate: {
      massicEnergy: { value: -26.434, unit: 'kJ/g', uncertainty: 0.003 },
      citation: 'NIST SRM 39j certificate (from memory)',
    },
    runs: [0.98, 1.0, 1.01, 0.99, 1.02, 1.0].map((g) => run(g)),
  };

  it('returns the certificate value for the calibrant burnt as a sample, and ΔfH° of benzoic acid from the library', async () => {
    // The certificate's bomb conditions lie about +20 J/g from standard states (ΔcU° ≈ −26.414 kJ/g;
    // from memory); with it, ΔfH°(C7H6O2, cr) ≈ −385.2 kJ/mol (Cox & Pilcher 1970; from memory).
    const res = await bomb({
      sample: { formula: 'C6H5COOH', phase: 'cr' },
      calibration,
      runs: [run(0.95), run(1.05)],
      standardStateCorrection: { value: 20, unit: 'J/g' },
    });
    expect(res.status).toBe(200);
    const body = bombResultSchema.parse(res.body);
    expect(body.energyEquivalent.value).toBeCloseTo(epsilon, 3);
    expect(body.massicEnergy.value).toBeCloseTo(certificate, 3);
    expect(body.combustion.deltaNGas).toBe('-1/2');
    expect(body.deltaFH!.value).toBeCloseTo(-385.2, 0);
    expect(body.auxiliary.map((a) => a.key).sort()).toEqual(['CO2(g)', 'H2O(l)']);
    expect(body.auxiliary.every((a) => a.source.citation.length > 0)).toBe(true);
    expect(body.libraryRevision).toBe(1);
    expect(body.standardState.applied).toBe(true);
    expect(body.cautions.join(' ')).toMatch(/oxygen/i);
  });

  it('lists the standard-state corrections as not applied when none are given', async () => {
    const res = await bomb({
      sample: { formula: 'C10H8', phase: 'cr' },
      energyEquivalent: { value: 10.17, unit: 'kJ/K' },
      runs: [{ mass: { value: 1.435, unit: 'g' }, temperature: { rise: { value: 25.95 - 20.28, unit: 'C' } } }],
    });
    expect(res.status).toBe(200);
    // 1.435 g of naphthalene raise a 10.17 kJ/°C bomb by 5.67 °C: ΔcU = −5.15 × 10³ kJ/mol (Chang, from memory).
    expect(res.body.deltaCU.value / 1000).toBeCloseTo(-5.15, 2);
    expect(res.body.standardState.applied).toBe(false);
    expect(res.body.standardState.note).toMatch(/not applied/);
  });

  it('answers 400 naming each bad field', async () => {
    const res = await bomb({
      sample: { formula: 'C6H6', phase: 'x' },
      runs: [{ mass: { value: 1, unit: 'g' }, temperature: {} }],
    });
    expect(res.status).toBe(400);
    expect(paths(res)).toEqual(
      expect.arrayContaining(['body.sample.phase', 'body.runs.0.temperature.rise', 'body.calibration']),
    );
  });

  it('names the formula of a sample whose elements it does not handle', async () => {
    const res = await bomb({
      sample: { formula: 'C6H5Cl', phase: 'l' },
      energyEquivalent: { value: 10_000, unit: 'J/K' },
      runs: [{ mass: { value: 1, unit: 'g' }, temperature: { rise: { value: 2, unit: 'K' } } }],
    });
    expect(res.status).toBe(400);
    expect(paths(res)).toEqual(['body.sample.formula']);
  });
});

describe('/api/v1/teams/:teamId/calorimetry/runs', () => {
  it('lets a member save a run with its readings, reduced again on the server, that viewers read', async () => {
    const member = await t.signIn('member');
    const viewer = await t.signIn('viewer');
    const base = `/api/v1/teams/${t.ids.teams.kestrel}/calorimetry/runs`;
    const csv = 'time_s,temp_C\n0,22.50\n600,25.86\n';
    const saved = await member.post(base).send({
      kind: 'constant-pressure',
      label: 'Neutralisation, run 1',
      inputs: neutralisation,
      evidence: { fileName: 'run1.csv', text: csv },
    });
    expect(saved.status).toBe(201);
    expect(saved.body.result.deltaH.value).toBeCloseTo(-56.2, 1);
    expect(saved.body.evidence).toEqual({ fileName: 'run1.csv', text: csv });
    expect(saved.body.authorName.length).toBeGreaterThan(0);

    const list = await viewer.get(base);
    expect(list.status).toBe(200);
    const line = list.body.runs.find((r: { id: string }) => r.id === saved.body.id);
    expect(line).toMatchObject({ kind: 'constant-pressure', label: 'Neutralisation, run 1' });
    expect(line.deltaH.value).toBeCloseTo(-56.2, 1);
    const one = await viewer.get(`${base}/${saved.body.id}`);
    expect(one.body.inputs).toEqual(neutralisation);

    const renamed = await member.patch(`${base}/${saved.body.id}`).send({ label: 'Neutralisation A' });
    expect(renamed.status).toBe(200);
    expect(renamed.body.label).toBe('Neutralisation A');
    expect((await viewer.delete(`${base}/${saved.body.id}`)).status).toBe(403);
    expect((await member.delete(`${base}/${saved.body.id}`)).status).toBe(204);
    expect((await viewer.get(`${base}/${saved.body.id}`)).status).toBe(404);
  });

  it('keeps the library revision of a bomb run', async () => {
    const member = await t.signIn('member');
    const res = await member.post(`/api/v1/teams/${t.ids.teams.kestrel}/calorimetry/runs`).send({
      kind: 'bomb',
      label: 'Naphthalene',
      inputs: {
        sample: { formula: 'C10H8', phase: 'cr' },
        energyEquivalent: { value: 10.17, unit: 'kJ/K' },
        runs: [{ mass: { value: 1.435, unit: 'g' }, temperature: { rise: { value: 5.67, unit: 'K' } } }],
      },
    });
    expect(res.status).toBe(201);
    expect(res.body.libraryRevision).toBe(1);
  });

  it('saves nothing when the inputs cannot be reduced, naming the field', async () => {
    const member = await t.signIn('member');
    const base = `/api/v1/teams/${t.ids.teams.kestrel}/calorimetry/runs`;
    const before = (await member.get(base)).body.runs.length;
    const res = await member.post(base).send({
      kind: 'constant-pressure',
      label: 'Bad',
      inputs: {
        ...neutralisation,
        reaction: { ...neutralisation.reaction, limiting: { term: 9, amount: { value: 1, unit: 'mol' } } },
      },
    });
    expect(res.status).toBe(400);
    expect(paths(res)).toEqual(['body.inputs.reaction.limiting.term']);
    expect((await member.get(base)).body.runs.length).toBe(before);
  });
});
