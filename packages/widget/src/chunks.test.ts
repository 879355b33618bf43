import { describe, expect, it } from 'vitest';
import { chunkLoader, installRegistry, type ChunkRegistry, type ChunkTable } from './chunks.js';

const BASE = 'https://app.wickstone.example/releases/0.2.0/';

const table: ChunkTable = {
  'runtime-a.js': ['sha384-runtime', []],
  'shared-b.js': ['sha384-shared', ['runtime-a.js']],
  'engine-c.js': ['sha384-engine', ['runtime-a.js', 'shared-b.js']],
};

interface FakeScript {
  src: string;
  integrity: string;
  crossOrigin: string | null;
  onload: (() => void) | null;
  onerror: (() => void) | null;
  remove(): void;
}

/**
 * A document whose <script> elements "run" the chunk served at their URL, as a browser would: the
 * body registers itself, then load fires; a body whose hash is not the tag's integrity is refused.
 */
function fakePage(served: Record<string, { hash: string; body: (g: ChunkRegistry) => void }>) {
  const g = installRegistry({});
  const added: FakeScript[] = [];
  const doc = {
    createElement: () =>
      ({ src: '', integrity: '', crossOrigin: null, onload: null, onerror: null, remove() {} }) as FakeScript,
    head: {
      append(s: FakeScript) {
        added.push(s);
        const file = served[s.src.slice(BASE.length)];
        setTimeout(() => {
          if (!file || file.hash !== s.integrity) return s.onerror?.();
          file.body(g);
          s.onload?.();
        }, 0);
      },
    },
  } as unknown as Document;
  return { g, doc, added };
}

const chunks = (order: string[]) => ({
  'runtime-a.js': {
    hash: 'sha384-runtime',
    body: (g: ChunkRegistry) =>
      g._d('0.2.0/runtime-a.js', () => {
        order.push('runtime');
        return { mount: 'the runtime' };
      }),
  },
  'shared-b.js': {
    hash: 'sha384-shared',
    body: (g: ChunkRegistry) =>
      g._d('0.2.0/shared-b.js', (r) => {
        order.push('shared');
        return { runtime: (r('runtime-a.js') as { mount: string }).mount };
      }),
  },
  'engine-c.js': {
    hash: 'sha384-engine',
    body: (g: ChunkRegistry) =>
      g._d('0.2.0/engine-c.js', (r) => {
        order.push('engine');
        return { shared: r('shared-b.js'), calculator: 'tube-rise' };
      }),
  },
});

describe('chunk loader', () => {
  it('fetches a chunk and what it imports, each once and with its hash, and runs them in order', async () => {
    const order: string[] = [];
    const { g, doc, added } = fakePage(chunks(order));
    const load = chunkLoader(g, '0.2.0', BASE, table, doc);
    const other = chunkLoader(g, '0.2.0', BASE, table, doc); // a second widget's loader
    const [a, b] = await Promise.all([load('engine-c.js'), other('engine-c.js')]);
    expect(a).toEqual({ shared: { runtime: 'the runtime' }, calculator: 'tube-rise' });
    expect(b).toBe(a);
    expect(order).toEqual(['runtime', 'shared', 'engine']);
    expect(added.map((s) => s.src.slice(BASE.length)).sort()).toEqual([
      'engine-c.js',
      'runtime-a.js',
      'shared-b.js',
    ]);
    for (const s of added) {
      expect(s.integrity).toBe(table[s.src.slice(BASE.length)]?.[0]);
      expect(s.crossOrigin).toBe('anonymous');
    }
  });

  it('refuses the load when a chunk fails its integrity check, and asks again next time', async () => {
    const order: string[] = [];
    const served = chunks(order);
    const { g, doc, added } = fakePage({
      ...served,
      'runtime-a.js': { ...served['runtime-a.js'], hash: 'sha384-changed' },
    });
    const load = chunkLoader(g, '0.2.0', BASE, table, doc);
    await expect(load('engine-c.js')).rejects.toThrow(/runtime-a\.js .*integrity/);
    expect(order).toEqual([]);
    await expect(load('engine-c.js')).rejects.toThrow();
    expect(added.filter((s) => s.src.endsWith('runtime-a.js'))).toHaveLength(2);
  });

  it('takes the chunks an engine file registers beside its own (the build bundles them) without fetching them, and runs each once', async () => {
    const order: string[] = [];
    const served = chunks(order);
    // Two engine files that each carry shared-b.js, as two calculators' engines sharing a formula chunk do.
    const engineFile = (name: string, calculator: string) => ({
      hash: `sha384-${name}`,
      body: (g: ChunkRegistry) => {
        served['shared-b.js'].body(g);
        g._d(`0.2.0/${name}`, (r) => {
          const shared = r('shared-b.js'); // a chunk's imports come first
          order.push(calculator);
          return { shared, calculator };
        });
      },
    });
    const { g, doc, added } = fakePage({
      'runtime-a.js': served['runtime-a.js'],
      'engine-d.js': engineFile('engine-d.js', 'tube-rise'),
      'engine-e.js': engineFile('engine-e.js', 'slot-rise'),
    });
    const bundled: ChunkTable = {
      'runtime-a.js': table['runtime-a.js']!,
      'shared-b.js': table['shared-b.js']!,
      'engine-d.js': ['sha384-engine-d.js', ['runtime-a.js']],
      'engine-e.js': ['sha384-engine-e.js', ['runtime-a.js']],
    };
    const load = chunkLoader(g, '0.2.0', BASE, bundled, doc);
    const d = (await load('engine-d.js')) as { shared: unknown };
    const e = (await load('engine-e.js')) as { shared: unknown };
    expect(e.shared).toBe(d.shared);
    expect(order).toEqual(['runtime', 'shared', 'tube-rise', 'slot-rise']);
    // A later chunk importing the shared one finds it here.
    expect(await load('shared-b.js')).toBe(d.shared);
    expect(added.map((s) => s.src.slice(BASE.length)).sort()).toEqual([
      'engine-d.js',
      'engine-e.js',
      'runtime-a.js',
    ]);
  });

  it('will not load a file its table does not list', async () => {
    const { g, doc } = fakePage({});
    await expect(chunkLoader(g, '0.2.0', BASE, table, doc)('elsewhere.js')).rejects.toThrow(/no chunk/);
  });

  it('loads a later chunk with the hash an engine carried for it, once the loader took the table of the engine it checked (a chain of trust)', async () => {
    const order: string[] = [];
    const served = chunks(order);
    const app = (hash: string) => ({
      hash,
      body: (g: ChunkRegistry) =>
        g._d('0.2.0/app-d.js', (r) => {
          order.push('app');
          return { runtime: (r('runtime-a.js') as { mount: string }).mount };
        }),
    });
    for (const [servedHash, ok] of [
      ['sha384-app', true],
      ['sha384-app-changed', false],
    ] as const) {
      order.length = 0;
      const { g, doc } = fakePage({ ...served, 'app-d.js': app(servedHash) });
      // The loader's own table: the first flight only.
      const own: Record<string, ChunkTable[string]> = { ...table };
      const load = chunkLoader(g, '0.2.0', BASE, own, doc);
      await expect(load('app-d.js')).rejects.toThrow(/no chunk app-d\.js/);
      await load('engine-c.js');
      // What the checked engine carries for the chunks after first paint.
      Object.assign(own, { 'app-d.js': ['sha384-app', ['runtime-a.js']] });
      if (ok) {
        await expect(load('app-d.js')).resolves.toEqual({ runtime: 'the runtime' });
        expect(order).toEqual(['runtime', 'shared', 'engine', 'app']);
      } else {
        await expect(load('app-d.js')).rejects.toThrow(/app-d\.js .*integrity/);
        expect(order).not.toContain('app');
      }
    }
  });
});
