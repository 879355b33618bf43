import { describe, expect, it } from 'vitest';
import { waterSurfaceTension } from '../properties/water.js';
import { bindWriters, resolveContactAngle, resolveLiquid } from './shared-liquid.js';
import { sharedWriters } from './shared-working.js';

// These tests read the working and assumptions of what was resolved, as `runCalculation` does: with
// the writers bound (shared-working.test.ts checks what happens without them).
bindWriters(sharedWriters);

describe('resolveLiquid and resolveContactAngle keep what they resolved', () => {
  it('gives the same answer for the same inputs, and another for another temperature', () => {
    const at = (t: number) => resolveLiquid({ liquid: 'water', temperatureC: t }, { density: true });
    const a = at(20);
    expect(at(20)).toBe(a);
    const b = at(35);
    expect(b).not.toBe(a);
    // The values are the correlation's at each temperature, not the first one kept (IAPWS R1-76 via waterSurfaceTension).
    expect(a.surfaceTension).toBe(waterSurfaceTension(20));
    expect(b.surfaceTension).toBe(waterSurfaceTension(35));
    // Its working is made on each read: a reader that changes one copy changes no other.
    expect(a.working).not.toBe(a.working);
    expect(a.working).toEqual(at(20).working);
  });

  it('tells apart what the liquid is resolved from: needs, entered properties', () => {
    const custom = (sigma: number) =>
      resolveLiquid({ liquid: 'custom', surfaceTension: sigma, density: 900 }, { density: true });
    expect(custom(0.03).surfaceTension).toBe(0.03);
    expect(custom(0.04).surfaceTension).toBe(0.04);
    const withDensity = resolveLiquid({ liquid: 'water', temperatureC: 20 }, { density: true });
    const without = resolveLiquid({ liquid: 'water', temperatureC: 20 }, {});
    expect(withDensity.density).toBeGreaterThan(990);
    expect(without.density).toBe(0);
  });

  it('keeps a bounded number and answers the same after one was dropped', () => {
    const first = resolveLiquid({ liquid: 'water', temperatureC: 1 }, { density: true });
    for (let i = 0; i < 400; i++)
      resolveLiquid({ liquid: 'water', temperatureC: 2 + i / 10 }, { density: true });
    const again = resolveLiquid({ liquid: 'water', temperatureC: 1 }, { density: true });
    expect(again).not.toBe(first);
    expect(again.surfaceTension).toBe(first.surfaceTension);
    expect(again.density).toBe(first.density);
  });

  it('a contact angle: the same answer for the same preset, angle and liquid, another otherwise', () => {
    const typed = (deg: number) =>
      resolveContactAngle({ contactAnglePreset: 'custom', contactAngleDeg: deg }, 'water');
    expect(typed(20)).toBe(typed(20));
    expect(typed(20).angleDeg).toBe(20);
    expect(typed(30).angleDeg).toBe(30);
    const preset = resolveContactAngle({ contactAnglePreset: 'water-clean-glass' }, 'water');
    expect(preset).toBe(resolveContactAngle({ contactAnglePreset: 'water-clean-glass' }, 'water'));
    expect(preset.angleDeg).toBe(0);
    // A preset of another liquid is refused every time, never kept.
    expect(() => resolveContactAngle({ contactAnglePreset: 'water-clean-glass' }, 'ethanol')).toThrow();
    expect(() => resolveContactAngle({ contactAnglePreset: 'water-clean-glass' }, 'ethanol')).toThrow();
  });
});
