import { SET_EXPORT_FORMAT, type SetEvaluation, type SetExport } from '@shared/schemas/reaction-sets';
import type { ServiceContext } from '../context';
import type { ReactionSetRow } from '../db/tables/index';
import { FileDownload } from '../lib/file-reply';
import { setBibtex } from '../reports/bibtex';
import { setCsv } from '../reports/set-csv';
import { evaluationOfSet } from './reaction-sets-evaluate.service';
import { resolveShareToken, weighSetWork } from './reaction-sets-links.service';
import { findSet, stateOf } from './reaction-sets.service';

/**
 * A set's results as files: CSV, JSON (which import reads back), BibTeX of its sources, and the
 * printable PDF report. The same files come from the team's routes and from a share link.
 */

export type ExportFormat = 'csv' | 'json' | 'bib' | 'pdf';

const CONTENT_TYPES: Record<ExportFormat, string> = {
  csv: 'text/csv; charset=utf-8',
  json: 'application/json; charset=utf-8',
  bib: 'application/x-bibtex; charset=utf-8',
  pdf: 'application/pdf',
};

/** A file name from the title: letters, digits and hyphens only (no header injection, no path). */
export function exportFileName(title: string, version: number, format: ExportFormat): string {
  const base =
    title
      .normalize('NFKD')
      .replace(/[^A-Za-z0-9]+/g, '-')
      .replace(/^-+|-+$/g, '')
      .slice(0, 60)
      .toLowerCase() || 'reaction-set';
  return `${base}-v${version}.${format}`;
}

/**
 * Recent PDFs by set version and the results they print: typesetting a large set takes seconds of
 * a worker, and a shared link's PDF is typically fetched by several readers. The
 * results' `evaluatedAt` is in the key, so a PDF is only reused with the very results it printed.
 */
const PDF_CACHE_SIZE = 8;
const pdfCache = new Map<string, Promise<Buffer>>();

function cachedPdf(key: string, make: () => Promise<Buffer>): Promise<Buffer> {
  let pdf = pdfCache.get(key);
  if (pdf) {
    pdfCache.delete(key);
    pdfCache.set(key, pdf);
    return pdf;
  }
  pdf = make();
  pdf.catch(() => pdfCache.delete(key));
  pdfCache.set(key, pdf);
  while (pdfCache.size > PDF_CACHE_SIZE) pdfCache.delete(pdfCache.keys().next().value as string);
  return pdf;
}

/** The certificates the set's bomb runs were calibrated against, as cited in the runs. */
function calibrantCertificates(evaluation: SetEvaluation): string[] {
  return evaluation.results.flatMap((r) =>
    r.kind === 'calorimetry-run' && r.value?.runKind === 'bomb' && r.value.result.energyEquivalent.certificate
      ? [r.value.result.energyEquivalent.certificate.citation]
      : [],
  );
}

async function fileOf(ctx: ServiceContext, set: ReactionSetRow, format: ExportFormat): Promise<FileDownload> {
  const evaluation = await evaluationOfSet(ctx, set);
  const state = stateOf(set);
  const name = exportFileName(set.title, set.version, format);
  const file = (body: Buffer | string) => new FileDownload(CONTENT_TYPES[format], name, body);
  switch (format) {
    case 'csv':
      // A byte-order mark, so spreadsheet programs read the file as UTF-8 (Δ, →, −).
      return file(`\uFEFF${setCsv(set.items, evaluation)}\r\n`);
    case 'json': {
      const document: SetExport = {
        format: SET_EXPORT_FORMAT,
        formatVersion: 1,
        exportedAt: new Date().toISOString(),
        set: { ...state, version: set.version },
        evaluation,
      };
      return file(`${JSON.stringify(document, null, 2)}\n`);
    }
    case 'bib':
      return file(
        setBibtex(
          evaluation.sources,
          { title: set.title, revision: evaluation.libraryRevision },
          calibrantCertificates(evaluation),
        ),
      );
    case 'pdf': {
      const key = `${set.id}|${set.version}|${evaluation.libraryRevision}|${evaluation.latestRevision}|${evaluation.evaluatedAt}`;
      return file(
        // Typeset in the calculation pool's workers: bounded like a calculation, off the request thread.
        await cachedPdf(key, () =>
          ctx.calc.runReport({ state, version: set.version, evaluation, generatedAt: new Date() }),
        ),
      );
    }
  }
}

/** GET /teams/:teamId/sets/:setId/export.{csv,json,bib,pdf}. A PDF weighs the set's items against the caller's budget. */
export async function exportTeamSet(
  ctx: ServiceContext,
  input: { teamId: string; setId: string; format: ExportFormat },
): Promise<FileDownload> {
  const set = await findSet(ctx.db, input.teamId, input.setId);
  if (input.format === 'pdf') await weighSetWork(ctx, set);
  return fileOf(ctx, set, input.format);
}

/** GET /shared/:token/export.{csv,json,bib,pdf}: the same files through a share link. */
export async function exportSharedSet(
  ctx: ServiceContext,
  input: { token: string; format: ExportFormat },
): Promise<FileDownload> {
  const { set } = await resolveShareToken(ctx, input.token);
  await weighSetWork(ctx, set);
  return fileOf(ctx, set, input.format);
}
