import { createHash, randomBytes } from 'node:crypto';
import argon2 from 'argon2';

/** A URL-safe random secret with 32 bytes of entropy. */
export function randomSecret(): string {
  return randomBytes(32).toString('base64url');
}

/** How secrets are stored: the SHA-256 hex digest (the secrets are random, so no salt is needed). */
export function hashSecret(secret: string): string {
  return createHash('sha256').update(secret).digest('hex');
}

/** API tokens are recognisable by their prefix, so a leaked one is easy to spot in logs. */
export const API_TOKEN_PREFIX = 'tl_';

export function newApiTokenSecret(): string {
  return API_TOKEN_PREFIX + randomSecret();
}

/** argon2id hash of a password (the library's defaults: 64 MiB, 3 passes). */
export function hashPassword(password: string): Promise<string> {
  return argon2.hash(password, { type: argon2.argon2id });
}

/** Checks a password against a stored hash; false for a malformed hash instead of throwing. */
export async function verifyPassword(hash: string, password: string): Promise<boolean> {
  try {
    return await argon2.verify(hash, password);
  } catch {
    return false;
  }
}

let dummyHash: Promise<string> | undefined;
/** Verifies against a throwaway hash so an unknown e-mail takes as long as a wrong password. */
export async function burnPasswordCheck(password: string): Promise<void> {
  dummyHash ??= hashPassword('not-a-real-password-' + randomSecret());
  await verifyPassword(await dummyHash, password);
}
