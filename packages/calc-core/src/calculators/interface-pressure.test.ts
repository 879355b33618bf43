import { describe, expect, it } from 'vitest';
import { waterDensity, waterSurfaceTension } from '../properties/water.js';
import { run } from './interface-pressure.js';

const sigma = waterSurfaceTension(20);

describe('interface-pressure calculator', () => {
  it.each([
    [
      'drop',
      { radius: 1e-3 },
      (2 * sigma) / 1e-3,
      'Young–Laplace, Δp = 2σ/R for a sphere (Adamson & Gast 1997, ch. II)',
    ],
    [
      'film-bubble',
      { radius: 1e-3 },
      (4 * sigma) / 1e-3,
      'Young–Laplace, two surfaces of a soap film, 4σ/R (Adamson & Gast 1997, ch. II)',
    ],
    ['jet', { radius: 1e-3 }, sigma / 1e-3, 'Young–Laplace, cylinder R₂ = ∞ (Adamson & Gast 1997, ch. II)'],
    [
      'general',
      { r1: 1e-3, r2: 3e-3 },
      sigma * (1 / 1e-3 + 1 / 3e-3),
      'Young–Laplace, σ(1/R1 + 1/R2) (Adamson & Gast 1997, ch. II)',
    ],
    [
      'pore',
      { poreRadius: 1e-6 },
      (2 * sigma) / 1e-6,
      'capillary pressure of a cylindrical pore, 2σ cos θ/r (Young–Laplace, Adamson & Gast 1997)',
    ],
  ] as [string, Record<string, number>, number, string][])('%s (%s)', (shape, extra, expected) => {
    expect(run({ shape, ...extra }).outputs.pressure).toBeCloseTo(expected, 9);
  });

  it('expresses a pore’s air-entry pressure as the equivalent capillary rise: OpenStax 11.79, r = 0.5 mm → 2.97 cm (printed)', () => {
    const r = run({
      shape: 'pore',
      liquid: 'custom',
      surfaceTension: 0.0728,
      density: 1000,
      gravity: 9.8,
      poreRadius: 0.5e-3,
    });
    expect(Math.abs((r.outputs.pressureHead ?? 0) - 0.0297)).toBeLessThanOrEqual(0.00005);
  });

  it('warns for a drop too large to stay spherical and for a non-wetting pore', () => {
    const lc = Math.sqrt(sigma / (waterDensity(20).value * 9.80665));
    expect(run({ shape: 'drop', radius: lc * 1.01 }).warnings.map((w) => w.code)).toEqual([
      'SHAPE_NOT_SPHERICAL',
    ]);
    expect(run({ shape: 'drop', radius: lc * 0.99 }).warnings).toEqual([]);
    const hg = run({ shape: 'pore', liquid: 'mercury', contactAnglePreset: 'mercury-glass' });
    expect(hg.outputs.pressure ?? 0).toBeLessThan(0);
    expect(hg.warnings.map((w) => w.code)).toContain('PORE_NON_WETTING');
    expect(hg.band?.outputs.pressure?.low ?? 0).toBeLessThan(hg.band?.outputs.pressure?.high ?? 0);
  });

  it('ignores the pore inputs for a drop', () => {
    expect(run({ shape: 'drop', poreRadius: 5e-6 }).inputHash).toBe(run({ shape: 'drop' }).inputHash);
  });
});
