/**
 * Widget keys. A key is public (it sits in the firm's page) but names one widget, so it must be
 * unguessable, easy to read out over the phone and hard to mistype unnoticed.
 *
 * Reference keys (from widget release 0.3.0): four blocks of four symbols and a check symbol,
 * `K7QM-4XD9-T2HB-R6NP-W`, written like a survey or job reference. The symbols are Crockford's
 * Base32 set (digits and capitals without I, L, O, U), so 1/I/L and 0/O are never confused; 16
 * random symbols carry 80 bits. The check symbol is Luhn's mod N algorithm over the same 32
 * symbols: every single wrong symbol changes it, so a mistyped key is told apart from a key of a
 * widget that does not exist.
 *
 * Older keys (`wk_` and 20 of [a-z0-9]) stay valid wherever they were accepted: the loaders of
 * releases 0.1.0 and 0.2.0 read only those.
 */

/** Crockford's Base32 symbols, in value order. */
export const KEY_SYMBOLS = '0123456789ABCDEFGHJKMNPQRSTVWXYZ';
const SYMBOL = '[0-9A-HJKMNP-TV-Z]';

export const legacyKeyPattern = /^wk_[a-z0-9]{20}$/;
export const referenceKeyPattern = new RegExp(`^${SYMBOL}{4}(?:-${SYMBOL}{4}){3}-${SYMBOL}$`);

/** The first widget release whose loader reads reference keys; older loaders read only `wk_` keys. */
export const REFERENCE_KEYS_SINCE = '0.3.0';

/** The longest overlap a key rotation may give the old key. */
export const MAX_KEY_OVERLAP_DAYS = 90;

/**
 * Luhn's mod N check symbol over `alphabet` (N its length): the symbol that makes the doubled-
 * alternately sum of `symbols` plus it a multiple of N. With the ten digits it is the Luhn check
 * digit of card numbers (ISO/IEC 7812-1).
 */
export function luhnModN(symbols: string, alphabet: string): string {
  const n = alphabet.length;
  let factor = 2;
  let sum = 0;
  for (let i = symbols.length - 1; i >= 0; i--) {
    const value = alphabet.indexOf(symbols[i] as string);
    if (value < 0) throw new Error(`Not a symbol of the alphabet: ${symbols[i]}`);
    const addend = factor * value;
    sum += Math.floor(addend / n) + (addend % n);
    factor = factor === 2 ? 1 : 2;
  }
  return alphabet[(n - (sum % n)) % n] as string;
}

/** A reference key's check symbol: Luhn mod 32 over its 16 symbols. */
export const keyCheckSymbol = (symbols: string): string => luhnModN(symbols, KEY_SYMBOLS);

/** A reference key's shape and check symbol. */
export function isReferenceKey(key: string): boolean {
  if (!referenceKeyPattern.test(key)) return false;
  const symbols = key.replaceAll('-', '');
  return keyCheckSymbol(symbols.slice(0, -1)) === symbols.slice(-1);
}

/** Either kind of widget key, well formed. */
export function isWidgetKey(key: string): boolean {
  return legacyKeyPattern.test(key) || isReferenceKey(key);
}

/** A reference key from 16 random bytes (the low 5 bits of each: 256 is a multiple of 32, so uniform). */
export function referenceKeyFrom(random: Uint8Array): string {
  if (random.length < 16) throw new Error('A reference key needs 16 random bytes');
  const symbols = Array.from(random.subarray(0, 16), (b) => KEY_SYMBOLS[b & 31]).join('');
  const blocks = symbols.match(/.{4}/g) as string[];
  return `${blocks.join('-')}-${keyCheckSymbol(symbols)}`;
}

/** An older-style key from 20 random bytes (for widgets on releases before REFERENCE_KEYS_SINCE). */
export function legacyKeyFrom(random: Uint8Array): string {
  if (random.length < 20) throw new Error('An older-style key needs 20 random bytes');
  const alphabet = 'abcdefghijklmnopqrstuvwxyz0123456789';
  return `wk_${Array.from(random.subarray(0, 20), (b) => alphabet[b % 36]).join('')}`;
}
