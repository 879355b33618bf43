// Dev-only check of the live path in Debian's Chromium, against a stand-in for the embed API
// (Playwright request routing; no server process). It is not the product's end-to-end test, which
// runs against the real server: it exercises the bundle's own side of the contract quickly, and
// validates what the bundle sends with the real zod schemas from @wickstone/contracts.
// Usage: node dev/live-check.mjs   (after `npm run build`)
import assert from 'node:assert/strict';
import { readFileSync } from 'node:fs';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { chromium } from 'playwright-core';
import { embedLeadBodySchema, embedRunBodySchema } from '@wickstone/contracts';

const here = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '..');
const version = JSON.parse(readFileSync(path.join(here, 'package.json'), 'utf8')).version;
const manifest = JSON.parse(readFileSync(path.join(here, 'dist/releases', version, 'manifest.json'), 'utf8'));
const { samples } = await import('./samples.js');

const SITE = 'http://www.brackenridge-ground.example';
const API = 'http://wickstone.example';
const KEYS = {
  a: 'wk_aaaaaaaaaaaaaaaaaaaa',
  b: 'wk_bbbbbbbbbbbbbbbbbbbb',
  c: 'wk_cccccccccccccccccccc',
  denied: 'wk_dddddddddddddddddddd',
};
const widgets = {
  [KEYS.a]: { ...samples[0], publicKey: KEYS.a },
  [KEYS.b]: {
    ...samples[0],
    publicKey: KEYS.b,
    name: 'Second tube widget',
    settings: { ...samples[0].settings, units: { system: 'us', visitorMaySwitch: true } },
  },
  [KEYS.c]: { ...samples[2], publicKey: KEYS.c },
};
for (const w of Object.values(widgets)) w.settings.look = { ...w.settings.look, logoUrl: null };

const snippet = (id, key) =>
  `<script async src="${API}/releases/${version}/${manifest.files[id].file}" integrity="${manifest.files[id].integrity}" crossorigin="anonymous" data-wickstone-key="${key}"></script>`;
const page = `<!doctype html><html lang="en"><head><meta charset="utf-8"><title>Brackenridge Ground & Damp</title></head><body>
<h1>Damp and ground advice</h1>
<p id="before-a">Tube widget A:</p>${snippet('tube-rise', KEYS.a)}
<p id="before-b">Tube widget B:</p>${snippet('tube-rise', KEYS.b)}
<p id="before-c">Soil widget:</p>${snippet('soil-capillary-rise', KEYS.c)}
<p id="before-d">Not allowed here:</p>${snippet('tube-rise', KEYS.denied)}
<p id="after">End of page.</p></body></html>`;

const log = [];
let runAttempts = 0;
let leadAttempts = 0;
const storedRuns = new Set();

const browser = await chromium.launch({
  executablePath: '/usr/bin/chromium',
  headless: true,
  args: [
    '--no-sandbox',
    '--disable-gpu',
    '--disable-background-networking',
    '--disable-component-update',
    '--no-first-run',
  ],
});
const context = await browser.newContext({ viewport: { width: 1000, height: 900 } });
const cors = { 'access-control-allow-origin': SITE, 'content-type': 'application/json' };
await context.route(`${SITE}/**`, (route) =>
  route.fulfill({
    status: 200,
    contentType: 'text/html',
    body: route.request().url().endsWith('/blank') ? '<!doctype html><title>blank</title>' : page,
  }),
);
await context.route(`${API}/**`, async (route) => {
  const req = route.request();
  const url = new URL(req.url());
  log.push({
    method: req.method(),
    path: url.pathname,
    type: req.headers()['content-type'] ?? null,
    body: req.postData(),
  });
  if (url.pathname.startsWith('/releases/')) {
    const file = path.join(here, 'dist', url.pathname);
    return route.fulfill({
      status: 200,
      body: readFileSync(file),
      headers: {
        'access-control-allow-origin': '*',
        'content-type': file.endsWith('.js') ? 'text/javascript' : 'font/woff2',
      },
    });
  }
  if (req.method() === 'OPTIONS') return route.fulfill({ status: 500, body: 'no preflight expected' });
  const m = url.pathname.match(/^\/api\/v1\/embed\/widgets\/(wk_[a-z0-9]{20})$/);
  if (m) {
    if (m[1] === KEYS.denied)
      return route.fulfill({
        status: 403,
        headers: cors,
        body: JSON.stringify({ error: { code: 'forbidden', message: 'no', details: {} } }),
      });
    return route.fulfill({ status: 200, headers: cors, body: JSON.stringify(widgets[m[1]]) });
  }
  if (url.pathname === '/api/v1/embed/runs') {
    runAttempts++;
    // The first report meets a server failure: the bundle must retry with the same body.
    if (runAttempts === 1) return route.fulfill({ status: 503, headers: cors, body: '{}' });
    const body = embedRunBodySchema.parse(JSON.parse(req.postData()));
    storedRuns.add(body.id);
    return route.fulfill({
      status: 201,
      headers: cors,
      body: JSON.stringify({ id: body.id, agreed: true, duplicate: false }),
    });
  }
  if (url.pathname === '/api/v1/embed/leads') {
    leadAttempts++;
    const body = embedLeadBodySchema.parse(JSON.parse(req.postData()));
    assert.ok(storedRuns.has(body.runId), 'the lead names a run the server has acknowledged');
    if (leadAttempts === 1) {
      return route.fulfill({
        status: 400,
        headers: cors,
        body: JSON.stringify({
          error: {
            code: 'validation_failed',
            message: 'Invalid request',
            details: {
              fields: [{ field: 'body.fields.email', message: 'This address cannot receive mail' }],
            },
          },
        }),
      });
    }
    return route.fulfill({ status: 201, headers: cors, body: JSON.stringify({ id: 7 }) });
  }
  return route.fulfill({ status: 404, headers: cors, body: '{}' });
});

const tab = await context.newPage();
const errors = [];
tab.on('pageerror', (e) => errors.push(e.message));
const baseline = await (async () => {
  const blank = await context.newPage();
  await blank.goto(`${SITE}/blank`);
  const keys = await blank.evaluate(() => Object.keys(window));
  await blank.close();
  return keys;
})();
log.length = 0;
await tab.goto(`${SITE}/`);
await tab.waitForFunction(
  () =>
    document.querySelectorAll('wickstone-widget[data-state="ready"]').length === 3 &&
    document.querySelector('wickstone-widget[data-state="unavailable"]'),
);

// Placement: each host right after its own script; the refused one empty and invisible.
const placement = await tab.evaluate(() =>
  [...document.querySelectorAll('script[data-wickstone-key]')].map((s) => {
    const host = s.nextElementSibling;
    return {
      key: s.dataset.wickstoneKey,
      host: host?.localName,
      state: host?.dataset.state,
      height: host?.getBoundingClientRect().height,
      calc: host?.dataset.calculator,
    };
  }),
);
assert.deepEqual(
  placement.map((p) => p.host),
  ['wickstone-widget', 'wickstone-widget', 'wickstone-widget', 'wickstone-widget'],
);
assert.equal(placement[3].state, 'unavailable');
assert.equal(placement[3].height, 0);
assert.equal(placement[2].calc, 'soil-capillary-rise');
const added = await tab.evaluate(
  (before) => Object.keys(window).filter((k) => !before.includes(k)),
  baseline,
);
assert.deepEqual(added, ['Wickstone'], `globals added: ${added.join(', ')}`);
const g = await tab.evaluate(() => ({
  version: window.Wickstone.version,
  bundles: Object.keys(window.Wickstone.bundles).sort(),
}));
assert.deepEqual(g, { version, bundles: ['soil-capillary-rise', 'tube-rise'] });
assert.ok(
  !log.some((r) => r.path.includes(KEYS.denied) && r.method !== 'GET'),
  'nothing but the settings request for a refused key',
);

// Widget B starts in US units; A in SI.
const hostA = tab.locator('wickstone-widget').nth(0);
const hostB = tab.locator('wickstone-widget').nth(1);
assert.equal(await hostB.locator('[data-wickstone="root"]').getAttribute('data-system'), 'us');
await hostA.locator('[data-input="diameter"]').fill('0.5');
await hostA.locator('[data-wickstone="calculate"]').click();
await hostA.locator('[data-output="rise"]').waitFor();
assert.equal(await hostA.locator('[data-output="rise"]').getAttribute('data-unit'), 'mm');
const riseSi = Number(await hostA.locator('[data-output="rise"]').getAttribute('data-value'));
await hostA.locator('[data-unit="us"]').check();
assert.equal(await hostA.locator('[data-output="rise"]').getAttribute('data-unit'), 'in');
assert.equal(await hostA.locator('[data-input="diameter"]').inputValue(), '0.019685');
assert.equal(Number(await hostA.locator('[data-output="rise"]').getAttribute('data-value')), riseSi);

// Every input is named with its unit (label plus unit suffix label).
assert.equal(
  await hostA.getByRole('textbox', { name: 'Bore (inside diameter), in', exact: true }).count(),
  1,
);
assert.equal(await hostA.getByRole('combobox', { name: 'Liquid', exact: true }).count(), 1);

// The report: retried after the 503 with the very same body, as text/plain.
await hostA.locator('[data-result][data-report="stored"]').waitFor({ timeout: 10000 });
const runs = log.filter((r) => r.path === '/api/v1/embed/runs');
assert.equal(runs.length, 2);
assert.equal(runs[0].body, runs[1].body);
assert.equal(runs[0].type, 'text/plain;charset=UTF-8');
const run = JSON.parse(runs[0].body);
assert.equal(run.publicKey, KEYS.a);
assert.equal(run.inputs.diameter, 0.0005);
assert.equal(run.unitSystem, 'si');
assert.equal(run.pageUrl, `${SITE}/`);

// Lead form: the visitor's slips first, then the server's field error beside its field, then success.
await hostA.locator('[data-wickstone="lead-submit"]').click();
assert.equal(await hostA.locator('[data-lead-error="name"]').count(), 1);
assert.equal(await hostA.locator('[data-lead-error="consent"]').count(), 1);
await hostA.locator('[data-lead-field="name"]').fill('Imogen Tarrant');
await hostA.locator('[data-lead-field="email"]').fill('imogen.tarrant@visitor.example');
await hostA.locator('[data-lead-field="consent"]').check();
await hostA.locator('[data-lead-field="sendCopy"]').check();
await hostA.locator('[data-wickstone="lead-submit"]').click();
await hostA.locator('[data-lead-error="email"]').waitFor();
assert.equal(
  await hostA.locator('[data-lead-error="email"]').textContent(),
  'This address cannot receive mail',
);
assert.equal(
  await hostA.locator('[data-lead-field="email"]').getAttribute('aria-describedby'),
  'wk-lead-email-error',
);
await hostA.locator('[data-wickstone="lead-submit"]').click();
await hostA.locator('[data-wickstone="lead-confirmation"]').waitFor();
const lead = JSON.parse(log.filter((r) => r.path === '/api/v1/embed/leads').at(-1).body);
assert.deepEqual(lead, {
  runId: run.id,
  publicKey: KEYS.a,
  fields: { name: 'Imogen Tarrant', email: 'imogen.tarrant@visitor.example' },
  consent: true,
  sendCopy: true,
});

// Field errors from calc-core beside the field, in the visitor's units; nothing reported for them.
const before = log.length;
await hostB.locator('[data-input="diameter"]').fill('3');
await hostB.locator('[data-wickstone="calculate"]').click();
await hostB.locator('[data-field-error="diameter"]').waitFor();
console.log('field error (US units):', await hostB.locator('[data-field-error="diameter"]').textContent());
assert.equal(log.length, before);
// Preview through Wickstone.mount: an update redraws in place (the result stays), nothing is sent.
const sentBefore = log.length;
const preview = await tab.evaluate(async (widget) => {
  const slot = document.createElement('div');
  document.body.append(slot);
  const handle = window.Wickstone.mount(slot, { widget, preview: true });
  const root = () => slot.querySelector('wickstone-widget').shadowRoot;
  // The first view draws once the engine has arrived; the full widget takes over after first paint.
  for (
    let i = 0;
    !slot.querySelector('wickstone-widget')?.shadowRoot?.querySelector('[data-view="full"]');
    i++
  ) {
    if (i > 400) throw new Error('the preview never became the full widget');
    await new Promise((r) => setTimeout(r, 25));
  }
  root().querySelector('[data-wickstone="calculate"]').click();
  await new Promise((r) => setTimeout(r, 50));
  const recoloured = structuredClone(widget);
  recoloured.settings.look.colors.primary = '#4b3fa8';
  handle.update({ widget: recoloured, preview: true });
  await new Promise((r) => setTimeout(r, 50));
  const out = {
    hosts: slot.querySelectorAll('wickstone-widget').length,
    mode: slot.querySelector('wickstone-widget').dataset.mode,
    keptResult: root().querySelector('[data-result]') !== null,
    accent: root().querySelector('[data-wickstone="root"]').style.getPropertyValue('--wk-accent'),
    previewNote: root().querySelector('[data-wickstone="preview-note"]') !== null,
    leadDisabled: root().querySelector('[data-wickstone="lead-form"] fieldset').disabled,
  };
  let refused = '';
  try {
    window.Wickstone.mount(slot, { widget: { ...widget, calculatorId: 'wicking-time' }, preview: true });
  } catch (e) {
    refused = e.message;
  }
  handle.unmount();
  return { ...out, refused, afterUnmount: slot.children.length };
}, widgets[KEYS.a]);
assert.deepEqual(preview, {
  hosts: 1,
  mode: 'preview',
  keptResult: true,
  accent: '#4b3fa8',
  previewNote: true,
  leadDisabled: true,
  refused: 'Wickstone: no bundle for calculator "wicking-time" is loaded on this page',
  afterUnmount: 0,
});
await tab.waitForTimeout(200);
assert.equal(log.length, sentBefore, 'preview sends nothing');

assert.deepEqual(errors, []);
assert.ok(!log.some((r) => r.method === 'OPTIONS'), 'no preflight');
await browser.close();
console.log('live check passed:', log.length, 'requests to the stand-in API');
