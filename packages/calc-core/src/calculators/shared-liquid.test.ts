/// <reference types="vite/client" />
import { describe, expect, it } from 'vitest';

// shared-liquid.ts travels in the widget's first flight of every calculator that takes a liquid, with
// what it imports. The citations of the liquids' values and the presets' angles (`liquids.ts`,
// `contactAngles.ts`) are read by the working alone, which follows first paint: neither it nor the
// values tables it reads may import them (a type import is erased and carries nothing).

const firstFlight = import.meta.glob<string>(
  ['./shared-liquid.ts', '../properties/liquidValues.ts', '../properties/contactAngleValues.ts'],
  { eager: true, query: '?raw', import: 'default' },
);
const importsCitations = (source: string): boolean =>
  /^import (?!type )[^;]*from '(\.\.\/properties|\.)\/(liquids|contactAngles)\.js';/m.test(source);

describe('the liquid inputs carry values, not citations', () => {
  it('shared-liquid.ts and the values tables import neither liquids.ts nor contactAngles.ts', () => {
    expect(Object.keys(firstFlight)).toHaveLength(3);
    for (const [file, source] of Object.entries(firstFlight))
      expect(importsCitations(source), `${file} imports the citations`).toBe(false);
  });

  it('the check sees such an import', () => {
    expect(importsCitations("import { getLiquid } from '../properties/liquids.js';")).toBe(true);
    expect(importsCitations("import { contactAnglePresets } from './contactAngles.js';")).toBe(true);
    expect(importsCitations("import type { Basis } from './liquids.js';")).toBe(false);
  });
});
