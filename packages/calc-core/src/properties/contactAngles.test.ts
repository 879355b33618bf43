import { describe, expect, it } from 'vitest';
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
});
