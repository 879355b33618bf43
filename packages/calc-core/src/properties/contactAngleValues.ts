import type { Basis } from './liquids.js';

// What a calculation and its first view need of the contact-angle presets: label, liquid, angle and
// spread. Kept apart from `contactAngles.ts`, which adds the surface and where each angle comes from
// (read by the working alone), so the widget's first flight carries no such text; a preset with a
// spread carries the source of that spread here, since a result's band names it.

export interface ContactAngleValues {
  readonly id: string;
  readonly label: string;
  /** `water` or a liquid id of `liquids`. */
  readonly liquid: string;
  /** Nominal static contact angle, degrees. */
  readonly angleDeg: number;
  /** The range the sources give, degrees, with the source; absent when they give a single value. */
  readonly spread?: {
    readonly low: number;
    readonly high: number;
    readonly source: string;
    readonly basis: Basis;
  };
}

/**
 * Contact-angle presets a widget can offer instead of a typed angle. Angles depend strongly on
 * cleanliness and on whether the meniscus is advancing or receding; the spread is what the band of
 * a result is drawn from. Each angle's source: `contactAngles.ts`, by preset id.
 */
export const contactAngleValues: readonly ContactAngleValues[] = [
  { id: 'water-clean-glass', label: 'Water on clean glass', liquid: 'water', angleDeg: 0 },
  {
    id: 'water-mineral-grains',
    label: 'Water on clean mineral grains (sand, silt)',
    liquid: 'water',
    angleDeg: 0,
  },
  {
    id: 'water-roughened-platinum',
    label: 'Water on a roughened platinum plate',
    liquid: 'water',
    angleDeg: 0,
  },
  {
    id: 'mercury-glass',
    label: 'Mercury on glass',
    liquid: 'mercury',
    angleDeg: 140,
    spread: {
      low: 130,
      high: 140,
      source: 'mercury on glass sits near 130–140°, with 140° the usual default',
      basis: 'common practice',
    },
  },
];

/** A preset's values by id, or undefined. */
export function getContactAngleValues(id: string): ContactAngleValues | undefined {
  return contactAngleValues.find((p) => p.id === id);
}
