import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { CalcInputError } from '../errors.js';
import { waterDensity, waterSurfaceTension } from '../properties/water.js';
import {
  capillaryLength,
  jurinRise,
  meniscusCorrection,
  meniscusGeometry,
  slotMeniscusCorrection,
  slotMeniscusGeometry,
  slotRise,
} from './capillary.js';

const water20 = { surfaceTension: waterSurfaceTension(20), density: waterDensity(20).value };

describe("Jurin's law", () => {
  it('OpenStax College Physics problem 11.79: r = 0.500 mm, σ = 0.0728 N/m, ρ = 1000 kg/m³, g = 9.80 m/s² → 2.97 cm (printed)', () => {
    const h = jurinRise({
      surfaceTension: 0.0728,
      contactAngleDeg: 0,
      density: 1000,
      diameter: 1e-3,
      gravity: 9.8,
    });
    // The answer is printed to three figures: ±0.005 cm.
    expect(Math.abs(h - 0.0297)).toBeLessThanOrEqual(0.00005);
  });

  it('water at 20 °C in glass: h·d ≈ 30 mm² (common practice rule of thumb)', () => {
    for (const d of [0.1e-3, 0.5e-3, 1e-3]) {
      const hd = jurinRise({ ...water20, contactAngleDeg: 0, diameter: d }) * d;
      expect(Math.abs(hd * 1e6 - 30)).toBeLessThan(1);
    }
  });

  it('capillary length of water at 20 °C is 2.726 mm (REFERENCES.md, computed)', () => {
    expect(Math.abs(capillaryLength(water20) * 1000 - 2.726)).toBeLessThan(0.0005);
  });

  it('a slot rises half as high as a tube whose bore equals the gap (REFERENCES.md: 4σcosθ/(ρgd) vs 2σcosθ/(ρgw))', () => {
    fc.assert(
      fc.property(
        fc.double({ min: 1e-6, max: 1e-2, noNaN: true }),
        fc.double({ min: 0, max: 180, noNaN: true }),
        (w, theta) => {
          const tube = jurinRise({ ...water20, contactAngleDeg: theta, diameter: w });
          const slot = slotRise({ ...water20, contactAngleDeg: theta, gap: w });
          expect(slot).toBeCloseTo(tube / 2, 12);
        },
      ),
    );
  });

  it('falls as the bore grows (fast-check)', () => {
    fc.assert(
      fc.property(
        fc.double({ min: 1e-6, max: 1e-2, noNaN: true }),
        fc.double({ min: 1.001, max: 100, noNaN: true }),
        fc.double({ min: 0, max: 80, noNaN: true }),
        (d, k, theta) => {
          const narrow = jurinRise({ ...water20, contactAngleDeg: theta, diameter: d });
          const wide = jurinRise({ ...water20, contactAngleDeg: theta, diameter: d * k });
          expect(wide).toBeLessThan(narrow);
          expect(wide).toBeGreaterThan(0);
        },
      ),
    );
  });

  it('is a depression for θ > 90°, zero at exactly 90° and odd about 90°', () => {
    const at = (theta: number): number => jurinRise({ ...water20, contactAngleDeg: theta, diameter: 1e-3 });
    expect(at(90)).toBe(0);
    expect(at(140)).toBeLessThan(0);
    expect(at(180)).toBeCloseTo(-at(0), 15);
    expect(at(120)).toBeCloseTo(-at(60), 15);
  });

  it('names the bad argument and never returns NaN', () => {
    const base = { ...water20, contactAngleDeg: 0, diameter: 1e-3 };
    expect(() => jurinRise({ ...base, diameter: -1e-3 })).toThrow(
      expect.objectContaining({ field: 'diameter', code: 'NOT_POSITIVE' }),
    );
    expect(() => jurinRise({ ...base, contactAngleDeg: 181 })).toThrow(
      expect.objectContaining({ field: 'contactAngleDeg', code: 'ANGLE_OUT_OF_RANGE' }),
    );
    expect(() => jurinRise({ ...base, density: Number.NaN })).toThrow(
      expect.objectContaining({ field: 'density', code: 'NOT_A_NUMBER' }),
    );
    expect(() => jurinRise({ ...base, diameter: Infinity })).toThrow(
      expect.objectContaining({ field: 'diameter', code: 'NOT_FINITE' }),
    );
    expect(() => jurinRise({ ...base, gravity: 0 })).toThrow(CalcInputError);
    expect(() => jurinRise({ ...base, diameter: 1e-320 })).toThrow(RangeError);
    fc.assert(
      fc.property(fc.double(), fc.double(), fc.double(), fc.double(), (sigma, theta, rho, d) => {
        let value: number | undefined;
        try {
          value = jurinRise({ surfaceTension: sigma, contactAngleDeg: theta, density: rho, diameter: d });
        } catch (err) {
          expect(err instanceof CalcInputError || err instanceof RangeError).toBe(true);
          return;
        }
        expect(Number.isFinite(value)).toBe(true);
      }),
    );
  });
});

describe('meniscus-weight correction', () => {
  it("is Rayleigh's r/3 for a hemispherical meniscus (Rayleigh 1915, printed)", () => {
    fc.assert(
      fc.property(fc.double({ min: 1e-6, max: 1e-2, noNaN: true }), (d) => {
        expect(meniscusCorrection({ diameter: d, contactAngleDeg: 0 })).toBeCloseTo(d / 2 / 3, 15);
      }),
    );
  });

  it("recovers σ through Rayleigh's printed relation σ = ρ·g·r·(h + r/3) / (2 cos θ) (Rayleigh 1915)", () => {
    const d = 0.8e-3;
    const r = d / 2;
    const h =
      jurinRise({ ...water20, contactAngleDeg: 0, diameter: d }) -
      meniscusCorrection({ diameter: d, contactAngleDeg: 0 });
    const sigma = (water20.density * 9.80665 * r * (h + r / 3)) / 2;
    expect(sigma / water20.surfaceTension).toBeCloseTo(1, 12);
  });

  it('matches a numerical integration of the spherical meniscus for θ between 0 and 90° (computed here)', () => {
    for (const theta of [10, 35, 60, 85]) {
      const r = 1e-3;
      const R = r / Math.cos((theta * Math.PI) / 180);
      // Liquid above the lowest point: ∫₀ʳ 2πx·(R − √(R² − x²)) dx, spread over πr².
      const n = 20000;
      let volume = 0;
      for (let i = 0; i < n; i++) {
        const x = ((i + 0.5) / n) * r;
        volume += 2 * Math.PI * x * (R - Math.sqrt(R * R - x * x)) * (r / n);
      }
      expect(meniscusCorrection({ diameter: 2 * r, contactAngleDeg: theta })).toBeCloseTo(
        volume / (Math.PI * r * r),
        9,
      );
    }
  });

  it('for a slot is (1/2 − π/8)·w at θ = 0 and matches a numerical integration otherwise (derived here)', () => {
    expect(slotMeniscusCorrection({ gap: 1e-3, contactAngleDeg: 0 })).toBeCloseTo(
      (0.5 - Math.PI / 8) * 1e-3,
      15,
    );
    for (const theta of [20, 50, 80]) {
      const w = 1e-3;
      const a = w / 2;
      const R = a / Math.cos((theta * Math.PI) / 180);
      const n = 20000;
      let area = 0;
      for (let i = 0; i < n; i++) {
        const x = -a + ((i + 0.5) / n) * w;
        area += (R - Math.sqrt(R * R - x * x)) * (w / n);
      }
      expect(slotMeniscusCorrection({ gap: w, contactAngleDeg: theta })).toBeCloseTo(area / w, 9);
    }
  });

  it('shrinks to zero as the meniscus flattens at 90° and is refused for a convex meniscus', () => {
    expect(meniscusCorrection({ diameter: 1e-3, contactAngleDeg: 90 })).toBe(0);
    expect(meniscusCorrection({ diameter: 1e-3, contactAngleDeg: 60 })).toBeLessThan(
      meniscusCorrection({ diameter: 1e-3, contactAngleDeg: 30 }),
    );
    expect(() => meniscusCorrection({ diameter: 1e-3, contactAngleDeg: 140 })).toThrow(
      expect.objectContaining({ code: 'MENISCUS_NOT_CONCAVE' }),
    );
  });
});

describe('meniscus geometry, the intermediate values of the correction', () => {
  it('at θ = 0 is a hemisphere: sag r, liquid held πr³/3, correction r/3 (Rayleigh 1915)', () => {
    const m = meniscusGeometry({ diameter: 2e-3, contactAngleDeg: 0 });
    expect(m.radius).toBeCloseTo(1e-3, 15);
    expect(m.sag).toBeCloseTo(1e-3, 15);
    expect(m.held).toBeCloseTo((Math.PI * 1e-9) / 3, 20);
    expect(m.correction).toBeCloseTo(1e-3 / 3, 15);
  });

  it('at θ = 60° is a cap of radius 2r: sag and held volume from the cap by hand', () => {
    const r = 1e-3;
    const m = meniscusGeometry({ diameter: 2 * r, contactAngleDeg: 60 });
    const R = 2 * r;
    const s = R * (1 - Math.sqrt(3) / 2);
    const cap = (Math.PI * s * s * (3 * R - s)) / 3;
    expect(m.radius).toBeCloseTo(R, 15);
    expect(m.sag).toBeCloseTo(s, 15);
    expect(m.held).toBeCloseTo(Math.PI * r * r * s - cap, 20);
    expect(m.correction).toBeCloseTo(m.held / (Math.PI * r * r), 15);
  });

  it('in a slot at θ = 0 is a half-cylinder: correction (1/2 − π/8)·w, held w²/2 − πw²/8', () => {
    const w = 1e-3;
    const m = slotMeniscusGeometry({ gap: w, contactAngleDeg: 0 });
    expect(m.sag).toBeCloseTo(w / 2, 15);
    expect(m.held).toBeCloseTo((w * w) / 2 - (Math.PI * w * w) / 8, 20);
    expect(m.correction).toBeCloseTo((0.5 - Math.PI / 8) * w, 15);
  });

  it('at θ = 90° is flat: nothing held, no correction', () => {
    expect(meniscusGeometry({ diameter: 1e-3, contactAngleDeg: 90 })).toMatchObject({
      sag: 0,
      held: 0,
      correction: 0,
    });
    expect(slotMeniscusGeometry({ gap: 1e-3, contactAngleDeg: 90 })).toMatchObject({
      sag: 0,
      held: 0,
      correction: 0,
    });
  });
});
