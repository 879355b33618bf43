import { absorptionCoefficientCalculator, tubeRiseCalculator } from '@wickstone/calc-core';
import { defaultWidgetSettings, type WidgetSettings } from '@wickstone/contracts';
import { describe, expect, it } from 'vitest';
import { reservedHeight } from './snippet.js';

const hiding = (ids: string[]): WidgetSettings => {
  const d = defaultWidgetSettings();
  return { ...d, inputs: Object.fromEntries(ids.map((id) => [id, { mode: 'hidden' as const }])) };
};

describe('the height a snippet holds', () => {
  it('holds a table input at the height of its table, not of one field', () => {
    const calc = absorptionCoefficientCalculator;
    const table = calc.inputs.find((i) => i.kind === 'table');
    const plain = calc.inputs.find((i) => i.kind !== 'table' && !i.appliesWhen);
    expect(table).toBeDefined();
    expect(plain).toBeDefined();
    const all = reservedHeight(calc, defaultWidgetSettings());
    // The table drawn 390 px wide with its eight default rows is 567 px (the widget's dev measure).
    expect(all - reservedHeight(calc, hiding([table!.id]))).toBe(570);
    expect(all - reservedHeight(calc, hiding([plain!.id]))).toBe(100);
  });

  it('holds one field row per visible input of a calculator without a table', () => {
    expect(reservedHeight(tubeRiseCalculator, defaultWidgetSettings())).toBe(440 + 100 * 5 + 100);
  });
});
