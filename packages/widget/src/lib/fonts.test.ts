import { afterEach, describe, expect, it, vi } from 'vitest';
import { whenStill } from './fonts.js';

type Callback = (entries: { isIntersecting: boolean }[]) => void;

describe('whenStill', () => {
  afterEach(() => vi.unstubAllGlobals());

  it('waits for the visitor to press Calculate in the widget, then applies once', () => {
    const root = new EventTarget();
    const apply = vi.fn();
    whenStill({} as Element, root as unknown as Node, apply);
    root.dispatchEvent(new Event('input'));
    expect(apply).not.toHaveBeenCalled();
    root.dispatchEvent(new Event('submit'));
    root.dispatchEvent(new Event('submit'));
    expect(apply).toHaveBeenCalledTimes(1);
  });

  it('applies as soon as the widget is out of view, and not while it is in view', () => {
    let report: Callback = () => undefined;
    const disconnect = vi.fn();
    vi.stubGlobal(
      'IntersectionObserver',
      class {
        constructor(callback: Callback) {
          report = callback;
        }
        observe() {}
        disconnect = disconnect;
      },
    );
    const root = new EventTarget();
    const apply = vi.fn();
    whenStill({} as Element, root as unknown as Node, apply);
    report([{ isIntersecting: true }]);
    expect(apply).not.toHaveBeenCalled();
    report([{ isIntersecting: false }]);
    expect(apply).toHaveBeenCalledTimes(1);
    expect(disconnect).toHaveBeenCalled();
    // Already applied: a later Calculate does nothing more.
    root.dispatchEvent(new Event('submit'));
    expect(apply).toHaveBeenCalledTimes(1);
  });

  it('waits once per widget however often it is asked', () => {
    const root = new EventTarget();
    const first = vi.fn();
    const second = vi.fn();
    whenStill({} as Element, root as unknown as Node, first);
    whenStill({} as Element, root as unknown as Node, second);
    root.dispatchEvent(new Event('submit'));
    expect(first).toHaveBeenCalledTimes(1);
    expect(second).not.toHaveBeenCalled();
  });
});
