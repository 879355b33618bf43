import { resolveInputs, type CalculatorDefinition } from '@wickstone/calc-core';
import type { WidgetSettings } from '@wickstone/contracts';

// The embed snippet a firm pastes: a placeholder that holds the widget's place, then the script.
// The placeholder is in the page from its first paint, so nothing on the page moves when the
// widget appears in it (the script is async and may arrive after the page has been drawn).

/**
 * Heights (CSS px) of the widget's parts when it is narrow (one field a row, titles and labels
 * wrapping), so the space held is enough at every width; on a wide page the widget's card fills
 * what the form leaves and the result later uses it. Taken from the heights Chromium drew on the
 * demo page (tests/bench/first-flight.ts prints shown/held heights and the layout shift left).
 */
const HEAD = 440;
const FIELD = 100;
/**
 * A table input (absorption readings): label, help, the scroll box of rows (at most 22em high), its
 * buttons and note, as drawn 390 px wide with the default eight rows (567 px). The widget's own
 * place holds the same from the start (styles.css, `.table-slot`), so its arrival moves nothing.
 */
const TABLE = 570;
const ACTIONS = 100;

/** The inputs a visitor sees before touching anything: not hidden, and applying with the defaults. */
export function visibleInputs(
  calc: CalculatorDefinition,
  settings: WidgetSettings['inputs'],
): CalculatorDefinition['inputs'] {
  const shown = calc.inputs.filter((i) => settings[i.id]?.mode !== 'hidden');
  const defaults: Record<string, unknown> = {};
  for (const i of calc.inputs) {
    const d = settings[i.id]?.default;
    if (d !== undefined) defaults[i.id] = d;
  }
  try {
    const applying = resolveInputs(calc, defaults);
    return shown.filter((i) => Object.hasOwn(applying, i.id));
  } catch {
    // A firm default calc-core refuses: the widget will say so; count what applies unconditionally.
    return shown.filter((i) => !i.appliesWhen);
  }
}

/** The height to hold for a widget before its script has run: a table input holds a table's height. */
export function reservedHeight(calc: CalculatorDefinition, settings: WidgetSettings): number {
  const inputs = visibleInputs(calc, settings.inputs);
  return HEAD + inputs.reduce((h, i) => h + (i.kind === 'table' ? TABLE : FIELD), 0) + ACTIONS;
}

const attr = (s: string) => s.replace(/&/g, '&amp;').replace(/"/g, '&quot;').replace(/</g, '&lt;');

export function embedSnippet(args: {
  url: string;
  integrity: string;
  publicKey: string;
  calculatorId: string;
  height: number;
}): string {
  return (
    `<wickstone-widget data-calculator="${attr(args.calculatorId)}" style="display:block;min-height:${args.height}px;--wk-held:${args.height}px"></wickstone-widget>\n` +
    `<script async src="${attr(args.url)}" integrity="${attr(args.integrity)}" crossorigin="anonymous" ` +
    `data-wickstone-key="${attr(args.publicKey)}"></script>`
  );
}

/** Stands in a snippet for the nonce the firm's server makes for each page it sends. */
export const NONCE_PLACEHOLDER = '{{csp-nonce}}';

/**
 * The three ways to paste a widget: `async` (the default snippet: the page never waits for it),
 * `plain` (runs where it stands, the page waits for it) and `nonce`, for a site whose
 * Content-Security-Policy allows scripts by nonce: the script carries the page's nonce, and the
 * placeholder has no inline style (a strict `style-src` refuses style attributes), so the held
 * height goes in the site's own stylesheet (`heldCss`).
 */
export function embedVariants(args: Parameters<typeof embedSnippet>[0]): {
  plain: string;
  async: string;
  nonce: string;
  heldCss: string;
} {
  const async = embedSnippet(args);
  const script = (extra: string) =>
    `<script${extra} src="${attr(args.url)}" integrity="${attr(args.integrity)}" crossorigin="anonymous" ` +
    `data-wickstone-key="${attr(args.publicKey)}"></script>`;
  const bare = `<wickstone-widget data-calculator="${attr(args.calculatorId)}"></wickstone-widget>\n`;
  return {
    async,
    plain: async.replace('<script async ', '<script '),
    nonce: bare + script(` async nonce="${NONCE_PLACEHOLDER}"`),
    heldCss: `wickstone-widget[data-calculator="${args.calculatorId}"] { display: block; min-height: ${args.height}px; }`,
  };
}

/**
 * What a firm's Content-Security-Policy must allow for the widget, from what the loader loads: its
 * loader and chunks are scripts from the app (`script-src`, by nonce for the snippet's own tag); it
 * fetches its settings and sends runs, leads and sheet requests to the embed API (`connect-src`);
 * it loads the Manrope face from the release folder with the FontFace API (`font-src`); a firm's
 * logo is an image from the embed API (`img-src`). Its styles are constructed style sheets in its
 * shadow root, which `style-src` does not govern. tests/e2e/csp.test.ts runs a widget under exactly
 * this policy in Chromium and fails on any violation.
 */
export function embedCsp(appOrigin: string): { directive: string; sources: string[] }[] {
  return [
    { directive: 'script-src', sources: [`'nonce-${NONCE_PLACEHOLDER}'`, appOrigin] },
    { directive: 'connect-src', sources: [appOrigin] },
    { directive: 'font-src', sources: [appOrigin] },
    { directive: 'img-src', sources: [appOrigin] },
  ];
}
