import { MANROPE_FAMILY } from './look.js';

/** The one Manrope face of this page, once a widget asked for it. */
let face: FontFace | null = null;
/** Widgets already waiting for a still moment. */
const waiting = new WeakSet<Node>();

/**
 * Runs `apply` once, at a moment when a font swap moves nothing the visitor is reading: when they
 * press Calculate in this widget (the result appears then anyway), or while the widget is out of view.
 */
export function whenStill(host: Element, root: Node, apply: () => void): void {
  if (waiting.has(root)) return;
  waiting.add(root);
  let done = false;
  const run = (): void => {
    if (done) return;
    done = true;
    root.removeEventListener('submit', run, true);
    seen?.disconnect();
    apply();
  };
  root.addEventListener('submit', run, true);
  const seen =
    typeof IntersectionObserver === 'function'
      ? new IntersectionObserver((entries) => {
          if (entries.some((e) => !e.isIntersecting)) run();
        })
      : null;
  seen?.observe(host);
}

/**
 * Fetches Manrope (one variable font file, every weight) after the widget's first paint and adds it
 * to the document's FontFaceSet (a shadow tree uses the document's fonts), once per document
 * whichever widgets ask: no style element is put into the page. The face is `display: swap`, but it
 * is added only when loaded and at a still moment (`whenStill`), so its different widths never
 * reflow text under a reader's eyes: until then the fallback stack shows.
 * @param releaseBase the release folder's URL, ending in `/`
 */
export function registerManrope(fonts: FontFaceSet, releaseBase: string, host: Element, root: Node): void {
  for (const f of fonts) if (f.family.replace(/["']/g, '') === MANROPE_FAMILY) return;
  const url = JSON.stringify(releaseBase + __WICKSTONE_MANROPE_FILE__);
  const mine = (face ??= new FontFace(MANROPE_FAMILY, `url(${url}) format("woff2")`, {
    weight: '200 800',
    style: 'normal',
    display: 'swap',
  }));
  mine.load().then(
    () =>
      whenStill(host, root, () => {
        if (![...fonts].includes(mine)) fonts.add(mine);
      }),
    () => undefined,
  );
}
