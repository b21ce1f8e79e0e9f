/**
 * A small reader for the single-part text/plain messages the server itself sends (nodemailer
 * output): headers, encoded-word subjects, quoted-printable or base64 bodies. Not a general MIME parser.
 */
export interface ParsedMessage {
  headers: Record<string, string>;
  subject: string;
  text: string;
}

function decodeQuotedPrintable(input: string): Uint8Array {
  const soft = input.replace(/=\r?\n/g, '');
  const bytes: number[] = [];
  for (let i = 0; i < soft.length; i++) {
    const ch = soft[i]!;
    const hex = soft.slice(i + 1, i + 3);
    if (ch === '=' && /^[0-9A-Fa-f]{2}$/.test(hex)) {
      bytes.push(parseInt(hex, 16));
      i += 2;
    } else {
      bytes.push(...Buffer.from(ch, 'utf8'));
    }
  }
  return Uint8Array.from(bytes);
}

function decodeBody(body: string, transferEncoding: string): string {
  switch (transferEncoding.toLowerCase()) {
    case 'base64':
      return Buffer.from(body.replace(/\s+/g, ''), 'base64').toString('utf8');
    case 'quoted-printable':
      return Buffer.from(decodeQuotedPrintable(body)).toString('utf8');
    default:
      return body;
  }
}

/** Decodes RFC 2047 encoded words (=?UTF-8?Q?…?= and =?UTF-8?B?…?=). */
function decodeEncodedWords(value: string): string {
  return value
    .replace(/\?=\s+=\?/g, '?==?') // whitespace between adjacent encoded words is not content
    .replace(/=\?([^?]+)\?([QqBb])\?([^?]*)\?=/g, (_m, _charset: string, enc: string, text: string) =>
      enc.toUpperCase() === 'B'
        ? Buffer.from(text, 'base64').toString('utf8')
        : Buffer.from(decodeQuotedPrintable(text.replace(/_/g, ' '))).toString('utf8'),
    );
}

/** Splits a raw RFC 5322 message into headers and its decoded text body. */
export function parseMessage(raw: string): ParsedMessage {
  const split = raw.search(/\r?\n\r?\n/);
  const head = split === -1 ? raw : raw.slice(0, split);
  const body = split === -1 ? '' : raw.slice(split).replace(/^\r?\n\r?\n/, '');
  const headers: Record<string, string> = {};
  // Unfold continuation lines, then read "Name: value".
  for (const line of head.replace(/\r?\n[ \t]+/g, ' ').split(/\r?\n/)) {
    const colon = line.indexOf(':');
    if (colon > 0) headers[line.slice(0, colon).trim().toLowerCase()] = line.slice(colon + 1).trim();
  }
  const text = decodeBody(body, headers['content-transfer-encoding'] ?? '7bit')
    .replace(/\r\n/g, '\n')
    .replace(/\n$/, '');
  return { headers, subject: decodeEncodedWords(headers['subject'] ?? ''), text };
}
