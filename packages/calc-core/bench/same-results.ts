// Checks that two builds of calc-core give the same results: `calculate` and `compute` of every
// calculator over its defaults and random inputs (`anyInputs`, seeded), compared as JSON, errors
// included. Usage: npx tsx bench/same-results.ts <other dist dir> [runs per calculator]; e.g. build
// main's calc-core, copy its dist aside, build this tree's, and compare.
import path from 'node:path';
import { pathToFileURL } from 'node:url';
import fc from 'fast-check';
import { anyInputs } from '../testing/arbitrary.js';

type Run = (id: string, inputs: unknown) => unknown;
interface Build {
  readonly calculate: Run;
  readonly compute: Run;
  readonly calculators: readonly import('../src/calculators/types.js').CalculatorDefinition[];
}

const [otherDir, runsArg = '300'] = process.argv.slice(2);
if (otherDir === undefined) throw new Error('usage: npx tsx bench/same-results.ts <other dist dir> [runs]');
const runs = Number(runsArg);
const load = async (file: string): Promise<Build> =>
  (await import(pathToFileURL(path.resolve(file, 'index.js')).href)) as Build;
const a = await load(otherDir);
const b = await load(path.resolve(import.meta.dirname, '..', 'dist'));

const outcome = (f: () => unknown): string => {
  try {
    return JSON.stringify(f());
  } catch (err) {
    const e = err as { constructor?: { name?: string }; issues?: unknown; message?: string };
    return `throws ${String(e.constructor?.name)}: ${JSON.stringify(e.issues ?? e.message)}`;
  }
};

let compared = 0;
let differ = 0;
let errors = 0;
for (const def of b.calculators) {
  const samples: unknown[] = [{}, ...fc.sample(anyInputs(def), { numRuns: runs, seed: 14 })];
  for (const raw of samples) {
    for (const fn of ['calculate', 'compute'] as const) {
      const x = outcome(() => a[fn](def.id, raw));
      const y = outcome(() => b[fn](def.id, raw));
      compared++;
      if (x.startsWith('throws')) errors++;
      if (x !== y) {
        differ++;
        if (differ <= 5)
          console.log(
            `${def.id} ${fn} differs for ${JSON.stringify(raw)}:\n  ${x.slice(0, 400)}\n  ${y.slice(0, 400)}`,
          );
      }
    }
  }
}
console.log(
  `${b.calculators.length} calculators, ${compared} results compared (${errors} of them input errors): ${differ} differ`,
);
process.exitCode = differ === 0 ? 0 : 1;
