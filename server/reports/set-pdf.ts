import { readFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import PDFDocument from 'pdfkit';
import { formatEquation, formatFormula, parseEquation, parseFormula } from '@shared/chemistry/index';
import { calorimetryRunSummary } from '@shared/reaction-sets/calorimetry-summary';
import { itemLabel } from '@shared/reaction-sets/diff';
import type { Source } from '@shared/schemas/library';
import type { ItemResult, SetEvaluation, SetItem, SetState } from '@shared/schemas/reaction-sets';
import type { CalorimetryRunValue } from '@shared/schemas/reaction-sets-calorimetry';
import { kelvin, plainFigure, valueWithUncertainty } from './numbers';

/**
 * The printable report of a set as a PDF (pdfkit): title, library revision, date and cautions
 * first, then every item with its equation typeset (sub- and superscripts, → and ⇌), its values
 * with uncertainties and the sources it rests on, then the full citations. The font is DejaVu
 * Sans, embedded (subset) so every character prints and can be copied out again.
 */

const FONTS = {
  body: fileURLToPath(new URL('./fonts/DejaVuSans.ttf', import.meta.url)),
  bold: fileURLToPath(new URL('./fonts/DejaVuSans-Bold.ttf', import.meta.url)),
};
let fontData: { body: Buffer; bold: Buffer } | undefined;
function fonts() {
  return (fontData ??= { body: readFileSync(FONTS.body), bold: readFileSync(FONTS.bold) });
}

export interface SetReportInput {
  state: SetState;
  version: number;
  evaluation: SetEvaluation;
  generatedAt: Date;
}

const MUTED = '#4a4f57';
const TEXT = '#111418';
const RULE = '#b9bec6';
const PER_MOL = 'kJ mol⁻¹';

/** An equation as chemists print it; the text as typed when it cannot be read. */
export function typesetEquation(text: string): string {
  try {
    return formatEquation(parseEquation(text), 'unicode');
  } catch {
    return text;
  }
}

function typesetFormula(key: string): string {
  try {
    return formatFormula(parseFormula(key), 'unicode');
  } catch {
    return key;
  }
}

function energy(e: { value: number; uncertainty: number | null }, unit = PER_MOL): string {
  return `${valueWithUncertainty(e.value, e.uncertainty)} ${unit}`;
}

function utc(date: Date): string {
  return `${date.toISOString().slice(0, 16).replace('T', ' ')} UTC`;
}

function citation(source: Source): string {
  const where = [source.publication, source.volume].filter(Boolean).join(' ');
  const parts = [`${source.authors}.`, `${source.title}.`];
  const place = `${where}${source.pages ? `${where ? ', ' : ''}${source.pages}` : ''}${source.year ? ` (${source.year})` : ''}`;
  if (place.trim()) parts.push(`${place.trim()}.`);
  if (source.doi) parts.push(`DOI ${source.doi}.`);
  if (source.isbn) parts.push(`ISBN ${source.isbn}.`);
  if (source.url) parts.push(source.url);
  return parts.join(' ');
}

type Doc = InstanceType<typeof PDFDocument>;

class Report {
  constructor(readonly doc: Doc) {}

  get width(): number {
    return this.doc.page.width - this.doc.page.margins.left - this.doc.page.margins.right;
  }
  get left(): number {
    return this.doc.page.margins.left;
  }

  /** Starts a new page when less than `space` points are left. */
  need(space: number): void {
    if (this.doc.y + space > this.doc.page.height - this.doc.page.margins.bottom) this.doc.addPage();
  }

  heading(text: string, size = 13): void {
    this.need(size * 3);
    this.doc.moveDown(0.6).font('bold').fontSize(size).fillColor(TEXT).text(text, this.left, this.doc.y, {
      width: this.width,
    });
    this.doc.moveDown(0.25);
  }

  para(text: string, options: { size?: number; color?: string; indent?: number; font?: 'body' | 'bold' } = {}): void {
    const size = options.size ?? 10;
    this.need(size * 2);
    const indent = options.indent ?? 0;
    this.doc
      .font(options.font ?? 'body')
      .fontSize(size)
      .fillColor(options.color ?? TEXT)
      .text(text, this.left + indent, this.doc.y, { width: this.width - indent });
  }

  bullets(lines: readonly string[], size = 9.5, indent = 0): void {
    for (const line of lines) {
      this.need(size * 2.5);
      const y = this.doc.y;
      this.doc
        .font('body')
        .fontSize(size)
        .fillColor(TEXT)
        .text('•', this.left + indent, y, { width: 10 });
      this.doc.text(line, this.left + indent + 12, y, { width: this.width - indent - 12 });
      this.doc.moveDown(0.15);
    }
  }

  rule(): void {
    this.need(10);
    const y = this.doc.y + 4;
    this.doc
      .moveTo(this.left, y)
      .lineTo(this.left + this.width, y)
      .lineWidth(0.5)
      .strokeColor(RULE)
      .stroke();
    this.doc.y = y + 6;
  }

  /** A small table: column widths as fractions of the text width. */
  table(headers: string[], rows: string[][], fractions: number[]): void {
    const widths = fractions.map((f) => f * this.width);
    const draw = (cells: string[], font: 'body' | 'bold') => {
      this.doc.font(font).fontSize(8.5);
      const height = Math.max(...cells.map((c, i) => this.doc.heightOfString(c, { width: widths[i]! - 6 })));
      this.need(height + 6);
      const y = this.doc.y;
      let x = this.left;
      cells.forEach((c, i) => {
        this.doc.fillColor(font === 'bold' ? MUTED : TEXT).text(c, x, y, { width: widths[i]! - 6 });
        x += widths[i]!;
      });
      this.doc.y = y + height + 3;
    };
    draw(headers, 'bold');
    for (const r of rows) draw(r, 'body');
    this.doc.x = this.left;
  }
}

function temperatureWords(t: number): string {
  return `${kelvin(t)} K`;
}

function writeItem(report: Report, item: SetItem, result: ItemResult | undefined, position: number, revision: number) {
  report.heading(`${position}. ${itemLabel(item)}`, 11);
  if (result?.error) {
    if ('equation' in item && typeof item.equation === 'string')
      report.para(typesetEquation(item.equation), { size: 11 });
    if (item.kind === 'derivation') report.para(typesetEquation(item.target), { size: 11 });
    report.para(`Not evaluated at library revision ${revision}: ${result.error.message}`, { size: 9.5, color: MUTED });
    return;
  }
  switch (item.kind) {
    case 'reaction': {
      const r = result?.kind === 'reaction' ? result.value : null;
      if (!r) return;
      report.para(typesetEquation(item.equation.includes('<=>') ? item.equation : r.equation), { size: 12 });
      report.doc.moveDown(0.2);
      report.para(`ΔrH°(${temperatureWords(r.temperature)}) = ${energy(r.deltaH)}`, { font: 'bold' });
      if (r.deltaH298 && Math.abs(r.temperature - 298.15) > 0.005)
        report.para(`ΔrH°(298.15 K) = ${energy(r.deltaH298)}`);
      report.para(
        r.uncertaintyComplete
          ? 'Uncertainties are standard uncertainties (k = 1), combined as independent inputs.'
          : `Incomplete uncertainty: no stated uncertainty for ${r.uncertaintyMissing.join(', ')}; the ± covers the other inputs only.`,
        { size: 8.5, color: MUTED },
      );
      report.doc.moveDown(0.3);
      report.table(
        ['Species', 'ν', `ΔfH° / ${PER_MOL}`, 'Source', 'Provenance'],
        r.terms.map((t) => [
          typesetFormula(t.key),
          `${t.side === 'reactant' ? '−' : ''}${t.coefficient}`,
          t.deltaFH ? valueWithUncertainty(t.deltaFH.value, t.deltaFH.uncertainty) : 'from its model at T',
          t.source ?? '—',
          t.provenance === 'memory' ? 'typed from memory' : (t.provenance ?? '—'),
        ]),
        [0.28, 0.08, 0.26, 0.2, 0.18],
      );
      if (r.warnings.length > 0)
        report.bullets(
          r.warnings.map((w) => w.message),
          8.5,
        );
      return;
    }
    case 'given-reaction': {
      const g = result?.kind === 'given-reaction' ? result.value : null;
      if (!g) return;
      report.para(typesetEquation(item.equation), { size: 12 });
      report.doc.moveDown(0.2);
      report.para(`ΔH (given, ${temperatureWords(g.temperature)}) = ${energy(g.given)}`, { font: 'bold' });
      report.para(`Source of the given value: ${g.source ?? 'not stated'}`, { size: 9.5 });
      report.para(
        g.library
          ? `The library gives ΔrH° = ${energy(g.library)} for the same equation at this revision.`
          : `No library value to compare: ${g.libraryProblem ?? 'not evaluated'}`,
        { size: 9.5, color: MUTED },
      );
      return;
    }
    case 'derivation': {
      const d = result?.kind === 'derivation' ? result.value : null;
      if (!d) return;
      report.para(typesetEquation(d.target), { size: 12 });
      report.doc.moveDown(0.2);
      if (d.deltaH) {
        const basis =
          d.basis === 'chosen-route'
            ? `the chosen route (ranked ${d.route!.rank + 1} of ${d.routes})`
            : d.basis === 'combined'
              ? `combined over the agreeing routes (${d.routes} found)`
              : 'the best-ranked route';
        report.para(`ΔrH°(298.15 K) = ${energy(d.deltaH)} by Hess's law, from ${basis}`, { font: 'bold' });
      } else report.para('No route reaches the target with the reactions available.', { font: 'bold' });
      if (d.route) {
        report.doc.moveDown(0.2);
        report.table(
          ['×', 'Reaction', `ΔH / ${PER_MOL}`, 'Source'],
          d.route.steps.map((s) => [
            s.multiplier.replace(/^-/, '−'),
            typesetEquation(s.equation),
            valueWithUncertainty(s.deltaH.value, s.deltaH.uncertainty),
            s.source ?? (s.kind === 'given' ? 'given with the derivation' : '—'),
          ]),
          [0.08, 0.5, 0.2, 0.22],
        );
      }
      if (d.warnings.length > 0)
        report.bullets(
          d.warnings.map((w) => w.message),
          8.5,
        );
      return;
    }
    case 'quantities': {
      const q = result?.kind === 'quantities' ? result.value : null;
      if (!q) return;
      report.para(typesetEquation(q.equation), { size: 12 });
      report.doc.moveDown(0.2);
      const words =
        q.direction === 'released' ? 'Heat released' : q.direction === 'absorbed' ? 'Heat absorbed' : 'Net heat';
      report.para(
        `${words}: ${valueWithUncertainty(Math.abs(q.heat.value), q.heat.uncertainty)} kJ (Q = ξ·ΔrH = ${valueWithUncertainty(q.heat.value, q.heat.uncertainty)} kJ)`,
        { font: 'bold' },
      );
      report.para(
        `ΔrH°(${temperatureWords(q.temperature)}) = ${energy(q.deltaH)}; extent ξ = ${plainFigure(q.extent)} mol; limiting: ${typesetFormula(q.limiting)}`,
      );
      if (q.adiabaticRise !== null)
        report.para(`Adiabatic temperature rise (screening estimate only): ${plainFigure(q.adiabaticRise, 3)} K`);
      report.bullets(q.cautions, 8.5);
      return;
    }
    case 'note':
      report.para(item.text || '(empty note)', { size: 10 });
      return;
    case 'calorimetry-run': {
      const c = result?.kind === 'calorimetry-run' ? result.value : null;
      if (!c) return;
      writeCalorimetryRun(report, item, c);
      return;
    }
  }
}

/** A calorimetry run: its ΔH with uncertainty, the method, each correction applied or not, the run's cautions. */
function writeCalorimetryRun(
  report: Report,
  item: Extract<SetItem, { kind: 'calorimetry-run' }>,
  c: CalorimetryRunValue,
): void {
  report.para(typesetEquation(c.equation), { size: 12 });
  report.doc.moveDown(0.2);
  if (c.runKind === 'constant-pressure') {
    const r = c.result;
    report.para(`ΔH = ${energy(r.deltaH)} per mole of reaction as written (measured)`, { font: 'bold' });
    report.para(
      `q = ${valueWithUncertainty(r.q.value, r.q.uncertainty)} kJ; corrected ΔT = ${valueWithUncertainty(r.deltaT.value, r.deltaT.uncertainty)} K; extent ξ = ${plainFigure(r.extent.value)} mol (limiting ${typesetFormula(r.limiting.species)})`,
    );
    report.para(r.basis, { size: 9.5 });
  } else {
    const r = c.result;
    report.para(`ΔcH° = ${energy(r.deltaCH)} of the sample (measured)`, { font: 'bold' });
    report.para(
      `ΔcU = ${energy(r.deltaCU)}; massic energy ${valueWithUncertainty(r.massicEnergy.value, r.massicEnergy.uncertainty)} J g⁻¹; energy equivalent ε = ${valueWithUncertainty(r.energyEquivalent.value, r.energyEquivalent.uncertainty)} J K⁻¹`,
    );
    report.para(
      r.deltaFH
        ? `ΔfH° of the sample by Hess's law = ${energy(r.deltaFH)}, with ${r.auxiliary.map((a) => `ΔfH°(${typesetFormula(a.key)}) [${a.source.key}]`).join(', ')} at library revision ${r.libraryRevision ?? '—'}`
        : 'ΔfH° of the sample: not derived (a product value is missing from the library).',
    );
    if (r.energyEquivalent.certificate)
      report.para(`Calibrant certificate: ${r.energyEquivalent.certificate.citation}`, { size: 9.5 });
  }
  const summary = calorimetryRunSummary(item.inputs, c);
  report.para(`Method: ${summary.method}`, { size: 9.5 });
  report.para(
    c.result.uncertaintyMethod ? `Uncertainty: ${c.result.uncertaintyMethod}` : 'Uncertainty: standard (k = 1).',
    { size: 8.5, color: MUTED },
  );
  report.doc.moveDown(0.2);
  report.table(
    ['Correction', 'Applied', 'Detail'],
    summary.corrections.map((line) => [line.name, line.applied ? 'applied' : 'not applied', line.detail]),
    [0.3, 0.14, 0.56],
  );
  if (item.evidence) report.para(`Readings file: ${item.evidence.fileName}`, { size: 9, color: MUTED });
  if (item.note) report.para(item.note, { size: 9.5 });
  if (c.result.warnings.length > 0)
    report.bullets(
      c.result.warnings.map((w) => w.message),
      8.5,
    );
  report.bullets(c.result.cautions, 8.5);
}

/** The report as PDF bytes. */
export function setPdf(input: SetReportInput): Promise<Buffer> {
  const { state, evaluation } = input;
  const doc = new PDFDocument({
    size: 'A4',
    margins: { top: 56, bottom: 64, left: 56, right: 56 },
    bufferPages: true,
    info: {
      Title: state.title,
      Subject: `Reaction set, library revision ${evaluation.libraryRevision}`,
      Creator: 'Thermoledger',
      CreationDate: input.generatedAt,
    },
  });
  const { body, bold } = fonts();
  doc.registerFont('body', body);
  doc.registerFont('bold', bold);
  const chunks: Buffer[] = [];
  doc.on('data', (c: Buffer) => chunks.push(c));
  const done = new Promise<Buffer>((resolve, reject) => {
    doc.on('end', () => resolve(Buffer.concat(chunks)));
    doc.on('error', reject);
  });

  const report = new Report(doc);
  doc.font('body').fontSize(8.5).fillColor(MUTED).text('Thermoledger · reaction set report');
  doc.moveDown(0.3);
  doc.font('bold').fontSize(18).fillColor(TEXT).text(state.title);
  if (state.description.trim()) {
    doc.moveDown(0.3);
    report.para(state.description, { size: 10 });
  }
  doc.moveDown(0.5);
  const revisionWords =
    state.revision === 'latest'
      ? `${evaluation.libraryRevision} (the set follows the newest revision)`
      : evaluation.latestRevision > evaluation.libraryRevision
        ? `${evaluation.libraryRevision} (pinned; the newest is ${evaluation.latestRevision})`
        : `${evaluation.libraryRevision} (pinned)`;
  report.table(
    ['Library revision', 'Set version', 'Generated', 'Items'],
    [[revisionWords, String(input.version), utc(input.generatedAt), String(state.items.length)]],
    [0.4, 0.15, 0.3, 0.15],
  );
  if (state.tags.length > 0) report.para(`Tags: ${state.tags.join(', ')}`, { size: 9, color: MUTED });

  report.heading('Cautions');
  report.bullets(evaluation.cautions);

  report.heading('Results');
  report.para(
    `Energies in ${PER_MOL} per mole of reaction as written, ΔH < 0 when heat is released; ± is the standard uncertainty (k = 1).`,
    { size: 8.5, color: MUTED },
  );
  const byId = new Map(evaluation.results.map((r) => [r.itemId, r]));
  state.items.forEach((item, i) => {
    if (i > 0) report.rule();
    writeItem(report, item, byId.get(item.id), i + 1, evaluation.libraryRevision);
  });

  report.heading('Sources');
  if (evaluation.sources.length === 0) report.para('No library source is used.', { size: 9.5, color: MUTED });
  evaluation.sources.forEach((s) => {
    report.need(40);
    report.para(`[${s.key}] ${citation(s)}`, { size: 9 });
    if (s.note) report.para(s.note, { size: 8, color: MUTED, indent: 12 });
    doc.moveDown(0.3);
  });

  // Footers once the page count is known.
  const range = doc.bufferedPageRange();
  for (let i = range.start; i < range.start + range.count; i++) {
    doc.switchToPage(i);
    const bottom = doc.page.margins.bottom;
    doc.page.margins.bottom = 0;
    doc
      .font('body')
      .fontSize(7.5)
      .fillColor(MUTED)
      .text(
        `${state.title} · library revision ${evaluation.libraryRevision} · ${utc(input.generatedAt)} · page ${i + 1} of ${range.count}`,
        doc.page.margins.left,
        doc.page.height - 40,
        { width: report.width, align: 'center', lineBreak: false },
      );
    doc.page.margins.bottom = bottom;
  }
  doc.end();
  return done;
}
