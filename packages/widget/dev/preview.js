// Dev-only page script: loads the built bundles of one release and mounts each sample in preview
// mode. Query: ?release=0.1.0&only=<calculatorId>&hostile=1
import { drawLogo, samples } from './samples.js';

const params = new URLSearchParams(location.search);
const release = params.get('release') ?? '0.1.0';
const only = params.get('only');

// Everything a page could do to leak styles into an embedded widget.
const HOSTILE = `
  html { font-size: 40px !important; }
  * { color: red !important; font: 30px serif !important; text-transform: uppercase !important;
      letter-spacing: 4px !important; line-height: 3 !important; text-decoration: underline !important;
      box-sizing: content-box !important; text-align: center !important; word-spacing: 12px !important; }
  input, button, select, textarea, label { background: yellow !important; border: 6px dotted lime !important;
      padding: 24px !important; margin: 12px !important; border-radius: 0 !important; width: 50px !important; }
  div, section, p { display: inline !important; margin: 20px !important; }
  wickstone-widget { display: none !important; opacity: .2 !important; }
  :root { --wk-bg: #000; --wk-fg: #f00; --wk-accent: #0f0; }
`;
if (params.get('hostile') === '1') {
  const style = document.createElement('style');
  style.textContent = HOSTILE;
  document.head.append(style);
}

function load(src) {
  return new Promise((resolve, reject) => {
    const s = document.createElement('script');
    s.src = src;
    s.onload = resolve;
    s.onerror = () => reject(new Error(`could not load ${src}`));
    document.head.append(s);
  });
}

const chosen = samples.filter((s) => !only || s.calculatorId === only);
for (const s of chosen) await load(`../dist/releases/${release}/wickstone-${s.calculatorId}.js`);
const logo = await drawLogo();
const app = document.getElementById('app');
for (const sample of chosen) {
  const widget = structuredClone(sample);
  if (widget.settings.look.logoUrl === 'LOGO') widget.settings.look.logoUrl = logo;
  const section = document.createElement('section');
  section.innerHTML = `<h2 class="sample">${widget.calculatorId}</h2>`;
  const slot = document.createElement('div');
  slot.id = `slot-${widget.calculatorId}`;
  section.append(slot);
  app.append(section);
  window.Wickstone.mount(slot, { widget, preview: true });
}
document.body.dataset.ready = '1';
