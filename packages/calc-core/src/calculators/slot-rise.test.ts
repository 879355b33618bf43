import { describe, expect, it } from 'vitest';
import { slotRise } from '../formulas/capillary.js';
import { waterDensity, waterSurfaceTension } from '../properties/water.js';
import { run as runTube } from './tube-rise.js';
import { SLOT } from './rise-common.js';
import { run } from './slot-rise.js';

describe('slot-rise calculator', () => {
  it('rises half as high as a tube of the same size (the Jurin force balance per unit length of a slot, 2σ cos θ/(ρ g w); common practice)', () => {
    const slot = run({ gap: 0.3e-3 }).outputs.rise ?? 0;
    expect(slot).toBeCloseTo((runTube({ diameter: 0.3e-3 }).outputs.rise ?? 0) / 2, 15);
    expect(slot).toBeCloseTo(
      slotRise({
        surfaceTension: waterSurfaceTension(20),
        contactAngleDeg: 0,
        density: waterDensity(20).value,
        gap: 0.3e-3,
      }),
      15,
    );
  });

  it('corrects by (1/2 − π/8)·w at θ = 0 and warns at its own 2 % threshold', () => {
    const r = run({ gap: 1e-3 });
    expect((r.outputs.rise ?? 0) - (r.outputs.riseCorrected ?? 0)).toBeCloseTo(
      (0.5 - Math.PI / 8) * 1e-3,
      15,
    );
    const lc = r.outputs.capillaryLength ?? 0;
    const at = run({ gap: 2 * SLOT.notSmallRatio * lc });
    expect(((at.outputs.rise ?? 0) - (at.outputs.riseCorrected ?? 0)) / (at.outputs.rise ?? 1)).toBeCloseTo(
      0.02,
      10,
    );
    expect(run({ gap: 2 * SLOT.notSmallRatio * lc * 1.01 }).warnings.map((w) => w.code)).toEqual([
      'GAP_NOT_SMALL',
    ]);
    expect(run({ gap: 2 * SLOT.notSmallRatio * lc * 0.99 }).warnings).toEqual([]);
    expect(run({ gap: 6e-3 }).warnings.map((w) => w.code)).toEqual(['GAP_TOO_WIDE']);
  });
});
