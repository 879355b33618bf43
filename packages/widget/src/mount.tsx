import type {
  CalculationResult,
  CalculatorCore,
  CalculatorDefinition,
  ComputedResult,
} from '@wickstone/calc-core';
import { withTexts } from '@wickstone/calc-core/join';
import type { TextsChunk } from './engine.js';
import { hydrate, render } from 'preact';
import type { MountHandle, MountOptions } from './global.js';
import type { Reporter } from './lib/reporter.js';
import { newRunId } from './lib/run-id.js';
import { App } from './ui/App.js';
import { deferredReporter, loadExtras, withExtras, type ExtrasModule } from './lazy.js';
import { setTablesFetch, type TablesModule } from './lazy-tables.js';
import { hostIn } from './first/mount.js';
import { afterFirstPaint } from './lib/paint.js';
import { restoreFocus, saveFocus } from './lib/focus.js';
import type { ViewState } from './lib/view.js';
import css from './ui/styles.css?inline';
import { adoptStyles } from './lib/sheets.js';

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

/** The first view giving way to the full widget: its state and the element it rendered into (its listeners stopped). */
export interface Handoff {
  readonly state: ViewState;
  readonly container: HTMLElement;
}

/**
 * Renders a widget into a shadow root on `element` (or on a host made inside it). Rendering again
 * into the same element updates it in place, keeping what the visitor typed. With `handoff`, it
 * takes over from the first view: the App starts from the first view's state and adopts the first
 * view's elements (Preact's `hydrate`: the markup is the same), so nothing moves, the focused control
 * keeps its focus and caret, and no keystroke is lost.
 */
export function mountWidget(
  bundle: Bundle,
  element: Element,
  first: MountOptions,
  handoff?: Handoff,
): MountHandle {
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
  let container = handoff?.container ?? shadow.querySelector<HTMLElement>('div[data-wickstone="mount"]');
  if (container === null) {
    container = document.createElement('div');
    container.setAttribute('data-wickstone', 'mount');
    shadow.append(container);
  }
  const target = container;
  target.setAttribute('data-view', 'full');

  let reporter: Reporter | null = null;
  let reporterKey = '';
  let latest = first;
  let gone = false;
  // Taking over from the first view: the App adopts its elements (same markup) rather than replacing them.
  let adopt = handoff !== undefined;
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
    const focus = adopt ? saveFocus(shadow) : null;
    (adopt ? hydrate : render)(
      <App
        widget={widget}
        calculator={calculator}
        compute={bundle.compute}
        run={run}
        apiBase={apiBase}
        reporter={reporter}
        initial={handoff?.state}
      />,
      target,
    );
    if (adopt) {
      // The focused control is the same element, caret and all; were one made afresh, focus follows it.
      restoreFocus(shadow, focus);
      adopt = false;
    }
  };
  draw(first);
  // The calculator's texts, the working, the lead form, the reporter and the font follow first
  // paint; extras already here were used above.
  const fetchTexts = bundle.texts;
  if (fetchTexts)
    afterFirstPaint(() => {
      fetchTexts().then(
        ({ texts, runCalculation }) => {
          // calc-core's own join, as its registry makes the whole calculator from the same modules.
          calculator = withTexts(bundle.calculator, texts);
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
