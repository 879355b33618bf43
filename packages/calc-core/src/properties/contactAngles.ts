import type { Basis } from './liquids.js';

export interface ContactAnglePreset {
  readonly id: string;
  readonly label: string;
  /** `water` or a liquid id of `liquids`. */
  readonly liquid: string;
  readonly surface: string;
  /** Nominal static contact angle, degrees. */
  readonly angleDeg: number;
  /** The range the sources give, degrees; absent when they give a single value. */
  readonly spreadDeg?: { readonly low: number; readonly high: number };
  readonly source: string;
  readonly basis: Basis;
}

/**
 * Contact-angle presets a widget can offer instead of a typed angle. Angles depend strongly on
 * cleanliness and on whether the meniscus is advancing or receding; the spread is what the band of
 * a result is drawn from.
 */
export const contactAnglePresets: readonly ContactAnglePreset[] = [
  {
    id: 'water-clean-glass',
    label: 'Water on clean glass',
    liquid: 'water',
    surface: 'clean glass',
    angleDeg: 0,
    source: 'water wets clean glass at about 0°',
    basis: 'common practice',
  },
  {
    id: 'water-mineral-grains',
    label: 'Water on clean mineral grains (sand, silt)',
    liquid: 'water',
    surface: 'clean quartz-rich mineral grains',
    angleDeg: 0,
    source: 'soil capillarity is worked with full wetting, θ = 0°, unless the soil is water-repellent',
    basis: 'common practice',
  },
  {
    id: 'water-roughened-platinum',
    label: 'Water on a roughened platinum plate',
    liquid: 'water',
    surface: 'roughened platinum (Wilhelmy plate)',
    angleDeg: 0,
    source: 'a clean roughened platinum plate is taken as fully wetted, θ = 0°',
    basis: 'common practice',
  },
  {
    id: 'mercury-glass',
    label: 'Mercury on glass',
    liquid: 'mercury',
    surface: 'glass',
    angleDeg: 140,
    spreadDeg: { low: 130, high: 140 },
    source: 'mercury on glass sits near 130–140°, with 140° the usual default',
    basis: 'common practice',
  },
];

/** A preset by id, or undefined. */
export function getContactAnglePreset(id: string): ContactAnglePreset | undefined {
  return contactAnglePresets.find((p) => p.id === id);
}
