import { generateIdFromEntropySize } from 'lucia';
import { alphabet, generateRandomString, sha256 } from 'oslo/crypto';
import { encodeHex } from 'oslo/encoding';

/** 40 characters from 36: ≈ 206 bits, far beyond guessing. */
const tokenLength = 40;

/** SHA-256 in hex: what the database keeps instead of a link's token. */
export async function hashToken(token: string): Promise<string> {
  return encodeHex(await sha256(new TextEncoder().encode(token)));
}

/** A fresh random token for an e-mailed link, and the hash to store for it. */
export async function createToken(): Promise<{ token: string; hash: string }> {
  const token = generateRandomString(tokenLength, alphabet('a-z', '0-9'));
  return { token, hash: await hashToken(token) };
}

/**
 * A new id for a user or a stored file: 10 random bytes, base32 (16 characters). Lucia makes it;
 * this is the only place outside server/auth/lucia.ts that knows, so replacing Lucia touches
 * server/auth alone (DEVELOPERS.md).
 */
export function newRecordId(): string {
  return generateIdFromEntropySize(10);
}
