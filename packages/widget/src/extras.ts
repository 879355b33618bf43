// The extras chunk: what a widget shows or needs only after its first paint. The runtime imports
// it lazily (`lazy.ts`), so it never counts against the first flight.
export { LeadForm } from './ui/LeadForm.js';
export { Notes, Picture, Working } from './ui/Working.js';
export { registerManrope } from './lib/fonts.js';
export { default as css } from './ui/extras.css?inline';
