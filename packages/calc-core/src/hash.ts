// Input hashing without Node's crypto or the browser's SubtleCrypto (which is async and absent
// from some embed contexts): a small synchronous SHA-256 (FIPS 180-4) over canonical JSON, so the
// browser and the server get the same digest for the same inputs. Every calculation hashes its
// inputs once, so the hash allocates nothing per call but its answer: the message goes straight
// into a reused byte buffer and the schedule lives in one reused array. Node's own SHA-256 (which
// Node 20.16+ would hand over synchronously) is still several times faster on these inputs
// (`apps/server/bench/input-hash.ts` prints both), but a second path would add bytes to every
// widget's first flight for a few microseconds per calculation on the server.

export type JsonValue =
  null | boolean | number | string | readonly JsonValue[] | { readonly [key: string]: JsonValue };

/**
 * JSON with object keys sorted at every level and no white space. Numbers use JavaScript's
 * shortest round-trip form, which the language specifies exactly, so every engine agrees.
 * @throws TypeError for non-finite numbers, which JSON cannot carry
 */
export function canonicalJson(value: JsonValue): string {
  if (value === null || typeof value === 'boolean' || typeof value === 'string') return JSON.stringify(value);
  if (typeof value === 'number') {
    if (!Number.isFinite(value)) throw new TypeError('canonicalJson: numbers must be finite');
    return JSON.stringify(value);
  }
  if (Array.isArray(value)) return `[${value.map((v: JsonValue) => canonicalJson(v)).join(',')}]`;
  const obj = value as { readonly [key: string]: JsonValue };
  const keys = Object.keys(obj).sort();
  return `{${keys.map((k) => `${JSON.stringify(k)}:${canonicalJson(obj[k] as JsonValue)}`).join(',')}}`;
}

// FIPS 180-4 §4.2.2 and §5.3.3 define the constants as the first 32 bits of the fractional parts of
// the cube roots of the first 64 primes (K) and the square roots of the first 8 (H⁰). Deriving them
// keeps ~700 bytes of hex out of every widget. Math.sqrt is correctly rounded everywhere; the
// nearest K to a rounding edge is 0.025 of a unit in its 32nd bit, so any Math.cbrt within 10⁻¹²
// (every engine is within a few ulps) gives the same table, and the test vectors pin it.
function fractionBits(x: number): number {
  return ((x - Math.floor(x)) * 0x100000000) | 0;
}
function firstPrimes(count: number): number[] {
  const primes: number[] = [];
  for (let n = 2; primes.length < count; n++) if (primes.every((p) => n % p !== 0)) primes.push(n);
  return primes;
}

/**
 * The part of TextEncoder used here: every browser and Node have it, but calc-core's types know no
 * host (no DOM, no Node), so it is declared for this file alone.
 */
declare const TextEncoder: new () => { encodeInto(text: string, into: Uint8Array): { written: number } };

interface State {
  k: Int32Array;
  h0: Int32Array;
  /** The message schedule, reused by every block. */
  w: Int32Array;
  /** The padded message, grown when a longer one comes. */
  bytes: Uint8Array;
  encoder: InstanceType<typeof TextEncoder>;
}
let state: State | undefined;
function setUp(): State {
  if (state === undefined) {
    const primes = firstPrimes(64);
    state = {
      k: Int32Array.from(primes, (p) => fractionBits(Math.cbrt(p))),
      h0: Int32Array.from(primes.slice(0, 8), (p) => fractionBits(Math.sqrt(p))),
      w: new Int32Array(64),
      bytes: new Uint8Array(256),
      encoder: new TextEncoder(),
    };
  }
  return state;
}

/**
 * Writes the UTF-8 bytes of `text` into `s.bytes` (grown when needed) and returns their count. A
 * lone surrogate has no UTF-8 form: TextEncoder writes U+FFFD for it, as Node does.
 */
function utf8Into(s: State, text: string): number {
  // At most 3 bytes per UTF-16 unit, plus the padding's 72 at most.
  const need = text.length * 3 + 72;
  if (s.bytes.length < need) s.bytes = new Uint8Array(Math.max(need, s.bytes.length * 2));
  // Inputs are nearly always ASCII: copied directly, TextEncoder only for the rest.
  const bytes = s.bytes;
  for (let i = 0; i < text.length; i++) {
    const c = text.charCodeAt(i);
    if (c > 127) return s.encoder.encodeInto(text, bytes).written;
    bytes[i] = c;
  }
  return text.length;
}

const rotr = (x: number, n: number): number => (x >>> n) | (x << (32 - n));

/** SHA-256 of the UTF-8 bytes of `text`, as 64 lower-case hex digits. */
export function sha256Hex(text: string): string {
  const s = setUp();
  const { k, w } = s;
  const length = utf8Into(s, text);
  const bytes = s.bytes;
  // Padding (FIPS 180-4 §5.1.1): 0x80, zeros, then the length in bits as 64 bits big-endian;
  // inputs here are far below 2³² bits, so the high word's upper bytes stay 0.
  const total = (((length + 8) >> 6) + 1) << 6;
  bytes[length] = 0x80;
  bytes.fill(0, length + 1, total - 8);
  const bitsHigh = Math.floor(length / 0x20000000);
  const bitsLow = length << 3;
  for (let i = 0; i < 4; i++) {
    bytes[total - 8 + i] = bitsHigh >>> (24 - 8 * i);
    bytes[total - 4 + i] = bitsLow >>> (24 - 8 * i);
  }

  const h0 = s.h0;
  let h0a = h0[0] as number;
  let h1 = h0[1] as number;
  let h2 = h0[2] as number;
  let h3 = h0[3] as number;
  let h4 = h0[4] as number;
  let h5 = h0[5] as number;
  let h6 = h0[6] as number;
  let h7 = h0[7] as number;
  for (let off = 0; off < total; off += 64) {
    for (let i = 0; i < 16; i++) {
      const j = off + (i << 2);
      w[i] =
        ((bytes[j] as number) << 24) |
        ((bytes[j + 1] as number) << 16) |
        ((bytes[j + 2] as number) << 8) |
        (bytes[j + 3] as number);
    }
    for (let i = 16; i < 64; i++) {
      const x = w[i - 15] as number;
      const y = w[i - 2] as number;
      const s0 = rotr(x, 7) ^ rotr(x, 18) ^ (x >>> 3);
      const s1 = rotr(y, 17) ^ rotr(y, 19) ^ (y >>> 10);
      w[i] = ((w[i - 16] as number) + s0 + (w[i - 7] as number) + s1) | 0;
    }
    let a = h0a;
    let b = h1;
    let c = h2;
    let d = h3;
    let e = h4;
    let f = h5;
    let g = h6;
    let h = h7;
    for (let i = 0; i < 64; i++) {
      const S1 = rotr(e, 6) ^ rotr(e, 11) ^ rotr(e, 25);
      const t1 = (h + S1 + ((e & f) ^ (~e & g)) + (k[i] as number) + (w[i] as number)) | 0;
      const S0 = rotr(a, 2) ^ rotr(a, 13) ^ rotr(a, 22);
      const t2 = (S0 + ((a & b) ^ (a & c) ^ (b & c))) | 0;
      h = g;
      g = f;
      f = e;
      e = (d + t1) | 0;
      d = c;
      c = b;
      b = a;
      a = (t1 + t2) | 0;
    }
    h0a = (h0a + a) | 0;
    h1 = (h1 + b) | 0;
    h2 = (h2 + c) | 0;
    h3 = (h3 + d) | 0;
    h4 = (h4 + e) | 0;
    h5 = (h5 + f) | 0;
    h6 = (h6 + g) | 0;
    h7 = (h7 + h) | 0;
  }
  const word = (x: number): string => (x >>> 0).toString(16).padStart(8, '0');
  return word(h0a) + word(h1) + word(h2) + word(h3) + word(h4) + word(h5) + word(h6) + word(h7);
}
