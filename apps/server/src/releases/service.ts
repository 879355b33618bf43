import { existsSync, readdirSync, readFileSync } from 'node:fs';
import path from 'node:path';

export interface ReleaseFile {
  file: string;
  /** Subresource Integrity hash, `sha384-<base64>`. */
  integrity: string;
  bytes: number;
  gzipBytes: number;
}

/** What the widget build writes beside each release (packages/widget/dist/releases/<version>/manifest.json). */
export interface ReleaseManifest {
  version: string;
  calcCoreVersion: string;
  files: Record<string, ReleaseFile>;
  fonts: Record<string, string>;
}

export interface ReleaseService {
  /** Every release found, newest first. */
  list(): ReleaseManifest[];
  latest(): ReleaseManifest | null;
  get(version: string): ReleaseManifest | null;
  /** The versioned script of one calculator in a release, or null when that release lacks it. */
  script(version: string, calculatorId: string): { url: string; integrity: string } | null;
  readonly dir: string;
}

const VERSION = /^\d+\.\d+\.\d+(?:-[0-9A-Za-z.-]+)?$/;

function compareVersions(a: string, b: string): number {
  const pa = a.split(/[.-]/).map((x) => Number.parseInt(x, 10));
  const pb = b.split(/[.-]/).map((x) => Number.parseInt(x, 10));
  for (let i = 0; i < 3; i++) {
    const d = (pa[i] ?? 0) - (pb[i] ?? 0);
    if (d !== 0) return d;
  }
  return a.localeCompare(b);
}

/**
 * Releases of the widget bundle are folders named by version; a folder is never rewritten once
 * published, so its files can be cached for a year and pinned by SRI. Manifests are read once.
 */
export function createReleaseService(dir: string, publicUrl: string): ReleaseService {
  let cache: ReleaseManifest[] | null = null;
  const load = (): ReleaseManifest[] => {
    if (cache) return cache;
    const found: ReleaseManifest[] = [];
    if (existsSync(dir)) {
      for (const name of readdirSync(dir)) {
        const file = path.join(dir, name, 'manifest.json');
        if (!VERSION.test(name) || !existsSync(file)) continue;
        const manifest = JSON.parse(readFileSync(file, 'utf8')) as ReleaseManifest;
        if (manifest.version === name) found.push(manifest);
      }
    }
    found.sort((a, b) => compareVersions(b.version, a.version));
    cache = found;
    return found;
  };
  const base = publicUrl.replace(/\/$/, '');
  return {
    dir,
    list: load,
    latest: () => load()[0] ?? null,
    get: (version) => load().find((m) => m.version === version) ?? null,
    script(version, calculatorId) {
      const m = load().find((r) => r.version === version);
      const f = m?.files[calculatorId];
      if (!m || !f) return null;
      return { url: `${base}/releases/${m.version}/${f.file}`, integrity: f.integrity };
    },
  };
}
