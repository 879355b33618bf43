import { CalcInputError } from '../errors.js';
import { finite, positive } from '../guards.js';

// Partial-immersion water absorption: the mass gained per area of the wetted face, Δm/A, plotted
// against the square root of time, is a straight line while the wetting front is inside the
// specimen; its slope is the water absorption coefficient A_w (EN ISO 15148:2002, kg/(m²·√s)) and,
// divided by the density of water, the sorptivity S (ASTM C1585 reports it in mm/√s).

/** Seconds per hour, square-rooted: A_w in kg/(m²·√h) = 60 × A_w in kg/(m²·√s). */
export const ROOT_SECONDS_PER_ROOT_HOUR = 60;

export interface LineFit {
  /** Number of points in the fit. */
  readonly n: number;
  readonly slope: number;
  readonly intercept: number;
  /** Coefficient of determination, 0–1 (1 when every point is on the line). */
  readonly rSquared: number;
  /** Means of x and y, and the sums that a checker needs to redo the fit by hand. */
  readonly meanX: number;
  readonly meanY: number;
  readonly sxx: number;
  readonly sxy: number;
  readonly syy: number;
}

/**
 * Ordinary least squares y = a + b·x, with the sums shown so the fit can be checked by hand:
 * b = Sxy / Sxx, a = ȳ − b·x̄, R² = Sxy² / (Sxx·Syy).
 * @throws CalcInputError when fewer than 2 points or every x is the same
 */
export function fitLine(points: readonly { readonly x: number; readonly y: number }[]): LineFit {
  const n = points.length;
  if (n < 2)
    throw new CalcInputError({
      field: 'readings',
      code: 'TOO_FEW_POINTS',
      message: 'a straight line needs at least two readings',
    });
  let sumX = 0;
  let sumY = 0;
  points.forEach((p, i) => {
    sumX += finite(`readings.${i}.x`, p.x);
    sumY += finite(`readings.${i}.y`, p.y);
  });
  const meanX = sumX / n;
  const meanY = sumY / n;
  let sxx = 0;
  let sxy = 0;
  let syy = 0;
  for (const p of points) {
    const dx = p.x - meanX;
    const dy = p.y - meanY;
    sxx += dx * dx;
    sxy += dx * dy;
    syy += dy * dy;
  }
  if (sxx === 0)
    throw new CalcInputError({
      field: 'readings',
      code: 'NO_SPREAD',
      message: 'the readings must be at different times',
    });
  const slope = sxy / sxx;
  const intercept = meanY - slope * meanX;
  // As two ratios, not Sxy²/(Sxx·Syy): with gains near the smallest doubles (a balance reading 0 and
  // 1e-166 kg) the products underflow to 0/0. Clamped to [0, 1] against rounding; no spread in y is 1.
  const raw = (sxy / sxx) * (sxy / syy);
  const rSquared = syy === 0 || !Number.isFinite(raw) ? 1 : Math.min(1, Math.max(0, raw));
  return { n, slope, intercept, rSquared, meanX, meanY, sxx, sxy, syy };
}

/**
 * The points of a partial-immersion test as the fit takes them: x = √t in √s, y = (m_t − m_0)/A in
 * kg/m², from readings of time (s) and specimen mass (kg), the first at t = 0.
 */
export function absorptionPoints(
  readings: readonly { readonly time: number; readonly mass: number }[],
  faceArea: number,
): { x: number; y: number }[] {
  const area = positive('faceArea', faceArea);
  const first = readings[0];
  if (!first || first.time !== 0) {
    throw new CalcInputError({
      field: 'readings.0.time',
      code: 'NO_ZERO_READING',
      message: 'the first reading must be the dry mass at time 0',
    });
  }
  return readings.map((r, i) => ({
    x: Math.sqrt(finite(`readings.${i}.time`, r.time)),
    y: (finite(`readings.${i}.mass`, r.mass) - first.mass) / area,
  }));
}

/** The test methods whose rules pick the readings that enter the fit. */
export type AbsorptionMethod = 'en-iso-15148' | 'astm-c1585';

/**
 * The times (s) whose readings enter the straight-line fit, inclusive. EN ISO 15148 fits every
 * weighing after the dry one (from memory: 5 min, 20 min, 1 h, 2 h, 4 h, 8 h and 24 h); ASTM C1585
 * fits the initial rate from 1 min to 6 h (from memory), leaving the later, slower uptake out.
 */
export const FIT_WINDOW_S: Readonly<Record<AbsorptionMethod, readonly [from: number, to: number]>> = {
  'en-iso-15148': [Number.MIN_VALUE, Number.POSITIVE_INFINITY],
  'astm-c1585': [60, 6 * 3600],
};

/** Whether a reading at `timeS` seconds enters the fit under `method`. */
export function inFitWindow(method: AbsorptionMethod, timeS: number): boolean {
  const [from, to] = FIT_WINDOW_S[method];
  return timeS >= from && timeS <= to;
}
