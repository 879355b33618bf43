import type { Basis } from './liquids.js';

// What a calculation and its first view need of the liquids other than water: each liquid's name,
// its σ, ρ and μ at TABLE_TEMPERATURE_C and its handling hazard. Kept apart from `liquids.ts`, which
// adds each value's source and basis (read by the working alone): the widget's first flight carries
// this module, not the citations. Every value here is cited, by liquid id, in `liquids.ts`.

/** The temperature every value of the table is for, °C. */
export const TABLE_TEMPERATURE_C = 20;

/** A liquid's hazard as a result shows it: GHS classes and hazard statements, with their source. */
export interface Hazard {
  /** Stable caution code, `HAZARD_<LIQUID>`. */
  readonly code: string;
  readonly text: string;
  readonly source: string;
  readonly basis: Basis;
}

/** One liquid's numbers at TABLE_TEMPERATURE_C (sources in `liquids.ts`, by id). */
export interface LiquidValues {
  readonly id: string;
  readonly name: string;
  /** N/m */
  readonly surfaceTension: number;
  /** kg/m³ */
  readonly density: number;
  /** Pa·s */
  readonly viscosity: number;
  /** The handling hazard every result that uses this liquid carries, first among its cautions. */
  readonly hazard?: Hazard;
}

/**
 * Harmonised classifications of Regulation (EC) No 1272/2008 (CLP) Annex VI as the ECHA C&L
 * inventory lists them, or the supplier safety data sheet where there is none; recalled, not read
 * from the inventory here, so every line says `from memory` until someone checks it.
 */
const CLP_SOURCE = 'Regulation (EC) No 1272/2008 (CLP) Annex VI, as listed in the ECHA C&L inventory';
const SDS_SOURCE = 'supplier safety data sheets (self-classification under CLP)';

function hazard(code: string, text: string, source = CLP_SOURCE): Hazard {
  return { code, text, source, basis: 'from memory' };
}

/** Shown with every result that involves mercury. */
export const MERCURY_HAZARD =
  'Mercury is toxic: its vapour is harmful at room temperature and spills are hard to clean up. GHS: Acute Tox. 2 by inhalation (H330), Repr. 1B (H360D), STOT RE 1 (H372), Aquatic Acute 1 and Chronic 1 (H400, H410). Handle it only under the controls its safety data sheet and local rules require.';

/**
 * Liquids other than water, at 20 °C (water has its own temperature correlations in `water`).
 * Surface tensions: Jasper 1972 as printed, mercury Adamson & Gast 1997 as printed, glycerol a
 * handbook value from memory; densities and viscosities: CRC Handbook values from memory (each
 * value's citation and basis: `liquids.ts`).
 */
export const liquidValues: readonly LiquidValues[] = [
  {
    id: 'ethanol',
    name: 'Ethanol',
    // Jasper's fit for ethanol, 24.05 − 0.0832·t mN/m, gives 22.39 at 20 °C.
    surfaceTension: 22.39e-3,
    density: 789.3,
    viscosity: 1.2e-3,
    hazard: hazard(
      'HAZARD_ETHANOL',
      'Ethanol is highly flammable: keep it away from flames, sparks and hot surfaces. GHS: Flam. Liq. 2 (H225); Eye Irrit. 2 (H319) on most supplier sheets.',
      `${CLP_SOURCE}; ${SDS_SOURCE} for H319`,
    ),
  },
  {
    id: 'methanol',
    name: 'Methanol',
    surfaceTension: 22.45e-3,
    density: 791.4,
    viscosity: 0.59e-3,
    hazard: hazard(
      'HAZARD_METHANOL',
      'Methanol is highly flammable and toxic if swallowed, inhaled or absorbed through the skin; it damages the optic nerve. GHS: Flam. Liq. 2 (H225), Acute Tox. 3 oral, dermal and inhalation (H301, H311, H331), STOT SE 1 (H370).',
    ),
  },
  {
    id: 'acetone',
    name: 'Acetone',
    surfaceTension: 24.02e-3,
    density: 790,
    viscosity: 0.32e-3,
    hazard: hazard(
      'HAZARD_ACETONE',
      'Acetone is highly flammable and its vapour causes drowsiness. GHS: Flam. Liq. 2 (H225), Eye Irrit. 2 (H319), STOT SE 3 (H336); EUH066 (repeated exposure may cause skin dryness or cracking).',
    ),
  },
  {
    id: 'toluene',
    name: 'Toluene',
    surfaceTension: 28.52e-3,
    density: 866.9,
    viscosity: 0.59e-3,
    hazard: hazard(
      'HAZARD_TOLUENE',
      'Toluene is highly flammable, may be fatal if swallowed and enters the airways, and is suspected of damaging the unborn child. GHS: Flam. Liq. 2 (H225), Asp. Tox. 1 (H304), Skin Irrit. 2 (H315), STOT SE 3 (H336), Repr. 2 (H361d), STOT RE 2 (H373).',
    ),
  },
  {
    id: 'ethylene-glycol',
    name: 'Ethylene glycol',
    surfaceTension: 48.43e-3,
    density: 1113.5,
    viscosity: 19.9e-3,
    hazard: hazard(
      'HAZARD_ETHYLENE_GLYCOL',
      'Ethylene glycol is harmful if swallowed and damages the kidneys on repeated exposure; it tastes sweet, so keep it from children and animals. GHS: Acute Tox. 4 oral (H302), STOT RE 2 (H373).',
    ),
  },
  { id: 'glycerol', name: 'Glycerol', surfaceTension: 63.4e-3, density: 1261, viscosity: 1.41 },
  {
    id: 'mercury',
    name: 'Mercury',
    surfaceTension: 486.5e-3,
    density: 13546,
    viscosity: 1.55e-3,
    hazard: hazard('HAZARD_MERCURY', MERCURY_HAZARD),
  },
];

/** A liquid's values by id, or undefined. */
export function getLiquidValues(id: string): LiquidValues | undefined {
  return liquidValues.find((l) => l.id === id);
}
