import {
  appendFileSync,
  cpSync,
  mkdirSync,
  mkdtempSync,
  readFileSync,
  rmSync,
  unlinkSync,
  writeFileSync,
} from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { afterAll, describe, expect, it } from 'vitest';
import {
  newChangesets,
  publishedVersions,
  publishRelease,
  verifyRelease,
} from '../../scripts/lib/releases.mjs';

const repo = fileURLToPath(new URL('../../', import.meta.url));
const committed = path.join(repo, 'releases');

describe('published releases', () => {
  const dirs: string[] = [];
  const temp = () => {
    const d = mkdtempSync(path.join(tmpdir(), 'wst-rel-'));
    dirs.push(d);
    return d;
  };
  afterAll(() => {
    for (const d of dirs) rmSync(d, { recursive: true, force: true });
  });

  // The guard CI runs: a published release's bytes never change after it is committed.
  it('every committed release is byte for byte what its checksum list says', () => {
    const versions = publishedVersions(committed);
    expect(versions).toContain('0.1.0');
    for (const v of versions) expect(verifyRelease(path.join(committed, v)), v).toEqual([]);
  });

  it('the guard names a changed byte, a missing file and a file added after publishing', () => {
    const copy = path.join(temp(), '0.1.0');
    cpSync(path.join(committed, '0.1.0'), copy, { recursive: true });
    expect(verifyRelease(copy)).toEqual([]);
    const manifest = JSON.parse(readFileSync(path.join(copy, 'manifest.json'), 'utf8')) as {
      files: Record<string, { file: string }>;
    };
    const loader = manifest.files['tube-rise']?.file as string;
    appendFileSync(path.join(copy, loader), ' ');
    unlinkSync(path.join(copy, 'engine.mjs'));
    writeFileSync(path.join(copy, 'late.js'), '1');
    expect(verifyRelease(copy).sort()).toEqual(
      [`${loader}: bytes changed`, 'engine.mjs: missing', 'late.js: not in checksums.sha256'].sort(),
    );
  });

  it('publishes the widget build as it is, with an engine equal to calc-core, and never over a published version', async () => {
    const out = temp();
    const buildDir = path.join(repo, 'packages', 'widget', 'dist', 'releases');
    const built = JSON.parse(readFileSync(path.join(repo, 'packages', 'widget', 'package.json'), 'utf8')) as {
      version: string;
    };
    const published = await publishRelease({ releasesDir: out, buildDir, version: built.version });
    const dir = path.join(out, built.version);
    expect(verifyRelease(dir)).toEqual([]);
    // Every file the build wrote is there unchanged.
    const manifest = readFileSync(path.join(buildDir, built.version, 'manifest.json'));
    expect(readFileSync(path.join(dir, 'manifest.json')).equals(manifest)).toBe(true);
    // The engine module computes what calc-core computes.
    const engine = (await import(path.join(dir, 'engine.mjs'))) as typeof import('@wickstone/calc-core');
    const core = await import('@wickstone/calc-core');
    const inputs = { diameter: 0.0012, liquid: 'water', temperatureC: 12 };
    expect(engine.calculate('tube-rise', inputs).outputs).toEqual(
      core.calculate('tube-rise', inputs).outputs,
    );
    expect(published.info.engineVersion).toBe(core.VERSION);
    await expect(publishRelease({ releasesDir: out, buildDir, version: built.version })).rejects.toThrow(
      /already published/,
    );
  });

  it('a release’s changelog holds the Changesets entries no earlier release listed', () => {
    const releases = temp();
    const changesets = temp();
    mkdirSync(path.join(releases, '0.1.0'));
    writeFileSync(
      path.join(releases, '0.1.0', 'release.json'),
      JSON.stringify({ version: '0.1.0', changelog: [{ id: 'old-entry', packages: {}, summary: 'x' }] }),
    );
    writeFileSync(path.join(changesets, 'old-entry.md'), "---\n'@wickstone/widget': minor\n---\n\nOld.\n");
    writeFileSync(path.join(changesets, 'new-entry.md'), "---\n'@wickstone/calc-core': patch\n---\n\nNew.\n");
    writeFileSync(path.join(changesets, 'README.md'), 'not an entry');
    expect(newChangesets(changesets, releases)).toEqual([
      { id: 'new-entry', packages: { '@wickstone/calc-core': 'patch' }, summary: 'New.' },
    ]);
  });
});
