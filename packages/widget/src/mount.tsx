import type {
  CalculationResult,
  CalculatorCore,
  CalculatorDefinition,
  ComputedResult,
} from '@wickstone/calc-core';
import type { TextsChunk } from './engine.js';
import { render } from 'preact';
import type { MountHandle, MountOptions } from './global.js';
import type { Reporter } from './lib/reporter.js';
import { newRunId } from './lib/run-id.js';
import { App } from './ui/App.js';
import { deferredReporter, loadExtras, withExtras, type ExtrasModule } from './lazy.js';
import { setTablesFetch, type TablesModule } from './lazy-tables.js';
import { HOST_TAG } from './placement.js';
import css from './ui/styles.css?inline';
import { adoptStyles } from './lib/sheets.js';

/** Fetches the extras once the browser has painted the widget (and had a moment to spare). */
function afterFirstPaint(then: () => void): void {
  requestAnimationFrame(() => setTimeout(then, 0));
}

/** The host element to render into: `element` itself when it is one of ours, else one made inside it. */
function hostIn(element: Element, calculatorId: string): { host: HTMLElement; made: boolean } {
  if (element.localName === HOST_TAG && element instanceof HTMLElement) return { host: element, made: false };
  const existing = [...element.children].find(
    (c): c is HTMLElement => c.localName === HOST_TAG && c instanceof HTMLElement,
  );
  // Another calculator's bundle rendered here before: its runtime owns that tree, so start afresh.
  if (existing && existing.getAttribute('data-calculator') === calculatorId)
    return { host: existing, made: false };
  existing?.remove();
  const host = document.createElement(HOST_TAG);
  element.append(host);
  return { host, made: true };
}

export interface Bundle {
  /** The calculator's core; its texts follow (`texts`). A whole definition is taken as it is. */
  readonly calculator: CalculatorCore | CalculatorDefinition;
  /** The numbers only: the first result. The full run (working, input hash) comes with the texts. */
  readonly compute: (inputs: unknown) => ComputedResult;
  /** The release folder this bundle was loaded from (fonts), or null when unknown. */
  readonly releaseBase: string | null;
  /** The server the bundle came from: the default for runs and leads. */
  readonly defaultApiBase: string | null;
  /** Fetches the calculator's texts (cautions, references) and the full run; null where there is none to fetch. */
  readonly texts?: (() => Promise<TextsChunk>) | null;
  /** Fetches the extras chunk (working, lead form, run reporter, font); null where there is none to fetch. */
  readonly extras: (() => Promise<ExtrasModule>) | null;
  /** Fetches the tables chunk (table input, CSV, chart); absent for a calculator without a table input. */
  readonly tables?: (() => Promise<TablesModule>) | null;
}

/**
 * Renders a widget into a shadow root on `element` (or on a host made inside it). Rendering again
 * into the same element updates it in place, keeping what the visitor typed.
 */
export function mountWidget(bundle: Bundle, element: Element, first: MountOptions): MountHandle {
  // Until the texts arrive the calculator has no cautions or references of its own to show.
  let calculator: CalculatorDefinition = { cautions: [], references: [], ...bundle.calculator };
  // The full run (working, assumptions, input hash: the notes and the run report) follows with the texts.
  let run: ((inputs: unknown) => CalculationResult) | null = null;
  setTablesFetch(bundle.tables ?? null);
  const { host, made } = hostIn(element, calculator.id);
  host.setAttribute('data-wickstone', 'host');
  host.setAttribute('data-calculator', calculator.id);
  const shadow = host.shadowRoot ?? host.attachShadow({ mode: 'open' });
  adoptStyles(shadow, css, 'styles');
  const stopWaiting = withExtras((extras) => adoptStyles(shadow, extras.css, 'extras'));
  let container = shadow.querySelector<HTMLElement>('div[data-wickstone="mount"]');
  if (container === null) {
    container = document.createElement('div');
    container.setAttribute('data-wickstone', 'mount');
    shadow.append(container);
  }
  const target = container;

  let reporter: Reporter | null = null;
  let reporterKey = '';
  let latest = first;
  let gone = false;
  const draw = (options: MountOptions): void => {
    latest = options;
    const { widget } = options;
    if (widget.calculatorId !== calculator.id) {
      throw new Error(`Wickstone: this bundle renders "${calculator.id}", not "${widget.calculatorId}"`);
    }
    const preview = options.preview === true;
    const apiBase = preview
      ? null
      : ((options.apiBase ?? bundle.defaultApiBase)?.replace(/\/+$/, '') ?? null);
    if (!preview && apiBase === null) throw new Error('Wickstone: apiBase is needed outside preview');
    const key = `${apiBase ?? ''} ${widget.publicKey}`;
    if (apiBase === null) reporter = null;
    else if (reporter === null || key !== reporterKey) {
      const args = {
        apiBase,
        publicKey: widget.publicKey,
        href: () => location.href,
        // The release this script belongs to: the server recomputes the run with its engine.
        release: __WICKSTONE_VERSION__,
      };
      reporter = deferredReporter((extras) => extras.createReporter(args), newRunId);
    }
    reporterKey = key;
    const releaseBase = bundle.releaseBase;
    // A shipped font is fetched with the extras, after first paint, and used from a still moment
    // on (the visitor's Calculate, or the widget out of view); until then the fallback stack shows.
    if (widget.settings.look.font === 'manrope' && releaseBase !== null)
      withExtras((extras) => extras.registerManrope(document.fonts, releaseBase, host, shadow));
    host.setAttribute('data-mode', preview ? 'preview' : 'live');
    host.setAttribute('data-state', 'ready');
    render(
      <App
        widget={widget}
        calculator={calculator}
        compute={bundle.compute}
        run={run}
        apiBase={apiBase}
        reporter={reporter}
      />,
      target,
    );
  };
  draw(first);
  // The calculator's texts, the working, the lead form, the reporter and the font follow first
  // paint; extras already here were used above.
  const fetchTexts = bundle.texts;
  if (fetchTexts)
    afterFirstPaint(() => {
      fetchTexts().then(
        ({ texts, runCalculation }) => {
          calculator = { ...calculator, ...texts };
          // The core, as the engine computes with: the liquid's hazards, the calculator's cautions from the texts.
          const core = bundle.calculator;
          run = (inputs) => runCalculation(core, inputs);
          if (!gone) draw(latest);
        },
        (err: unknown) =>
          console.warn('Wickstone: the cautions, references and working could not be loaded', err),
      );
    });
  const fetchExtras = bundle.extras;
  if (fetchExtras)
    afterFirstPaint(() => {
      loadExtras(fetchExtras).catch((err: unknown) =>
        console.warn('Wickstone: the working and lead form could not be loaded', err),
      );
    });
  return {
    update: draw,
    unmount() {
      gone = true;
      stopWaiting();
      render(null, target);
      if (made) host.remove();
    },
  };
}
