import { hash, verify } from '@node-rs/argon2';
import { commonPasswords } from './common-passwords';

/**
 * argon2id with OWASP's minimum settings (19 MiB, 2 passes, 1 lane — OWASP Password Storage Cheat
 * Sheet); ≈ 14 ms per hash on our machines.
 */
const options = { memoryCost: 19_456, timeCost: 2, outputLen: 32, parallelism: 1 } as const;

export function hashPassword(password: string): Promise<string> {
  return hash(password, options);
}

export async function verifyPassword(passwordHash: string, password: string): Promise<boolean> {
  try {
    return await verify(passwordHash, password);
  } catch {
    return false;
  }
}

let dummyHash: Promise<string> | null = null;

/** Spends the same time as a real check, so "no such account" cannot be told apart by timing. */
export async function verifyAgainstDummy(password: string): Promise<false> {
  dummyHash ??= hashPassword('blazebook-no-such-account');
  await verifyPassword(await dummyHash, password);
  return false;
}

/** True for passwords on the short list of the most used ones (compared without case or spaces). */
export function isCommonPassword(password: string): boolean {
  return commonPasswords.has(password.trim().toLowerCase());
}
