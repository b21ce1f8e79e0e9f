import { readonly, ref } from 'vue';
import type { z } from 'zod';
import { apiErrorText, fieldErrors } from '@/lib/api-error-words';
import { validateForm } from '@/lib/validate-form';

/** Messages by field name ("email", "newPassword"…), as the form shows them under each field. */
export type FieldErrors = Record<string, string>;

export interface FormSubmitOptions<TData> {
  /** The shared zod schema the values must pass before anything is sent. */
  schema: z.ZodType<TData>;
  /** Reads the form's current values; called at each submit. Keys the schema does not know are dropped. */
  values: () => unknown;
  /** Checks the schema cannot make (a repeated password); runs with it, messages merge by field. */
  check?: () => FieldErrors;
  /** Sends the checked data. Rejecting makes the submit fail; resolving makes it succeed. */
  send: (data: TData) => Promise<unknown>;
  /** Also hears of each failed send (to show a notification); `failure` and `errors` are set either way. */
  onFailure?: (error: unknown) => void;
}

/**
 * The submit pattern every form shares: check the values with the shared schema (and any extra
 * check) before sending, keep the form busy while sending, put the server's per-field messages
 * under their fields and its other complaint in `failure`, and never send twice at once.
 * Pure Vue reactivity (no naive-ui), so it runs and is tested without a component.
 */
export function useFormSubmit<TData>(options: FormSubmitOptions<TData>) {
  const busy = ref(false);
  const errors = ref<FieldErrors>({});
  const failure = ref<string | null>(null);

  /** Checks and sends; resolves true when the send succeeded, false otherwise (never rejects). */
  async function submit(): Promise<boolean> {
    if (busy.value) return false;
    failure.value = null;
    const check = validateForm(options.schema, options.values());
    const found: FieldErrors = { ...(check.ok ? {} : check.errors), ...(options.check?.() ?? {}) };
    if (!check.ok || Object.keys(found).length > 0) {
      errors.value = found;
      return false;
    }
    errors.value = {};
    busy.value = true;
    try {
      await options.send(check.data);
      return true;
    } catch (error) {
      errors.value = fieldErrors(error);
      failure.value = apiErrorText(error);
      options.onFailure?.(error);
      return false;
    } finally {
      busy.value = false;
    }
  }

  /** Forgets the messages (after the user resets or closes the form). */
  function clear(): void {
    errors.value = {};
    failure.value = null;
  }

  return { busy: readonly(busy), errors, failure, submit, clear };
}
