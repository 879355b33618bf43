import type { Component, FunctionComponent } from 'preact';

/**
 * Whether two sets of props would render the same: the same keys with the same values, arrays
 * compared item by item (a field's offered options and warning ids are new arrays on every render
 * of the form, with the same items when nothing changed).
 */
export function sameProps(a: object, b: object): boolean {
  const x = a as Record<string, unknown>;
  const y = b as Record<string, unknown>;
  for (const key in x) if (!(key in y)) return false;
  for (const key in y) {
    if (!(key in x)) return false;
    const p = x[key];
    const q = y[key];
    if (Object.is(p, q)) continue;
    if (!Array.isArray(p) || !Array.isArray(q) || p.length !== q.length) return false;
    for (let i = 0; i < p.length; i++) if (!Object.is(p[i], q[i])) return false;
  }
  return true;
}

/**
 * `Inner`, rendered again only when its props change (by `sameProps`); its own hooks' state
 * still re-renders it. Preact's `shouldComponentUpdate` on the instance a function component is
 * rendered with, as preact/compat's `memo` does, without bringing compat into the bundle.
 */
export function pure<P extends object>(Inner: FunctionComponent<P>): FunctionComponent<P> {
  function shouldComponentUpdate(this: Component<P>, next: P): boolean {
    return !sameProps(this.props, next);
  }
  function Pure(this: Component<P>, props: P) {
    this.shouldComponentUpdate = shouldComponentUpdate;
    return <Inner {...props} />;
  }
  return Pure as FunctionComponent<P>;
}
