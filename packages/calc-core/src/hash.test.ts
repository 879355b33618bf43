/// <reference types="node" />
// Node's crypto appears only here, as an independent implementation to check against.
import { createHash } from 'node:crypto';
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { canonicalJson, sha256Hex, type JsonValue } from './hash.js';

describe('sha256Hex', () => {
  // [message, digest, source]
  it.each([
    [
      'abc',
      'ba7816bf8f01cfea414140de5dae2223b00361a396177a9cb410ff61f20015ad',
      'FIPS 180-2 appendix B.1, printed',
    ],
    [
      '',
      'e3b0c44298fc1c149afbf4c8996fb92427ae41e4649b934ca495991b7852b855',
      'NIST SHA-256 example, empty message',
    ],
    [
      'abcdbcdecdefdefgefghfghighijhijkijkljklmklmnlmnomnopnopq',
      '248d6a61d20638b8e5c026930c3e6039a33ce45964ff2167f6ecedd419db06c1',
      'FIPS 180-2 appendix B.2 (two blocks), printed',
    ],
  ])('%j → %s (%s)', (message, digest) => {
    expect(sha256Hex(message)).toBe(digest);
  });

  it('matches Node’s crypto for any Unicode text, across block boundaries (fast-check)', () => {
    fc.assert(
      fc.property(fc.string({ unit: 'binary', maxLength: 300 }), (text) => {
        expect(sha256Hex(text)).toBe(createHash('sha256').update(text, 'utf8').digest('hex'));
      }),
    );
    for (const odd of ['\ud800', 'a\udfffb', '😀é']) {
      expect(sha256Hex(odd)).toBe(createHash('sha256').update(odd, 'utf8').digest('hex'));
    }
  });
});

describe('canonicalJson', () => {
  const json: fc.Arbitrary<JsonValue> = fc.jsonValue() as fc.Arbitrary<JsonValue>;

  it('does not depend on key order and parses back to the same value (fast-check)', () => {
    fc.assert(
      fc.property(fc.dictionary(fc.string(), json), (obj) => {
        const reversed = Object.fromEntries(Object.entries(obj).reverse());
        expect(canonicalJson(reversed)).toBe(canonicalJson(obj));
        expect(JSON.parse(canonicalJson(obj))).toEqual(JSON.parse(JSON.stringify(obj)));
      }),
    );
  });

  it('sorts nested keys, keeps array order and refuses non-finite numbers', () => {
    expect(canonicalJson({ b: 1, a: { d: [3, 1], c: null } })).toBe('{"a":{"c":null,"d":[3,1]},"b":1}');
    expect(() => canonicalJson({ x: Infinity })).toThrow(TypeError);
  });
});
