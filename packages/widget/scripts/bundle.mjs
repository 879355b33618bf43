// Builds one calculator's bundle in memory with Vite's JS API: a minified classic script (IIFE)
// holding the loader, the UI, the Preact runtime, the styles and that one calculator from
// calc-core. Shared by build.mjs (writes the release) and bench.mjs (compares runtimes).
import { createHash } from 'node:crypto';
import { readFileSync } from 'node:fs';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { gzipSync } from 'node:zlib';
import { build } from 'vite';

export const widgetDir = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '..');
export const widgetVersion = JSON.parse(readFileSync(path.join(widgetDir, 'package.json'), 'utf8')).version;

/** The size budget (the build fails above it) and the goal (one TCP initial window), gzipped bytes. */
export const LIMIT_GZIP = 35 * 1024;
export const GOAL_GZIP = 14 * 1024;

const VIRTUAL = 'virtual:wickstone-calculator';

const PROBE = 'virtual:wickstone-probe';

/**
 * Points the entry's `virtual:wickstone-calculator` at exactly one calc-core calculator subpath;
 * `probe` is an alternative entry's source (for measuring a part of the bundle alone).
 */
function calculatorPlugin(calculatorId, probe) {
  return {
    name: 'wickstone-calculator',
    resolveId(id) {
      if (id === VIRTUAL) return '\0' + VIRTUAL;
      // Vite hands a lib entry over as a path under the root.
      if (probe !== undefined && (id === PROBE || id.endsWith(`/${PROBE}`))) return '\0' + PROBE;
      return null;
    },
    load(id) {
      if (id === '\0' + VIRTUAL)
        return `export { calculator, run } from '@wickstone/calc-core/calculators/${calculatorId}';\n`;
      if (id === '\0' + PROBE) return probe;
      return null;
    },
  };
}

/**
 * Our own modules' hooks and JSX taken from preact/compat; compat's own imports of Preact left as
 * they are (an alias for everything would point compat at itself).
 */
function compatPlugin() {
  const src = path.join(widgetDir, 'src') + path.sep;
  const swap = { 'preact/hooks': 'preact/compat', 'preact/jsx-runtime': 'preact/compat/jsx-runtime' };
  return {
    name: 'wickstone-compat',
    enforce: 'pre',
    async resolveId(id, importer) {
      if (!(id in swap) || importer === undefined || !importer.startsWith(src)) return null;
      return this.resolve(swap[id], importer, { skipSelf: true });
    },
  };
}

/**
 * @param {string} calculatorId
 * @param {{ runtime?: 'preact' | 'compat', probe?: string }} [options] `compat` builds the same code
 *   with its hooks and JSX taken from preact/compat, the layer React-style code would be aliased to;
 *   `probe` replaces the entry with the given module source.
 * @returns {Promise<{ code: string, bytes: number, gzipBytes: number, integrity: string }>}
 */
export async function bundleCalculator(calculatorId, options = {}) {
  const compat = options.runtime === 'compat';
  const result = await build({
    configFile: false,
    root: widgetDir,
    logLevel: 'warn',
    mode: 'production',
    define: { __WICKSTONE_VERSION__: JSON.stringify(widgetVersion) },
    oxc: { jsx: { runtime: 'automatic', importSource: 'preact' } },
    plugins: [calculatorPlugin(calculatorId, options.probe), ...(compat ? [compatPlugin()] : [])],
    build: {
      write: false,
      target: 'es2022',
      minify: true,
      cssMinify: true,
      sourcemap: false,
      reportCompressedSize: false,
      copyPublicDir: false,
      lib: {
        entry: options.probe === undefined ? path.join(widgetDir, 'src/entry.ts') : PROBE,
        formats: ['iife'],
        // Required by Vite for IIFE; the entry exports nothing, so no global of this name is made.
        name: 'WickstoneBundle',
        fileName: () => `wickstone-${calculatorId}.js`,
      },
    },
  });
  const outputs = (Array.isArray(result) ? result : [result]).flatMap((r) => r.output);
  const chunks = outputs.filter((o) => o.type === 'chunk');
  const extra = outputs.filter((o) => o.type !== 'chunk');
  if (chunks.length !== 1 || extra.length !== 0) {
    throw new Error(
      `${calculatorId}: expected one self-contained file, got ${outputs.map((o) => o.fileName).join(', ')}`,
    );
  }
  const code = chunks[0].code;
  const buffer = Buffer.from(code, 'utf8');
  return {
    code,
    bytes: buffer.length,
    gzipBytes: gzipSync(buffer, { level: 9 }).length,
    integrity: `sha384-${createHash('sha384').update(buffer).digest('base64')}`,
  };
}

/** Checks a built file carries only its own calculator and puts nothing on window but `Wickstone`. */
export function checkContents(calculatorId, code, calculators) {
  const problems = [];
  for (const other of calculators) {
    if (other.id !== calculatorId && code.includes(JSON.stringify(other.title).slice(1, -1))) {
      problems.push(`carries another calculator (${other.id})`);
    }
  }
  if (/^\s*(var|let|const)\s+WickstoneBundle\b/.test(code) || code.includes('WickstoneBundle'))
    problems.push('defines a global WickstoneBundle');
  return problems;
}

export function kb(bytes) {
  return `${(bytes / 1024).toFixed(1)} KB`;
}
