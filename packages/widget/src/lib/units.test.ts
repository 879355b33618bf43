import { describe, expect, it } from 'vitest';
import { formatInput, formatValue, fromDisplay, outputUnitFor, parseNumber, toDisplay } from './units.js';

describe('outputUnitFor', () => {
  const time = { kind: 'time' as const };
  it('shows a time in the largest unit that keeps the number at two or more', () => {
    expect(outputUnitFor(time, 'si', 90)).toBe('s');
    expect(outputUnitFor(time, 'si', 120)).toBe('min');
    expect(outputUnitFor(time, 'us', 3 * 3600)).toBe('h');
    expect(outputUnitFor(time, 'si', 5 * 86400)).toBe('day');
    expect(outputUnitFor(time, 'si', -5 * 86400)).toBe('day');
  });
  it('keeps a unit the definition chose', () => {
    expect(outputUnitFor({ kind: 'time', display: { si: 's' } }, 'si', 1e6)).toBe('s');
    expect(outputUnitFor({ kind: 'length', display: { si: 'mm' } }, 'si', 5)).toBe('mm');
  });
});

describe('conversion for display', () => {
  it('converts canonical values to display units and back (NIST SP 811 exact factors)', () => {
    expect(toDisplay(0.0254, 'in')).toBeCloseTo(1, 15);
    expect(toDisplay(20, 'degF')).toBeCloseTo(68, 12);
    expect(toDisplay(0.072, 'dyn/cm')).toBeCloseTo(72, 12);
    expect(fromDisplay(68, 'degF')).toBeCloseTo(20, 12);
    expect(fromDisplay(25.4, 'mm')).toBeCloseTo(0.0254, 15);
    expect(fromDisplay(1, 'psi')).toBeCloseTo(6894.757293168361, 6);
  });
});

describe('formatValue', () => {
  it.each([
    [0, '0'],
    [29.7246, '29.72'],
    [-0.0123456, '−0.01235'],
    [0.001, '0.001'],
    [999999, '1000000'],
    [1666.6667, '1667'],
    [0.00016667, '1.667×10⁻⁴'],
    [1.5e7, '1.5×10⁷'],
    [-2.5e-12, '−2.5×10⁻¹²'],
  ])('%s → %s', (value, text) => {
    expect(formatValue(value)).toBe(text);
  });
});

describe('formatInput and parseNumber', () => {
  it('prints six significant figures in plain digits', () => {
    expect(formatInput(0.001 / 0.0254)).toBe('0.0393701');
    expect(formatInput(1)).toBe('1');
    expect(formatInput(1e-6 / 0.0254)).toBe('0.0000393701');
    expect(formatInput(3.93701e-7)).toBe('0.000000393701');
    expect(formatInput(Number.NaN)).toBe('');
  });
  it('reads what visitors type', () => {
    expect(parseNumber(' 12.5 ')).toBe(12.5);
    expect(parseNumber('0,5')).toBe(0.5);
    expect(parseNumber('−3')).toBe(-3);
    expect(parseNumber('.25')).toBe(0.25);
    expect(parseNumber('2e-3')).toBe(0.002);
    expect(parseNumber('')).toBeNull();
    expect(parseNumber('   ')).toBeNull();
    expect(parseNumber('1,000.5')).toBeNaN();
    expect(parseNumber('12 mm')).toBeNaN();
    expect(parseNumber('abc')).toBeNaN();
  });
  it('round-trips a printed value to within its six figures', () => {
    for (const v of [0.001, 0.0005, 0.3, 1e-6, 9.80665]) {
      const back = fromDisplay(parseNumber(formatInput(toDisplay(v, 'in'))) as number, 'in');
      expect(Math.abs(back - v) / v).toBeLessThan(5e-6);
    }
  });
});
