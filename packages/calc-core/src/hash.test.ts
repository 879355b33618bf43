/// <reference types="node" />
// Node's crypto appears only here, as an independent implementation to check against.
import { createHash } from 'node:crypto';
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { canonicalJson, sha256Hex, type JsonValue } from './hash.js';

const nodeDigest = (text: string) => createHash('sha256').update(text, 'utf8').digest('hex');

describe('sha256Hex', () => {
  const hash = sha256Hex;
  // [message as named, digest, source, message]
  it.each([
    [
      '"abc"',
      'ba7816bf8f01cfea414140de5dae2223b00361a396177a9cb410ff61f20015ad',
      'FIPS 180-2 appendix B.1, printed',
      'abc',
    ],
    [
      'the empty message',
      'e3b0c44298fc1c149afbf4c8996fb92427ae41e4649b934ca495991b7852b855',
      'NIST SHA-256 example, empty message',
      '',
    ],
    [
      '"abcdbcdecdefdefgefghfghighijhijkijkljklmklmnlmnomnopnopq"',
      '248d6a61d20638b8e5c026930c3e6039a33ce45964ff2167f6ecedd419db06c1',
      'FIPS 180-2 appendix B.2 (two blocks), printed',
      'abcdbcdecdefdefgefghfghighijhijkijkljklmklmnlmnomnopnopq',
    ],
    [
      'one million "a"',
      'cdc76e5c9914fb9281a1c7e284d73e67f1809a48a497200e046d39ccc7112cd0',
      'FIPS 180-2 appendix B.3, from memory, agrees with node:crypto',
      'a'.repeat(1_000_000),
    ],
  ])('%s → %s (%s)', (_named, digest, _source, message) => {
    expect(hash(message)).toBe(digest);
  });

  it('matches Node’s crypto for any Unicode text, across block boundaries (fast-check)', () => {
    fc.assert(
      fc.property(fc.string({ unit: 'binary', maxLength: 300 }), (text) => {
        expect(hash(text)).toBe(nodeDigest(text));
      }),
    );
    for (const odd of ['\ud800', 'a\udfffb', '😀é']) expect(hash(odd)).toBe(nodeDigest(odd));
  });

  it('matches Node’s crypto at every length around the padding edges, and after a long message', () => {
    // 55/56 bytes: the length still fits the block or needs a second; 63/64/65: a block's edge.
    for (let n = 0; n <= 200; n++) {
      const text = 'x'.repeat(n);
      expect(hash(text), `${n} bytes`).toBe(nodeDigest(text));
    }
    // The plain hash reuses its buffer: a short message after a long one must not see its bytes.
    expect(hash('é'.repeat(5_000))).toBe(nodeDigest('é'.repeat(5_000)));
    expect(hash('abc')).toBe(nodeDigest('abc'));
  });

  it('matches Node’s crypto on 20,000 canonical inputs as the engine hashes them', () => {
    const liquids = ['water', 'ethanol', 'glycerol', 'mercury'];
    for (let i = 0; i < 20_000; i++) {
      const text = canonicalJson({
        calculator: 'tube-rise',
        inputs: { diameter: 0.0002 + i * 1.37e-9, contactAngleDeg: i % 90, liquid: liquids[i % 4] as string },
      });
      expect(hash(text)).toBe(nodeDigest(text));
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

  it('writes what the straightforward form writes: JSON.stringify of each leaf, keys sorted (fast-check)', () => {
    const reference = (v: JsonValue): string =>
      v === null || typeof v !== 'object'
        ? JSON.stringify(v)
        : Array.isArray(v)
          ? `[${(v as readonly JsonValue[]).map(reference).join(',')}]`
          : `{${Object.keys(v)
              .sort()
              .map(
                (k) => `${JSON.stringify(k)}:${reference((v as Record<string, JsonValue>)[k] as JsonValue)}`,
              )
              .join(',')}}`;
    fc.assert(
      fc.property(json, (value) => {
        expect(canonicalJson(value)).toBe(reference(value));
      }),
    );
    const odd = [-0, 1e21, 5e-324, 0.1 + 0.2, -1.5e-7, 2 ** 53 + 2];
    expect(canonicalJson(odd)).toBe(JSON.stringify(odd));
  });

  it('sorts nested keys, keeps array order and refuses non-finite numbers', () => {
    expect(canonicalJson({ b: 1, a: { d: [3, 1], c: null } })).toBe('{"a":{"c":null,"d":[3,1]},"b":1}');
    expect(() => canonicalJson({ x: Infinity })).toThrow(TypeError);
  });
});
