/** Checks form values with the shared zod schema before sending, giving one message per field. */
import type { z } from 'zod';

export type FormCheck<T> = { ok: true; data: T } | { ok: false; errors: Record<string, string> };

/** Runs `schema` on `value`; on failure returns the first message for each top-level field. */
export function validateForm<T>(schema: z.ZodType<T>, value: unknown): FormCheck<T> {
  const result = schema.safeParse(value);
  if (result.success) return { ok: true, data: result.data };
  const errors: Record<string, string> = {};
  for (const issue of result.error.issues) {
    const key = issue.path.map(String).join('.') || '_form';
    errors[key] ??= issue.message;
  }
  return { ok: false, errors };
}
