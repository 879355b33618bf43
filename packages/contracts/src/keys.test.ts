import { describe, expect, it } from 'vitest';
import {
  isReferenceKey,
  isWidgetKey,
  KEY_SYMBOLS,
  legacyKeyFrom,
  luhnModN,
  referenceKeyFrom,
} from './keys.js';
import { publicKeySchema } from './widgets.js';

const randomBytes = (n: number): Uint8Array => crypto.getRandomValues(new Uint8Array(n));

describe('Luhn mod N', () => {
  it.each([
    // [payload, alphabet, check symbol, source]
    ['7992739871', '0123456789', '3', 'Luhn algorithm worked example, Wikipedia "Luhn algorithm"'],
    [
      '424242424242424',
      '0123456789',
      '2',
      'card number 4242 4242 4242 4242 is Luhn-valid (common practice: the payments test card)',
    ],
  ])('%s over %s gives %s (%s)', (payload, alphabet, check) => {
    expect(luhnModN(payload, alphabet)).toBe(check);
  });
});

describe('reference keys', () => {
  it('are four blocks of four symbols and a check symbol, with a valid check', () => {
    for (let i = 0; i < 200; i++) {
      const key = referenceKeyFrom(randomBytes(16));
      expect(key).toMatch(/^[0-9A-HJKMNP-TV-Z]{4}(-[0-9A-HJKMNP-TV-Z]{4}){3}-[0-9A-HJKMNP-TV-Z]$/);
      expect(isReferenceKey(key)).toBe(true);
      expect(publicKeySchema.safeParse(key).success).toBe(true);
    }
  });

  it('use every symbol and only the unambiguous ones', () => {
    const seen = new Set(Array.from({ length: 400 }, () => referenceKeyFrom(randomBytes(16))).join(''));
    seen.delete('-');
    expect([...seen].sort().join('')).toBe([...KEY_SYMBOLS].sort().join(''));
    for (const confusable of ['I', 'L', 'O', 'U']) expect(seen.has(confusable)).toBe(false);
  });

  it('catch every single mistyped symbol', () => {
    for (let i = 0; i < 50; i++) {
      const key = referenceKeyFrom(randomBytes(16));
      for (let at = 0; at < key.length; at++) {
        if (key[at] === '-') continue;
        for (const other of KEY_SYMBOLS) {
          if (other === key[at]) continue;
          const typo = key.slice(0, at) + other + key.slice(at + 1);
          expect(isReferenceKey(typo), typo).toBe(false);
        }
      }
    }
  });

  it('refuse lower case, missing blocks and foreign symbols', () => {
    const key = referenceKeyFrom(randomBytes(16));
    expect(isWidgetKey(key.toLowerCase())).toBe(false);
    expect(isWidgetKey(key.slice(5))).toBe(false);
    expect(isWidgetKey(key.replace(/^./, 'O'))).toBe(false);
    expect(isWidgetKey(key.replaceAll('-', ''))).toBe(false);
  });
});

describe('older keys', () => {
  it('stay valid widget keys', () => {
    const key = legacyKeyFrom(randomBytes(20));
    expect(key).toMatch(/^wk_[a-z0-9]{20}$/);
    expect(isWidgetKey(key)).toBe(true);
    expect(publicKeySchema.safeParse('wk_abcdefghij0123456789').success).toBe(true);
    expect(publicKeySchema.safeParse('wk_ABCDEFGHIJ0123456789').success).toBe(false);
  });
});
