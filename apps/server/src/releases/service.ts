import { existsSync, readdirSync, readFileSync } from 'node:fs';
import { createRequire } from 'node:module';
import path from 'node:path';
import semver from 'semver';
import type { z } from 'zod';
import * as currentEngine from '@wickstone/calc-core';
import { CalcInputError } from '@wickstone/calc-core';
import {
  publishedReleaseSchema,
  releaseManifestSchema,
  releaseVersionSchema,
  type PublishedRelease,
  type ReleaseManifest,
  type ReleaseSummary,
} from '@wickstone/contracts';

/** calc-core's input error, also from a published release's engine (which has its own copy of the class). */
export function isCalcInputError(e: unknown): e is CalcInputError {
  return (
    e instanceof CalcInputError ||
    (e instanceof Error && e.name === 'CalcInputError' && Array.isArray((e as { issues?: unknown }).issues))
  );
}

/** What the server needs of a release's engine: calc-core's runner and registry. */
export interface RunEngine {
  VERSION: string;
  calculate: typeof currentEngine.calculate;
  getCalculator: typeof currentEngine.getCalculator;
}

export interface ReleaseEntry {
  manifest: ReleaseManifest;
  /** release.json of a published release; null for the development build. */
  published: PublishedRelease | null;
  /** The folder its files are served from. */
  folder: string;
}

export interface ReleaseService {
  /** Every release found, newest first. */
  list(): ReleaseManifest[];
  /** Every release with where it lives and, when published, its release.json; newest first. */
  entries(): ReleaseEntry[];
  latest(): ReleaseManifest | null;
  get(version: string): ReleaseManifest | null;
  /** The versioned script of one calculator in a release, or null when that release lacks it. */
  script(version: string, calculatorId: string): { url: string; integrity: string } | null;
  /**
   * The engine a release's widgets calculate with: a published release's own `engine.mjs`, or this
   * server's calc-core for the development build. Null for a release the server does not have.
   */
  engine(version: string): RunEngine | null;
  /** Where that engine's module lives, for a worker thread to load it itself; null as for `engine`. */
  enginePath(version: string): string | null;
  /** The newest published release a range pin (`~0.2`) allows, never a pre-release; null when none. */
  resolve(pin: string): string | null;
  summaries(): ReleaseSummary[];
  /** Folders to serve release files from, the published ones first. */
  readonly dirs: readonly string[];
  /** The development build's folder (the widget build's output). */
  readonly dir: string;
}

/** Read and check one JSON file of a release; a malformed one is a broken deployment, said with its path. */
function readChecked<T>(file: string, schema: z.ZodType<T>): T {
  let json: unknown;
  try {
    json = JSON.parse(readFileSync(file, 'utf8'));
  } catch (err) {
    throw new Error(`Release manifest ${file} is not JSON`, { cause: err });
  }
  const parsed = schema.safeParse(json);
  if (!parsed.success) {
    const where = parsed.error.issues.map((i) => i.path.join('.') || '(root)').join(', ');
    throw new Error(`Release manifest ${file} does not match its schema at ${where}`, {
      cause: parsed.error,
    });
  }
  return parsed.data;
}

const nodeRequire = createRequire(import.meta.url);

/** A published engine module, checked to be one before it is used. */
function loadEngine(file: string): RunEngine {
  // Node 20.19+ loads an ES module without top-level await synchronously, so the run ingest can
  // look an engine up in the middle of a batch without waiting.
  const m = nodeRequire(file) as Partial<RunEngine>;
  if (typeof m.calculate !== 'function' || typeof m.getCalculator !== 'function' || typeof m.VERSION !== 'string')
    throw new Error(`${file} is not a calc-core engine (calculate, getCalculator, VERSION)`);
  return m as RunEngine;
}

/**
 * Releases of the widget bundle are folders named by version: the published ones
 * (`publishedDir`, committed, never rewritten) and the widget build's output (`dir`), which adds
 * the version being developed when it is not published yet. A published version always wins over
 * a build of the same version, so its files and engine are the ones that were published. Folders
 * are read once.
 */
export function createReleaseService(dir: string, publicUrl: string, publishedDir?: string): ReleaseService {
  let cache: ReleaseEntry[] | null = null;
  const engines = new Map<string, RunEngine>();
  const scan = (folder: string, published: boolean, into: Map<string, ReleaseEntry>) => {
    if (!existsSync(folder)) return;
    for (const name of readdirSync(folder)) {
      if (into.has(name) || !releaseVersionSchema.safeParse(name).success) continue;
      const base = path.join(folder, name);
      const manifestFile = path.join(base, 'manifest.json');
      const infoFile = path.join(base, 'release.json');
      if (!existsSync(manifestFile) || (published && !existsSync(infoFile))) continue;
      const manifest = readChecked(manifestFile, releaseManifestSchema);
      if (manifest.version !== name) continue;
      const info = published ? readChecked(infoFile, publishedReleaseSchema) : null;
      into.set(name, { manifest, published: info, folder });
    }
  };
  const load = (): ReleaseEntry[] => {
    if (cache) return cache;
    const found = new Map<string, ReleaseEntry>();
    if (publishedDir) scan(publishedDir, true, found);
    scan(dir, false, found);
    // Semantic-version order: a pre-release ranks below its release (1.0.0-rc.2 < 1.0.0).
    cache = [...found.values()].sort((a, b) => semver.rcompare(a.manifest.version, b.manifest.version));
    return cache;
  };
  const entry = (version: string) => load().find((e) => e.manifest.version === version) ?? null;
  const base = publicUrl.replace(/\/$/, '');
  return {
    dir,
    dirs: publishedDir ? [publishedDir, dir] : [dir],
    entries: load,
    list: () => load().map((e) => e.manifest),
    latest: () => load()[0]?.manifest ?? null,
    get: (version) => entry(version)?.manifest ?? null,
    script(version, calculatorId) {
      const m = entry(version)?.manifest;
      const f = m?.files[calculatorId];
      if (!m || !f) return null;
      return { url: `${base}/releases/${m.version}/${f.file}`, integrity: f.integrity };
    },
    engine(version) {
      const e = entry(version);
      if (!e) return null;
      if (!e.published) return currentEngine;
      let engine = engines.get(version);
      if (!engine) {
        engine = loadEngine(path.join(e.folder, version, e.published.engine));
        engines.set(version, engine);
      }
      return engine;
    },
    enginePath(version) {
      const e = entry(version);
      if (!e) return null;
      return e.published ? path.join(e.folder, version, e.published.engine) : nodeRequire.resolve('@wickstone/calc-core');
    },
    resolve(pin) {
      // Only published releases: a development build is never picked by a range.
      const versions = load().flatMap((e) => (e.published ? [e.manifest.version] : []));
      return semver.maxSatisfying(versions, pin, { includePrerelease: false });
    },
    summaries: () =>
      load().map((e) => ({
        version: e.manifest.version,
        engineVersion: e.published?.engineVersion ?? e.manifest.calcCoreVersion,
        published: e.published !== null,
        publishedAt: e.published?.publishedAt ?? null,
        prerelease: semver.prerelease(e.manifest.version) !== null,
        calculators: Object.keys(e.manifest.files),
        changelog: e.published?.changelog ?? [],
      })),
  };
}
