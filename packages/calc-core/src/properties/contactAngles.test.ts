/// <reference types="vite/client" />
import { describe, expect, it } from 'vitest';
import { contactAngleValues, getContactAngleValues } from './contactAngleValues.js';
import valuesSource from './contactAngleValues.ts?raw';
import { contactAnglePresets, getContactAnglePreset } from './contactAngles.js';
import { getLiquid } from './liquids.js';

describe('contact-angle presets', () => {
  it('water on clean glass wets at about 0° (common practice)', () => {
    const p = getContactAnglePreset('water-clean-glass');
    expect(p?.angleDeg).toBe(0);
    expect(p?.basis).toBe('common practice');
  });

  it('mercury on glass sits near 130–140°, 140° the usual default (common practice)', () => {
    const p = getContactAnglePreset('mercury-glass');
    expect(p?.angleDeg).toBe(140);
    expect(p?.spreadDeg).toEqual({ low: 130, high: 140 });
  });

  it('keeps every nominal angle within its spread and within 0–180°', () => {
    for (const p of contactAnglePresets) {
      expect(p.angleDeg).toBeGreaterThanOrEqual(0);
      expect(p.angleDeg).toBeLessThanOrEqual(180);
      if (p.spreadDeg !== undefined) {
        expect(p.spreadDeg.low).toBeLessThanOrEqual(p.angleDeg);
        expect(p.spreadDeg.high).toBeGreaterThanOrEqual(p.angleDeg);
      }
      expect(p.liquid === 'water' || getLiquid(p.liquid) !== undefined).toBe(true);
    }
  });

  it('gives every preset of the values table its surface, source and basis, a spread its own source', () => {
    expect(contactAnglePresets.map((p) => p.id)).toEqual(contactAngleValues.map((v) => v.id));
    for (const p of contactAnglePresets) {
      const v = getContactAngleValues(p.id);
      expect([p.label, p.liquid, p.angleDeg]).toEqual([v?.label, v?.liquid, v?.angleDeg]);
      expect(p.surface.length).toBeGreaterThan(3);
      expect(p.source.length).toBeGreaterThan(10);
      expect(['printed', 'common practice', 'from memory']).toContain(p.basis);
      if (v?.spread === undefined) expect(p.spreadDeg).toBeUndefined();
      else {
        expect(p.spreadDeg).toEqual({ low: v.spread.low, high: v.spread.high });
        expect([p.source, p.basis]).toEqual([v.spread.source, v.spread.basis]);
      }
    }
  });

  it('keeps the values table free of the surfaces and of the sources no band names', () => {
    for (const p of contactAnglePresets) {
      // As a string of its own: a label may name the surface ("Water on clean glass").
      expect(valuesSource).not.toContain(`'${p.surface}'`);
      if (p.spreadDeg === undefined) expect(valuesSource).not.toContain(p.source);
    }
  });
});
