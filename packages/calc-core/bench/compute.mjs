// calculate() against compute() per calculator, warm, in the same run: the median µs of one call
// over rounds of many calls, on the defaults and on a table liquid with a spread (a band).
// compute gives the numbers without the working text, the assumptions and the input hash.
// Usage: npm run build -w packages/calc-core && node packages/calc-core/bench/compute.mjs
import { calculate, calculators, compute } from '../dist/index.js';

const ROUNDS = 31;
const CALLS = 400;

/** Median µs of one call of `fn`, after a warm-up. */
function median(fn) {
  for (let i = 0; i < 2000; i++) fn();
  const perCall = [];
  for (let r = 0; r < ROUNDS; r++) {
    const t0 = process.hrtime.bigint();
    for (let i = 0; i < CALLS; i++) fn();
    perCall.push(Number(process.hrtime.bigint() - t0) / 1000 / CALLS);
  }
  return perCall.sort((a, b) => a - b)[ROUNDS >> 1];
}

const cases = [
  ...calculators.map((c) => [`${c.id}`, c.id, {}]),
  ['tube-rise, mercury (band)', 'tube-rise', { liquid: 'mercury', contactAnglePreset: 'mercury-glass' }],
];
console.log(
  `${'calculator (inputs: defaults)'.padEnd(34)}${'calculate µs'.padStart(14)}${'compute µs'.padStart(12)}${'ratio'.padStart(8)}`,
);
for (const [name, id, inputs] of cases) {
  // Interleaved so that both see the same machine load.
  const full = median(() => calculate(id, inputs));
  const fast = median(() => compute(id, inputs));
  console.log(
    `${name.padEnd(34)}${full.toFixed(2).padStart(14)}${fast.toFixed(2).padStart(12)}${(fast / full).toFixed(2).padStart(8)}`,
  );
}
console.log(
  `median of ${ROUNDS} rounds of ${CALLS} calls each, after 2,000 warm-up calls; ratio = compute / calculate`,
);
