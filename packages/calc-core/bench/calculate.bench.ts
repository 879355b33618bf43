import { bench, describe } from 'vitest';
import { calculate, calculators } from '../src/index.js';

// calculate() throughput per calculator on its default inputs, and on the heaviest mode of each.
describe('calculate()', () => {
  for (const c of calculators) {
    bench(`${c.id} (defaults)`, () => {
      calculate(c.id, {});
    });
  }
  bench('tube-rise, mercury with band', () => {
    calculate('tube-rise', { liquid: 'mercury', contactAnglePreset: 'mercury-glass' });
  });
  bench('wetting-force, du Noüy ring', () => {
    calculate('wetting-force', { method: 'ring' });
  });
});
