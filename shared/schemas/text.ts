import { z } from 'zod';

// C0 controls except tab (U+0009), line feed (U+000A) and carriage return (U+000D), DEL, and the C1 block.
// PostgreSQL cannot store U+0000 in text at all; the others have no business in names and notes.
// eslint-disable-next-line no-control-regex -- matching control characters is the point
const FORBIDDEN_CONTROL = /[\u0000-\u0008\u000B\u000C\u000E-\u001F\u007F-\u009F]/;

function codePoint(ch: string): string {
  return `U+${ch.codePointAt(0)!.toString(16).toUpperCase().padStart(4, '0')}`;
}

/**
 * A string of text people typed: any Unicode, tabs and line breaks (LF or CRLF) included, but no
 * other control characters. Every free-text field of the API starts from this schema, so a NUL
 * byte or an escape sequence is a 400 naming the field, never a database error.
 */
export function plainText(): z.ZodString {
  return z.string().check((ctx) => {
    const match = FORBIDDEN_CONTROL.exec(ctx.value);
    if (match) {
      ctx.issues.push({
        code: 'custom',
        input: ctx.value,
        message: `contains the control character ${codePoint(match[0])} at position ${match.index + 1}; only tabs and line breaks are allowed.`,
      });
    }
  });
}

/** True when `text` holds no control character other than tab, LF and CR. */
export function isPlainText(text: string): boolean {
  return !FORBIDDEN_CONTROL.test(text);
}
