import { describe, expect, it } from 'vitest';
import { apiBaseFor, isBundleSrc, isPublicKey, releaseBaseFor } from './placement.js';

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
});
