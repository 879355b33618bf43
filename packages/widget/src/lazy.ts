import { useEffect, useState } from 'preact/hooks';

export type ExtrasModule = typeof import('./extras.js');

let loaded: ExtrasModule | null = null;
let pending: Promise<ExtrasModule> | null = null;
const listeners = new Set<(m: ExtrasModule) => void>();

/**
 * Fetches the extras chunk (through `fetch`: the loader's) once per runtime (the working, the lead form, the fonts and their styles),
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
