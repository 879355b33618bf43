/**
 * How firmly a tabulated value is sourced: seen in the named publication, a fact of the trade with
 * no single source, or recalled from the named handbook without the page at hand.
 */
export type Basis = 'printed' | 'common practice' | 'from memory';

export interface SourcedValue {
  /** SI: N/m for surface tension, kg/m³ for density, Pa·s for viscosity. */
  readonly value: number;
  readonly source: string;
  readonly basis: Basis;
}

export interface Liquid {
  readonly id: string;
  readonly name: string;
  /** The temperature every value of the row is for, °C. */
  readonly temperatureC: number;
  readonly surfaceTension: SourcedValue;
  readonly density: SourcedValue;
  readonly viscosity: SourcedValue;
  /** The handling hazard every result that uses this liquid carries, first among its cautions. */
  readonly hazard?: Hazard;
}

/** A liquid's hazard as a result shows it: GHS classes and hazard statements, with their source. */
export interface Hazard {
  /** Stable caution code, `HAZARD_<LIQUID>`. */
  readonly code: string;
  readonly text: string;
  readonly source: string;
  readonly basis: Basis;
}

/**
 * Harmonised classifications of Regulation (EC) No 1272/2008 (CLP) Annex VI as the ECHA C&L
 * inventory lists them, or the supplier safety data sheet where there is none; recalled, not read
 * from the inventory here, so every line says `from memory` until someone checks it.
 */
const CLP_SOURCE = 'Regulation (EC) No 1272/2008 (CLP) Annex VI, as listed in the ECHA C&L inventory';
const SDS_SOURCE = 'supplier safety data sheets (self-classification under CLP)';

function hazard(code: string, text: string, source: string): Hazard {
  return { code, text, source, basis: 'from memory' };
}

/** Shown with every result that involves mercury. */
export const MERCURY_HAZARD =
  'Mercury is toxic: its vapour is harmful at room temperature and spills are hard to clean up. GHS: Acute Tox. 2 by inhalation (H330), Repr. 1B (H360D), STOT RE 1 (H372), Aquatic Acute 1 and Chronic 1 (H400, H410). Handle it only under the controls its safety data sheet and local rules require.';

const JASPER = 'Jasper J. J. (1972) J. Phys. Chem. Ref. Data 1, 841–1009';
const CRC = 'CRC Handbook of Chemistry and Physics, tables of liquid density and viscosity';

function printed(value: number, source: string): SourcedValue {
  return { value, source, basis: 'printed' };
}
function recalled(value: number, source: string): SourcedValue {
  return { value, source, basis: 'from memory' };
}

/**
 * Liquids other than water, at 20 °C (water has its own temperature correlations in `water`).
 * Surface tensions are Jasper's printed values except glycerol; densities and viscosities are
 * handbook values marked `from memory` until someone checks them against the printed page.
 */
export const liquids: readonly Liquid[] = [
  {
    id: 'ethanol',
    name: 'Ethanol',
    temperatureC: 20,
    // Jasper's fit for ethanol, 24.05 − 0.0832·t mN/m, gives 22.39 at 20 °C.
    surfaceTension: printed(22.39e-3, JASPER),
    density: recalled(789.3, CRC),
    viscosity: recalled(1.2e-3, CRC),
    hazard: hazard(
      'HAZARD_ETHANOL',
      'Ethanol is highly flammable: keep it away from flames, sparks and hot surfaces. GHS: Flam. Liq. 2 (H225); Eye Irrit. 2 (H319) on most supplier sheets.',
      `${CLP_SOURCE}; ${SDS_SOURCE} for H319`,
    ),
  },
  {
    id: 'methanol',
    name: 'Methanol',
    temperatureC: 20,
    surfaceTension: printed(22.45e-3, JASPER),
    density: recalled(791.4, CRC),
    viscosity: recalled(0.59e-3, CRC),
    hazard: hazard(
      'HAZARD_METHANOL',
      'Methanol is highly flammable and toxic if swallowed, inhaled or absorbed through the skin; it damages the optic nerve. GHS: Flam. Liq. 2 (H225), Acute Tox. 3 oral, dermal and inhalation (H301, H311, H331), STOT SE 1 (H370).',
      CLP_SOURCE,
    ),
  },
  {
    id: 'acetone',
    name: 'Acetone',
    temperatureC: 20,
    surfaceTension: printed(24.02e-3, JASPER),
    density: recalled(790, CRC),
    viscosity: recalled(0.32e-3, CRC),
    hazard: hazard(
      'HAZARD_ACETONE',
      'Acetone is highly flammable and its vapour causes drowsiness. GHS: Flam. Liq. 2 (H225), Eye Irrit. 2 (H319), STOT SE 3 (H336); EUH066 (repeated exposure may cause skin dryness or cracking).',
      CLP_SOURCE,
    ),
  },
  {
    id: 'toluene',
    name: 'Toluene',
    temperatureC: 20,
    surfaceTension: printed(28.52e-3, JASPER),
    density: recalled(866.9, CRC),
    viscosity: recalled(0.59e-3, CRC),
    hazard: hazard(
      'HAZARD_TOLUENE',
      'Toluene is highly flammable, may be fatal if swallowed and enters the airways, and is suspected of damaging the unborn child. GHS: Flam. Liq. 2 (H225), Asp. Tox. 1 (H304), Skin Irrit. 2 (H315), STOT SE 3 (H336), Repr. 2 (H361d), STOT RE 2 (H373).',
      CLP_SOURCE,
    ),
  },
  {
    id: 'ethylene-glycol',
    name: 'Ethylene glycol',
    temperatureC: 20,
    surfaceTension: printed(48.43e-3, JASPER),
    density: recalled(1113.5, CRC),
    viscosity: recalled(19.9e-3, CRC),
    hazard: hazard(
      'HAZARD_ETHYLENE_GLYCOL',
      'Ethylene glycol is harmful if swallowed and damages the kidneys on repeated exposure; it tastes sweet, so keep it from children and animals. GHS: Acute Tox. 4 oral (H302), STOT RE 2 (H373).',
      CLP_SOURCE,
    ),
  },
  {
    id: 'glycerol',
    name: 'Glycerol',
    temperatureC: 20,
    surfaceTension: recalled(63.4e-3, 'handbook value for glycerol at 20 °C'),
    density: recalled(1261, CRC),
    viscosity: recalled(1.41, CRC),
  },
  {
    id: 'mercury',
    name: 'Mercury',
    temperatureC: 20,
    surfaceTension: printed(
      486.5e-3,
      'Adamson A. W., Gast A. P. (1997) Physical Chemistry of Surfaces, 6th ed., Wiley',
    ),
    density: recalled(13546, CRC),
    viscosity: recalled(1.55e-3, CRC),
    hazard: hazard('HAZARD_MERCURY', MERCURY_HAZARD, CLP_SOURCE),
  },
];

/** A liquid row by id, or undefined. */
export function getLiquid(id: string): Liquid | undefined {
  return liquids.find((l) => l.id === id);
}
