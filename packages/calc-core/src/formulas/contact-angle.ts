import { CalcInputError } from '../errors.js';
import { contactAngle, cosDeg, finiteResult, positive } from '../guards.js';
import { STANDARD_GRAVITY } from '../units.js';

// Contact angles and surface tensions read backwards from a measurement: the force on a Wilhelmy
// plate with the buoyancy of its immersed part (plate-force.ts), and the rise in a narrow tube with
// Rayleigh's first-order meniscus correction. All SI: N, N/m, kg/m³, m, m/s².

// The plate's force balance is in plate-force.ts, apart, so that tension-from-rise (which reads its
// angle from a rise) does not carry it; re-exported here as before.
export { plateForceTerms, type PlateForceArgs, type PlateForceTerms } from './plate-force.js';

/** Degrees, 0–180, from a cosine inside [−1, 1]. */
export function acosDeg(cos: number): number {
  return (Math.acos(cos) * 180) / Math.PI;
}

/**
 * Below this angle a 1 % error in the force, rise or surface tension moves a contact angle read from
 * its cosine by about 2° or more (arccos(0.99·cos 15°) − 15° = 2.0°): our threshold for saying the
 * angle is poorly determined.
 */
export const ILL_CONDITIONED_BELOW_DEG = 15;

/** How far an angle below 90° moves, in degrees, when its cosine is 1 % lower. */
export function onePercentShift(angleDeg: number): number {
  return acosDeg(0.99 * Math.cos((angleDeg * Math.PI) / 180)) - angleDeg;
}

/**
 * The contact angle whose cosine is `cos`, in degrees, 0–180.
 * @throws CalcInputError with code COS_OUT_OF_RANGE when |cos| > 1 (no such angle)
 */
export function angleFromCos(field: string, cos: number): number {
  if (!Number.isFinite(cos) || cos > 1 || cos < -1) {
    throw new CalcInputError({
      field,
      code: 'COS_OUT_OF_RANGE',
      message: `cos θ comes out at ${cos.toPrecision(3)}, outside −1…1: no contact angle gives this measurement`,
    });
  }
  return (Math.acos(cos) * 180) / Math.PI;
}

export interface TubeRiseReading {
  /** Rise to the bottom of the meniscus above the free surface, m. */
  readonly rise: number;
  /** Bore diameter, m. */
  readonly diameter: number;
  /** kg/m³ */
  readonly density: number;
  /** m/s²; standard gravity when absent */
  readonly gravity?: number;
}

/**
 * ρ·g·r·(h + r/3): the weight per unit length of the wall that the surface tension holds up, with
 * Rayleigh's first-order meniscus term r/3 (Rayleigh 1915, Proc. R. Soc. A 92, 184), N/m.
 */
function heldWeight(args: TubeRiseReading): number {
  const h = positive('rise', args.rise);
  const r = positive('diameter', args.diameter) / 2;
  const rho = positive('density', args.density);
  const g = positive('gravity', args.gravity ?? STANDARD_GRAVITY);
  return rho * g * r * (h + r / 3);
}

/**
 * Surface tension from a measured rise, Rayleigh (1915) first order: σ = ρ·g·r·(h + r/3) / (2·cos θ).
 * @param args.contactAngleDeg degrees, below 90 (a wetting meniscus)
 * @returns N/m
 */
export function tensionFromRise(args: TubeRiseReading & { readonly contactAngleDeg: number }): number {
  contactAngle('contactAngleDeg', args.contactAngleDeg);
  if (args.contactAngleDeg >= 90) {
    throw new CalcInputError({
      field: 'contactAngleDeg',
      code: 'ANGLE_NOT_WETTING',
      message: 'a rise gives a surface tension only for a wetting liquid, θ below 90°',
    });
  }
  return finiteResult('surface tension', heldWeight(args) / (2 * cosDeg(args.contactAngleDeg)));
}

/**
 * cos θ from a measured rise with a known surface tension: cos θ = ρ·g·r·(h + r/3) / (2σ).
 * Unclamped, as for the plate: above 1 the rise is more than the surface tension can hold.
 */
export function cosFromRise(args: TubeRiseReading & { readonly surfaceTension: number }): number {
  const sigma = positive('surfaceTension', args.surfaceTension);
  return finiteResult('cos θ', heldWeight(args) / (2 * sigma));
}
