import { describe, expect, it } from 'vitest';
import { configFromEnv, EnvError, readEnv } from '../../server/env';

describe('readEnv', () => {
  it('fills the documented defaults', () => {
    const env = readEnv({});
    expect(env).toMatchObject({
      PORT: 3000,
      DATA_DIR: './data',
      SMTP_PORT: 2525,
      CALC_RATE_LIMIT_PER_MINUTE: 600,
      SESSION_TTL_DAYS: 30,
    });
    expect(configFromEnv(env).publicUrl).toBe('http://localhost:3000');
  });

  it('names each invalid variable', () => {
    expect(() => readEnv({ PORT: 'eighty', DATABASE_URL: 'mysql://x' })).toThrow(EnvError);
    try {
      readEnv({ PORT: 'eighty', DATABASE_URL: 'mysql://x' });
    } catch (err) {
      expect((err as Error).message).toMatch(/PORT: /);
      expect((err as Error).message).toMatch(/DATABASE_URL: Write a postgres:\/\/ connection URL\./);
    }
  });

  it('reads trust proxy, booleans and a public URL', () => {
    const config = configFromEnv(
      readEnv({ TRUST_PROXY: '1', SMTP_SECURE: 'true', PUBLIC_URL: 'https://tl.example/', PORT: '0' }),
    );
    expect(config.trustProxy).toBe(1);
    expect(config.publicUrl).toBe('https://tl.example');
    expect(readEnv({ SMTP_SECURE: 'yes' }).SMTP_SECURE).toBe(true);
    expect(() => readEnv({ SMTP_SECURE: 'maybe' })).toThrow(/SMTP_SECURE/);
  });

  it('treats empty strings as unset', () => {
    expect(readEnv({ DATABASE_URL: '', PORT: '' }).DATABASE_URL).toBeUndefined();
  });
});
