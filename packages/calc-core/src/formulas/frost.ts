import { CalcInputError } from '../errors.js';
import { finite, nonNegative, positive } from '../guards.js';

// Frost-susceptibility screening by grain size. Casagrande's criterion (1931, as carried into the
// frost-design practice of the US Army Corps of Engineers) [from memory, common practice]:
// under natural freezing with a water supply, expect ice segregation in non-uniform soils
// (Cu > 15) with more than 3 % by mass finer than 0.02 mm, and in very uniform soils (Cu < 5) with
// more than 10 %. Between the two no single threshold is printed; this screening applies the
// lower one (3 %), the conservative reading — our choice, stated on every result.
// A screen only: ASTM D5918 (frost heave and thaw weakening test) measures susceptibility, and
// EN ISO 13793 governs the thermal design of foundations against frost heave.

/** The share finer than 0.02 mm above which a soil is frost-susceptible, by uniformity. */
export const CASAGRANDE_THRESHOLDS = {
  /** Cu below this is "very uniform". */
  uniformBelowCu: 5,
  /** Cu above this is "non-uniform". */
  nonUniformAboveCu: 15,
  /** Share finer than 0.02 mm, very uniform soils. */
  uniformShare: 0.1,
  /** Share finer than 0.02 mm, non-uniform soils (and, conservatively, those between). */
  nonUniformShare: 0.03,
} as const;

export type Gradation = 'very uniform' | 'intermediate' | 'non-uniform';

export interface CasagrandeResult {
  readonly gradation: Gradation;
  /** The threshold share applied, 0–1. */
  readonly threshold: number;
  readonly susceptible: boolean;
}

/**
 * Casagrande's grain-size criterion.
 * @param finesShare mass share finer than 0.02 mm, 0–1
 * @param uniformity coefficient of uniformity Cu = D60/D10, ≥ 1
 */
export function casagrandeCriterion(finesShare: number, uniformity: number): CasagrandeResult {
  const share = nonNegative('finesShare', finesShare);
  if (share > 1) {
    throw new CalcInputError({
      field: 'finesShare',
      code: 'SHARE_ABOVE_ONE',
      message: 'finesShare is a share of the mass, 0 to 1',
    });
  }
  const cu = finite('uniformity', uniformity);
  if (cu < 1) {
    throw new CalcInputError({
      field: 'uniformity',
      code: 'CU_BELOW_ONE',
      message: 'Cu = D60/D10 cannot be below 1',
    });
  }
  const t = CASAGRANDE_THRESHOLDS;
  const gradation: Gradation =
    cu < t.uniformBelowCu ? 'very uniform' : cu > t.nonUniformAboveCu ? 'non-uniform' : 'intermediate';
  const threshold = gradation === 'very uniform' ? t.uniformShare : t.nonUniformShare;
  return { gradation, threshold, susceptible: share > threshold };
}

export type SoilKind = 'gravel' | 'sand' | 'very-fine-silty-sand' | 'silt' | 'clay' | 'varved-clay';

/** Frost-design soil groups F1 (least) to F4 (most susceptible); 'NFS' where the criterion is not met. */
export type FrostGroup = 'NFS' | 'F1' | 'F2' | 'F3' | 'F4';

/**
 * The frost-design soil group of the US Army Corps of Engineers' pavement practice [from memory]:
 * F1 gravelly soils with 3–10 % finer than 0.02 mm; F2 gravelly soils with 10–20 %, sands with
 * 3–15 %; F3 gravelly soils over 20 %, sands (not very fine silty sands) over 15 %, clays with
 * PI > 12; F4 all silts, very fine silty sands over 15 %, clays with PI < 12, varved clays.
 * @param kind the soil's kind
 * @param finesShare mass share finer than 0.02 mm, 0–1
 * @param plasticityIndex PI in percentage points, for clays
 */
export function frostGroup(kind: SoilKind, finesShare: number, plasticityIndex?: number): FrostGroup {
  const p = nonNegative('finesShare', finesShare) * 100;
  switch (kind) {
    case 'gravel':
      return p <= 3 ? 'NFS' : p <= 10 ? 'F1' : p <= 20 ? 'F2' : 'F3';
    case 'sand':
      return p <= 3 ? 'NFS' : p <= 15 ? 'F2' : 'F3';
    case 'very-fine-silty-sand':
      return p <= 3 ? 'NFS' : p <= 15 ? 'F2' : 'F4';
    case 'silt':
    case 'varved-clay':
      return 'F4';
    case 'clay': {
      if (plasticityIndex === undefined) {
        throw new CalcInputError({
          field: 'plasticityIndex',
          code: 'REQUIRED',
          message: 'a clay needs its plasticity index',
        });
      }
      return nonNegative('plasticityIndex', plasticityIndex) > 12 ? 'F3' : 'F4';
    }
  }
}

/**
 * Whether the capillary fringe above a water table reaches the frost line: the top of the fringe
 * is the water-table depth less the capillary rise; it reaches when that is at or above the frost
 * depth. Depths below the finished surface, m.
 * @returns the gap in m between the frost line and the top of the fringe (≤ 0: it reaches)
 */
export function fringeGapBelowFrostLine(args: {
  readonly waterTableDepth: number;
  readonly frostDepth: number;
  readonly capillaryRise: number;
}): number {
  const wt = positive('waterTableDepth', args.waterTableDepth);
  const fd = positive('frostDepth', args.frostDepth);
  const hc = nonNegative('capillaryRise', args.capillaryRise);
  return wt - hc - fd;
}
