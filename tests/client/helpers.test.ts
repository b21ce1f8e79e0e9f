import { describe, expect, it } from 'vitest';
import { z } from 'zod';
import { ApiError } from '@/api/api-error';
import { apiErrorText, fieldErrors, retryAfterSeconds } from '@/lib/api-error-words';
import { formatDateTime, inAppPath, splitLinks } from '@/lib/format';
import { parseThemePreference, resolveTheme } from '@/lib/theme-choice';
import { validateForm } from '@/lib/validate-form';

describe('apiErrorText', () => {
  it('says how long to wait after too many attempts', () => {
    expect(
      apiErrorText(new ApiError(429, 'rate_limited', 'Too many sign-in attempts.', { retryAfterSeconds: 37 })),
    ).toBe('Too many attempts — try again in 37 s.');
  });
  it('still says something when the wait is unknown', () => {
    expect(apiErrorText(new ApiError(429, 'rate_limited', 'x'))).toMatch(/^Too many attempts/);
  });
  it('prefers the server’s message', () => {
    expect(apiErrorText(new ApiError(401, 'invalid_credentials', 'E-mail or password is wrong.'))).toBe(
      'E-mail or password is wrong.',
    );
  });
  it('falls back to words for the code', () => {
    expect(apiErrorText(new ApiError(403, 'forbidden', ''))).toBe('Your role does not allow this.');
  });
  it('describes non-API errors', () => {
    expect(apiErrorText(new Error('boom'))).toBe('Something went wrong: boom');
    expect(apiErrorText('??')).toBe('Something went wrong.');
  });
});

describe('retryAfterSeconds', () => {
  it('reads numbers and digit strings, rounding up', () => {
    expect(retryAfterSeconds(new ApiError(429, 'rate_limited', '', { retryAfterSeconds: 4.2 }))).toBe(5);
    expect(retryAfterSeconds(new ApiError(429, 'rate_limited', '', { retryAfter: '12' }))).toBe(12);
    expect(retryAfterSeconds(new ApiError(429, 'rate_limited', ''))).toBeUndefined();
  });
});

describe('fieldErrors', () => {
  it('keys issues by field without the body prefix, first message wins', () => {
    const error = new ApiError(400, 'validation_failed', 'email: bad', {
      issues: [
        { path: ['body', 'email'], message: 'Invalid email address' },
        { path: ['body', 'email'], message: 'second' },
        { path: ['body', 'fixed', '3'], message: 'Term 3 does not exist.' },
      ],
    });
    expect(fieldErrors(error)).toEqual({ email: 'Invalid email address', 'fixed.3': 'Term 3 does not exist.' });
  });
  it('is empty for other errors', () => {
    expect(fieldErrors(new ApiError(401, 'invalid_credentials', 'x'))).toEqual({});
    expect(fieldErrors(new Error('x'))).toEqual({});
  });
});

describe('validateForm', () => {
  const schema = z.object({
    email: z.email('Enter an e-mail address.'),
    password: z.string().min(10, 'Use at least 10 characters.'),
  });
  it('returns the parsed data', () => {
    expect(validateForm(schema, { email: 'a@b.example', password: '0123456789' })).toEqual({
      ok: true,
      data: { email: 'a@b.example', password: '0123456789' },
    });
  });
  it('returns one message per field', () => {
    expect(validateForm(schema, { email: 'nope', password: 'short' })).toEqual({
      ok: false,
      errors: { email: 'Enter an e-mail address.', password: 'Use at least 10 characters.' },
    });
  });
  it('puts plain words where the schema gives no message of its own', () => {
    const bare = z.object({
      current: z.string().min(1),
      name: z.string().min(2).max(5),
      email: z.email(),
      days: z.number().int().min(1).max(3650),
      role: z.enum(['viewer', 'member']),
    });
    expect(validateForm(bare, { current: '', name: 'x', email: 'nope', days: 0, role: 'boss' })).toEqual({
      ok: false,
      errors: {
        current: 'Fill this in.',
        name: 'Use at least 2 characters.',
        email: 'Give an e-mail address, like name@lab.example.',
        days: 'Use at least 1.',
        role: 'Choose one of the offered values.',
      },
    });
    expect(validateForm(bare, { name: 'toolong', days: 1.5 })).toMatchObject({
      errors: { current: 'Fill this in.', name: 'Use at most 5 characters.', days: 'Give a whole number.' },
    });
  });
});

describe('formatDateTime', () => {
  it('formats in the given zone and shows a dash for null', () => {
    expect(formatDateTime('2025-03-12T14:05:00Z', 'en-GB', 'UTC')).toBe('12 Mar 2025, 14:05');
    expect(formatDateTime(null)).toBe('—');
  });
});

describe('splitLinks', () => {
  it('separates links from text and leaves a trailing full stop outside the link', () => {
    expect(splitLinks('Open http://localhost:3000/invitations/abc. Thanks')).toEqual([
      { kind: 'text', value: 'Open ' },
      { kind: 'link', value: 'http://localhost:3000/invitations/abc' },
      { kind: 'text', value: '. Thanks' },
    ]);
  });
  it('keeps query strings', () => {
    expect(splitLinks('https://x.example/reset-password?token=a_b-c')).toEqual([
      { kind: 'link', value: 'https://x.example/reset-password?token=a_b-c' },
    ]);
  });
  it('returns plain text untouched', () =>
    expect(splitLinks('no links')).toEqual([{ kind: 'text', value: 'no links' }]));
});

describe('inAppPath', () => {
  it('gives the path for same-origin links only', () => {
    expect(inAppPath('http://localhost:3000/reset-password?token=t', 'http://localhost:3000')).toBe(
      '/reset-password?token=t',
    );
    expect(inAppPath('https://elsewhere.example/x', 'http://localhost:3000')).toBeNull();
    expect(inAppPath('not a url', 'http://localhost:3000')).toBeNull();
  });
});

describe('resolveTheme', () => {
  it('follows the OS until the user chooses', () => {
    expect(resolveTheme('system', 'dark')).toBe('dark');
    expect(resolveTheme('system', null)).toBe('light');
    expect(resolveTheme('light', 'dark')).toBe('light');
  });
  it('treats unknown stored values as following the system', () => {
    expect(parseThemePreference('purple')).toBe('system');
    expect(parseThemePreference('dark')).toBe('dark');
  });
});
