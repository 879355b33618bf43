import { mkdtempSync, readFileSync, rmSync, statSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { ensureSessionSecret } from '../../scripts/lib/secrets.mjs';

describe('the session secret npm start makes per checkout', () => {
  const dirs: string[] = [];
  const freshVar = () => {
    const d = mkdtempSync(path.join(tmpdir(), 'wst-var-'));
    dirs.push(d);
    return path.join(d, 'var');
  };
  afterAll(() => {
    for (const d of dirs) rmSync(d, { recursive: true, force: true });
  });

  it('gives two fresh checkouts different secrets', () => {
    const a = ensureSessionSecret(freshVar());
    const b = ensureSessionSecret(freshVar());
    expect(a.length).toBeGreaterThanOrEqual(32);
    expect(b.length).toBeGreaterThanOrEqual(32);
    expect(a).not.toBe(b);
  });

  it('keeps one checkout’s secret across starts, readable by its owner alone', () => {
    const dir = freshVar();
    const first = ensureSessionSecret(dir);
    expect(ensureSessionSecret(dir)).toBe(first);
    expect(readFileSync(path.join(dir, 'session-secret'), 'utf8').trim()).toBe(first);
    expect(statSync(path.join(dir, 'session-secret')).mode & 0o077).toBe(0);
  });
});
