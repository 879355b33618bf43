import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { calculate } from '../registry.js';
import { STANDARD_GRAVITY } from '../units.js';

// Reference checks for the contact angle read from a Wilhelmy plate force with buoyancy. No worked
// example of this calculation with its numbers was seen printed, so each row is checked against an
// independent route: the force written forwards by hand, F = σ·P·cos θ − ρ·g·w·t·h, then read back.

const G = STANDARD_GRAVITY;
const SIGMA_20C = 0.07274; // IAPWS R1-76(2014) Table 1, water at 20 °C, printed
const RHO_20C = 998.2067; // Tanaka et al. 2001 at 20 °C, computed (REFERENCES.md)

/** The force a plate feels at angle θ (degrees), by hand: σ·2(w + t)·cos θ − ρ·g·w·t·h. */
function forwardForce(angleDeg: number, plate: { w: number; t: number; h: number }): number {
  const { w, t, h } = plate;
  return SIGMA_20C * 2 * (w + t) * Math.cos((angleDeg * Math.PI) / 180) - RHO_20C * G * w * t * h;
}

const base = { surfaceTension: SIGMA_20C, density: RHO_20C, plateWidth: 0.02, plateThickness: 1e-4 };

describe('contact-angle-from-force: reference rows', () => {
  // [case, inputs, expected angle (deg), tolerance (deg), source of the expected value]
  const rows: [string, Record<string, number | string>, number, number, string][] = [
    [
      '20 × 0.1 mm plate 2 mm deep, F = 1.4229178 mN',
      { ...base, immersionDepth: 0.002, force: 1.4229178e-3 },
      60,
      1e-4,
      'hand arithmetic: 0.07274 × 0.0402 × 0.5 − 998.2067 × 9.80665 × 0.02 × 0.0001 × 0.002 = 1.4229178e-3 N (python3)',
    ],
    [
      'zero depth, F = σ·P (the surface-tension reading of ASTM D1331 Method C run backwards)',
      { ...base, immersionDepth: 0, force: SIGMA_20C * 0.0402 },
      0,
      1e-5,
      'ASTM D1331-20 Method C: a fully wetted plate at zero depth pulls σ·P (scope as published)',
    ],
    [
      'F = −B: the surface pulls neither way, θ = 90°',
      { ...base, immersionDepth: 0.005, force: -RHO_20C * G * 0.02 * 1e-4 * 0.005 },
      90,
      1e-9,
      'hand arithmetic: cos θ = 0',
    ],
  ];
  it.each(rows)('%s → %s° (%s)', (_case, inputs, expected, tol) => {
    const r = calculate('contact-angle-from-force', inputs);
    expect(Math.abs((r.outputs.contactAngleDeg ?? NaN) - expected)).toBeLessThanOrEqual(tol);
  });

  it('gives the buoyancy ρ·g·w·t·h and the wetted length 2(w + t) it used (hand arithmetic)', () => {
    const r = calculate('contact-angle-from-force', { ...base, immersionDepth: 0.002, force: 1e-3 });
    expect(r.outputs.buoyancy).toBeCloseTo(3.915625e-5, 10); // 998.2067 × 9.80665 × 0.02 × 1e-4 × 0.002
    expect(r.outputs.wettedLength).toBeCloseTo(0.0402, 12);
  });

  it('reads advancing and receding angles and their hysteresis back from forces made forwards (fast-check)', () => {
    fc.assert(
      fc.property(
        fc.double({ min: 16, max: 170, noNaN: true }),
        fc.double({ min: 0, max: 1, noNaN: true }),
        fc.double({ min: 0, max: 0.01, noNaN: true }),
        (advancing, k, h) => {
          const receding = 16 + k * (advancing - 16);
          const plate = { w: 0.02, t: 1e-4, h };
          const r = calculate('contact-angle-from-force', {
            ...base,
            readings: 'cycle',
            immersionDepth: h,
            force: forwardForce(advancing, plate),
            recedingForce: forwardForce(receding, plate),
          });
          expect(r.outputs.contactAngleDeg).toBeCloseTo(advancing, 7);
          expect(r.outputs.recedingAngleDeg).toBeCloseTo(receding, 7);
          expect(r.outputs.hysteresisDeg).toBeCloseTo(advancing - receding, 7);
        },
      ),
    );
  });
});

describe('contact-angle-from-force: refusals and warnings', () => {
  it('refuses a force the surface tension cannot give, with the reason, and withholds the angle', () => {
    const r = calculate('contact-angle-from-force', { force: 0.01 });
    expect(r.outputs.contactAngleDeg).toBeNull();
    expect(r.outputs.cosTheta).toBeGreaterThan(1);
    const w = r.warnings.find((x) => x.code === 'NO_ANGLE_FOR_FORCE');
    expect(w?.message).toMatch(/surface tension entered is too low/);
    expect(w?.message).toMatch(/tared/);
    expect(w?.fields).toEqual(['force', 'surfaceTension']);
    expect(r.working.some((s) => s.id === 'angle')).toBe(false);
  });

  it('says "pushed up" for a cosine below −1', () => {
    const r = calculate('contact-angle-from-force', { force: -0.01 });
    expect(r.outputs.cosTheta).toBeLessThan(-1);
    expect(r.warnings[0]?.message).toMatch(/pushed up/);
  });

  it('gives no hysteresis when the withdrawal force is below the immersion force', () => {
    const r = calculate('contact-angle-from-force', { readings: 'cycle', force: 2e-3, recedingForce: 1e-3 });
    expect(r.outputs.recedingAngleDeg).toBeGreaterThan(r.outputs.contactAngleDeg ?? 0);
    expect(r.outputs.hysteresisDeg).toBeNull();
    expect(r.warnings.map((w) => w.code)).toEqual(['RECEDING_ABOVE_ADVANCING']);
  });

  it('says how far 1 % moves a small angle: arccos(0.99·cos 10°) − 10° = 2.85° (python3)', () => {
    const F = forwardForce(10, { w: 0.02, t: 1e-4, h: 0 });
    const r = calculate('contact-angle-from-force', { ...base, immersionDepth: 0, force: F });
    expect(r.outputs.contactAngleDeg).toBeCloseTo(10, 8);
    expect(r.warnings.find((w) => w.code === 'ANGLE_POORLY_DETERMINED')?.message).toMatch(/by 2\.8°/);
    const at20 = calculate('contact-angle-from-force', {
      ...base,
      immersionDepth: 0,
      force: forwardForce(20, { w: 0.02, t: 1e-4, h: 0 }),
    });
    expect(at20.warnings).toEqual([]);
  });

  it('shows receding outputs only with two readings', () => {
    const one = calculate('contact-angle-from-force', {});
    expect(one.outputs).toMatchObject({ recedingAngleDeg: null, hysteresisDeg: null });
    expect(one.inputs).not.toHaveProperty('recedingForce');
  });
});
