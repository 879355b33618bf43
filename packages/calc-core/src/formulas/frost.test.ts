import { describe, expect, it } from 'vitest';
import { casagrandeCriterion, frostGroup, fringeGapBelowFrostLine } from './frost.js';

describe("Casagrande's grain-size criterion (from memory, common practice)", () => {
  // [share finer than 0.02 mm, Cu, susceptible, source]
  const rows: [number, number, boolean, string][] = [
    [0.02, 20, false, 'Casagrande 1931: non-uniform, 3 % threshold — from memory'],
    [0.04, 20, true, 'Casagrande 1931: non-uniform, 3 % threshold — from memory'],
    [0.08, 3, false, 'Casagrande 1931: very uniform, 10 % threshold — from memory'],
    [0.12, 3, true, 'Casagrande 1931: very uniform, 10 % threshold — from memory'],
    [0.05, 10, true, 'between the classes the 3 % threshold applies: our conservative choice'],
  ];
  it.each(rows)('%s finer, Cu %s → susceptible %s (%s)', (share, cu, susceptible) => {
    expect(casagrandeCriterion(share, cu).susceptible).toBe(susceptible);
  });

  it('names the field of a share above one or a Cu below one', () => {
    expect(() => casagrandeCriterion(1.2, 10)).toThrowError(expect.objectContaining({ field: 'finesShare' }));
    expect(() => casagrandeCriterion(0.1, 0.5)).toThrowError(
      expect.objectContaining({ field: 'uniformity' }),
    );
  });
});

describe('frost-design soil groups (US Army Corps practice, from memory)', () => {
  const rows: [Parameters<typeof frostGroup>[0], number, number | undefined, string][] = [
    ['gravel', 0.02, undefined, 'NFS'],
    ['gravel', 0.06, undefined, 'F1'],
    ['gravel', 0.15, undefined, 'F2'],
    ['gravel', 0.25, undefined, 'F3'],
    ['sand', 0.1, undefined, 'F2'],
    ['sand', 0.2, undefined, 'F3'],
    ['very-fine-silty-sand', 0.2, undefined, 'F4'],
    ['silt', 0.5, undefined, 'F4'],
    ['clay', 0.9, 20, 'F3'],
    ['clay', 0.9, 8, 'F4'],
  ];
  it.each(rows)('%s with %s finer (PI %s) → %s', (kind, share, pi, group) => {
    expect(frostGroup(kind, share, pi)).toBe(group);
  });
  it('asks for the plasticity index of a clay', () => {
    expect(() => frostGroup('clay', 0.5)).toThrowError(expect.objectContaining({ field: 'plasticityIndex' }));
  });
});

describe('capillary fringe against the frost line', () => {
  it('is the water-table depth less the rise less the frost depth (hand arithmetic)', () => {
    expect(
      fringeGapBelowFrostLine({ waterTableDepth: 2.5, frostDepth: 0.8, capillaryRise: 1.2 }),
    ).toBeCloseTo(0.5, 12);
    expect(
      fringeGapBelowFrostLine({ waterTableDepth: 1.5, frostDepth: 0.8, capillaryRise: 1.2 }),
    ).toBeCloseTo(-0.5, 12);
  });
});
