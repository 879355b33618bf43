import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { waterDensity, waterSurfaceTension, waterViscosity } from '../properties/water.js';
import { jurinRise } from './capillary.js';
import {
  bosanquetTime,
  gravityRestrainedRiseTime,
  gravityShape,
  washburnLength,
  washburnTime,
} from './wicking.js';

const water = { surfaceTension: waterSurfaceTension(20), viscosity: waterViscosity(20) };
const rho = waterDensity(20).value;

function simpson(f: (x: number) => number, a: number, b: number, n: number): number {
  const h = (b - a) / n;
  let sum = f(a) + f(b);
  for (let i = 1; i < n; i++) sum += (i % 2 === 1 ? 4 : 2) * f(a + i * h);
  return (sum * h) / 3;
}

describe('Lucas–Washburn', () => {
  it('agrees with a quadrature of Washburn’s equation of motion dL/dt = σ·r·cos θ / (4μL), gravity dropped (Washburn 1921; computed here)', () => {
    const r = 20e-6;
    const k = (water.surfaceTension * r) / (4 * water.viscosity);
    const target = 0.03;
    // t = ∫ dL / (dL/dt) by Simpson's rule.
    expect(
      simpson((x) => x / k, 0, target, 2000) /
        washburnTime({ ...water, poreRadius: r, contactAngleDeg: 0, length: target }),
    ).toBeCloseTo(1, 9);
  });

  it('time grows as the square of the distance and inverts to the distance (fast-check)', () => {
    fc.assert(
      fc.property(
        fc.double({ min: 1e-4, max: 1, noNaN: true }),
        fc.double({ min: 1e-7, max: 1e-3, noNaN: true }),
        fc.double({ min: 0, max: 85, noNaN: true }),
        (L, r, theta) => {
          const args = { ...water, poreRadius: r, contactAngleDeg: theta };
          const t = washburnTime({ ...args, length: L });
          expect(washburnTime({ ...args, length: 2 * L }) / t).toBeCloseTo(4, 9);
          expect(washburnLength({ ...args, time: t }) / L).toBeCloseTo(1, 9);
        },
      ),
    );
  });

  it('refuses a non-wetting liquid', () => {
    expect(() => washburnTime({ ...water, poreRadius: 1e-5, contactAngleDeg: 95, length: 0.01 })).toThrow(
      expect.objectContaining({ field: 'contactAngleDeg', code: 'NO_SPONTANEOUS_WICKING' }),
    );
  });
});

describe('rise with gravity', () => {
  const base = { ...water, poreRadius: 50e-6, contactAngleDeg: 0, density: rho };
  const limit = jurinRise({
    surfaceTension: water.surfaceTension,
    contactAngleDeg: 0,
    density: rho,
    diameter: 100e-6,
  });

  it.each([0.6, 0.05, 2e-4, 5e-5])(
    'agrees with a quadrature of dh/dt = (r²ρg / 8μ)(h_J − h)/h at h = %s·h_J (Washburn 1921 with gravity; computed here)',
    (fraction) => {
      const target = fraction * limit;
      const k = (base.poreRadius ** 2 * rho * 9.80665) / (8 * water.viscosity);
      const t = simpson((h) => h / (k * (limit - h)), 0, target, 20000);
      expect(gravityRestrainedRiseTime({ ...base, height: target }) / t).toBeCloseTo(1, 9);
    },
  );

  it('tends to the Lucas–Washburn time low down and exceeds it higher up', () => {
    const low = 1e-6 * limit;
    expect(
      gravityRestrainedRiseTime({ ...base, height: low }) / washburnTime({ ...base, length: low }),
    ).toBeCloseTo(1, 5);
    fc.assert(
      fc.property(fc.double({ min: 0.01, max: 0.99, noNaN: true }), (x) => {
        expect(gravityRestrainedRiseTime({ ...base, height: x * limit })).toBeGreaterThan(
          washburnTime({ ...base, length: x * limit }),
        );
      }),
    );
  });

  it('never reaches the Jurin limit', () => {
    expect(() => gravityRestrainedRiseTime({ ...base, height: limit })).toThrow(/Jurin limit/);
    expect(() => gravityRestrainedRiseTime({ ...base, height: 2 * limit })).toThrow(RangeError);
  });
});

describe('Bosanquet (1923), with inertia', () => {
  const args = { ...water, poreRadius: 1e-3, contactAngleDeg: 0, density: rho };

  it('reports a = 4σ cos θ/(ρ r) and b = 8μ/(ρ r²) and solves x² = (a/b²)(bt − 1 + e^(−bt)) exactly', () => {
    const r = bosanquetTime({ ...args, length: 0.05 });
    expect(r.a).toBeCloseTo((4 * water.surfaceTension) / (rho * 1e-3), 12);
    expect(r.b).toBeCloseTo((8 * water.viscosity) / (rho * 1e-6), 12);
    expect(r.tau).toBeCloseTo(r.b * r.time, 12);
    // Put the time back into the closed form (a different evaluation from the solver's).
    const x2 = (r.a / r.b ** 2) * (r.b * r.time - 1 + Math.exp(-r.b * r.time));
    expect(Math.sqrt(x2)).toBeCloseTo(0.05, 12);
  });

  it('starts at the inertial speed √(a/2) (Bosanquet’s short-time limit) and ends on Lucas–Washburn', () => {
    const short = bosanquetTime({ ...args, length: 1e-8 });
    expect((short.time * Math.sqrt(short.a / 2)) / 1e-8).toBeCloseTo(1, 6);
    const long = bosanquetTime({ ...args, length: 10 });
    const lw = washburnTime({ ...args, length: 10 });
    // t_B − t_LW → 1/b for long times: the inertial delay.
    expect(long.time - lw).toBeCloseTo(1 / long.b, 6);
  });

  it('is never shorter than Lucas–Washburn and grows with the distance (fast-check)', () => {
    fc.assert(
      fc.property(
        fc.double({ min: 1e-7, max: 1e-2, noNaN: true }),
        fc.double({ min: 1e-6, max: 1, noNaN: true }),
        fc.double({ min: 0, max: 80, noNaN: true }),
        (r, L, theta) => {
          const a = { ...water, poreRadius: r, contactAngleDeg: theta, density: rho };
          const t = bosanquetTime({ ...a, length: L }).time;
          expect(t).toBeGreaterThanOrEqual(washburnTime({ ...a, length: L }) * (1 - 1e-12));
          expect(bosanquetTime({ ...a, length: L * 1.5 }).time).toBeGreaterThan(t);
        },
      ),
      { numRuns: 200 },
    );
  });

  it('refuses a wetting angle of 90° or more, like Lucas–Washburn', () => {
    expect(() => bosanquetTime({ ...args, contactAngleDeg: 90, length: 0.01 })).toThrow(
      expect.objectContaining({ code: 'NO_SPONTANEOUS_WICKING' }),
    );
  });
});

describe('the shape term of the rise with gravity', () => {
  it('joins its series and the closed form smoothly at x = 1e-4 and matches −x − ln(1 − x)', () => {
    for (const x of [1e-6, 5e-5, 0.99e-4, 1.01e-4, 0.01, 0.5, 0.9]) {
      // ln(1 − x) by its series Σ xⁿ/n, an independent route for small x.
      let series = 0;
      for (let n = 2; n < 3000; n++) series += x ** n / n;
      expect(gravityShape(x) / series).toBeCloseTo(1, 9);
    }
    expect(gravityShape(0)).toBe(0);
  });
});
