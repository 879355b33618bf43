import type { EmbedWidget } from '@wickstone/contracts';

type Look = EmbedWidget['settings']['look'];

/** The family name the bundle registers Manrope under; unlikely to clash with a page's own fonts. */
export const MANROPE_FAMILY = 'Wickstone Manrope';

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

const HEX = /^#[0-9a-fA-F]{6}$/;

/**
 * The CSS custom properties a widget's look sets on its root. Colours are taken only as #rrggbb
 * (what the dashboard saves, checked there for contrast); anything else falls back to the
 * product's own pair rather than reaching the style sheet.
 */
export function lookVariables(look: Look): Record<string, string> {
  const c = look.colors;
  // The product's own pairs where a colour is unusable.
  const pick = (value: string, fallback: string): string => (HEX.test(value) ? value : fallback);
  const [panel, control] = CORNERS[look.corner] ?? CORNERS.soft;
  return {
    '--wk-bg': pick(c.background, '#ffffff'),
    '--wk-fg': pick(c.text, '#1b2a30'),
    '--wk-accent': pick(c.primary, '#1d4e5f'),
    '--wk-on-accent': pick(c.primaryText, '#ffffff'),
    '--wk-r': panel,
    '--wk-rc': control,
    '--wk-font': FONT_STACKS[look.font] ?? FONT_STACKS['system-sans'],
  };
}
