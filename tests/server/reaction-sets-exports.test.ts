import { execFileSync } from 'node:child_process';
import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { createRequire } from 'node:module';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { parse as parseBibtex } from '@retorquere/bibtex-parser';
import Papa from 'papaparse';
import type TestAgent from 'supertest/lib/agent';
import { afterAll, beforeAll, beforeEach, describe, expect, it } from 'vitest';
import { startTestApp, type TestApp } from './helpers';

let t: TestApp;
let member: TestAgent;
beforeAll(async () => {
  t = await startTestApp();
});
afterAll(() => t?.close());
beforeEach(async () => {
  await t.reset();
  member = await t.signIn('member');
});

const setsUrl = () => `/api/v1/teams/${t.ids.teams.kestrel}/sets`;

const ITEMS = [
  { kind: 'reaction', id: 'propane', label: 'Burner feed', equation: 'C3H8(g) + 5 O2(g) -> 3 CO2(g) + 4 H2O(l)' },
  {
    kind: 'reaction',
    id: 'ammonia',
    equation: 'N2(g) + 3 H2(g) <=> 2 NH3(g)',
    temperature: { value: 298.15, unit: 'K' },
  },
  {
    kind: 'given-reaction',
    id: 'measured',
    equation: 'CH4(g) + 2 O2(g) -> CO2(g) + 2 H2O(l)',
    deltaH: { value: -890.6, uncertainty: 0.5, unit: 'kJ/mol' },
    source: 'Our bomb calorimeter, run 12',
  },
  {
    kind: 'quantities',
    id: 'batch',
    equation: 'CH4(g) + 2 O2(g) -> CO2(g) + 2 H2O(l)',
    amounts: [{ term: 0, value: 2, unit: 'mol' }],
  },
  { kind: 'derivation', id: 'hess', target: 'CO(g) + 1/2 O2(g) -> CO2(g)' },
  // Text a spreadsheet would run as a formula.
  { kind: 'note', id: 'evil', label: '=HYPERLINK("http://evil.example","x")', text: '+1+2' },
] as const;

async function makeSet() {
  const res = await member.post(setsUrl()).send({
    title: '=cmd|/c calc|!A1 Burner & feed {study}',
    description: 'Heat balance of the pilot burner',
    tags: ['burner', 'pilot'],
    items: ITEMS,
  });
  expect(res.status, JSON.stringify(res.body)).toBe(201);
  return res.body as { id: string; version: number; revision: number };
}

const binary = (
  res: { on: (e: string, f: (c?: Buffer) => void) => void },
  done: (e: Error | null, b: Buffer) => void,
) => {
  const chunks: Buffer[] = [];
  res.on('data', (c) => chunks.push(c!));
  res.on('end', () => done(null, Buffer.concat(chunks)));
};

describe('GET /api/v1/teams/:teamId/sets/:setId/export.csv', () => {
  it('writes one row per item with numbers as numbers, and neutralises formula-like text', async () => {
    const set = await makeSet();
    const res = await member.get(`${setsUrl()}/${set.id}/export.csv`);
    expect(res.status).toBe(200);
    expect(res.headers['content-type']).toContain('text/csv');
    expect(res.headers['content-disposition']).toMatch(/^attachment; filename="?[a-z0-9-]+-v1\.csv"?$/);
    const parsed = Papa.parse<Record<string, string>>(res.text.replace(/^\uFEFF/, '').trim(), { header: true });
    expect(parsed.errors).toEqual([]);
    expect(parsed.data).toHaveLength(ITEMS.length);
    const propane = parsed.data.find((r) => r.label === 'Burner feed')!;
    // Propane burnt to liquid water: ΔcH° = −2219.2 ± 0.5 kJ/mol (NIST Chemistry WebBook, propane; from memory).
    expect(Number(propane.deltaH_kJ_per_mol)).toBeCloseTo(-2219.2, -1);
    expect(propane.library_revision).toBe(String(set.revision));
    const evil = parsed.data.find((r) => r.kind === 'note')!;
    // OWASP "CSV Injection": a cell that starts with = + - @ is prefixed so it stays text.
    expect(evil.label).toBe('\'=HYPERLINK("http://evil.example","x")');
    for (const row of parsed.data)
      for (const [column, cell] of Object.entries(row)) {
        if (/^-?\d/.test(cell) && /_(kJ|K)|revision|item/.test(column)) continue;
        expect(cell, `${column}: ${cell}`).not.toMatch(/^[=+@\t\r]/);
      }
  });
});

describe('export.json and POST /api/v1/teams/:teamId/sets/import', () => {
  it('re-creates the set exactly: the same items, item by item, and the same results', async () => {
    const set = await makeSet();
    const exported = await member.get(`${setsUrl()}/${set.id}/export.json`);
    expect(exported.status).toBe(200);
    const document = JSON.parse(exported.text);
    expect(document.format).toBe('thermoledger.reaction-set');

    const imported = await member.post(`${setsUrl()}/import`).send(document);
    expect(imported.status, JSON.stringify(imported.body)).toBe(201);
    expect(imported.body.id).not.toBe(set.id);
    const original = (await member.get(`${setsUrl()}/${set.id}`)).body;
    const copy = (await member.get(`${setsUrl()}/${imported.body.id}`)).body;
    expect(copy.items).toHaveLength(original.items.length);
    original.items.forEach((item: unknown, i: number) => expect(copy.items[i]).toEqual(item));
    for (const field of ['title', 'description', 'tags', 'revision'])
      expect(copy[field], field).toEqual(original[field]);

    const again = JSON.parse((await member.get(`${setsUrl()}/${imported.body.id}/export.json`)).text);
    expect(again.set).toEqual(document.set);
    const strip = (e: { evaluatedAt?: string }) => ({ ...e, evaluatedAt: null });
    expect(strip(again.evaluation)).toEqual(strip(document.evaluation));
  });

  it('refuses a file that is not an export, naming the field, and creates nothing', async () => {
    const res = await member.post(`${setsUrl()}/import`).send({ format: 'something-else', formatVersion: 1, set: {} });
    expect(res.status).toBe(400);
    const paths = (res.body.error.details.issues as { path: string[] }[]).map((i) => i.path.join('.'));
    expect(paths).toContain('body.format');
    expect((await member.get(setsUrl())).body.total).toBe(0);
  });
});

describe('GET …/export.bib', () => {
  it('parses back with a general-purpose BibTeX parser, with the fields of every source', async () => {
    const set = await makeSet();
    const [bib, results] = await Promise.all([
      member.get(`${setsUrl()}/${set.id}/export.bib`).buffer(true).parse(binary),
      member.get(`${setsUrl()}/${set.id}/results`),
    ]);
    expect(bib.status).toBe(200);
    const sources = results.body.sources as {
      key: string;
      title: string;
      year: number | null;
      doi: string | null;
      authors: string;
    }[];
    expect(sources.length).toBeGreaterThan(0);
    expect(bib.headers['content-type']).toContain('application/x-bibtex');
    const parsed = parseBibtex((bib.body as Buffer).toString('utf8'), { sentenceCase: false });
    expect(parsed.errors).toEqual([]);
    expect(parsed.entries.map((e) => e.key).sort()).toEqual(sources.map((s) => s.key).sort());
    for (const source of sources) {
      const entry = parsed.entries.find((e) => e.key === source.key)!;
      expect(entry.fields.title, source.key).toBe(source.title);
      if (source.year !== null) expect(entry.fields.year).toBe(String(source.year));
      if (source.doi) expect(entry.fields.doi).toBe(source.doi.replace(/^https?:\/\/(dx\.)?doi\.org\//i, ''));
      const authors = (entry.fields.author ?? []) as { lastName?: string; name?: string }[];
      const expectedCount = source.authors.split(';').filter((a) => a.trim()).length;
      expect(authors).toHaveLength(expectedCount);
    }
  });
});

describe('GET …/export.pdf', () => {
  it('embeds a font with every character the report prints', () => {
    // fontkit is the font reader pdfkit itself uses; it has no typings.
    const load = createRequire(import.meta.url);
    const fontkit = load('fontkit') as { openSync(p: string): { hasGlyphForCodePoint(c: number): boolean } };
    const fontDir = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '../../server/reports/fonts');
    for (const file of ['DejaVuSans.ttf', 'DejaVuSans-Bold.ttf']) {
      const font = fontkit.openSync(path.join(fontDir, file));
      for (const char of '→⇌ΔΣ−±°½·ξ⁰¹²³⁴⁵⁶⁷⁸⁹⁺⁻₀₁₂₃₄₅₆₇₈₉₊₋')
        expect(font.hasGlyphForCodePoint(char.codePointAt(0)!), `${file} ${char}`).toBe(true);
    }
  });

  it('reads back with pdftotext: equations with arrows, ΔH with minus signs, sources, revision, cautions', async () => {
    const set = await makeSet();
    const res = await member.get(`${setsUrl()}/${set.id}/export.pdf`).buffer(true).parse(binary);
    expect(res.status).toBe(200);
    expect(res.headers['content-type']).toBe('application/pdf');
    const pdf = res.body as Buffer;
    expect(pdf.subarray(0, 5).toString()).toBe('%PDF-');
    const dir = mkdtempSync(path.join(tmpdir(), 'set-pdf-'));
    let text: string;
    try {
      writeFileSync(path.join(dir, 'set.pdf'), pdf);
      text = execFileSync('pdftotext', ['-enc', 'UTF-8', path.join(dir, 'set.pdf'), '-'], { encoding: 'utf8' });
    } finally {
      rmSync(dir, { recursive: true, force: true });
    }
    const results = (await member.get(`${setsUrl()}/${set.id}/results`)).body;
    // Typeset equations: subscript digits and both arrows.
    expect(text).toContain('C₃H₈(g) + 5 O₂(g) → 3 CO₂(g) + 4 H₂O(l)');
    expect(text).toContain('⇌ 2 NH₃(g)');
    // ΔH of propane with the minus sign U+2212 (NIST WebBook ΔcH° −2219.2 kJ/mol, from memory).
    const propane = /ΔrH°\(298\.15 K\) = −(\d+\.\d+) ± (\d+\.\d+) kJ mol⁻¹/.exec(text);
    expect(propane, text.slice(0, 3000)).not.toBeNull();
    expect(-Number(propane![1])).toBeCloseTo(-2219.2, -1);
    expect(-Number(propane![1])).toBeCloseTo(results.results[0].value.deltaH.value, 1);
    // Ammonia synthesis: 2 × ΔfH°(NH3, g) = 2 × (−45.94) = −91.88 kJ/mol (CODATA Key Values 1989; from memory).
    expect(text).toMatch(/ΔrH°\(298\.15 K\) = −91\.\d+ ± \d/);
    expect(text).not.toMatch(/= -\d/);
    expect(text).toContain(`Library revision`);
    expect(text).toContain(`${results.libraryRevision} (pinned)`);
    for (const source of results.sources as { key: string }[]) expect(text).toContain(`[${source.key}]`);
    expect(text).toContain('Cautions');
    expect(text).toContain(results.cautions[0].slice(0, 40));
    expect(text).toContain('Our bomb calorimeter, run 12');
  });
});

describe('GET …/export.pdf in the calculation workers', () => {
  /** A set whose PDF takes a while to typeset: long notes fill many pages (cheap to evaluate). */
  async function longSet(title: string) {
    const paragraph = 'Heat removal at scale depends on the jacket, the stirrer and the feed rate. '.repeat(18);
    const items = Array.from({ length: 60 }, (_, i) => ({ kind: 'note', text: `${i + 1}. ${paragraph}` }));
    const res = await member.post(setsUrl()).send({ title, items });
    expect(res.status, JSON.stringify(res.body)).toBe(201);
    return res.body as { id: string };
  }

  it('answers health checks while PDFs are being typeset', async () => {
    // Warm a worker first, so the PDFs below are typesetting (not loading) while health is asked.
    const warm = await makeSet();
    expect((await member.get(`${setsUrl()}/${warm.id}/export.pdf`)).status).toBe(200);
    const sets = await Promise.all([longSet('Long notes A'), longSet('Long notes B')]);
    const order: string[] = [];
    const pdfs = sets.map((set) =>
      member
        .get(`${setsUrl()}/${set.id}/export.pdf`)
        .buffer(true)
        .parse(binary)
        .then((res) => {
          order.push(`pdf ${res.status}`);
          return res;
        }),
    );
    const calc = t.app.locals.deps.calc;
    while (calc.inFlight === 0) await new Promise((r) => setImmediate(r));
    for (let i = 0; i < 3; i++) order.push(`health ${(await t.anon().get('/api/v1/health')).status}`);
    const stillRunning = calc.inFlight > 0;
    const replies = await Promise.all(pdfs);
    expect(stillRunning).toBe(true);
    expect(order.slice(0, 3)).toEqual(['health 200', 'health 200', 'health 200']);
    for (const res of replies) expect((res.body as Buffer).subarray(0, 5).toString()).toBe('%PDF-');
  });

  it('stops a PDF past the time budget with 503 in words and Retry-After', async () => {
    const hasty = await startTestApp({
      open: { ...t.open, close: async () => {} },
      config: { calc: { timeBudgetMs: 1 } },
    });
    try {
      const set = await makeSet();
      const agent = await hasty.signIn('member');
      const res = await agent.get(`${setsUrl()}/${set.id}/export.pdf`);
      expect(res.status).toBe(503);
      expect(res.body.error.code).toBe('unavailable');
      expect(res.body.error.message).toMatch(/PDF report did not finish within its time budget/);
      expect(res.body.error.details).toMatchObject({ limit: 'timeBudgetMs', max: 1 });
      expect(res.headers['retry-after']).toBe('1');
    } finally {
      await hasty.close();
    }
  });

  it('refuses a PDF larger than the reply limit with 413 naming the limit', async () => {
    const small = await startTestApp({
      open: { ...t.open, close: async () => {} },
      config: { calc: { limits: { maxReplyBytes: 20_000 } } },
    });
    try {
      const set = await longSet('Too long for the limit');
      const agent = await small.signIn('member');
      const res = await agent.get(`${setsUrl()}/${set.id}/export.pdf`);
      expect(res.status).toBe(413);
      expect(res.body.error.code).toBe('payload_too_large');
      expect(res.body.error.details).toMatchObject({ limit: 'replyBytes', max: 20_000 });
      expect(res.body.error.details.found).toBeGreaterThan(20_000);
    } finally {
      await small.close();
    }
  });
});

describe('exports through a share link', () => {
  it('serves the same files at /api/v1/shared/:token/export.*, without an account', async () => {
    const set = await makeSet();
    const link = (await member.post(`${setsUrl()}/${set.id}/links`).send({})).body as { token: string };
    const anon = t.anon();
    for (const format of ['csv', 'json', 'bib']) {
      const [team, shared] = await Promise.all([
        member.get(`${setsUrl()}/${set.id}/export.${format}`).buffer(true).parse(binary),
        anon.get(`/api/v1/shared/${link.token}/export.${format}`).buffer(true).parse(binary),
      ]);
      expect(shared.status).toBe(200);
      expect(shared.headers['referrer-policy']).toBe('no-referrer');
      const clean = (res: { body: unknown }) =>
        (res.body as Buffer).toString('utf8').replace(/"(exportedAt|evaluatedAt)": "[^"]+"/g, '');
      expect(clean(shared)).toBe(clean(team));
    }
    const pdf = await anon.get(`/api/v1/shared/${link.token}/export.pdf`).buffer(true).parse(binary);
    expect(pdf.status).toBe(200);
    expect((pdf.body as Buffer).subarray(0, 5).toString()).toBe('%PDF-');
  });
});
