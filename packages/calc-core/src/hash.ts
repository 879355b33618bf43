// Input hashing: SHA-256 (FIPS 180-4) over canonical JSON, so the browser and the server get the
// same digest for the same inputs. The browser's SubtleCrypto is async (and absent from some embed
// contexts), so the browser uses a small synchronous SHA-256 in plain JS here; under Node, whose
// `process.getBuiltinModule` hands over node:crypto synchronously (Node 20.16+), Node's own hash
// is used, which is faster. Every calculation hashes its inputs once, so the plain-JS hash avoids
// per-call allocation: the message is written straight into a reused byte buffer, the schedule
// lives in one reused array, hex digits come from a table.

export type JsonValue =
  null | boolean | number | string | readonly JsonValue[] | { readonly [key: string]: JsonValue };

function canonical(value: JsonValue): string {
  if (typeof value === 'number') {
    if (!Number.isFinite(value)) throw new TypeError('canonicalJson: numbers must be finite');
    // For a finite number JSON's form is the language's shortest round-trip form, as String gives.
    return String(value);
  }
  if (value === null || typeof value === 'boolean' || typeof value === 'string') return JSON.stringify(value);
  let out: string;
  if (Array.isArray(value)) {
    out = '[';
    for (let i = 0; i < value.length; i++) out += (i > 0 ? ',' : '') + canonical(value[i] as JsonValue);
    return out + ']';
  }
  const obj = value as { readonly [key: string]: JsonValue };
  const keys = Object.keys(obj).sort();
  out = '{';
  for (let i = 0; i < keys.length; i++) {
    const k = keys[i] as string;
    out += (i > 0 ? ',' : '') + JSON.stringify(k) + ':' + canonical(obj[k] as JsonValue);
  }
  return out + '}';
}

/**
 * JSON with object keys sorted at every level and no white space. Numbers use JavaScript's
 * shortest round-trip form, which the language specifies exactly, so every engine agrees.
 * @throws TypeError for non-finite numbers, which JSON cannot carry
 */
export function canonicalJson(value: JsonValue): string {
  return canonical(value);
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

interface State {
  k: Int32Array;
  h0: Int32Array;
  /** The message schedule, reused by every block. */
  w: Int32Array;
  /** The padded message, grown when a longer one comes. */
  bytes: Uint8Array;
  /** Two hex digits per byte value. */
  hex: string[];
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
      hex: Array.from({ length: 256 }, (_, i) => (i < 16 ? '0' : '') + i.toString(16)),
    };
  }
  return state;
}

/**
 * Writes the UTF-8 bytes of `text` into `s.bytes` (grown when needed) and returns their count. A
 * lone surrogate has no UTF-8 form: it becomes U+FFFD, as TextEncoder and Node do.
 */
function utf8Into(s: State, text: string): number {
  // At most 3 bytes per UTF-16 unit, plus the padding's 72 at most.
  const need = text.length * 3 + 72;
  if (s.bytes.length < need) s.bytes = new Uint8Array(Math.max(need, s.bytes.length * 2));
  const out = s.bytes;
  let n = 0;
  for (let i = 0; i < text.length; i++) {
    let cp = text.charCodeAt(i);
    if (cp < 0x80) {
      out[n++] = cp;
      continue;
    }
    if (cp >= 0xd800 && cp <= 0xdbff && i + 1 < text.length) {
      const low = text.charCodeAt(i + 1);
      if (low >= 0xdc00 && low <= 0xdfff) {
        cp = 0x10000 + ((cp - 0xd800) << 10) + (low - 0xdc00);
        i++;
      }
    }
    if (cp >= 0xd800 && cp <= 0xdfff) cp = 0xfffd;
    if (cp < 0x800) {
      out[n++] = 0xc0 | (cp >> 6);
      out[n++] = 0x80 | (cp & 63);
    } else if (cp < 0x10000) {
      out[n++] = 0xe0 | (cp >> 12);
      out[n++] = 0x80 | ((cp >> 6) & 63);
      out[n++] = 0x80 | (cp & 63);
    } else {
      out[n++] = 0xf0 | (cp >> 18);
      out[n++] = 0x80 | ((cp >> 12) & 63);
      out[n++] = 0x80 | ((cp >> 6) & 63);
      out[n++] = 0x80 | (cp & 63);
    }
  }
  return n;
}

/** SHA-256 of the UTF-8 bytes of `text`, as 64 lower-case hex digits, in plain JS (any engine). */
export function sha256HexPlain(text: string): string {
  const s = setUp();
  const { k, w, hex } = s;
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
      const s0 = ((x >>> 7) | (x << 25)) ^ ((x >>> 18) | (x << 14)) ^ (x >>> 3);
      const s1 = ((y >>> 17) | (y << 15)) ^ ((y >>> 19) | (y << 13)) ^ (y >>> 10);
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
      const S1 = ((e >>> 6) | (e << 26)) ^ ((e >>> 11) | (e << 21)) ^ ((e >>> 25) | (e << 7));
      const t1 = (h + S1 + ((e & f) ^ (~e & g)) + (k[i] as number) + (w[i] as number)) | 0;
      const S0 = ((a >>> 2) | (a << 30)) ^ ((a >>> 13) | (a << 19)) ^ ((a >>> 22) | (a << 10));
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
  const word = (x: number): string =>
    (hex[x >>> 24] as string) +
    (hex[(x >>> 16) & 0xff] as string) +
    (hex[(x >>> 8) & 0xff] as string) +
    (hex[x & 0xff] as string);
  return word(h0a) + word(h1) + word(h2) + word(h3) + word(h4) + word(h5) + word(h6) + word(h7);
}

interface NodeHash {
  update(text: string, encoding: 'utf8'): NodeHash;
  digest(encoding: 'hex'): string;
}
type CreateHash = (algorithm: 'sha256') => NodeHash;

/** Node's createHash when the host hands it over synchronously; undefined in a browser. */
function nodeCreateHash(): CreateHash | undefined {
  const host = (globalThis as { process?: { getBuiltinModule?: (id: string) => unknown } }).process;
  if (typeof host?.getBuiltinModule !== 'function') return undefined;
  const crypto = host.getBuiltinModule('node:crypto') as { createHash?: CreateHash } | undefined;
  return typeof crypto?.createHash === 'function' ? crypto.createHash : undefined;
}
const createHash = nodeCreateHash();

/** SHA-256 of the UTF-8 bytes of `text`, as 64 lower-case hex digits. */
export const sha256Hex: (text: string) => string =
  createHash === undefined
    ? sha256HexPlain
    : (text) => createHash('sha256').update(text, 'utf8').digest('hex');
