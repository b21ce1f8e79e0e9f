import multer from 'multer';
import type { RequestHandler } from 'express';
import type { AppDeps } from '../context';
import { AppError } from '../errors';

/** A multipart upload of files in one field, held in memory until the service has checked and stored them. */
export interface UploadSpec {
  /** The form field holding the files. */
  field: string;
}

function megabytes(bytes: number): string {
  return `${Math.round((bytes / 1024 / 1024) * 10) / 10} MB`;
}

/**
 * Parses a multipart/form-data upload with multer's limits (file size, file count, field count),
 * leaving the files in req.files. Anything but multipart is 415; a limit is 413 naming it.
 */
export function acceptUpload(spec: UploadSpec, deps: AppDeps): RequestHandler[] {
  const { maxFileBytes, maxFilesPerUpload } = deps.config.evidence;
  const parse = multer({
    storage: multer.memoryStorage(),
    limits: {
      fileSize: maxFileBytes,
      files: maxFilesPerUpload,
      fields: 10,
      fieldSize: 10_000,
      parts: maxFilesPerUpload + 10,
    },
  }).array(spec.field, maxFilesPerUpload);

  const requireMultipart: RequestHandler = (req, _res, next) => {
    if (!req.is('multipart/form-data'))
      throw new AppError(
        'unsupported_media_type',
        `Send the files as multipart/form-data in the field "${spec.field}" (got ${req.get('content-type') ?? 'no content type'}).`,
      );
    next();
  };

  const mapError = (error: unknown): unknown => {
    if (!(error instanceof multer.MulterError)) return error;
    switch (error.code) {
      case 'LIMIT_FILE_SIZE':
        return new AppError(
          'payload_too_large',
          `A file is larger than ${megabytes(maxFileBytes)}, the most one evidence file may be.`,
          {
            limit: 'fileSize',
            max: maxFileBytes,
          },
        );
      case 'LIMIT_FILE_COUNT':
      case 'LIMIT_PART_COUNT':
        return new AppError('payload_too_large', `Upload at most ${maxFilesPerUpload} files at once.`, {
          limit: 'files',
          max: maxFilesPerUpload,
        });
      case 'LIMIT_UNEXPECTED_FILE':
        return new AppError('validation_failed', `Send the files in the form field "${spec.field}".`, {
          issues: [{ path: ['body', error.field ?? spec.field], message: `Use the field "${spec.field}".` }],
        });
      default:
        return new AppError('bad_request', `The upload could not be read: ${error.message}.`);
    }
  };

  // multer reports its limits as MulterError: they become our 413/400 before the error handler.
  const parseMapped: RequestHandler = (req, res, next) =>
    parse(req, res, (error?: unknown) => (error === undefined ? next() : next(mapError(error))));

  return [requireMultipart, parseMapped];
}
