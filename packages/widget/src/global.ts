import type { EmbedWidget } from '@wickstone/contracts';

/** What `Wickstone.mount` takes. */
export interface MountOptions {
  /** The widget's settings, as the embed API answers them (or the dashboard's unsaved draft). */
  readonly widget: EmbedWidget;
  /** Render only: never fetch settings, report runs or send leads. */
  readonly preview?: boolean;
  /** Origin (or base URL) of the Wickstone server for runs and leads; defaults to the bundle's own origin. */
  readonly apiBase?: string;
}

/** A mounted widget: re-render with new options (same calculator), or take it out of the page. */
export interface MountHandle {
  update(options: MountOptions): void;
  unmount(): void;
}

/** One loaded calculator bundle. */
export interface BundleEntry {
  readonly calculatorId: string;
  readonly version: string;
  readonly calcCoreVersion: string;
  mount(element: Element, options: MountOptions): MountHandle;
}

/** `window.Wickstone`: the only name any bundle puts on the page, shared by every bundle loaded. */
export interface WickstoneGlobal {
  /** The release of the bundle that created this object. */
  readonly version: string;
  /** Loaded bundles by calculator id (the latest loaded for an id wins). */
  readonly bundles: Record<string, BundleEntry>;
  /** Renders `options.widget` into `element` with the bundle of its calculator. */
  mount(element: Element, options: MountOptions): MountHandle;
}

declare global {
  interface Window {
    Wickstone?: WickstoneGlobal;
  }
}

/**
 * The shared `Wickstone` object on `host` (normally `window`), created by the first bundle to run.
 * A later bundle of any release only adds itself to `bundles`, so the dispatching `mount` keeps
 * working for every calculator on the page.
 */
export function installGlobal(
  host: { Wickstone?: unknown },
  version: string,
  entry: BundleEntry,
): WickstoneGlobal {
  let g = host.Wickstone as Partial<WickstoneGlobal> | null | undefined;
  // Anything else under that name (not a Wickstone object) is replaced.
  if (typeof g?.mount !== 'function' || typeof g.bundles !== 'object' || !g.bundles) {
    // No prototype: a calculator id never finds an inherited property.
    const bundles = Object.create(null) as Record<string, BundleEntry>;
    host.Wickstone = g = {
      version,
      bundles,
      mount(element, options) {
        const id = options?.widget?.calculatorId;
        const bundle = bundles[id];
        if (!bundle) throw Error(`Wickstone: no bundle for calculator "${id}" on this page`);
        return bundle.mount(element, options);
      },
    };
  }
  g.bundles![entry.calculatorId] = entry;
  return g as WickstoneGlobal;
}
