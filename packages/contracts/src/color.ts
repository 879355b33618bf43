/**
 * WCAG 2.1 contrast between two sRGB colours given as #rrggbb (success criterion 1.4.3:
 * AA needs 4.5 for body text). Relative luminance per the WCAG 2.1 definition.
 */
export const hexColorPattern = /^#[0-9a-fA-F]{6}$/;

function channel(c: number): number {
  const s = c / 255;
  return s <= 0.04045 ? s / 12.92 : ((s + 0.055) / 1.055) ** 2.4;
}

export function relativeLuminance(hex: string): number {
  if (!hexColorPattern.test(hex)) throw new RangeError(`not a #rrggbb colour: ${hex}`);
  const n = Number.parseInt(hex.slice(1), 16);
  return 0.2126 * channel((n >> 16) & 255) + 0.7152 * channel((n >> 8) & 255) + 0.0722 * channel(n & 255);
}

/** Contrast ratio from 1 (same colour) to 21 (black on white). */
export function contrastRatio(a: string, b: string): number {
  const la = relativeLuminance(a);
  const lb = relativeLuminance(b);
  return (Math.max(la, lb) + 0.05) / (Math.min(la, lb) + 0.05);
}

export const WCAG_AA_TEXT = 4.5;
