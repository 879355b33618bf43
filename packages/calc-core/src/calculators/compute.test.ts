import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { CalcInputError } from '../errors.js';
import { calculate, calculators, compute } from '../registry.js';
import { anyInputs } from '../../testing/arbitrary.js';

// compute() is calculate() without the working text, the assumptions and the input hash: for the
// same inputs its numbers, warnings and band must be calculate's, and a bad input must fail alike.

/** The outcome of one call: its numbers, or the issues of the error it threw. */
function outcome<T>(run: () => T): { ok: T } | { issues: unknown } {
  try {
    return { ok: run() };
  } catch (err) {
    if (err instanceof CalcInputError) return { issues: err.issues };
    throw err;
  }
}

describe('compute agrees with calculate', () => {
  it.each(calculators.map((c) => [c.id, c] as const))(
    '%s: same inputs used, outputs, warnings (with their text), band, cautions and version over the whole input range',
    (id, def) => {
      fc.assert(
        fc.property(anyInputs(def), (inputs) => {
          const full = outcome(() => calculate(id, inputs));
          const fast = outcome(() => compute(id, inputs));
          if ('issues' in full) {
            expect(fast).toEqual(full);
            return;
          }
          const r = full.ok;
          expect(fast).toEqual({
            ok: {
              calculator: r.calculator,
              inputs: r.inputs,
              outputs: r.outputs,
              warnings: r.warnings,
              band: r.band,
              cautions: r.cautions,
              version: r.version,
            },
          });
        }),
        { numRuns: 150 },
      );
    },
  );

  it('defaults: every calculator, and no working, assumptions or hash in what compute gives', () => {
    for (const def of calculators) {
      const r = compute(def.id, {});
      expect(r.outputs).toEqual(calculate(def.id, {}).outputs);
      expect(Object.keys(r).sort()).toEqual(
        ['band', 'calculator', 'cautions', 'inputs', 'outputs', 'version', 'warnings'].sort(),
      );
    }
  });

  it('an unknown calculator and a bad input are refused as calculate refuses them', () => {
    expect(() => compute('no-such', {})).toThrow(CalcInputError);
    expect(outcome(() => compute('tube-rise', { diameter: -1 }))).toEqual(
      outcome(() => calculate('tube-rise', { diameter: -1 })),
    );
  });
});
