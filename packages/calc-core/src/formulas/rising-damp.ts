import { positive } from '../guards.js';

// Rising damp in a wall by the sharp-front model of Hall & Hoff (2007, Proc. R. Soc. A 463,
// 1871–1884). The wall draws water from wet ground at its base; above, water leaves by evaporation
// from its faces. Per unit length of wall, with a sharp wet front at height h:
//   b·θ_w·dh/dt = b·S²/(2·θ_w·h) − n·e·h
// The first term is the sharp-front capillary inflow: a cumulative absorption i = S·√t fills the
// pores to θ_w, so h = i/θ_w and the flux density is di/dt = S²/(2·θ_w·h). The second is evaporation
// at a rate e per unit area from each of the n drying faces over the wet height h. In y = h² the
// balance is linear, dy/dt = S²/θ_w² − y/τ, so (derived here from the balance above):
//   steady height  h_ss = S·√(b / (2·n·e·θ_w)),
//   approach       h(t) = h_ss·√(1 − exp(−t/τ)), τ = b·θ_w / (2·n·e),
// With n = 1 the steady height is the form h_ss = S·(b/(2·e·θ_w))^½ that Hall & Hoff give, in which
// e is the evaporation per unit height of wall from the whole wet area (from memory: the paper itself
// was not seen printed here, so its definition of e is not confirmed). All SI: S in m/s½, e in m/s
// (m³ of water per m² of face per second), lengths in m, θ_w a volume fraction.

export interface RisingDampArgs {
  /** Sorptivity of the masonry, m/s½. */
  readonly sorptivity: number;
  /** Wall thickness b, m. */
  readonly wallThickness: number;
  /** Evaporation rate e per unit area of each drying face, m/s. */
  readonly evaporationRate: number;
  /** Wet volumetric water content θ_w, volume fraction (0–1). */
  readonly wetWaterContent: number;
  /** Number of faces the wall dries from, 1 or 2. */
  readonly dryingFaces: number;
}

export interface RisingDampResult {
  /** Steady-state height of the wet front above the source, m. */
  readonly steadyHeight: number;
  /** Water held in the wet zone per metre of wall, m³/m. */
  readonly waterHeld: number;
  /** Flow through the wall at steady state per metre of wall (inflow = evaporation), m³/(m·s). */
  readonly flow: number;
  /** Time constant τ of the approach to steady state, s. */
  readonly timeConstant: number;
  /** Mean time a volume of water spends in the wall, water held / flow = 2τ, s. */
  readonly residenceTime: number;
}

/** The fraction of the steady height taken as "steady state reached" (our choice: 95 %). */
export const STEADY_FRACTION = 0.95;

/**
 * Steady state of rising damp in a wall, sharp-front model (see the header for the balance).
 * @returns heights in m, volumes per metre in m³/m, flow in m³/(m·s), times in s
 */
export function risingDampSteadyState(args: RisingDampArgs): RisingDampResult {
  const S = positive('sorptivity', args.sorptivity);
  const b = positive('wallThickness', args.wallThickness);
  const e = positive('evaporationRate', args.evaporationRate);
  const theta = positive('wetWaterContent', args.wetWaterContent);
  const n = positive('dryingFaces', args.dryingFaces);
  const steadyHeight = S * Math.sqrt(b / (2 * n * e * theta));
  const waterHeld = theta * b * steadyHeight;
  const flow = n * e * steadyHeight;
  const timeConstant = (b * theta) / (2 * n * e);
  return { steadyHeight, waterHeld, flow, timeConstant, residenceTime: waterHeld / flow };
}

/**
 * Height of the wet front at time t after wetting began from a dry wall: h_ss·√(1 − exp(−t/τ)).
 * @param t s; @param timeConstant τ in s; @param steadyHeight m
 */
export function risingDampHeightAt(t: number, steadyHeight: number, timeConstant: number): number {
  return steadyHeight * Math.sqrt(1 - Math.exp(-t / timeConstant));
}

/**
 * Time for the wet front to reach a fraction f (0–1) of its steady height from a dry wall:
 * t_f = −τ·ln(1 − f²), s.
 */
export function timeToFraction(fraction: number, timeConstant: number): number {
  return -timeConstant * Math.log(1 - fraction * fraction);
}
