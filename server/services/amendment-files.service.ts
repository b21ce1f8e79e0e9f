import { createHash, randomBytes } from 'node:crypto';
import { mkdir, rm, writeFile } from 'node:fs/promises';
import path from 'node:path';
import { and, asc, count, eq } from 'drizzle-orm';
import { evidenceMediaTypes, type EvidenceFile, type EvidenceFileList } from '@shared/schemas/amendments';
import { API_PREFIX } from '@shared/api-prefix';
import type { ActorContext } from '../context';
import { amendmentFiles, amendments } from '../db/tables/index';
import { AppError, errors } from '../errors';
import { acceptedEvidenceWords, detectEvidenceType } from '../amendments/evidence-type';
import { finalStates } from '../amendments/states';
import { FileReply } from '../lib/file-reply';

/**
 * Evidence files of amendments. The author attaches them while the amendment is not yet decided;
 * anyone who may read the amendment may download them. Bytes are stored in the evidence directory
 * under a random name (never the uploaded one), metadata in amendment_files; files are only ever
 * sent through the download route, as attachments.
 */

/** A file as multer hands it over (memory storage). */
export interface UploadedFile {
  originalname: string;
  buffer: Buffer;
  size: number;
}

type FileRow = typeof amendmentFiles.$inferSelect;
type AmendmentRow = typeof amendments.$inferSelect;

function present(row: FileRow): EvidenceFile {
  return {
    id: row.id,
    name: row.originalName,
    mediaType: row.mediaType,
    size: row.size,
    sha256: row.sha256,
    uploadedBy: { id: row.uploadedBy, name: row.uploadedByName },
    createdAt: row.createdAt.toISOString(),
    href: `${API_PREFIX}/amendments/${row.amendmentId}/files/${row.id}`,
  };
}

/** The name shown and offered on download: no path, no control characters, at most 200 characters. */
function cleanName(name: string): string {
  // multer hands over latin1-decoded header bytes; browsers send UTF-8.
  const utf8 = Buffer.from(name, 'latin1').toString('utf8');
  const base = (utf8.includes('\uFFFD') ? name : utf8).split(/[\\/]/).pop() ?? '';
  const cleaned = base
    // eslint-disable-next-line no-control-regex -- control characters are what is removed
    .replace(/[\u0000-\u001f\u007f"]/g, '')
    .trim()
    .slice(0, 200);
  return cleaned.length > 0 ? cleaned : 'evidence';
}

async function amendmentFor(ctx: ActorContext, amendmentId: string): Promise<AmendmentRow> {
  const [row] = await ctx.db.select().from(amendments).where(eq(amendments.id, amendmentId));
  // Someone else's draft does not exist for the caller.
  if (!row || (row.state === 'draft' && row.authorId !== ctx.actor.user.id)) throw errors.notFound('The amendment');
  return row;
}

function requireAuthorWhileUndecided(ctx: ActorContext, row: AmendmentRow, verb: string): void {
  if (row.authorId !== ctx.actor.user.id)
    throw new AppError('forbidden', `Only the amendment's author may ${verb} its evidence files.`);
  if (finalStates.includes(row.state))
    throw new AppError('conflict', `The amendment is ${row.state}: its evidence files no longer change.`, {
      state: row.state,
    });
}

/** The evidence files of an amendment, oldest first. */
export async function listEvidence(
  ctx: ActorContext,
  { amendmentId }: { amendmentId: string },
): Promise<EvidenceFileList> {
  const row = await amendmentFor(ctx, amendmentId);
  return { items: (await evidenceRows(ctx, row.id)).map(present) };
}

/** The rows of an amendment's files (for the amendment's detail too). */
export async function evidenceRows(ctx: Pick<ActorContext, 'db'>, amendmentId: string): Promise<FileRow[]> {
  return ctx.db
    .select()
    .from(amendmentFiles)
    .where(eq(amendmentFiles.amendmentId, amendmentId))
    .orderBy(asc(amendmentFiles.createdAt), asc(amendmentFiles.id));
}

export const presentEvidence = present;

/**
 * Checks and stores uploaded files: every file's type is read from its content (415 naming the
 * file when one is not PDF, CSV/text, XLSX or an image), and the amendment may hold at most the
 * configured number (413). Either all files are stored or none.
 */
export async function addEvidence(
  ctx: ActorContext,
  { amendmentId, files }: { amendmentId: string; files: readonly UploadedFile[] },
): Promise<EvidenceFileList> {
  const row = await amendmentFor(ctx, amendmentId);
  requireAuthorWhileUndecided(ctx, row, 'add');
  if (files.length === 0)
    throw new AppError('validation_failed', 'Attach at least one file in the form field "files".', {
      issues: [{ path: ['body', 'files'], message: 'Attach at least one file.' }],
    });
  const checked: { name: string; mediaType: string; buffer: Buffer; sha256: string; storedName: string }[] = [];
  for (const [index, file] of files.entries()) {
    const name = cleanName(file.originalname);
    const verdict = await detectEvidenceType(file.buffer, name);
    if (!verdict.ok)
      throw new AppError(
        'unsupported_media_type',
        `"${name}" cannot be evidence: ${verdict.reason}. Accepted: ${acceptedEvidenceWords}.`,
        { file: index, name, accepted: Object.keys(evidenceMediaTypes) },
      );
    checked.push({
      name,
      mediaType: verdict.mediaType,
      buffer: file.buffer,
      sha256: createHash('sha256').update(file.buffer).digest('hex'),
      // 128 random bits: not guessable, and nothing of the upload's name reaches the disk.
      storedName: randomBytes(16).toString('hex'),
    });
  }
  const { dir, maxFilesPerAmendment } = ctx.config.evidence;
  await mkdir(dir, { recursive: true, mode: 0o700 });
  const written: string[] = [];
  try {
    for (const file of checked) {
      const target = path.join(dir, file.storedName);
      await writeFile(target, file.buffer, { flag: 'wx', mode: 0o600 });
      written.push(target);
    }
    await ctx.db.transaction(async (tx) => {
      // The row lock keeps two uploads from passing the count check together.
      const [locked] = await tx.select().from(amendments).where(eq(amendments.id, row.id)).for('update');
      if (!locked || finalStates.includes(locked.state))
        throw new AppError(
          'conflict',
          `The amendment is ${locked?.state ?? 'gone'}: its evidence files no longer change.`,
          {
            state: locked?.state ?? null,
          },
        );
      const [held] = await tx.select({ n: count() }).from(amendmentFiles).where(eq(amendmentFiles.amendmentId, row.id));
      const total = Number(held?.n ?? 0) + checked.length;
      if (total > maxFilesPerAmendment)
        throw new AppError(
          'payload_too_large',
          `An amendment holds at most ${maxFilesPerAmendment} evidence files; it has ${Number(held?.n ?? 0)}.`,
          { limit: 'filesPerAmendment', max: maxFilesPerAmendment, found: total },
        );
      await tx.insert(amendmentFiles).values(
        checked.map((f) => ({
          amendmentId: row.id,
          storedName: f.storedName,
          originalName: f.name,
          mediaType: f.mediaType,
          size: f.buffer.length,
          sha256: f.sha256,
          uploadedBy: ctx.actor.user.id,
          uploadedByName: ctx.actor.user.displayName,
        })),
      );
      await tx.update(amendments).set({ updatedAt: new Date() }).where(eq(amendments.id, row.id));
    });
  } catch (error) {
    await Promise.all(written.map((p) => rm(p, { force: true })));
    throw error;
  }
  return listEvidence(ctx, { amendmentId: row.id });
}

async function fileOf(
  ctx: ActorContext,
  amendmentId: string,
  fileId: string,
): Promise<{ row: AmendmentRow; file: FileRow }> {
  const row = await amendmentFor(ctx, amendmentId);
  const [file] = await ctx.db
    .select()
    .from(amendmentFiles)
    .where(and(eq(amendmentFiles.id, fileId), eq(amendmentFiles.amendmentId, row.id)));
  if (!file) throw errors.notFound('The file');
  return { row, file };
}

/** One evidence file, for download (the router sends it as an attachment). */
export async function downloadEvidence(
  ctx: ActorContext,
  { amendmentId, fileId }: { amendmentId: string; fileId: string },
): Promise<FileReply> {
  const { file } = await fileOf(ctx, amendmentId, fileId);
  return new FileReply(
    path.join(ctx.config.evidence.dir, file.storedName),
    file.originalName,
    file.mediaType,
    file.size,
  );
}

/** Removes an evidence file (its author, before the amendment is decided). */
export async function removeEvidence(
  ctx: ActorContext,
  { amendmentId, fileId }: { amendmentId: string; fileId: string },
): Promise<void> {
  const { row, file } = await fileOf(ctx, amendmentId, fileId);
  requireAuthorWhileUndecided(ctx, row, 'remove');
  await ctx.db.delete(amendmentFiles).where(eq(amendmentFiles.id, file.id));
  await rm(path.join(ctx.config.evidence.dir, file.storedName), { force: true });
}
