/** Set on a snippet's script once a widget has been placed for it, so no other bundle run takes it again. */
export const PLACED_ATTR = 'data-wickstone-placed';
// A widget key: a reference key (four blocks of four Crockford Base32 symbols and a check symbol,
// from 0.3.0) or an older `wk_` key. The server checks the check symbol; the shape is enough here.
const KEY = /^(wk_[a-z\d]{20}|([\dA-HJKMNP-TV-Z]{4}-){4}[\dA-HJKMNP-TV-Z])$/;

/** Whether a script URL is this calculator's bundle (any release, any server). */
export function isBundleSrc(src: string, calculatorId: string): boolean {
  try {
    return new URL(src).pathname.endsWith(`/wickstone-${calculatorId}.js`);
  } catch {
    return false;
  }
}

/**
 * The Wickstone server a placed widget talks to, without a trailing slash: `data-wickstone-api`
 * when given as an http(s) URL (a firm proxying the API under its own path), else the origin the
 * script came from.
 */
export function apiBaseFor(src: string, override: string | null): string | null {
  const given = httpUrl(override?.trim());
  return given ? (given.origin + given.pathname).replace(/\/+$/, '') : (httpUrl(src)?.origin ?? null);
}

/** `text` as an http(s) URL, else null (not a URL, or another scheme). */
function httpUrl(text: string | undefined): URL | null {
  try {
    const u = new URL(text!);
    return /^https?:$/.test(u.protocol) ? u : null;
  } catch {
    return null;
  }
}

/** The release folder a bundle was loaded from (where its fonts sit), ending in `/`. */
export function releaseBaseFor(src: string): string | null {
  try {
    return new URL('.', src).href;
  } catch {
    return null;
  }
}

export function isPublicKey(key: string | undefined): key is string {
  return key !== undefined && KEY.test(key);
}

/**
 * The script element this bundle run belongs to: `document.currentScript` while it is one of
 * ours; otherwise (a loader that runs scripts from elsewhere) the first snippet for this
 * calculator not yet placed, else any script tag loading it (a preview page without a key).
 */
export function findOwnScript(doc: Document, calculatorId: string): HTMLScriptElement | null {
  const ours = (s: Element | null): s is HTMLScriptElement =>
    s instanceof HTMLScriptElement && isBundleSrc(s.src, calculatorId);
  const current = doc.currentScript;
  if (ours(current)) return current;
  const scripts = [...doc.scripts].filter(ours);
  return (
    scripts.find((s) => s.hasAttribute('data-wickstone-key') && !s.hasAttribute(PLACED_ATTR)) ??
    scripts[0] ??
    null
  );
}

/** The element a widget renders into (its shadow root holds the widget). */
export const HOST_TAG = 'wickstone-widget';

/**
 * The host for a snippet's widget: the placeholder the snippet put just before its script (it
 * reserves the widget's height, so nothing on the page moves when the widget appears), else a new
 * one right after the script (or at the end of the body, for a script placed in the head).
 */
export function insertHost(script: HTMLScriptElement, calculatorId: string): HTMLElement {
  const doc = script.ownerDocument;
  const before = script.previousElementSibling;
  const reserved =
    before instanceof HTMLElement &&
    before.localName === HOST_TAG &&
    before.getAttribute('data-calculator') === calculatorId &&
    !before.shadowRoot;
  const host = reserved ? before : doc.createElement(HOST_TAG);
  host.setAttribute('data-wickstone', 'host');
  host.setAttribute('data-calculator', calculatorId);
  if (reserved) return host;
  const append = (): void => doc.body.append(host);
  if (script.parentNode && !doc.head?.contains(script)) script.after(host);
  else if (doc.body) append();
  else doc.addEventListener('DOMContentLoaded', append, { once: true });
  return host;
}
