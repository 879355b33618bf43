import { describe, expect, it } from 'vitest';
import * as calcCore from '@wickstone/calc-core';
import { calculate, calculators, type CalculationResult } from '@wickstone/calc-core';
import { defaultWidgetSettings } from '@wickstone/contracts';
import { inputHashOf, recompute, type RunEngine } from './ingest.js';
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
});
