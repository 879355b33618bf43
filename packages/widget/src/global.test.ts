import { describe, expect, it, vi } from 'vitest';
import { installGlobal, type BundleEntry, type MountOptions } from './global.js';

const entry = (
  calculatorId: string,
  version = '0.1.0',
): BundleEntry & { mount: ReturnType<typeof vi.fn> } => ({
  calculatorId,
  version,
  calcCoreVersion: '0.1.0',
  mount: vi.fn(() => ({ update: () => {}, unmount: () => {} })),
});
const options = (calculatorId: string) => ({ widget: { calculatorId } }) as unknown as MountOptions;

describe('installGlobal', () => {
  it('creates one shared object and dispatches mount to the bundle of the widget’s calculator', () => {
    const win: { Wickstone?: unknown } = {};
    const tube = entry('tube-rise');
    const soil = entry('soil-capillary-rise', '0.2.0');
    const g = installGlobal(win, '0.1.0', tube);
    expect(installGlobal(win, '0.2.0', soil)).toBe(g);
    expect(win.Wickstone).toBe(g);
    expect(g.version).toBe('0.1.0');
    expect(Object.keys(g.bundles).sort()).toEqual(['soil-capillary-rise', 'tube-rise']);
    const el = {} as Element;
    g.mount(el, options('soil-capillary-rise'));
    expect(soil.mount).toHaveBeenCalledWith(el, options('soil-capillary-rise'));
    expect(tube.mount).not.toHaveBeenCalled();
  });

  it('refuses a calculator no loaded bundle renders', () => {
    const g = installGlobal({}, '0.1.0', entry('tube-rise'));
    expect(() => g.mount({} as Element, options('wicking-time'))).toThrow(
      /no bundle for calculator "wicking-time"/,
    );
  });

  it('lets the latest bundle loaded for a calculator win, and replaces a foreign Wickstone value', () => {
    const win: { Wickstone?: unknown } = { Wickstone: 'something else' };
    const older = entry('tube-rise', '0.1.0');
    const newer = entry('tube-rise', '0.1.1');
    installGlobal(win, '0.1.0', older);
    const g = installGlobal(win, '0.1.1', newer);
    g.mount({} as Element, options('tube-rise'));
    expect(newer.mount).toHaveBeenCalledTimes(1);
    expect(older.mount).not.toHaveBeenCalled();
  });
});
