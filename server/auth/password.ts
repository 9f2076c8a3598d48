import { hash, verify } from '@node-rs/argon2';
import { commonPasswords } from './common-passwords';

/** argon2id's cost: memory in KiB, passes over it, lanes. */
export type Argon2Cost = { memoryCost: number; timeCost: number; parallelism: number };

/**
 * OWASP's minimum settings for argon2id (19 MiB, 2 passes, 1 lane — OWASP Password Storage Cheat
 * Sheet); ≈ 14 ms per hash on our machines. Every app takes it unless a test injects another.
 */
export const productionArgon2Cost: Argon2Cost = { memoryCost: 19_456, timeCost: 2, parallelism: 1 };

export type PasswordHasher = {
  hash(password: string): Promise<string>;
  /** False for a wrong password and for anything that is not one of our hashes. */
  verify(passwordHash: string, password: string): Promise<boolean>;
  /** Spends the same time as a real check, so "no such account" cannot be told apart by timing. */
  verifyAgainstDummy(password: string): Promise<false>;
};

/**
 * argon2id at the given cost. A hash carries its own cost, so `verify` reads any of ours; the
 * dummy is hashed at this cost, so an unknown e-mail costs what a known one does.
 */
export function createPasswordHasher(cost: Argon2Cost = productionArgon2Cost): PasswordHasher {
  const options = { ...cost, outputLen: 32 };
  let dummyHash: Promise<string> | null = null;
  const hasher: PasswordHasher = {
    hash: (password) => hash(password, options),
    async verify(passwordHash, password) {
      try {
        return await verify(passwordHash, password);
      } catch {
        return false;
      }
    },
    async verifyAgainstDummy(password) {
      dummyHash ??= hasher.hash('blazebook-no-such-account');
      await hasher.verify(await dummyHash, password);
      return false;
    },
  };
  return hasher;
}

/** The production hasher, for code that runs outside an app (the demo seed). */
export const passwordHasher = createPasswordHasher();

/** True for passwords on the short list of the most used ones (compared without case or spaces). */
export function isCommonPassword(password: string): boolean {
  return commonPasswords.has(password.trim().toLowerCase());
}
