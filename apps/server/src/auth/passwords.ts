import bcrypt from 'bcryptjs';
import { dictionary } from '@zxcvbn-ts/language-common';
import { fieldError } from '../errors.js';

let common: Set<string> | undefined;

/**
 * The most common passwords, from zxcvbn-ts's common dictionary (about 49,000 entries, ranked by
 * frequency in leaked-password corpora, all lower case). Built on first use.
 */
function commonPasswords(): Set<string> {
  common ??= new Set(dictionary['passwords-common']);
  return common;
}

/** True when the password, ignoring case, is on the common list ("Password1" is "password1"). */
export function isCommonPassword(password: string): boolean {
  return commonPasswords().has(password.toLowerCase());
}

const utf8 = new TextEncoder();

/** bcrypt reads 72 bytes; the contracts refuse longer new passwords, so a longer one can never match. */
export const BCRYPT_MAX_BYTES = 72;

/**
 * The server-side half of the new-password rules (the contracts check length and bytes): 400 naming
 * `field` when the password is a common one.
 */
export function assertAcceptablePassword(password: string, field: string): void {
  if (isCommonPassword(password)) {
    throw fieldError(field, 'This is one of the most common passwords: choose another');
  }
}

export function hashPassword(password: string, cost: number): Promise<string> {
  return bcrypt.hash(password, cost);
}

const dummyHashes = new Map<number, Promise<string>>();

/**
 * Compare a password with a stored hash. With no hash (unknown address) it still spends one bcrypt
 * comparison at the same cost, so the answer's timing does not tell whether the address has an account.
 */
export async function verifyPassword(password: string, hash: string | null, cost: number): Promise<boolean> {
  const tooLong = utf8.encode(password).length > BCRYPT_MAX_BYTES;
  if (hash === null || tooLong) {
    let dummy = dummyHashes.get(cost);
    if (!dummy) {
      dummy = bcrypt.hash('wickstone-timing-equaliser', cost);
      dummyHashes.set(cost, dummy);
    }
    await bcrypt.compare(password.slice(0, BCRYPT_MAX_BYTES), await dummy);
    return false;
  }
  return bcrypt.compare(password, hash);
}
