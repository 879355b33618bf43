import { describe, expect, it } from 'vitest';
import { gravityRestrainedRiseTime, washburnTime } from '../formulas/wicking.js';
import { waterDensity, waterSurfaceTension, waterViscosity } from '../properties/water.js';
import { calculate } from '../registry.js';
import { run } from './wicking-time.js';

const water = { surfaceTension: waterSurfaceTension(20), viscosity: waterViscosity(20) };

describe('wicking-time calculator', () => {
  it('uses water’s viscosity from IAPWS SR6-08 in the Lucas–Washburn time', () => {
    const r = run({ direction: 'horizontal', length: 0.05, poreRadius: 20e-6 });
    expect(r.outputs.time).toBeCloseTo(
      washburnTime({ ...water, poreRadius: 20e-6, contactAngleDeg: 0, length: 0.05 }),
      12,
    );
    expect(r.outputs.jurinLimit).toBeNull();
    expect(r.outputs.timeWithGravity).toBeNull();
    expect(r.working.map((w) => w.source)).toContain('IAPWS SR6-08 (2011)');
  });

  it('checks a vertical rise against the Jurin limit and gives the time with gravity', () => {
    const r = run({ length: 0.05, poreRadius: 20e-6 });
    const limit = (2 * water.surfaceTension) / (waterDensity(20).value * 9.80665 * 20e-6);
    expect(r.outputs.jurinLimit).toBeCloseTo(limit, 12);
    expect(r.outputs.timeWithGravity).toBeCloseTo(
      gravityRestrainedRiseTime({
        ...water,
        poreRadius: 20e-6,
        contactAngleDeg: 0,
        height: 0.05,
        density: waterDensity(20).value,
      }),
      9,
    );
    expect(r.warnings).toEqual([]);
    expect(run({ length: 0.2, poreRadius: 20e-6 }).warnings.map((w) => w.code)).toEqual([
      'GRAVITY_NOT_NEGLIGIBLE',
    ]);
    const beyond = run({ length: 1, poreRadius: 20e-6 });
    expect(beyond.warnings.map((w) => w.code)).toEqual(['BEYOND_JURIN_LIMIT']);
    expect(beyond.outputs.timeWithGravity).toBeNull();
  });

  it('refuses a contact angle at which nothing wicks', () => {
    expect(() => calculate('wicking-time', { contactAnglePreset: 'custom', contactAngleDeg: 100 })).toThrow(
      expect.objectContaining({ field: 'contactAngleDeg', code: 'NO_SPONTANEOUS_WICKING' }),
    );
  });
});
