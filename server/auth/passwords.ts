import { hash, verify } from '@node-rs/argon2';

// Argon2id (the library's default algorithm) with OWASP's suggested minimum memory of 19 MiB, 2 passes.
const ARGON2_OPTIONS = { memoryCost: 19_456, timeCost: 2, parallelism: 1 };

export const hashPassword = (password: string) => hash(password, ARGON2_OPTIONS);

export async function verifyPassword(passwordHash: string | null, password: string) {
  if (!passwordHash) return false;
  try {
    return await verify(passwordHash, password);
  } catch {
    return false;
  }
}

// A hash of a fixed password, checked when the e-mail is unknown so the answer takes the same time.
let decoyHash: Promise<string> | null = null;
export function decoyPasswordHash() {
  decoyHash ??= hashPassword('patchwise-decoy-password-for-timing');
  return decoyHash;
}
