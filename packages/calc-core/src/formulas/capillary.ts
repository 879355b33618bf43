import { CalcInputError } from '../errors.js';
import { contactAngle, cosDeg, positive } from '../guards.js';

// The meniscus-weight corrections of a tube and a slot rise. The rise laws and the capillary length
// are in jurin.ts, apart, so that a calculator that needs only those (interface-pressure,
// wicking-time) does not carry the corrections; they are re-exported here as before.
export { capillaryLength, jurinRise, slotRise, type RiseArgs } from './jurin.js';

function wettingAngle(angleDeg: number): number {
  contactAngle('contactAngleDeg', angleDeg);
  if (angleDeg > 90) {
    throw new CalcInputError({
      field: 'contactAngleDeg',
      code: 'MENISCUS_NOT_CONCAVE',
      message: 'the meniscus-weight correction is for a wetting (concave) meniscus, θ ≤ 90°',
    });
  }
  return angleDeg;
}

/**
 * Meniscus-weight correction for a tube: the height of the liquid held in the meniscus above its
 * lowest point, spread over the bore, so that Jurin's rise minus it is the rise to the bottom of
 * the meniscus. For θ = 0 (a hemisphere) it is Rayleigh's r/3 (Rayleigh 1915, Proc. R. Soc. A 92,
 * 184: σ = ρ·g·r·(h + r/3) / (2 cos θ)); for 0 < θ ≤ 90° the same spherical-cap geometry with radius
 * r/cos θ, derived here. Only the first term of Rayleigh's series: good while r ≪ ℓc.
 * @param args.diameter bore diameter in m
 * @param args.contactAngleDeg degrees, 0–90
 * @returns correction in m (≥ 0)
 */
export function meniscusCorrection(args: {
  readonly diameter: number;
  readonly contactAngleDeg: number;
}): number {
  return meniscusGeometry(args).correction;
}

/** The pieces of a meniscus correction, for the working: all lengths in m, volume in m³ (area in m² for a slot). */
export interface MeniscusGeometry {
  /** Radius of the meniscus surface, m (r/cos θ or (w/2)/cos θ). */
  readonly radius: number;
  /** Sag: height of the meniscus from its lowest point to where it meets the wall, m. */
  readonly sag: number;
  /** Liquid above the lowest point of the meniscus: a volume (tube, m³) or an area per unit length (slot, m²). */
  readonly held: number;
  /** The correction δ = sag − held / (π·r²) or sag − held / w, m. */
  readonly correction: number;
}

/** The tube's meniscus correction with its intermediate values (see `meniscusCorrection`). */
export function meniscusGeometry(args: {
  readonly diameter: number;
  readonly contactAngleDeg: number;
}): MeniscusGeometry {
  const r = positive('diameter', args.diameter) / 2;
  const angle = wettingAngle(args.contactAngleDeg);
  if (angle === 90) return { radius: Infinity, sag: 0, held: 0, correction: 0 };
  const R = r / cosDeg(angle);
  const sag = R * (1 - Math.sin((angle * Math.PI) / 180));
  const capVolume = (Math.PI * sag * sag * (3 * R - sag)) / 3;
  // Liquid above the lowest point = cylinder of height sag minus the spherical cap.
  const held = Math.PI * r * r * sag - capVolume;
  return { radius: R, sag, held, correction: sag - capVolume / (Math.PI * r * r) };
}

/**
 * The slot form of the meniscus-weight correction: a cylindrical meniscus of radius (w/2)/cos θ,
 * liquid above its lowest point spread over the gap; (1/2 − π/8)·w at θ = 0. The two-dimensional
 * analogue of Rayleigh's r/3, derived here from the same geometry.
 * @param args.gap distance between the walls in m
 * @param args.contactAngleDeg degrees, 0–90
 * @returns correction in m (≥ 0)
 */
export function slotMeniscusCorrection(args: {
  readonly gap: number;
  readonly contactAngleDeg: number;
}): number {
  return slotMeniscusGeometry(args).correction;
}

/** The slot's meniscus correction with its intermediate values (see `slotMeniscusCorrection`). */
export function slotMeniscusGeometry(args: {
  readonly gap: number;
  readonly contactAngleDeg: number;
}): MeniscusGeometry {
  const w = positive('gap', args.gap);
  const angle = wettingAngle(args.contactAngleDeg);
  if (angle === 90) return { radius: Infinity, sag: 0, held: 0, correction: 0 };
  const R = w / 2 / cosDeg(angle);
  const sag = R * (1 - Math.sin((angle * Math.PI) / 180));
  const half = Math.PI / 2 - (angle * Math.PI) / 180;
  const segment = R * R * (half - Math.sin(half) * Math.cos(half));
  return { radius: R, sag, held: w * sag - segment, correction: sag - segment / w };
}
