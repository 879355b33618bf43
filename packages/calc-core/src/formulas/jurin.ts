import { contactAngle, cosDeg, finiteResult, positive } from '../guards.js';
import { STANDARD_GRAVITY } from '../units.js';

// Capillary rise between a liquid and air. Air density is neglected against the liquid's (0.12 %
// for water), as in every source cited here. All SI: N/m, kg/m³, m, m/s².

export interface RiseArgs {
  /** N/m */
  readonly surfaceTension: number;
  /** degrees, 0–180 */
  readonly contactAngleDeg: number;
  /** kg/m³ */
  readonly density: number;
  /** m/s²; standard gravity when absent */
  readonly gravity?: number;
}

function common(args: RiseArgs): { sigma: number; cos: number; rho: number; g: number } {
  return {
    sigma: positive('surfaceTension', args.surfaceTension),
    cos: cosDeg(contactAngle('contactAngleDeg', args.contactAngleDeg)),
    rho: positive('density', args.density),
    g: positive('gravity', args.gravity ?? STANDARD_GRAVITY),
  };
}

/**
 * Jurin's law, h = 4σ·cos θ / (ρ·g·d): equilibrium height of the bottom of the meniscus above the
 * free surface, for a bore that is small against the capillary length.
 * @param args.diameter bore diameter in m
 * @returns rise in m; negative for a depression (θ > 90°)
 */
export function jurinRise(args: RiseArgs & { readonly diameter: number }): number {
  const { sigma, cos, rho, g } = common(args);
  const d = positive('diameter', args.diameter);
  return finiteResult('capillary rise', (4 * sigma * cos) / (rho * g * d));
}

/**
 * Rise between two parallel walls a gap w apart, h = 2σ·cos θ / (ρ·g·w): the force balance of
 * Jurin's law per unit length of a slot, half the rise of a tube whose diameter equals the gap.
 * @param args.gap distance between the walls in m
 * @returns rise in m; negative for a depression
 */
export function slotRise(args: RiseArgs & { readonly gap: number }): number {
  const { sigma, cos, rho, g } = common(args);
  const w = positive('gap', args.gap);
  return finiteResult('capillary rise', (2 * sigma * cos) / (rho * g * w));
}

/**
 * Capillary length ℓc = √(σ / (ρ·g)): a bore is "small" when its radius is well below it.
 * @param args.surfaceTension N/m
 * @param args.density kg/m³
 * @param args.gravity m/s², standard gravity when absent
 * @returns capillary length in m
 */
export function capillaryLength(args: {
  readonly surfaceTension: number;
  readonly density: number;
  readonly gravity?: number;
}): number {
  const sigma = positive('surfaceTension', args.surfaceTension);
  const rho = positive('density', args.density);
  const g = positive('gravity', args.gravity ?? STANDARD_GRAVITY);
  return finiteResult('capillary length', Math.sqrt(sigma / (rho * g)));
}
