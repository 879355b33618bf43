import { defaultWidgetSettings, embedWidgetSchema } from '@wickstone/contracts';
import { describe, expect, it } from 'vitest';
import { isEmbedWidget } from './shape.js';

function sample() {
  const s = defaultWidgetSettings();
  return {
    publicKey: 'wk_abcdefghij0123456789',
    name: 'Damp check',
    calculatorId: 'tube-rise',
    release: '0.1.0',
    settings: {
      inputs: { gravity: { mode: 'hidden' as const } },
      units: s.units,
      look: { colors: s.look.colors, font: s.look.font, corner: s.look.corner, logoUrl: null },
      cautions: '',
      leadForm: { enabled: true, fields: s.leadForm.fields, consentText: s.leadForm.consentText },
      sheet: { enabled: true },
    },
  };
}

describe('isEmbedWidget', () => {
  it('accepts what embedWidgetSchema accepts', () => {
    const w = sample();
    expect(embedWidgetSchema.safeParse(w).success).toBe(true);
    expect(isEmbedWidget(w)).toBe(true);
  });

  it.each([
    ['not an object', () => 'x'],
    ['no settings', () => ({ ...sample(), settings: undefined })],
    [
      'an unknown unit system',
      () => ({
        ...sample(),
        settings: { ...sample().settings, units: { system: 'imperial', visitorMaySwitch: true } },
      }),
    ],
    [
      'colours missing',
      () => ({
        ...sample(),
        settings: { ...sample().settings, look: { ...sample().settings.look, colors: {} } },
      }),
    ],
    [
      'a lead form without consent text',
      () => ({ ...sample(), settings: { ...sample().settings, leadForm: { enabled: true, fields: {} } } }),
    ],
    [
      'no word on the calculation sheet',
      () => ({ ...sample(), settings: { ...sample().settings, sheet: undefined } }),
    ],
    [
      'an input setting without a mode',
      () => ({ ...sample(), settings: { ...sample().settings, inputs: { gravity: {} } } }),
    ],
  ])('refuses %s', (_name, make) => {
    expect(isEmbedWidget(make())).toBe(false);
  });
});
