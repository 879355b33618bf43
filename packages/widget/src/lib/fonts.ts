import { MANROPE_FAMILY } from './look.js';

/**
 * Registers Manrope with the document's FontFaceSet (a shadow tree uses the document's fonts), once
 * per document whichever widgets ask: no style element is put into the page. One variable font
 * file holds every weight; `display: swap` shows the fallback stack until it is here, and the
 * widget asks for it only after its first paint (with the extras).
 * @param releaseBase the release folder's URL, ending in `/`
 */
export function registerManrope(fonts: FontFaceSet, releaseBase: string): void {
  for (const face of fonts) if (face.family.replace(/["']/g, '') === MANROPE_FAMILY) return;
  const url = JSON.stringify(releaseBase + __WICKSTONE_MANROPE_FILE__);
  const face = new FontFace(MANROPE_FAMILY, `url(${url}) format("woff2")`, {
    weight: '200 800',
    style: 'normal',
    display: 'swap',
  });
  fonts.add(face);
  // Fetch it now (after first paint) rather than when text first needs it.
  void face.load().catch(() => undefined);
}
