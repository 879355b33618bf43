import { calculate, getCalculator } from '@wickstone/calc-core';
import { describe, expect, it } from 'vitest';
import { resultLines } from '../embed/format.js';
import { showRun } from './present.js';

// The runs table and the e-mailed copy print values with calc-core's one spacing rule: a space
// before every unit symbol, none before the degree of a plane angle (SI Brochure, BIPM, 9th ed.,
// 2019, §5.4.3; NIST SP 811, 2008, §7.2).
const inputs = {
  liquid: 'water',
  temperatureC: 20,
  contactAnglePreset: 'custom',
  contactAngleDeg: 35,
  diameter: 0.001,
};

describe('values shown by the server', () => {
  it('runs table: `35°` for an angle, `20 °C` for a temperature', () => {
    const result = calculate('tube-rise', inputs);
    const shown = showRun('tube-rise', { inputs: {} }, inputs, result.outputs, 'si');
    const text = (id: string) => shown.inputs.find((i) => i.id === id)?.text;
    expect(text('contactAngleDeg')).toBe('35°');
    expect(text('temperatureC')).toBe('20 °C');
    expect(text('diameter')).toBe('1 mm');
    expect(shown.inputs.find((i) => i.id === 'contactAngleDeg')?.unit).toBe('°');
  });

  it('e-mailed copy: the same spacing in inputs and in the working', () => {
    const calc = getCalculator('tube-rise');
    if (calc === undefined) throw new Error('no tube-rise');
    const lines = resultLines(calc, calculate('tube-rise', inputs), 'us');
    expect(lines).toContain('  Contact angle: 35°');
    expect(lines.some((l) => /: 68 °F$/.test(l))).toBe(true);
    expect(lines.join('\n')).not.toMatch(/\d °(?![CF])|\d°[CF]/);
    expect(lines.filter((l) => l.startsWith('    = ')).every((l) => !l.endsWith(' '))).toBe(true);
  });
});

describe('the trade calculators through the same runs table and e-mailed copy', () => {
  it.each([
    ['rising-damp-height', 'si', 'steadyHeight', '0.794 m'],
    ['rising-damp-height', 'si', 'waterHeld', '55.6 L/m'],
    ['rising-damp-height', 'us', 'dailyFlow', '0.128 gal/(ft·day)'],
    ['contact-angle-from-force', 'si', 'contactAngleDeg', '59.8°'],
    ['tension-from-rise', 'us', 'surfaceTension', '61.6 mN/m'],
    ['frost-screening', 'si', 'frostGroup', '2'],
  ] as const)('%s (%s): %s shows as %s', (id, system, output, text) => {
    const result = calculate(id, {});
    const shown = showRun(id, { inputs: {} }, result.inputs, result.outputs, system);
    expect(shown.outputs.find((o) => o.id === output)?.text).toBe(text);
    const calc = getCalculator(id);
    if (calc === undefined) throw new Error(`no ${id}`);
    const lines = resultLines(calc, result, system).join('\n');
    expect(lines).toContain(text);
  });
});
