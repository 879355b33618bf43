// The runtime's side of a calculator's engine: what the engine chunk exports, and how a widget is
// mounted once the loader has the runtime and the engine (both checked against the hashes the
// loader carries). The chunks that follow first paint are checked through a chain: the runtime
// carries the app chunk's hash (the build writes it in place of `__WICKSTONE_APP_CHUNK__`), and
// the app chunk carries the hash of every later chunk of the release (its `later`), so no loader
// or engine carries those.
import type {
  CalculationResult,
  CalculatorCore,
  CalculatorTexts,
  ComputedResult,
} from '@wickstone/calc-core';
import type { ChunkTable } from './chunks.js';
import type { MountHandle, MountOptions } from './global.js';
import { mountFirst, type AppChunk } from './first/mount.js';
import type { ExtrasModule } from './lazy.js';
import type { TablesModule } from './lazy-tables.js';

/** The app chunk's file, its SRI hash and the chunks it imports: one per release, in the runtime. */
export type AppEntry = readonly [file: string, integrity: string, imports: readonly string[]];
declare const __WICKSTONE_APP_CHUNK__: AppEntry;

/** What the app chunk carries for the chunks after it (the build adds it to the app's exports). */
export interface LaterChunks {
  /** Every later chunk of the release but the app: SRI hash and static imports. */
  readonly chunks: ChunkTable;
  /** Each calculator's texts chunk. */
  readonly texts: Readonly<Record<string, string>>;
  readonly extras: string;
  readonly tables: string;
}

/** What the loader hands an engine: its chunk loader, its table (which the chain extends), where it came from. */
export interface LoaderContext {
  readonly load: (file: string) => Promise<unknown>;
  readonly table: Record<string, ChunkTable[string]>;
  /** The release folder (fonts), or null when unknown. */
  readonly base: string | null;
  /** The server the loader came from: the default for runs and leads. */
  readonly api: string | null;
}

/** How a widget fetches the chunks after first paint (what `mountFirst` and the full widget call). */
export interface Later {
  readonly app: () => Promise<AppChunk & { later: LaterChunks }>;
  readonly texts: () => Promise<TextsChunk>;
  readonly extras: () => Promise<ExtrasModule>;
  /** Null for a calculator without a table input. */
  readonly tables: (() => Promise<TablesModule>) | null;
}

/**
 * The chain after first paint for one calculator: the app chunk with the hash the runtime carries
 * (`app`), then the texts, extras and tables with the hashes the app chunk carries, each added to
 * the loader's `table` (an entry already there is kept) before `load` is asked for it.
 */
export function laterChunks(
  load: LoaderContext['load'],
  table: LoaderContext['table'],
  calculator: Pick<CalculatorCore, 'id' | 'inputs'>,
  app: AppEntry = __WICKSTONE_APP_CHUNK__,
): Later {
  table[app[0]] ??= [app[1], app[2]];
  const fetchApp = (): Promise<AppChunk & { later: LaterChunks }> =>
    (load(app[0]) as Promise<AppChunk & { later: LaterChunks }>).then((a) => {
      for (const [file, entry] of Object.entries(a.later.chunks)) table[file] ??= entry;
      return a;
    });
  const after =
    <T>(pick: (later: LaterChunks) => string | undefined) =>
    (): Promise<T> =>
      fetchApp().then((a) => load(pick(a.later) ?? '') as Promise<T>);
  return {
    app: fetchApp,
    texts: after((l) => l.texts[calculator.id]),
    extras: after((l) => l.extras),
    tables: calculator.inputs.some((i) => i.kind === 'table') ? after((l) => l.tables) : null,
  };
}

/**
 * Mounts `engine`'s calculator into `element`: the first view at once, and the chunks after first
 * paint through `laterChunks`. `checkSettings`: the settings came from the embed API (see `mountFirst`).
 */
export function mountEngine(
  { calculator, compute }: Pick<Engine, 'calculator' | 'compute'>,
  { load, table, base, api }: LoaderContext,
  element: Element,
  options: MountOptions,
  checkSettings: boolean,
): MountHandle {
  return mountFirst(
    {
      calculator,
      compute,
      releaseBase: base,
      defaultApiBase: api,
      ...laterChunks(load, table, calculator),
      checkSettings,
    },
    element,
    options,
  );
}

/**
 * What a calculator's engine chunk exports (the build makes one per calculator from its calc-core
 * subpath): the calculator's core (no texts), its `compute`, and from the shared runtime chunk the
 * first view's `mountFirst` and `mount` (`mountEngine`), so loading the engine loads the runtime
 * once for every widget of the release.
 */
export interface Engine {
  readonly calculator: CalculatorCore;
  /** The numbers only (calc-core's `compute`): what the first result shows. */
  readonly compute: (inputs: unknown) => ComputedResult;
  readonly mountFirst: typeof mountFirst;
  readonly mount: typeof mountEngine;
}

/**
 * What a calculator's texts chunk exports (from calc-core's `calculators/<id>.texts`), fetched after
 * first paint: its cautions and references, and calc-core's full run (working, assumptions, input
 * hash), which the working and the run report need and the first result does not.
 */
export interface TextsChunk {
  readonly texts: CalculatorTexts;
  readonly runCalculation: (def: CalculatorCore, inputs: unknown) => CalculationResult;
}
