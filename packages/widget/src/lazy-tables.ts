import { useEffect, useState } from 'preact/hooks';

export type TablesModule = typeof import('./tables.js');

// The tables chunk (table input, CSV reading, chart), fetched the first time a widget shows a
// table input; a calculator without one never asks for it.

let fetchTables: (() => Promise<TablesModule>) | null = null;
let pending: Promise<TablesModule> | null = null;

/** The loader's way to fetch the chunk (with its SRI hash); null where this release has none for the calculator. */
export function setTablesFetch(fetch: (() => Promise<TablesModule>) | null): void {
  fetchTables ??= fetch;
}

/** The chunk in a component: null until it is here. A failed load is forgotten, so a later render asks again. */
export function useTables(): TablesModule | null {
  const [m, setM] = useState<TablesModule | null>(null);
  useEffect(() => {
    if (m || fetchTables === null) return;
    const f = fetchTables;
    pending ??= f();
    const p = pending;
    let live = true;
    p.then(
      (loaded) => live && setM(loaded),
      () => {
        if (pending === p) pending = null;
      },
    );
    return () => {
      live = false;
    };
  }, [m]);
  return m;
}
