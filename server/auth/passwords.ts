import { hash, verify } from '@node-rs/argon2';

// Argon2id (the library's default algorithm) with OWASP's suggested minimum memory of 19 MiB, 2 passes.
const ARGON2_OPTIONS = { memoryCost: 19_456, timeCost: 2, parallelism: 1 };

export const hashPassword = (password: string) => hash(password, ARGON2_OPTIONS);

/**
 * Checks a password against a hash. Without a hash (an unknown address, or an invited account that has not set a
 * password yet) it checks against a decoy hash and answers false, so every failure costs the same Argon2 work.
 */
export async function verifyPassword(passwordHash: string | null, password: string) {
  try {
    const matches = await verify(passwordHash || (await decoyPasswordHash()), password);
    return Boolean(passwordHash) && matches;
  } catch {
    return false;
  }
}

// A hash of a fixed password, the one checked when there is no hash of the account's own.
let decoyHash: Promise<string> | null = null;
export function decoyPasswordHash() {
  decoyHash ??= hashPassword('patchwise-decoy-password-for-timing');
  return decoyHash;
}
