import type * as Crypto from 'node:crypto';
import { describe, expect, it, vi } from 'vitest';

// Count and inspect every constant-time comparison the token check makes.
const compared = vi.hoisted(() => ({ calls: [] as [number, number][] }));
vi.mock('node:crypto', async (importOriginal) => {
  const actual = await importOriginal<typeof Crypto>();
  return {
    ...actual,
    timingSafeEqual: (a: NodeJS.ArrayBufferView, b: NodeJS.ArrayBufferView) => {
      compared.calls.push([a.byteLength, b.byteLength]);
      return actual.timingSafeEqual(a, b);
    },
  };
});

const { newShareToken, readShareToken, verifierMatches } = await import('../../../server/lib/share-tokens');

describe('share tokens', () => {
  it('carry 16 bytes of selector and 32 bytes of verifier, base64url, and are never stored in the clear', () => {
    const { token, selectorHash, verifierHash } = newShareToken();
    expect(token).toMatch(/^[A-Za-z0-9_-]{65}$/);
    expect(Buffer.from(token.slice(0, 22), 'base64url')).toHaveLength(16);
    expect(Buffer.from(token.slice(22), 'base64url')).toHaveLength(32);
    expect(selectorHash).not.toContain(token.slice(0, 22));
    expect(verifierHash).not.toContain(token.slice(22));
    expect(readShareToken(token)).toEqual({ selectorHash, verifierHash });
  });

  it('read nothing from text that cannot be a token', () => {
    expect(readShareToken('')).toBeNull();
    expect(readShareToken('a'.repeat(64))).toBeNull();
    expect(readShareToken(`${'a'.repeat(64)}/`)).toBeNull();
  });

  it('compare the verifier with crypto.timingSafeEqual on equal-length digests, for hits, misses and unknown selectors alike', () => {
    const { token, verifierHash } = newShareToken();
    const presented = readShareToken(token)!.verifierHash;
    const wrong = readShareToken(newShareToken().token)!.verifierHash;
    compared.calls.length = 0;
    expect(verifierMatches(presented, verifierHash)).toBe(true);
    expect(verifierMatches(wrong, verifierHash)).toBe(false);
    expect(verifierMatches(presented, null)).toBe(false);
    // A malformed token is compared too (an empty digest against a full one is refused before comparing bytes).
    expect(verifierMatches('', verifierHash)).toBe(false);
    expect(compared.calls.slice(0, 3)).toEqual([
      [32, 32],
      [32, 32],
      [32, 32],
    ]);
  });
});
