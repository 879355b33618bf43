import { describe, expect, it } from 'vitest';
import { calculate } from '../registry.js';
import type { WorkingStep } from './types.js';

// The working is a sheet a checker re-computes by hand. These tests read the coefficients back out
// of the printed text and re-compute each value from them alone: if the text and the code ever hold
// different numbers, they fail.

const num = (text: string): number => Number(text.replace('−', '-'));
/** The number printed after `name = ` in a formula. */
function coefficient(step: WorkingStep, name: string): number {
  const m = new RegExp(`${name} = (−?[0-9.e-]+)`).exec(step.formula);
  if (m?.[1] === undefined) throw new Error(`${name} not in "${step.formula}"`);
  return num(m[1]);
}
function stepOf(steps: readonly WorkingStep[], label: RegExp): WorkingStep {
  const s = steps.find((x) => label.test(x.label));
  if (s === undefined) throw new Error(`no step ${label}`);
  return s;
}

describe('working built from the constants the code computes with', () => {
  it('IAPWS R1-76: B, b, μ and Tc as printed give the surface tension shown', () => {
    for (const t of [0.01, 20, 55.5, 100]) {
      const s = stepOf(calculate('tube-rise', { temperatureC: t }).working, /^Surface tension of water/);
      const B = coefficient(s, 'B') / 1000;
      const tau = 1 - (t + 273.15) / coefficient(s, 'Tc');
      expect(B * tau ** coefficient(s, 'μ') * (1 + coefficient(s, 'b') * tau)).toBeCloseTo(s.value, 15);
      expect(s.source).toBe('IAPWS R1-76(2014)');
    }
  });

  it('Tanaka 2001: a₁…a₅ as printed give the density shown', () => {
    for (const t of [0.01, 4, 20, 40]) {
      const s = stepOf(calculate('tube-rise', { temperatureC: t }).working, /^Density of water/);
      const [a1, a2, a3, a4, a5] = ['a₁', 'a₂', 'a₃', 'a₄', 'a₅'].map((n) => coefficient(s, n)) as [
        number,
        number,
        number,
        number,
        number,
      ];
      expect(a5 * (1 - ((t + a1) ** 2 * (t + a2)) / (a3 * (t + a4)))).toBeCloseTo(s.value, 9);
    }
  });

  it('Kell 1975: the printed polynomial gives the density shown above 40 °C', () => {
    const t = 80;
    const s = stepOf(calculate('tube-rise', { temperatureC: t }).working, /^Density of water/);
    const [numer = '', denom = ''] = s.formula.replace('ρ = (', '').split(') / (1 + ');
    const terms = numer.replaceAll('− ', '+ -').split(' + ');
    let top = 0;
    for (const term of terms) {
      const [c = '0', power] = term.split('·t');
      const n = power === undefined ? 0 : power === '' ? 1 : '⁰¹²³⁴⁵⁶⁷⁸⁹'.indexOf(power);
      top += num(c) * t ** n;
    }
    const b = num(denom.split('·t')[0] ?? '');
    expect(top / (1 + b * t)).toBeCloseTo(s.value, 9);
  });

  it('IAPWS SR6-08: the printed aᵢ and bᵢ give the viscosity shown', () => {
    const t = 25;
    const s = stepOf(calculate('wicking-time', { temperatureC: t }).working, /^Viscosity of water/);
    const list = (name: string): number[] =>
      (new RegExp(`${name} = ([^;]+)`).exec(s.formula)?.[1] ?? '').split(', ').map(num);
    const a = list('a');
    const b = list('b');
    expect(a).toHaveLength(4);
    const tr = (t + 273.15) / 300;
    expect(a.reduce((sum, ai, i) => sum + ai * tr ** (b[i] ?? 0), 0) * 1e-6).toBeCloseTo(s.value, 15);
  });

  it('Zuidema–Waters: k, c, m and the base as printed give the radicand, root and factor shown', () => {
    const r = calculate('wetting-force', { method: 'ring' });
    const rad = stepOf(r.working, /radicand/);
    const P = (9e-3 * 1e5) / (4 * Math.PI * 0.955);
    const C = 2 * Math.PI * 0.955;
    const value =
      (coefficient(rad, 'k') * P) / (C * C * 0.998) +
      coefficient(rad, 'c') -
      coefficient(rad, 'm') * (0.2 / 9.55);
    expect(value).toBeCloseTo(rad.value, 12);
    const f = stepOf(r.working, /correction factor/);
    const base = num(/f = ([0-9.]+) \+/.exec(f.formula)?.[1] ?? '');
    expect(base + Math.sqrt(rad.value)).toBeCloseTo(f.value, 12);
    expect(r.outputs.correctionFactor).toBe(f.value);
  });

  it('puts a source on every step that applies a method, and an id a warning can point at', () => {
    for (const [id, inputs] of [
      ['tube-rise', {}],
      ['slot-rise', {}],
      ['soil-capillary-rise', {}],
      ['interface-pressure', { shape: 'pore' }],
      ['wetting-force', { method: 'ring' }],
      ['wetting-force', { method: 'plate-force' }],
      ['wicking-time', {}],
      ['contact-angle-from-force', { readings: 'cycle' }],
      ['tension-from-rise', {}],
      ['tension-from-rise', { solveFor: 'contactAngle' }],
      ['rising-damp-height', {}],
      ['frost-screening', {}],
      ['frost-screening', { riseFrom: 'measured' }],
    ] as const) {
      const r = calculate(id, inputs);
      const methodSteps = r.working.filter((s) => s.id !== undefined);
      expect(methodSteps.length).toBeGreaterThan(0);
      for (const s of methodSteps) expect(s.source, `${id}: ${s.label}`).toBeTruthy();
    }
  });
});
