import { finiteResult, nonNegative, positive } from '../guards.js';
import { STANDARD_GRAVITY } from '../units.js';

// A Wilhelmy plate read for its contact angle: the measured force with the buoyancy of the plate's
// immersed part (contact-angle-from-force). All SI: N, N/m, kg/m³, m, m/s².

export interface PlateForceArgs {
  /** Measured force on the plate, net of its weight in air (tare), N; positive pulls the plate down. */
  readonly force: number;
  /** N/m */
  readonly surfaceTension: number;
  /** Liquid density, kg/m³ */
  readonly density: number;
  /** m */
  readonly plateWidth: number;
  /** m */
  readonly plateThickness: number;
  /** Depth of the plate's lower edge below the undisturbed liquid surface, m (0 at the zero-depth reading). */
  readonly immersionDepth: number;
  /** m/s²; standard gravity when absent */
  readonly gravity?: number;
}

/** The terms of the plate's force balance, each worth showing on a calculation sheet. */
export interface PlateForceTerms {
  /** Wetted perimeter P = 2(w + t), m. */
  readonly perimeter: number;
  /** Buoyancy of the immersed part, ρ·g·w·t·h, N. */
  readonly buoyancy: number;
  /** cos θ = (F + ρ·g·w·t·h) / (σ·P), unbounded: outside [−1, 1] no angle exists. */
  readonly cosTheta: number;
}

/**
 * Wilhelmy plate read for the contact angle, with buoyancy: the measured force is
 * F = σ·P·cos θ − ρ·g·w·t·h, so cos θ = (F + ρ·g·w·t·h) / (σ·P), P = 2(w + t).
 * The returned cos θ is not clamped: a value outside [−1, 1] means the force is more than the
 * surface tension can give (a surface tension set too low, or a tare error), and no angle exists.
 */
export function plateForceTerms(args: PlateForceArgs): PlateForceTerms {
  const force = finiteResult('force', args.force);
  const sigma = positive('surfaceTension', args.surfaceTension);
  const rho = positive('density', args.density);
  const w = positive('plateWidth', args.plateWidth);
  const t = nonNegative('plateThickness', args.plateThickness);
  const h = nonNegative('immersionDepth', args.immersionDepth);
  const g = positive('gravity', args.gravity ?? STANDARD_GRAVITY);
  const perimeter = 2 * (w + t);
  const buoyancy = rho * g * w * t * h;
  return { perimeter, buoyancy, cosTheta: finiteResult('cos θ', (force + buoyancy) / (sigma * perimeter)) };
}
