// @vitest-environment happy-dom
import { afterEach, describe, expect, it } from 'vitest';
import { findOwnScript, insertHost, PLACED_ATTR } from './placement.js';

const SRC = 'https://app.wickstone.example/releases/0.3.0/wickstone-tube-rise.js';

/** A script tag as a snippet writes it (not run: happy-dom does not fetch it). */
function tag(src: string, key?: string): HTMLScriptElement {
  const s = document.createElement('script');
  s.type = 'text/plain'; // never fetched or run here
  s.src = src;
  if (key !== undefined) s.setAttribute('data-wickstone-key', key);
  return s;
}

afterEach(() => {
  document.head.replaceChildren();
  document.body.replaceChildren();
});

describe('insertHost', () => {
  it('takes the place the snippet reserved just before its script', () => {
    const held = document.createElement('wickstone-widget');
    held.setAttribute('data-calculator', 'tube-rise');
    held.style.minHeight = '420px';
    const script = tag(SRC, 'wk_abcdefghij0123456789');
    document.body.append(held, script);
    const host = insertHost(script, 'tube-rise');
    expect(host).toBe(held);
    expect(host.getAttribute('data-wickstone')).toBe('host');
    expect(document.querySelectorAll('wickstone-widget')).toHaveLength(1);
  });

  it('makes a new host right after the script when the place before it is not this calculator’s, or is taken', () => {
    // Another calculator's place; this calculator's, already holding a widget.
    for (const [calculator, rendered] of [
      ['slot-rise', false],
      ['tube-rise', true],
    ] as const) {
      document.body.replaceChildren();
      const before = document.createElement('wickstone-widget');
      before.setAttribute('data-calculator', calculator);
      if (rendered) before.attachShadow({ mode: 'open' });
      const script = tag(SRC);
      document.body.append(before, script);
      const host = insertHost(script, 'tube-rise');
      expect(host).not.toBe(before);
      expect(script.nextElementSibling).toBe(host);
      expect(host.localName).toBe('wickstone-widget');
      expect(host.getAttribute('data-calculator')).toBe('tube-rise');
      expect(host.getAttribute('data-wickstone')).toBe('host');
    }
  });

  it('puts the host at the end of the body for a script in the head', () => {
    const script = tag(SRC);
    document.head.append(script);
    document.body.append(document.createElement('p'));
    const host = insertHost(script, 'tube-rise');
    expect(document.body.lastElementChild).toBe(host);
    expect(document.head.contains(host)).toBe(false);
  });
});

describe('findOwnScript', () => {
  it('without a current script, takes the first snippet of this calculator not yet placed, else any tag loading it', () => {
    const other = tag(SRC.replace('tube-rise', 'slot-rise'), 'wk_abcdefghij0123456789');
    const preview = tag(SRC);
    const placed = tag(SRC, 'wk_placedplaced0123456');
    placed.setAttribute(PLACED_ATTR, '');
    const next = tag(`${SRC}?v=2`, 'wk_nextnextne0123456789');
    document.body.append(other, preview, placed, next);
    expect(findOwnScript(document, 'tube-rise')).toBe(next);
    next.setAttribute(PLACED_ATTR, '');
    expect(findOwnScript(document, 'tube-rise')).toBe(preview);
    expect(findOwnScript(document, 'wicking-time')).toBeNull();
  });
});
