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

describe('readEnv: the hardening settings', () => {
  it('defaults to listening on loopback only, and to the documented work limits', () => {
    const env = readEnv({});
    expect(env.HOST).toBe('127.0.0.1');
    const { calc } = configFromEnv(env);
    expect(calc.limits).toEqual({
      maxTermsPerEquation: 80,
      maxDistinctSpecies: 60,
      maxBatchLines: 2000,
      maxBatchBytes: 200_000,
      maxReplyBytes: 8_000_000,
    });
    expect(calc).toMatchObject({ timeBudgetMs: 10_000, requestsPerMinute: 600, linesPerMinute: 6000 });
    expect(calc.workers).toBeGreaterThanOrEqual(2);
  });

  it('refuses TRUST_PROXY=true, which would let any client choose its own address', () => {
    expect(() => readEnv({ TRUST_PROXY: 'true' })).toThrow(/TRUST_PROXY: true would trust any X-Forwarded-For/);
  });

  it('takes a hop count or a list of proxy addresses for TRUST_PROXY', () => {
    expect(configFromEnv(readEnv({ TRUST_PROXY: '2' })).trustProxy).toBe(2);
    expect(configFromEnv(readEnv({ TRUST_PROXY: 'loopback, 10.0.0.0/8, fd00::1' })).trustProxy).toEqual([
      'loopback',
      '10.0.0.0/8',
      'fd00::1',
    ]);
    expect(configFromEnv(readEnv({})).trustProxy).toBe(false);
    expect(() => readEnv({ TRUST_PROXY: 'proxy.internal' })).toThrow(/proxy\.internal is not a proxy address/);
    expect(() => readEnv({ TRUST_PROXY: '10.0.0.0/33' })).toThrow(/TRUST_PROXY/);
  });

  it('refuses a line budget smaller than the largest allowed batch', () => {
    expect(() => readEnv({ CALC_MAX_BATCH_LINES: '5000', CALC_LINES_PER_MINUTE: '4000' })).toThrow(
      /CALC_LINES_PER_MINUTE: must be at least CALC_MAX_BATCH_LINES \(5000\)/,
    );
  });

  it('refuses SEED_DEMO=1 with NODE_ENV=production', () => {
    expect(() => readEnv({ NODE_ENV: 'production', SEED_DEMO: '1' })).toThrow(
      /SEED_DEMO: demo accounts are never created/,
    );
    expect(readEnv({ NODE_ENV: 'production', SEED_DEMO: '0' }).SEED_DEMO).toBe(false);
  });
});
