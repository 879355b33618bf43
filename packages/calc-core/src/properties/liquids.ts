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
  /** A handling hazard that the result should carry. */
  readonly hazard?: string;
}

/** Shown with every result that involves mercury. */
export const MERCURY_HAZARD =
  'Mercury is toxic: its vapour is harmful at room temperature and spills are hard to clean up. Handle it only under the controls its safety data sheet and local rules require.';

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
  },
  {
    id: 'methanol',
    name: 'Methanol',
    temperatureC: 20,
    surfaceTension: printed(22.45e-3, JASPER),
    density: recalled(791.4, CRC),
    viscosity: recalled(0.59e-3, CRC),
  },
  {
    id: 'acetone',
    name: 'Acetone',
    temperatureC: 20,
    surfaceTension: printed(24.02e-3, JASPER),
    density: recalled(790, CRC),
    viscosity: recalled(0.32e-3, CRC),
  },
  {
    id: 'toluene',
    name: 'Toluene',
    temperatureC: 20,
    surfaceTension: printed(28.52e-3, JASPER),
    density: recalled(866.9, CRC),
    viscosity: recalled(0.59e-3, CRC),
  },
  {
    id: 'ethylene-glycol',
    name: 'Ethylene glycol',
    temperatureC: 20,
    surfaceTension: printed(48.43e-3, JASPER),
    density: recalled(1113.5, CRC),
    viscosity: recalled(19.9e-3, CRC),
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
    hazard: MERCURY_HAZARD,
  },
];

/** A liquid row by id, or undefined. */
export function getLiquid(id: string): Liquid | undefined {
  return liquids.find((l) => l.id === id);
}
