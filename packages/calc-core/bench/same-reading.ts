// Checks that two builds of calc-core read results alike to a person: for every calculator over its
// defaults and random inputs (`anyInputs`, seeded), the headline in both unit systems, each warning
// worded (`readWarning`) and the working's and assumptions' sentences re-stated in the reader's
// units (`inReaderUnits`), and every conversion between two units of a kind over a spread of values.
// Usage: npx tsx bench/same-reading.ts <other dist dir> [runs per calculator]; e.g. copy main's
// built dist aside, build this tree's, and compare (same-results.ts compares the numbers).
import path from 'node:path';
import { pathToFileURL } from 'node:url';
import fc from 'fast-check';
import { anyInputs } from '../testing/arbitrary.js';

type Index = typeof import('../src/index.js');

const [otherDir, runsArg = '200'] = process.argv.slice(2);
if (otherDir === undefined) throw new Error('usage: npx tsx bench/same-reading.ts <other dist dir> [runs]');
const runs = Number(runsArg);
const load = async (dir: string): Promise<Index> =>
  (await import(pathToFileURL(path.resolve(dir, 'index.js')).href)) as Index;
const a = await load(otherDir);
const b = await load(path.resolve(import.meta.dirname, '..', 'dist'));

const outcome = (f: () => unknown): string => {
  try {
    return JSON.stringify(f());
  } catch (err) {
    return `throws ${String((err as Error).message)}`;
  }
};

/** Everything a person reads of one result, through one build's functions. */
function reading(lib: Index, id: string, raw: unknown): unknown {
  const def = lib.getCalculator(id);
  if (def === undefined) throw new Error(`no calculator ${id}`);
  const result = lib.calculate(id, raw);
  return (['si', 'us'] as const).map((system) => ({
    headline: lib.headline(def, result, system),
    warnings: result.warnings.map((w) => lib.readWarning(w, system, def)),
    working: result.working.map((s) => lib.inReaderUnits(`${s.substituted} = ${String(s.value)}`, system)),
    assumptions: result.assumptions.map((x) => lib.inReaderUnits(x, system)),
  }));
}

let compared = 0;
let differ = 0;
const check = (label: string, x: string, y: string): void => {
  compared++;
  if (x === y) return;
  differ++;
  if (differ <= 5) console.log(`${label} differs:\n  ${x.slice(0, 400)}\n  ${y.slice(0, 400)}`);
};
for (const def of b.calculators) {
  const samples: unknown[] = [{}, ...fc.sample(anyInputs(def), { numRuns: runs, seed: 14 })];
  for (const raw of samples)
    check(
      `${def.id} ${JSON.stringify(raw)}`,
      outcome(() => reading(a, def.id, raw)),
      outcome(() => reading(b, def.id, raw)),
    );
}
const values = [-40, -1e-7, 0, 1e-9, 0.0254, 1, 9.80665, 20, 273.15, 1234.5, 6.02e8];
for (const from of Object.keys(b.units))
  for (const to of Object.keys(b.units))
    if (b.units[from as keyof Index['units']].kind === b.units[to as keyof Index['units']].kind)
      check(
        `${from} -> ${to}`,
        outcome(() => values.map((v) => a.convert(v, from, to))),
        outcome(() => values.map((v) => b.convert(v, from, to))),
      );
console.log(`${compared} readings and conversions compared: ${differ} differ`);
process.exitCode = differ === 0 ? 0 : 1;
