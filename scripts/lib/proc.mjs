// Small process helpers shared by the start, test and db scripts (plain Node, no dependencies,
// so they run before `npm ci` has installed anything).
import { spawn, spawnSync } from 'node:child_process';
import { existsSync, readFileSync } from 'node:fs';

export const root = new URL('../..', import.meta.url).pathname.replace(/\/$/, '');

export function log(msg) {
  process.stdout.write(`[wickstone] ${msg}\n`);
}

/** Run a command to completion with inherited output; throws on a non-zero exit. */
export function run(cmd, args, opts = {}) {
  succeeded(spawnSync(cmd, args, { stdio: 'inherit', cwd: root, ...opts }), cmd, args);
}

/** The finished command's result, or an error naming it (its exit code on `exitCode`). */
function succeeded(r, cmd, args) {
  if (r.error) throw r.error;
  if (r.status !== 0) {
    const err = new Error(`${cmd} ${args.join(' ')} exited with ${r.status ?? r.signal}`);
    err.exitCode = r.status ?? 1;
    throw err;
  }
  return r;
}

/** Run a command, its errors shown as they come, and return what it printed (throws as `run`). */
export function runCapture(cmd, args, opts = {}) {
  const r = spawnSync(cmd, args, {
    stdio: ['ignore', 'pipe', 'inherit'],
    cwd: root,
    encoding: 'utf8',
    ...opts,
  });
  // On failure what it printed is shown before the error.
  if (r.status !== 0) process.stdout.write(r.stdout ?? '');
  return succeeded(r, cmd, args).stdout ?? '';
}

/** Run a command and return its exit code (for the test runner, whose code we pass on). */
export function runStatus(cmd, args, opts = {}) {
  const r = spawnSync(cmd, args, { stdio: 'inherit', cwd: root, ...opts });
  if (r.error) throw r.error;
  return r.status ?? 1;
}

export function commandExists(path) {
  return existsSync(path);
}

export function which(name) {
  const r = spawnSync('sh', ['-c', `command -v ${name}`], { encoding: 'utf8' });
  return r.status === 0 ? r.stdout.trim() : null;
}

export function isAlive(pid) {
  if (!pid) return false;
  try {
    process.kill(pid, 0);
    return true;
  } catch {
    return false;
  }
}

export function readPid(file) {
  if (!existsSync(file)) return null;
  const pid = Number.parseInt(readFileSync(file, 'utf8').trim(), 10);
  return Number.isFinite(pid) && pid > 0 ? pid : null;
}

export const sleep = (ms) => new Promise((r) => setTimeout(r, ms));

/** Send SIGTERM, wait up to `ms` for the process to go, then SIGKILL. */
export async function stopPid(pid, ms = 15_000) {
  if (!isAlive(pid)) return;
  try {
    process.kill(pid, 'SIGTERM');
  } catch {
    return;
  }
  const until = Date.now() + ms;
  while (isAlive(pid) && Date.now() < until) await sleep(100);
  if (isAlive(pid)) {
    try {
      process.kill(pid, 'SIGKILL');
    } catch {
      /* already gone */
    }
  }
}

/** Start a long-running child whose pid we keep; output is prefixed so it can be told apart. */
export function startChild(name, cmd, args, opts = {}) {
  const child = spawn(cmd, args, { cwd: root, stdio: ['ignore', 'pipe', 'pipe'], ...opts });
  const prefix = (chunk) =>
    chunk
      .toString()
      .split('\n')
      .filter((l) => l.length)
      .map((l) => `[${name}] ${l}\n`)
      .join('');
  child.stdout?.on('data', (c) => process.stdout.write(prefix(c)));
  child.stderr?.on('data', (c) => process.stderr.write(prefix(c)));
  return child;
}

/** Install Debian packages with apt-get when a command is missing; a clear message when we cannot. */
export function ensureDebianPackage(binary, packages, why) {
  if (existsSync(binary)) return;
  log(`${binary} is missing: installing Debian package(s) ${packages.join(' ')} (${why})`);
  const asRoot = process.getuid?.() === 0;
  const sudo = asRoot ? [] : which('sudo') ? ['sudo', '-n'] : null;
  if (!sudo) {
    throw new Error(
      `${binary} is missing and this user cannot install packages. Run as root or install: apt-get install ${packages.join(' ')}`,
    );
  }
  const env = { ...process.env, DEBIAN_FRONTEND: 'noninteractive' };
  const aptGet = (args) => {
    const [cmd, ...rest] = [...sudo, 'apt-get', ...args];
    return spawnSync(cmd, rest, { stdio: 'inherit', env }).status;
  };
  if (
    aptGet(['update']) !== 0 ||
    aptGet(['install', '-y', '--no-install-recommends', ...packages]) !== 0 ||
    !existsSync(binary)
  ) {
    throw new Error(
      `Could not install ${packages.join(' ')} with apt-get; install it by hand, then run again.`,
    );
  }
}

/** Wait until an HTTP URL answers at all (any status), or throw after `ms`. */
export async function waitForHttp(url, ms = 30_000) {
  const until = Date.now() + ms;
  while (Date.now() < until) {
    try {
      await fetch(url, { signal: AbortSignal.timeout(1000) });
      return;
    } catch {
      await sleep(150);
    }
  }
  throw new Error(`${url} did not answer within ${ms} ms`);
}

/**
 * What a long-running script started, stopped in reverse order on Ctrl-C, SIGTERM or `stop(code)`:
 * child processes (`add`) and anything else (`onStop`, e.g. a database it started).
 */
export function supervisor() {
  const children = [];
  const hooks = [];
  const stop = async (code = 0) => {
    for (const child of children.reverse()) await stopPid(child.pid, 10_000);
    for (const hook of hooks.reverse()) await hook();
    process.exit(code);
  };
  process.on('SIGINT', () => void stop(0));
  process.on('SIGTERM', () => void stop(0));
  return {
    add(child) {
      children.push(child);
      return child;
    },
    onStop(hook) {
      hooks.push(hook);
    },
    stop,
  };
}
