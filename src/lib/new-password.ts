/**
 * The rule for a new password as the user types it, read from the shared schema the server
 * enforces (shared/schemas/common.ts), so the hint and the server never disagree. Pure.
 */
import { newPasswordSchema } from '@shared/schemas/common';

/** Fewest characters the server accepts. */
export const newPasswordMinLength: number = newPasswordSchema.minLength ?? 0;

export const PASSWORDS_DIFFER = 'The two passwords differ.';

export interface PasswordHint {
  /** True once the password passes the server's rule. */
  met: boolean;
  text: string;
}

/** What to say under the new-password field for what has been typed so far. */
export function newPasswordHint(password: string): PasswordHint {
  const rule = `At least ${newPasswordMinLength} characters`;
  if (password === '') return { met: false, text: `${rule}.` };
  const check = newPasswordSchema.safeParse(password);
  if (check.success) return { met: true, text: `${rule}: met.` };
  const missing = newPasswordMinLength - password.length;
  if (missing > 0) return { met: false, text: `${rule}: ${missing} more to go.` };
  return { met: false, text: check.error.issues[0]?.message ?? `${rule}.` };
}

/**
 * `{ confirm: message }` when the repetition differs, `{}` when it matches: the shape of a form's
 * extra check (useFormSubmit's `check`), under the field name NewPasswordFields' parents use.
 */
export function confirmationErrors(password: string, confirm: string): Record<string, string> {
  return password === confirm ? {} : { confirm: PASSWORDS_DIFFER };
}
