import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { waterSurfaceTension } from '../properties/water.js';
import { STANDARD_GRAVITY } from '../units.js';
import {
  duNouySurfaceTension,
  RING_TABLE_RANGE,
  ringCorrection,
  ZUIDEMA_WATERS,
  wilhelmyForce,
  wilhelmyRodForce,
  wilhelmyRodSurfaceTension,
  wilhelmySurfaceTension,
} from './tensiometry.js';

describe('Wilhelmy plate and rod', () => {
  it('a fully wetted plate in water at 20 °C pulls σ·2(w + t) (REFERENCES.md formula; σ from IAPWS R1-76)', () => {
    const sigma = waterSurfaceTension(20);
    const f = wilhelmyForce({ surfaceTension: sigma, contactAngleDeg: 0, width: 0.02, thickness: 0.1e-3 });
    expect(f).toBeCloseTo(sigma * 0.0402, 15);
    // 2.924 mN: the order every plate tensiometer shows for water.
    expect(f * 1000).toBeCloseTo(2.924, 3);
  });

  it('force and surface tension round-trip for plates and rods (fast-check)', () => {
    fc.assert(
      fc.property(
        fc.double({ min: 1e-3, max: 1, noNaN: true }),
        fc.double({ min: 0, max: 89, noNaN: true }),
        fc.double({ min: 1e-4, max: 0.1, noNaN: true }),
        fc.double({ min: 0, max: 1e-3, noNaN: true }),
        (sigma, theta, w, t) => {
          const f = wilhelmyForce({ surfaceTension: sigma, contactAngleDeg: theta, width: w, thickness: t });
          expect(
            wilhelmySurfaceTension({ force: f, contactAngleDeg: theta, width: w, thickness: t }),
          ).toBeCloseTo(sigma, 10);
          const fr = wilhelmyRodForce({ surfaceTension: sigma, contactAngleDeg: theta, diameter: w });
          expect(fr).toBeCloseTo(sigma * Math.PI * w * Math.cos((theta * Math.PI) / 180), 12);
          expect(wilhelmyRodSurfaceTension({ force: fr, contactAngleDeg: theta, diameter: w })).toBeCloseTo(
            sigma,
            10,
          );
        },
      ),
    );
  });

  it('refuses to read a surface tension through θ ≥ 90° and names bad sizes', () => {
    expect(() =>
      wilhelmySurfaceTension({ force: 1e-3, contactAngleDeg: 90, width: 0.02, thickness: 0 }),
    ).toThrow(expect.objectContaining({ field: 'contactAngleDeg', code: 'ANGLE_NOT_WETTING' }));
    expect(() =>
      wilhelmyForce({ surfaceTension: 0.07, contactAngleDeg: 0, width: 0.02, thickness: -1 }),
    ).toThrow(expect.objectContaining({ field: 'thickness', code: 'NEGATIVE' }));
    expect(() => wilhelmyRodSurfaceTension({ force: 0, contactAngleDeg: 0, diameter: 1e-3 })).toThrow(
      expect.objectContaining({ field: 'force' }),
    );
  });
});

describe('du Noüy ring, Zuidema–Waters as in ASTM D971', () => {
  const ring = { ringRadius: 9.55e-3, wireRadius: 0.2e-3, densityDifference: 998 };

  it('gives the uncorrected value F/(4πR) beside the corrected one', () => {
    const r = duNouySurfaceTension({ ...ring, force: 9e-3 });
    expect(r.apparentSurfaceTension).toBeCloseTo(9e-3 / (4 * Math.PI * 9.55e-3), 15);
    expect(r.surfaceTension).toBeCloseTo(r.correctionFactor * r.apparentSurfaceTension, 15);
  });

  it('reproduces the ASTM D971 expression evaluated in its own units: P dyn/cm, C cm, D − d g/mL (from memory)', () => {
    // Worked here in CGS straight from the printed form, independently of the SI code path.
    const forceDyn = 9e-3 * 1e5;
    const Rcm = 0.955;
    const P = forceDyn / (4 * Math.PI * Rcm);
    const C = 2 * Math.PI * Rcm;
    const f = 0.725 + Math.sqrt((0.01452 * P) / (C * C * 0.998) + 0.04534 - 1.679 * (0.02 / 0.955));
    const r = duNouySurfaceTension({ ...ring, force: 9e-3 });
    expect(r.correctionFactor).toBeCloseTo(f, 12);
    expect(r.surfaceTension * 1000).toBeCloseTo(f * P, 9);
  });

  it('for water with a 6 cm ring the factor is about 0.93 (from memory: typical du Noüy correction for water)', () => {
    // Find the pull that a water surface at 20 °C (IAPWS R1-76) would give, by bisection on f·σ* = σ.
    const target = waterSurfaceTension(20);
    let lo = 1e-3;
    let hi = 2e-2;
    for (let i = 0; i < 80; i++) {
      const mid = (lo + hi) / 2;
      if (duNouySurfaceTension({ ...ring, force: mid }).surfaceTension < target) lo = mid;
      else hi = mid;
    }
    const f = duNouySurfaceTension({ ...ring, force: lo }).correctionFactor;
    expect(f).toBeGreaterThan(0.91);
    expect(f).toBeLessThan(0.95);
  });

  it('scales the gravity term by gₙ/g and is ASTM’s expression at standard gravity', () => {
    const std = duNouySurfaceTension({ ...ring, force: 9e-3 });
    expect(duNouySurfaceTension({ ...ring, force: 9e-3, gravity: 9.80665 })).toEqual(std);
    // Lower g means a larger meniscus volume per unit pull: the term grows, and so does f.
    expect(duNouySurfaceTension({ ...ring, force: 9e-3, gravity: 9.78 }).correctionFactor).toBeGreaterThan(
      std.correctionFactor,
    );
  });

  it('refuses a wire as thick as the ring and a ratio outside the correction', () => {
    expect(() => duNouySurfaceTension({ ...ring, force: 9e-3, wireRadius: 0.01 })).toThrow(
      expect.objectContaining({ field: 'wireRadius', code: 'WIRE_NOT_THINNER_THAN_RING' }),
    );
    expect(() => duNouySurfaceTension({ ...ring, force: 1e-5, wireRadius: 1e-3 })).toThrow(RangeError);
    expect(() => duNouySurfaceTension({ ...ring, force: 1e-5, wireRadius: 1e-3 })).toThrow(/Zuidema–Waters/);
  });
});

describe('the ring correction with its pieces', () => {
  const base = { force: 9e-3, ringRadius: 9.55e-3, wireRadius: 0.2e-3, densityDifference: 998 };

  it('gives R/r, V = F/(Δρ g), R³/V and the radicand, the last against ASTM D971 written out by hand', () => {
    const x = ringCorrection(base);
    expect(x.ringToWire).toBeCloseTo(47.75, 12);
    expect(x.liftedVolume).toBeCloseTo(9e-3 / (998 * STANDARD_GRAVITY), 15);
    expect(x.r3OverV).toBeCloseTo(9.55e-3 ** 3 / x.liftedVolume, 12);
    // ASTM D971 form in its own units: P dyn/cm, C cm, D − d g/mL.
    const P = (9e-3 * 1e5) / (4 * Math.PI * 0.955);
    const C = 2 * Math.PI * 0.955;
    const rad = (0.01452 * P) / (C * C * 0.998) + 0.04534 - 1.679 * (0.2 / 9.55);
    expect(x.radicand).toBeCloseTo(rad, 12);
    expect(x.root).toBeCloseTo(Math.sqrt(rad), 12);
    expect(x.factor).toBeCloseTo(0.725 + Math.sqrt(rad), 12);
    expect(x.inTableRange).toBe(true);
  });

  it('scales the gravity term by gₙ/g: the same lifted volume at another g gives the same factor', () => {
    const g = 9.78;
    const x = ringCorrection({ ...base, force: (base.force * g) / STANDARD_GRAVITY, gravity: g });
    expect(x.liftedVolume).toBeCloseTo(ringCorrection(base).liftedVolume, 15);
    expect(x.factor).toBeCloseTo(ringCorrection(base).factor ?? 0, 12);
  });

  it('holds the constants ASTM D971 prints (recalled) and the table range (from memory)', () => {
    expect(ZUIDEMA_WATERS).toEqual({ base: 0.725, k: 0.01452, c: 0.04534, m: 1.679 });
    expect(RING_TABLE_RANGE).toEqual({
      ringToWire: { min: 30, max: 80 },
      r3OverV: { min: 0.3, max: 4.5 },
      factor: { min: 0.75, max: 1.05 },
    });
  });

  it('is in the table range exactly at its edges and out just beyond them', () => {
    const R = 9.55e-3;
    const at = (ratio: number, r3v: number) =>
      ringCorrection({
        ringRadius: R,
        wireRadius: R / ratio,
        densityDifference: 1000,
        force: (R ** 3 / r3v) * 1000 * STANDARD_GRAVITY,
      }).inTableRange;
    expect(at(30 * (1 + 1e-9), 1)).toBe(true);
    expect(at(80 * (1 - 1e-9), 1)).toBe(true);
    expect(at(29.9, 1)).toBe(false);
    expect(at(80.1, 1)).toBe(false);
    expect(at(47, 0.3 * 1.0001)).toBe(true);
    expect(at(47, 4.5 * 0.9999)).toBe(true);
    expect(at(47, 0.299)).toBe(false);
    expect(at(47, 4.51)).toBe(false);
  });

  it('gives no root and no factor where the radicand is negative, and the refusal names it', () => {
    const thick = { force: 1e-6, ringRadius: 2e-3, wireRadius: 1e-3, densityDifference: 998 };
    const x = ringCorrection(thick);
    expect(x.radicand).toBeLessThan(0);
    expect(x.root).toBeNull();
    expect(x.factor).toBeNull();
    expect(() => duNouySurfaceTension(thick)).toThrow(RangeError);
    expect(() => ringCorrection({ ...thick, wireRadius: 2e-3 })).toThrow(
      expect.objectContaining({ code: 'WIRE_NOT_THINNER_THAN_RING' }),
    );
  });
});
