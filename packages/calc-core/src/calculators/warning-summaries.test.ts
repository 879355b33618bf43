/// <reference types="vite/client" />
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { anyInputs } from '../../testing/arbitrary.js';
import { headline } from '../answer.js';
import { calculators, withTexts } from '../registry.js';
import { computeCalculation } from './engine.js';
import type { CalculatorCore, CalculatorDefinition, ComputedResult } from './types.js';

// A core declares every warning its solve raises but carries only the summaries its first view can
// show: the headline's, which says why a withheld output has no figure. Its texts carry them all,
// and the whole calculator (the registry's, the widget's once its texts arrive) has every one.

const cores = Object.values(
  import.meta.glob<{ calculator: CalculatorCore }>(['./*.ts', '!./*.*.ts'], { eager: true }),
)
  .map((m) => m.calculator)
  .filter((c): c is CalculatorCore => c !== undefined);
const coreOf = (id: string): CalculatorCore => {
  const core = cores.find((c) => c.id === id);
  if (core === undefined) throw new Error(`no core for ${id}`);
  return core;
};

describe.each(calculators.map((c) => [c.id, c] as const))('%s', (id, def: CalculatorDefinition) => {
  const core = coreOf(id);

  it('has every warning summarised whole, and declares the same warnings in its core', () => {
    for (const w of def.warnings) expect(w.summary?.length ?? 0).toBeGreaterThan(15);
    expect(core.warnings.map((w) => w.code)).toEqual(def.warnings.map((w) => w.code));
    core.warnings.forEach((w, i) => {
      if (w.summary !== undefined) expect(w.summary).toBe(def.warnings[i]?.summary);
    });
  });

  it("gives the first view the full widget's headline, withheld or not (a warning that withholds keeps its summary in the core)", () => {
    let withholding = 0;
    fc.assert(
      fc.property(anyInputs(def), (inputs) => {
        let result: ComputedResult;
        try {
          result = computeCalculation(core, inputs);
        } catch {
          return; // inputs no form would be answered for
        }
        for (const w of result.warnings) {
          if ((w.withholds ?? []).length === 0) continue;
          withholding++;
          expect(core.warnings.find((d) => d.code === w.code)?.summary).toBeDefined();
        }
        for (const system of ['si', 'us'] as const) {
          expect(headline(core, result, system)).toEqual(headline(def, result, system));
        }
      }),
      { numRuns: 300, seed: 20261202 },
    );
    // The sweep reaches warnings that withhold wherever the calculator has any.
    if (core.warnings.some((w) => w.summary !== undefined && w.code !== 'CONTACT_ANGLE_NEAR_90'))
      expect(withholding).toBeGreaterThan(0);
  });
});

describe('withTexts', () => {
  const core = coreOf('wetting-force');
  const def = calculators.find((c) => c.id === 'wetting-force') as CalculatorDefinition;
  const texts = {
    cautions: def.cautions,
    references: def.references,
    warnings: def.warnings,
    ...(def.explain !== undefined ? { explain: def.explain } : {}),
  };

  it('joins a core and its texts, the texts giving every summary in the core order', () => {
    expect(withTexts(core, texts)).toEqual(def);
  });

  it('refuses texts whose warnings are not the core ones, or lack a summary, or say another', () => {
    const swapped = [def.warnings[1], def.warnings[0], ...def.warnings.slice(2)];
    expect(() => withTexts(core, { ...texts, warnings: swapped as typeof def.warnings })).toThrow(
      /wetting-force/,
    );
    expect(() => withTexts(core, { ...texts, warnings: def.warnings.slice(1) })).toThrow(/wetting-force/);
    const bare = def.warnings.map((w) => ({ code: w.code }));
    expect(() => withTexts(core, { ...texts, warnings: bare })).toThrow(/wetting-force/);
    const kept = def.warnings.findIndex(
      (w, i) => core.warnings[i]?.summary !== undefined && w.code !== 'CONTACT_ANGLE_NEAR_90',
    );
    const other = def.warnings.map((w, i) =>
      i === kept ? { ...w, summary: 'Another summary entirely.' } : w,
    );
    expect(() => withTexts(core, { ...texts, warnings: other })).toThrow(/wetting-force/);
  });
});
