// The snippet's script: one small classic script per calculator. It registers the calculator on
// the shared `window.Wickstone`, reserves the widget's place right after its tag, asks for the
// widget's settings while it fetches the runtime (the first view, shared by every widget of the
// release on the page) and this calculator's engine, each checked against the SRI hash this file
// carries, then renders the first view. Everything else (the full widget, the calculator's cautions
// and references, working, the lead form, the run reporter, fonts) is fetched after first paint,
// each checked against the hash the engine carries for it (a chain: the engine's own was checked).
// It exports nothing, so the IIFE defines no global of its own.
import { chunkLoader, installRegistry, type ChunkRegistry, type ChunkTable } from './chunks.js';
import type { EmbedWidget } from '@wickstone/contracts';
import { installGlobal, type MountHandle, type MountOptions } from './global.js';
import type { Engine, TextsChunk } from './engine.js';
import type { AppChunk } from './first/mount.js';
import type { ExtrasModule } from './lazy.js';
import type { TablesModule } from './lazy-tables.js';
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
/** This calculator's texts chunk (cautions, references): follows first paint. */
declare const __WICKSTONE_TEXTS__: string;
/** The full widget (Preact, the App): follows first paint and takes over from the first view. */
declare const __WICKSTONE_APP__: string;
/** The extras chunk: what follows first paint. */
declare const __WICKSTONE_EXTRAS__: string;
/** The tables chunk (table input, CSV, chart) for a calculator with a table input, else null. */
declare const __WICKSTONE_TABLES__: string | null;
/** The first flight's chunks (runtime, engine), with their SRI hashes and static imports; the engine carries the rest. */
declare const __WICKSTONE_CHUNKS__: ChunkTable;

const calculatorId = __WICKSTONE_CALCULATOR__;
const version = __WICKSTONE_VERSION__;
const script = findOwnScript(document, calculatorId);
const releaseBase = script ? releaseBaseFor(script.src) : null;
const g = installGlobal(window, version, {
  calculatorId,
  version,
  calcCoreVersion: __WICKSTONE_CALC_CORE_VERSION__,
  mount,
}) as ReturnType<typeof installGlobal> & Partial<ChunkRegistry>;
const table: Record<string, ChunkTable[string]> = { ...__WICKSTONE_CHUNKS__ };
const load = releaseBase === null ? null : chunkLoader(installRegistry(g), version, releaseBase, table);

function engine(): Promise<Engine> {
  if (load === null) return Promise.reject(new Error('Wickstone: the release folder is unknown'));
  return (load(__WICKSTONE_ENGINE__) as Promise<Engine>).then((e) => {
    // The later chunks' hashes, from the engine the browser has just checked against ours.
    for (const [file, entry] of Object.entries(e.chunks)) table[file] ??= entry;
    return e;
  });
}

/**
 * `Wickstone.mount` for this calculator: answers at once with a handle, and renders as soon as
 * the runtime and engine are here (updates and unmounts made before then are kept in order).
 * `fail` (a snippet's own widget) has the runtime check the settings' shape first, and hears of
 * anything that keeps the widget from showing.
 */
function mount(element: Element, first: MountOptions, fail?: (why: string) => void): MountHandle {
  let latest = first;
  let handle: MountHandle | null = null;
  let gone = false;
  engine()
    .then((e) => {
      if (gone) return;
      // The engine came through `load`, so there is one.
      const later =
        <T>(file: string) =>
        (): Promise<T> =>
          load!(file) as Promise<T>;
      handle = e.mountFirst(
        {
          calculator: e.calculator,
          compute: e.compute,
          releaseBase,
          defaultApiBase: script ? apiBaseFor(script.src, null) : null,
          app: later<AppChunk>(__WICKSTONE_APP__),
          texts: later<TextsChunk>(__WICKSTONE_TEXTS__),
          extras: later<ExtrasModule>(__WICKSTONE_EXTRAS__),
          tables: __WICKSTONE_TABLES__ === null ? null : later<TablesModule>(__WICKSTONE_TABLES__),
          checkSettings: fail !== undefined,
        },
        element,
        latest,
      );
    })
    .catch((err: unknown) => {
      const why = err instanceof Error ? err.message : String(err);
      if (fail) return fail(why);
      element.setAttribute('data-state', 'unavailable');
      console.warn(`Wickstone: ${why}`);
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
async function getSettings(url: string): Promise<{ status: number; body: unknown }> {
  for (const wait of [1000, 3000, -1]) {
    let status = 0;
    let body: unknown = null;
    try {
      const res = await fetch(url, { credentials: 'omit', mode: 'cors' });
      status = res.status;
      body = await res.json().catch(() => null);
    } catch {
      // no answer: asked again below
    }
    if ((status > 0 && status < 500) || wait < 0) return { status, body };
    await new Promise((r) => setTimeout(r, wait));
  }
  return { status: 0, body: null };
}

async function place(tag: HTMLScriptElement, key: string): Promise<void> {
  tag.setAttribute(PLACED_ATTR, '');
  const host = insertHost(tag, calculatorId);
  host.setAttribute('data-state', 'loading');
  const apiBase = apiBaseFor(tag.src, tag.getAttribute('data-wickstone-api'));
  const unavailable = (why: string): void => {
    host.setAttribute('data-state', 'unavailable');
    // No widget is coming: give back the place the snippet held for it.
    host.style.removeProperty('min-height');
    host.style.removeProperty('--wk-held');
    console.warn(`Wickstone: widget ${key} not shown: ${why}`);
  };
  if (apiBase === null) return unavailable('no server');
  // The code and the settings travel at the same time; the runtime checks the settings' shape.
  engine().catch(() => undefined);
  const { status, body } = await getSettings(`${apiBase}/api/v1/embed/widgets/${key}`);
  const widget = body as EmbedWidget | null;
  if (status !== 200 || widget?.calculatorId !== calculatorId)
    return unavailable(
      status === 403
        ? 'not allowed on this site'
        : status === 404
          ? 'not live (draft, paused or unknown key)'
          : status === 200
            ? `settings for ${String(widget?.calculatorId)}`
            : `server answered ${status || 'nothing'}`,
    );
  mount(host, { widget, apiBase }, unavailable);
}

const key = script?.getAttribute('data-wickstone-key') ?? undefined;
if (script && key !== undefined && !script.hasAttribute(PLACED_ATTR)) {
  if (isPublicKey(key)) void place(script, key);
  else console.warn(`Wickstone: "${key}" is not a widget key`);
}
