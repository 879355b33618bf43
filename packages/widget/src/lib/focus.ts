// Keeps the visitor's place when the full widget takes over from the first view (and adopts its
// markup): which control had focus, and where its caret or selection was, so typing goes on where
// it was. The first view's own redraws remake only its fields, which it finds again by id itself.

/** The focused control, found again by what stays the same across a redraw, and its selection. */
export interface SavedFocus {
  readonly selector: string;
  readonly start: number | null;
  readonly end: number | null;
  readonly direction: 'forward' | 'backward' | 'none' | null;
}

/** How a control is found again: its id, else the data attribute that names it. */
function selectorOf(el: Element): string | null {
  // Our own ids and data values: letters, digits and dashes, nothing to escape.
  if (el.id !== '') return `#${el.id}`;
  for (const attr of ['data-unit', 'data-wickstone', 'data-input'])
    if (el.hasAttribute(attr)) return `${el.localName}[${attr}="${el.getAttribute(attr) ?? ''}"]`;
  return null;
}

/** What has focus inside `root` (a shadow root), or null when nothing there does. */
export function saveFocus(root: DocumentOrShadowRoot & ParentNode): SavedFocus | null {
  const el = root.activeElement;
  if (el === null || !root.contains(el)) return null;
  const selector = selectorOf(el);
  if (selector === null) return null;
  const text = el instanceof HTMLInputElement || el instanceof HTMLTextAreaElement ? el : null;
  let start: number | null = null;
  let end: number | null = null;
  let direction: SavedFocus['direction'] = null;
  try {
    // Radio buttons and other controls without text have no selection (reading it throws in some browsers).
    start = text?.selectionStart ?? null;
    end = text?.selectionEnd ?? null;
    direction = text?.selectionDirection ?? null;
  } catch {
    start = end = null;
  }
  return { selector, start, end, direction };
}

/** Focuses the same control in the markup now in `root`, with the same caret or selection. */
export function restoreFocus(root: ParentNode, saved: SavedFocus | null): void {
  if (saved === null) return;
  const el = root.querySelector<HTMLElement>(saved.selector);
  if (el === null) return;
  if (root instanceof ShadowRoot ? root.activeElement !== el : true) el.focus({ preventScroll: true });
  if (saved.start !== null && saved.end !== null && el instanceof HTMLInputElement) {
    try {
      el.setSelectionRange(saved.start, saved.end, saved.direction ?? undefined);
    } catch {
      // a control that takes no selection
    }
  }
}
