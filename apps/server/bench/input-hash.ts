// calc-core's input hash (canonical JSON, then SHA-256), the part of every calculate() that makes
// `inputHash`: this checkout's against the committed release 0.2.0's (the baseline, measured in the
// same run), per call, over 20,000 canonical inputs as the engine hashes them; and, for reference,
// Node's own SHA-256 (node:crypto), which calc-core does not use (it runs in the browser too). The
// digests are checked equal first. Run: npx tsx apps/server/bench/input-hash.ts (needs calc-core built).
import { createHash } from 'node:crypto';
import { createRequire } from 'node:module';
import { loadavg } from 'node:os';
import { fileURLToPath } from 'node:url';
import { canonicalJson, sha256Hex, VERSION } from '@wickstone/calc-core';

interface HashEngine {
  canonicalJson: typeof canonicalJson;
  sha256Hex: typeof sha256Hex;
}
const baseline = createRequire(import.meta.url)(
  fileURLToPath(new URL('../../../releases/0.2.0/engine.mjs', import.meta.url)),
) as HashEngine;

const N = 20_000;
const values = Array.from({ length: N }, (_, i) => ({
  calculator: 'tube-rise',
  inputs: {
    diameter: 0.0002 + i * 1.3e-9,
    contactAnglePreset: 'custom',
    contactAngleDeg: i % 90,
    liquid: 'water',
    gravity: 9.80665,
  },
}));
const texts = values.map((v) => baseline.canonicalJson(v));
for (let i = 0; i < N; i++) {
  const v = values[i] as (typeof values)[number];
  const t = texts[i] as string;
  if (
    canonicalJson(v) !== t ||
    sha256Hex(t) !== baseline.sha256Hex(t) ||
    createHash('sha256').update(t).digest('hex') !== baseline.sha256Hex(t)
  )
    throw new Error(`digests differ at ${i}`);
}

/**
 * Microseconds per call of `before` and `after`, each the best of 10 passes over all inputs, the
 * two alternating pass by pass so that the shared machine's load falls on both alike.
 */
function perCall(before: (i: number) => unknown, after: (i: number) => unknown): [number, number] {
  const best = [Infinity, Infinity];
  for (let pass = 0; pass < 11; pass++) {
    [before, after].forEach((f, k) => {
      const t0 = performance.now();
      for (let i = 0; i < N; i++) f(i);
      // The first pass warms the JIT up.
      if (pass > 0) best[k] = Math.min(best[k] as number, performance.now() - t0);
    });
  }
  return [((best[0] as number) / N) * 1000, ((best[1] as number) / N) * 1000];
}

const text = (i: number) => texts[i] as string;
const rows: [string, [number, number]][] = [
  [
    'SHA-256: release 0.2.0 -> this sha256Hex',
    perCall(
      (i) => baseline.sha256Hex(text(i)),
      (i) => sha256Hex(text(i)),
    ),
  ],
  [
    'reference: this sha256Hex -> Node’s own SHA-256',
    perCall(
      (i) => sha256Hex(text(i)),
      (i) => createHash('sha256').update(text(i)).digest('hex'),
    ),
  ],
  [
    'canonical JSON (unchanged code): 0.2.0 -> this',
    perCall(
      (i) => baseline.canonicalJson(values[i] as never),
      (i) => canonicalJson(values[i] as never),
    ),
  ],
];
console.log(
  `input hash per call, ${N.toLocaleString('en')} inputs of ~${texts[0]?.length} characters: calc-core ${VERSION}, node ${process.version}, load average ${loadavg()[0]?.toFixed(1)}`,
);
for (const [name, [before, after]] of rows)
  console.log(
    `  ${name.padEnd(48)} ${before.toFixed(2).padStart(7)} µs -> ${after.toFixed(2).padStart(6)} µs  (${(before / after).toFixed(1)}x)`,
  );
