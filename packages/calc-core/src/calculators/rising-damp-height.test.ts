import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { calculate } from '../registry.js';
import { convert } from '../units.js';

// Reference checks for the sharp-front rising-damp model. Hall & Hoff (2007) was not seen printed
// here, so no worked example of theirs is used: the independent route is the water balance itself,
// b·θ_w·dh/dt = b·S²/(2·θ_w·h) − n·e·h, integrated numerically (classical Runge–Kutta) from a dry
// wall, against the closed forms the calculator uses.

const DAY = 86400;
const S_BRICK = 1e-3 / Math.sqrt(60); // 1 mm/min½ in m/s½

/** Integrates the balance from h = 1e-6 m; returns the height at `until` and when it first passed 95 % of `target`. */
function integrate(
  p: { S: number; b: number; e: number; theta: number; n: number },
  until: number,
  target: number,
): { h: number; t95: number } {
  const rate = (h: number): number =>
    (p.b * p.S ** 2) / (2 * p.theta * h) / (p.b * p.theta) - (p.n * p.e * h) / (p.b * p.theta);
  // Start on the early-time sharp-front solution h = (S/θ)·√t, where evaporation is still negligible.
  let t = 1;
  let h = (p.S / p.theta) * Math.sqrt(t);
  let t95 = NaN;
  const dt = until / 200000;
  while (t < until) {
    const k1 = rate(h);
    const k2 = rate(h + (dt / 2) * k1);
    const k3 = rate(h + (dt / 2) * k2);
    const k4 = rate(h + dt * k3);
    const next = h + (dt / 6) * (k1 + 2 * k2 + 2 * k3 + k4);
    if (Number.isNaN(t95) && next >= 0.95 * target) t95 = t + (dt * (0.95 * target - h)) / (next - h);
    h = next;
    t += dt;
  }
  return { h, t95 };
}

describe('rising-damp-height: reference rows', () => {
  // [case, inputs, expected steady height (m), tolerance (m), source]
  const rows: [string, Record<string, number | string>, number, number, string][] = [
    [
      'S = 1 mm/min½, b = 350 mm, e = 1 mm/day from each of two faces, θ_w = 0.2',
      { sorptivity: S_BRICK, wallThickness: 0.35, evaporationRate: 1e-3 / DAY, wetWaterContent: 0.2 },
      0.7937254,
      1e-7,
      'hand arithmetic: 1e-3/sqrt(60) * sqrt(0.35 / (4 * 1e-3/86400 * 0.2)) = 0.7937254 m (python3)',
    ],
    [
      'the same wall drying from one face',
      {
        sorptivity: S_BRICK,
        wallThickness: 0.35,
        evaporationRate: 1e-3 / DAY,
        wetWaterContent: 0.2,
        dryingFaces: 'one',
      },
      1.1224972,
      1e-7,
      'h_ss = S·(b/(2eθ_w))^½, the form of Hall & Hoff 2007 (from memory): 1e-3/sqrt(60) * sqrt(0.35 / (2 * 1e-3/86400 * 0.2)) (python3)',
    ],
  ];
  it.each(rows)('%s → %s m (%s)', (_case, inputs, expected, tol) => {
    const r = calculate('rising-damp-height', inputs);
    expect(Math.abs((r.outputs.steadyHeight ?? NaN) - expected)).toBeLessThanOrEqual(tol);
  });

  it('agrees with the water balance integrated numerically: height, water held, flow and the time to 95 %', () => {
    const inputs = {
      sorptivity: S_BRICK,
      wallThickness: 0.35,
      evaporationRate: 1e-3 / DAY,
      wetWaterContent: 0.2,
    };
    const r = calculate('rising-damp-height', inputs);
    const hss = r.outputs.steadyHeight ?? NaN;
    const { h, t95 } = integrate({ S: S_BRICK, b: 0.35, e: 1e-3 / DAY, theta: 0.2, n: 2 }, 400 * DAY, hss);
    expect(h / hss).toBeCloseTo(1, 8);
    expect(Math.abs(t95 / (r.outputs.timeToSteady ?? NaN) - 1)).toBeLessThan(1e-3);
    // At steady state the inflow b·S²/(2θ_w·h) equals the flow out, and the wall holds θ_w·b·h.
    expect(r.outputs.dailyFlow).toBeCloseTo((0.35 * S_BRICK ** 2) / (2 * 0.2 * h), 15);
    expect(r.outputs.waterHeld).toBeCloseTo(0.2 * 0.35 * h, 9);
    expect(r.outputs.residenceTime).toBeCloseTo(2 * (r.outputs.timeConstant ?? NaN), 6);
  });

  it('shows the water held in L/m and the flow in L/(m·day) (unit factors exact)', () => {
    const r = calculate('rising-damp-height', {});
    expect(convert(r.outputs.waterHeld ?? NaN, 'm3/m', 'L/m')).toBeCloseTo(0.2 * 0.35 * 0.7937254 * 1000, 4);
    // Q = 2 × 1 mm/day × h_ss = 2 × 0.7937254 L/(m·day)
    expect(convert(r.outputs.dailyFlow ?? NaN, 'm3/(m*s)', 'L/(m*day)')).toBeCloseTo(2 * 0.7937254, 6);
  });

  it('scales as the model says for any inputs: h ∝ S, ∝ √b, ∝ 1/√e, ∝ 1/√θ_w (fast-check)', () => {
    fc.assert(
      fc.property(fc.double({ min: 0.25, max: 4, noNaN: true }), (k) => {
        const base = calculate('rising-damp-height', {}).outputs.steadyHeight ?? NaN;
        const at = (inputs: Record<string, number>): number =>
          calculate('rising-damp-height', inputs).outputs.steadyHeight ?? NaN;
        expect(at({ sorptivity: S_BRICK * k }) / base).toBeCloseTo(k, 10);
        expect(at({ wallThickness: 0.35 * k }) / base).toBeCloseTo(Math.sqrt(k), 10);
        expect(at({ evaporationRate: (1e-3 / DAY) * k }) / base).toBeCloseTo(1 / Math.sqrt(k), 10);
        expect(at({ wetWaterContent: 0.2 * Math.min(k, 2.5) }) / base).toBeCloseTo(
          1 / Math.sqrt(Math.min(k, 2.5)),
          10,
        );
      }),
      { numRuns: 50 },
    );
  });
});
