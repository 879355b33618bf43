import { describe, expect, it } from 'vitest';
import * as calcCore from '@wickstone/calc-core';
import { calculate, calculators, type CalculationResult } from '@wickstone/calc-core';
import { defaultWidgetSettings, type EmbedRunBody } from '@wickstone/contracts';
import { inputHashOf, RecentCalculations, recompute, type RunEngine } from './ingest.js';
import { storedCalculation } from '../runs/working.js';
import { reportOf } from '../runs/invent.js';

/*
 * The server recomputes each report with the engine of its release: with `compute` where the engine
 * has it (the numbers alone, the input hash made here with Node's SHA-256), else with `calculate`.
 * Either way what is compared and stored must be exactly what `calculate` gives.
 */

// Readings for the table-input calculator (invented, rising as absorption does).
const readings = [
  { time: 0, mass: 0.91502 },
  { time: 300, mass: 0.91791 },
  { time: 1200, mass: 0.92045 },
  { time: 3600, mass: 0.92418 },
  { time: 7200, mass: 0.92791 },
];
const inputsFor = (id: string): Record<string, unknown> =>
  calculators.find((c) => c.id === id)!.inputs.some((i) => i.kind === 'table')
    ? { readings, faceArea: 0.005 }
    : {};

/** An engine with `compute` as calc-core documents it: calculate's numbers, nothing else. */
const withCompute: RunEngine = {
  ...calcCore,
  compute: (id, inputs) => {
    const { calculator, inputs: used, outputs, warnings, band, version } = calculate(id, inputs);
    return { calculator, inputs: used, outputs, warnings, band, version };
  },
};

describe('recompute', () => {
  const widget = (calculatorId: string) => ({ id: 1, calculatorId, settings: defaultWidgetSettings() });

  it.each(calculators.map((c) => c.id))(
    '%s: the same stored result with compute (hash made natively) as with calculate',
    (id) => {
      const r: CalculationResult = calculate(id, inputsFor(id));
      expect(inputHashOf(r.calculator, r.inputs)).toBe(r.inputHash);
      const body = reportOf(r, { id: crypto.randomUUID(), publicKey: 'wk_test', unitSystem: 'si' });
      const viaCalculate = recompute(widget(id), body as never, calcCore);
      const viaCompute = recompute(widget(id), body as never, withCompute);
      expect(storedCalculation(viaCompute)).toEqual(storedCalculation(viaCalculate));
      expect(storedCalculation(viaCompute)).toEqual(storedCalculation(r));
      expect(viaCompute).not.toHaveProperty('working');
    },
  );

  it('names the bad input field with compute as with calculate', () => {
    const body = reportOf(calculate('tube-rise', {}), {
      id: crypto.randomUUID(),
      publicKey: 'wk_test',
      unitSystem: 'si',
    });
    const bad = { ...body, inputs: { ...body.inputs, diameter: -1 } };
    for (const engine of [calcCore, withCompute]) {
      expect(() => recompute(widget('tube-rise'), bad as never, engine)).toThrowError(
        expect.objectContaining({
          code: 'validation_failed',
          details: { fields: [expect.objectContaining({ field: 'body.inputs.diameter' })] },
        }),
      );
    }
  });

  describe('with recent calculations kept', () => {
    /** An engine without `compute` (as release 0.1.0's), counting the calculations it makes. */
    const counting = () => {
      const made = { n: 0 };
      const engine: RunEngine = {
        getCalculator: calcCore.getCalculator,
        calculate: (id, inputs) => {
          made.n += 1;
          return calculate(id, inputs);
        },
      };
      return { engine, made };
    };
    const report = (inputs: Record<string, unknown>): EmbedRunBody =>
      reportOf(calculate('tube-rise', inputs), {
        id: crypto.randomUUID(),
        publicKey: 'wk_test',
        unitSystem: 'si',
      }) as EmbedRunBody;

    it('runs the engine once for reports with the same inputs, with what a fresh run gives', () => {
      const { engine, made } = counting();
      const recent = new RecentCalculations();
      const a = report({ diameter: 0.0004, temperatureC: 12 });
      const first = recompute(widget('tube-rise'), a, engine, recent);
      const again = recompute(
        widget('tube-rise'),
        report({ diameter: 0.0004, temperatureC: 12 }),
        engine,
        recent,
      );
      expect(made.n).toBe(1);
      expect(again).toBe(first);
      expect(Object.isFrozen(again)).toBe(true);
      expect(storedCalculation(again)).toEqual(storedCalculation(calculate('tube-rise', a.inputs)));
      // Other inputs are another calculation.
      const other = recompute(
        widget('tube-rise'),
        report({ diameter: 0.0005, temperatureC: 12 }),
        engine,
        recent,
      );
      expect(made.n).toBe(2);
      expect(other.outputs).not.toEqual(first.outputs);
    });

    it('keeps each engine apart, forgets the least recently used, and keeps no refusal', () => {
      const one = counting();
      const two = counting();
      const recent = new RecentCalculations(2);
      const inputs = [0.0004, 0.0005, 0.0006].map((diameter) => report({ diameter, temperatureC: 12 }));
      recompute(widget('tube-rise'), inputs[0]!, one.engine, recent);
      recompute(widget('tube-rise'), inputs[0]!, two.engine, recent);
      expect([one.made.n, two.made.n]).toEqual([1, 1]);
      recompute(widget('tube-rise'), inputs[1]!, one.engine, recent);
      recompute(widget('tube-rise'), inputs[0]!, one.engine, recent); // used again: kept
      recompute(widget('tube-rise'), inputs[2]!, one.engine, recent); // the 0.0005 one goes
      expect(one.made.n).toBe(3);
      recompute(widget('tube-rise'), inputs[0]!, one.engine, recent);
      expect(one.made.n).toBe(3);
      recompute(widget('tube-rise'), inputs[1]!, one.engine, recent);
      expect(one.made.n).toBe(4);
      const bad: EmbedRunBody = { ...inputs[0]!, inputs: { diameter: -1, temperatureC: 12 } };
      for (let i = 0; i < 2; i++)
        expect(() => recompute(widget('tube-rise'), bad, one.engine, recent)).toThrowError(
          expect.objectContaining({ code: 'validation_failed' }),
        );
      expect(one.made.n).toBe(6);
    });

    it('still refuses a changed locked input before looking for a kept result', () => {
      const { engine } = counting();
      const recent = new RecentCalculations();
      const settings = defaultWidgetSettings();
      const locked = {
        ...widget('tube-rise'),
        settings: {
          ...settings,
          inputs: { ...settings.inputs, temperatureC: { mode: 'locked', default: 20 } },
        },
      };
      recompute(widget('tube-rise'), report({ diameter: 0.0004, temperatureC: 12 }), engine, recent);
      expect(() =>
        recompute(locked as never, report({ diameter: 0.0004, temperatureC: 12 }), engine, recent),
      ).toThrowError(expect.objectContaining({ code: 'validation_failed' }));
    });
  });
});
