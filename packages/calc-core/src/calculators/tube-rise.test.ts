import { describe, expect, it } from 'vitest';
import { jurinRise } from '../formulas/capillary.js';
import { waterDensity, waterSurfaceTension } from '../properties/water.js';
import { calculate } from '../registry.js';
import { TUBE } from './rise-common.js';
import { run } from './tube-rise.js';

const codes = (inputs: Record<string, unknown>): string[] => run(inputs).warnings.map((w) => w.code);

describe('tube-rise calculator', () => {
  it('reproduces OpenStax College Physics 11.79 with its own numbers: r = 0.500 mm → 2.97 cm (printed)', () => {
    const r = run({
      liquid: 'custom',
      surfaceTension: 0.0728,
      density: 1000,
      contactAnglePreset: 'custom',
      contactAngleDeg: 0,
      diameter: 1e-3,
      gravity: 9.8,
    });
    expect(Math.abs((r.outputs.rise ?? 0) - 0.0297)).toBeLessThanOrEqual(0.00005);
  });

  it('takes water’s σ and ρ from IAPWS R1-76 and Kell at the temperature given, and says so in the working', () => {
    const r = run({ temperatureC: 60 });
    const expected = jurinRise({
      surfaceTension: waterSurfaceTension(60),
      contactAngleDeg: 0,
      density: waterDensity(60).value,
      diameter: 1e-3,
    });
    expect(r.outputs.rise).toBeCloseTo(expected, 15);
    expect(r.working.map((w) => w.source)).toContain('Kell 1975');
    expect(r.working.map((w) => w.source)).toContain('IAPWS R1-76(2014)');
    expect(run({ temperatureC: 20 }).working.map((w) => w.source)).toContain('Tanaka et al. 2001');
    expect(run({ temperatureC: 80 }).outputs.rise ?? 0).toBeLessThan(
      run({ temperatureC: 20 }).outputs.rise ?? 0,
    );
  });

  it('corrects for the meniscus by r/3 at θ = 0 (Rayleigh 1915, printed)', () => {
    const r = run({ diameter: 2e-3 });
    expect((r.outputs.rise ?? 0) - (r.outputs.riseCorrected ?? 0)).toBeCloseTo(1e-3 / 3, 15);
  });

  it('warns when the bore is not small against the capillary length, at the 2 % threshold it states', () => {
    // ℓc of water at 20 °C is 2.726 mm: the threshold radius is √0.12·ℓc ≈ 0.944 mm.
    expect(codes({ diameter: 1.8e-3 })).not.toContain('BORE_NOT_SMALL');
    expect(codes({ diameter: 2e-3 })).toContain('BORE_NOT_SMALL');
    expect(codes({ diameter: 6e-3 })).toEqual(['BORE_TOO_WIDE']);
    // At the threshold the correction is exactly 2 % of the rise (θ = 0).
    const lc = run({}).outputs.capillaryLength ?? 0;
    const d = 2 * TUBE.notSmallRatio * lc;
    const at = run({ diameter: d });
    expect(((at.outputs.rise ?? 0) - (at.outputs.riseCorrected ?? 0)) / (at.outputs.rise ?? 1)).toBeCloseTo(
      0.02,
      10,
    );
  });

  it('gives a depression for mercury on glass, with the band over its 130–140° spread (common practice)', () => {
    const r = run({ liquid: 'mercury', contactAnglePreset: 'mercury-glass' });
    expect(r.outputs.rise).toBeLessThan(0);
    expect(r.outputs.riseCorrected).toBeNull();
    expect(r.warnings.map((w) => w.code)).toContain('MENISCUS_CORRECTION_NOT_APPLIED');
    const at = (theta: number): number =>
      run({ liquid: 'mercury', contactAnglePreset: 'custom', contactAngleDeg: theta }).outputs.rise ?? 0;
    expect(r.band?.outputs.rise).toEqual({ low: at(140), high: at(130) });
    expect(r.band?.basis[0]?.input).toBe('contactAngleDeg');
  });

  it('refuses a preset meant for another liquid, naming the preset field', () => {
    expect(() => calculate('tube-rise', { liquid: 'water', contactAnglePreset: 'mercury-glass' })).toThrow(
      expect.objectContaining({ field: 'contactAnglePreset', code: 'PRESET_LIQUID_MISMATCH' }),
    );
  });

  it('warns near 90° where cos θ is small', () => {
    expect(codes({ contactAnglePreset: 'custom', contactAngleDeg: 85 })).toContain('CONTACT_ANGLE_NEAR_90');
    expect(codes({ contactAnglePreset: 'custom', contactAngleDeg: 70 })).not.toContain(
      'CONTACT_ANGLE_NEAR_90',
    );
  });
});
