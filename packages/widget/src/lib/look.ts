import type { EmbedWidget } from '@wickstone/contracts';

type Look = EmbedWidget['settings']['look'];

/** The family name the bundle registers Manrope under; unlikely to clash with a page's own fonts. */
export const MANROPE_FAMILY = 'Wickstone Manrope';

/** The Manrope files shipped in every release folder, by weight. */
export const MANROPE_FILES: Readonly<Record<'400' | '600' | '700', string>> = {
  '400': 'manrope-latin-400-normal.woff2',
  '600': 'manrope-latin-600-normal.woff2',
  '700': 'manrope-latin-700-normal.woff2',
};

const FONT_STACKS: Readonly<Record<Look['font'], string>> = {
  manrope: `'${MANROPE_FAMILY}', ui-sans-serif, system-ui, sans-serif`,
  'system-sans':
    "ui-sans-serif, system-ui, -apple-system, 'Segoe UI', Roboto, 'Helvetica Neue', Arial, sans-serif",
  'system-serif': "ui-serif, Georgia, Cambria, 'Times New Roman', Times, serif",
};

/** Panel and control radii for each corner style. */
const CORNERS: Readonly<Record<Look['corner'], readonly [panel: string, control: string]>> = {
  square: ['0px', '0px'],
  soft: ['8px', '5px'],
  round: ['18px', '12px'],
};

const FALLBACK = {
  background: '#ffffff',
  text: '#1b2a30',
  primary: '#1d4e5f',
  primaryText: '#ffffff',
} as const;
const HEX = /^#[0-9a-fA-F]{6}$/;

/**
 * The CSS custom properties a widget's look sets on its root. Colours are taken only as #rrggbb
 * (what the dashboard saves, checked there for contrast); anything else falls back to the
 * product's own pair rather than reaching the style sheet.
 */
export function lookVariables(look: Look): Record<string, string> {
  const c = look.colors;
  const pick = (value: string, fallback: string): string => (HEX.test(value) ? value : fallback);
  const [panel, control] = CORNERS[look.corner] ?? CORNERS.soft;
  return {
    '--wk-bg': pick(c.background, FALLBACK.background),
    '--wk-fg': pick(c.text, FALLBACK.text),
    '--wk-accent': pick(c.primary, FALLBACK.primary),
    '--wk-on-accent': pick(c.primaryText, FALLBACK.primaryText),
    '--wk-r': panel,
    '--wk-rc': control,
    '--wk-font': FONT_STACKS[look.font] ?? FONT_STACKS['system-sans'],
  };
}

/**
 * Registers Manrope with the document's FontFaceSet (a shadow tree uses the document's fonts), once
 * per document whichever bundles ask: no style element is put into the page. The faces load only
 * when text needs them.
 * @param releaseBase the release folder's URL, ending in `/`
 */
export function registerManrope(fonts: FontFaceSet, releaseBase: string): void {
  for (const face of fonts) if (face.family.replace(/["']/g, '') === MANROPE_FAMILY) return;
  for (const [weight, file] of Object.entries(MANROPE_FILES)) {
    const face = new FontFace(MANROPE_FAMILY, `url(${JSON.stringify(releaseBase + file)}) format("woff2")`, {
      weight,
      style: 'normal',
      display: 'swap',
    });
    fonts.add(face);
  }
}
