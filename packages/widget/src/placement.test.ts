import { describe, expect, it } from 'vitest';
import { legacyKeyFrom, referenceKeyFrom } from '@wickstone/contracts';
import { apiBaseFor, isBundleSrc, isPublicKey, releaseBaseFor } from './placement.js';

const randomBytes = (n: number): Uint8Array => crypto.getRandomValues(new Uint8Array(n));
const SRC = 'https://app.wickstone.example/releases/0.1.0/wickstone-tube-rise.js';

describe('placement helpers', () => {
  it('recognises this calculator’s bundle by its file name', () => {
    expect(isBundleSrc(SRC, 'tube-rise')).toBe(true);
    expect(isBundleSrc(`${SRC}?v=1`, 'tube-rise')).toBe(true);
    expect(isBundleSrc(SRC, 'slot-rise')).toBe(false);
    expect(isBundleSrc('https://x.example/wickstone-tube-rise.json', 'tube-rise')).toBe(false);
    expect(isBundleSrc('', 'tube-rise')).toBe(false);
  });

  it('talks to the server the script came from, unless data-wickstone-api says otherwise', () => {
    expect(apiBaseFor(SRC, null)).toBe('https://app.wickstone.example');
    expect(apiBaseFor(SRC, 'https://www.brackenridge-ground.example/wickstone/')).toBe(
      'https://www.brackenridge-ground.example/wickstone',
    );
    expect(apiBaseFor(SRC, 'http://localhost:5180')).toBe('http://localhost:5180');
    expect(apiBaseFor(SRC, 'javascript:alert(1)')).toBe('https://app.wickstone.example');
    expect(apiBaseFor(SRC, '  ')).toBe('https://app.wickstone.example');
    expect(apiBaseFor('file:///tmp/wickstone-tube-rise.js', null)).toBeNull();
  });

  it('finds the release folder for the fonts', () => {
    expect(releaseBaseFor(SRC)).toBe('https://app.wickstone.example/releases/0.1.0/');
    expect(releaseBaseFor('not a url')).toBeNull();
  });

  it('accepts only widget keys', () => {
    expect(isPublicKey('wk_abcdefghij0123456789')).toBe(true);
    expect(isPublicKey('wk_ABCDEFGHIJ0123456789')).toBe(false);
    expect(isPublicKey('wk_short')).toBe(false);
    expect(isPublicKey(undefined)).toBe(false);
  });

  it('accepts reference keys (0.3.0 on) and older keys, as the server makes them', () => {
    expect(isPublicKey('988M-4JNV-N3F4-D01S-E')).toBe(true);
    for (let i = 0; i < 100; i++) {
      expect(isPublicKey(referenceKeyFrom(randomBytes(16)))).toBe(true);
      expect(isPublicKey(legacyKeyFrom(randomBytes(20)))).toBe(true);
    }
    expect(isPublicKey('988m-4jnv-n3f4-d01s-e')).toBe(false);
    expect(isPublicKey('988M4JNVN3F4D01SE')).toBe(false);
    expect(isPublicKey('988M-4JNV-N3F4-D01S')).toBe(false);
    expect(isPublicKey('988M-4JNV-N3F4-D01S-EE')).toBe(false);
    expect(isPublicKey('O88M-4JNV-N3F4-D01S-E')).toBe(false);
    expect(isPublicKey('x988M-4JNV-N3F4-D01S-E')).toBe(false);
  });
});
