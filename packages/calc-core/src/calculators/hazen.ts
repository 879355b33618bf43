import { HAZEN_C_RANGE_M2 } from '../formulas/soil.js';
import { quantityInput } from './shared.js';
import type { BandBasis, Condition, QuantityInput } from './types.js';

// Hazen's capillary rise as the soil calculators use it: the constant's input with its published
// spread and the band basis, written once (its working step is in shared-working.ts).

export const HAZEN_SOURCE =
  'Terzaghi & Peck (1948): C = 0.1–0.5 cm² (10–50 mm²), as given by Smith, Elements of Soil Mechanics (from memory)';

/** The band over the whole published range of Hazen's constant. */
export const HAZEN_BASIS: BandBasis = {
  input: 'hazenC',
  low: HAZEN_C_RANGE_M2.min,
  high: HAZEN_C_RANGE_M2.max,
  source: HAZEN_SOURCE,
};

/** The `hazenC` input, m², defaulting to the middle of the published range. */
export function hazenCInput(help: string, when?: readonly Condition[]): QuantityInput {
  return quantityInput(
    'area',
    'hazenC',
    "Hazen's constant C",
    3e-5,
    [HAZEN_C_RANGE_M2.min, HAZEN_C_RANGE_M2.max],
    {
      spread: { low: HAZEN_C_RANGE_M2.min, high: HAZEN_C_RANGE_M2.max, source: HAZEN_SOURCE },
      help,
      display: { si: 'cm2', us: 'cm2' },
      ...(when !== undefined ? { appliesWhen: when } : {}),
    },
  );
}
