// Dev-only: opens the preview pages in Debian's Chromium and saves screenshots under /tmp/shots/
// (or SHOTS_DIR), of the package's built release (or RELEASE=<version>). FIRST_VIEW=1 refuses the
// app chunk, so the shots show the first view alone; otherwise each widget is shot once the full
// widget has taken over. Two runs' folders compare pixel for pixel (same build, same pictures,
// but for the working's arrow caught in its turn).
// Files are served from this package through Playwright's request routing (no server process).
// Usage: node dev/shoot.mjs [calculatorId]
import { mkdirSync, readFileSync, existsSync } from 'node:fs';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { chromium } from 'playwright-core';

const here = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '..');
const ORIGIN = 'http://widget.test';
const TYPES = {
  '.html': 'text/html',
  '.js': 'text/javascript',
  '.json': 'application/json',
  '.woff2': 'font/woff2',
  '.css': 'text/css',
};
const only = process.argv[2] ?? null;
const release =
  process.env.RELEASE ?? JSON.parse(readFileSync(path.join(here, 'package.json'), 'utf8')).version;
const firstView = process.env.FIRST_VIEW === '1';
const OUT = process.env.SHOTS_DIR ?? '/tmp/shots';
mkdirSync(OUT, { recursive: true });

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

async function open(width, query) {
  const context = await browser.newContext({ viewport: { width, height: 900 }, deviceScaleFactor: 1 });
  await context.route(`${ORIGIN}/**`, (route) => {
    const file = path.join(here, decodeURIComponent(new URL(route.request().url()).pathname));
    if (firstView && /[\\/]app-[^\\/]*\.js$/.test(file))
      return route.fulfill({ status: 404, body: 'first view only' });
    if (!file.startsWith(here) || !existsSync(file)) return route.fulfill({ status: 404, body: 'not found' });
    return route.fulfill({
      status: 200,
      body: readFileSync(file),
      headers: {
        'content-type': TYPES[path.extname(file)] ?? 'application/octet-stream',
        'access-control-allow-origin': '*',
      },
    });
  });
  const page = await context.newPage();
  const problems = [];
  page.on('pageerror', (e) => problems.push(`pageerror: ${e.message}`));
  page.on('console', (m) => m.type() === 'error' && problems.push(`console: ${m.text()}`));
  await page.goto(`${ORIGIN}/dev/preview.html?release=${release}&${query}`);
  await page.waitForSelector('body[data-ready="1"]');
  await page.evaluate(() => document.fonts.ready);
  return { context, page, problems };
}

async function calculateAll(page) {
  // A click while the full widget takes over could land on the first view's button as it goes.
  if (!firstView)
    for (const mount of await page.locator('[data-wickstone="mount"]').all())
      await mount.and(page.locator('[data-view="full"]')).waitFor({ timeout: 10_000 });
  for (const button of await page.locator('[data-wickstone="calculate"]').all()) await button.click();
  await page.waitForTimeout(200);
}

const ids = only
  ? [only]
  : [
      'tube-rise',
      'slot-rise',
      'soil-capillary-rise',
      'interface-pressure',
      'wetting-force',
      'wicking-time',
      'contact-angle-from-force',
      'tension-from-rise',
      'rising-damp-height',
      'frost-screening',
    ];
for (const [width, tag] of [
  [1280, 'desktop'],
  [390, 'phone'],
]) {
  for (const id of ids) {
    const { context, page, problems } = await open(width, `only=${id}`);
    await calculateAll(page);
    if (
      !firstView &&
      ['tube-rise', 'soil-capillary-rise', 'rising-damp-height', 'frost-screening'].includes(id)
    )
      await page.locator('[data-wickstone="working"] summary').first().click();
    await page.screenshot({ path: `${OUT}/widget-${id}-${tag}.png`, fullPage: true });
    // Parts at full resolution, to check type and spacing closely.
    const top = await page.evaluate(
      () => document.querySelector('wickstone-widget').getBoundingClientRect().top + window.scrollY,
    );
    await page.screenshot({
      path: `${OUT}/widget-${id}-${tag}-top.png`,
      fullPage: true,
      clip: { x: 0, y: top, width, height: 900 },
    });
    await page
      .locator('[data-wickstone="result"]')
      .first()
      .screenshot({ path: `${OUT}/widget-${id}-${tag}-result.png` });
    const lead = page.locator('[data-wickstone="lead-form"]').first();
    if (await lead.count()) await lead.screenshot({ path: `${OUT}/widget-${id}-${tag}-lead.png` });
    if (problems.length) console.log(id, tag, problems);
    await context.close();
  }
}

// Keyboard only: Tab through the widget, Enter to calculate; the focus ring must show.
{
  const { context, page } = await open(900, 'only=tube-rise');
  const order = [];
  for (let i = 0; i < 12 && order.at(-1) !== 'calculate'; i++) {
    await page.keyboard.press('Tab');
    order.push(
      await page.evaluate(() => {
        const el = document.querySelector('wickstone-widget')?.shadowRoot?.activeElement;
        return el
          ? (el.getAttribute('data-input') ??
              el.getAttribute('data-unit') ??
              el.getAttribute('data-wickstone') ??
              el.localName)
          : 'outside';
      }),
    );
    if (order.at(-1) === 'diameter')
      await page.locator('wickstone-widget').screenshot({ path: `${OUT}/widget-focus-input.png` });
    if (order.at(-1) === 'calculate')
      await page.locator('wickstone-widget').screenshot({ path: `${OUT}/widget-focus-button.png` });
  }
  await page.keyboard.press('Enter');
  await page.locator('[data-result]').waitFor();
  console.log('tab order:', order.join(' → '), '| Enter on Calculate shows a result');
  await context.close();
}

// The same widget with and without hostile page CSS: the computed styles inside must not differ
// (only the width it is given, which is the page's to decide).
const PROPS = [
  'font-family',
  'font-size',
  'font-weight',
  'color',
  'text-transform',
  'letter-spacing',
  'line-height',
  'text-decoration-line',
  'text-align',
  'background-color',
  'border-top-width',
  'padding-top',
];
const looks = [];
for (const hostile of ['0', '1']) {
  const { context, page, problems } = await open(900, `only=tube-rise&hostile=${hostile}`);
  await calculateAll(page);
  await page
    .locator('wickstone-widget')
    .first()
    .screenshot({ path: `${OUT}/widget-hostile-${hostile}.png` });
  looks.push(
    await page.evaluate((props) => {
      const root = document.querySelector('wickstone-widget').shadowRoot;
      const out = {};
      for (const sel of [
        '.title',
        '.label',
        '[data-input="diameter"]',
        '[data-input="liquid"]',
        '[data-wickstone="calculate"]',
        '.figure',
        '.label .unit',
        '.note',
      ]) {
        const cs = getComputedStyle(root.querySelector(sel));
        out[sel] = props.map((p) => `${p}: ${cs.getPropertyValue(p)}`).join('; ');
      }
      return out;
    }, PROPS),
  );
  if (problems.length) console.log('hostile', hostile, problems);
  await context.close();
}
const diffs = Object.keys(looks[0]).filter((k) => looks[0][k] !== looks[1][k]);
console.log(
  diffs.length === 0 ? 'hostile CSS: no computed style differs inside the widget' : 'hostile CSS changed:',
  diffs.map((k) => `${k}\n  ${looks[0][k]}\n  ${looks[1][k]}`).join('\n'),
);
await browser.close();
console.log(`screenshots in ${OUT}`);
