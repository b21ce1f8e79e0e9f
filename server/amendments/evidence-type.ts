import { fileTypeFromBuffer } from 'file-type';
import { evidenceMediaTypes, type EvidenceMediaType } from '@shared/schemas/amendments';

/**
 * The type of an evidence file, read from its bytes. file-type recognises binary formats by their
 * signatures (PDF, XLSX, PNG, JPEG, GIF, WebP, and executables, archives and the rest, which are
 * refused); it does not recognise text, so a file it cannot place is accepted only as text: valid
 * UTF-8 without NUL bytes, CSV when named .csv, plain text otherwise. The name and the type the
 * client sent decide nothing.
 */
export type EvidenceVerdict = { ok: true; mediaType: EvidenceMediaType } | { ok: false; reason: string };

const strictUtf8 = new TextDecoder('utf-8', { fatal: true });

function isText(bytes: Uint8Array): boolean {
  if (bytes.includes(0)) return false;
  try {
    strictUtf8.decode(bytes);
    return true;
  } catch {
    return false;
  }
}

export async function detectEvidenceType(bytes: Uint8Array, name: string): Promise<EvidenceVerdict> {
  if (bytes.length === 0) return { ok: false, reason: 'the file is empty' };
  const found = await fileTypeFromBuffer(bytes);
  if (found) {
    if (found.mime in evidenceMediaTypes) return { ok: true, mediaType: found.mime as EvidenceMediaType };
    return { ok: false, reason: `its content is ${found.ext.toUpperCase()} (${found.mime})` };
  }
  if (!isText(bytes))
    return { ok: false, reason: 'its content is neither a known document or image format nor UTF-8 text' };
  return { ok: true, mediaType: /\.csv$/i.test(name) ? 'text/csv' : 'text/plain' };
}

/** "PDF, CSV, plain text, XLSX, PNG image, …": for messages. */
export const acceptedEvidenceWords = [...new Set(Object.values(evidenceMediaTypes))].join(', ');
