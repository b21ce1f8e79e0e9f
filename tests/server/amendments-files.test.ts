import { readdirSync, readFileSync } from 'node:fs';
import type TestAgent from 'supertest/lib/agent';
import { afterAll, beforeAll, describe, expect, it, vi } from 'vitest';
import { startTestApp, type TestApp } from './helpers';

// Every test drives several requests (acceptances plan and write whole revisions): room for a loaded machine.
vi.setConfig({ testTimeout: 120_000 });

/** Evidence files: POST/GET/DELETE /api/v1/amendments/:id/files. Limits made small for the test. */
let t: TestApp;
let member: TestAgent;
let curator: TestAgent;
let amendmentId: string;

const MAX_BYTES = 64 * 1024;

// A minimal PDF (the %PDF- signature is what identifies it; PDF 1.7, ISO 32000-1 §7.5.2).
const pdf = Buffer.from(
  '%PDF-1.4\n1 0 obj << /Type /Catalog /Pages 2 0 R >> endobj\n2 0 obj << /Type /Pages /Kids [] /Count 0 >> endobj\ntrailer << /Root 1 0 R >>\n%%EOF\n',
);
// A PNG: its 8-byte signature and an IHDR chunk header (PNG spec, §5.2).
const png = Buffer.concat([
  Buffer.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a, 0, 0, 0, 13]),
  Buffer.from('IHDR'),
  Buffer.alloc(17),
]);
// An ELF executable header (0x7F "ELF", 64-bit, little-endian) and a Windows "MZ" executable.
const elf = Buffer.concat([Buffer.from([0x7f, 0x45, 0x4c, 0x46, 2, 1, 1, 0]), Buffer.alloc(120)]);
const exe = Buffer.concat([Buffer.from('MZ'), Buffer.alloc(200, 0x90)]);
const csv = Buffer.from('species,value,uncertainty\nCO2(g),-393.47,0.05\n');

beforeAll(async () => {
  t = await startTestApp({
    config: { evidence: { maxFileBytes: MAX_BYTES, maxFilesPerUpload: 2, maxFilesPerAmendment: 3 } },
  });
  [member, curator] = await Promise.all([t.signIn('member'), t.signIn('curator')]);
  const created = await member.post('/api/v1/amendments').send({
    title: 'With evidence',
    rationale: 'The attached report.',
    entries: [
      {
        kind: 'revise-value',
        species: 'CO2(g)',
        deltaFH: { value: -393.45, uncertainty: 0.1 },
        source: { key: 'codata-1989' },
      },
    ],
  });
  amendmentId = created.body.id;
}, 180_000);
afterAll(async () => t?.close());

const filesUrl = () => `/api/v1/amendments/${amendmentId}/files`;

describe('POST /api/v1/amendments/:id/files', () => {
  it('stores a PDF and a CSV, types read from content, and sends them back as attachments with nosniff', async () => {
    const res = await member
      .post(filesUrl())
      .attach('files', pdf, { filename: 'calorimetry report.pdf', contentType: 'text/html' })
      .attach('files', csv, { filename: 'runs.csv', contentType: 'application/octet-stream' });
    expect(res.status).toBe(201);
    const items = res.body.items as { id: string; name: string; mediaType: string; href: string }[];
    const report = items.find((f) => f.name.endsWith('.pdf'));
    const runs = items.find((f) => f.name.endsWith('.csv'));
    expect(report).toMatchObject({ name: 'calorimetry report.pdf', mediaType: 'application/pdf' });
    expect(runs).toMatchObject({ name: 'runs.csv', mediaType: 'text/csv' });

    // Still a draft: only its author sees it, and its files.
    const download = await member
      .get(report!.href)
      .buffer(true)
      .parse((r, done) => {
        const chunks: Buffer[] = [];
        r.on('data', (c: Buffer) => chunks.push(c));
        r.on('end', () => done(null, Buffer.concat(chunks)));
      });
    expect(download.status).toBe(200);
    expect(download.headers['content-disposition']).toMatch(/^attachment; filename="calorimetry report.pdf"/);
    expect(download.headers['x-content-type-options']).toBe('nosniff');
    expect(download.headers['content-type']).toMatch(/^application\/pdf/);
    expect(Buffer.compare(download.body as Buffer, pdf)).toBe(0);

    const detail = await curator.get(`/api/v1/amendments/${amendmentId}`).query({ impact: 'false' });
    expect(detail.status).toBe(404); // still a draft: the curator cannot see it
    const own = await member.get(`/api/v1/amendments/${amendmentId}`).query({ impact: 'false' });
    expect(own.body.files.map((f: { name: string }) => f.name).sort()).toEqual(['calorimetry report.pdf', 'runs.csv']);
  });

  it('refuses a renamed executable and binary data posing as CSV (415, naming the file); nothing is stored', async () => {
    const before = readdirSync(t.config.evidence.dir).length;
    for (const [bytes, name] of [
      [elf, 'report.pdf'],
      [exe, 'photo.png'],
      [Buffer.from([0x41, 0x00, 0x42, 0x0a]), 'data.csv'],
      [Buffer.from([0xc3, 0x28, 0x0a]), 'latin.csv'],
    ] as const) {
      const res = await member
        .post(filesUrl())
        .attach('files', bytes, { filename: name, contentType: 'application/pdf' });
      expect(res.status).toBe(415);
      expect(res.body.error.code).toBe('unsupported_media_type');
      expect(res.body.error.message).toContain(name);
    }
    expect(readdirSync(t.config.evidence.dir)).toHaveLength(before);
  });

  it('answers 413 for a file over the size limit, too many files at once, and too many on one amendment', async () => {
    const big = Buffer.concat([pdf, Buffer.alloc(MAX_BYTES, 0x20)]);
    const tooBig = await member.post(filesUrl()).attach('files', big, 'big.pdf');
    expect(tooBig.status).toBe(413);
    expect(tooBig.body.error.message).toMatch(/larger than 0\.1 MB|larger than 0\.06 MB|larger than/);
    expect(tooBig.body.error.details).toMatchObject({ limit: 'fileSize', max: MAX_BYTES });

    const three = await member
      .post(filesUrl())
      .attach('files', png, 'a.png')
      .attach('files', png, 'b.png')
      .attach('files', png, 'c.png');
    expect(three.status).toBe(413);
    expect(three.body.error.details).toMatchObject({ limit: 'files', max: 2 });

    // Two stored already; one more fits, the next does not.
    expect((await member.post(filesUrl()).attach('files', png, 'a.png')).status).toBe(201);
    const fourth = await member.post(filesUrl()).attach('files', png, 'd.png');
    expect(fourth.status).toBe(413);
    expect(fourth.body.error.details).toMatchObject({ limit: 'filesPerAmendment', max: 3 });
  });

  it('answers 415 for a JSON body and lets only the author attach', async () => {
    expect((await member.post(filesUrl()).send({ files: [] })).status).toBe(415);
    // The curator cannot see the draft (404); once open, may read but not attach (403).
    await member.post(`/api/v1/amendments/${amendmentId}/open`).send({});
    expect((await curator.post(filesUrl()).attach('files', png, 'x.png')).status).toBe(403);
    expect((await curator.get(filesUrl())).status).toBe(200);
    expect((await t.signIn('viewer').then((v) => v.get(filesUrl()))).status).toBe(200);
    expect((await t.anon().get(filesUrl())).status).toBe(401);
  });

  it('keeps files under random names outside anything served, never at a guessable path', async () => {
    const stored = readdirSync(t.config.evidence.dir);
    expect(stored.length).toBeGreaterThan(0);
    for (const name of stored) {
      expect(name).toMatch(/^[0-9a-f]{32}$/);
      const list = await member.get(filesUrl());
      expect(JSON.stringify(list.body)).not.toContain(name);
      for (const guess of [
        `/${name}`,
        `/evidence/${name}`,
        `/data/evidence/${name}`,
        `/api/v1/files/${name}`,
        `/api/v1/amendments/${amendmentId}/files/${name}`,
      ]) {
        const res = await member.get(guess);
        expect(res.status, guess).toBeGreaterThanOrEqual(400);
      }
      for (const guess of ['/calorimetry%20report.pdf', '/runs.csv', '/evidence/runs.csv']) {
        expect((await member.get(guess)).status).toBeGreaterThanOrEqual(400);
      }
    }
    // What is stored is exactly what was uploaded, nothing of the name on disk.
    const bytes = stored.map((n) => readFileSync(`${t.config.evidence.dir}/${n}`));
    expect(bytes.some((b) => b.equals(pdf))).toBe(true);
  });

  it('removes a file for its author, and keeps files once the amendment is decided', async () => {
    const list = await member.get(filesUrl());
    const last = list.body.items.at(-1) as { href: string };
    expect((await member.delete(last.href)).status).toBe(204);
    expect((await member.get(last.href)).status).toBe(404);
    const declined = await curator.post(`/api/v1/amendments/${amendmentId}/decline`).send({ reason: 'Test decline.' });
    expect(declined.status).toBe(200);
    const late = await member.post(filesUrl()).attach('files', png, 'late.png');
    expect(late.status).toBe(409);
    expect(late.body.error.details.state).toBe('declined');
  });
});
