import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { jurinRise } from './capillary.js';
import { bubblePressure, laplacePressure, poreEntryPressure } from './laplace.js';

describe('Young–Laplace', () => {
  const sigma = 0.0728;

  // [case, computed Pa, expected Pa, source]
  const cases: [string, () => number, number, string][] = [
    [
      'drop 2σ/R',
      () => laplacePressure({ surfaceTension: sigma, r1: 1e-3 }),
      145.6,
      'REFERENCES.md: drop 2σ/R',
    ],
    [
      'bubble with two surfaces 4σ/R',
      () => bubblePressure({ surfaceTension: sigma, radius: 1e-3 }),
      291.2,
      'REFERENCES.md: bubble 4σ/R',
    ],
    [
      'jet σ/R',
      () => laplacePressure({ surfaceTension: sigma, r1: 1e-3, r2: Infinity }),
      72.8,
      'REFERENCES.md: jet σ/R',
    ],
    [
      'two radii',
      () => laplacePressure({ surfaceTension: sigma, r1: 1e-3, r2: 2e-3 }),
      109.2,
      'REFERENCES.md: σ(1/R1 + 1/R2)',
    ],
  ];
  it.each(cases)('%s', (_name, compute, expected) => {
    expect(compute()).toBeCloseTo(expected, 9);
  });

  it('the pore entry pressure as a head equals the OpenStax 11.79 rise: r = 0.500 mm → 2.97 cm (printed)', () => {
    const pc = poreEntryPressure({ surfaceTension: sigma, contactAngleDeg: 0, poreRadius: 0.5e-3 });
    expect(Math.abs(pc / (1000 * 9.8) - 0.0297)).toBeLessThanOrEqual(0.00005);
  });

  it('pore entry pressure is ρ·g times the Jurin rise of a tube of the same radius (fast-check)', () => {
    fc.assert(
      fc.property(
        fc.double({ min: 1e-8, max: 1e-2, noNaN: true }),
        fc.double({ min: 0, max: 180, noNaN: true }),
        fc.double({ min: 1e-3, max: 1, noNaN: true }),
        (r, theta, s) => {
          const pc = poreEntryPressure({ surfaceTension: s, contactAngleDeg: theta, poreRadius: r });
          const h = jurinRise({
            surfaceTension: s,
            contactAngleDeg: theta,
            density: 1000,
            diameter: 2 * r,
            gravity: 9.80665,
          });
          const viaRise = 1000 * 9.80665 * h;
          expect(Math.abs(pc - viaRise)).toBeLessThanOrEqual(
            1e-12 * Math.max(Math.abs(pc), Math.abs(viaRise)),
          );
        },
      ),
    );
  });

  it('is symmetric in its radii, a sphere when r2 is absent and falls as the radius grows', () => {
    fc.assert(
      fc.property(
        fc.double({ min: 1e-9, max: 1, noNaN: true }),
        fc.double({ min: 1e-9, max: 1, noNaN: true }),
        (a, b) => {
          // Addition commutes exactly in IEEE arithmetic, so the symmetry is exact.
          expect(laplacePressure({ surfaceTension: sigma, r1: a, r2: b })).toBe(
            laplacePressure({ surfaceTension: sigma, r1: b, r2: a }),
          );
          expect(laplacePressure({ surfaceTension: sigma, r1: a })).toBe(
            laplacePressure({ surfaceTension: sigma, r1: a, r2: a }),
          );
          // Radii a few ulps apart can round to the same reciprocal; compare only distinct ones.
          if (b > a * (1 + 1e-9)) {
            expect(laplacePressure({ surfaceTension: sigma, r1: b })).toBeLessThan(
              laplacePressure({ surfaceTension: sigma, r1: a }),
            );
          }
        },
      ),
    );
  });

  it('gives a negative entry pressure for a non-wetting pore and names bad radii', () => {
    expect(
      poreEntryPressure({ surfaceTension: 0.4865, contactAngleDeg: 140, poreRadius: 1e-6 }),
    ).toBeLessThan(0);
    expect(() => laplacePressure({ surfaceTension: sigma, r1: 0 })).toThrow(
      expect.objectContaining({ field: 'r1' }),
    );
    expect(() => laplacePressure({ surfaceTension: sigma, r1: 1e-3, r2: -1 })).toThrow(
      expect.objectContaining({ field: 'r2' }),
    );
    expect(() => laplacePressure({ surfaceTension: sigma, r1: Infinity })).toThrow(
      expect.objectContaining({ code: 'NOT_FINITE' }),
    );
  });
});
