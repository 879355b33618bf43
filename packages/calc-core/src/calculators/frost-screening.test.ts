import { describe, expect, it } from 'vitest';
import { calculate } from '../registry.js';

// Reference checks for the frost screen. Casagrande's criterion and the frost-design groups are
// recalled practice (from memory, common practice), checked row by row; the fringe arithmetic is
// checked by hand; the Hazen band is set against a printed typical rise.

const codes = (inputs: Record<string, unknown>): string[] =>
  calculate('frost-screening', inputs).warnings.map((w) => w.code);

describe('frost-screening: susceptibility and group', () => {
  // [soil, inputs, frostSusceptible, frostGroup, source]
  const rows: [string, Record<string, number | string>, number, number, string][] = [
    [
      'clean gravel, 2 % finer than 0.02 mm, Cu 30',
      { soilKind: 'gravel', finesShare: 0.02, uniformity: 30 },
      0,
      0,
      'Casagrande 1931: non-uniform, 3 % threshold; gravel ≤ 3 % is NFS — from memory',
    ],
    [
      'gravel, 8 %, Cu 30',
      { soilKind: 'gravel', finesShare: 0.08, uniformity: 30 },
      1,
      1,
      'USACE groups: gravelly soils with 3–10 % finer than 0.02 mm are F1 — from memory',
    ],
    [
      'sand, 5 %, Cu 20',
      { soilKind: 'sand', finesShare: 0.05, uniformity: 20 },
      1,
      2,
      'USACE groups: sands with 3–15 % are F2 — from memory',
    ],
    [
      'silty sand, 25 %, Cu 20',
      { soilKind: 'very-fine-silty-sand', finesShare: 0.25, uniformity: 20 },
      1,
      4,
      'USACE groups: very fine silty sands over 15 % are F4 — from memory',
    ],
    [
      'lean clay, PI 20',
      { soilKind: 'clay', finesShare: 0.8, uniformity: 50, plasticityIndex: 20 },
      1,
      3,
      'USACE groups: clays with PI above 12 are F3 — from memory',
    ],
    [
      'uniform sand, 8 %, Cu 3: Casagrande says no, the group says F2; the screen takes the worse',
      { soilKind: 'sand', finesShare: 0.08, uniformity: 3 },
      1,
      2,
      'Casagrande 1931: very uniform, 10 % threshold — from memory; our conservative choice',
    ],
  ];
  it.each(rows)('%s → susceptible %s, group %s (%s)', (_soil, inputs, susceptible, group) => {
    const r = calculate('frost-screening', inputs);
    expect(r.outputs.frostSusceptible).toBe(susceptible);
    expect(r.outputs.frostGroup).toBe(group);
  });

  it('warns when the two screens disagree, near a threshold and between the gradation classes', () => {
    expect(codes({ soilKind: 'sand', finesShare: 0.08, uniformity: 3 })).toContain('SCREENS_DISAGREE');
    expect(codes({ finesShare: 0.035 })).toContain('NEAR_THRESHOLD');
    expect(codes({ finesShare: 0.05 })).not.toContain('NEAR_THRESHOLD');
    expect(codes({ uniformity: 10 })).toContain('INTERMEDIATE_GRADATION');
  });
});

describe('frost-screening: capillary fringe against the frost line', () => {
  it('D10 0.1 mm, e 0.6, C 0.3 cm²: rise 0.5 m; water table 1.2 m, frost 1.0 m → gap −0.3 m, reaches (hand arithmetic)', () => {
    const r = calculate('frost-screening', {
      d10: 1e-4,
      voidRatio: 0.6,
      hazenC: 3e-5,
      waterTableDepth: 1.2,
      frostDepth: 1,
    });
    expect(r.outputs.capillaryRise).toBeCloseTo(0.5, 12);
    expect(r.outputs.fringeGap).toBeCloseTo(-0.3, 12);
    expect(r.outputs.fringeReachesFrostLine).toBe(1);
  });

  it("spans the USGS typical rise of fine sand, 40 cm (Heath 1982, printed), over Hazen's published C for D10 0.1 mm, e 0.6", () => {
    const r = calculate('frost-screening', { d10: 1e-4, voidRatio: 0.6 });
    const band = r.band?.outputs.capillaryRise;
    expect(band?.low).toBeLessThan(0.4);
    expect(band?.high).toBeGreaterThan(0.4);
  });

  it('takes a measured rise instead of Hazen, and says nothing of Hazen then', () => {
    const r = calculate('frost-screening', {
      riseFrom: 'measured',
      capillaryRise: 1.2,
      waterTableDepth: 2.5,
      frostDepth: 1,
    });
    expect(r.outputs.fringeGap).toBeCloseTo(0.3, 12);
    expect(r.outputs.fringeReachesFrostLine).toBe(0);
    expect(r.band).toBeNull();
    expect(r.inputs).not.toHaveProperty('d10');
  });

  it('withholds the Hazen rise in a fine-grained soil, yet answers "reaches" when the water table is within the frost depth', () => {
    const deep = calculate('frost-screening', { d10: 0.03e-3 });
    expect(deep.outputs).toMatchObject({
      capillaryRise: null,
      fringeGap: null,
      fringeReachesFrostLine: null,
    });
    const shallow = calculate('frost-screening', { d10: 0.03e-3, waterTableDepth: 0.5, frostDepth: 1 });
    expect(shallow.outputs).toMatchObject({
      capillaryRise: null,
      fringeGap: null,
      fringeReachesFrostLine: 1,
    });
    expect(shallow.warnings.map((w) => w.code)).toEqual([
      'FINE_GRAINED_SOIL',
      'WATER_TABLE_WITHIN_FROST_DEPTH',
    ]);
  });

  it('warns when the top of Hazen’s range reaches the frost line though the nominal C does not', () => {
    const r = calculate('frost-screening', { waterTableDepth: 2 });
    expect(r.outputs.fringeReachesFrostLine).toBe(0);
    expect(r.band?.outputs.fringeReachesFrostLine?.high).toBe(1);
    expect(r.warnings.map((w) => w.code)).toContain('FRINGE_MAY_REACH_FROST_LINE');
  });

  it('defers to ASTM D5918 and EN ISO 13793 in its cautions and references', () => {
    const r = calculate('frost-screening', {});
    const caution = r.cautions.find((c) => c.code === 'FROST_TESTING_AND_DESIGN');
    expect(caution?.text).toMatch(/ASTM D5918/);
    expect(caution?.text).toMatch(/EN ISO 13793/);
  });
});
