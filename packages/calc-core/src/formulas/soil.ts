import { finite, positive } from '../guards.js';

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

// The capillary-break check is in capillary-break.ts, apart, so that frost-screening (Hazen's rise
// alone) does not carry it; re-exported here as before.
export { capillaryBreakCheck, type CapillaryBreakResult } from './capillary-break.js';
