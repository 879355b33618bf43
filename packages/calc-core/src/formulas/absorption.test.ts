import fc from 'fast-check';
import { lusolve } from 'mathjs';
import { describe, expect, it } from 'vitest';
import { absorptionPoints, fitLine, ROOT_SECONDS_PER_ROOT_HOUR } from './absorption.js';

describe('least-squares line through the absorption points', () => {
  it('agrees with the normal equations solved by mathjs (independent route) on random data (fast-check)', () => {
    fc.assert(
      fc.property(
        fc.array(
          fc.record({
            x: fc.double({ min: 0, max: 300, noNaN: true }),
            y: fc.double({ min: -5, max: 50, noNaN: true }),
          }),
          { minLength: 3, maxLength: 20 },
        ),
        (pts) => {
          const xs = pts.map((p) => p.x);
          fc.pre(Math.max(...xs) - Math.min(...xs) > 1);
          const n = pts.length;
          const sx = xs.reduce((a, b) => a + b, 0);
          const sxx = xs.reduce((a, b) => a + b * b, 0);
          const sy = pts.reduce((a, p) => a + p.y, 0);
          const sxy = pts.reduce((a, p) => a + p.x * p.y, 0);
          const sol = lusolve(
            [
              [n, sx],
              [sx, sxx],
            ],
            [sy, sxy],
          ) as number[][];
          const fit = fitLine(pts);
          expect(fit.intercept).toBeCloseTo(sol[0]![0]!, 6);
          expect(fit.slope).toBeCloseTo(sol[1]![0]!, 6);
          expect(fit.rSquared).toBeGreaterThanOrEqual(0);
          expect(fit.rSquared).toBeLessThanOrEqual(1 + 1e-12);
        },
      ),
    );
  });

  it('is exact on points on a line (R² = 1)', () => {
    const fit = fitLine([0, 1, 2, 3, 4].map((x) => ({ x, y: 0.5 + 2 * x })));
    expect(fit.slope).toBeCloseTo(2, 12);
    expect(fit.intercept).toBeCloseTo(0.5, 12);
    expect(fit.rSquared).toBeCloseTo(1, 12);
  });

  it('gives a finite R² in [0, 1] when the gains are near the smallest doubles (no 0/0 from underflow)', () => {
    // The shape fast-check found (validity sweep): √t of readings 1 ms apart and a gain of 3e-162 kg/m²,
    // so Sxx·Syy underflows to 0 while Sxy² is 0 too.
    const x = [0, 834.27223, 834.27323, 834.27423, 834.27523].map(Math.sqrt);
    const y = [0, 0, 3e-162, 0, 0];
    const fit = fitLine(x.slice(1).map((xi, k) => ({ x: xi, y: y[k + 1] as number })));
    expect(Number.isFinite(fit.rSquared)).toBe(true);
    expect(fit.rSquared).toBeGreaterThanOrEqual(0);
    expect(fit.rSquared).toBeLessThanOrEqual(1);
  });

  it('refuses fewer than two points and points all at one time', () => {
    expect(() => fitLine([{ x: 1, y: 1 }])).toThrowError(/two readings/);
    expect(() =>
      fitLine([
        { x: 1, y: 1 },
        { x: 1, y: 2 },
      ]),
    ).toThrowError(/different times/);
  });
});

describe('absorption points from readings', () => {
  it('takes √t and the mass gained per area of the face', () => {
    const pts = absorptionPoints(
      [
        { time: 0, mass: 0.5 },
        { time: 3600, mass: 0.502 },
      ],
      0.01,
    );
    expect(pts[1]).toEqual({ x: 60, y: expect.closeTo(0.2, 12) as unknown as number });
  });
  it('needs the first reading at time 0, named by row', () => {
    expect(() => absorptionPoints([{ time: 60, mass: 0.5 }], 0.01)).toThrowError(
      expect.objectContaining({ field: 'readings.0.time' }),
    );
  });
  it('converts √s to √h by 60 (√3600 s, exact arithmetic)', () => {
    expect(ROOT_SECONDS_PER_ROOT_HOUR).toBe(Math.sqrt(3600));
  });
});
