import { spawn } from 'node:child_process';
import { cpSync, mkdirSync, mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { publishRelease } from '../../../scripts/lib/releases.mjs';

const repo = fileURLToPath(new URL('../../../', import.meta.url));

/**
 * The change the test's second release makes to the engine: the tube's meniscus correction uses a
 * cap volume a little larger (a stand-in for a real engine change; it exists only in this test's
 * temporary copy, never in committed code). Only tube-rise's `riseCorrected` moves, and only where the
 * contact angle is below 90°, so a preview has runs that change and runs that do not.
 */
export const TEST_ENGINE_CHANGE = {
  file: 'formulas/capillary.js',
  from: '(3 * R - sag)) / 3;',
  to: '(3 * R - sag)) / 2.5;',
};

function run(cmd: string, args: string[], env: NodeJS.ProcessEnv): Promise<void> {
  return new Promise((resolve, reject) => {
    const child = spawn(cmd, args, {
      cwd: repo,
      env: { ...process.env, ...env },
      stdio: ['ignore', 'pipe', 'pipe'],
    });
    let out = '';
    child.stdout.on('data', (c: Buffer) => (out += c.toString()));
    child.stderr.on('data', (c: Buffer) => (out += c.toString()));
    child.on('error', reject);
    child.on('exit', (code) =>
      code === 0 ? resolve() : reject(new Error(`${cmd} ${args.join(' ')}: ${code}\n${out}`)),
    );
  });
}

export interface TestReleases {
  /** A releases folder holding the committed 0.1.0 and a freshly published `newer`. */
  dir: string;
  older: string;
  newer: string;
  cleanup(): void;
}

/**
 * A temporary published-releases folder with two releases: a copy of the committed 0.1.0, and
 * `newer` published by the real publish function from a real widget build of the current source at
 * that version, with an engine bundled from calc-core's build changed by `TEST_ENGINE_CHANGE`.
 * Needs calc-core, contracts and the widget's dependencies built (`npm run test:env` does it).
 */
/** The version the widget's source builds as: the release the test publishes beside 0.1.0. */
const sourceVersion = (): string =>
  (
    JSON.parse(readFileSync(path.join(repo, 'packages', 'widget', 'package.json'), 'utf8')) as {
      version: string;
    }
  ).version;

export async function publishTestReleases(newer = sourceVersion()): Promise<TestReleases> {
  const tmp = mkdtempSync(path.join(tmpdir(), 'wst-test-releases-'));
  const dir = path.join(tmp, 'releases');
  mkdirSync(dir);
  cpSync(path.join(repo, 'releases', '0.1.0'), path.join(dir, '0.1.0'), { recursive: true });
  const buildDir = path.join(tmp, 'build');
  await run(process.execPath, ['packages/widget/build.mjs'], {
    WICKSTONE_RELEASE_VERSION: newer,
    WICKSTONE_RELEASES_OUT: buildDir,
  });
  const core = path.join(tmp, 'calc-core');
  cpSync(path.join(repo, 'packages', 'calc-core', 'dist'), core, { recursive: true });
  const target = path.join(core, TEST_ENGINE_CHANGE.file);
  const source = readFileSync(target, 'utf8');
  if (!source.includes(TEST_ENGINE_CHANGE.from))
    throw new Error(
      `the test's engine change no longer applies: ${TEST_ENGINE_CHANGE.file} has no "${TEST_ENGINE_CHANGE.from}"`,
    );
  writeFileSync(target, source.replace(TEST_ENGINE_CHANGE.from, TEST_ENGINE_CHANGE.to));
  const changesets = path.join(tmp, 'changesets');
  mkdirSync(changesets);
  writeFileSync(
    path.join(changesets, 'meniscus-volume.md'),
    "---\n'@wickstone/calc-core': minor\n---\n\nThe tube's meniscus correction counts a larger cap volume.\n",
  );
  await publishRelease({
    version: newer,
    releasesDir: dir,
    buildDir,
    calcCoreEntry: path.join(core, 'index.js'),
    changesetDir: changesets,
  });
  return { dir, older: '0.1.0', newer, cleanup: () => rmSync(tmp, { recursive: true, force: true }) };
}
