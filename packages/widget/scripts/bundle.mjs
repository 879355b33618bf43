// Builds the widget release in memory with Vite's JS API, as six kinds of classic scripts:
//   wickstone-<id>.js  the loader a snippet points at (one per calculator, carries the SRI hashes of
//                      the first flight: the runtime and its engine)
//   runtime-<hash>.js  the first view (plain DOM: fields, "Work it out", the answer and its warnings),
//                      its styles, the calc-core it uses and the calc-core every engine uses (unit
//                      lookups, validation, shared helpers): one per release, shared, no Preact; its
//                      units table is empty until an engine adds its calculator's units (`unitsOf`)
//   engine-<id>-<hash>.js  one calculator's core, with the chunks it shares only with other engines (one
//                      file: e.g. the liquid inputs, the liquids' data and the water correlations for the
//                      calculators that take a liquid); the runtime mounts it (src/engine.ts) and carries the app
//                      chunk's SRI hash
//   app-<hash>.js      Preact and the whole widget (App), after first paint: it takes over from the first view;
//                      it carries the SRI hashes of every later chunk of the release (`sealChain`)
//   texts-<id>-<hash>.js   that calculator's cautions and references (`<id>.texts.ts`), after first paint
//   extras-<hash>.js   the working, the lead form, the run reporter, the font and their styles, after first paint
// The chunks come from one code-split ES build (entries: each engine, each texts, the app, the extras
// and the tables) and are
// wrapped into `Wickstone._d(key, factory)` (see src/chunks.ts), so each can be loaded with
// `integrity` and linked without module scripts.
// Shared by build.mjs (writes the release) and bench.mjs (prints what each part weighs).
import { createHash } from 'node:crypto';
import { existsSync, readFileSync } from 'node:fs';
import { createRequire } from 'node:module';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { brotliCompressSync, constants as zlib, gzipSync } from 'node:zlib';
import { calculators, canonicalUnits, units, unitSystems } from '@wickstone/calc-core';
import { unitsBySize } from '@wickstone/calc-core/answer';
import { init, parse } from 'es-module-lexer';
import { build } from 'vite';

export const widgetDir = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '..');
/** The package's version; `WICKSTONE_RELEASE_VERSION` builds another (tests publish a second release with it). */
export const widgetVersion =
  process.env.WICKSTONE_RELEASE_VERSION ??
  JSON.parse(readFileSync(path.join(widgetDir, 'package.json'), 'utf8')).version;

/** The Manrope the release ships: one variable font file for every weight, Latin only. */
export const MANROPE_FILE = 'manrope-latin-wght-normal.woff2';

/** The first-flight goal: the loader, runtime and engine of one calculator, compressed, in one TCP initial window. */
export const FLIGHT_GOAL = 14 * 1024;
/**
 * Where the build fails: a ceiling that keeps the first flight from growing until it reaches the
 * goal (see README). History: 32 KB, then 30 KB when the texts and the reporter left the first
 * flight, 32 KB when the trade calculators joined, 31.5, 31, 30.25 and 30.5 KB as the engines and
 * the runtime were reshaped (largest then: absorption-coefficient, 31,012 bytes).
 * 24.5 KB when the first view became plain DOM and Preact with the full widget (the app chunk)
 * left the first flight, the loader began carrying only the first flight's SRI hashes (the engine
 * carries the later chunks'), and calc-core's full run (input hash) left the runtime for the texts
 * chunks (largest: absorption-coefficient, 24,638 bytes).
 * 23.9 KB when the first view's style sheet left the app-only rules to the extras and the loader
 * and engines began carrying SHA-256 hashes for the chunks (largest: absorption-coefficient,
 * 24,420 bytes).
 * 23.25 KB when the shared inputs' working left for the texts chunks (`shared-working.js`) and the
 * liquid inputs with the liquids' data for the engines of the calculators that take a liquid
 * (`shared-liquid.js`): runtime 17,452 -> 13,531 bytes (largest: wetting-force, 23,646 bytes). The
 * goal is not met: what is left is the first view and its styles, calc-core's units table, headline
 * and validation, and each engine's own code (inputs' labels and help, the working's text of its solve).
 * 23 KB with both together (largest: wetting-force, 23,392 bytes; smallest: rising-damp-height, 18,547).
 * 22 KB when each engine began carrying its own calculator's units and the whole units table left
 * the runtime for the app chunk (runtime 13,421 -> 12,022 bytes; largest: wetting-force, 22,332;
 * smallest: rising-damp-height, 17,636).
 * 21 KB with the units, each calculator's own working out of its engine (`<id>.working.js`, in the
 * texts chunk) and the first view's and loader's trims together (largest: wetting-force, 20,732;
 * smallest: rising-damp-height, 16,091).
 * 19.25 KB when the later chunks' SRI table moved from each engine to the runtime (the app chunk's
 * hash) and the app chunk (every other's), the loader was trimmed, calc-core's developer
 * self-checks left the release, the liquids' citations and the warnings' summaries the first view
 * never shows moved to the texts (largest: wetting-force, 19,510; smallest: rising-damp-height, 15,142).
 */
export const FLIGHT_LIMIT = 19.25 * 1024;

const ENGINE = 'virtual:wickstone-engine/';
const TEXTS = 'virtual:wickstone-texts/';
const calcCoreDist = path.dirname(createRequire(import.meta.url).resolve('@wickstone/calc-core'));
/** A calculator's texts module in calc-core's build: what follows first paint. */
export function textsModuleOf(calculatorId) {
  const file = path.join(calcCoreDist, 'calculators', `${calculatorId}.texts.js`);
  if (!existsSync(file))
    throw new Error(
      `calculator ${calculatorId} has no texts module (calc-core src/calculators/${calculatorId}.texts.ts): its cautions and references must be kept apart from its core, see DEVELOPERS.md, "Adding a calculator"`,
    );
  return file;
}
/** calc-core's full run (working, assumptions, input hash): with the texts, after first paint. */
const RUN_MODULE = path.join(calcCoreDist, 'calculators', 'run.js');
// ---- units (h14-units): each engine carries its calculator's units; the whole table follows first paint.
/** calc-core's units table (data only), which calc-core's `units.js` reads. */
const UNIT_TABLE = path.join(calcCoreDist, 'unit-table.js');
/** What the release puts in the table's place: a table the engines and later chunks fill (`addUnits`). */
const UNIT_REGISTRY = path.join(widgetDir, 'src', 'lib', 'unit-registry.ts');
/** Adds calc-core's whole units table to the registry: in the app chunk, which every later chunk follows. */
const WHOLE_UNITS = 'virtual:wickstone-units/whole';
const UNITS_MODULE = /[\\/]calc-core[\\/]dist[\\/]units\.js$/;
/**
 * Unit ids written as string literals in the calc-core modules a calculator's engine can run (its
 * own, the formulas and shared helpers it imports; not the texts, the full run nor the table
 * itself): the units its warnings print values in (`q(lc, 'm')`, `q(angle, 'deg')`), whatever
 * their kind. Generous by design: an id that is also a word elsewhere ('h', 's') only adds a unit.
 */
function unitLiteralsOf(calculatorId) {
  const skip =
    /(^|[\\/])(index|registry|run|hash|units|unit-table|wording)\.js$|\.texts\.js$|shared-texts\.js$/;
  const seen = new Set();
  const ids = new Set();
  const visit = (file) => {
    if (seen.has(file) || skip.test(file)) return;
    seen.add(file);
    const code = readFileSync(file, 'utf8');
    for (const m of code.matchAll(/'([^'\\\n]{1,24})'|"([^"\\\n]{1,24})"/g)) {
      const id = m[1] ?? m[2];
      if (Object.hasOwn(units, id)) ids.add(id);
    }
    for (const m of code.matchAll(/\bfrom\s*'(\.[^']+)'/g)) visit(path.resolve(path.dirname(file), m[1]));
  };
  visit(path.join(calcCoreDist, 'calculators', `${calculatorId}.js`));
  return ids;
}
/**
 * The units one calculator's first flight can show or convert: for each kind of its inputs, table
 * columns and outputs, the canonical unit and both unit systems' (`unitSystems`), those the runtime
 * picks by size (`unitsBySize`: mm or ft for a length, minutes or days for a time) and any an
 * input or output names for itself (`display`); and the units its warnings print values in
 * (`unitLiteralsOf`). Entries without the unit's name (the widget never shows one); the factors are
 * calc-core's own numbers, written as JavaScript prints them, so they are the same doubles.
 */
export function unitsOf(calculatorId) {
  const calc = calculators.find((c) => c.id === calculatorId);
  if (!calc) throw new Error(`no calculator ${calculatorId} in calc-core's registry`);
  const items = [...calc.inputs, ...calc.outputs]
    .flatMap((item) => (item.kind === 'table' ? item.columns : [item]))
    .filter((item) => item.kind !== 'choice');
  const kinds = new Set(items.map((item) => item.kind));
  const ids = new Set(unitLiteralsOf(calculatorId));
  for (const kind of kinds)
    for (const id of [canonicalUnits[kind], unitSystems.si[kind], unitSystems.us[kind], ...unitsBySize(kind)])
      ids.add(id);
  for (const item of items) for (const id of Object.values(item.display ?? {})) ids.add(id);
  const pick = (table, keep) => Object.fromEntries(Object.entries(table).filter(([key]) => keep(key)));
  return {
    units: Object.fromEntries(
      Object.entries(units)
        .filter(([id]) => ids.has(id))
        .map(([id, { kind, symbol, factor, offset }]) => [id, { kind, symbol, factor, offset }]),
    ),
    canonicalUnits: pick(canonicalUnits, (kind) => kinds.has(kind)),
    unitSystems: {
      si: pick(unitSystems.si, (kind) => kinds.has(kind)),
      us: pick(unitSystems.us, (kind) => kinds.has(kind)),
    },
  };
}

/**
 * `unitsOf(calculatorId)` in the shorter form an engine carries (`UnitList` in
 * src/lib/unit-registry.ts, which `addUnitList` turns back into the same entries): by kind, the
 * kind's canonical, SI and US units (0 when the subset has none for it), then each unit as its id
 * alone when its symbol is its id, its factor 1 and its offset 0, else `[id, factor, offset?,
 * symbol?]`. Numbers are written as JavaScript prints them, so they read back as the same doubles.
 */
export function unitListOf(calculatorId) {
  const subset = unitsOf(calculatorId);
  const list = {};
  for (const [id, { kind, symbol, factor, offset }] of Object.entries(subset.units)) {
    const canonical = subset.canonicalUnits[kind];
    list[kind] ??= [
      canonical === undefined ? 0 : [canonical, subset.unitSystems.si[kind], subset.unitSystems.us[kind]],
    ];
    const entry = [id, factor];
    if (offset !== 0 || symbol !== id) entry.push(offset);
    if (symbol !== id) entry.push(symbol);
    list[kind].push(entry.length === 2 && factor === 1 ? id : entry);
  }
  for (const kind of Object.keys(subset.canonicalUnits))
    if (!list[kind]) throw new Error(`${calculatorId}: no unit of its kind ${kind} in its subset`);
  return list;
}

/** A calc-core texts module: never part of a first flight. */
const TEXTS_MODULE = /[\\/]calc-core[\\/]dist[\\/]calculators[\\/][^\\/]*texts\.js$/;
/**
 * calc-core's list of calculators and the calculators themselves: the UI reaches them only through
 * calc-core's index (for types and errors), so they stay out of the runtime and in the engines.
 */
const CALC_CORE_INDEX = /[\\/]calc-core[\\/]dist[\\/]index\.js$/;
const CALCULATOR_MODULE =
  /[\\/]calc-core[\\/]dist[\\/](registry\.js|calculators[\\/](?!engine\.js|types\.js)[^\\/]+\.js)$/;
const src = path.join(widgetDir, 'src') + path.sep;
/** The first view's mount: what it reaches is the first flight's runtime. */
const FIRST_ENTRY = path.join(src, 'first', 'mount.ts');
/** The full widget's entry (Preact, App): after first paint. */
const APP_ENTRY = path.join(src, 'app.ts');
const PREACT = /[\\/]node_modules[\\/]preact[\\/]/;
/** Stands in the app chunk for the table of the chunks after it (`sealChain` writes it). */
export const LATER_CHUNKS = '__WICKSTONE_LATER_CHUNKS__';
/** Stands in the runtime for the app chunk's file, hash and imports (`sealChain` writes it; see src/engine.ts). */
export const APP_CHUNK = '__WICKSTONE_APP_CHUNK__';
/** The runtime's side of an engine (`mountEngine`, which holds `APP_CHUNK`): in the runtime. */
const ENGINE_MODULE = path.join(src, 'engine.ts');
/** Widget modules only the extras chunk uses: left out of the runtime. */
const EXTRAS_ONLY = new Set(
  [
    'extras.ts',
    'ui/LeadForm.tsx',
    'ui/SheetBlock.tsx',
    'ui/Working.tsx',
    'lib/lead.ts',
    'lib/fonts.ts',
    'lib/reporter.ts',
    'lib/report.ts',
    'lib/transport.ts',
  ].map((f) => path.join(src, f)),
);
// ---- tables chunk (h2-tradetab): the table input, CSV reading and chart, for calculators with a table input.
const TABLES_ENTRY = path.join(src, 'tables.ts');
const TABLES_DIR = path.join(src, 'tables') + path.sep;

const common = (define) => ({
  configFile: false,
  root: widgetDir,
  logLevel: 'warn',
  mode: 'production',
  define: {
    __WICKSTONE_VERSION__: JSON.stringify(widgetVersion),
    __WICKSTONE_MANROPE_FILE__: JSON.stringify(MANROPE_FILE),
    // calc-core leaves its self-checks (SELF_CHECKS in its errors.ts) out of the release.
    __WICKSTONE_RELEASE__: 'true',
    ...define,
  },
  // A release is the production build whatever NODE_ENV the caller runs under (the release tests run
  // with NODE_ENV=test, which would otherwise pick the JSX development transform): same bytes, same sizes.
  oxc: { jsx: { runtime: 'automatic', importSource: 'preact', development: false } },
});

const buildOptions = {
  write: false,
  target: 'es2022',
  minify: true,
  cssMinify: true,
  sourcemap: false,
  reportCompressedSize: false,
  copyPublicDir: false,
  modulePreload: false,
};

function outputsOf(result) {
  return (Array.isArray(result) ? result : [result]).flatMap((r) => r.output);
}

/** Compressed sizes and the SRI hash of a file's bytes. */
export function measure(code) {
  const buffer = Buffer.from(code, 'utf8');
  const gzip = gzipSync(buffer, { level: 9 });
  const brotli = brotliCompressSync(buffer, {
    params: { [zlib.BROTLI_PARAM_QUALITY]: 11, [zlib.BROTLI_PARAM_SIZE_HINT]: buffer.length },
  });
  return {
    buffer,
    gzip,
    brotli,
    bytes: buffer.length,
    gzipBytes: gzip.length,
    brotliBytes: brotli.length,
    integrity: `sha384-${createHash('sha384').update(buffer).digest('base64')}`,
  };
}

/**
 * The SRI hash a loader, the runtime or the app chunk carries for a chunk: SHA-256, which every browser checks as it
 * does SHA-384 (the Subresource Integrity spec requires both), 27 characters shorter in base64, and
 * a first flight carries three of them (the loader two, the runtime one). What a snippet pins (the
 * loader's own hash, `measure().integrity`, in the manifest) stays SHA-384.
 */
export function chunkIntegrity(code) {
  return `sha256-${createHash('sha256').update(Buffer.from(code, 'utf8')).digest('base64')}`;
}

/**
 * Turns one ES chunk into a classic script: static imports of other chunks become `$wkr("<file>")`,
 * dynamic ones `r.l("<file>")`, and the export list the factory's return value.
 */
function wrapChunk(chunk, extraExports = []) {
  let code = chunk.code;
  const [imports] = parse(code);
  const edits = [];
  const reexports = [...extraExports];
  for (const imp of imports) {
    const file = path.posix.basename(imp.n ?? '');
    if (imp.d === -2)
      throw new Error(
        `${chunk.fileName}: import.meta is not supported in a chunk: ${code.slice(imp.s - 80, imp.e + 80)}`,
      );
    if (imp.d > -1)
      throw new Error(`${chunk.fileName}: dynamic import() of ${imp.n}: load chunks through the loader`);
    const statement = code.slice(imp.ss, imp.se);
    const re = /^export\s*\{([^}]*)\}\s*from\s*["'][^"']+["']\s*;?$/.exec(statement);
    if (re) {
      // export{a as b}from"./x.js" → the chunk's exports read x's
      const ns = `$wk${reexports.length}`;
      for (const s of re[1]
        .split(',')
        .map((x) => x.trim())
        .filter(Boolean)) {
        const [local, exported = local] = s.split(/\s+as\s+/);
        reexports.push(`${JSON.stringify(exported)}:${ns}.${local}`);
      }
      edits.push([imp.ss, imp.se, `const ${ns}=$wkr(${JSON.stringify(file)});`]);
      continue;
    }
    const m = /^import\s*(?:\{([^}]*)\}|\*\s*as\s+([\w$]+))?\s*(?:from\s*)?["'][^"']+["']\s*;?$/.exec(
      statement,
    );
    if (!m) throw new Error(`${chunk.fileName}: cannot rewrite ${statement}`);
    const req = `$wkr(${JSON.stringify(file)})`;
    let replacement = `${req};`;
    if (m[1] !== undefined) {
      const names = m[1]
        .split(',')
        .map((s) => s.trim())
        .filter(Boolean)
        .map((s) => s.replace(/^([\w$]+)\s+as\s+([\w$]+)$/, '$1:$2'));
      replacement = `const{${names.join(',')}}=${req};`;
    } else if (m[2] !== undefined) replacement = `const ${m[2]}=${req};`;
    edits.push([imp.ss, imp.se, replacement]);
  }
  const exportList = /export\s*\{([^}]*)\}\s*;?\s*$/.exec(code);
  if (exportList) {
    const pairs = exportList[1]
      .split(',')
      .map((s) => s.trim())
      .filter(Boolean)
      .map((s) => {
        const [local, exported = local] = s.split(/\s+as\s+/);
        return `${JSON.stringify(exported)}:${local}`;
      });
    edits.push([exportList.index, code.length, `return{${[...pairs, ...reexports].join(',')}}`]);
  } else if (reexports.length > 0) {
    edits.push([code.length, code.length, `;return{${reexports.join(',')}}`]);
  } else if (/\bexport\b/.test(code.slice(-200))) {
    throw new Error(`${chunk.fileName}: cannot find its export list`);
  }
  for (const [s, e, text] of edits.sort((a, b) => b[0] - a[0]))
    code = code.slice(0, s) + text + code.slice(e);
  const key = `${widgetVersion}/${chunk.fileName}`;
  return `Wickstone._d(${JSON.stringify(key)},function($wkr){${code}\n});\n`;
}

/**
 * The release's chunks: one code-split build of every calculator's engine (each also exporting
 * the runtime's `mountWidget`), with Preact, the UI and the calc-core modules the UI uses grouped
 * into the one runtime chunk.
 * @returns {Promise<{ files: Map<string, { code: string, imports: string[] }>, engines: Record<string, string>, extras: string }>}
 */
export async function buildChunks(calculatorIds, { unitSubsets = true } = {}) {
  await init;
  const input = {
    ...Object.fromEntries(calculatorIds.map((id) => [`engine-${id}`, ENGINE + id])),
    ...Object.fromEntries(calculatorIds.map((id) => [`texts-${id}`, TEXTS + id])),
    app: APP_ENTRY,
    extras: path.join(src, 'extras.ts'),
    tables: TABLES_ENTRY,
  };
  /** The first view and everything it imports (not through calc-core's index, not Preact): the runtime. */
  let first = null;
  const inFirst = (id, getModuleInfo) => {
    first ??= reachable(
      getModuleInfo,
      FIRST_ENTRY,
      (next) => !CALC_CORE_INDEX.test(next) && !PREACT.test(next),
    );
    return first.has(id) || id === ENGINE_MODULE || everyEngineUses(id, getModuleInfo);
  };
  const runtimeMemo = new Map();
  /** A module of the full widget: Preact, the widget's own code, and what they import from calc-core. */
  const inApp = (id, getModuleInfo, seen = new Set()) => {
    if (runtimeMemo.has(id)) return runtimeMemo.get(id);
    if (seen.has(id)) return false;
    seen.add(id);
    let yes = false;
    if (PREACT.test(id)) yes = true;
    else if (id.startsWith(src))
      yes =
        !EXTRAS_ONLY.has(id.split('?')[0]) &&
        !id.includes('extras.css') &&
        id.split('?')[0] !== TABLES_ENTRY &&
        !id.startsWith(TABLES_DIR);
    else if (id === `\0${WHOLE_UNITS}` || id === UNIT_TABLE) yes = true;
    else if (CALCULATOR_MODULE.test(id)) yes = false;
    else if (id.includes(`${path.sep}calc-core${path.sep}`))
      // calc-core's index re-exports everything: what only it imports is the engines' business.
      yes =
        CALC_CORE_INDEX.test(id) ||
        (getModuleInfo(id)?.importers ?? []).some(
          (i) => !CALC_CORE_INDEX.test(i) && inApp(i, getModuleInfo, seen),
        );
    runtimeMemo.set(id, yes);
    return runtimeMemo.get(id);
  };
  /**
   * The calc-core modules every calculator's engine imports (the units, the validation, the shared
   * helpers of `calculators/shared.js`): they travel in every first flight anyway, so they go into the
   * runtime, loaded once per page and compressed with it (one file compresses better than three, and
   * two requests fewer). What only some engines import (`calculators/shared-liquid.js` and the liquids'
   * data: five of eleven) stays with those engines.
   */
  let universal = null;
  const everyEngineUses = (id, getModuleInfo) => {
    if (universal === null) {
      // Not through the widget's own code, calc-core's index (which re-exports every calculator) nor its
      // full run (working, input hash): an engine tree-shakes the run away, the texts chunks carry it.
      const reach = (start) =>
        reachable(
          getModuleInfo,
          start,
          (next) => !next.startsWith(src) && !CALC_CORE_INDEX.test(next) && next !== RUN_MODULE,
        );
      const sets = calculatorIds.map((c) => reach(`\0${ENGINE}${c}`));
      universal = new Set(
        [...sets[0]].filter(
          (m) =>
            m.includes(`${path.sep}calc-core${path.sep}`) &&
            !TEXTS_MODULE.test(m) &&
            sets.every((set) => set.has(m)),
        ),
      );
    }
    return universal.has(id);
  };
  const result = await build({
    ...common({}),
    plugins: [
      {
        // calc-core's units.js reads the registry the engines fill, not the whole table (see unitsOf).
        name: 'wickstone-unit-registry',
        enforce: 'pre',
        resolveId: (id, importer) =>
          id === './unit-table.js' && importer !== undefined && UNITS_MODULE.test(importer)
            ? UNIT_REGISTRY
            : null,
      },
      {
        name: 'wickstone-engines',
        resolveId: (id) =>
          id.startsWith(ENGINE) || id.startsWith(TEXTS) || id === WHOLE_UNITS ? `\0${id}` : null,
        load(id) {
          const registry = `import { addUnits, addUnitList } from ${JSON.stringify(UNIT_REGISTRY)};\n`;
          const whole =
            `import { units, canonicalUnits, unitSystems, aliases } from ${JSON.stringify(UNIT_TABLE)};\n` +
            `addUnits({ units, canonicalUnits, unitSystems, aliases });\n`;
          if (id === `\0${WHOLE_UNITS}`) return `${registry}${whole}export const wholeUnits = true;\n`;
          // The texts chunk also carries calc-core's full run (working, input hash): the first flight
          // computes only. The working is written by the texts' `explain` (`<id>.working.ts`), handed
          // to the full run here, since the widget runs the core it computed with. Its working prints
          // any unit, so it takes the whole table (with the app chunk, `WHOLE_UNITS`).
          if (id.startsWith(`\0${TEXTS}`))
            return (
              `import { texts } from ${JSON.stringify(textsModuleOf(id.slice(TEXTS.length + 1)))};\n` +
              `import { runCalculation as run } from ${JSON.stringify(RUN_MODULE)};\n` +
              `export { texts };\n` +
              `export const runCalculation = (def, inputs) => run(def, inputs, texts.explain);\n` +
              `export { wholeUnits } from ${JSON.stringify(WHOLE_UNITS)};\n`
            );
          if (!id.startsWith(`\0${ENGINE}`)) return null;
          const calc = id.slice(ENGINE.length + 1);
          // The engine adds its calculator's units to the runtime's table when it runs, before it mounts.
          return (
            `export { calculator, compute } from '@wickstone/calc-core/calculators/${calc}';\n` +
            `export { mountFirst } from ${JSON.stringify(FIRST_ENTRY)};\n` +
            `export { mountEngine as mount } from ${JSON.stringify(ENGINE_MODULE)};\n` +
            registry +
            (unitSubsets ? `addUnitList(${JSON.stringify(unitListOf(calc))});\n` : whole)
          );
        },
      },
    ],
    build: {
      ...buildOptions,
      rollupOptions: {
        input,
        preserveEntrySignatures: 'allow-extension',
        output: {
          format: 'es',
          entryFileNames: '[name]-[hash].js',
          chunkFileNames: '[name]-[hash].js',
          // Two groups, the first view's before the full widget's: a module both use stays in the
          // runtime; modules in neither (each calculator's own, what only texts or extras use) are split as usual.
          codeSplitting: {
            includeDependenciesRecursively: false,
            groups: [
              { name: (id, c) => (inFirst(id, (m) => c.getModuleInfo(m)) ? 'runtime' : null), priority: 2 },
              { name: (id, c) => (inApp(id, (m) => c.getModuleInfo(m)) ? 'app' : null), priority: 1 },
            ],
          },
        },
      },
    },
  });
  const files = new Map();
  const engines = {};
  const texts = {};
  let extras = null;
  let tables = null;
  let app = null;
  for (const o of outputsOf(result)) {
    if (o.type !== 'chunk') throw new Error(`unexpected asset ${o.fileName} in the release build`);
    if (process.env.WICKSTONE_CHUNK_MODULES)
      for (const [id, m] of Object.entries(o.modules))
        console.log(
          `  ${o.fileName} ${String(m.renderedLength).padStart(7)} ${String(m.code ? measure(m.code).brotliBytes : 0).padStart(6)} ${path.relative(widgetDir, id)}`,
        );
    files.set(o.fileName, {
      // The app chunk also exports the table of the chunks after it (`sealChain`).
      code: wrapChunk(o, o.isEntry && o.name === 'app' ? [`"later":${LATER_CHUNKS}`] : []),
      imports: o.imports.map((f) => path.posix.basename(f)),
      hasTexts: Object.keys(o.modules).some((id) => TEXTS_MODULE.test(id)),
      hasPreact: Object.keys(o.modules).some((id) => PREACT.test(id)),
      hasWholeUnits: Object.keys(o.modules).some((id) => id === UNIT_TABLE),
      calcCode: calcCoreCode(o),
    });
    if (o.isEntry && o.name === 'extras') extras = o.fileName;
    else if (o.isEntry && o.name === 'app') app = o.fileName;
    else if (o.isEntry && o.name.startsWith('texts-')) texts[o.name.slice('texts-'.length)] = o.fileName;
    else if (o.isEntry && o.name === 'tables') tables = o.fileName;
    else if (o.isEntry) engines[o.name.slice('engine-'.length)] = o.fileName;
  }
  if (extras === null) throw new Error('no extras chunk was built');
  if (tables === null) throw new Error('no tables chunk was built');
  if (app === null) throw new Error('no app chunk was built');
  bundleEngines(files, engines);
  checkWholeUnits(files, { engines, texts, extras, tables, unitSubsets });
  return { files, engines, texts, extras, tables, app };
}

/** calc-core's modules in a chunk, as the chunk carries them (minified, before the chunk is wrapped). */
const CALC_CORE_MODULE = /[\\/]calc-core[\\/]dist[\\/]/;
function calcCoreCode(chunk) {
  return Object.entries(chunk.modules)
    .filter(([id]) => CALC_CORE_MODULE.test(id))
    .map(([, m]) => m.code ?? '')
    .join('\n');
}

/**
 * What computes in a first flight, alone: calc-core's code in the chunks `flight` lists (the
 * calculator's core, the shared inputs, units, validation and the headline), as one file, brotli.
 * The rest of the first flight is the loader and the first view (form, answer, styles, look).
 */
export function calcCoreBrotli(files, flight) {
  return measure(flight.map((f) => files.get(f).calcCode ?? '').join('\n')).brotliBytes;
}

/**
 * calc-core's whole units table: in no first flight when the engines carry their own units, and
 * run before every chunk that follows first paint and may print any unit (the working in the
 * texts, the worded warnings in the extras, a CSV's units in the tables).
 */
function checkWholeUnits(files, { engines, texts, extras, tables, unitSubsets }) {
  const holders = [...files].filter(([, f]) => f.hasWholeUnits).map(([name]) => name);
  if (holders.length !== 1)
    throw new Error(`calc-core's units table should be in one chunk, found: ${holders.join(', ') || 'none'}`);
  const [holder] = holders;
  for (const later of [extras, tables, ...Object.values(texts)])
    if (!closure(files, later).has(holder))
      throw new Error(`${later} may run before calc-core's whole units table (${holder}) is added`);
  if (unitSubsets)
    for (const engine of Object.values(engines))
      if (files.get(engine).hasWholeUnits || closure(files, engine).has(holder))
        throw new Error(`${engine}: its first flight carries calc-core's whole units table (${holder})`);
}

/**
 * Makes each engine one file with the chunks only engines share (a formula module two calculators
 * use): each engine file registers those chunks before its own, so the first flight is the loader,
 * the runtime and one engine file (one request fewer or two, and one file compresses better than
 * several). A chunk two engines carry is registered by whichever arrives first and run once; its
 * own file stays in the release for a later chunk that imports it.
 */
function bundleEngines(files, engines) {
  const runtime = [...files.keys()].find((f) => f.startsWith('runtime-'));
  const shared = runtime ? closure(files, runtime) : new Set();
  const merged = Object.values(engines).map((engine) => {
    const own = [...closure(files, engine)].filter((f) => !shared.has(f));
    const parts = own.map((f) => files.get(f));
    return [
      engine,
      {
        code: parts.map((p) => p.code).join(''),
        imports: [...new Set(parts.flatMap((p) => p.imports))].filter((f) => !own.includes(f)),
        hasTexts: parts.some((p) => p.hasTexts),
        hasPreact: parts.some((p) => p.hasPreact),
        hasWholeUnits: parts.some((p) => p.hasWholeUnits),
        calcCode: parts.map((p) => p.calcCode).join('\n'),
      },
    ];
  });
  for (const [engine, file] of merged) files.set(engine, file);
}

/** The modules `start` reaches through static imports, following only those `follow` allows. */
function reachable(getModuleInfo, start, follow) {
  const out = new Set();
  const todo = [start];
  while (todo.length > 0) {
    const m = todo.pop();
    if (out.has(m)) continue;
    out.add(m);
    for (const next of getModuleInfo(m)?.importedIds ?? []) if (follow(next)) todo.push(next);
  }
  return out;
}

/** Every chunk `file` reaches through static imports (itself included), in load order. */
export function closure(files, file, out = new Set()) {
  if (out.has(file)) return out;
  for (const dep of files.get(file)?.imports ?? []) closure(files, dep, out);
  out.add(file);
  return out;
}

/** Writes `text` in place of the one `placeholder` in `file`'s code. */
function fillIn(files, file, placeholder, text) {
  const chunk = files.get(file);
  const parts = chunk.code.split(placeholder);
  if (parts.length !== 2) throw new Error(`${file}: expected one ${placeholder}, found ${parts.length - 1}`);
  files.set(file, { ...chunk, code: parts.join(text) });
}

/**
 * Seals the chain of trust for the chunks after first paint. The app chunk gets the SRI hash and
 * static imports of every later chunk of the release (all but the runtime, the engines and itself,
 * so also the chunks the engines carry inside them, which a later chunk may import) and which
 * file is each calculator's texts, the extras and the tables (in place of `LATER_CHUNKS`); then the
 * runtime gets the sealed app chunk's file, hash and imports (in place of `APP_CHUNK`). The loader
 * checked the runtime, so every file is still checked while no loader or engine carries more than
 * the first flight's hashes.
 * @returns the runtime's file and how many chunks the app chunk's table lists
 */
export function sealChain(files, { engines, texts, extras, tables, app }) {
  const runtime = [...files.keys()].find((f) => f.startsWith('runtime-'));
  if (runtime === undefined) throw new Error('no runtime chunk was built');
  const skip = new Set([runtime, app, ...Object.values(engines)]);
  const chunks = {};
  for (const [file, chunk] of files)
    if (!skip.has(file)) chunks[file] = [chunkIntegrity(chunk.code), chunk.imports];
  fillIn(files, app, LATER_CHUNKS, JSON.stringify({ chunks, texts, extras, tables }));
  const sealed = files.get(app);
  fillIn(files, runtime, APP_CHUNK, JSON.stringify([app, chunkIntegrity(sealed.code), sealed.imports]));
  return { runtime, listed: Object.keys(chunks).length };
}

/**
 * One calculator's loader: an IIFE carrying the SRI hash and static imports of its first flight's
 * chunks (the runtime and its engine); the runtime and the app chunk carry the rest (`sealChain`).
 */
export async function buildLoader(calculatorId, calcCoreVersion, files, engine) {
  const table = {};
  for (const f of closure(files, engine))
    table[f] = [chunkIntegrity(files.get(f).code), files.get(f).imports];
  const result = await build({
    ...common({
      __WICKSTONE_CALCULATOR__: JSON.stringify(calculatorId),
      __WICKSTONE_CALC_CORE_VERSION__: JSON.stringify(calcCoreVersion),
      __WICKSTONE_ENGINE__: JSON.stringify(engine),
      __WICKSTONE_CHUNKS__: JSON.stringify(table),
    }),
    build: {
      ...buildOptions,
      lib: {
        entry: path.join(src, 'loader.ts'),
        formats: ['iife'],
        // Required by Vite for IIFE; the entry exports nothing, so no global of this name is made.
        name: 'WickstoneBundle',
        fileName: () => `wickstone-${calculatorId}.js`,
      },
    },
  });
  const outputs = outputsOf(result);
  if (outputs.length !== 1 || outputs[0].type !== 'chunk')
    throw new Error(
      `${calculatorId}: the loader must be one file, got ${outputs.map((o) => o.fileName).join(', ')}`,
    );
  return outputs[0].code;
}

/** Checks an engine carries only its own calculator and a loader puts nothing on window but `Wickstone`. */
export function checkContents(calculatorId, code, calculators) {
  const problems = [];
  for (const other of calculators) {
    if (other.id !== calculatorId && code.includes(JSON.stringify(other.title).slice(1, -1))) {
      problems.push(`carries another calculator (${other.id})`);
    }
  }
  if (code.includes('WickstoneBundle')) problems.push('defines a global WickstoneBundle');
  return problems;
}

export function kb(bytes) {
  return `${(bytes / 1024).toFixed(1)} KB`;
}
