// Loads the release's chunks as classic scripts, each with its Subresource Integrity hash, and
// links them. The build turns every chunk into `Wickstone._d("<version>/<file>", factory)`: the
// factory gets a `require` for the chunks it imports (already loaded when it runs). The registry lives on the shared `Wickstone` object, so every
// loader of a release on the page fetches and runs a chunk once.

/** A chunk of the release: its SRI hash and the chunks it imports statically. */
export type ChunkTable = Readonly<Record<string, readonly [integrity: string, imports: readonly string[]]>>;

/** What a chunk's factory receives: the exports of a chunk it imports. */
export type ChunkRequire = (file: string) => unknown;

type Factory = (require: ChunkRequire) => unknown;

interface Slot {
  /** The factory, once the chunk's script ran. */
  f?: Factory;
  /** The exports, once the factory ran. */
  e?: unknown;
  /** The load of the chunk and everything it imports. */
  p?: Promise<unknown>;
}

export interface ChunkRegistry {
  /** Called by each chunk's script. */
  _d(key: string, factory: Factory): void;
  /** Slots by `<version>/<file>`. */
  _c: Record<string, Slot>;
}

/** Makes `_d` and `_c` on the shared object when no loader has yet. */
export function installRegistry(host: Partial<ChunkRegistry>): ChunkRegistry {
  host._c ??= Object.create(null) as Record<string, Slot>;
  const slots = host._c;
  host._d ??= (key, factory) => {
    (slots[key] ??= {}).f = factory;
  };
  return host as ChunkRegistry;
}

/**
 * A loader for one release: `load(file)` fetches the chunk with `integrity` set (a changed byte
 * and the browser refuses to run it), with its imports in parallel, then runs them in order.
 */
export function chunkLoader(
  registry: ChunkRegistry,
  version: string,
  base: string,
  table: ChunkTable,
  doc: Document = document,
): (file: string) => Promise<unknown> {
  const slot = (file: string): Slot => (registry._c[`${version}/${file}`] ??= {});
  const run = (file: string): unknown => {
    const s = slot(file);
    // Its script ran (loaded, integrity checked) and so registered its factory.
    if (!('e' in s)) s.e = s.f!(run);
    return s.e;
  };
  const load = (file: string): Promise<unknown> => {
    const s = slot(file);
    const entry = table[file];
    return (s.p ??= Promise.all([
      // A chunk another file registered (an engine carries the chunks only engines share) is not fetched.
      s.f ??
        new Promise((resolve, reject) => {
          if (!entry) throw Error(`no chunk ${file}`);
          const tag = doc.createElement('script');
          tag.src = base + file;
          tag.integrity = entry[0];
          tag.crossOrigin = 'anonymous';
          tag.onload = resolve;
          tag.onerror = () => {
            tag.remove();
            reject(Error(`${tag.src} failed to load or its integrity check`));
          };
          doc.head.append(tag);
        }),
      ...(entry?.[1] ?? []).map(load),
    ])
      .then(() => run(file))
      .catch((err: unknown) => {
        // A failed load is forgotten, so a later mount asks again.
        delete s.p;
        throw err;
      }));
  };
  return load;
}
