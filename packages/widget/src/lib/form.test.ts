import { run as runTube, calculator as tube } from '@wickstone/calc-core/calculators/tube-rise';
import { CalcInputError } from '@wickstone/calc-core';
import { describe, expect, it } from 'vitest';
import {
  applicable,
  collectInputs,
  initialForm,
  issueMessage,
  offeredOptions,
  reformat,
  settleChoices,
  typed,
} from './form.js';
import { resolveInputSettings } from './settings.js';

const inputs = resolveInputSettings(tube, {
  gravity: { mode: 'hidden' },
  contactAnglePreset: { mode: 'locked', default: 'water-clean-glass' },
});
const input = (id: string) => inputs.find((i) => i.def.id === id)!;

describe('form state', () => {
  it('shows a round default round in US units and sends what the box says', () => {
    const us = initialForm(inputs, 'us');
    // 1 mm is 0.03937 in: an engineer writes 0.04 in (within our 2 % rule), and 0.04 in is sent.
    expect(us.diameter).toMatchObject({ text: '0.04', fromDefault: true });
    expect(us.diameter?.value).toBeCloseTo(0.04 * 0.0254, 15);
    expect(us.temperatureC).toMatchObject({ text: '68', value: 20 });
    expect(collectInputs(inputs, us).diameter).toBeCloseTo(0.001016, 15);
    // A default that is not round is not rounded, and is sent exactly: standard gravity stays standard.
    const free = resolveInputSettings(tube, {});
    expect(initialForm(free, 'us').gravity).toMatchObject({ text: '32.174', value: 9.80665 });
    // Metric shows the calculator's own default, exactly.
    expect(initialForm(inputs, 'si').diameter).toMatchObject({ text: '1', value: 0.001 });
    // A default still untouched follows a unit switch back to the exact metric value.
    expect(reformat(us, inputs, 'si').diameter).toMatchObject({ text: '1', value: 0.001 });
  });

  it('keeps a locked default exact (the firm’s value), however it converts', () => {
    const locked = resolveInputSettings(tube, { diameter: { mode: 'locked', default: 0.001 } });
    expect(initialForm(locked, 'us').diameter).toEqual({ text: '0.0393701', value: 0.001 });
  });

  it('offers only the presets of the chosen liquid, and settles on one when the liquid changes', () => {
    const free = resolveInputSettings(tube, {});
    const preset = free.find((i) => i.def.id === 'contactAnglePreset')!;
    let state = initialForm(free, 'si');
    expect(offeredOptions(preset, free, state).map((o) => o.value)).toEqual(['water-clean-glass', 'custom']);
    state = settleChoices(free, { ...state, liquid: { text: 'mercury', value: 'mercury' } });
    expect(state.contactAnglePreset?.value).toBe('mercury-glass');
    expect(() => runTube(collectInputs(free, state))).not.toThrow();
  });

  it('honours a firm’s list of options', () => {
    const limited = resolveInputSettings(tube, {
      contactAnglePreset: { mode: 'editable', options: ['custom'] },
    });
    const preset = limited.find((i) => i.def.id === 'contactAnglePreset')!;
    const state = initialForm(limited, 'si');
    expect(offeredOptions(preset, limited, state).map((o) => o.value)).toEqual(['custom']);
    expect(state.contactAnglePreset?.value).toBe('custom');
  });

  it('reads typed text in the box’s unit', () => {
    expect(typed(input('diameter'), '0.5', 'si')).toEqual({ text: '0.5', value: 0.0005 });
    expect(typed(input('diameter'), '1', 'us').value).toBeCloseTo(0.0254, 15);
    expect(typed(input('diameter'), '', 'si').value).toBeNull();
    expect(typed(input('diameter'), 'x', 'si').value).toBeNaN();
  });

  it('re-shows numbers after a unit switch and leaves unreadable text alone', () => {
    let state = initialForm(inputs, 'si');
    state = {
      ...state,
      diameter: typed(input('diameter'), '2', 'si'),
      temperatureC: typed(input('temperatureC'), 'warm', 'si'),
    };
    const us = reformat(state, inputs, 'us');
    expect(us.diameter).toEqual({ text: '0.0787402', value: 0.002 });
    expect(us.temperatureC?.text).toBe('warm');
    expect(reformat(us, inputs, 'si').diameter?.text).toBe('2');
  });

  it('sends only inputs that apply, and the firm’s values for locked and hidden ones', () => {
    let state = initialForm(inputs, 'si');
    // A locked or hidden value cannot be changed by whatever the form holds for it.
    state = {
      ...state,
      gravity: { text: '1', value: 1 },
      contactAnglePreset: { text: 'custom', value: 'custom' },
    };
    const sent = collectInputs(inputs, state);
    expect(sent.gravity).toBe(9.80665);
    expect(sent.contactAnglePreset).toBe('water-clean-glass');
    expect(Object.keys(sent)).toEqual([
      'liquid',
      'temperatureC',
      'contactAnglePreset',
      'diameter',
      'gravity',
    ]);
    const ethanol = { ...state, liquid: { text: 'ethanol', value: 'ethanol' } };
    expect(applicable(inputs, ethanol).map((i) => i.def.id)).not.toContain('temperatureC');
    expect(collectInputs(inputs, ethanol)).not.toHaveProperty('temperatureC');
    const free = resolveInputSettings(tube, {});
    const custom = { ...initialForm(free, 'si'), contactAnglePreset: { text: 'custom', value: 'custom' } };
    expect(runTube(collectInputs(free, custom)).inputs).toHaveProperty('contactAngleDeg', 0);
  });

  it('words calc-core’s range problems in the visitor’s units', () => {
    const state = { ...initialForm(inputs, 'us'), diameter: typed(input('diameter'), '3', 'us') };
    let caught: unknown;
    try {
      runTube(collectInputs(inputs, state));
    } catch (e) {
      caught = e;
    }
    expect(caught).toBeInstanceOf(CalcInputError);
    const issue = (caught as CalcInputError).issues.find((i) => i.field === 'diameter')!;
    expect(issue.code).toBe('ABOVE_MAX');
    expect(issueMessage(issue, input('diameter'), 'us')).toBe(
      'Use a value from 0.0000393701 in to 1.9685 in',
    );
    expect(issueMessage(issue, input('diameter'), 'si')).toBe('Use a value from 0.001 mm to 50 mm');
    expect(issueMessage({ field: 'diameter', code: 'REQUIRED', message: 'x' }, input('diameter'), 'si')).toBe(
      'Enter a value',
    );
    expect(
      issueMessage({ field: 'inputs', code: 'OUT_OF_RANGE', message: 'no solution' }, undefined, 'si'),
    ).toBe('no solution');
  });
});
