// The set-up shared by `npm start` and `npm test`: install what is missing, then build.
import { existsSync, statSync } from 'node:fs';
import path from 'node:path';
import { ensureDebianPackage, log, root, run } from './proc.mjs';

/** `npm ci` when node_modules is missing or older than the lock file. */
export function ensureNodeModules() {
  const lock = path.join(root, 'package-lock.json');
  const marker = path.join(root, 'node_modules', '.package-lock.json');
  if (existsSync(marker) && statSync(marker).mtimeMs >= statSync(lock).mtimeMs) return;
  log('installing npm packages (npm ci)');
  run('npm', ['ci', '--no-audit', '--no-fund']);
}

export function ensureChromium() {
  ensureDebianPackage('/usr/bin/chromium', ['chromium'], 'browser tests drive Debian Chromium');
}

/** The sheet tests read each PDF's text with poppler-utils' `pdftotext` (and look at pages with `pdftoppm`). */
export function ensurePdfTools() {
  ensureDebianPackage(
    '/usr/bin/pdftotext',
    ['poppler-utils'],
    'calculation-sheet tests read PDFs with pdftotext',
  );
}

export function build() {
  log('building every workspace (turbo run build)');
  run('npx', ['turbo', 'run', 'build', '--output-logs=errors-only']);
}
