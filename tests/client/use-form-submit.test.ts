import { describe, expect, it, vi } from 'vitest';
import { reactive } from 'vue';
import { z } from 'zod';
import { ApiError } from '@/api/api-error';
import { useFormSubmit } from '@/composables/use-form-submit';

const schema = z.object({
  email: z.email('Give an e-mail address.'),
  name: z.string().trim().min(1, 'Give a name.'),
});

/** A promise the test settles by hand, to look at the form while it is sending. */
function deferred() {
  let resolve!: () => void;
  let reject!: (error: unknown) => void;
  const promise = new Promise<void>((res, rej) => {
    resolve = res;
    reject = rej;
  });
  return { promise, resolve, reject };
}

function setUp(options: { check?: () => Record<string, string>; send?: (data: unknown) => Promise<unknown> } = {}) {
  const form = reactive({ email: 'ada@lab.example', name: '  Ada  ', confirm: 'extra' });
  const send = vi.fn(options.send ?? (() => Promise.resolve()));
  const onFailure = vi.fn();
  const submitter = useFormSubmit({ schema, values: () => form, send, onFailure, check: options.check });
  return { form, send, onFailure, ...submitter };
}

describe('useFormSubmit', () => {
  it('sends the data the schema produced, without the keys it does not know', async () => {
    const { send, submit, errors, failure, busy } = setUp();
    expect(await submit()).toBe(true);
    expect(send).toHaveBeenCalledWith({ email: 'ada@lab.example', name: 'Ada' });
    expect(errors.value).toEqual({});
    expect(failure.value).toBeNull();
    expect(busy.value).toBe(false);
  });

  it('puts schema messages under their fields and sends nothing', async () => {
    const { form, send, submit, errors } = setUp();
    form.email = 'not an address';
    form.name = ' ';
    expect(await submit()).toBe(false);
    expect(send).not.toHaveBeenCalled();
    expect(errors.value).toEqual({ email: 'Give an e-mail address.', name: 'Give a name.' });
  });

  it('merges the extra check with the schema and blocks on it alone', async () => {
    const check = vi.fn(() => ({ confirm: 'The two passwords differ.' }));
    const { send, submit, errors } = setUp({ check });
    expect(await submit()).toBe(false);
    expect(send).not.toHaveBeenCalled();
    expect(errors.value).toEqual({ confirm: 'The two passwords differ.' });
  });

  it('is busy while sending and ignores a second submit meanwhile', async () => {
    const pending = deferred();
    const { send, submit, busy } = setUp({ send: () => pending.promise });
    const first = submit();
    expect(busy.value).toBe(true);
    expect(await submit()).toBe(false);
    expect(send).toHaveBeenCalledTimes(1);
    pending.resolve();
    expect(await first).toBe(true);
    expect(busy.value).toBe(false);
  });

  it('shows the server’s field messages under the fields and its words as the failure', async () => {
    const refusal = new ApiError(400, 'validation_failed', 'The e-mail is already invited.', {
      issues: [{ path: ['body', 'email'], message: 'Already invited.' }],
    });
    const { submit, errors, failure, onFailure, busy } = setUp({ send: () => Promise.reject(refusal) });
    expect(await submit()).toBe(false);
    expect(errors.value).toEqual({ email: 'Already invited.' });
    expect(failure.value).toBe('The e-mail is already invited.');
    expect(onFailure).toHaveBeenCalledWith(refusal);
    expect(busy.value).toBe(false);
  });

  it('turns any other failure into words, with no field messages', async () => {
    const { submit, errors, failure } = setUp({
      send: () => Promise.reject(new ApiError(429, 'rate_limited', 'Slow down.', { retryAfterSeconds: 12 })),
    });
    expect(await submit()).toBe(false);
    expect(errors.value).toEqual({});
    expect(failure.value).toBe('Too many attempts — try again in 12 s.');
  });

  it('clears the last failure when submitted again, and on clear()', async () => {
    let attempt = 0;
    const { submit, failure, errors, clear, form } = setUp({
      send: () => (attempt++ === 0 ? Promise.reject(new Error('offline')) : Promise.resolve()),
    });
    expect(await submit()).toBe(false);
    expect(failure.value).toBe('Something went wrong: offline');
    expect(await submit()).toBe(true);
    expect(failure.value).toBeNull();
    form.name = '';
    await submit();
    expect(errors.value).toHaveProperty('name');
    clear();
    expect(errors.value).toEqual({});
    expect(failure.value).toBeNull();
  });
});
