import { describe, expect, it } from 'vitest';
import {
  getCalculator,
  inputApplies,
  type CalculatorDefinition,
  type QuantityInput,
} from '@wickstone/calc-core';
import { defaultWidgetSettings } from '@wickstone/contracts';
import { sampleWidget } from '../testing/fixtures';
import {
  checkSite,
  conditionText,
  draftFromWidget,
  formatRatio,
  isDirty,
  previewWidget,
  serverFieldErrors,
  setChoiceDefault,
  setDefaultText,
  setInputMode,
  setOptionOffered,
  startingChoices,
  usableColors,
  validateDraft,
  withUnitSystem,
  type WidgetDraft,
} from './widget-draft';

const calc = getCalculator('tube-rise') as CalculatorDefinition;
const bore = calc.inputs.find((i) => i.id === 'diameter') as QuantityInput;

const widget = sampleWidget;

const fresh = () => draftFromWidget(widget(), calc);
const errorsOf = (d: WidgetDraft) => validateDraft(d, calc).errors ?? {};

describe('input defaults', () => {
  it('takes a default typed in the widget’s units and stores it in SI', () => {
    const us = withUnitSystem(fresh(), calc, 'us');
    const d = setDefaultText(us, bore, '0.04');
    // The inch is exactly 25.4 mm.
    expect(d.settings.inputs.diameter?.default).toBeCloseTo(0.001016, 15);
    expect(d.defaultTexts.diameter).toBe('0.04');
    expect(validateDraft(d, calc).body?.settings?.inputs.diameter).toEqual({
      mode: 'editable',
      default: d.settings.inputs.diameter?.default,
    });
  });

  it('shows the same stored value again when the unit system changes', () => {
    const d = setDefaultText(withUnitSystem(fresh(), calc, 'us'), bore, '0.04');
    expect(withUnitSystem(d, calc, 'si').defaultTexts.diameter).toBe('1.016');
    expect(withUnitSystem(withUnitSystem(d, calc, 'si'), calc, 'us').defaultTexts.diameter).toBe('0.04');
  });

  it('leaves the setting out when the box is emptied, and names unreadable or out-of-range values', () => {
    const set = setDefaultText(fresh(), bore, '2');
    expect(setDefaultText(set, bore, '').settings.inputs).toEqual({});
    expect(errorsOf(setDefaultText(fresh(), bore, 'two'))['settings.inputs.diameter.default']).toBe(
      'Enter a number in mm',
    );
    expect(errorsOf(setDefaultText(fresh(), bore, '80'))['settings.inputs.diameter.default']).toBe(
      'Between 0.001 and 50 mm',
    );
    expect(errorsOf(setDefaultText(fresh(), bore, '50'))).toEqual({});
  });

  it('keeps only settings that say something: a mode, or a default that is not the calculator’s own', () => {
    const liquid = calc.inputs.find((i) => i.id === 'liquid')!;
    let d = setInputMode(fresh(), 'liquid', 'locked');
    expect(d.settings.inputs).toEqual({ liquid: { mode: 'locked' } });
    d = setChoiceDefault(setInputMode(d, 'liquid', 'editable'), liquid, 'ethanol');
    expect(d.settings.inputs).toEqual({ liquid: { mode: 'editable', default: 'ethanol' } });
    expect(setChoiceDefault(d, liquid, 'water').settings.inputs).toEqual({});
  });

  it('says which inputs take part with the starting choices', () => {
    const temperature = calc.inputs.find((i) => i.id === 'temperatureC')!;
    const tension = calc.inputs.find((i) => i.id === 'surfaceTension')!;
    const liquid = calc.inputs.find((i) => i.id === 'liquid')!;
    const d = fresh();
    expect(inputApplies(temperature, calc.inputs, startingChoices(calc, d.settings))).toBe(true);
    expect(inputApplies(tension, calc.inputs, startingChoices(calc, d.settings))).toBe(false);
    const custom = setChoiceDefault(d, liquid, 'custom');
    expect(inputApplies(tension, calc.inputs, startingChoices(calc, custom.settings))).toBe(true);
    expect(conditionText(tension, calc)).toMatch(/^Liquid is “.+”$/);
  });
});

describe('checks before saving', () => {
  it('refuses a colour pair below WCAG AA and says the ratio', () => {
    const d = fresh();
    d.settings = {
      ...d.settings,
      look: { ...d.settings.look, colors: { ...d.settings.look.colors, text: '#bbbbbb' } },
    };
    expect(errorsOf(d)['settings.look.colors.text']).toBe(
      'Contrast between text and background is 1.92:1; WCAG AA needs at least 4.5:1',
    );
    expect(validateDraft(d, calc).body).toBeNull();
  });

  it('never rounds a failing ratio up to the threshold', () => {
    expect(formatRatio(4.497)).toBe('4.49:1');
    expect(formatRatio(4.5)).toBe('4.50:1');
    expect(formatRatio(12.345)).toBe('12.35:1');
  });

  it('asks a live widget for a site and checks each origin by its line', () => {
    const live = { ...fresh(), status: 'live' as const };
    expect(errorsOf(live).allowedOrigins).toBe(
      'A widget in service needs at least one site allowed to embed it',
    );
    const sites = {
      ...live,
      sitesText:
        'https://www.brackenridge-ground.example\n\nhttps://portal.brackenridge-ground.example/leads',
    };
    expect(Object.keys(errorsOf(sites))).toEqual(['allowedOrigins.1']);
    expect(checkSite('portal.brackenridge-ground.example/leads')).toMatchObject({
      ok: false,
      suggestion: 'https://portal.brackenridge-ground.example',
    });
  });

  it('checks each notified address', () => {
    const d = { ...fresh(), notifyText: 'surveys@brackenridge-ground.example\nnot an address' };
    expect(Object.keys(errorsOf(d))).toEqual(['settings.leadForm.notify.1']);
  });

  it('sends the full settings, with the origins as the server keeps them', () => {
    const d = {
      ...fresh(),
      status: 'live' as const,
      sitesText: ' HTTPS://WWW.Brackenridge-Ground.example \n',
    };
    const body = validateDraft(d, calc).body;
    expect(body?.allowedOrigins).toEqual(['https://www.brackenridge-ground.example']);
    expect(body?.settings).toEqual({
      ...defaultWidgetSettings(),
      leadForm: { ...defaultWidgetSettings().leadForm, notify: [] },
    });
  });
});

describe('server errors, dirtiness and the preview', () => {
  it('keys the server’s fields like the form’s own (body. taken off)', () => {
    expect(
      serverFieldErrors([
        { field: 'body.settings.look.colors.text', message: 'Contrast too low' },
        { field: 'body.allowedOrigins', message: 'A live widget needs at least one site' },
        { field: 'body.settings.look.colors.text', message: 'second message' },
      ]),
    ).toEqual({
      'settings.look.colors.text': 'Contrast too low',
      allowedOrigins: 'A live widget needs at least one site',
    });
  });

  it('knows when the draft differs from what is saved', () => {
    const saved = fresh();
    expect(isDirty(saved, saved)).toBe(false);
    expect(isDirty({ ...saved, name: 'Another name' }, saved)).toBe(true);
    expect(isDirty(setDefaultText(saved, bore, 'x'), saved)).toBe(true);
  });

  it('renders the unsaved settings, a half-typed colour keeping the last complete one', () => {
    const d = fresh();
    const look = { ...d.settings.look, colors: { ...d.settings.look.colors, text: '#12' } };
    const draft = { ...d, name: 'Damp check', settings: { ...d.settings, cautions: ' Ours. ', look } };
    const embed = previewWidget(
      widget(),
      draft,
      usableColors(look.colors, defaultWidgetSettings().look.colors),
    );
    expect(embed.name).toBe('Damp check');
    expect(embed.settings.cautions).toBe('Ours.');
    expect(embed.settings.look.colors.text).toBe(defaultWidgetSettings().look.colors.text);
    expect(embed.settings).not.toHaveProperty('leadForm.notify');
  });
});

describe('options a firm offers for a choice', () => {
  const preset = calc.inputs.find((i) => i.id === 'contactAnglePreset');
  if (preset?.kind !== 'choice') throw new Error('tube-rise has a preset choice');

  it('stores the list only while something is withdrawn, in the calculator’s order', () => {
    const start = draftFromWidget(sampleWidget(), calc);
    const narrowed = setOptionOffered(start, preset, 'mercury-glass', false);
    expect(narrowed.settings.inputs.contactAnglePreset?.options).toEqual(['water-clean-glass', 'custom']);
    const back = setOptionOffered(narrowed, preset, 'mercury-glass', true);
    expect(back.settings.inputs.contactAnglePreset).toBeUndefined();
  });

  it('passes the result setting to the preview', () => {
    const start = draftFromWidget(sampleWidget(), calc);
    const hidden = { ...start, settings: { ...start.settings, result: { secondary: 'hidden' as const } } };
    expect(previewWidget(sampleWidget(), hidden, hidden.settings.look.colors).settings.result).toEqual({
      secondary: 'hidden',
    });
  });
});
