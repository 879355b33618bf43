/// <reference types="vite/client" />
import { describe, expect, it } from 'vitest';
import { TABLE_TEMPERATURE_C, getLiquidValues, liquidValues } from './liquidValues.js';
import valuesSource from './liquidValues.ts?raw';
import { getLiquid, liquids } from './liquids.js';

describe('liquid table', () => {
  // [id, σ mN/m, tolerance, source]
  const surfaceTensions: [string, number, number, string][] = [
    ['ethanol', 22.39, 0.005, 'Jasper 1972, printed (24.05 − 0.0832·t at 20 °C)'],
    ['methanol', 22.45, 0.005, 'Jasper 1972, printed'],
    ['acetone', 24.02, 0.005, 'Jasper 1972, printed'],
    ['toluene', 28.52, 0.005, 'Jasper 1972, printed'],
    ['ethylene-glycol', 48.43, 0.005, 'Jasper 1972, printed'],
    ['mercury', 486.5, 0.05, 'Adamson & Gast 1997, printed'],
    ['glycerol', 63.4, 0.05, 'handbook value, from memory'],
  ];
  it.each(surfaceTensions)('%s at 20 °C: %s mN/m ±%s (%s)', (id, expected, tol) => {
    const row = getLiquid(id);
    expect(row?.temperatureC).toBe(20);
    expect(Math.abs((row?.surfaceTension.value ?? 0) * 1000 - expected)).toBeLessThanOrEqual(tol);
  });

  it("ethanol's row agrees with Jasper's linear fit at 20 °C (Jasper 1972: 24.05 − 0.0832·t mN/m)", () => {
    expect(
      Math.abs((getLiquid('ethanol')?.surfaceTension.value ?? 0) * 1000 - (24.05 - 0.0832 * 20)),
    ).toBeLessThan(0.005);
  });

  // [id, ρ kg/m³, tolerance, source] — CRC Handbook, from memory
  const densities: [string, number, number, string][] = [
    ['ethanol', 789.3, 1, 'CRC Handbook, from memory'],
    ['methanol', 791.4, 1, 'CRC Handbook, from memory'],
    ['toluene', 866.9, 1, 'CRC Handbook, from memory'],
    ['ethylene-glycol', 1113.5, 1, 'CRC Handbook, from memory'],
    ['glycerol', 1261, 1, 'CRC Handbook, from memory'],
    ['mercury', 13546, 2, 'CRC Handbook, from memory'],
  ];
  it.each(densities)('%s density %s kg/m³ ±%s (%s)', (id, expected, tol) => {
    expect(Math.abs((getLiquid(id)?.density.value ?? 0) - expected)).toBeLessThanOrEqual(tol);
  });

  it('marks every value with a source and an honest basis', () => {
    for (const l of liquids) {
      for (const v of [l.surfaceTension, l.density, l.viscosity]) {
        expect(v.source.length).toBeGreaterThan(5);
        expect(['printed', 'common practice', 'from memory']).toContain(v.basis);
        expect(v.value).toBeGreaterThan(0);
      }
    }
    // Only the values REFERENCES.md tags as printed may claim to be printed.
    const printed = liquids.flatMap((l) =>
      [l.surfaceTension, l.density, l.viscosity].filter((v) => v.basis === 'printed').map(() => l.id),
    );
    expect(printed.sort()).toEqual([
      'acetone',
      'ethanol',
      'ethylene-glycol',
      'mercury',
      'methanol',
      'toluene',
    ]);
  });

  it('carries the mercury hazard', () => {
    expect(getLiquid('mercury')?.hazard?.text).toMatch(/toxic/);
    expect(getLiquid('mercury')?.hazard?.code).toBe('HAZARD_MERCURY');
    expect(getLiquid('water')).toBeUndefined();
  });

  it('cites every value of the values table, row for row, with the values and hazard unchanged', () => {
    expect(liquids.map((l) => l.id)).toEqual(liquidValues.map((v) => v.id));
    for (const l of liquids) {
      const v = getLiquidValues(l.id);
      expect(l.name).toBe(v?.name);
      expect(l.temperatureC).toBe(TABLE_TEMPERATURE_C);
      expect([l.surfaceTension.value, l.density.value, l.viscosity.value]).toEqual([
        v?.surfaceTension,
        v?.density,
        v?.viscosity,
      ]);
      expect(l.hazard).toBe(v?.hazard);
    }
  });

  it('keeps the values table (what a calculation and its first view load) free of the value citations', () => {
    const citations = new Set(
      liquids.flatMap((l) => [l.surfaceTension, l.density, l.viscosity].map((v) => v.source)),
    );
    expect(citations.size).toBeGreaterThanOrEqual(3);
    for (const citation of citations) expect(valuesSource).not.toContain(citation);
  });
});
