// The changeset rule, read from git history so it works on a clean clone with no base branch:
//
// - The rule starts at the commit that added scripts/check-changesets.mjs (found by content, so it
//   survives rebases and squashes), and restarts after the latest commit that consumed changesets
//   (`changeset version` deletes their .md files).
// - Each commit on HEAD's first-parent line after that point (and descended from it) is one unit:
//   a plain commit, or a whole merged branch (a merge commit, compared with its first parent, so a
//   branch needs a changeset somewhere in it, as a pull request would). A unit that changes the
//   shipped source of packages/calc-core or packages/widget must add or edit a `.changeset/*.md`.
// - Uncommitted changes to that source need an uncommitted changeset too (so `npm test` says it
//   before the commit does).
// A change no user can see takes an empty changeset (`npx changeset --empty`): the decision is
// written down, not skipped.
import { spawnSync } from 'node:child_process';
import { readFileSync } from 'node:fs';
import path from 'node:path';
import parseChangeset from '@changesets/parse';
import { root } from './proc.mjs';

const CHECK_SCRIPT = 'scripts/check-changesets.mjs';
const PACKAGES = { 'packages/calc-core': '@wickstone/calc-core', 'packages/widget': '@wickstone/widget' };
const KNOWN_PACKAGES = new Set([
  '@wickstone/calc-core',
  '@wickstone/widget',
  '@wickstone/contracts',
  '@wickstone/server',
  '@wickstone/dashboard',
]);

/** Shipped source: what the package's build reads. Tests, benchmarks, dev pages and docs are not. */
export function isShippedSource(file) {
  const pkg = Object.keys(PACKAGES).find((p) => file.startsWith(`${p}/`));
  if (!pkg) return false;
  const rel = file.slice(pkg.length + 1);
  if (/\.test\.[cm]?[jt]sx?$/.test(rel) || /(^|\/)__tests__\//.test(rel)) return false;
  return rel.startsWith('src/') || rel === 'build.mjs' || rel.startsWith('scripts/');
}

export function isChangeset(file) {
  return /^\.changeset\/[^/]+\.md$/.test(file) && file !== '.changeset/README.md';
}

function git(args) {
  const r = spawnSync('git', args, { cwd: root, encoding: 'utf8' });
  if (r.status !== 0) throw new Error(`git ${args.join(' ')}: ${r.stderr.trim()}`);
  return r.stdout.trimEnd();
}
const lines = (s) => (s ? s.split('\n') : []);

/** The commit from which the rule applies, or null when the check script is not committed yet. */
function startOfRule() {
  const added = lines(git(['log', '--diff-filter=A', '--format=%H', '--', CHECK_SCRIPT]));
  const introduced = added.at(-1);
  if (!introduced) return null;
  // The latest commit since then that deleted changesets (consumed them into a release).
  const consumed = lines(
    git(['log', '--diff-filter=D', '--format=%H', `${introduced}..HEAD`, '--', '.changeset/*.md']),
  ).find((sha) =>
    lines(git(['diff-tree', '--no-commit-id', '--name-only', '--diff-filter=D', '-r', sha])).some(
      isChangeset,
    ),
  );
  return consumed ?? introduced;
}

/** Files a unit changed: a commit against its first parent (for a merge, the whole merged branch). */
function changedFiles(sha) {
  return lines(git(['diff', '--name-only', `${sha}^1`, sha]));
}

/** Uncommitted changes, staged or not, and untracked files. */
function workingTreeFiles() {
  return lines(git(['status', '--porcelain', '--untracked-files=all'])).map((l) =>
    l
      .slice(3)
      .replace(/^.* -> /, '')
      .replace(/^"|"$/g, ''),
  );
}

/** Problems in the changeset files themselves (names, bump types, a summary). */
function invalidChangesets(files) {
  const problems = [];
  for (const file of files) {
    let parsed;
    try {
      parsed = parseChangeset(readFileSync(path.join(root, file), 'utf8'));
    } catch (err) {
      problems.push(`${file}: ${err instanceof Error ? err.message.split('\n')[0] : err}`);
      continue;
    }
    for (const r of parsed.releases) {
      if (!KNOWN_PACKAGES.has(r.name)) problems.push(`${file}: unknown package ${r.name}`);
      if (!['major', 'minor', 'patch', 'none'].includes(r.type))
        problems.push(`${file}: ${r.name} has bump "${r.type}"`);
    }
    if (parsed.releases.length > 0 && !parsed.summary.trim()) problems.push(`${file}: no summary`);
  }
  return problems;
}

/** Returns true when the rule holds; prints what is missing otherwise. */
export function runChangesetCheck({ out = console } = {}) {
  if (git(['rev-parse', '--is-shallow-repository']) === 'true') {
    out.error('changesets: this clone is shallow; the check needs the history (git fetch --unshallow).');
    return false;
  }
  const failures = [];
  const start = startOfRule();
  const units = start
    ? lines(git(['log', '--first-parent', '--ancestry-path', '--format=%H %s', `${start}..HEAD`]))
    : [];
  for (const unit of units) {
    const sha = unit.slice(0, 40);
    const files = changedFiles(sha);
    const source = files.filter(isShippedSource);
    if (source.length > 0 && !files.some(isChangeset)) {
      failures.push(`commit ${unit.slice(0, 8)}${unit.slice(40)}\n    changes ${source.join(', ')}`);
    }
  }
  const pending = workingTreeFiles();
  const pendingSource = pending.filter(isShippedSource);
  if (pendingSource.length > 0 && !pending.some(isChangeset)) {
    failures.push(`uncommitted changes\n    to ${pendingSource.join(', ')}`);
  }

  const present = lines(git(['ls-files', '--cached', '--others', '--exclude-standard', '.changeset'])).filter(
    isChangeset,
  );
  const invalid = invalidChangesets(present);
  for (const p of invalid) out.error(`changesets: ${p}`);
  if (failures.length > 0) {
    out.error(
      [
        'changesets: these change calc-core or widget source without a changeset (.changeset/*.md):',
        ...failures.map((f) => `  - ${f}`),
        'Add one saying what users of the package will notice, for example .changeset/short-name.md:',
        '  ---\n  "@wickstone/calc-core": patch\n  ---\n\n  One sentence an integrator understands.',
        'For a change no user can see, add an empty one: npx changeset --empty',
        'A commit that is already made: amend it, or (on a branch) merge it with a changeset in the branch.',
      ].join('\n'),
    );
  }
  if (failures.length === 0 && invalid.length === 0) {
    out.log(
      `changesets: ${units.length} commit(s) since ${start ? start.slice(0, 8) : '(rule not committed yet)'} checked, ${present.length} pending changeset(s)`,
    );
    return true;
  }
  return false;
}
