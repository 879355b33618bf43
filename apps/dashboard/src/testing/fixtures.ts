import { defaultWidgetSettings, type Widget } from '@wickstone/contracts';

// Test data only: imported by tests, never by the app, so the bundle never holds it.

/** A saved tube-rise widget of an invented firm, with the calculator's default settings. */
export function sampleWidget(over: Partial<Widget> = {}): Widget {
  return {
    id: 7,
    publicKey: 'wk_abcdefghij0123456789',
    name: 'Rising damp check',
    calculatorId: 'tube-rise',
    status: 'draft',
    allowedOrigins: [],
    settings: defaultWidgetSettings(),
    release: '0.1.0',
    releasePin: null,
    logoUrl: null,
    embed: {
      scriptUrl: '',
      integrity: '',
      snippet: '',
      variants: { plain: '', async: '', nonce: '', heldCss: '' },
      csp: [],
    },
    previousKey: null,
    nextKeyKind: 'older',
    createdAt: '2026-12-01T10:00:00.000Z',
    updatedAt: '2026-12-01T10:00:00.000Z',
    ...over,
  };
}
