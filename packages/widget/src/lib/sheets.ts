/** The style sheets the widget puts into its shadow roots: the main styles, the extras', the tables'. */
export type SheetKind = 'styles' | 'extras' | 'tables';

const sheets = new Map<SheetKind, CSSStyleSheet>();

/**
 * Styles go into the shadow root only. A constructed sheet is shared by every widget of this
 * bundle on the page (parsed once) and is not an inline style a page's CSP (style-src) would
 * block; where that API is missing, a <style> inside the shadow root, after the main styles.
 */
export function adoptStyles(root: ShadowRoot, text: string, kind: SheetKind): void {
  if ('adoptedStyleSheets' in root && typeof CSSStyleSheet.prototype.replaceSync === 'function') {
    let s = sheets.get(kind);
    if (s === undefined) {
      s = new CSSStyleSheet();
      s.replaceSync(text);
      sheets.set(kind, s);
    }
    if (!root.adoptedStyleSheets.includes(s)) root.adoptedStyleSheets = [...root.adoptedStyleSheets, s];
    return;
  }
  if (root.querySelector(`style[data-wickstone="${kind}"]`) !== null) return;
  const style = document.createElement('style');
  style.setAttribute('data-wickstone', kind);
  style.textContent = text;
  // The main styles first; the others after the last style already there.
  const before = kind === 'styles' ? null : [...root.querySelectorAll('style[data-wickstone]')].pop();
  if (before) before.after(style);
  else root.prepend(style);
}
