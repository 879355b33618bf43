import { useEffect, useRef, useState } from 'react';
import type { EmbedWidget } from '@wickstone/contracts';
import { Button, Spinner } from './ui';

/** The part of `window.Wickstone` (packages/widget, README) that the preview uses. */
interface MountHandle {
  update(options: { widget: EmbedWidget; preview: true }): void;
  unmount(): void;
}
interface WickstoneGlobal {
  bundles: Record<string, unknown>;
  mount(element: Element, options: { widget: EmbedWidget; preview: true }): MountHandle;
}

function wickstone(): WickstoneGlobal | null {
  const g = (window as unknown as { Wickstone?: unknown }).Wickstone;
  if (typeof g !== 'object' || g === null) return null;
  const w = g as Partial<WickstoneGlobal>;
  return typeof w.mount === 'function' && typeof w.bundles === 'object' && w.bundles !== null
    ? (w as WickstoneGlobal)
    : null;
}

/*
 * Each release script is loaded once per page, whatever mounts it: a second editor of the same
 * calculator reuses the bundle already registered on `window.Wickstone`. A failed load is
 * forgotten so "Try again" really asks again.
 */
const loads = new Map<string, Promise<WickstoneGlobal>>();

/** The same-origin release file of one calculator (served by the app beside the dashboard). */
export function releaseScriptPath(release: string, calculatorId: string): string {
  return `/releases/${encodeURIComponent(release)}/wickstone-${encodeURIComponent(calculatorId)}.js`;
}

function loadBundle(release: string, calculatorId: string, integrity: string): Promise<WickstoneGlobal> {
  const src = releaseScriptPath(release, calculatorId);
  const known = loads.get(src);
  if (known) return known;
  const loading = new Promise<WickstoneGlobal>((resolve, reject) => {
    const script = document.createElement('script');
    script.src = src;
    script.async = true;
    // Without data-wickstone-key the bundle only registers itself: it places nothing on this page.
    if (integrity) script.integrity = integrity;
    script.dataset.wickstonePreview = calculatorId;
    script.addEventListener('load', () => {
      const g = wickstone();
      if (g && calculatorId in g.bundles) resolve(g);
      else reject(new Error(`release ${release} has no ${calculatorId} bundle`));
    });
    script.addEventListener('error', () => {
      script.remove();
      reject(new Error(`${src} could not be loaded`));
    });
    document.head.append(script);
  });
  loads.set(src, loading);
  loading.catch(() => loads.delete(src));
  return loading;
}

/**
 * The live preview: the real widget bundle of this release, rendering the unsaved settings in
 * preview mode (it reports no runs and sends no leads), updated on every change.
 */
export function WidgetPreview({
  widget,
  integrity,
  labelledBy,
}: {
  widget: EmbedWidget;
  /** The release file's SRI hash when known: the preview runs exactly what the snippet will. */
  integrity: string;
  labelledBy: string;
}) {
  const hostRef = useRef<HTMLDivElement>(null);
  const handleRef = useRef<MountHandle | null>(null);
  const latest = useRef(widget);
  const [attempt, setAttempt] = useState(0);
  const { release, calculatorId } = widget;
  // The outcome of loading this bundle (loading until one is known for this very load), and the
  // bundle's refusal of particular settings: both derived in render, not reset from effects.
  const loadKey = `${release}|${calculatorId}|${integrity}|${attempt}`;
  const [loaded, setLoaded] = useState<{ key: string; failure: string | null } | null>(null);
  const [refused, setRefused] = useState<{ widget: EmbedWidget; message: string } | null>(null);
  const state = loaded?.key !== loadKey ? 'loading' : loaded.failure === null ? 'ready' : 'failed';
  const problem = state === 'failed' ? loaded?.failure : refused?.widget === widget ? refused.message : null;

  useEffect(() => {
    let gone = false;
    loadBundle(release, calculatorId, integrity).then(
      (g) => {
        if (gone || !hostRef.current) return;
        try {
          handleRef.current = g.mount(hostRef.current, { widget: latest.current, preview: true });
          setLoaded({ key: loadKey, failure: null });
        } catch (err) {
          setLoaded({ key: loadKey, failure: err instanceof Error ? err.message : String(err) });
        }
      },
      (err: unknown) => {
        if (gone) return;
        setLoaded({ key: loadKey, failure: err instanceof Error ? err.message : String(err) });
      },
    );
    return () => {
      gone = true;
      handleRef.current?.unmount();
      handleRef.current = null;
    };
  }, [release, calculatorId, integrity, loadKey]);

  useEffect(() => {
    latest.current = widget;
    const handle = handleRef.current;
    if (!handle) return;
    try {
      handle.update({ widget, preview: true });
    } catch (err) {
      // The bundle refused these settings; the last good rendering stays and the reason is said.
      // The bundle is the external system this effect synchronises with, and it answers at once.
      // eslint-disable-next-line react-hooks/set-state-in-effect
      setRefused({ widget, message: err instanceof Error ? err.message : String(err) });
    }
  }, [widget]);

  return (
    <div aria-labelledby={labelledBy} role="region" className="space-y-3">
      {state === 'loading' ? (
        <p role="status" className="flex items-center gap-2 text-sm text-ink-soft">
          <Spinner className="text-accent" /> Loading the widget bundle {release}…
        </p>
      ) : null}
      {state === 'failed' ? (
        <div
          role="alert"
          className="space-y-2 rounded-md border border-bad/40 bg-bad-tint px-4 py-3 text-sm text-bad"
        >
          <p className="font-semibold">The preview could not be shown.</p>
          <p>{problem}</p>
          <Button size="sm" onClick={() => setAttempt((n) => n + 1)}>
            Try again
          </Button>
        </div>
      ) : state === 'ready' && problem ? (
        <p role="alert" className="text-sm font-semibold text-bad">
          The preview kept its last rendering: {problem}
        </p>
      ) : null}
      <div ref={hostRef} data-widget-preview={calculatorId} />
    </div>
  );
}
