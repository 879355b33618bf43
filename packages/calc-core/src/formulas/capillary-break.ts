import { nonNegative, positive } from '../guards.js';

// Whether capillary water from the water table reaches the underside of a slab, through a granular
// layer or none (soil-capillary-rise). All m.

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
