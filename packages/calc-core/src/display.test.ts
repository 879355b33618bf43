import { describe, expect, it } from 'vitest';
import { soilCapillaryRise as soil, tubeRise as tube, wettingForce as wetting } from './registry.js';
import type { InputDefinition } from './calculators/types.js';
import { CalcInputError } from './errors.js';
import { runCalculation } from './calculators/run.js';
import {
  displayUnitOf,
  inputApplies,
  optionsFor,
  outputHelp,
  referencesFor,
  unitGap,
  withUnit,
} from './display.js';
import { units, type UnitId } from './units.js';

describe('withUnit: one spacing rule for every number and unit symbol', () => {
  it.each([
    // [number, unit, printed, source]
    [
      '30.2',
      'degC',
      '30.2 °C',
      'SI Brochure (BIPM, 9th ed., 2019) §5.4.3: a space before °C, as before any unit',
    ],
    [
      '30.2',
      'degF',
      '30.2 °F',
      'NIST SP 811 (2008) §7.2: a space before every unit symbol but the plane angle',
    ],
    [
      '35',
      'deg',
      '35°',
      'SI Brochure (BIPM, 9th ed., 2019) §5.4.3: no space before the degree of a plane angle',
    ],
    ['2.5', 'm', '2.5 m', 'SI Brochure (BIPM, 9th ed., 2019) §5.4.3: a space before the unit'],
    ['293.15', 'K', '293.15 K', 'NIST SP 811 (2008) §7.2: a space before kelvin'],
    [
      '998.2',
      'kg/m3',
      '998.2 kg/m³',
      'NIST SP 811 (2008) §7.2 (space) and §6.1 (exponent as superscript, from memory)',
    ],
    ['72.74', 'mN/m', '72.74 mN/m', 'NIST SP 811 (2008) §7.2: a space before the unit symbol'],
    [
      '1.002',
      'mPa*s',
      '1.002 mPa·s',
      'SI Brochure (BIPM, 9th ed., 2019) §5.4.3 (space); product of units with a half-high dot',
    ],
    ['0.42', '1', '0.42', 'a pure number has no symbol, so nothing follows it (common practice)'],
    ['1.2', 'rad', '1.2 rad', 'NIST SP 811 (2008) §7.2: the radian is an ordinary symbol, spaced'],
  ] as const)('%s %s → %s (%s)', (text, unit, printed, _source) => {
    expect(withUnit(text, unit)).toBe(printed);
  });

  it('spaces every unit calc-core knows except the plane-angle degree and the pure number (NIST SP 811 §7.2)', () => {
    for (const [id, def] of Object.entries(units) as [UnitId, (typeof units)[UnitId]][]) {
      const printed = withUnit('7', id);
      if (id === 'deg') expect(printed).toBe('7°');
      else if (id === '1') expect(printed).toBe('7');
      else expect(printed, id).toBe(`7 ${def.symbol}`);
      expect(unitGap(id)).toBe(printed === `7${def.symbol}` ? '' : ' ');
    }
  });

  it('writes exponents as superscripts in every symbol: kg/m³, not kg/m3 (SI Brochure §5.4.2, from memory)', () => {
    for (const def of Object.values(units)) expect(def.symbol, def.name).not.toMatch(/[A-Za-z)]\d/);
  });
});

describe('the engine’s range messages follow the same rule', () => {
  const message = (inputs: Record<string, unknown>): string => {
    try {
      runCalculation(tube, inputs);
    } catch (err) {
      if (err instanceof CalcInputError) return err.issues.map((i) => i.message).join('; ');
    }
    throw new Error('no CalcInputError');
  };
  it('spaces °C and metres, and not the plane-angle degree (SI Brochure §5.4.3)', () => {
    expect(message({ liquid: 'water', temperatureC: 500 })).toMatch(/from \S+ °C to \S+ °C$/);
    expect(message({ diameter: 5 })).toMatch(/from \S+ m to \S+ m$/);
    expect(message({ contactAnglePreset: 'custom', contactAngleDeg: 200 })).toMatch(/from 0° to 180°$/);
  });
});

describe('displayUnitOf', () => {
  it('takes the definition’s own unit for the system, else the system’s default', () => {
    const bore = { kind: 'length' as const, display: { si: 'mm' as const, us: 'in' as const } };
    expect(displayUnitOf(bore, 'si')).toBe('mm');
    expect(displayUnitOf(bore, 'us')).toBe('in');
    expect(displayUnitOf({ kind: 'length' }, 'si')).toBe('m');
    expect(displayUnitOf({ kind: 'temperature' }, 'us')).toBe('degF');
    // No US customary unit of surface tension is in use: the US system shows mN/m (dyn/cm is CGS).
    expect(displayUnitOf({ kind: 'surfaceTension', display: { si: 'N/m' } }, 'us')).toBe('mN/m');
  });
});

describe('locks: options and references follow the chosen liquid', () => {
  const preset = tube.inputs.find((i) => i.id === 'contactAnglePreset');
  if (preset?.kind !== 'choice') throw new Error('tube-rise has a preset choice');

  it('with water, only water presets (and typing the angle) are offered', () => {
    const offered = optionsFor(preset, { liquid: 'water' }).map((o) => o.value);
    expect(offered).toEqual(['water-clean-glass', 'custom']);
    expect(optionsFor(preset, { liquid: 'mercury' }).map((o) => o.value)).toEqual([
      'mercury-glass',
      'custom',
    ]);
    // A liquid entered by hand may take any preset: calc-core cannot know what it is.
    expect(optionsFor(preset, { liquid: 'custom' })).toHaveLength(preset.options.length);
  });

  it('a firm list narrows the options further', () => {
    expect(optionsFor(preset, { liquid: 'water' }, ['custom']).map((o) => o.value)).toEqual(['custom']);
  });

  it('with water no mercury or organic-liquid reference is shown; with mercury no water one', () => {
    const water = referencesFor(tube.references, runCalculation(tube, {}).inputs).map((r) => r.id);
    expect(water).toEqual(expect.arrayContaining(['jurin-1718', 'iapws-r1-76', 'tanaka-2001']));
    expect(water).not.toContain('adamson-gast-1997');
    expect(water).not.toContain('jasper-1972');
    expect(water).not.toContain('crc-handbook');
    const mercury = referencesFor(
      tube.references,
      runCalculation(tube, { liquid: 'mercury', contactAnglePreset: 'mercury-glass' }).inputs,
    ).map((r) => r.id);
    expect(mercury).toEqual(expect.arrayContaining(['adamson-gast-1997', 'crc-handbook']));
    expect(mercury).not.toContain('iapws-r1-76');
    expect(mercury).not.toContain('jasper-1972');
  });

  it('no reference of any calculator says it is still to be checked', () => {
    for (const def of [tube, soil, wetting]) {
      for (const r of def.references) expect(`${r.citation} ${r.usedFor}`).not.toMatch(/to be checked/i);
    }
  });
});

describe('outputHelp: help that follows the sign of the value', () => {
  const clearance = soil.outputs.find((o) => o.id === 'slabClearance');
  if (clearance === undefined) throw new Error('soil has a clearance');
  it('a positive clearance does not say the water reaches the slab', () => {
    expect(outputHelp(clearance, 0.5)).not.toMatch(/reaches/);
    expect(outputHelp(clearance, 0)).toMatch(/reaches the underside of the slab/);
    expect(outputHelp(clearance, -0.2)).toMatch(/reaches/);
  });
});

describe('inputApplies', () => {
  const get = (inputs: readonly InputDefinition[], id: string): InputDefinition => {
    const found = inputs.find((i) => i.id === id);
    if (found === undefined) throw new Error(`no input ${id}`);
    return found;
  };

  it('follows appliesWhen on the current choices', () => {
    expect(inputApplies(get(tube.inputs, 'temperatureC'), tube.inputs, { liquid: 'water' })).toBe(true);
    expect(inputApplies(get(tube.inputs, 'temperatureC'), tube.inputs, { liquid: 'ethanol' })).toBe(false);
    expect(inputApplies(get(tube.inputs, 'surfaceTension'), tube.inputs, { liquid: 'custom' })).toBe(true);
    expect(inputApplies(get(tube.inputs, 'diameter'), tube.inputs, {})).toBe(true);
  });

  it('needs every condition, including those on inputs that themselves depend on another', () => {
    const t = get(wetting.inputs, 'temperatureC');
    expect(inputApplies(t, wetting.inputs, { method: 'plate-force', liquid: 'water' })).toBe(true);
    expect(inputApplies(t, wetting.inputs, { method: 'ring', liquid: 'water' })).toBe(false);
    expect(inputApplies(get(soil.inputs, 'layerThickness'), soil.inputs, { breakLayer: 'none' })).toBe(false);
  });

  it('matches only string choices and never an inherited key', () => {
    const t = get(tube.inputs, 'temperatureC');
    expect(inputApplies(t, tube.inputs, { liquid: 1 })).toBe(false);
    expect(inputApplies(t, tube.inputs, { liquid: null })).toBe(false);
    expect(inputApplies(t, tube.inputs, Object.create({ liquid: 'water' }) as Record<string, unknown>)).toBe(
      false,
    );
  });

  it('never applies an input whose conditions refer back to themselves', () => {
    const loop: InputDefinition = {
      id: 'a',
      label: 'A',
      kind: 'choice',
      default: 'x',
      options: [{ value: 'x', label: 'X' }],
      appliesWhen: [{ input: 'a', values: ['x'] }],
    };
    expect(inputApplies(loop, [loop], { a: 'x' })).toBe(false);
  });
});
