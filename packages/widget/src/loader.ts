// The snippet's script: one small classic script per calculator. It registers the calculator on
// the shared `window.Wickstone`, reserves the widget's place right after its tag, asks for the
// widget's settings while it fetches the runtime (the first view, shared by every widget of the
// release on the page) and this calculator's engine, each checked against the SRI hash this file
// carries, then has the runtime mount the widget (`mountEngine`). Everything else follows first
// paint, checked through a chain that starts with the runtime this file checked (see engine.ts).
// It exports nothing, so the IIFE defines no global of its own.
import { chunkLoader, installRegistry, type ChunkRegistry, type ChunkTable } from './chunks.js';
import type { EmbedWidget } from '@wickstone/contracts';
import { installGlobal, type MountHandle, type MountOptions } from './global.js';
import type { Engine } from './engine.js';
import {
  apiBaseFor,
  findOwnScript,
  insertHost,
  isPublicKey,
  PLACED_ATTR,
  releaseBaseFor,
} from './placement.js';

declare const __WICKSTONE_CALCULATOR__: string;
declare const __WICKSTONE_CALC_CORE_VERSION__: string;
/** The engine chunk of this calculator. */
declare const __WICKSTONE_ENGINE__: string;
/** The first flight's chunks (runtime, engine), with their SRI hashes and static imports. */
declare const __WICKSTONE_CHUNKS__: Record<string, ChunkTable[string]>;

const calculatorId = __WICKSTONE_CALCULATOR__;
const version = __WICKSTONE_VERSION__;
const script = findOwnScript(document, calculatorId);
const base = script && releaseBaseFor(script.src);
const g = installGlobal(window, version, {
  calculatorId,
  version,
  calcCoreVersion: __WICKSTONE_CALC_CORE_VERSION__,
  mount,
});
const table = __WICKSTONE_CHUNKS__;
const load = base ? chunkLoader(installRegistry(g as Partial<ChunkRegistry>), version, base, table) : null;
const engine = (): Promise<Engine> =>
  load ? (load(__WICKSTONE_ENGINE__) as Promise<Engine>) : Promise.reject(Error('no release folder'));

/**
 * `Wickstone.mount` for this calculator: answers at once with a handle, and renders as soon as
 * the runtime and engine are here (updates and unmounts made before then are kept in order).
 * `fail` (a snippet's own widget) has the runtime check the settings' shape first, and hears of
 * anything that keeps the widget from showing.
 */
function mount(element: Element, first: MountOptions, fail?: (why: string) => void): MountHandle {
  let latest = first;
  let handle: MountHandle | undefined;
  let gone = false;
  engine()
    .then((e) => {
      if (!gone)
        handle = e.mount(
          e,
          { load: load!, table, base, api: script && apiBaseFor(script.src, null) },
          element,
          latest,
          !!fail,
        );
    })
    .catch((err: Error) => {
      const why = err.message;
      if (fail) return fail(why);
      element.setAttribute('data-state', 'unavailable');
      console.warn('Wickstone:', why);
    });
  return {
    update(options) {
      latest = options;
      handle?.update(options);
    },
    unmount() {
      gone = true;
      handle?.unmount();
    },
  };
}

/**
 * The widget's settings: a plain GET, asked again after 1 s and 3 s when the network fails or the
 * server answers 5xx. Fewer retries than a run report (the reporter's transport follows with the
 * extras): a page the widget may not be embedded on sees a refused CORS read, which looks exactly
 * like a network failure, and asking again will not change it. Status 0: no answer at all.
 */
async function getSettings(url: string): Promise<[status: number, body: EmbedWidget | null]> {
  for (const wait of [1000, 3000, 0]) {
    let status = 0;
    let body = null;
    try {
      // A CORS request (fetch's default mode), without cookies.
      const res = await fetch(url, { credentials: 'omit' });
      status = res.status;
      body = await res.json();
    } catch {
      // no answer (asked again below), or an answer that is not JSON (status kept, body null)
    }
    if ((status && status < 500) || !wait) return [status, body];
    await new Promise((r) => setTimeout(r, wait));
  }
  return [0, null];
}

async function place(tag: HTMLScriptElement, key: string): Promise<void> {
  tag.setAttribute(PLACED_ATTR, '');
  const host = insertHost(tag, calculatorId);
  const state = (s: string): void => host.setAttribute('data-state', s);
  state('loading');
  const api = apiBaseFor(tag.src, tag.getAttribute('data-wickstone-api'));
  const unavailable = (why: string): void => {
    state('unavailable');
    // No widget is coming: give back the place the snippet held for it.
    host.style.removeProperty('min-height');
    host.style.removeProperty('--wk-held');
    console.warn(`Wickstone: widget ${key} not shown:`, why);
  };
  if (!api) return unavailable('no server');
  // The code and the settings travel at the same time; the runtime checks the settings' shape.
  engine().catch(() => 0);
  const [status, widget] = await getSettings(`${api}/api/v1/embed/widgets/${key}`);
  // The embed API's status says why: 403 not allowed on this site, 404 not live (a draft, paused
  // or unknown key); 0 no answer (a page the widget may not be on usually sees this: a refused CORS read).
  if (status !== 200) return unavailable(`HTTP ${status}`);
  if (widget?.calculatorId !== calculatorId) return unavailable(`settings for ${widget?.calculatorId}`);
  mount(host, { widget, apiBase: api }, unavailable);
}

const key = script?.getAttribute('data-wickstone-key');
if (key != null && !script!.hasAttribute(PLACED_ATTR)) {
  if (isPublicKey(key)) void place(script!, key);
  else console.warn(`Wickstone: "${key}" is not a widget key`);
}
