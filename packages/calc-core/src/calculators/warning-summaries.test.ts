/// <reference types="vite/client" />
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import before from '../../testing/registry-warnings-d13f24b.json' with { type: 'json' };
import { anyInputs } from '../../testing/arbitrary.js';
import { headline } from '../answer.js';
import { withTexts } from '../join.js';
import { calculators } from '../registry.js';
import { computeCalculation } from './engine.js';
import type { CalculatorCore, CalculatorDefinition, CalculatorTexts, ComputedResult } from './types.js';

// A core declares every warning its solve raises but carries only the summaries its first view can
// show: the headline's, which says why a withheld output has no figure. Its texts summarise the
// others (`warningSummaries`), and the whole calculator (the registry's, the widget's once its texts
// arrive: both joined by `withTexts`) has every one, each written in one place.

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
const textModules = Object.entries(
  import.meta.glob<{ texts: CalculatorTexts }>('./*.texts.ts', { eager: true }),
).map(([file, m]) => ({ calculator: file.slice(2, -'.texts.ts'.length), texts: m.texts }));
const textsOf = (id: string): CalculatorTexts => {
  const texts = textModules.find((t) => t.calculator === id)?.texts;
  if (texts === undefined) throw new Error(`no texts for ${id}`);
  return texts;
};

describe.each(calculators.map((c) => [c.id, c] as const))('%s', (id, def: CalculatorDefinition) => {
  const core = coreOf(id);
  const texts = textsOf(id);

  it('has every warning summarised whole, and declares the same warnings in its core', () => {
    for (const w of def.warnings) expect(w.summary?.length ?? 0).toBeGreaterThan(15);
    expect(core.warnings.map((w) => w.code)).toEqual(def.warnings.map((w) => w.code));
    core.warnings.forEach((w, i) => {
      if (w.summary !== undefined) expect(w.summary).toBe(def.warnings[i]?.summary);
    });
  });

  it('has the warnings, order and summaries it had when its texts restated the whole list', () => {
    // Fixture: each calculator's `warnings` in the registry at commit d13f24b (texts with full lists).
    expect(Object.keys(before)).toContain(id);
    expect(def.warnings).toEqual(before[id as keyof typeof before]);
  });

  it('summarises in its texts exactly the warnings its core leaves without a summary', () => {
    const unsummarised = core.warnings.filter((w) => w.summary === undefined).map((w) => w.code);
    expect(Object.keys(texts.warningSummaries ?? {}).sort()).toEqual([...unsummarised].sort());
    expect(def).not.toHaveProperty('warningSummaries');
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
  // Wetting force: a core that summarises some of its warnings and texts that summarise the rest.
  const core = coreOf('wetting-force');
  const texts = textsOf('wetting-force');
  const summaries = texts.warningSummaries ?? {};
  const inCore = core.warnings.find((w) => w.summary !== undefined);
  const inTexts = core.warnings.find((w) => w.summary === undefined);
  if (inCore === undefined || inTexts === undefined)
    throw new Error('wetting-force no longer has both kinds');

  it("keeps the core's order, each warning with the core's summary or else the texts'", () => {
    const joined = withTexts(core, texts);
    expect(joined.warnings.map((w) => w.code)).toEqual(core.warnings.map((w) => w.code));
    joined.warnings.forEach((w, i) => {
      const own = core.warnings[i]?.summary;
      expect(w.summary).toBe(own ?? summaries[w.code]);
      expect(w.summary).toBeDefined();
    });
    // The rest is the core's and the texts' own, the summaries map left out.
    const { warningSummaries: _given, ...said } = texts;
    expect(joined).toEqual({ ...core, ...said, warnings: joined.warnings });
    expect(joined).not.toHaveProperty('warningSummaries');
  });

  it('takes a core that summarises every warning as it is, with texts that summarise none', () => {
    const tube = coreOf('tube-rise');
    expect(tube.warnings.every((w) => w.summary !== undefined)).toBe(true);
    expect(withTexts(tube, textsOf('tube-rise')).warnings).toEqual(tube.warnings);
  });

  it('refuses a warning left without a summary, naming the calculator and the code', () => {
    const { [inTexts.code]: _dropped, ...fewer } = summaries;
    expect(() => withTexts(core, { ...texts, warningSummaries: fewer })).toThrow(
      new RegExp(`wetting-force.*${inTexts.code}`),
    );
  });

  it('refuses a summary for a code the core does not declare, naming the calculator and the code', () => {
    const extra = { ...summaries, RING_NOT_ROUND: 'A ring that is not round enough to read.' };
    expect(() => withTexts(core, { ...texts, warningSummaries: extra })).toThrow(
      /wetting-force.*RING_NOT_ROUND/,
    );
  });

  it('refuses a summary for a warning the core already summarises, even the same words', () => {
    const again = { ...summaries, [inCore.code]: inCore.summary as string };
    expect(() => withTexts(core, { ...texts, warningSummaries: again })).toThrow(
      new RegExp(`wetting-force.*${inCore.code}`),
    );
  });
});
