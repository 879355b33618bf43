// The full widget's chunk (`app-<hash>.js`): Preact and the whole App (working, notes, texts, lead
// form, sheet, tables). Fetched after first paint; it takes over from the first view (`first/`).
export { mountWidget } from './mount.js';
