import { createHash, randomBytes } from 'node:crypto';

/** A random single-use token for an e-mailed link (256 bits, URL-safe) and the hash that is stored instead. */
export function newLinkToken(): { token: string; hash: string } {
  const token = randomBytes(32).toString('base64url');
  return { token, hash: hashLinkToken(token) };
}

/** SHA-256 is enough here: the token is random, not a password, so there is nothing to slow-hash. */
export function hashLinkToken(token: string): string {
  return createHash('sha256').update(token, 'utf8').digest('hex');
}
