import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { jurinRise, meniscusCorrection } from './capillary.js';
import { angleFromCos, cosFromRise, plateForceTerms, tensionFromRise } from './contact-angle.js';
import { wilhelmyForce } from './tensiometry.js';

const G = 9.80665;

describe('Wilhelmy plate read for the contact angle, with buoyancy', () => {
  // Hand computation (independent route: the force written forwards, F = σ·P·cos θ − ρ·g·w·t·h, then read back).
  // Water at 20 °C: σ = 72.74 mN/m (IAPWS R1-76 Table 1, printed), ρ = 998.2067 kg/m³ (Tanaka 2001, computed in REFERENCES).
  it('recovers 60° from a force computed by hand at 2 mm depth (20 × 0.1 mm plate)', () => {
    const sigma = 0.07274;
    const rho = 998.2067;
    const [w, t, h] = [0.02, 0.0001, 0.002];
    const force = sigma * 2 * (w + t) * 0.5 - rho * G * w * t * h; // 1.462074e-3 − 3.915625e-5 N (python3, by hand)
    expect(force).toBeCloseTo(0.00142292, 7);
    const terms = plateForceTerms({
      force,
      surfaceTension: sigma,
      density: rho,
      plateWidth: w,
      plateThickness: t,
      immersionDepth: h,
    });
    expect(terms.perimeter).toBeCloseTo(0.0402, 12);
    expect(terms.buoyancy).toBeCloseTo(3.915625e-5, 10);
    expect(angleFromCos('force', terms.cosTheta)).toBeCloseTo(60, 9);
  });

  it('at zero depth agrees with the plate formula run forwards (tensiometry.wilhelmyForce), over the whole wetting range (fast-check)', () => {
    fc.assert(
      fc.property(
        fc.double({ min: 0.01, max: 0.5, noNaN: true }),
        fc.double({ min: 0, max: 180, noNaN: true }),
        fc.double({ min: 1e-3, max: 0.05, noNaN: true }),
        fc.double({ min: 0, max: 1e-3, noNaN: true }),
        (sigma, angle, w, t) => {
          const force = wilhelmyForce({
            surfaceTension: sigma,
            contactAngleDeg: angle,
            width: w,
            thickness: t,
          });
          const { cosTheta } = plateForceTerms({
            force,
            surfaceTension: sigma,
            density: 1000,
            plateWidth: w,
            plateThickness: t,
            immersionDepth: 0,
          });
          expect(cosTheta).toBeCloseTo(Math.cos((angle * Math.PI) / 180), 9);
        },
      ),
    );
  });

  it('refuses a cosine outside −1…1 with the reason, naming the field', () => {
    const { cosTheta } = plateForceTerms({
      force: 0.01,
      surfaceTension: 0.02,
      density: 1000,
      plateWidth: 0.02,
      plateThickness: 0.0001,
      immersionDepth: 0,
    });
    expect(cosTheta).toBeGreaterThan(1);
    expect(() => angleFromCos('force', cosTheta)).toThrowError(/outside −1…1/);
    try {
      angleFromCos('force', cosTheta);
    } catch (e) {
      expect(e).toMatchObject({ code: 'COS_OUT_OF_RANGE', field: 'force' });
    }
  });
});

describe('surface tension or contact angle from a measured rise (Rayleigh 1915, first order)', () => {
  it('inverts Jurin’s rise less the meniscus correction (independent route: capillary.ts forwards) for wetting angles', () => {
    fc.assert(
      fc.property(
        fc.double({ min: 0.02, max: 0.08, noNaN: true }),
        fc.double({ min: 0.1e-3, max: 1e-3, noNaN: true }),
        (sigma, d) => {
          const rise =
            jurinRise({ surfaceTension: sigma, contactAngleDeg: 0, density: 998.2, diameter: d }) -
            meniscusCorrection({ diameter: d, contactAngleDeg: 0 });
          expect(tensionFromRise({ rise, diameter: d, density: 998.2, contactAngleDeg: 0 })).toBeCloseTo(
            sigma,
            10,
          );
          expect(cosFromRise({ rise, diameter: d, density: 998.2, surfaceTension: sigma })).toBeCloseTo(1, 9);
        },
      ),
    );
  });

  it('hand case: 0.5 mm bore, 59.4 mm rise, ρ = 998.2 kg/m³, θ = 0 → σ = ρ·g·r·(h + r/3)/2 = 0.0727853 N/m', () => {
    // 998.2 × 9.80665 × 0.00025 × (0.0594 + 0.00025/3) / 2 = 0.07278528 N/m (computed separately with python3).
    expect(
      tensionFromRise({ rise: 0.0594, diameter: 0.0005, density: 998.2, contactAngleDeg: 0 }),
    ).toBeCloseTo(0.07278528, 8);
  });

  it('refuses a non-wetting angle for the surface tension', () => {
    expect(() =>
      tensionFromRise({ rise: 0.01, diameter: 0.001, density: 1000, contactAngleDeg: 95 }),
    ).toThrowError(/wetting/);
  });
});
