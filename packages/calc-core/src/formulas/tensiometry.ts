import { CalcInputError } from '../errors.js';
import { contactAngle, cosDeg, finiteResult, nonNegative, positive } from '../guards.js';
import { STANDARD_GRAVITY } from '../units.js';

// Force tensiometry. The plate and rod forms assume zero immersion depth (the buoyancy of the
// immersed part is neglected) and a force net of the probe's weight, as the Wilhelmy method is run.

function wettingCos(angleDeg: number): number {
  contactAngle('contactAngleDeg', angleDeg);
  if (angleDeg >= 90) {
    throw new CalcInputError({
      field: 'contactAngleDeg',
      code: 'ANGLE_NOT_WETTING',
      message: 'a surface tension can only be read from a pull with θ below 90°',
    });
  }
  return cosDeg(angleDeg);
}

/**
 * Wetted perimeter of a rectangular plate, P = 2(w + t).
 * @param width plate width in m
 * @param thickness plate thickness in m (0 for an ideal thin plate)
 * @returns perimeter in m
 */
export function platePerimeter(width: number, thickness: number): number {
  return 2 * (positive('width', width) + nonNegative('thickness', thickness));
}

/**
 * Wilhelmy plate: F = σ·P·cos θ with P = 2(w + t).
 * @param args.surfaceTension N/m
 * @param args.contactAngleDeg degrees, 0–180
 * @param args.width m
 * @param args.thickness m
 * @returns force in N (negative when θ > 90°: the plate is pushed out)
 */
export function wilhelmyForce(args: {
  readonly surfaceTension: number;
  readonly contactAngleDeg: number;
  readonly width: number;
  readonly thickness: number;
}): number {
  const sigma = positive('surfaceTension', args.surfaceTension);
  const cos = cosDeg(contactAngle('contactAngleDeg', args.contactAngleDeg));
  return finiteResult('Wilhelmy force', sigma * platePerimeter(args.width, args.thickness) * cos);
}

/**
 * Wilhelmy plate read backwards: σ = F / (P·cos θ).
 * @param args.force pull in N (> 0)
 * @param args.contactAngleDeg degrees, below 90
 * @param args.width m
 * @param args.thickness m
 * @returns surface tension in N/m
 */
export function wilhelmySurfaceTension(args: {
  readonly force: number;
  readonly contactAngleDeg: number;
  readonly width: number;
  readonly thickness: number;
}): number {
  const force = positive('force', args.force);
  const cos = wettingCos(args.contactAngleDeg);
  return finiteResult('surface tension', force / (platePerimeter(args.width, args.thickness) * cos));
}

/**
 * Wilhelmy method with a rod or fibre: F = σ·π·d·cos θ.
 * @param args.surfaceTension N/m
 * @param args.contactAngleDeg degrees, 0–180
 * @param args.diameter rod diameter in m
 * @returns force in N
 */
export function wilhelmyRodForce(args: {
  readonly surfaceTension: number;
  readonly contactAngleDeg: number;
  readonly diameter: number;
}): number {
  const sigma = positive('surfaceTension', args.surfaceTension);
  const cos = cosDeg(contactAngle('contactAngleDeg', args.contactAngleDeg));
  return finiteResult('Wilhelmy force', sigma * Math.PI * positive('diameter', args.diameter) * cos);
}

/**
 * Rod or fibre read backwards: σ = F / (π·d·cos θ).
 * @param args.force pull in N (> 0)
 * @param args.contactAngleDeg degrees, below 90
 * @param args.diameter rod diameter in m
 * @returns surface tension in N/m
 */
export function wilhelmyRodSurfaceTension(args: {
  readonly force: number;
  readonly contactAngleDeg: number;
  readonly diameter: number;
}): number {
  const force = positive('force', args.force);
  const cos = wettingCos(args.contactAngleDeg);
  return finiteResult('surface tension', force / (Math.PI * positive('diameter', args.diameter) * cos));
}

export interface RingResult {
  /** Corrected surface (or interfacial) tension σ = f·σ*, N/m. */
  readonly surfaceTension: number;
  /** Apparent value σ* = F / (4πR) before correction, N/m. */
  readonly apparentSurfaceTension: number;
  /** Zuidema–Waters factor f (dimensionless). */
  readonly correctionFactor: number;
}

/**
 * du Noüy ring, σ = f·F/(4πR), with the Zuidema–Waters (1941) factor in the form ASTM D971 gives:
 * f = 0.7250 + √(0.01452·P / (C²·(D − d)) + 0.04534 − 1.679·r/R), where P is the apparent value in
 * mN/m (dyn/cm), C = 2πR the ring circumference in cm, D − d the density difference of the two
 * phases in g/mL and r/R the wire-to-ring radius ratio.
 *
 * The constant 0.01452 carries gravity (f depends on R³/V, and V = F/(Δρ·g)); we take it as fitted
 * at standard gravity and scale the term by gₙ/g. That scaling follows from the dimensions; ASTM
 * writes no g. With `gravity` absent the expression is exactly ASTM's.
 * @param args.force maximum pull, net of the ring's weight, in N
 * @param args.ringRadius mean ring radius R in m
 * @param args.wireRadius wire radius r in m
 * @param args.densityDifference density of the lower phase minus the upper, kg/m³ (≈ liquid density against air)
 * @param args.gravity m/s², standard gravity when absent
 * @returns corrected and apparent surface tension in N/m and the factor
 * @throws RangeError where the square root's argument is negative (outside the correction's range)
 */
export function duNouySurfaceTension(args: {
  readonly force: number;
  readonly ringRadius: number;
  readonly wireRadius: number;
  readonly densityDifference: number;
  readonly gravity?: number;
}): RingResult {
  const force = positive('force', args.force);
  const R = positive('ringRadius', args.ringRadius);
  const r = positive('wireRadius', args.wireRadius);
  const drho = positive('densityDifference', args.densityDifference);
  const g = positive('gravity', args.gravity ?? STANDARD_GRAVITY);
  if (r >= R) {
    throw new CalcInputError({
      field: 'wireRadius',
      code: 'WIRE_NOT_THINNER_THAN_RING',
      message: 'the wire radius must be smaller than the ring radius',
    });
  }
  const apparent = finiteResult('apparent surface tension', force / (4 * Math.PI * R));
  const pDynPerCm = apparent * 1000;
  const circumferenceCm = 2 * Math.PI * R * 100;
  const drhoGPerMl = drho / 1000;
  const radicand =
    (0.01452 * pDynPerCm * (STANDARD_GRAVITY / g)) / (circumferenceCm ** 2 * drhoGPerMl) +
    0.04534 -
    1.679 * (r / R);
  if (!(radicand >= 0)) {
    throw new RangeError(
      `du Noüy ring: outside the range of the Zuidema–Waters correction (0.01452·P/(C²·(D − d)) + 0.04534 − 1.679·r/R = ${radicand.toPrecision(3)} must not be negative)`,
    );
  }
  const f = 0.725 + Math.sqrt(radicand);
  return {
    surfaceTension: finiteResult('surface tension', f * apparent),
    apparentSurfaceTension: apparent,
    correctionFactor: f,
  };
}
