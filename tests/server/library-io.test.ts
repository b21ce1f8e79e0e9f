import Papa from 'papaparse';
import writeXlsxFile from 'write-excel-file/node';
import { afterAll, beforeAll, beforeEach, describe, expect, it } from 'vitest';
import type { LibraryExport } from '@shared/schemas/library-io';
import { acceptEntries } from './amendment-helpers';
import { startTestApp, type TestApp } from './helpers';

let t: TestApp;
beforeAll(async () => {
  t = await startTestApp();
}, 60_000);
afterAll(async () => t?.close());
beforeEach(async () => t.reset());

const valuesHeader =
  'species,property,value,unit,uncertainty_kind,uncertainty,k,source,table,entry_note,provenance,pressure_bar,ion_convention,note';

async function importFiles(files: { name: string; text: string | Buffer }[], wait = true) {
  const member = await t.signIn('member');
  let req = member.post(`/api/v1/amendments/imports?wait=${wait}`).field('title', 'Imported values');
  for (const f of files) req = req.attach('files', Buffer.from(f.text), f.name);
  return req;
}

async function exportJson(revision?: number): Promise<LibraryExport> {
  const res = await t.anon().get(`/api/v1/library/export.json${revision ? `?revision=${revision}` : ''}`);
  expect(res.status).toBe(200);
  return res.body as LibraryExport;
}

async function amendmentCount(): Promise<number> {
  const res = await (await t.signIn('member')).get('/api/v1/amendments?author=me');
  return (res.body.items ?? res.body.amendments ?? []).length as number;
}

describe('import', () => {
  it('reports every bad row by line, column and reason, and creates nothing', async () => {
    const before = await amendmentCount();
    const csv = [
      valuesHeader,
      'CO2(g),dfH298,-393.1,kJ/mol,standard,0.2,,codata-1989,,,entered,1,,',
      'CO2(g),dfH298,minus four,kJ/mol,standard,0.2,,codata-1989,,,entered,1,,',
      'CO2(g),dfH999,-393.1,kJ/mol,standard,0.2,,codata-1989,,,entered,1,,',
      'CO2(g),dfH298,-393.1,kJ/mol,sometimes,0.2,,codata-1989,,,entered,1,,',
      'NoSuchThing(g),dfH298,-1,kJ/mol,standard,0.2,,codata-1989,,,entered,1,,',
    ].join('\n');
    const res = await importFiles([{ name: 'values.csv', text: csv }]);
    expect(res.status).toBe(400);
    const problems = res.body.error.details.report.problems as { line: number; column: string; reason: string }[];
    const at = (line: number) => problems.filter((p) => p.line === line).map((p) => p.column);
    expect(at(2)).toEqual([]);
    expect(at(3)).toContain('value');
    expect(at(4)).toContain('property');
    expect(at(5)).toContain('uncertainty_kind');
    // Found when the rows that parse are checked against the library, in the same report.
    expect(at(6)).toEqual(['species']);
    expect(problems.every((p) => p.reason.length > 0)).toBe(true);
    expect(await amendmentCount()).toBe(before);

    const unknown = await importFiles([{ name: 'values.csv', text: [valuesHeader, csv.split('\n')[5]].join('\n') }]);
    expect(unknown.status).toBe(400);
    expect(unknown.body.error.details.report.problems).toEqual([
      expect.objectContaining({ file: 'values.csv', line: 2, column: 'species' }),
    ]);
    expect(await amendmentCount()).toBe(before);
  });

  it('refuses a file whose content is not CSV, XLSX or JSON (415) and one over the row limit (413)', async () => {
    const png = Buffer.from(
      '89504e470d0a1a0a0000000d49484452000000010000000108060000001f15c4890000000d4944415478da63f8cfc0f01f0005000201a5d4e1b20000000049454e44ae426082',
      'hex',
    );
    const notCsv = await importFiles([{ name: 'values.csv', text: png }]);
    expect(notCsv.status).toBe(415);
    const rows = Array.from(
      { length: 20_001 },
      () => 'CO2(g),dfH298,-393.1,kJ/mol,standard,0.2,,codata-1989,,,entered,1,,',
    );
    const big = await importFiles([{ name: 'big.csv', text: [valuesHeader, ...rows].join('\n') }]);
    expect(big.status).toBe(413);
  });

  it('reads an XLSX workbook (numbers as cells) and names a bad row by its sheet row', async () => {
    const header = valuesHeader.split(',').map((value) => ({ value }));
    const row = (property: string, value: number) =>
      [
        'CO2(g)',
        property,
        value,
        'kJ/mol',
        'standard',
        0.2,
        null,
        'codata-1989',
        null,
        null,
        'entered',
        1,
        null,
        null,
      ].map((v) => (v === null ? null : { value: v }));
    const workbook = (rows: ReturnType<typeof row>[]) => writeXlsxFile([header, ...rows]).toBuffer();
    const bad = await importFiles([
      { name: 'values.xlsx', text: await workbook([row('dfH298', -393.3), row('dfH', -393.3)]) },
    ]);
    expect(bad.status).toBe(400);
    expect(bad.body.error.details.report.problems).toEqual([
      expect.objectContaining({ file: expect.stringContaining('values.xlsx'), line: 3, column: 'property' }),
    ]);
    const good = await importFiles([{ name: 'values.xlsx', text: await workbook([row('dfH298', -393.3)]) }]);
    expect(good.status, JSON.stringify(good.body).slice(0, 500)).toBe(201);
    const amendment = await (await t.signIn('member')).get(`/api/v1/amendments/${good.body.amendmentId}?impact=false`);
    expect(amendment.body.entries[0]).toMatchObject({ kind: 'revise-value', deltaFH: { value: -393.3 } });
  });

  it('runs as a job whose progress and outcome can be read', async () => {
    const csv = [valuesHeader, 'CO2(g),dfH298,-393.2,kJ/mol,standard,0.2,,codata-1989,,,entered,1,,'].join('\n');
    const started = await importFiles([{ name: 'values.csv', text: csv }], false);
    expect(started.status).toBe(202);
    const member = await t.signIn('member');
    let job = started.body;
    for (let i = 0; i < 100 && job.state === 'running'; i++) {
      await new Promise((r) => setTimeout(r, 50));
      job = (await member.get(`/api/v1/amendments/imports/${started.body.jobId}`)).body;
    }
    expect(job).toMatchObject({ state: 'done', rowsRead: 1, rowsTotal: 1 });
    const amendment = await member.get(`/api/v1/amendments/${job.amendmentId}?impact=false`);
    expect(amendment.body).toMatchObject({ state: 'draft', entryCount: 1, origin: { kind: 'import' } });
    // Another user cannot read the job.
    const other = await (await t.signIn('curator')).get(`/api/v1/amendments/imports/${started.body.jobId}`);
    expect(other.status).toBe(404);
  });

  it('tells the import page its limits and the columns of each table, from the server settings', async () => {
    const member = await t.signIn('member');
    const res = await member.get('/api/v1/amendments/imports/limits');
    expect(res.status).toBe(200);
    expect(res.body.maxFileBytes).toBe(t.config.evidence.maxFileBytes);
    expect(res.body.maxFiles).toBe(t.config.evidence.maxFilesPerUpload);
    expect(res.body.maxRows).toBe(20_000);
    // The values header of seeds/library/FORMAT.md, plus `selected` of our CSV export.
    expect(res.body.tables.values.columns).toEqual([...valuesHeader.split(','), 'selected']);
    expect(res.body.tables.selections.required).toEqual(['species', 'property', 'source', 'reason']);
    expect((await t.anon().get('/api/v1/amendments/imports/limits')).status).toBe(401);
  });

  it('imports a 10,000-row CSV into one amendment', async () => {
    const library = await exportJson();
    const species = library.species.filter((s) => s.referenceState === null).slice(0, 1_000);
    const sources = library.sources.slice(0, 5).map((s) => s.key);
    expect(species.length).toBe(1_000);
    const rows: string[] = [valuesHeader];
    for (const source of sources)
      for (const [i, s] of species.entries()) {
        rows.push(
          Papa.unparse([
            [s.key, 'dfH298', `-${100 + i}.5`, 'kJ/mol', 'standard', '0.3', '', source, '', '', 'entered', '1', '', ''],
          ]),
        );
        rows.push(
          Papa.unparse([
            [s.key, 'S298', `${50 + i}.25`, 'J/(mol K)', 'standard', '0.5', '', source, '', '', 'entered', '1', '', ''],
          ]),
        );
      }
    expect(rows.length - 1).toBe(10_000);
    const res = await importFiles([{ name: 'ten-thousand.csv', text: rows.join('\r\n') }]);
    expect(res.status, JSON.stringify(res.body).slice(0, 500)).toBe(201);
    expect(res.body).toMatchObject({ state: 'done', rowsRead: 10_000, rowsTotal: 10_000 });
    const amendment = await (await t.signIn('member')).get(`/api/v1/amendments/${res.body.amendmentId}?impact=false`);
    expect(amendment.body.entryCount).toBe(10_000);
  }, 240_000);
});

describe('export', () => {
  it('neutralises a formula-injection cell and keeps negative numbers numbers', async () => {
    const attack = '=HYPERLINK("http://example.invalid","x")';
    await acceptEntries(t, [
      {
        kind: 'revise-value',
        species: 'CO2(g)',
        deltaFH: { value: -393.45, uncertainty: 0.1 },
        source: { citation: 'A. Tester, J. Test Thermochem. 1 (2026) 1.', key: 'test-injection' },
        provenanceNote: attack,
        entryNote: '@SUM(1+1)',
      },
    ]);
    const res = await t.anon().get('/api/v1/library/export.csv');
    expect(res.status).toBe(200);
    expect(res.headers['content-type']).toMatch(/^text\/csv/);
    const parsed = Papa.parse<Record<string, string>>(res.text, { header: true, skipEmptyLines: true });
    const row = parsed.data.find((r) => r.species === 'CO2(g)' && r.source === 'test-injection')!;
    expect(row.note).toBe(`'${attack}`);
    expect(row.entry_note).toBe("'@SUM(1+1)");
    expect(row.value).toBe('-393.45');
    // Raw text: the negative number is written bare, not quoted or prefixed.
    expect(res.text).toMatch(/,-393\.45,/);
    // No cell anywhere starts with a formula character unless it is a plain number.
    for (const r of parsed.data)
      for (const cell of Object.values(r))
        if (/^[=+\-@\t\r]/.test(cell)) expect(cell).toMatch(/^-?(\d+(\.\d*)?|\.\d+)([eE][+-]?\d+)?$/);
  });

  it('answers 404 for a revision that does not exist', async () => {
    const res = await t.anon().get('/api/v1/library/export.json?revision=999');
    expect(res.status).toBe(404);
  });

  it('re-imports the JSON export as an amendment that restores the same values, selections and sources', async () => {
    // The newest revision: earlier tests of this file may have added rows (the library is not reset),
    // and an import adds and revises rows but removes none.
    const original = await exportJson();
    // Change the library: revise a selected value and select another value.
    const selected = original.selections.find((s) => s.property === 'dfH298' && s.species === 'CO2(g)')!;
    const value = original.values.find(
      (v) => v.species === 'CO2(g)' && v.property === 'dfH298' && v.source === selected.source,
    )!;
    const other = original.values.find(
      (v) =>
        v.species === 'H2O(l)' &&
        v.property === 'dfH298' &&
        original.selections.every((s) => !(s.species === 'H2O(l)' && s.property === 'dfH298' && s.source === v.source)),
    )!;
    const changed = await acceptEntries(t, [
      {
        kind: 'revise-value',
        species: 'CO2(g)',
        deltaFH: { value: Number(value.value) + 1, uncertainty: null },
        stated: { kind: 'none', value: null },
        source: { key: value.source },
      },
      {
        kind: 'select-value',
        species: 'H2O(l)',
        property: 'dfH298',
        source: { key: other.source },
        reason: 'A test change.',
      },
    ]);
    const between = await exportJson(changed.revision);
    expect(between.values).not.toEqual(original.values);

    const imported = await importFiles([{ name: 'library.json', text: JSON.stringify(original) }]);
    expect(imported.status, JSON.stringify(imported.body).slice(0, 800)).toBe(201);
    const member = await t.signIn('member');
    expect((await member.post(`/api/v1/amendments/${imported.body.amendmentId}/open`).send({})).status).toBe(200);
    const accepted = await (
      await t.signIn('curator')
    )
      .post(`/api/v1/amendments/${imported.body.amendmentId}/accept`)
      .send({});
    expect(accepted.status, JSON.stringify(accepted.body).slice(0, 800)).toBe(200);
    const restored = await exportJson(accepted.body.resultRevision);
    expect(restored.revision).toBeGreaterThan(changed.revision);
    expect(restored.values).toEqual(original.values);
    expect(restored.selections).toEqual(original.selections);
    expect(restored.sources).toEqual(original.sources);
  }, 240_000);
});
