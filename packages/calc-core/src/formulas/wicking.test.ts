import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { waterDensity, waterSurfaceTension, waterViscosity } from '../properties/water.js';
import { jurinRise } from './capillary.js';
import { gravityRestrainedRiseTime, washburnLength, washburnTime } from './wicking.js';

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
