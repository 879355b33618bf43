// The first flight's `mount`: the first view (`view.ts`) into the widget's shadow root at once, then,
// after first paint, the full widget (Preact, the `app` chunk) takes over with the first view's
// state. Until then, and if the full widget never arrives, the first view is the widget.
import type { CalculatorCore, CalculatorDefinition, ComputedResult } from '@wickstone/calc-core';
import type { Bundle } from '../mount.js';
import type { MountHandle, MountOptions } from '../global.js';
import { afterFirstPaint } from '../lib/paint.js';
import { adoptStyles } from '../lib/sheets.js';
import { isEmbedWidget } from '../lib/shape.js';
import { HOST_TAG } from '../placement.js';
import css from '../ui/styles.css?inline';
import { renderFirstView, type FirstView } from './view.js';

/** What the full widget's chunk exports. */
export interface AppChunk {
  readonly mountWidget: typeof import('../mount.js').mountWidget;
}

export interface FirstBundle extends Bundle {
  /** Fetches the full widget (Preact, the whole App); null where there is none to fetch (it never takes over). */
  readonly app: (() => Promise<AppChunk>) | null;
  /** The settings came from the embed API (a snippet's widget): check their shape before drawing anything. */
  readonly checkSettings?: boolean;
}

/** The host element to render into: `element` itself when it is one of ours, else one made inside it. */
export function hostIn(element: Element, calculatorId: string): { host: HTMLElement; made: boolean } {
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

/**
 * Renders the first view of a widget into a shadow root on `element` (or on a host made inside
 * it) and hands it to the full widget after first paint: same markup, same state, same focus.
 */
export function mountFirst(bundle: FirstBundle, element: Element, first: MountOptions): MountHandle {
  // A malformed answer must not break the page: the loader gives the widget's place back instead.
  if (bundle.checkSettings && !isEmbedWidget(first.widget)) throw new Error('malformed settings');
  const core: CalculatorCore | CalculatorDefinition = bundle.calculator;
  // The first view has no cautions or references of its own to show: they follow with the texts.
  const calculator: CalculatorDefinition = { cautions: [], references: [], ...core };
  const { host, made } = hostIn(element, calculator.id);
  host.setAttribute('data-wickstone', 'host');
  host.setAttribute('data-calculator', calculator.id);
  const shadow = host.shadowRoot ?? host.attachShadow({ mode: 'open' });
  adoptStyles(shadow, css, 'styles');
  let container = shadow.querySelector<HTMLElement>('div[data-wickstone="mount"]');
  if (container === null) {
    container = document.createElement('div');
    container.setAttribute('data-wickstone', 'mount');
    shadow.append(container);
  }
  const target = container;
  // Which view is showing (tests and support read it): the full widget's container says `full`.
  target.setAttribute('data-view', 'first');
  let latest = first;
  let view: FirstView | null = null;
  let full: MountHandle | null = null;
  let gone = false;

  const draw = (options: MountOptions): void => {
    latest = options;
    const { widget } = options;
    if (widget.calculatorId !== calculator.id)
      throw new Error(`Wickstone: this bundle renders "${calculator.id}", not "${widget.calculatorId}"`);
    const preview = options.preview === true;
    const apiBase = preview
      ? null
      : ((options.apiBase ?? bundle.defaultApiBase)?.replace(/\/+$/, '') ?? null);
    if (!preview && apiBase === null) throw new Error('Wickstone: apiBase is needed outside preview');
    host.setAttribute('data-mode', preview ? 'preview' : 'live');
    host.setAttribute('data-state', 'ready');
    const compute: (inputs: unknown) => ComputedResult = bundle.compute;
    view = renderFirstView(target, { widget, calculator, compute, apiBase });
  };
  draw(first);

  const fetchApp = bundle.app;
  if (fetchApp)
    afterFirstPaint(() => {
      // The texts and extras travel beside the full widget rather than after it.
      bundle.texts?.().catch(() => undefined);
      bundle.extras?.().catch(() => undefined);
      fetchApp().then(
        (app) => {
          if (gone || view === null) return;
          const { app: _app, ...rest } = bundle;
          view.stop();
          full = app.mountWidget(rest, host, latest, { state: view.state(), container: target });
          view = null;
        },
        (err: unknown) =>
          console.warn('Wickstone: the full widget could not be loaded; the first view stays', err),
      );
    });

  return {
    update(options) {
      if (full) full.update(options);
      else draw(options);
    },
    unmount() {
      gone = true;
      if (full) full.unmount();
      else target.replaceChildren();
      if (made) host.remove();
    },
  };
}
