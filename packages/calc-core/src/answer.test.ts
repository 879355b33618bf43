import { describe, expect, it } from 'vitest';
import { formatResult, headline, isSecondaryOutput, practicalDefault, significantFigures } from './answer.js';
import { inReaderUnits, readWarning, warningTitle } from './wording.js';
import { runCalculation } from './calculators/run.js';
import type { CalculatorDefinition } from './calculators/types.js';
import {
  calculators,
  interfacePressure as interfacePressure,
  slotRise as slot,
  soilCapillaryRise as soil,
  tubeRise as tube,
  wettingForce as wetting,
  wickingTime as wicking,
} from './registry.js';
import { jurinRise } from './formulas/capillary.js';
import { convert, unitSystems } from './units.js';

describe('formatResult: three significant figures, written out', () => {
  it.each([
    [29.74, '29.7'],
    [0.00002, '0.00002'],
    [2.7264, '2.73'],
    [1.6404, '1.64'],
    [1234.5, '1230'],
    [-0.3048, '−0.305'],
    [0, '0'],
    [100, '100'],
    [0.1, '0.1'],
  ] as const)('%s → %s', (value, text) => {
    expect(formatResult(value)).toBe(text);
  });

  it('never writes a power of ten between 10⁻⁶ and 10⁹', () => {
    for (let e = -6; e < 9; e++) expect(formatResult(3.14159 * 10 ** e)).not.toMatch(/×10|e/);
    expect(formatResult(2e-8)).toBe('2×10⁻⁸');
  });
});

describe('practicalDefault: a round default stays round in the other unit (our 2 % threshold)', () => {
  it.each([
    // [canonical default, unit it is shown in, text, what it is]
    [0.1e-3, 'in', '0.004', 'soil D10 0.1 mm (0.003937 in)'],
    [1, 'ft', '3.3', 'water table 1 m (3.28084 ft)'],
    [0.15, 'in', '6', 'layer 150 mm (5.906 in)'],
    [1e-3, 'in', '0.04', 'bore 1 mm (0.03937 in)'],
    [20, 'degF', '68', '20 °C is exactly 68 °F'],
    [9.80665, 'ft/s2', '32.174', 'standard gravity is not rounded: six figures kept'],
  ] as const)('%s → %s %s (%s)', (canonical, unit, text, _what) => {
    const shown = convert(canonical, unitOfKind(unit), unit);
    const out = practicalDefault(shown, canonical);
    expect(out).toBe(text);
    // The text is within 2 % of the exact conversion, whatever it is.
    expect(Math.abs(Number(out) - shown)).toBeLessThanOrEqual(0.02 * Math.abs(shown));
  });

  it('counts significant figures as printed', () => {
    expect(significantFigures(0.15)).toBe(2);
    expect(significantFigures(9.80665)).toBe(6);
    expect(significantFigures(1000)).toBe(1);
  });
});

function unitOfKind(unit: string): string {
  return unit === 'degF' ? 'degC' : unit === 'ft/s2' ? 'm/s2' : 'm';
}

describe('inReaderUnits: calc-core sentences in the reader units', () => {
  it('re-states canonical values by size and leaves chosen units alone', () => {
    expect(inReaderUnits('a gap of 2×10⁻⁵ m here', 'si')).toBe('a gap of 0.02 mm here');
    expect(inReaderUnits('a gap of 0.00002 m here', 'us')).toBe('a gap of 0.000787 in here');
    expect(inReaderUnits('ℓc (0.002726 m) and 1.5 m', 'si')).toBe('ℓc (2.73 mm) and 1.5 m');
    expect(inReaderUnits('at 20 °C', 'us')).toBe('at 68 °F');
    expect(inReaderUnits('at least 4 in (102 mm) of base', 'us')).toBe('at least 4 in (102 mm) of base');
    expect(inReaderUnits('σ of 0.07274 N/m', 'us')).toBe('σ of 72.7 mN/m');
  });
});

describe('headline: one sentence per calculator', () => {
  it('tube rise, water at 20 °C in a 1 mm bore: the Jurin rise in mm and in inches', () => {
    const r = runCalculation(tube, {});
    const h = r.outputs.rise as number;
    // Independent of calc-core's own rounding: the Jurin rise recomputed from its formula.
    expect(h).toBeCloseTo(
      jurinRise({
        surfaceTension: 0.07274,
        contactAngleDeg: 0,
        density: 998.2,
        diameter: 1e-3,
        gravity: 9.80665,
      }),
      4,
    );
    expect(headline(tube, r, 'si').text).toBe(
      `Water can climb about ${formatResult(h * 1000)} mm in a 1 mm bore.`,
    );
    expect(headline(tube, r, 'us').text).toBe(
      `Water can climb about ${formatResult(h / 0.0254)} in in a ${formatResult(1 / 25.4)} in bore.`,
    );
  });

  it('mercury in glass is pushed down', () => {
    const r = runCalculation(tube, { liquid: 'mercury', contactAnglePreset: 'mercury-glass' });
    expect(headline(tube, r, 'si').text).toMatch(/^Mercury is pushed down about [\d.]+ mm in a 1 mm bore\.$/);
  });

  it('a bore too wide withholds the figure and says why', () => {
    const r = runCalculation(tube, { diameter: 0.02 });
    const h = headline(tube, r, 'us');
    expect(h.withheld).toBe(true);
    expect(h.output).toBeNull();
    expect(h.text).toBe(
      'No rise is given for these inputs. Half the bore is at least the capillary length: the capillary formulas do not hold.',
    );
  });

  it('slot rise names the gap', () => {
    const r = runCalculation(slot, {});
    expect(headline(slot, r, 'si').text).toMatch(
      /^Water can climb about [\d.]+ mm between walls 0\.5 mm apart\.$/,
    );
  });

  it('soil: the sign of the clearance decides the sentence', () => {
    const below = runCalculation(soil, { breakLayer: 'none', d10: 0.1e-3, waterTableDepth: 2 });
    const c = below.outputs.slabClearance as number;
    expect(c).toBeGreaterThan(0);
    expect(headline(soil, below, 'us').text).toBe(
      `Capillary water stays about ${formatResult(c / 0.3048)} ft below the slab.`,
    );
    const reaches = runCalculation(soil, { breakLayer: 'none', d10: 0.1e-3, waterTableDepth: 0.2 });
    expect(reaches.outputs.slabClearance as number).toBeLessThanOrEqual(0);
    expect(headline(soil, reaches, 'si').text).toBe('Capillary water reaches the slab.');
    const fine = runCalculation(soil, { d10: 0.01e-3 });
    expect(headline(soil, fine, 'si')).toMatchObject({ withheld: true, output: null });
    expect(headline(soil, fine, 'si').text).toMatch(
      /^No clearance under the slab is given for these inputs\. D10 is finer than 0\.075 mm/,
    );
  });

  it('every calculator and method gives a sentence with no canonical SI leftovers in US units', () => {
    const cases: [CalculatorDefinition, Record<string, unknown>][] = [
      [interfacePressure, {}],
      [interfacePressure, { shape: 'pore' }],
      [wetting, {}],
      [wetting, { method: 'plate-force' }],
      [wetting, { method: 'ring' }],
      [wicking, {}],
      [wicking, { direction: 'horizontal' }],
      [wicking, { length: 5 }],
    ];
    for (const [def, inputs] of cases) {
      const h = headline(def, runCalculation(def, inputs), 'us');
      expect(h.text, `${def.id} ${JSON.stringify(inputs)}`).toMatch(/^[A-Z].*\.$/);
      expect(h.text).not.toMatch(/\d (m|N\/m|Pa|kg\/m³)\b/);
    }
  });

  it('wicking beyond the Jurin limit says the liquid never gets there', () => {
    const r = runCalculation(wicking, { length: 5 });
    expect(headline(wicking, r, 'si').text).toMatch(
      /^Water never climbs 5000 mm: it stops at about [\d.]+ (mm|m)\.$/,
    );
  });

  it('a calculator it does not know gets its first output as a sentence', () => {
    const { headline: _rules, ...unknown } = { ...tube, id: 'some-later-calculator' };
    const r = runCalculation(tube, {});
    const h = headline(unknown, r, 'si');
    expect(h.text).toMatch(/^Rise \(Jurin's law\): about [\d.]+ mm\.$/);
    expect(h.output).toBe('rise');
  });
});

describe('warnings: titles and sentences in the reader units', () => {
  it('every declared warning of every calculator has a title of its own', () => {
    for (const def of calculators) {
      for (const w of def.warnings) {
        const title = warningTitle(w.code, def);
        expect(title, w.code).not.toBe('Check this result');
        expect(title).not.toMatch(/^[A-Z_]+$/);
      }
    }
    expect(
      warningTitle('SOMETHING_NEW', { warnings: [{ code: 'SOMETHING_NEW', summary: 'Too hot: no value.' }] }),
    ).toBe('Too hot');
  });

  it('bore too wide, in US units: inches, no metres', () => {
    const r = runCalculation(tube, { diameter: 0.012 });
    const w = r.warnings.find((x) => x.code === 'BORE_TOO_WIDE');
    expect(w).toBeDefined();
    const read = readWarning(w!, 'us', tube);
    expect(read.title).toBe('Bore too wide for this formula');
    expect(read.text).toMatch(/^Half the bore is 2\.2 times the capillary length \(0\.107 in\)/);
    expect(read.text).not.toMatch(/\d m\b/);
  });
});

describe('units: dyn/cm is a CGS unit, not US customary', () => {
  it('the US system shows surface tension in mN/m', () => {
    expect(unitSystems.us.surfaceTension).toBe('mN/m');
  });
  it('secondary outputs are the capillary length and the pure ratios', () => {
    expect(tube.outputs.filter(isSecondaryOutput).map((o) => o.id)).toEqual([
      'capillaryLength',
      'radiusToCapillaryLength',
    ]);
  });
});

describe('headline rules name only what their calculator has', () => {
  it('outputs, inputs in placeholders and conditions, and warnings all exist', () => {
    for (const def of calculators) {
      expect(def.headline, `${def.id} has a headline`).toBeDefined();
      for (const rule of def.headline?.rules ?? []) {
        expect(
          def.outputs.map((o) => o.id),
          def.id,
        ).toContain(rule.output);
        for (const text of [rule.text, rule.atOrBelow ?? '']) {
          for (const [, id] of text.matchAll(/\{input\.(\w+)\}/g))
            expect(def.inputs.map((i) => i.id)).toContain(id);
          expect(text.replace(/\{(value|liquid|input\.\w+)\}/g, '')).not.toMatch(/[{}]/);
        }
        for (const c of rule.when ?? []) expect(def.inputs.map((i) => i.id)).toContain(c.input);
        if (rule.warning !== undefined) expect(def.warnings.map((w) => w.code)).toContain(rule.warning);
      }
    }
  });
});
