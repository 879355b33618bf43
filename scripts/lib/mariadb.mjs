// A private MariaDB from Debian's packages: its own data folder, its own port on 127.0.0.1,
// its own socket and pid file. Nothing here touches a system database on 3306.
import { spawn, spawnSync } from 'node:child_process';
import { existsSync, mkdirSync, openSync, rmSync, writeFileSync } from 'node:fs';
import path from 'node:path';
import { ensureDebianPackage, isAlive, log, readPid, sleep, stopPid } from './proc.mjs';

const MARIADBD = '/usr/sbin/mariadbd';
const INSTALL_DB = '/usr/bin/mariadb-install-db';
const CLIENT = '/usr/bin/mariadb';

export function ensureMariaDBInstalled() {
  ensureDebianPackage(MARIADBD, ['mariadb-server', 'mariadb-client'], 'the private database server');
}

/** Paths of one instance rooted at `dir` (for example var/mariadb). */
export function instance(dir, port) {
  const base = path.resolve(dir);
  // A unix socket path must stay under ~107 bytes; fall back to /tmp for deep checkouts.
  let socket = path.join(base, 'mysqld.sock');
  if (socket.length > 100) socket = path.join('/tmp', `wickstone-${port}.sock`);
  return {
    dir: base,
    port,
    datadir: path.join(base, 'data'),
    socket,
    pidFile: path.join(base, 'mariadbd.pid'),
    logFile: path.join(base, 'mariadbd.log'),
  };
}

function clientArgs(inst) {
  return ['--no-defaults', `--socket=${inst.socket}`, '-uroot', '--protocol=socket'];
}

/** Run SQL as the instance's root over its socket. */
export function sql(inst, statements) {
  const r = spawnSync(CLIENT, [...clientArgs(inst), '-e', statements], { encoding: 'utf8' });
  if (r.status !== 0) throw new Error(`mariadb client failed: ${r.stderr.trim()}`);
  return r.stdout;
}

function pings(inst) {
  const r = spawnSync(CLIENT, [...clientArgs(inst), '-e', 'SELECT 1'], { encoding: 'utf8' });
  return r.status === 0;
}

function asRootArgs() {
  return process.getuid?.() === 0 ? ['--user=root'] : [];
}

/**
 * Start the instance if it is not running (initialising its data folder on first use), wait
 * until it answers, and return its pid. A second call finds it running; a crashed one (stale
 * pid file) is started again. `args` are further server options (the test instance's binary log).
 */
export async function startMariaDB(inst, { quiet = false, args = [] } = {}) {
  ensureMariaDBInstalled();
  mkdirSync(inst.dir, { recursive: true });
  const known = readPid(inst.pidFile);
  if (known && isAlive(known) && pings(inst)) {
    if (!quiet) log(`MariaDB already running on 127.0.0.1:${inst.port} (pid ${known})`);
    return known;
  }
  if (known && isAlive(known)) await stopPid(known);
  rmSync(inst.pidFile, { force: true });
  rmSync(inst.socket, { force: true });

  if (!existsSync(path.join(inst.datadir, 'mysql'))) {
    if (!quiet) log(`initialising MariaDB data folder ${inst.datadir}`);
    rmSync(inst.datadir, { recursive: true, force: true });
    mkdirSync(inst.datadir, { recursive: true });
    const r = spawnSync(
      INSTALL_DB,
      [
        '--no-defaults',
        `--datadir=${inst.datadir}`,
        '--auth-root-authentication-method=socket',
        '--skip-test-db',
        ...asRootArgs(),
      ],
      { encoding: 'utf8' },
    );
    if (r.status !== 0) throw new Error(`mariadb-install-db failed:\n${r.stdout}\n${r.stderr}`);
  }

  const out = openSync(inst.logFile, 'a');
  const child = spawn(
    MARIADBD,
    [
      '--no-defaults',
      `--datadir=${inst.datadir}`,
      `--port=${inst.port}`,
      '--bind-address=127.0.0.1',
      `--socket=${inst.socket}`,
      `--pid-file=${inst.pidFile}`,
      '--skip-name-resolve',
      '--character-set-server=utf8mb4',
      '--collation-server=utf8mb4_unicode_ci',
      '--default-time-zone=+00:00',
      '--innodb-buffer-pool-size=256M',
      '--innodb-flush-log-at-trx-commit=1',
      '--max-connections=300',
      ...args,
      ...asRootArgs(),
    ],
    { detached: true, stdio: ['ignore', out, out] },
  );
  child.unref();
  const until = Date.now() + 60_000;
  while (Date.now() < until) {
    if (child.exitCode !== null) break;
    if (pings(inst)) {
      writeFileSync(inst.pidFile, `${child.pid}\n`);
      if (!quiet) log(`MariaDB started on 127.0.0.1:${inst.port} (pid ${child.pid}, data ${inst.datadir})`);
      return child.pid;
    }
    await sleep(200);
  }
  throw new Error(`MariaDB did not start on port ${inst.port}; see ${inst.logFile}`);
}

export async function stopMariaDB(inst, { quiet = false } = {}) {
  const pid = readPid(inst.pidFile);
  if (pid && isAlive(pid)) {
    await stopPid(pid, 30_000);
    if (!quiet) log(`MariaDB on port ${inst.port} stopped (pid ${pid})`);
  }
  rmSync(inst.pidFile, { force: true });
}

/**
 * Create the database and an application user that may use it (and, for tests, create others:
 * `allDatabases`, or only those whose names match `alsoPattern`, a LIKE pattern such as `wst\_%`).
 */
export function ensureDatabase(inst, { database, user, password, allDatabases = false, alsoPattern }) {
  const q = (s) => s.replace(/'/g, "''");
  const grantOn = allDatabases ? '*.*' : `\`${database}\`.*`;
  sql(
    inst,
    [
      `CREATE DATABASE IF NOT EXISTS \`${database}\` CHARACTER SET utf8mb4 COLLATE utf8mb4_unicode_ci`,
      `CREATE USER IF NOT EXISTS '${q(user)}'@'127.0.0.1' IDENTIFIED BY '${q(password)}'`,
      `ALTER USER '${q(user)}'@'127.0.0.1' IDENTIFIED BY '${q(password)}'`,
      `GRANT ALL PRIVILEGES ON ${grantOn} TO '${q(user)}'@'127.0.0.1'`,
      ...(alsoPattern ? [`GRANT ALL PRIVILEGES ON \`${alsoPattern}\`.* TO '${q(user)}'@'127.0.0.1'`] : []),
      'FLUSH PRIVILEGES',
    ].join(';\n'),
  );
}
