/** Checks form values with the shared zod schema before sending, giving one message per field. */
import type { z } from 'zod';

export type FormCheck<T> = { ok: true; data: T } | { ok: false; errors: Record<string, string> };

/**
 * Plain words for zod's generic messages ("Too small: expected string to have >=1 characters").
 * Used only where a schema gives no message of its own, which always wins.
 */
const plainWords: z.core.$ZodErrorMap = (issue) => {
  const origin = 'origin' in issue ? issue.origin : undefined;
  switch (issue.code) {
    case 'too_small':
      if (origin === 'string') {
        return Number(issue.minimum) <= 1 ? 'Fill this in.' : `Use at least ${issue.minimum} characters.`;
      }
      if (origin === 'number') return `Use ${issue.inclusive === false ? 'more than' : 'at least'} ${issue.minimum}.`;
      return undefined;
    case 'too_big':
      if (origin === 'string') return `Use at most ${issue.maximum} characters.`;
      if (origin === 'number') return `Use ${issue.inclusive === false ? 'less than' : 'at most'} ${issue.maximum}.`;
      return undefined;
    case 'invalid_format':
      return issue.format === 'email' ? 'Give an e-mail address, like name@lab.example.' : undefined;
    case 'invalid_type':
      if (issue.input === undefined || issue.input === null || issue.input === '') return 'Fill this in.';
      return issue.expected === 'int' || issue.expected === 'number' ? 'Give a whole number.' : undefined;
    case 'invalid_value':
      return 'Choose one of the offered values.';
    default:
      return undefined;
  }
};

/** Runs `schema` on `value`; on failure returns the first message for each field (dotted path). */
export function validateForm<T>(schema: z.ZodType<T>, value: unknown): FormCheck<T> {
  const result = schema.safeParse(value, { error: plainWords });
  if (result.success) return { ok: true, data: result.data };
  const errors: Record<string, string> = {};
  for (const issue of result.error.issues) {
    const key = issue.path.map(String).join('.') || '_form';
    errors[key] ??= issue.message;
  }
  return { ok: false, errors };
}
