import { mkdirSync, mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { afterEach, describe, expect, it } from 'vitest';
import { createReleaseService } from './service.js';

let dirs: string[] = [];
afterEach(() => {
  for (const d of dirs) rmSync(d, { recursive: true, force: true });
  dirs = [];
});

function releasesDir(manifests: Record<string, unknown>): string {
  const dir = mkdtempSync(path.join(tmpdir(), 'wst-releases-'));
  dirs.push(dir);
  for (const [folder, manifest] of Object.entries(manifests)) {
    mkdirSync(path.join(dir, folder));
    writeFileSync(path.join(dir, folder, 'manifest.json'), JSON.stringify(manifest));
  }
  return dir;
}

const manifest = (version: string) => ({
  version,
  calcCoreVersion: '0.1.0',
  files: {
    'tube-rise': {
      file: 'wickstone-tube-rise.js',
      integrity: `sha384-${'A'.repeat(64)}`,
      bytes: 1000,
      gzipBytes: 400,
    },
  },
  fonts: { 'manrope-400': 'manrope-latin-400-normal.woff2' },
});

describe('release service', () => {
  it('lists releases in semantic-version order: a pre-release below its release, 0.10 above 0.9', () => {
    const versions = ['1.0.0-rc.2', '0.9.0', '1.0.0', '0.10.0', '1.0.0-rc.10', '1.0.0-beta.1'];
    const releases = createReleaseService(
      releasesDir(Object.fromEntries(versions.map((v) => [v, manifest(v)]))),
      'http://wickstone.example',
    );
    expect(releases.list().map((m) => m.version)).toEqual([
      '1.0.0',
      '1.0.0-rc.10',
      '1.0.0-rc.2',
      '1.0.0-beta.1',
      '0.10.0',
      '0.9.0',
    ]);
    expect(releases.latest()?.version).toBe('1.0.0');
    expect(releases.script('1.0.0-rc.2', 'tube-rise')).toEqual({
      url: 'http://wickstone.example/releases/1.0.0-rc.2/wickstone-tube-rise.js',
      integrity: `sha384-${'A'.repeat(64)}`,
    });
  });

  it('ignores folders that are not versions and a manifest that names another version', () => {
    const releases = createReleaseService(
      releasesDir({ '1.0.0': manifest('1.0.0'), latest: manifest('2.0.0'), '1.1.0': manifest('1.2.0') }),
      'http://wickstone.example',
    );
    expect(releases.list().map((m) => m.version)).toEqual(['1.0.0']);
  });

  it('refuses a manifest that does not match its schema, naming the file and the field', () => {
    const broken = { ...manifest('1.0.0'), files: { 'tube-rise': { file: '../../etc/passwd', bytes: -1 } } };
    const dir = releasesDir({ '1.0.0': broken });
    expect(() => createReleaseService(dir, 'http://wickstone.example').list()).toThrow(
      /1\.0\.0\/manifest\.json does not match its schema at files\.tube-rise\.file, files\.tube-rise\.integrity, files\.tube-rise\.bytes/,
    );
  });
});
