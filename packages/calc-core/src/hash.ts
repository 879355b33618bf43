// Input hashing without Node's crypto or the browser's SubtleCrypto (which is async and absent
// from some embed contexts): a small synchronous SHA-256 (FIPS 180-4) over canonical JSON, so the
// browser and the server get the same digest for the same inputs.

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

function utf8(text: string): number[] {
  const out: number[] = [];
  for (let i = 0; i < text.length; i++) {
    let cp = text.charCodeAt(i);
    if (cp >= 0xd800 && cp <= 0xdbff && i + 1 < text.length) {
      const low = text.charCodeAt(i + 1);
      if (low >= 0xdc00 && low <= 0xdfff) {
        cp = 0x10000 + ((cp - 0xd800) << 10) + (low - 0xdc00);
        i++;
      }
    }
    // A lone surrogate has no UTF-8 form; replace it as TextEncoder and Node do.
    if (cp >= 0xd800 && cp <= 0xdfff) cp = 0xfffd;
    if (cp < 0x80) out.push(cp);
    else if (cp < 0x800) out.push(0xc0 | (cp >> 6), 0x80 | (cp & 63));
    else if (cp < 0x10000) out.push(0xe0 | (cp >> 12), 0x80 | ((cp >> 6) & 63), 0x80 | (cp & 63));
    else out.push(0xf0 | (cp >> 18), 0x80 | ((cp >> 12) & 63), 0x80 | ((cp >> 6) & 63), 0x80 | (cp & 63));
  }
  return out;
}

// FIPS 180-4 §4.2.2 and §5.3.3 define the constants as the first 32 bits of the fractional parts of
// the cube roots of the first 64 primes (K) and the square roots of the first 8 (H⁰). Deriving them
// keeps ~700 bytes of hex out of every widget. Math.sqrt is correctly rounded everywhere; the
// nearest K to a rounding edge is 0.025 of a unit in its 32nd bit, so any Math.cbrt within 10⁻¹²
// (every engine is within a few ulps) gives the same table, and the test vectors pin it.
function fractionBits(x: number): number {
  return ((x - Math.floor(x)) * 0x100000000) >>> 0;
}
function firstPrimes(count: number): number[] {
  const primes: number[] = [];
  for (let n = 2; primes.length < count; n++) if (primes.every((p) => n % p !== 0)) primes.push(n);
  return primes;
}
let tables: { k: Uint32Array; h0: Uint32Array } | undefined;
function constants(): { k: Uint32Array; h0: Uint32Array } {
  if (tables === undefined) {
    const primes = firstPrimes(64);
    tables = {
      k: Uint32Array.from(primes, (p) => fractionBits(Math.cbrt(p))),
      h0: Uint32Array.from(primes.slice(0, 8), (p) => fractionBits(Math.sqrt(p))),
    };
  }
  return tables;
}

/** SHA-256 of the UTF-8 bytes of `text`, as 64 lower-case hex digits. */
export function sha256Hex(text: string): string {
  const { k, h0 } = constants();
  const message = utf8(text);
  const bitLength = message.length * 8;
  const padded = new Uint8Array((((message.length + 8) >> 6) + 1) << 6);
  padded.set(message);
  padded[message.length] = 0x80;
  // 64-bit big-endian length; inputs here are far below 2³² bits, so the high word stays 0.
  const view = new DataView(padded.buffer);
  view.setUint32(padded.length - 4, bitLength >>> 0);
  view.setUint32(padded.length - 8, Math.floor(bitLength / 0x100000000));

  const h = Uint32Array.from(h0);
  const w = new Uint32Array(64);
  const rotr = (x: number, n: number): number => (x >>> n) | (x << (32 - n));
  for (let off = 0; off < padded.length; off += 64) {
    for (let i = 0; i < 16; i++) w[i] = view.getUint32(off + i * 4);
    for (let i = 16; i < 64; i++) {
      const a = w[i - 15] as number;
      const b = w[i - 2] as number;
      const s0 = rotr(a, 7) ^ rotr(a, 18) ^ (a >>> 3);
      const s1 = rotr(b, 17) ^ rotr(b, 19) ^ (b >>> 10);
      w[i] = (w[i - 16] as number) + s0 + (w[i - 7] as number) + s1;
    }
    let a = h[0] as number;
    let b = h[1] as number;
    let c = h[2] as number;
    let d = h[3] as number;
    let e = h[4] as number;
    let f = h[5] as number;
    let g = h[6] as number;
    let hh = h[7] as number;
    for (let i = 0; i < 64; i++) {
      const t1 =
        (hh +
          (rotr(e, 6) ^ rotr(e, 11) ^ rotr(e, 25)) +
          ((e & f) ^ (~e & g)) +
          (k[i] as number) +
          (w[i] as number)) >>>
        0;
      const t2 = ((rotr(a, 2) ^ rotr(a, 13) ^ rotr(a, 22)) + ((a & b) ^ (a & c) ^ (b & c))) >>> 0;
      hh = g;
      g = f;
      f = e;
      e = (d + t1) >>> 0;
      d = c;
      c = b;
      b = a;
      a = (t1 + t2) >>> 0;
    }
    const add = [a, b, c, d, e, f, g, hh];
    for (let i = 0; i < 8; i++) h[i] = ((h[i] as number) + (add[i] as number)) >>> 0;
  }
  return Array.from(h, (x) => x.toString(16).padStart(8, '0')).join('');
}
