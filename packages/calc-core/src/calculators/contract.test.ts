/// <reference types="vite/client" />
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import pkg from '../../package.json' with { type: 'json' };
import { CalcInputError } from '../errors.js';
import { calculate, calculatorIds, calculators, getCalculator } from '../registry.js';
import { units } from '../units.js';
import { VERSION } from '../version.js';
import { resolveInputs, resultsAgree } from './engine.js';
import { runCalculation } from './run.js';
import * as contactAngleFromForce from './contact-angle-from-force.js';
import * as frostScreening from './frost-screening.js';
import * as interfacePressure from './interface-pressure.js';
import * as risingDampHeight from './rising-damp-height.js';
import * as slotRise from './slot-rise.js';
import * as soilCapillaryRise from './soil-capillary-rise.js';
import * as tensionFromRise from './tension-from-rise.js';
import * as tubeRise from './tube-rise.js';
import { arbitraryInputs } from '../../testing/arbitrary.js';
import * as absorptionCoefficient from './absorption-coefficient.js';
import type { CalculatorDefinition, CalculatorTexts, InputDefinition, TableRow } from './types.js';
import * as wettingForce from './wetting-force.js';
import * as wickingTime from './wicking-time.js';

// What every calculator promises the widget, the dashboard and the server, checked for all ten.

const modules = {
  tubeRise,
  slotRise,
  soilCapillaryRise,
  interfacePressure,
  wettingForce,
  wickingTime,
  contactAngleFromForce,
  tensionFromRise,
  risingDampHeight,
  frostScreening,
  absorptionCoefficient,
};
/** Every calculator's texts module (`<id>.texts.ts`), by calculator id. */
const textModules = Object.entries(
  import.meta.glob<{ texts: CalculatorTexts }>('./*.texts.ts', { eager: true }),
).map(([file, m]) => ({ calculator: file.slice(2, -'.texts.ts'.length), texts: m.texts }));
/** The input a field names: `readings.2.mass` is in the table `readings`. */
const inputOf = (field: string): string => field.split('.')[0] ?? field;

/** Any inputs a form could send: every choice from its options, every number within its range, tables in order. */
function anyInputs(def: CalculatorDefinition): fc.Arbitrary<Record<string, number | string | TableRow[]>> {
  return arbitraryInputs(def, (input) => fc.double({ min: input.min, max: input.max, noNaN: true }));
}

describe.each(calculators.map((c) => [c.id, c] as const))('%s', (_id, def) => {
  it('is self-describing: ids, kinds, defaults inside their ranges, conditions that point at choices', () => {
    expect(def.id).toMatch(/^[a-z]+(-[a-z]+)*$/);
    expect(def.title.length).toBeGreaterThan(5);
    expect(def.summary.length).toBeGreaterThan(20);
    const ids = def.inputs.map((i) => i.id);
    expect(new Set(ids).size).toBe(ids.length);
    const byId = new Map<string, InputDefinition>(def.inputs.map((i) => [i.id, i]));
    for (const input of def.inputs) {
      expect(input.id).toMatch(/^[a-z][A-Za-z0-9]*$/);
      if (input.kind === 'choice') {
        expect(input.options.map((o) => o.value)).toContain(input.default);
      } else if (input.kind === 'table') {
        expect(input.minRows).toBeGreaterThan(0);
        expect(input.maxRows).toBeGreaterThanOrEqual(input.minRows);
        expect(input.default.length).toBeGreaterThanOrEqual(input.minRows);
        for (const c of input.columns) {
          expect(c.id).toMatch(/^[a-z][A-Za-z0-9]*$/);
          expect(c.min).toBeLessThan(c.max);
          for (const unit of Object.values(c.display ?? {})) expect(units[unit].kind).toBe(c.kind);
          for (const row of input.default) {
            expect(row[c.id]).toBeGreaterThanOrEqual(c.min);
            expect(row[c.id]).toBeLessThanOrEqual(c.max);
          }
        }
      } else {
        expect(Object.values(units).some((u) => u.kind === input.kind)).toBe(true);
        expect(input.default).toBeGreaterThanOrEqual(input.min);
        expect(input.default).toBeLessThanOrEqual(input.max);
        if (input.spread !== undefined) {
          expect(input.spread.low).toBeLessThanOrEqual(input.spread.high);
          expect(input.spread.source.length).toBeGreaterThan(5);
        }
        for (const unit of Object.values(input.display ?? {})) expect(units[unit].kind).toBe(input.kind);
      }
      for (const cond of input.appliesWhen ?? []) {
        const parent = byId.get(cond.input);
        expect(parent?.kind).toBe('choice');
        if (parent?.kind === 'choice') {
          for (const v of cond.values) expect(parent.options.map((o) => o.value)).toContain(v);
        }
      }
    }
    const outIds = def.outputs.map((o) => o.id);
    expect(new Set(outIds).size).toBe(outIds.length);
    for (const w of def.warnings) expect(w.code).toMatch(/^[A-Z][A-Z0-9_]+$/);
    expect(def.cautions.map((c) => c.code)).toContain('ESTIMATE_ONLY');
    expect(def.cautions.find((c) => c.code === 'ESTIMATE_ONLY')?.text).toMatch(/licensed professional/);
    expect(def.references.length).toBeGreaterThan(0);
    for (const r of def.references) expect(['printed', 'common practice', 'from memory']).toContain(r.basis);
  });

  it('runs on its defaults to a plain, deterministic, JSON-serialisable result', () => {
    const a = calculate(def.id, {});
    const b = calculate(def.id, {});
    expect(JSON.parse(JSON.stringify(a))).toEqual(a);
    expect(b).toEqual(a);
    expect(a.version).toBe(VERSION);
    expect(a.inputHash).toMatch(/^[0-9a-f]{64}$/);
    expect(Object.keys(a.outputs).sort()).toEqual(def.outputs.map((o) => o.id).sort());
    expect(a.working.length).toBeGreaterThan(0);
    for (const step of a.working) {
      expect(Number.isFinite(step.value)).toBe(true);
      expect(step.formula.length).toBeGreaterThan(0);
      expect(units[step.unit]).toBeDefined();
    }
  });

  it('has a subpath module (its core) whose run() gives the result of calculate() but the texts', () => {
    const mod = Object.values(modules).find((m) => m.calculator.id === def.id);
    const texts = Object.values(textModules).find((t) => t.calculator === def.id)?.texts;
    // The core carries no texts; the registry's definition is the core and the texts joined.
    expect(mod?.calculator).not.toHaveProperty('cautions');
    expect(mod?.calculator).not.toHaveProperty('references');
    expect(texts?.cautions.length).toBeGreaterThan(0);
    expect(texts?.references.length).toBeGreaterThan(0);
    // Each of the core's warnings has the core's summary or, failing that, the one its texts give.
    const { warningSummaries, ...said } = texts ?? {};
    const warnings = mod?.calculator.warnings.map((w) =>
      w.summary === undefined ? { ...w, summary: warningSummaries?.[w.code] } : w,
    );
    expect(def).toEqual({ ...mod?.calculator, ...said, warnings });
    // Its results are calculate()'s without the calculator's own cautions (the liquid's hazard stays).
    for (const inputs of [{}, { liquid: 'mercury', contactAnglePreset: 'mercury-glass' }]) {
      let full;
      try {
        full = calculate(def.id, inputs);
      } catch {
        continue; // a calculator without that liquid or preset
      }
      const own = new Set(texts?.cautions.map((c) => c.code));
      const fromCore = { ...full, cautions: full.cautions.filter((c) => !own.has(c.code)) };
      expect(mod?.run(inputs)).toEqual(fromCore);
      // The widget's texts chunk runs the core it computed with, handing over the texts' explain.
      if (mod !== undefined) expect(runCalculation(mod.calculator, inputs, texts?.explain)).toEqual(fromCore);
    }
    // The working's text is the texts' (`<id>.working.ts`): the core alone cannot write it, and says so.
    expect(mod?.calculator).not.toHaveProperty('explain');
    expect(texts?.explain).toBeDefined();
    if (mod !== undefined)
      expect(() => runCalculation(mod.calculator, {})).toThrow(`calculators/${def.id}.working.ts`);
    const exportsMap = pkg.exports as Record<string, unknown>;
    expect(exportsMap[`./calculators/${def.id}`]).toEqual({
      types: `./dist/calculators/${def.id}.d.ts`,
      default: `./dist/calculators/${def.id}.js`,
    });
  });

  it('hashes only what it used: defaults filled in, inputs that do not apply ignored', () => {
    const base = calculate(def.id, {});
    const explicit = calculate(def.id, base.inputs);
    expect(explicit.inputHash).toBe(base.inputHash);
    const hidden = def.inputs.find(
      (i) => !(i.id in base.inputs) && i.kind !== 'choice' && i.kind !== 'table',
    );
    if (hidden !== undefined && hidden.kind !== 'choice' && hidden.kind !== 'table') {
      const other = hidden.default === hidden.max ? hidden.min : hidden.max;
      expect(calculate(def.id, { [hidden.id]: other }).inputHash).toBe(base.inputHash);
    }
    const shown = def.inputs.find((i) => i.id in base.inputs && i.kind !== 'choice' && i.kind !== 'table');
    if (shown !== undefined && shown.kind !== 'choice' && shown.kind !== 'table') {
      const other = shown.default === shown.max ? (shown.default + shown.min) / 2 : shown.max;
      expect(calculate(def.id, { [shown.id]: other }).inputHash).not.toBe(base.inputHash);
    }
  });

  it('for any inputs a form can send: a finite result with declared warnings, or a CalcInputError (fast-check)', () => {
    const declared = new Set(def.warnings.map((w) => w.code));
    fc.assert(
      fc.property(anyInputs(def), (inputs) => {
        let result;
        try {
          result = calculate(def.id, inputs);
        } catch (err) {
          expect(err).toBeInstanceOf(CalcInputError);
          const issues = (err as CalcInputError).issues;
          for (const issue of issues) expect(def.inputs.map((i) => i.id)).toContain(inputOf(issue.field));
          return;
        }
        for (const v of Object.values(result.outputs)) expect(v === null || Number.isFinite(v)).toBe(true);
        for (const w of result.warnings) {
          expect(declared.has(w.code)).toBe(true);
          for (const f of w.fields) expect(def.inputs.map((i) => i.id)).toContain(f);
        }
        if (result.band !== null) {
          for (const [id, range] of Object.entries(result.band.outputs)) {
            const v = result.outputs[id];
            expect(range.low).toBeLessThanOrEqual(range.high);
            if (typeof v === 'number') {
              expect(v).toBeGreaterThanOrEqual(range.low);
              expect(v).toBeLessThanOrEqual(range.high);
            }
          }
        }
        expect(resultsAgree(result, calculate(def.id, inputs))).toBe(true);
      }),
      { numRuns: 250 },
    );
  });

  it('lists every bad field at once', () => {
    const numeric = def.inputs.filter((i) => i.kind !== 'choice' && (i.appliesWhen ?? []).length === 0);
    const bad: Record<string, unknown> = { notAnInput: 1 };
    for (const i of numeric) bad[i.id] = 'ten';
    const err = (() => {
      try {
        calculate(def.id, bad);
      } catch (e) {
        return e;
      }
      return null;
    })();
    expect(err).toBeInstanceOf(CalcInputError);
    const fields = (err as CalcInputError).issues.map((i) => i.field).sort();
    expect(fields).toEqual(['notAnInput', ...numeric.map((i) => i.id)].sort());
  });
});

describe('registry and engine', () => {
  it('registers the calculators of the design, in order, by stable id', () => {
    expect(calculatorIds).toEqual([
      'tube-rise',
      'slot-rise',
      'soil-capillary-rise',
      'interface-pressure',
      'wetting-force',
      'wicking-time',
      'contact-angle-from-force',
      'tension-from-rise',
      'rising-damp-height',
      'frost-screening',
      'absorption-coefficient',
    ]);
    expect(getCalculator('nope')).toBeUndefined();
    expect(() => calculate('nope', {})).toThrow(expect.objectContaining({ code: 'UNKNOWN_CALCULATOR' }));
  });

  it('carries the package version', () => {
    expect(VERSION).toBe(pkg.version);
  });

  it('gives each kind of bad value its own code', () => {
    const def = getCalculator('tube-rise');
    if (def === undefined) throw new Error('tube-rise missing');
    const issue = (inputs: unknown): string | undefined => {
      try {
        resolveInputs(def, inputs);
      } catch (e) {
        return (e as CalcInputError).issues[0]?.code;
      }
      return undefined;
    };
    expect(issue(null)).toBe('NOT_AN_OBJECT');
    expect(issue([1])).toBe('NOT_AN_OBJECT');
    expect(issue({ diameter: null })).toBe('REQUIRED');
    expect(issue({ diameter: Number.NaN })).toBe('NOT_A_NUMBER');
    expect(issue({ diameter: Infinity })).toBe('NOT_FINITE');
    expect(issue({ diameter: 0 })).toBe('BELOW_MIN');
    expect(issue({ diameter: 1 })).toBe('ABOVE_MAX');
    expect(issue({ liquid: 'lava' })).toBe('NOT_AN_OPTION');
    expect(issue({ temperatureC: '20' })).toBe('NOT_A_NUMBER');
    expect(issue({ diameter: 1e-3 })).toBeUndefined();
  });

  it('ignores a bad value for a choice that does not apply, as it does for numbers', () => {
    expect(calculate('wetting-force', { method: 'ring', liquid: 'lava' }).inputs).not.toHaveProperty(
      'liquid',
    );
    expect(() => calculate('wetting-force', { method: 'plate-force', liquid: 'lava' })).toThrow(
      expect.objectContaining({ field: 'liquid', code: 'NOT_AN_OPTION' }),
    );
  });

  it('judges results the same only when outputs agree within the tolerance', () => {
    const a = calculate('tube-rise', {});
    const nudged = (k: number) => ({ ...a, outputs: { ...a.outputs, rise: (a.outputs.rise ?? 0) * k } });
    expect(resultsAgree(a, nudged(1 + 1e-12))).toBe(true);
    expect(resultsAgree(a, nudged(1 + 1e-6))).toBe(false);
    expect(resultsAgree(a, { ...a, inputHash: '0'.repeat(64) })).toBe(false);
    expect(resultsAgree(a, calculate('tube-rise', { diameter: 2e-3 }))).toBe(false);
  });
});
