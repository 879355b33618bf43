import { finite, nonNegative, positive } from '../guards.js';

/**
 * The published range of Hazen's constant C in m² (0.1–0.5 cm²): Terzaghi & Peck (1948) as given in
 * Smith's Elements of Soil Mechanics ("10 to 50 mm²") and in Holtz & Kovacs.
 */
export const HAZEN_C_RANGE_M2 = { min: 1e-5, max: 5e-5 } as const;

/**
 * Hazen's formula for the height of capillary rise in a soil, h_c = C / (e·D10), written by
 * Terzaghi & Peck in cm (C in cm², D10 in cm); dimensionally the same in SI.
 * @param args.d10 effective grain size D10 in m
 * @param args.voidRatio void ratio e (dimensionless, > 0)
 * @param args.c Hazen's constant in m², 1e-5 to 5e-5 (0.1–0.5 cm²)
 * @returns height of capillary rise above the water table in m
 * @throws RangeError when c is outside the published 0.1–0.5 cm²
 */
export function hazenCapillaryRise(args: {
  readonly d10: number;
  readonly voidRatio: number;
  readonly c: number;
}): number {
  const d10 = positive('d10', args.d10);
  const e = positive('voidRatio', args.voidRatio);
  const c = finite('c', args.c);
  // A relative slack of 1e-9 keeps 0.1 cm² typed as 0.1 * 1e-4 (1.0000000000000002e-5) inside.
  if (c < HAZEN_C_RANGE_M2.min * (1 - 1e-9) || c > HAZEN_C_RANGE_M2.max * (1 + 1e-9)) {
    throw new RangeError(
      `Hazen's formula: C = ${c} m² is outside the published range of 1e-5–5e-5 m² (0.1–0.5 cm²)`,
    );
  }
  return c / (e * d10);
}

export interface CapillaryBreakResult {
  /** Height above the water table of the top of the capillary zone, m. */
  readonly wetZoneTop: number;
  /** Distance from the top of the capillary zone up to the underside of the slab, m; ≤ 0 means it reaches. */
  readonly clearance: number;
  readonly reachesSlab: boolean;
  /** Whether the rise in the soil reaches the bottom of the granular layer (the layer is then what stops it). */
  readonly soilReachesLayer: boolean;
}

/**
 * Capillary-break check for a granular layer directly under a slab, through the layered profile.
 * At equilibrium the suction at a height z above the water table is ρ·g·z, and a material holds
 * water only up to its own capillary height above the water table. Water climbs from the water
 * table through the soil, up to min(h_soil, base of the layer); only if it reaches the base of the
 * layer can the layer take it further, up to the layer's own h_layer. A layer whose own rise would
 * end below its base stays dry and adds nothing, and a soil fringe that stops below the layer never
 * wets the layer at all.
 * @param args.waterTableDepth depth of the water table below the underside of the slab, m (≥ 0)
 * @param args.soilRise capillary height of the soil under the layer, m
 * @param args.layer the granular layer, thickness and capillary height in m; absent for a slab on soil
 * @returns the top of the wet zone, the clearance below the slab (m) and the verdicts
 */
export function capillaryBreakCheck(args: {
  readonly waterTableDepth: number;
  readonly soilRise: number;
  readonly layer?: { readonly thickness: number; readonly rise: number };
}): CapillaryBreakResult {
  const depth = nonNegative('waterTableDepth', args.waterTableDepth);
  const soilRise = nonNegative('soilRise', args.soilRise);
  if (args.layer === undefined) {
    return {
      wetZoneTop: soilRise,
      clearance: depth - soilRise,
      reachesSlab: depth - soilRise <= 0,
      soilReachesLayer: false,
    };
  }
  const thickness = positive('layer.thickness', args.layer.thickness);
  const layerRise = nonNegative('layer.rise', args.layer.rise);
  const layerBase = Math.max(depth - thickness, 0);
  const soilReachesLayer = soilRise >= layerBase;
  // The layer's own rise is left uncapped so that a negative clearance says by how much it overshoots.
  const wetZoneTop = soilReachesLayer ? Math.max(layerBase, layerRise) : soilRise;
  const clearance = depth - wetZoneTop;
  return { wetZoneTop, clearance, reachesSlab: clearance <= 0, soilReachesLayer };
}
