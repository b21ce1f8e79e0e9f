import { randomUUID } from 'node:crypto';
import type { AmendmentEntry } from '@shared/schemas/amendments';
import {
  libraryExportSchema,
  MAX_IMPORT_ROWS,
  type ImportJob,
  type ImportProblem,
  type ImportReport,
  type LibraryExport,
} from '@shared/schemas/library-io';
import type { ActorContext, ServiceContext } from '../context';
import { AppError } from '../errors';
import { detectEvidenceType } from '../amendments/evidence-type';
import { planEntries } from '../amendments/plan';
import { libraryExport, valuesCsv } from '../library-io/export-library';
import { readCsv, readXlsx, type ReadTable } from '../library-io/read-table';
import { exportToTables, tableOf, tablesToEntries, type EntryOrigin } from '../library-io/rows-to-entries';
import { createAmendment } from './amendments.service';
import { snapshotFor } from './library.service';
import type { LibrarySnapshot } from '../library/snapshot';
import type { UploadedFile } from './amendment-files.service';

/**
 * Bulk import of library tables (CSV, XLSX, or the JSON export) into one draft amendment, run as
 * a job whose progress can be read; and the export of the library at a revision.
 */

// ——— Jobs ———

interface JobRecord {
  job: ImportJob;
  ownerId: string;
  finished: Promise<void>;
  expiresAt: number;
}

/** Jobs live in this process's memory for an hour after they start: enough to read the outcome. */
const JOB_LIFETIME_MS = 60 * 60 * 1000;
const jobs = new Map<string, JobRecord>();

function sweepJobs(now = Date.now()): void {
  for (const [id, record] of jobs) if (record.expiresAt < now) jobs.delete(id);
}

// ——— Reading the upload ———

function problemsError(report: ImportReport): AppError {
  const first = report.problems
    .slice(0, 3)
    .map(
      (p) =>
        `${p.file}${p.line === null ? '' : ` line ${p.line}`}${p.column ? `, column ${p.column}` : ''}: ${p.reason}`,
    )
    .join('; ');
  const more = report.problems.length > 3 ? ` (and ${report.problems.length - 3} more)` : '';
  return new AppError('validation_failed', `Nothing was imported: ${first}${more}.`, {
    issues: report.problems
      .slice(0, 200)
      .map((p) => ({ path: ['files', p.file, p.line ?? 0, p.column ?? ''], message: p.reason })),
    report,
  });
}

/** The tables of one uploaded file, its type read from its content (as for evidence files). */
async function readFile(file: UploadedFile): Promise<ReadTable[]> {
  const name = file.originalname;
  const verdict = await detectEvidenceType(file.buffer, name);
  if (!verdict.ok)
    throw new AppError(
      'unsupported_media_type',
      `"${name}" cannot be imported: ${verdict.reason}. Send CSV, XLSX or the JSON export.`,
      {
        name,
      },
    );
  if (verdict.mediaType === 'application/vnd.openxmlformats-officedocument.spreadsheetml.sheet') {
    try {
      return await readXlsx(name, file.buffer);
    } catch (error) {
      throw new AppError(
        'validation_failed',
        `"${name}" is not a workbook that can be read: ${(error as Error).message}.`,
        {
          issues: [{ path: ['files', name], message: 'The workbook cannot be read.' }],
        },
      );
    }
  }
  if (verdict.mediaType !== 'text/csv' && verdict.mediaType !== 'text/plain')
    throw new AppError(
      'unsupported_media_type',
      `"${name}" is ${verdict.mediaType}: send CSV, XLSX or the JSON export.`,
      {
        name,
      },
    );
  const text = file.buffer.toString('utf8');
  if (/^\s*\{/.test(text)) {
    let json: unknown;
    try {
      json = JSON.parse(text);
    } catch (error) {
      throw new AppError('validation_failed', `"${name}" is not valid JSON: ${(error as Error).message}.`, {
        issues: [{ path: ['files', name], message: 'Not valid JSON.' }],
      });
    }
    const parsed = libraryExportSchema.safeParse(json);
    if (!parsed.success)
      throw new AppError(
        'validation_failed',
        `"${name}" is not a library export: ${parsed.error.issues[0]?.message}.`,
        {
          issues: parsed.error.issues.map((i) => ({
            path: ['files', name, ...i.path.map(String)],
            message: i.message,
          })),
        },
      );
    return exportToTables(name, parsed.data);
  }
  return [readCsv(name, text)];
}

/** Problems the plan finds (keys that do not resolve, values that clash) named by file, line and column. */
function planProblems(
  problems: readonly { entry: number | null; field: (string | number)[]; message: string }[],
  origins: readonly EntryOrigin[],
): ImportProblem[] {
  return problems.map((p) => {
    const origin = p.entry === null ? undefined : origins[p.entry];
    if (!origin) return { file: '', line: null, column: null, reason: p.message };
    const column = origin.columns[String(p.field[0] ?? '')] ?? (p.field.join('.') || null);
    return { file: origin.file, line: origin.line, column, reason: p.message };
  });
}

const sourceFields = [
  'kind',
  'authors',
  'title',
  'publication',
  'year',
  'volume',
  'pages',
  'doi',
  'isbn',
  'url',
  'note',
] as const;

/**
 * Source rows the library already holds as they are change nothing: they are left out, so an
 * export re-imports even where a source was first given by its citation alone (no authors).
 */
function withoutKnownSources(tables: readonly ReadTable[], snapshot: LibrarySnapshot): ReadTable[] {
  const byKey = new Map([...snapshot.sources.values()].map((s) => [s.key, s]));
  const blank = (v: string | number | null | undefined) =>
    v === null || v === undefined || String(v).trim() === '' ? null : String(v).trim();
  const same = (cells: Record<string, string>) => {
    const known = byKey.get((cells.key ?? '').trim());
    return (
      known !== undefined && sourceFields.every((f) => cells[f] === undefined || blank(cells[f]) === blank(known[f]))
    );
  };
  return tables.map((t) =>
    tableOf(t.header) === 'sources' ? { ...t, rows: t.rows.filter((r) => !same(r.cells)) } : t,
  );
}

async function runImport(
  ctx: ActorContext,
  record: JobRecord,
  tables: readonly ReadTable[],
  input: { title?: string | undefined; rationale?: string | undefined; files: string[] },
): Promise<void> {
  const job = record.job;
  const snapshot = await snapshotFor(ctx.library);
  const converted = await tablesToEntries(withoutKnownSources(tables, snapshot), (done) => (job.rowsRead = done));
  job.rowsRead = job.rowsTotal;
  const counts: Record<string, number> = {};
  for (const t of tables) {
    const table = tableOf(t.header);
    if (table) counts[table] = (counts[table] ?? 0) + t.rows.length;
  }
  const report: ImportReport = { rowsRead: job.rowsRead, tables: counts, problems: converted.problems };
  if (report.problems.length === 0 && converted.entries.length === 0)
    report.problems.push({ file: input.files.join(', '), line: null, column: null, reason: 'The files hold no rows.' });
  if (converted.entries.length > 0) {
    // The rows that parse are checked against the library as the amendment will be, so every bad row is named at once.
    // A source row whose key the library has corrects that source (set-source names it by id).
    const sourceIds = new Map([...snapshot.sources.values()].map((s) => [s.key, s.id]));
    converted.entries = converted.entries.map((e) =>
      e.kind === 'set-source' && !e.id && sourceIds.has(e.source.key) ? { ...e, id: sourceIds.get(e.source.key)! } : e,
    );
    const plan = planEntries({
      snapshot,
      entries: converted.entries,
      title: input.title ?? 'Import',
      teamValues: new Map(),
      mode: 'review',
    });
    report.problems.push(...planProblems(plan.problems, converted.origins));
  }
  job.report = report;
  if (report.problems.length > 0) {
    job.state = 'failed';
    job.error = `${report.problems.length} problem${report.problems.length === 1 ? '' : 's'} in the rows: nothing was imported.`;
    return;
  }
  const detail = await createAmendment(ctx, {
    title: input.title ?? `Import of ${input.files.join(', ')}`.slice(0, 200),
    rationale: input.rationale ?? `Imported from ${input.files.join(', ')} (${converted.entries.length} rows).`,
    entries: converted.entries as AmendmentEntry[],
    origin: { kind: 'import', files: input.files, rows: converted.entries.length },
  });
  job.amendmentId = detail.id;
  job.state = 'done';
}

/**
 * Starts an import: the files are read and counted now (type, size and row limits answer at
 * once), the rows are checked and the draft made by a job. `wait` returns once the job ends
 * (and a job that found bad rows is then a 400 with the report).
 */
export async function startImport(
  ctx: ActorContext,
  input: { files: readonly UploadedFile[]; title?: string | undefined; rationale?: string | undefined; wait: boolean },
): Promise<ImportJob> {
  sweepJobs();
  if (input.files.length === 0)
    throw new AppError('validation_failed', 'Attach at least one file in the form field "files".', {
      issues: [{ path: ['body', 'files'], message: 'Attach at least one file.' }],
    });
  const tables: ReadTable[] = [];
  for (const file of input.files) tables.push(...(await readFile(file)));
  const rowsTotal = tables.reduce((n, t) => n + t.rows.length, 0);
  if (rowsTotal > MAX_IMPORT_ROWS)
    throw new AppError(
      'payload_too_large',
      `The files hold ${rowsTotal} rows; one import takes at most ${MAX_IMPORT_ROWS}.`,
      {
        limit: 'rows',
        max: MAX_IMPORT_ROWS,
        rows: rowsTotal,
      },
    );
  const job: ImportJob = {
    jobId: randomUUID(),
    state: 'running',
    rowsRead: 0,
    rowsTotal,
    report: null,
    amendmentId: null,
    error: null,
  };
  const files = input.files.map((f) => f.originalname);
  const record: JobRecord = {
    job,
    ownerId: ctx.actor.user.id,
    expiresAt: Date.now() + JOB_LIFETIME_MS,
    finished: Promise.resolve(),
  };
  record.finished = runImport(ctx, record, tables, { title: input.title, rationale: input.rationale, files }).catch(
    (error: unknown) => {
      job.state = 'failed';
      job.error = error instanceof AppError ? error.message : 'The import failed; nothing was imported.';
      if (!(error instanceof AppError)) ctx.log.error({ err: error }, 'library import failed');
    },
  );
  jobs.set(job.jobId, record);
  if (!input.wait) return { ...job };
  await record.finished;
  if (job.state === 'failed' && job.report && job.report.problems.length > 0) throw problemsError(job.report);
  if (job.state === 'failed') throw new AppError('validation_failed', job.error ?? 'The import failed.');
  return { ...job };
}

/** An import job, for the user who started it. */
export async function importJob(ctx: ActorContext, { jobId }: { jobId: string }): Promise<ImportJob> {
  sweepJobs();
  const record = jobs.get(jobId);
  if (!record || record.ownerId !== ctx.actor.user.id)
    throw new AppError('not_found', 'There is no such import job (jobs are kept for an hour).');
  return { ...record.job };
}

// ——— Export ———

export async function exportLibraryJson(
  ctx: ServiceContext,
  { revision }: { revision?: number | undefined },
): Promise<LibraryExport> {
  return libraryExport(await snapshotFor(ctx.library, revision));
}

export async function exportLibraryCsv(
  ctx: ServiceContext,
  { revision }: { revision?: number | undefined },
): Promise<{ revision: number; csv: string }> {
  const data = libraryExport(await snapshotFor(ctx.library, revision));
  return { revision: data.revision, csv: valuesCsv(data) };
}
