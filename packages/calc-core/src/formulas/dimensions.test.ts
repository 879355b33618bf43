import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { capillaryLength, jurinRise } from './capillary.js';
import { laplacePressure } from './laplace.js';
import { wilhelmyForce } from './tensiometry.js';
import { washburnTime } from './wicking.js';

// Dimensional consistency: re-express every argument in a different system of mass, length and time
// units (1 new mass unit = a kg, 1 length unit = b m, 1 time unit = c s) and the result must come out
// as the same quantity in the new units. A formula that mixed dimensions would fail for most a, b, c.

const scale = fc.double({ min: 1e-3, max: 1e3, noNaN: true });

// Numbers in the new units: surface tension [M T⁻²], density [M L⁻³], length [L], acceleration
// [L T⁻²], viscosity [M L⁻¹ T⁻¹], force [M L T⁻²], pressure [M L⁻¹ T⁻²], time [T].
const conv = (a: number, b: number, c: number) => ({
  surfaceTension: (v: number) => (v * c * c) / a,
  density: (v: number) => (v * b ** 3) / a,
  length: (v: number) => v / b,
  acceleration: (v: number) => (v * c * c) / b,
  viscosity: (v: number) => (v * b * c) / a,
  force: (v: number) => (v * c * c) / (a * b),
  pressure: (v: number) => (v * b * c * c) / a,
  time: (v: number) => v / c,
});

describe('dimensional consistency (fast-check over unit systems)', () => {
  it("Jurin's law and the capillary length are lengths", () => {
    fc.assert(
      fc.property(scale, scale, scale, (a, b, c) => {
        const u = conv(a, b, c);
        const si = {
          surfaceTension: 0.0728,
          contactAngleDeg: 20,
          density: 998,
          diameter: 1e-3,
          gravity: 9.81,
        };
        const h = jurinRise(si);
        const h2 = jurinRise({
          surfaceTension: u.surfaceTension(si.surfaceTension),
          contactAngleDeg: 20,
          density: u.density(si.density),
          diameter: u.length(si.diameter),
          gravity: u.acceleration(si.gravity),
        });
        expect(h2 / u.length(h)).toBeCloseTo(1, 9);
        const lc2 = capillaryLength({
          surfaceTension: u.surfaceTension(0.0728),
          density: u.density(998),
          gravity: u.acceleration(9.81),
        });
        expect(
          lc2 / u.length(capillaryLength({ surfaceTension: 0.0728, density: 998, gravity: 9.81 })),
        ).toBeCloseTo(1, 9);
      }),
    );
  });

  it('Laplace pressure is a pressure, the Wilhelmy force a force, the Washburn time a time', () => {
    fc.assert(
      fc.property(scale, scale, scale, (a, b, c) => {
        const u = conv(a, b, c);
        const p = laplacePressure({ surfaceTension: 0.05, r1: 2e-3, r2: 5e-3 });
        const p2 = laplacePressure({
          surfaceTension: u.surfaceTension(0.05),
          r1: u.length(2e-3),
          r2: u.length(5e-3),
        });
        expect(p2 / u.pressure(p)).toBeCloseTo(1, 9);

        const f = wilhelmyForce({ surfaceTension: 0.05, contactAngleDeg: 10, width: 0.02, thickness: 1e-4 });
        const f2 = wilhelmyForce({
          surfaceTension: u.surfaceTension(0.05),
          contactAngleDeg: 10,
          width: u.length(0.02),
          thickness: u.length(1e-4),
        });
        expect(f2 / u.force(f)).toBeCloseTo(1, 9);

        const t = washburnTime({
          length: 0.05,
          poreRadius: 2e-5,
          surfaceTension: 0.05,
          contactAngleDeg: 0,
          viscosity: 1e-3,
        });
        const t2 = washburnTime({
          length: u.length(0.05),
          poreRadius: u.length(2e-5),
          surfaceTension: u.surfaceTension(0.05),
          contactAngleDeg: 0,
          viscosity: u.viscosity(1e-3),
        });
        expect(t2 / u.time(t)).toBeCloseTo(1, 9);
      }),
    );
  });
});
