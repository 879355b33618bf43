// Published widget releases: `releases/<version>/` in the repository, one folder per version,
// written once by `npm run release:publish` and never again.
//
// Why in the repository: a published release must outlive every later build and be there on a
// fresh clone, byte for byte (embed snippets pin its scripts by SRI hash, and the server recomputes
// each run with the engine of the release that made it). `dist/` is rebuilt and ignored by git; a
// separate store would be one more service to run, back up and keep in step with the code that
// reads it. Committed files are reviewed, travel with the code that serves them, and git keeps
// them; `checksums.sha256` in each folder lets CI refuse a commit that changes a published byte.
//
// A release folder holds what the widget build wrote (loaders, runtime, engine and extras chunks,
// their .br/.gz copies, the font, manifest.json), plus:
//   engine.mjs        calc-core's registry and runner as one ES module, for the server
//   release.json      version, engine version, time of publishing, changelog entries
//   CHANGELOG.md      the same entries for people
//   checksums.sha256  `<sha256 hex>  <file>` for every other file of the folder, sorted
import { createHash } from 'node:crypto';
import {
  cpSync,
  existsSync,
  mkdirSync,
  readdirSync,
  readFileSync,
  renameSync,
  rmSync,
  statSync,
  writeFileSync,
} from 'node:fs';
import path from 'node:path';
import { pathToFileURL } from 'node:url';
import parseChangeset from '@changesets/parse';
import { root } from './proc.mjs';

export const CHECKSUMS_FILE = 'checksums.sha256';
export const ENGINE_FILE = 'engine.mjs';
export const RELEASE_FILE = 'release.json';
export const CHANGELOG_FILE = 'CHANGELOG.md';

export const defaults = {
  /** Where published releases are committed. */
  releasesDir: path.join(root, 'releases'),
  /** Where the widget build writes the release made from the current source. */
  buildDir: path.join(root, 'packages', 'widget', 'dist', 'releases'),
  widgetPackage: path.join(root, 'packages', 'widget', 'package.json'),
  calcCoreEntry: path.join(root, 'packages', 'calc-core', 'dist', 'index.js'),
  changesetDir: path.join(root, '.changeset'),
};

const VERSION = /^\d+\.\d+\.\d+(?:-[0-9A-Za-z.-]+)?$/;

/** Every file under dir, as forward-slash paths relative to it, sorted. */
function filesUnder(dir, prefix = '') {
  const out = [];
  for (const name of readdirSync(dir)) {
    const full = path.join(dir, name);
    const rel = prefix ? `${prefix}/${name}` : name;
    if (statSync(full).isDirectory()) out.push(...filesUnder(full, rel));
    else out.push(rel);
  }
  return out.sort();
}

const sha256 = (file) => createHash('sha256').update(readFileSync(file)).digest('hex');

/** The checksum list of a release folder (every file but the list itself). */
export function checksumList(dir) {
  return filesUnder(dir)
    .filter((f) => f !== CHECKSUMS_FILE)
    .map((f) => `${sha256(path.join(dir, f))}  ${f}\n`)
    .join('');
}

/**
 * What differs between a release folder and its committed checksum list: files changed, missing
 * or added. Empty when the folder is as published.
 */
export function verifyRelease(dir) {
  const listFile = path.join(dir, CHECKSUMS_FILE);
  if (!existsSync(listFile)) return [`${CHECKSUMS_FILE} is missing`];
  const expected = new Map();
  for (const line of readFileSync(listFile, 'utf8').split('\n')) {
    if (!line) continue;
    const m = /^([0-9a-f]{64}) {2}(.+)$/.exec(line);
    if (!m) return [`${CHECKSUMS_FILE}: unreadable line "${line}"`];
    expected.set(m[2], m[1]);
  }
  const problems = [];
  const present = new Set(filesUnder(dir).filter((f) => f !== CHECKSUMS_FILE));
  for (const [file, hash] of expected) {
    if (!present.has(file)) problems.push(`${file}: missing`);
    else if (sha256(path.join(dir, file)) !== hash) problems.push(`${file}: bytes changed`);
  }
  for (const file of present) if (!expected.has(file)) problems.push(`${file}: not in ${CHECKSUMS_FILE}`);
  return problems;
}

/** Published versions found in a releases folder (folders with a release.json). */
export function publishedVersions(releasesDir) {
  if (!existsSync(releasesDir)) return [];
  return readdirSync(releasesDir).filter(
    (v) => VERSION.test(v) && existsSync(path.join(releasesDir, v, RELEASE_FILE)),
  );
}

/**
 * The changesets not yet in any published release's changelog: what this release brings. Entries
 * are identified by their file name, as Changesets does.
 */
export function newChangesets(changesetDir, releasesDir) {
  const seen = new Set();
  for (const v of publishedVersions(releasesDir)) {
    const info = JSON.parse(readFileSync(path.join(releasesDir, v, RELEASE_FILE), 'utf8'));
    for (const entry of info.changelog ?? []) seen.add(entry.id);
  }
  if (!existsSync(changesetDir)) return [];
  return readdirSync(changesetDir)
    .filter((f) => f.endsWith('.md') && f !== 'README.md')
    .sort()
    .map((f) => ({
      id: f.replace(/\.md$/, ''),
      ...parseChangeset(readFileSync(path.join(changesetDir, f), 'utf8')),
    }))
    .filter((c) => !seen.has(c.id) && c.summary.trim() !== '')
    .map((c) => ({
      id: c.id,
      packages: Object.fromEntries(c.releases.map((r) => [r.name, r.type])),
      summary: c.summary.trim(),
    }));
}

function changelogText(version, engineVersion, entries) {
  const lines = [`# Wickstone widget ${version}`, '', `Engine (calc-core) ${engineVersion}.`, ''];
  if (!entries.length) lines.push('No changes recorded for this release.', '');
  for (const e of entries) {
    const what = Object.entries(e.packages)
      .map(([name, bump]) => `${name} ${bump}`)
      .join(', ');
    lines.push(`- ${e.summary.replace(/\n+/g, ' ')}${what ? ` (${what})` : ''}`);
  }
  return `${lines.join('\n').trimEnd()}\n`;
}

/**
 * calc-core's registry and runner as one self-contained ES module (no imports), so the server can
 * load the engine of any published release beside its own.
 */
export async function bundleEngine(entry, outFile) {
  const { build } = await import('vite');
  const result = await build({
    configFile: false,
    logLevel: 'warn',
    mode: 'production',
    build: {
      write: false,
      target: 'node20',
      minify: false,
      sourcemap: false,
      reportCompressedSize: false,
      copyPublicDir: false,
      lib: { entry, formats: ['es'], fileName: () => ENGINE_FILE },
    },
  });
  const outputs = (Array.isArray(result) ? result : [result]).flatMap((r) => r.output);
  const chunks = outputs.filter((o) => o.type === 'chunk');
  if (chunks.length !== 1) throw new Error(`engine bundle made ${chunks.length} chunks, expected one`);
  writeFileSync(outFile, chunks[0].code);
}

/**
 * Publish the release the widget build wrote for the widget package's version: copy it as it is
 * into releasesDir/<version>/ with its engine, changelog and checksum list. Refuses to overwrite a
 * published version. Returns what it wrote.
 */
export async function publishRelease(options = {}) {
  const o = { ...defaults, ...options };
  const version = o.version ?? JSON.parse(readFileSync(o.widgetPackage, 'utf8')).version;
  if (!VERSION.test(version))
    throw new Error(`packages/widget's version "${version}" is not a release version`);
  const source = path.join(o.buildDir, version);
  const manifestFile = path.join(source, 'manifest.json');
  if (!existsSync(manifestFile))
    throw new Error(`no build of ${version} at ${source}: run the widget build first`);
  const manifest = JSON.parse(readFileSync(manifestFile, 'utf8'));
  if (manifest.version !== version)
    throw new Error(`${manifestFile} is for ${manifest.version}, not ${version}`);
  const target = path.join(o.releasesDir, version);
  if (existsSync(target))
    throw new Error(
      `release ${version} is already published (${target}); published releases never change: bump packages/widget's version`,
    );

  mkdirSync(o.releasesDir, { recursive: true });
  const staging = path.join(o.releasesDir, `.publishing-${version}-${process.pid}`);
  rmSync(staging, { recursive: true, force: true });
  try {
    cpSync(source, staging, { recursive: true });
    await bundleEngine(o.calcCoreEntry, path.join(staging, ENGINE_FILE));
    const engine = await import(`${pathToFileURL(path.join(staging, ENGINE_FILE)).href}?t=${Date.now()}`);
    if (engine.VERSION !== manifest.calcCoreVersion)
      throw new Error(
        `the engine bundled (calc-core ${engine.VERSION}) is not the one the widget build used (${manifest.calcCoreVersion}): rebuild`,
      );
    const changelog = newChangesets(o.changesetDir, o.releasesDir);
    const info = {
      version,
      engineVersion: engine.VERSION,
      publishedAt: (o.now ?? new Date()).toISOString(),
      engine: ENGINE_FILE,
      changelog,
    };
    writeFileSync(path.join(staging, RELEASE_FILE), `${JSON.stringify(info, null, 2)}\n`);
    writeFileSync(path.join(staging, CHANGELOG_FILE), changelogText(version, engine.VERSION, changelog));
    writeFileSync(path.join(staging, CHECKSUMS_FILE), checksumList(staging));
    renameSync(staging, target);
    return { version, dir: target, info };
  } catch (err) {
    rmSync(staging, { recursive: true, force: true });
    throw err;
  }
}
