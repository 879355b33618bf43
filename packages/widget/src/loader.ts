// The bundle's entry: one classic script per calculator. It registers itself on the shared
// `window.Wickstone` and, when its script tag carries a widget key, places that widget right after
// the tag. It exports nothing, so the IIFE defines no global of its own.
import { VERSION as CALC_CORE_VERSION } from '@wickstone/calc-core';
import { calculator, run } from 'virtual:wickstone-calculator';
import { installGlobal } from './global.js';
import { isEmbedWidget } from './lib/shape.js';
import { request } from './lib/transport.js';
import { HOST_TAG, mountWidget, type Bundle } from './mount.js';
import {
  apiBaseFor,
  findOwnScript,
  insertHost,
  isPublicKey,
  PLACED_ATTR,
  releaseBaseFor,
} from './placement.js';

const script = findOwnScript(document, calculator.id);
const bundle: Bundle = {
  calculator,
  run,
  releaseBase: script ? releaseBaseFor(script.src) : null,
  defaultApiBase: script ? apiBaseFor(script.src, null) : null,
};

installGlobal(window, __WICKSTONE_VERSION__, {
  calculatorId: calculator.id,
  version: __WICKSTONE_VERSION__,
  calcCoreVersion: CALC_CORE_VERSION,
  mount: (element, options) => mountWidget(bundle, element, options),
});

async function place(tag: HTMLScriptElement, key: string): Promise<void> {
  tag.setAttribute(PLACED_ATTR, '');
  const host = document.createElement(HOST_TAG);
  host.setAttribute('data-wickstone', 'host');
  host.setAttribute('data-calculator', calculator.id);
  host.setAttribute('data-state', 'loading');
  insertHost(tag, host);
  const apiBase = apiBaseFor(tag.src, tag.getAttribute('data-wickstone-api'));
  const unavailable = (why: string): void => {
    host.setAttribute('data-state', 'unavailable');
    console.warn(`Wickstone: widget ${key} is not shown: ${why}`);
  };
  if (apiBase === null) return unavailable('no server to ask for its settings');
  // Fewer retries than a run report: a page the widget may not be embedded on sees a refused
  // CORS read, which looks exactly like a network failure, and asking again will not change it.
  const reply = await request(`${apiBase}/api/v1/embed/widgets/${key}`, undefined, { delays: [1000, 3000] });
  if (reply.status === 403) return unavailable('this site is not one the widget may be embedded on');
  if (reply.status === 404) return unavailable('the widget is not live (draft, paused or unknown key)');
  if (reply.status !== 200 || !isEmbedWidget(reply.body))
    return unavailable(`the server answered ${reply.status || 'nothing'}`);
  if (reply.body.calculatorId !== calculator.id)
    return unavailable(`it is a ${reply.body.calculatorId} widget, not ${calculator.id}`);
  mountWidget(bundle, host, { widget: reply.body, apiBase });
}

const key = script?.getAttribute('data-wickstone-key') ?? undefined;
if (script && key !== undefined && !script.hasAttribute(PLACED_ATTR)) {
  if (isPublicKey(key)) void place(script, key);
  else console.warn(`Wickstone: "${key}" is not a widget key`);
}
