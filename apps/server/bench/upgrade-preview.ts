// The upgrade preview's engine time for 100,000 logged runs (issue 15: goal at most 1 s on this
// machine). Engines: the committed release 0.1.0's engine.mjs against this checkout's calc-core.
// Baseline, measured in the same run: every run computed by both engines one by one (what a
// preview costs without reusing the result of inputs already computed), on a sample and scaled.
// Two mixes of runs: a widget's usual traffic (inputs from a few hundred combinations of bores,
// contact angles and liquids, as presets and locked inputs make them) and the worst case, every
// run's inputs different (measured on 10,000 runs and scaled to 100,000).
// Run: npx tsx apps/server/bench/upgrade-preview.ts (needs calc-core built).
import { randomUUID } from 'node:crypto';
import { createRequire } from 'node:module';
import { fileURLToPath } from 'node:url';
import * as current from '@wickstone/calc-core';
import { compareEngines, type PreviewRun } from '../src/releases/preview.js';
import type { RunEngine } from '../src/releases/service.js';

const RUNS = 100_000;
const published = createRequire(import.meta.url)(
  fileURLToPath(new URL('../../../releases/0.1.0/engine.mjs', import.meta.url)),
) as RunEngine;

const bores = [0.0002, 0.0003, 0.0005, 0.0008, 0.001, 0.0012, 0.0015, 0.002, 0.003, 0.005, 0.008, 0.01];
const angles = [0, 5, 10, 20, 30, 45, 60, 90];
const liquids = ['water', 'ethanol', 'glycerol'];
const usual = (i: number) => ({
  diameter: bores[i % bores.length],
  contactAnglePreset: 'custom',
  contactAngleDeg: angles[Math.floor(i / bores.length) % angles.length],
  liquid: liquids[Math.floor(i / (bores.length * angles.length)) % liquids.length],
});
const distinct = (i: number) => ({
  diameter: 0.0002 + i * 1e-9,
  contactAnglePreset: 'custom',
  contactAngleDeg: 20,
  liquid: 'water',
});
const runsOf = (n: number, inputs: (i: number) => object): PreviewRun[] =>
  Array.from({ length: n }, (_, i) => ({
    id: randomUUID(),
    createdAt: new Date(),
    inputs: JSON.stringify(inputs(i * 7919)),
  }));

function oneByOne(runs: PreviewRun[]): number {
  const t0 = performance.now();
  for (const r of runs) {
    const inputs = JSON.parse(r.inputs) as object;
    published.calculate('tube-rise', inputs);
    current.calculate('tube-rise', inputs);
  }
  return performance.now() - t0;
}

// Warm both engines' JIT.
compareEngines(published, current, 'tube-rise', runsOf(2_000, distinct));

const sample = 5_000;
const baseline = (oneByOne(runsOf(sample, usual)) * RUNS) / sample;
const usualRuns = runsOf(RUNS, usual);
const combos = new Set(usualRuns.map((r) => r.inputs)).size;
const usualMs = compareEngines(published, current, 'tube-rise', usualRuns).engineMs;
const worstSample = 10_000;
const worstMs =
  (compareEngines(published, current, 'tube-rise', runsOf(worstSample, distinct)).engineMs * RUNS) /
  worstSample;

const s = (ms: number) => `${(ms / 1000).toFixed(2)} s`;
console.log(
  `upgrade preview, engine time for ${RUNS.toLocaleString('en')} tube-rise runs, 0.1.0 -> calc-core ${current.VERSION}, node ${process.version}`,
);
console.log(`  baseline, each run by both engines one by one (scaled from ${sample}): ${s(baseline)}`);
console.log(
  `  usual traffic (${combos} distinct inputs):                           ${s(usualMs)}  (${(baseline / usualMs).toFixed(0)}x faster than the baseline; goal 1 s: ${usualMs <= 1000 ? 'met' : 'missed'})`,
);
console.log(
  `  worst case, every run different (scaled from ${worstSample}):        ${s(worstMs)}  (${(baseline / worstMs).toFixed(1)}x; goal 1 s: ${worstMs <= 1000 ? 'met' : 'missed'})`,
);
