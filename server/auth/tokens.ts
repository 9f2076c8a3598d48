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
