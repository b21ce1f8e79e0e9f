import { execFileSync } from 'node:child_process';
import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { parse as parseBibtex } from '@retorquere/bibtex-parser';
import Papa from 'papaparse';
import type TestAgent from 'supertest/lib/agent';
import { afterAll, beforeAll, beforeEach, describe, expect, it } from 'vitest';
import { applyLibrarySet } from '../../server/library/apply-set';
import { withNewRevision } from '../../server/library/revisions';
import { readLibraryFolder } from '../../server/library/seed-library';
import { readLibrarySet } from '../../server/library/seed-set';
import { startTestApp, type TestApp } from './helpers';

/**
 * Calorimetry runs kept in reaction sets: reduced again by the server whenever the set is
 * evaluated (a client-sent result is never read), at the set's revision, and carried through the
 * share page and every export.
 */

let t: TestApp;
let member: TestAgent;
beforeAll(async () => {
  t = await startTestApp({ config: { calc: { requestsPerMinute: 1000, linesPerMinute: 100_000 } } });
  await t.app.locals.deps.calc.warmUp();
});
afterAll(() => t?.close());
beforeEach(async () => {
  await t.reset();
  member = await t.signIn('member');
});

const setsUrl = () => `/api/v1/teams/${t.ids.teams.kestrel}/sets`;

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
};

// An invented bomb of ε = 10 000 J/K; each rise is computed from it and the certificate value.
const EPSILON = 10_000;
const CERTIFICATE = -26_434; // J/g, NIST SRM 39j benzoic acid (from memory).
const CITATION = 'NIST SRM 39j, benzoic acid, certificate of analysis (from memory)';
const bombRun = (grams: number) => ({
  mass: { value: grams, unit: 'g', uncertainty: 0.00002 },
  temperature: { rise: { value: (grams * -CERTIFICATE + 90) / EPSILON, unit: 'K', uncertainty: 0.0003 } },
  fuse: { energy: { value: 50, unit: 'J', uncertainty: 2 } },
  nitricAcid: { energy: { value: 40, unit: 'J', uncertainty: 4 } },
});
const benzoicAcid = {
  sample: { formula: 'C6H5COOH', phase: 'cr' },
  calibration: {
    certificate: { massicEnergy: { value: -26.434, unit: 'kJ/g', uncertainty: 0.003 }, citation: CITATION },
    runs: [0.98, 1.0, 1.01, 0.99].map(bombRun),
  },
  runs: [bombRun(0.95), bombRun(1.05)],
  standardStateCorrection: { value: 20, unit: 'J/g' },
};
const READINGS = 'time_s,temp_C\n0,22.50\n600,25.86\n';

const RUN_ITEMS = [
  {
    kind: 'calorimetry-run',
    id: 'neutral',
    label: 'Neutralisation, run 1',
    runKind: 'constant-pressure',
    inputs: neutralisation,
    evidence: { fileName: 'run1.csv', text: READINGS },
    note: 'Coffee-cup calorimeter, bench 3',
  },
  { kind: 'calorimetry-run', id: 'benzoic', runKind: 'bomb', inputs: benzoicAcid, fromRun: null },
];

async function makeSet(items: unknown[] = RUN_ITEMS, extra: object = {}) {
  const res = await member.post(setsUrl()).send({ title: 'Calorimetry of the pilot batch', items, ...extra });
  expect(res.status, JSON.stringify(res.body)).toBe(201);
  return res.body as { id: string; version: number; revision: number; items: Record<string, unknown>[] };
}

const binary = (
  res: { on: (e: string, f: (c?: Buffer) => void) => void },
  done: (e: Error | null, b: Buffer) => void,
) => {
  const chunks: Buffer[] = [];
  res.on('data', (c) => chunks.push(c!));
  res.on('end', () => done(null, Buffer.concat(chunks)));
};

type RunResult = {
  itemId: string;
  kind: string;
  error: { message: string } | null;
  value: {
    runKind: string;
    equation: string;
    deltaH: { value: number; uncertainty: number | null };
    sources: string[];
    result: { deltaFH?: { value: number } | null; libraryRevision?: number };
  } | null;
};

describe('a calorimetry run in a reaction set', () => {
  it('is reduced by the server when the set is evaluated, bomb runs with the library at the set revision', async () => {
    const set = await makeSet();
    const res = await member.get(`${setsUrl()}/${set.id}/results`);
    expect(res.status).toBe(200);
    const [cp, bomb] = res.body.results as RunResult[];
    expect(cp!.error).toBeNull();
    expect(cp!.value!.runKind).toBe('constant-pressure');
    expect(cp!.value!.deltaH.value).toBeCloseTo(-56.2, 1); // Chang, from memory (above)
    expect(bomb!.error).toBeNull();
    // With the ~ +20 J/g standard-state correction, ΔfH°(C7H6O2, cr) ≈ −385.2 kJ/mol (Cox & Pilcher 1970; from memory).
    expect(bomb!.value!.result.deltaFH!.value).toBeCloseTo(-385.2, 0);
    expect(bomb!.value!.result.libraryRevision).toBe(res.body.libraryRevision);
    // The CO2(g) and H2O(l) sources of the Hess cycle join the set's bibliography.
    expect(bomb!.value!.sources.length).toBeGreaterThan(0);
    const keys = (res.body.sources as { key: string }[]).map((s) => s.key);
    for (const key of bomb!.value!.sources) expect(keys).toContain(key);
    // The bomb cautions (high-pressure oxygen) reach every reader.
    expect((res.body.cautions as string[]).join(' ')).toMatch(/oxygen/i);
  });

  it('never keeps a result sent with the item: the stored item holds inputs only', async () => {
    const forged = { ...RUN_ITEMS[0], result: { deltaH: { value: -999, uncertainty: 0, unit: 'kJ/mol' } } };
    const set = await makeSet([forged]);
    expect(set.items[0]).not.toHaveProperty('result');
    const res = await member.get(`${setsUrl()}/${set.id}/results`);
    expect(res.body.results[0].value.deltaH.value).toBeCloseTo(-56.2, 1);
  });

  it('reports a run the server cannot reduce as that item’s problem, the others still evaluated', async () => {
    const bad = {
      ...RUN_ITEMS[0],
      id: 'bad',
      inputs: {
        ...neutralisation,
        reaction: { ...neutralisation.reaction, limiting: { term: 9, amount: { value: 1, unit: 'mol' } } },
      },
    };
    const set = await makeSet([bad, RUN_ITEMS[1]]);
    const res = await member.get(`${setsUrl()}/${set.id}/results`);
    expect(res.body.results[0].error.message).toMatch(/term|limiting/i);
    expect(res.body.results[1].error).toBeNull();
  });

  it('shows the same ΔH through a share link, without an account', async () => {
    const set = await makeSet();
    const team = (await member.get(`${setsUrl()}/${set.id}/results`)).body;
    const link = (await member.post(`${setsUrl()}/${set.id}/links`).send({})).body as { token: string };
    const shared = await t.anon().get(`/api/v1/shared/${link.token}`);
    expect(shared.status).toBe(200);
    expect(shared.body.items[0].evidence).toEqual({ fileName: 'run1.csv', text: READINGS });
    const values = (e: { results: RunResult[] }) => e.results.map((r) => r.value!.deltaH.value);
    expect(values(shared.body.evaluation)).toEqual(values(team));
  });
});

describe('hostile calorimetry-run items', () => {
  const post = (items: unknown[]) => member.post(setsUrl()).send({ title: 'Hostile', items });
  const issuePaths = (res: { body: { error: { details: { issues: { path: (string | number)[] }[] } } } }) =>
    res.body.error.details.issues.map((i) => i.path.join('.'));

  it('answers 400 naming the field, and creates nothing', async () => {
    const cases: [unknown, string][] = [
      [{ kind: 'calorimetry-run', inputs: neutralisation }, 'body.items.0.runKind'],
      [{ kind: 'calorimetry-run', runKind: 'oven', inputs: neutralisation }, 'body.items.0.runKind'],
      [{ kind: 'calorimetry-run', runKind: 'bomb', inputs: neutralisation }, 'body.items.0.inputs.sample'],
      [
        { kind: 'calorimetry-run', runKind: 'bomb', inputs: { ...benzoicAcid, sample: { formula: '', phase: 'cr' } } },
        'body.items.0.inputs.sample.formula',
      ],
      [
        { kind: 'calorimetry-run', runKind: 'constant-pressure', inputs: { ...neutralisation, solution: 'lots' } },
        'body.items.0.inputs.solution',
      ],
      [{ ...RUN_ITEMS[0], evidence: { fileName: '', text: 'x' } }, 'body.items.0.evidence.fileName'],
      [{ ...RUN_ITEMS[0], fromRun: '../../etc/passwd' }, 'body.items.0.fromRun'],
      [{ ...RUN_ITEMS[0], label: 'x'.repeat(201) }, 'body.items.0.label'],
      [{ ...RUN_ITEMS[0], note: 'bad\u0000byte' }, 'body.items.0.note'],
    ];
    for (const [item, where] of cases) {
      const res = await post([item]);
      expect(res.status, JSON.stringify(item).slice(0, 200)).toBe(400);
      expect(issuePaths(res), where).toContain(where);
    }
    expect((await member.get(setsUrl())).body.total).toBe(0);
  });

  it('refuses an oversize run naming the item (400), and a set over the body limit (413)', async () => {
    // 400 000 characters is the limit of one run: 9 000 readings in the inputs and three times as many in the file exceed it.
    const series = Array.from({ length: 9_000 }, (_, i) => [i, 22.5 + i / 1e4]);
    const longReadings = series.map(([s, c]) => `${s},${c}`).join('\n');
    const big = {
      ...RUN_ITEMS[0],
      inputs: { ...neutralisation, temperature: { series, unit: 'C', mixingTime: 100, method: 'dickinson' } },
      evidence: { fileName: 'long.csv', text: longReadings.repeat(3) },
    };
    const tooBig = await post([big]);
    expect(tooBig.status).toBe(400);
    expect(issuePaths(tooBig)).toContain('body.items.0');
    expect(JSON.stringify(tooBig.body)).toMatch(/calorimetry run may take up to 400,000 characters/);

    const fits = { ...big, evidence: { fileName: 'long.csv', text: longReadings.slice(0, 150_000) } };
    // Each run fits, but together they pass the 1 MB JSON body limit of the API.
    const copies = Math.ceil((1.1 * 2 ** 20) / JSON.stringify(fits).length);
    expect(JSON.stringify(fits).length).toBeLessThan(400_000);
    const overBody = await post(Array.from({ length: copies }, (_, i) => ({ ...fits, id: `run-${i}` })));
    expect(overBody.status).toBe(413);
    expect((await member.get(setsUrl())).body.total).toBe(0);
  });
});

describe('exports of a set with calorimetry runs', () => {
  it('CSV: one row per run with its ΔH, ΔT, q and ΔfH°', async () => {
    const set = await makeSet();
    const res = await member.get(`${setsUrl()}/${set.id}/export.csv`);
    expect(res.status).toBe(200);
    const rows = Papa.parse<Record<string, string>>(res.text.replace(/^\uFEFF/, '').trim(), { header: true }).data;
    expect(rows).toHaveLength(2);
    const [cp, bomb] = rows;
    expect(cp!.kind).toBe('calorimetry-run');
    expect(cp!.calorimetry_run).toBe('constant-pressure');
    expect(Number(cp!.deltaH_kJ_per_mol)).toBeCloseTo(-56.2, 1);
    // ΔT = 25.86 − 22.50 = 3.36 K, q = 200 g × 4.184 J/(g K) × 3.36 K = 2.81 kJ (Chang, from memory).
    expect(Number(cp!.deltaT_K)).toBeCloseTo(3.36, 6);
    expect(Number(cp!.q_kJ)).toBeCloseTo(2.81, 2);
    expect(bomb!.calorimetry_run).toBe('bomb');
    expect(Number(bomb!.deltaFH_kJ_per_mol)).toBeCloseTo(-385.2, 0);
    expect(Number(bomb!.temperature_K)).toBeCloseTo(298.15, 6);
  });

  it('JSON: import re-creates every run exactly, inputs, readings file and all', async () => {
    const set = await makeSet();
    const document = JSON.parse((await member.get(`${setsUrl()}/${set.id}/export.json`)).text);
    const imported = await member.post(`${setsUrl()}/import`).send(document);
    expect(imported.status, JSON.stringify(imported.body)).toBe(201);
    const original = (await member.get(`${setsUrl()}/${set.id}`)).body;
    const copy = (await member.get(`${setsUrl()}/${imported.body.id}`)).body;
    expect(copy.items).toEqual(original.items);
    const again = JSON.parse((await member.get(`${setsUrl()}/${imported.body.id}/export.json`)).text);
    const strip = (e: { evaluatedAt?: string }) => ({ ...e, evaluatedAt: null });
    expect(strip(again.evaluation)).toEqual(strip(document.evaluation));
  });

  it('BibTeX: the calibrant certificate beside the library sources of the Hess cycle', async () => {
    const set = await makeSet();
    const [bib, results] = await Promise.all([
      member.get(`${setsUrl()}/${set.id}/export.bib`).buffer(true).parse(binary),
      member.get(`${setsUrl()}/${set.id}/results`),
    ]);
    const parsed = parseBibtex((bib.body as Buffer).toString('utf8'), { sentenceCase: false });
    expect(parsed.errors).toEqual([]);
    const keys = parsed.entries.map((e) => e.key);
    for (const s of results.body.sources as { key: string }[]) expect(keys).toContain(s.key);
    const certificate = parsed.entries.find((e) => e.key === 'calibrant-1')!;
    expect(certificate.type).toBe('misc');
    expect(certificate.fields.title).toBe(CITATION);
  });

  it('PDF: ΔH with uncertainty, the method, corrections applied and not applied, and the cautions', async () => {
    const set = await makeSet();
    const res = await member.get(`${setsUrl()}/${set.id}/export.pdf`).buffer(true).parse(binary);
    expect(res.status).toBe(200);
    const dir = mkdtempSync(path.join(tmpdir(), 'calo-pdf-'));
    let text: string;
    try {
      writeFileSync(path.join(dir, 'set.pdf'), res.body as Buffer);
      text = execFileSync('pdftotext', ['-enc', 'UTF-8', path.join(dir, 'set.pdf'), '-'], { encoding: 'utf8' });
    } finally {
      rmSync(dir, { recursive: true, force: true });
    }
    // −56.2 kJ/mol (Chang, from memory), printed with U+2212 and its uncertainty or alone.
    expect(text).toMatch(/ΔH = −56\.\d+( ± [\d.]+)? kJ mol⁻¹ per mole of reaction as written/);
    expect(text).toMatch(/ΔcH° = −\d{4}\.\d+ ± [\d.]+ kJ mol⁻¹/);
    expect(text).toMatch(/ΔfH° of the sample by Hess's law = −385\.\d+ ± [\d.]+ kJ mol⁻¹/);
    expect(text).toContain('HCl(aq) + NaOH(aq) → NaCl(aq) + H₂O(l)');
    expect(text).toContain('Method: Constant pressure');
    expect(text).toContain('Method: Bomb (constant volume)');
    expect(text).toContain('Standard state (Washburn)');
    expect(text).toContain('not applied');
    expect(text).toContain('Readings file: run1.csv');
    expect(text).toContain('NIST SRM 39j');
    expect(text).toMatch(/oxygen/i);
    expect(text).not.toMatch(/= -\d/);
  });
});

describe('a bomb run in a pinned set after a later library revision', () => {
  // Runs last: it publishes a revision that the reset between tests does not undo.
  it('keeps ΔfH° at the pinned revision and reports what moving would change', async () => {
    const set = await makeSet([RUN_ITEMS[1]]);
    const before = (await member.get(`${setsUrl()}/${set.id}/results`)).body;
    const oldFH = before.results[0].value.result.deltaFH.value as number;

    // ΔfH°(CO2, g) from the seeded −393.51 to an invented −390.00 kJ/mol, as a curator's change would.
    const files = readLibraryFolder().map((f) =>
      f.name === 'values-codata.csv'
        ? { ...f, text: f.text.replace(/^CO2\(g\),dfH298,-393\.51,/m, 'CO2(g),dfH298,-390.00,') }
        : f,
    );
    const { set: library } = readLibrarySet(files);
    await withNewRevision(t.db, { kind: 'seed', summary: 'Test: another ΔfH° of CO2(g)' }, (tx, revision) =>
      applyLibrarySet(tx, library, revision),
    );

    const after = (await member.get(`${setsUrl()}/${set.id}/results`)).body;
    expect(after.libraryRevision).toBe(before.libraryRevision);
    expect(after.results[0].value.result.deltaFH.value).toBe(oldFH);
    // C7H6O2 burns to 7 CO2: ΔfH° of the sample moves by 7 × 3.51 = 24.57 kJ/mol (arithmetic of the cycle).
    const changes = (await member.get(`${setsUrl()}/${set.id}/revision-changes`)).body;
    expect(changes.items).toHaveLength(1);
    expect(changes.items[0].difference).toBeCloseTo(7 * 3.51, 6);
  });
});
