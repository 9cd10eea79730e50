import { hash, verify } from '@node-rs/argon2';

// OWASP's argon2id minimum (19 MiB, 2 iterations, 1 lane) — common practice, no source in ../shared.
const ARGON2_OPTIONS = { memoryCost: 19456, timeCost: 2, parallelism: 1, outputLen: 32 } as const;

/** argon2id hash in PHC string form (the algorithm default of @node-rs/argon2 is argon2id). */
export function hashPassword(password: string): Promise<string> {
  return hash(password, ARGON2_OPTIONS);
}

/** Constant-time check inside argon2; a malformed stored hash counts as "no match". */
export async function verifyPassword(passwordHash: string, password: string): Promise<boolean> {
  try {
    return await verify(passwordHash, password);
  } catch {
    return false;
  }
}
