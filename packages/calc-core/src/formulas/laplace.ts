import { contactAngle, cosDeg, finiteResult, positive, positiveOrInfinite } from '../guards.js';

/**
 * Young–Laplace equation, Δp = σ·(1/R₁ + 1/R₂): pressure on the concave side of a surface with
 * principal radii R₁, R₂.
 * @param args.surfaceTension N/m
 * @param args.r1 first principal radius in m
 * @param args.r2 second principal radius in m; r1 when absent (sphere), Infinity for a cylinder
 * @returns pressure difference in Pa
 */
export function laplacePressure(args: {
  readonly surfaceTension: number;
  readonly r1: number;
  readonly r2?: number;
}): number {
  const sigma = positive('surfaceTension', args.surfaceTension);
  const r1 = positive('r1', args.r1);
  const r2 = positiveOrInfinite('r2', args.r2 ?? r1);
  return finiteResult('Laplace pressure', sigma * (1 / r1 + 1 / r2));
}

/**
 * Excess pressure in a bubble of thin film with two surfaces (a soap bubble), Δp = 4σ/R. A gas
 * bubble inside a liquid has one surface: use `laplacePressure` (2σ/R).
 * @param args.surfaceTension N/m
 * @param args.radius bubble radius in m
 * @returns pressure difference in Pa
 */
export function bubblePressure(args: { readonly surfaceTension: number; readonly radius: number }): number {
  const sigma = positive('surfaceTension', args.surfaceTension);
  const r = positive('radius', args.radius);
  return finiteResult('bubble pressure', (4 * sigma) / r);
}

/**
 * Capillary (air-entry) pressure of a cylindrical pore, Pc = 2σ·cos θ / r: the suction the
 * meniscus holds, or for θ > 90° (negative result) the pressure needed to push the liquid in.
 * @param args.surfaceTension N/m
 * @param args.contactAngleDeg degrees, 0–180
 * @param args.poreRadius m
 * @returns pressure in Pa
 */
export function poreEntryPressure(args: {
  readonly surfaceTension: number;
  readonly contactAngleDeg: number;
  readonly poreRadius: number;
}): number {
  const sigma = positive('surfaceTension', args.surfaceTension);
  const cos = cosDeg(contactAngle('contactAngleDeg', args.contactAngleDeg));
  const r = positive('poreRadius', args.poreRadius);
  return finiteResult('pore entry pressure', (2 * sigma * cos) / r);
}
