/**
 * Password hashing with argon2id at m = 19 MiB, t = 2, p = 1: the OWASP ASVS 5.0 Appendix C
 * minimum for argon2id (better-auth's default scrypt, N = 2^14, r = 16, is below it).
 */
import { hash, verify } from '@node-rs/argon2';

export const ARGON2_PARAMS = { memoryCost: 19_456, timeCost: 2, parallelism: 1 } as const;
export const MIN_PASSWORD_LENGTH = 12; // ASVS 4.0.3 2.1.1
export const MAX_PASSWORD_LENGTH = 128; // ASVS 4.0.3 2.1.2

export function hashPassword(password: string): Promise<string> {
  // @node-rs/argon2 defaults to Argon2id.
  return hash(password, ARGON2_PARAMS);
}

export async function verifyPassword({ hash: stored, password }: { hash: string; password: string }): Promise<boolean> {
  if (!stored.startsWith('$argon2')) return false;
  try {
    return await verify(stored, password);
  } catch {
    return false;
  }
}
