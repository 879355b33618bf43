import { contactAngleValues } from './contactAngleValues.js';
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

// The angles themselves are in `contactAngleValues.ts` (what a calculation needs, in the widget's
// first flight); here are the surface and the source of each, by preset id, for the working.

/** The surface and the source of each preset without a spread (one with a spread carries its own). */
const CITED: Readonly<Record<string, { surface: string; source?: string; basis?: Basis }>> = {
  'water-clean-glass': {
    surface: 'clean glass',
    source: 'water wets clean glass at about 0°',
    basis: 'common practice',
  },
  'water-mineral-grains': {
    surface: 'clean quartz-rich mineral grains',
    source: 'soil capillarity is worked with full wetting, θ = 0°, unless the soil is water-repellent',
    basis: 'common practice',
  },
  'water-roughened-platinum': {
    surface: 'roughened platinum (Wilhelmy plate)',
    source: 'a clean roughened platinum plate is taken as fully wetted, θ = 0°',
    basis: 'common practice',
  },
  'mercury-glass': { surface: 'glass' },
};

/**
 * Contact-angle presets a widget can offer instead of a typed angle. Angles depend strongly on
 * cleanliness and on whether the meniscus is advancing or receding; the spread is what the band of
 * a result is drawn from.
 */
export const contactAnglePresets: readonly ContactAnglePreset[] = contactAngleValues.map((p) => {
  const cited = CITED[p.id];
  const source = p.spread?.source ?? cited?.source;
  const basis = p.spread?.basis ?? cited?.basis;
  if (cited === undefined || source === undefined || basis === undefined)
    throw new Error(`contact-angle preset ${p.id} has no surface or source`);
  return {
    id: p.id,
    label: p.label,
    liquid: p.liquid,
    surface: cited.surface,
    angleDeg: p.angleDeg,
    ...(p.spread === undefined ? {} : { spreadDeg: { low: p.spread.low, high: p.spread.high } }),
    source,
    basis,
  };
});

/** A preset by id, or undefined. */
export function getContactAnglePreset(id: string): ContactAnglePreset | undefined {
  return contactAnglePresets.find((p) => p.id === id);
}
