import { useEffect, useState } from 'preact/hooks';
import type { Reporter, RunReport } from './lib/reporter.js';

export type ExtrasModule = typeof import('./extras.js');

let loaded: ExtrasModule | null = null;
let pending: Promise<ExtrasModule> | null = null;
const listeners = new Set<(m: ExtrasModule) => void>();

/**
 * Fetches the extras chunk (through `fetch`: the loader's) once per runtime (the working, the lead form, the run reporter, the fonts and their styles),
 * and tells every widget waiting for it. A failed load is forgotten, so the next call asks again.
 */
export function loadExtras(fetch: () => Promise<ExtrasModule>): Promise<ExtrasModule> {
  if (pending) return pending;
  const p = fetch().then((m) => {
    loaded = m;
    for (const l of listeners) l(m);
    return m;
  });
  p.catch(() => {
    if (pending === p) pending = null;
  });
  pending = p;
  return p;
}

/** Runs `then` with the extras: now when they are here, else once they arrive. */
export function withExtras(then: (m: ExtrasModule) => void): () => void {
  if (loaded) {
    then(loaded);
    return () => undefined;
  }
  listeners.add(then);
  return () => listeners.delete(then);
}

/** The extras module in a component: null until it is here, then a re-render with it. */
export function useExtras(): ExtrasModule | null {
  const [m, setM] = useState<ExtrasModule | null>(loaded);
  useEffect(() => (m ? undefined : withExtras(setM)), [m]);
  return m;
}

/**
 * A run reporter whose code (and the transport under it) comes with the extras, after first paint.
 * A calculation made before they arrive gets its id at once and is sent as soon as they are here;
 * afterwards each report goes straight to the real reporter. Pressing Calculate again on the same
 * inputs before then is still one report.
 */
export function deferredReporter(make: (m: ExtrasModule) => Reporter, newId: () => string): Reporter {
  let real: Reporter | null = null;
  let waiting: { key: string; report: RunReport } | null = null;
  const ready = new Promise<Reporter>((resolve) => {
    withExtras((m) => resolve((real = make(m))));
  });
  return {
    report(result, unitSystem) {
      if (real) return real.report(result, unitSystem);
      const key = `${unitSystem}:${result.inputHash}`;
      if (waiting?.key === key) return waiting.report;
      const id = newId();
      const report = { id, stored: ready.then((r) => r.report(result, unitSystem, id).stored) };
      waiting = { key, report };
      return report;
    },
  };
}
