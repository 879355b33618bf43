import { existsSync, readdirSync, readFileSync } from 'node:fs';
import path from 'node:path';
import semver from 'semver';
import { releaseManifestSchema, releaseVersionSchema, type ReleaseManifest } from '@wickstone/contracts';

export interface ReleaseService {
  /** Every release found, newest first. */
  list(): ReleaseManifest[];
  latest(): ReleaseManifest | null;
  get(version: string): ReleaseManifest | null;
  /** The versioned script of one calculator in a release, or null when that release lacks it. */
  script(version: string, calculatorId: string): { url: string; integrity: string } | null;
  readonly dir: string;
}

/** Read and check one release's manifest; a malformed one is a broken deployment, said with its path. */
function readManifest(file: string): ReleaseManifest {
  let json: unknown;
  try {
    json = JSON.parse(readFileSync(file, 'utf8'));
  } catch (err) {
    throw new Error(`Release manifest ${file} is not JSON`, { cause: err });
  }
  const parsed = releaseManifestSchema.safeParse(json);
  if (!parsed.success) {
    const where = parsed.error.issues.map((i) => i.path.join('.') || '(root)').join(', ');
    throw new Error(`Release manifest ${file} does not match its schema at ${where}`, {
      cause: parsed.error,
    });
  }
  return parsed.data;
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
        if (!releaseVersionSchema.safeParse(name).success || !existsSync(file)) continue;
        const manifest = readManifest(file);
        if (manifest.version === name) found.push(manifest);
      }
    }
    // Semantic-version order: a pre-release ranks below its release (1.0.0-rc.2 < 1.0.0).
    found.sort((a, b) => semver.rcompare(a.version, b.version));
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
