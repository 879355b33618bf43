import { calculators } from '@wickstone/calc-core';
import { describe, expect, it } from 'vitest';
import { chunkLoader, installRegistry, type ChunkRegistry, type ChunkTable } from './chunks.js';
import { laterChunks, type LaterChunks } from './engine.js';

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

  it('loads the chunks after first paint through a chain: the app with the hash the runtime carries, the rest with the hashes the app carries', async () => {
    const order: string[] = [];
    const served = chunks(order);
    const later: LaterChunks = {
      chunks: {
        'texts-t.js': ['sha384-texts', ['app-d.js']],
        'extras-x.js': ['sha384-extras', ['app-d.js']],
        'tables-y.js': ['sha384-tables', ['app-d.js']],
      },
      texts: { 'tube-rise': 'texts-t.js' },
      extras: 'extras-x.js',
      tables: 'tables-y.js',
    };
    const chunk = (file: string, hash: string, exports: object) => ({
      hash,
      body: (g: ChunkRegistry) =>
        g._d(`0.2.0/${file}`, (r) => {
          r('runtime-a.js');
          if (file !== 'app-d.js') r('app-d.js');
          order.push(file);
          return exports;
        }),
    });
    /** The release as served, with the files named in `tampered` changed (their hash differs). */
    const page = (...tampered: string[]) => {
      order.length = 0;
      const files = {
        'app-d.js': chunk('app-d.js', 'sha384-app', { mountWidget: 'the app', later }),
        'texts-t.js': chunk('texts-t.js', 'sha384-texts', { texts: 'tube-rise texts' }),
        'extras-x.js': chunk('extras-x.js', 'sha384-extras', { extras: true }),
        'tables-y.js': chunk('tables-y.js', 'sha384-tables', { tables: true }),
      };
      for (const f of tampered) files[f as keyof typeof files].hash = 'sha384-changed';
      const { g, doc, added } = fakePage({ ...served, ...files });
      // The loader's own table: the first flight only.
      const own: Record<string, ChunkTable[string]> = { ...table };
      const load = chunkLoader(g, '0.2.0', BASE, own, doc);
      return { load, own, added };
    };
    const appEntry = ['app-d.js', 'sha384-app', ['runtime-a.js']] as const;
    const tube = calculators.find((c) => c.id === 'tube-rise')!;

    const ok = page();
    await expect(ok.load('texts-t.js')).rejects.toThrow(/no chunk texts-t\.js/);
    const chain = laterChunks(ok.load, ok.own, tube, appEntry);
    expect(chain.tables).toBeNull(); // no table input
    await expect(chain.texts()).resolves.toEqual({ texts: 'tube-rise texts' });
    await expect(chain.extras()).resolves.toEqual({ extras: true });
    expect(order).toEqual(['runtime', 'app-d.js', 'texts-t.js', 'extras-x.js']);
    for (const s of ok.added) expect(s.integrity).toBe(ok.own[s.src.slice(BASE.length)]?.[0]);
    // A calculator with a table input fetches the tables chunk, checked the same way.
    const withTable = laterChunks(
      ok.load,
      ok.own,
      calculators.find((c) => c.inputs.some((i) => i.kind === 'table'))!,
      appEntry,
    );
    await expect(withTable.tables?.()).resolves.toEqual({ tables: true });

    // A later chunk that differs from the hash the app carries is refused, and never runs.
    const texts = page('texts-t.js');
    const refused = laterChunks(texts.load, texts.own, tube, appEntry);
    await expect(refused.texts()).rejects.toThrow(/texts-t\.js .*integrity/);
    await expect(refused.extras()).resolves.toEqual({ extras: true });
    expect(order).not.toContain('texts-t.js');

    // A changed app chunk: refused, and nothing that depends on its table is loaded.
    const app = page('app-d.js');
    const noApp = laterChunks(app.load, app.own, tube, appEntry);
    await expect(noApp.app()).rejects.toThrow(/app-d\.js .*integrity/);
    await expect(noApp.texts()).rejects.toThrow(/integrity/);
    expect(order).toEqual(['runtime']); // only what the loader's own table vouches for
    expect(app.added.map((s) => s.src.slice(BASE.length))).not.toContain('texts-t.js');

    // A calculator whose texts the app does not list gets none.
    await expect(
      laterChunks(ok.load, ok.own, { id: 'slot-rise', inputs: [] }, appEntry).texts(),
    ).rejects.toThrow(/no chunk/);
  });
});
