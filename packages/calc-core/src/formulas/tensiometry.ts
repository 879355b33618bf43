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
 * The constants of the Zuidema–Waters (1941) fit as ASTM D971 writes it (from memory, not read
 * from the printed standard here): f = base + √(k·P/(C²·(D − d)) + c − m·r/R), P in dyn/cm, C in cm,
 * D − d in g/mL. The working is built from these same numbers.
 */
export const ZUIDEMA_WATERS = { base: 0.725, k: 0.01452, c: 0.04534, m: 1.679 } as const;

/**
 * The range over which Harkins & Jordan (1930) tabulate the ring factor, which the Zuidema–Waters
 * fit reproduces: R/r about 30–80, R³/V about 0.3–4.5, f about 0.75–1.05. Recalled, not seen
 * printed here (from memory); outside it the fit is an extrapolation.
 */
export const RING_TABLE_RANGE = {
  ringToWire: { min: 30, max: 80 },
  r3OverV: { min: 0.3, max: 4.5 },
  factor: { min: 0.75, max: 1.05 },
} as const;

/** The ring correction's pieces, for the working and the range checks. */
export interface RingCorrection {
  /** Apparent value σ* = F / (4πR), N/m. */
  readonly apparent: number;
  /** R/r. */
  readonly ringToWire: number;
  /** Volume of liquid lifted, V = F / (Δρ·g), m³. */
  readonly liftedVolume: number;
  /** R³/V (dimensionless). */
  readonly r3OverV: number;
  /** k·P·(gₙ/g)/(C²·(D − d)) + c − m·r/R (dimensionless). */
  readonly radicand: number;
  /** √radicand, or null where the radicand is negative. */
  readonly root: number | null;
  /** f = base + root, or null where the radicand is negative. */
  readonly factor: number | null;
  /** Whether R/r and R³/V are both inside the tabulated range. */
  readonly inTableRange: boolean;
}

/**
 * The Zuidema–Waters correction of a du Noüy ring reading with everything a checker needs: the
 * apparent value, R/r, the lifted volume and R³/V (the variables of Harkins & Jordan's tables),
 * the radicand and its root, and the factor. Never throws on range: the caller decides.
 *
 * The constant k carries gravity (f depends on R³/V, and V = F/(Δρ·g)); we take it as fitted at
 * standard gravity and scale the term by gₙ/g. That scaling follows from the dimensions; ASTM
 * writes no g. With `gravity` absent the expression is exactly ASTM's.
 * @param args.force maximum pull, net of the ring's weight, in N
 * @param args.ringRadius mean ring radius R in m
 * @param args.wireRadius wire radius r in m
 * @param args.densityDifference density of the lower phase minus the upper, kg/m³
 * @param args.gravity m/s², standard gravity when absent
 */
export function ringCorrection(args: {
  readonly force: number;
  readonly ringRadius: number;
  readonly wireRadius: number;
  readonly densityDifference: number;
  readonly gravity?: number;
}): RingCorrection {
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
  const { base, k, c, m } = ZUIDEMA_WATERS;
  const radicand =
    (k * pDynPerCm * (STANDARD_GRAVITY / g)) / (circumferenceCm ** 2 * drhoGPerMl) + c - m * (r / R);
  const root = radicand >= 0 ? Math.sqrt(radicand) : null;
  const liftedVolume = force / (drho * g);
  const ringToWire = R / r;
  const r3OverV = R ** 3 / liftedVolume;
  const t = RING_TABLE_RANGE;
  return {
    apparent,
    ringToWire,
    liftedVolume,
    r3OverV,
    radicand,
    root,
    factor: root === null ? null : base + root,
    inTableRange:
      ringToWire >= t.ringToWire.min &&
      ringToWire <= t.ringToWire.max &&
      r3OverV >= t.r3OverV.min &&
      r3OverV <= t.r3OverV.max,
  };
}

/**
 * du Noüy ring, σ = f·F/(4πR), with the Zuidema–Waters (1941) factor in the form ASTM D971 gives:
 * f = 0.7250 + √(0.01452·P / (C²·(D − d)) + 0.04534 − 1.679·r/R), where P is the apparent value in
 * mN/m (dyn/cm), C = 2πR the ring circumference in cm, D − d the density difference of the two
 * phases in g/mL and r/R the wire-to-ring radius ratio (see `ringCorrection` for gravity).
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
  const x = ringCorrection(args);
  if (x.factor === null) {
    throw new RangeError(
      `du Noüy ring: outside the range of the Zuidema–Waters correction (0.01452·P/(C²·(D − d)) + 0.04534 − 1.679·r/R = ${x.radicand.toPrecision(3)} must not be negative)`,
    );
  }
  return {
    surfaceTension: finiteResult('surface tension', x.factor * x.apparent),
    apparentSurfaceTension: x.apparent,
    correctionFactor: x.factor,
  };
}
