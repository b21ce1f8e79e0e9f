import { randomBytes, timingSafeEqual } from 'node:crypto';
import { hashSecret } from './secrets';

/**
 * Share-link tokens: a selector (16 random bytes) that finds the link and a verifier (32 random
 * bytes, 256 bits from the operating system's CSPRNG) that proves it, both written base64url
 * without a separator. Only SHA-256 hashes of the two parts are stored; the verifier's hash is
 * compared in constant time, so neither the index lookup nor the comparison tells a guesser
 * how close a wrong token came.
 */

const SELECTOR_BYTES = 16;
const VERIFIER_BYTES = 32;
/** base64url lengths of the two parts (no padding). */
const SELECTOR_CHARS = 22;
const VERIFIER_CHARS = 43;
const TOKEN_PATTERN = new RegExp(`^[A-Za-z0-9_-]{${SELECTOR_CHARS + VERIFIER_CHARS}}$`);

export interface NewShareToken {
  token: string;
  selectorHash: string;
  verifierHash: string;
}

export function newShareToken(): NewShareToken {
  const selector = randomBytes(SELECTOR_BYTES).toString('base64url');
  const verifier = randomBytes(VERIFIER_BYTES).toString('base64url');
  return { token: selector + verifier, selectorHash: hashSecret(selector), verifierHash: hashSecret(verifier) };
}

/** The hashes to look a token up by and to check it with; null when it cannot be a token at all. */
export function readShareToken(token: string): { selectorHash: string; verifierHash: string } | null {
  if (!TOKEN_PATTERN.test(token)) return null;
  return {
    selectorHash: hashSecret(token.slice(0, SELECTOR_CHARS)),
    verifierHash: hashSecret(token.slice(SELECTOR_CHARS)),
  };
}

// Compared against when no row matched, so a miss costs the same comparison as a hit.
const UNMATCHABLE = hashSecret(randomBytes(32).toString('base64url'));

/**
 * Whether the verifier's hash equals the stored one, in time independent of where they differ
 * (crypto.timingSafeEqual on the two 32-byte digests). `stored` null (no such selector) is false
 * after the same comparison.
 */
export function verifierMatches(presented: string, stored: string | null): boolean {
  const a = Buffer.from(presented, 'hex');
  const b = Buffer.from(stored ?? UNMATCHABLE, 'hex');
  const equal = a.length === b.length && timingSafeEqual(a, b);
  return stored !== null && equal;
}
