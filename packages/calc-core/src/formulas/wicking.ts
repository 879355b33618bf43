import { CalcInputError } from '../errors.js';
import { contactAngle, cosDeg, finiteResult, positive } from '../guards.js';
import { STANDARD_GRAVITY } from '../units.js';

// Lucas (1918) and Washburn (1921): L² = σ·r·t·cos θ / (2μ) for laminar Newtonian flow in a
// uniform capillary with a static contact angle; gravity and inertia neglected.

export interface WashburnArgs {
  /** Effective capillary radius, m. */
  readonly poreRadius: number;
  /** N/m */
  readonly surfaceTension: number;
  /** degrees, below 90 */
  readonly contactAngleDeg: number;
  /** Pa·s */
  readonly viscosity: number;
}

function drive(args: WashburnArgs): number {
  contactAngle('contactAngleDeg', args.contactAngleDeg);
  if (args.contactAngleDeg >= 90) {
    throw new CalcInputError({
      field: 'contactAngleDeg',
      code: 'NO_SPONTANEOUS_WICKING',
      message: 'at a contact angle of 90° or more the liquid does not wick in by itself',
    });
  }
  const r = positive('poreRadius', args.poreRadius);
  const sigma = positive('surfaceTension', args.surfaceTension);
  const mu = positive('viscosity', args.viscosity);
  // σ·r·cos θ / (2μ), m²/s: the Lucas–Washburn coefficient of L² against t.
  return (sigma * r * cosDeg(args.contactAngleDeg)) / (2 * mu);
}

/**
 * Lucas–Washburn time to wick a distance L: t = 2μ·L² / (σ·r·cos θ).
 * @param args.length distance (or height, gravity neglected) in m
 * @returns time in s
 */
export function washburnTime(args: WashburnArgs & { readonly length: number }): number {
  const length = positive('length', args.length);
  return finiteResult('wicking time', (length * length) / drive(args));
}

/**
 * Lucas–Washburn distance wicked in a time t: L = √(σ·r·t·cos θ / (2μ)).
 * @param args.time s
 * @returns distance in m
 */
export function washburnLength(args: WashburnArgs & { readonly time: number }): number {
  const time = positive('time', args.time);
  return finiteResult('wicking distance', Math.sqrt(drive(args) * time));
}

/**
 * Time for a vertical rise to reach a height h with gravity kept in Washburn's equation of motion,
 * dh/dt = (r²·ρ·g / 8μ)·(h_J − h)/h, which integrates to
 * t = (8μ / (r²·ρ·g))·(−h − h_J·ln(1 − h/h_J)), h_J = 2σ·cos θ/(ρ·g·r) being Jurin's height.
 * Equals `washburnTime` as h/h_J → 0 and grows without bound as h → h_J.
 * @param args.height m, below Jurin's height
 * @param args.density kg/m³
 * @param args.gravity m/s², standard gravity when absent
 * @returns time in s
 * @throws RangeError when the height is at or above Jurin's height (it is never reached)
 */
export function gravityRestrainedRiseTime(
  args: WashburnArgs & { readonly height: number; readonly density: number; readonly gravity?: number },
): number {
  const h = positive('height', args.height);
  const coeff = drive(args);
  const rho = positive('density', args.density);
  const g = positive('gravity', args.gravity ?? STANDARD_GRAVITY);
  const r = args.poreRadius;
  const jurin = (2 * args.surfaceTension * cosDeg(args.contactAngleDeg)) / (rho * g * r);
  const x = h / jurin;
  if (!(x < 1)) {
    throw new RangeError(
      `rise time: a height of ${h} m is at or above the Jurin limit of ${jurin.toPrecision(4)} m`,
    );
  }
  const shape = gravityShape(x);
  // (8μ/(r²ρg))·h_J² = h_J²/(coeff·x-free form): 8μ h_J²/(r²ρg) = 2·h_J² ... written through coeff:
  // coeff = σ r cos θ/(2μ) and h_J = 2σ cos θ/(ρ g r) give 8μ h_J/(r²ρg) = 2 h_J²/(coeff·2) · 2 = 2h_J²/coeff.
  return finiteResult('rise time', ((2 * jurin * jurin) / coeff) * shape);
}

/**
 * The shape term of the rise time with gravity, −x − ln(1 − x), x = h/h_J in [0, 1).
 * It loses its digits to cancellation for small x; the series is exact enough there.
 */
export function gravityShape(x: number): number {
  return x < 1e-4 ? x * x * (1 / 2 + x * (1 / 3 + x * (1 / 4 + x / 5))) : -x - Math.log1p(-x);
}

/** Bosanquet's solution with its intermediate values, for the working. */
export interface BosanquetResult {
  /** Time to reach the distance, s. */
  readonly time: number;
  /** Capillary drive per unit of liquid inertia, a = 4σ·cos θ / (ρ·r), m²/s². */
  readonly a: number;
  /** Viscous damping rate, b = 8μ / (ρ·r²), 1/s; 1/b is the time inertia takes to die out. */
  readonly b: number;
  /** The dimensionless time b·t. */
  readonly tau: number;
}

/** τ − 1 + e^(−τ), with a series where the subtraction would lose the digits (τ small). */
function bosanquetShape(tau: number): number {
  return tau < 1e-3 ? tau * tau * (1 / 2 - tau * (1 / 6 - tau / 24)) : tau + Math.expm1(-tau);
}

/**
 * Horizontal capillary penetration with inertia, Bosanquet (1923): d/dt(ρ·x·dx/dt) = 2σ·cos θ/r −
 * (8μ/r²)·x·dx/dt. With y = x² it is linear, ÿ + b·ẏ = a, and from rest (y = ẏ = 0) it integrates to
 * x² = (a/b²)·(b·t − 1 + e^(−b·t)), a = 4σ·cos θ/(ρ·r), b = 8μ/(ρ·r²). Long after 1/b it is the
 * Lucas–Washburn law; at first x = √(a/2)·t, the inertial limit. Solved here for t by Newton's method
 * from the right of the root (the left side is convex and increasing in t, so the steps fall
 * monotonically onto it).
 * @param args.length distance in m
 * @param args.density kg/m³
 * @returns time in s, with a, b and b·t
 */
export function bosanquetTime(
  args: WashburnArgs & { readonly length: number; readonly density: number },
): BosanquetResult {
  const L = positive('length', args.length);
  drive(args);
  const rho = positive('density', args.density);
  const r = args.poreRadius;
  const a = (4 * args.surfaceTension * cosDeg(args.contactAngleDeg)) / (rho * r);
  const b = (8 * args.viscosity) / (rho * r * r);
  const k = (L * L * b * b) / a;
  if (!Number.isFinite(k))
    throw new RangeError('Bosanquet time: the inputs are outside floating-point range');
  let tau = k + 1;
  for (let i = 0; i < 200; i++) {
    const next = tau - (bosanquetShape(tau) - k) / -Math.expm1(-tau);
    if (!(next < tau)) break;
    tau = next;
  }
  return { time: finiteResult('Bosanquet time', tau / b), a, b, tau };
}
