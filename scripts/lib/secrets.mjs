// The session secret of this checkout: made on first start, kept under var/, never in the repository,
// so no two installs share one (a token signed by one install is worthless to another).
import { randomBytes } from 'node:crypto';
import { existsSync, mkdirSync, readFileSync, writeFileSync } from 'node:fs';
import path from 'node:path';

/** Read `<varDir>/session-secret`, making it (48 random bytes, base64url, mode 0600) when missing. */
export function ensureSessionSecret(varDir) {
  const file = path.join(varDir, 'session-secret');
  if (existsSync(file)) {
    const kept = readFileSync(file, 'utf8').trim();
    if (kept.length >= 32) return kept;
  }
  mkdirSync(varDir, { recursive: true });
  const secret = randomBytes(48).toString('base64url');
  // 'wx' on a fresh file: two starts racing keep whichever wrote first.
  try {
    writeFileSync(file, `${secret}\n`, { mode: 0o600, flag: existsSync(file) ? 'w' : 'wx' });
  } catch (err) {
    if (err?.code !== 'EEXIST') throw err;
    return readFileSync(file, 'utf8').trim();
  }
  return secret;
}
