import { describe, expect, it } from 'vitest';
import { duNouySurfaceTension } from '../formulas/tensiometry.js';
import { waterSurfaceTension } from '../properties/water.js';
import { calculate } from '../registry.js';
import { run } from './wetting-force.js';

describe('wetting-force calculator', () => {
  it('reads σ = F/(2(w + t)) from a fully wetted plate and the inverse gives the force back', () => {
    const r = run({ method: 'plate-tension', force: 2.9e-3, plateWidth: 0.02, plateThickness: 0.1e-3 });
    expect(r.outputs.surfaceTension).toBeCloseTo(2.9e-3 / 0.0402, 15);
    expect(r.outputs.force).toBeNull();
    const back = run({
      method: 'plate-force',
      liquid: 'custom',
      surfaceTension: r.outputs.surfaceTension ?? 0,
    });
    expect(back.outputs.force).toBeCloseTo(2.9e-3, 15);
  });

  it('gives water’s pull on a rod from IAPWS R1-76 at the temperature given', () => {
    const r = run({ method: 'rod-force', rodDiameter: 1e-3, temperatureC: 25 });
    expect(r.outputs.force).toBeCloseTo(waterSurfaceTension(25) * Math.PI * 1e-3, 15);
    expect(
      run({ method: 'rod-tension', rodForce: r.outputs.force ?? 0, rodDiameter: 1e-3 }).outputs
        .surfaceTension,
    ).toBeCloseTo(waterSurfaceTension(25), 15);
  });

  it('gives the ring’s corrected and uncorrected values side by side (ASTM D971 form)', () => {
    const r = run({ method: 'ring' });
    const direct = duNouySurfaceTension({
      force: 9e-3,
      ringRadius: 9.55e-3,
      wireRadius: 0.2e-3,
      densityDifference: 998,
    });
    expect(r.outputs).toMatchObject({
      surfaceTension: direct.surfaceTension,
      apparentSurfaceTension: direct.apparentSurfaceTension,
      correctionFactor: direct.correctionFactor,
      force: null,
    });
    expect(r.working.find((w) => w.id === 'ring-factor')?.source).toMatch(/ASTM D971/);
  });

  it('warns for an assumed angle, an angle near 90° and a ring below ASTM size; refuses θ ≥ 90° and a wire as thick as the ring, withholds an out-of-range ring', () => {
    expect(run({ method: 'plate-tension', contactAngleDeg: 20 }).warnings.map((w) => w.code)).toEqual([
      'CONTACT_ANGLE_NOT_ZERO',
    ]);
    expect(run({ method: 'plate-force', contactAngleDeg: 85 }).warnings.map((w) => w.code)).toEqual([
      'CONTACT_ANGLE_NEAR_90',
    ]);
    // R = 6.5 mm with a 0.2 mm wire: R/r = 32.5 and R³/V = 0.30, inside the tables (from memory).
    expect(run({ method: 'ring', ringRadius: 6.5e-3, ringForce: 6e-3 }).warnings).toEqual([]);
    expect(run({ method: 'ring', ringRadius: 6.2e-3, ringForce: 5e-3 }).warnings.map((w) => w.code)).toEqual([
      'RING_BELOW_ASTM_SIZE',
    ]);
    expect(() => calculate('wetting-force', { method: 'plate-tension', contactAngleDeg: 95 })).toThrow(
      expect.objectContaining({ field: 'contactAngleDeg', code: 'ANGLE_NOT_WETTING' }),
    );
    const thick = calculate('wetting-force', {
      method: 'ring',
      ringRadius: 2e-3,
      wireRadius: 1e-3,
      ringForce: 1e-6,
    });
    expect(thick.outputs.correctionFactor).toBeNull();
    expect(thick.warnings.find((w) => w.code === 'RING_OUTSIDE_CORRECTION_RANGE')?.step).toBe(
      'ring-radicand',
    );
    expect(() => calculate('wetting-force', { method: 'ring', ringRadius: 1e-3, wireRadius: 1e-3 })).toThrow(
      expect.objectContaining({ field: 'wireRadius' }),
    );
  });
});
