import { describe, expect, it } from 'vitest';
import { contrastRatio } from './color.js';

describe('contrastRatio (WCAG 2.1 relative luminance)', () => {
  it.each([
    ['#000000', '#ffffff', 21, 1e-9], // WCAG 2.1, definition of contrast ratio: range 1 to 21
    ['#ffffff', '#ffffff', 1, 1e-9], // WCAG 2.1: identical colours give 1
    ['#767676', '#ffffff', 4.54, 0.01], // common practice: #767676 is the lightest grey that passes AA on white
    ['#777777', '#ffffff', 4.48, 0.01], // common practice: #777777 just fails AA on white
  ])('%s on %s ≈ %d', (a, b, expected, tol) => {
    expect(Math.abs(contrastRatio(a, b) - expected)).toBeLessThanOrEqual(tol);
    expect(contrastRatio(a, b)).toBeCloseTo(contrastRatio(b, a), 12);
  });

  it('refuses what is not #rrggbb', () => {
    expect(() => contrastRatio('red', '#ffffff')).toThrow(RangeError);
  });
});
