import { describe, expect, it } from 'vitest';
import { hazenCapillaryRise } from '../formulas/soil.js';
import { run } from './soil-capillary-rise.js';

const codes = (inputs: Record<string, unknown>): string[] => run(inputs).warnings.map((w) => w.code);

describe('soil-capillary-rise calculator', () => {
  it("gives Hazen's rise with the band of C = 0.1–0.5 cm² (Terzaghi & Peck; range printed in Smith, Elements of Soil Mechanics)", () => {
    const r = run({ d10: 0.1e-3, voidRatio: 0.6, hazenC: 0.3e-4 });
    // 0.3 cm² / (0.6 × 0.01 cm) = 50 cm.
    expect(r.outputs.capillaryRise).toBeCloseTo(0.5, 12);
    expect(r.band?.outputs.capillaryRise?.low).toBeCloseTo(0.1e-4 / (0.6 * 0.1e-3), 12);
    expect(r.band?.outputs.capillaryRise?.high).toBeCloseTo(0.5e-4 / (0.6 * 0.1e-3), 12);
    expect(r.band?.basis[0]?.source).toMatch(/Terzaghi & Peck/);
  });

  it('a fine-sand site with the typical Heath rise of 40 cm sits inside the band (USGS Heath 1982, printed; D10, e invented)', () => {
    const r = run({ d10: 0.1e-3, voidRatio: 0.6 });
    expect(r.band?.outputs.capillaryRise?.low ?? 1).toBeLessThan(0.4);
    expect(r.band?.outputs.capillaryRise?.high ?? 0).toBeGreaterThan(0.4);
  });

  it('a slab straight on the soil: reaches, may reach, or clears', () => {
    // Rise 0.5 m at C = 0.3 cm², 0.833 m at 0.5 cm².
    expect(codes({ breakLayer: 'none', waterTableDepth: 0.3 })).toContain('CAPILLARY_RISE_REACHES_SLAB');
    expect(codes({ breakLayer: 'none', waterTableDepth: 0.7 })).toContain('CAPILLARY_RISE_MAY_REACH_SLAB');
    expect(codes({ breakLayer: 'none', waterTableDepth: 1 })).toEqual([]);
    expect(run({ breakLayer: 'none', waterTableDepth: 0.3 }).outputs.slabClearance).toBeCloseTo(-0.2, 12);
    expect(run({ breakLayer: 'none' }).outputs.layerCapillaryRise).toBeNull();
  });

  it('a clean gravel layer breaks a fringe that reaches it, leaving the layer thickness as the clearance', () => {
    const r = run({ waterTableDepth: 0.4, layerThickness: 0.15, layerD10: 6e-3, layerVoidRatio: 0.5 });
    expect(r.outputs.layerCapillaryRise).toBeCloseTo(
      hazenCapillaryRise({ d10: 6e-3, voidRatio: 0.5, c: 3e-5 }),
      15,
    );
    expect(r.outputs.slabClearance).toBeCloseTo(0.15, 12);
    expect(r.warnings).toEqual([]);
  });

  it('flags a layer that is too thin, too fine, or under water, and a soil too fine for Hazen', () => {
    expect(codes({ layerThickness: 0.05 })).toContain('LAYER_THINNER_THAN_CODE_MINIMUM');
    // IRC R506.2.2: 4 in is 101.6 mm (the code prints 102 mm).
    expect(codes({ layerThickness: 0.101 })).toContain('LAYER_THINNER_THAN_CODE_MINIMUM');
    expect(codes({ layerThickness: 0.1016 })).not.toContain('LAYER_THINNER_THAN_CODE_MINIMUM');
    expect(codes({ layerD10: 2e-3 })).toContain('LAYER_NOT_CLEAN_GRAVEL');
    expect(codes({ layerD10: 4.75e-3 })).not.toContain('LAYER_NOT_CLEAN_GRAVEL');
    expect(codes({ waterTableDepth: 0.1, layerThickness: 0.15 })).toContain('WATER_TABLE_IN_LAYER');
    expect(codes({ d10: 0.05e-3, waterTableDepth: 50 })).toEqual(['FINE_GRAINED_SOIL']);
  });

  it('a layer of fine material fails as a break', () => {
    const r = run({ waterTableDepth: 0.3, layerThickness: 0.25, layerD10: 0.1e-3, layerVoidRatio: 0.6 });
    expect(r.outputs.slabClearance ?? 1).toBeLessThan(0);
    expect(r.warnings.map((w) => w.code)).toContain('CAPILLARY_RISE_REACHES_SLAB');
  });
});
