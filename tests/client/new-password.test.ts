import { describe, expect, it } from 'vitest';
import { newPasswordSchema } from '@shared/schemas/common';
import { confirmationErrors, newPasswordHint, newPasswordMinLength, PASSWORDS_DIFFER } from '@/lib/new-password';

describe('newPasswordHint', () => {
  it('reads the minimum length from the schema the server enforces', () => {
    // The hint's number must be the one the server checks: the shared schema accepts exactly it.
    expect(newPasswordSchema.safeParse('x'.repeat(newPasswordMinLength)).success).toBe(true);
    expect(newPasswordSchema.safeParse('x'.repeat(newPasswordMinLength - 1)).success).toBe(false);
  });
  it('states the rule before anything is typed', () => {
    expect(newPasswordHint('')).toEqual({ met: false, text: `At least ${newPasswordMinLength} characters.` });
  });
  it('counts down the characters still missing', () => {
    expect(newPasswordHint('abc')).toEqual({
      met: false,
      text: `At least ${newPasswordMinLength} characters: ${newPasswordMinLength - 3} more to go.`,
    });
  });
  it('says when the rule is met', () => {
    expect(newPasswordHint('a-long-enough-secret').met).toBe(true);
  });
  it('passes on the schema’s own message for anything else it refuses', () => {
    expect(newPasswordHint('x'.repeat(201))).toEqual({ met: false, text: 'Use at most 200 characters.' });
  });
});

describe('confirmationErrors', () => {
  it('is empty when the two entries match', () => {
    expect(confirmationErrors('same-secret-1', 'same-secret-1')).toEqual({});
  });
  it('names the repeat field when they differ', () => {
    expect(confirmationErrors('same-secret-1', 'same-secret-2')).toEqual({ confirm: PASSWORDS_DIFFER });
  });
});
