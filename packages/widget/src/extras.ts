// The extras chunk: what a widget shows or needs only after its first paint (the run reporter too:
// a calculation made before it arrives is sent when it does, see `deferredReporter`). The runtime imports
// it lazily (`lazy.ts`), so it never counts against the first flight.
export { LeadForm } from './ui/LeadForm.js';
export { SheetBlock } from './ui/SheetBlock.js';
export { Notes, Picture, Working } from './ui/Working.js';
export { createReporter } from './lib/reporter.js';
export { registerManrope } from './lib/fonts.js';
export { default as css } from './ui/extras.css?inline';
