import { describe, expect, it } from 'vitest';
import { CalcInputError } from '../errors.js';
import { calculators, compute } from '../registry.js';
import { compute as tubeRise } from './tube-rise.js';
import { compute as wettingForce } from './wetting-force.js';
import { runCalculation } from './run.js';
import { calculator as tubeRiseCore } from './tube-rise.js';
import { texts as tubeRiseTexts } from './tube-rise.texts.js';
import { resolveContactAngle, resolveLiquid } from './shared-liquid.js';

// The shared inputs' working is written by shared-working.ts, bound by runCalculation: a bundle that
// only computes (a widget's first flight) carries none of it. The tests run in this order in one
// module, so the first ones see the writers unbound.

describe('the shared inputs’ working is written only once runCalculation has bound its writers', () => {
  it('compute of every calculator, every option of every choice, reads no working', () => {
    let computed = 0;
    for (const def of calculators)
      for (const input of def.inputs) {
        if (input.kind !== 'choice') continue;
        for (const option of input.options) {
          try {
            expect(compute(def.id, { [input.id]: option.value }).calculator).toBe(def.id);
            computed++;
          } catch (err) {
            // A preset of another liquid is the visitor's mistake, not a read of the working.
            if (!(err instanceof CalcInputError)) throw err;
          }
        }
      }
    expect(computed).toBeGreaterThan(40);
  });

  it('compute gives its numbers without the writers', () => {
    const water = tubeRise({ diameter: 1e-3, liquid: 'water', temperatureC: 25 });
    expect(water.outputs.rise).toBeGreaterThan(0.029);
    expect(water.outputs.rise).toBeLessThan(0.031);
    const typed = tubeRise({
      liquid: 'custom',
      surfaceTension: 0.03,
      density: 900,
      contactAnglePreset: 'custom',
      contactAngleDeg: 85,
    });
    expect(typed.warnings.map((w) => w.code)).toContain('CONTACT_ANGLE_NEAR_90');
    // The Wilhelmy methods read the liquid: their assumptions wait for calculate.
    const plate = wettingForce({ method: 'plate-force', liquid: 'ethanol' });
    expect(plate.outputs.force).toBeGreaterThan(0);
    expect(plate.cautions.map((c) => c.code)).toContain('HAZARD_ETHANOL');
  });

  it('reading the working before then says what to do rather than printing nothing', () => {
    const liquid = resolveLiquid({ liquid: 'water', temperatureC: 15 }, { density: true });
    expect(liquid.surfaceTension).toBeGreaterThan(0.07);
    expect(() => liquid.working).toThrow(/runCalculation/);
    expect(
      () => resolveContactAngle({ contactAnglePreset: 'custom', contactAngleDeg: 30 }, 'water').assumption,
    ).toThrow(/runCalculation/);
  });

  it('after a full run the same resolved liquid writes its working and assumption', () => {
    const result = runCalculation(tubeRiseCore, { liquid: 'water', temperatureC: 15 }, tubeRiseTexts.explain);
    const liquid = resolveLiquid({ liquid: 'water', temperatureC: 15 }, { density: true });
    expect(result.working.slice(0, 2)).toEqual(liquid.working);
    expect(liquid.working.map((s) => s.source)).toEqual(['IAPWS R1-76(2014)', 'Tanaka et al. 2001']);
    expect(result.assumptions).toContain(liquid.assumption);
    expect(liquid.assumption).toMatch(/^Pure, air-free water at 15 °C/);
  });
});
