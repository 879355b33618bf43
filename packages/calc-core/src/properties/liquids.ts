import { type Hazard, TABLE_TEMPERATURE_C, liquidValues } from './liquidValues.js';

export { MERCURY_HAZARD, type Hazard } from './liquidValues.js';

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

// The values themselves are in `liquidValues.ts` (what a calculation needs, in the widget's first
// flight); here is where each comes from, by liquid id, for the working and the references, which
// follow first paint.

type Citation = Omit<SourcedValue, 'value'>;

const JASPER = 'Jasper J. J. (1972) J. Phys. Chem. Ref. Data 1, 841–1009';
const CRC = 'CRC Handbook of Chemistry and Physics, tables of liquid density and viscosity';

function printed(source: string): Citation {
  return { source, basis: 'printed' };
}
function recalled(source: string): Citation {
  return { source, basis: 'from memory' };
}

/**
 * The source of each value, [σ, ρ, μ], by liquid id. Surface tensions are Jasper's printed values
 * except glycerol; densities and viscosities are handbook values marked `from memory` until someone
 * checks them against the printed page.
 */
const SOURCES: Readonly<Record<string, readonly [Citation, Citation, Citation]>> = {
  ethanol: [printed(JASPER), recalled(CRC), recalled(CRC)],
  methanol: [printed(JASPER), recalled(CRC), recalled(CRC)],
  acetone: [printed(JASPER), recalled(CRC), recalled(CRC)],
  toluene: [printed(JASPER), recalled(CRC), recalled(CRC)],
  'ethylene-glycol': [printed(JASPER), recalled(CRC), recalled(CRC)],
  glycerol: [recalled('handbook value for glycerol at 20 °C'), recalled(CRC), recalled(CRC)],
  mercury: [
    printed('Adamson A. W., Gast A. P. (1997) Physical Chemistry of Surfaces, 6th ed., Wiley'),
    recalled(CRC),
    recalled(CRC),
  ],
};

/**
 * Liquids other than water, at 20 °C (water has its own temperature correlations in `water`), each
 * value with its source and basis.
 */
export const liquids: readonly Liquid[] = liquidValues.map((row) => {
  const sources = SOURCES[row.id];
  if (sources === undefined) throw new Error(`liquid ${row.id} has values but no sources`);
  const [sigma, rho, mu] = sources;
  return {
    id: row.id,
    name: row.name,
    temperatureC: TABLE_TEMPERATURE_C,
    surfaceTension: { value: row.surfaceTension, ...sigma },
    density: { value: row.density, ...rho },
    viscosity: { value: row.viscosity, ...mu },
    ...(row.hazard === undefined ? {} : { hazard: row.hazard }),
  };
});

/** A liquid row by id, or undefined. */
export function getLiquid(id: string): Liquid | undefined {
  return liquids.find((l) => l.id === id);
}
