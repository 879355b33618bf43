// The widget's first flight, measured in Chromium through the DevTools protocol on a slow network
// with the CPU slowed four times: for one widget of each calculator and for the demo firm's page
// with two widgets, the requests and compressed bytes the app sent before the calculator could be
// used, the bytes after the page went quiet, the time to usable, the cumulative layout shift and
// the time from typing a value to seeing its result, when the full widget had taken over from the
// first view, how many runtimes the page fetched and whether
// the shipped font came before or after the calculator was usable. The baseline, measured in the same run under
// the same profile, is the firm's page with no widget on it.
//
// A benchmark, not a test: it prints figures and asserts nothing. Needs the built tree
// (`npm run build`) and the test database's DB_* variables exported (see DEVELOPERS.md):
//   npm run bench -w tests            (BENCH_PORT, default 5670; the firm's site on BENCH_PORT + 1;
//                                      BENCH_ONLY=<calculator id>,… measures those widgets alone;
//                                      BENCH_PROFILE=1 prints where a click's CPU time went,
//                                      BENCH_PROFILE=all for every round and their medians;
//                                      BENCH_ROUNDS=<n> types to result n times, default 3)
import { readFileSync } from 'node:fs';
import { createServer, type Server } from 'node:http';
import { loadavg } from 'node:os';
import { calculators } from '@wickstone/calc-core';
import { defaultWidgetSettings, type WidgetSettings } from '@wickstone/contracts';
import { createApp } from '@wickstone/server/app';
import { createLogger } from '@wickstone/server/logger';
import { createTestDatabase, seedOrgWithTeam, TestClient } from '@wickstone/server/testing';
import type { Browser, CDPSession, Page } from 'playwright-core';
import { launchBrowser } from '../support/browser.js';

const appPort = Number(process.env.BENCH_PORT ?? 5670);
const sitePort = appPort + 1;
const appOrigin = `http://127.0.0.1:${appPort}`;
const siteOrigin = `http://127.0.0.1:${sitePort}`;

/** A slow mobile link (about 1.6 Mbit/s down, 150 ms round trip) and a CPU four times slower. */
const NETWORK = {
  offline: false,
  latency: 150,
  downloadThroughput: (1.6 * 1024 * 1024) / 8,
  uploadThroughput: (750 * 1024) / 8,
};
const CPU_SLOWDOWN = 4;
const QUIET_MS = 1500;

function listen(server: Server, port: number): Promise<void> {
  return new Promise((resolve, reject) => {
    server.once('error', reject);
    server.listen(port, '127.0.0.1', () => resolve());
  });
}

const template = readFileSync(new URL('../../scripts/demo-site/index.html', import.meta.url), 'utf8');
/** The demo page with `one` and `two` in its first two widget places and its other places left empty. */
const sitePage = (one: string, two: string) =>
  template
    .replace('{{WIDGET_1}}', one)
    .replace('{{WIDGET_2}}', two)
    .replace(/\{\{WIDGET_[A-Z0-9]+\}\}/g, '');

interface Typing {
  /** From the click to the frame presented after its handlers (0: under 16 ms, unreported). */
  shown: number | null;
  /** Whether the new result was in that frame (every round). */
  inFirst: boolean;
  /** From the click to the frame after the one with the full run (the working) and its report sent. */
  full: number | null;
  /** From the click to the frame after the one with the report's answer. */
  stored: number | null;
  /**
   * The keystroke before the click: from its input event to the end of the microtasks it queued
   * (the widget's render of the form), script alone, without style, layout or paint.
   */
  keystroke: number | null;
}

// BENCH_ROUNDS: more rounds give steadier medians on a shared, loaded machine.
const TYPING_ROUNDS = Math.max(1, Number(process.env.BENCH_ROUNDS ?? 3) || 3);

interface Figures {
  requests: number;
  bytes: number;
  totalRequests: number;
  totalBytes: number;
  usableMs: number;
  /** When the full widget (the app chunk) had taken over every first view; null if it never did. */
  fullMs: number | null;
  cls: number;
  /** Typing to result with the CPU four times slower, then at full speed; null without typing. */
  slow: Typing | null;
  fast: Typing | null;
  runtimeLoads: number;
  /** The shipped font: not fetched, or fetched before or after the calculator was usable. */
  font: 'none' | 'before' | 'after';
  heights: string;
}

/**
 * Runs in the page before anything else: records layout shifts and when every widget is usable.
 * Plain source text, not a function: the TypeScript runner adds helpers the page does not have.
 */
const pageProbe = (expected: number) => `
  window.__cls = 0;
  window.__shifts = [];
  window.__usableAt = null;
  const describe = (n) => !n ? '?' : n.nodeType === 1
    ? n.localName + (n.getAttribute('data-wickstone') ? '[data-wickstone=' + n.getAttribute('data-wickstone') + ']' : n.className ? '.' + String(n.className).split(' ')[0] : '')
    : '#text';
  new PerformanceObserver((list) => {
    for (const e of list.getEntries()) {
      if (e.hadRecentInput) continue;
      window.__cls += e.value;
      // What moved, for BENCH_DEBUG: each shifted node, where it was and where it went (x, y, width,
      // height), and the widths of the demo page's columns then.
      window.__shifts.push(e.value.toFixed(4) + ' at ' + Math.round(e.startTime) + ' ms: ' + (e.sources || []).map((s) =>
        describe(s.node) + ' x ' + Math.round(s.previousRect.x) + '→' + Math.round(s.currentRect.x) +
        ' y ' + Math.round(s.previousRect.y) + '→' + Math.round(s.currentRect.y) +
        ' w ' + Math.round(s.previousRect.width) + '→' + Math.round(s.currentRect.width) +
        ' h ' + Math.round(s.previousRect.height) + '→' + Math.round(s.currentRect.height)).join(', ') +
        '; columns of .pair: ' + [...document.querySelectorAll('.pair > section')].map((c) => Math.round(c.getBoundingClientRect().width)).join('/'));
    }
  }).observe({ type: 'layout-shift', buffered: true });
  const usable = () => {
    const hosts = [...document.querySelectorAll('wickstone-widget')];
    return hosts.length === ${expected} && hosts.every((h) => {
      const button = h.shadowRoot && h.shadowRoot.querySelector('[data-wickstone="calculate"]');
      return h.getAttribute('data-state') === 'ready' && button && !button.disabled;
    });
  };
  const tick = () => {
    if (${expected} > 0 ? usable() : document.readyState === 'complete') {
      window.__usableAt = performance.now();
      window.__heights = [...document.querySelectorAll('wickstone-widget')].map((h) => {
        const shown = h.shadowRoot.querySelector('[data-wickstone="root"]').getBoundingClientRect().height;
        return Math.round(shown) + '/' + (parseInt(h.style.minHeight, 10) || 0);
      });
      window.__usable();
    } else requestAnimationFrame(tick);
  };
  requestAnimationFrame(tick);
  window.__fullAt = null;
  const full = () => {
    const hosts = [...document.querySelectorAll('wickstone-widget')];
    if (${expected} > 0 && hosts.length === ${expected} && hosts.every((h) => h.shadowRoot && h.shadowRoot.querySelector('div[data-wickstone="mount"][data-view="full"]')))
      window.__fullAt = performance.now();
    else if (${expected} > 0) requestAnimationFrame(full);
  };
  requestAnimationFrame(full);
`;

/**
 * Types into the first widget and readies the measuring; the bench then presses "Work it out" with
 * a real (trusted) click and `typedWait` resolves with what the visitor saw, in milliseconds from
 * the click's own time stamp: `shown`, the frame presented with the new result (the click's event
 * timing: its duration runs to the next frame presented after its handlers, which is the result's
 * frame when the result is rendered before they end; Chromium reports it from 16 ms, in steps of
 * 8 ms; `inFirst` says whether the result was in that frame); `full`, the DOM holds the full run
 * (the working, once the extras are here) and a new run id (its report sent) and the next frame has
 * begun; `stored`, likewise for the report's answer (the emulated network's round trip in it).
 * `window.__frames` keeps the long animation frames meanwhile (what ran, when layout began), for
 * BENCH_DEBUG.
 */
const typeAndReady = (factor: number) => `(() => {
  const root = document.querySelector('wickstone-widget').shadowRoot;
  const control = [...root.querySelectorAll('input[data-input]')].find((i) => i.type !== 'radio' && i.type !== 'checkbox' && !i.readOnly && Number(i.value) > 0);
  const result = () => root.querySelector('[data-result]');
  const before = result() ? result().outerHTML : '';
  const runBefore = result() ? result().getAttribute('data-run-id') : null;
  const since = performance.now();
  const frames = [];
  const loaf = new PerformanceObserver((list) => frames.push(...list.getEntries()));
  try { loaf.observe({ type: 'long-animation-frame' }); } catch {}
  const events = [];
  const timing = new PerformanceObserver((list) => events.push(...list.getEntries()));
  timing.observe({ type: 'event', durationThreshold: 16 });
  const at = { shown: null, full: null, stored: null };
  const nextFrame = (key) => requestAnimationFrame(() => { at[key] = performance.now(); });
  const observer = new MutationObserver(() => {
    const now = result();
    if (!now || now.hasAttribute('data-stale')) return;
    if (at.shown === null && now.outerHTML !== before) at.shown = performance.now();
    const run = now.getAttribute('data-run-id');
    if (at.full === null && run && run !== runBefore) { at.full = -1; nextFrame('full'); }
    if (at.full !== null && at.stored === null && /^(stored|failed)$/.test(now.getAttribute('data-report') || '')) { at.stored = -1; nextFrame('stored'); }
  });
  observer.observe(root, { subtree: true, childList: true, attributes: true, characterData: true });
  control.value = String(Number(control.value) * ${factor});
  const typedAt = performance.now();
  control.dispatchEvent(new Event('input', { bubbles: true }));
  // Queued after the render the input event queued, so it runs once that render is done.
  let keystroke = null;
  queueMicrotask(() => { keystroke = performance.now() - typedAt; });
  const button = root.querySelector('[data-wickstone="calculate"]');
  button.scrollIntoView({ block: 'center' });
  window.__typed = (async () => {
    const deadline = performance.now() + 20000;
    const click = () => events.find((e) => e.name === 'click' && e.startTime >= since);
    const settled = () => at.shown !== null && at.full > 0 && at.stored > 0 && click();
    while (!settled() && performance.now() < deadline) await new Promise((r) => setTimeout(r, 20));
    // Event timing is reported after the frame: give a click under 16 ms its chance to be missing.
    await new Promise((r) => requestAnimationFrame(() => setTimeout(r, 100)));
    observer.disconnect();
    loaf.disconnect();
    timing.disconnect();
    const c = click();
    const t0 = c ? c.startTime : null;
    window.__frames = t0 === null ? [] : frames.filter((e) => e.startTime + e.duration >= t0).map((e) =>
      Math.round(e.startTime - t0) + '+' + Math.round(e.duration) + ' ms (render at ' + Math.round(e.renderStart - t0) +
      ', style/layout at ' + Math.round(e.styleAndLayoutStart - t0) + '): ' +
      e.scripts.map((s) => (s.invoker || s.invokerType) + ' ' + Math.round(s.duration) + ' ms').join(', '));
    return {
      // No click entry: it took under 16 ms (or it was never reported: then the others are null too).
      shown: c ? c.duration : at.shown === null ? null : 0,
      inFirst: c ? at.shown !== null && at.shown <= c.processingEnd : at.shown !== null,
      full: t0 !== null && at.full > 0 ? at.full - t0 : null,
      stored: t0 !== null && at.stored > 0 ? at.stored - t0 : null,
      keystroke,
    };
  })();
  const r = button.getBoundingClientRect();
  return { x: r.left + r.width / 2, y: r.top + r.height / 2 };
})()`;

/** Typing to result, `rounds` times (alternately up and down) at the CPU rate in force: the medians. */
/** A CPU profile's nodes, as the DevTools protocol gives them. */
interface ProfileNode {
  id: number;
  callFrame: { functionName: string; url: string; lineNumber: number };
}

/**
 * BENCH_PROFILE: the CPU profile of a round's click until its report's answer, self time summed per
 * chunk file (the engine's compute, Preact's render in the app chunk, the working in extras), the
 * browser's own calls from script (DOM, fetch) and the rest: "(program)" is the browser's work
 * outside script (style, layout, paint), "(idle)" the main thread waiting. BENCH_PROFILE=all: every
 * round's, and then the median of each over the rounds (steadier on a loaded machine).
 */
function printProfile(
  rate: number,
  profile: { nodes: ProfileNode[]; samples: number[]; timeDeltas: number[] },
): Map<string, number> {
  const byId = new Map(profile.nodes.map((n) => [n.id, n] as const));
  const self = new Map<string, number>();
  profile.samples.forEach((id, i) => {
    const frame = byId.get(id)!.callFrame;
    const file = frame.url.split('/').pop() ?? '';
    const key =
      file !== ''
        ? file.replace(/-[\w-]{8}\.js$/, '')
        : frame.functionName.startsWith('(')
          ? frame.functionName
          : '(browser calls from script)';
    self.set(key, (self.get(key) ?? 0) + (profile.timeDeltas[i] ?? 0) / 1000);
  });
  console.error(
    `  profile at CPU ${rate}×: ` +
      [...self]
        .sort((a, b) => b[1] - a[1])
        .map(([key, msSelf]) => `${key} ${msSelf.toFixed(1)} ms`)
        .join(', '),
  );
  return self;
}

async function typing(page: Page, cdp: CDPSession, rate: number, rounds: number): Promise<Typing> {
  const all: Typing[] = [];
  const profiles: Map<string, number>[] = [];
  for (let i = 0; i < rounds; i++) {
    const { x, y } = (await page.evaluate(typeAndReady(i % 2 === 0 ? 1.5 : 1 / 1.5))) as {
      x: number;
      y: number;
    };
    const profiling = process.env.BENCH_PROFILE && (i === 0 || process.env.BENCH_PROFILE === 'all');
    if (profiling) {
      await cdp.send('Profiler.enable');
      await cdp.send('Profiler.setSamplingInterval', { interval: 100 });
      await cdp.send('Profiler.start');
    }
    await page.mouse.click(x, y);
    all.push((await page.evaluate('window.__typed')) as Typing);
    if (profiling) profiles.push(printProfile(rate, (await cdp.send('Profiler.stop')).profile as never));
    for (const f of await page.evaluate(() => (window as unknown as { __frames: string[] }).__frames))
      if (process.env.BENCH_DEBUG) console.error(`  long frame ${f}`);
    if (process.env.BENCH_DEBUG) console.error(JSON.stringify(all[all.length - 1]));
  }
  if (profiles.length > 1) {
    const keys = [...new Set(profiles.flatMap((p) => [...p.keys()]))];
    const medians = keys.map((key) => {
      const v = profiles.map((p) => p.get(key) ?? 0).sort((a, b) => a - b);
      return [key, v[Math.floor(v.length / 2)]!] as const;
    });
    console.error(
      `  profile at CPU ${rate}×, median of ${profiles.length} rounds: ` +
        medians
          .sort((a, b) => b[1] - a[1])
          .map(([key, msSelf]) => `${key} ${msSelf.toFixed(1)} ms`)
          .join(', '),
    );
  }
  const median = (pick: (t: Typing) => number | null): number | null => {
    const v = all.map(pick).filter((n): n is number => n !== null && n >= 0);
    v.sort((a, b) => a - b);
    return v.length === 0 ? null : v[Math.floor(v.length / 2)]!;
  };
  return {
    shown: median((t) => t.shown),
    inFirst: all.every((t) => t.inFirst),
    full: median((t) => t.full),
    stored: median((t) => t.stored),
    keystroke: median((t) => t.keystroke),
  };
}

async function measure(browser: Browser, path: string, expected: number, types: boolean): Promise<Figures> {
  const context = await browser.newContext({ viewport: { width: 1280, height: 900 } });
  const page = await context.newPage();
  const cdp: CDPSession = await context.newCDPSession(page);
  await cdp.send('Network.enable');
  await cdp.send('Network.setCacheDisabled', { cacheDisabled: true });
  await cdp.send('Network.emulateNetworkConditions', NETWORK);
  await cdp.send('Emulation.setCPUThrottlingRate', { rate: CPU_SLOWDOWN });

  const urls = new Map<string, string>();
  const done = new Map<string, number>();
  let last = Date.now();
  cdp.on('Network.requestWillBeSent', (e: { requestId: string; request: { url: string } }) => {
    urls.set(e.requestId, e.request.url);
    last = Date.now();
  });
  cdp.on('Network.loadingFinished', (e: { requestId: string; encodedDataLength: number }) => {
    done.set(e.requestId, e.encodedDataLength);
    last = Date.now();
  });
  const fromApp = () =>
    [...done]
      .filter(([id]) => (urls.get(id) ?? '').startsWith(appOrigin))
      .map(([id, n]) => [urls.get(id)!, n] as const);

  let atUsable: (readonly [string, number])[] = [];
  let usable!: () => void;
  const ready = new Promise<void>((resolve) => (usable = resolve));
  await page.exposeFunction('__usable', () => {
    atUsable = fromApp();
    usable();
  });
  await page.addInitScript({ content: pageProbe(expected) });
  const log = (what: string) => process.env.BENCH_DEBUG && console.error(`${path}: ${what}`);
  log('going');
  await page.goto(`${siteOrigin}${path}`, { waitUntil: 'commit' });
  log('committed');
  let timer: NodeJS.Timeout | undefined;
  await Promise.race([
    ready,
    new Promise((_, reject) => {
      timer = setTimeout(async () => {
        const state = await page.evaluate(() => ({
          ready: document.readyState,
          hosts: [...document.querySelectorAll('wickstone-widget')].map((h) => h.getAttribute('data-state')),
          usableAt: (window as unknown as { __usableAt: number | null }).__usableAt,
        }));
        reject(new Error(`${path} never became usable: ${JSON.stringify(state)}`));
      }, 90_000);
    }),
  ]);
  clearTimeout(timer);
  log('usable');
  const usableMs = await page.evaluate(() => (window as unknown as { __usableAt: number }).__usableAt);
  // Quiet: nothing started or finished for a while.
  while (Date.now() - last < QUIET_MS) await new Promise((r) => setTimeout(r, 200));

  // Layout shift while the widget appears and settles, before the visitor does anything (the
  // typing below is scripted, not trusted input, so what it moves would count as if unprompted).
  const cls = await page.evaluate(() => (window as unknown as { __cls: number }).__cls);
  for (const shift of await page.evaluate(() => (window as unknown as { __shifts: string[] }).__shifts))
    log(`layout shift ${shift}`);
  let slow: Typing | null = null;
  let fast: Typing | null = null;
  if (types) {
    slow = await typing(page, cdp, CPU_SLOWDOWN, TYPING_ROUNDS);
    await cdp.send('Emulation.setCPUThrottlingRate', { rate: 1 });
    fast = await typing(page, cdp, 1, TYPING_ROUNDS);
  }
  const heights = await page.evaluate(() =>
    ((window as unknown as { __heights?: string[] }).__heights ?? []).join(' '),
  );
  const fullMs = await page.evaluate(() => (window as unknown as { __fullAt: number | null }).__fullAt);
  const total = fromApp();
  await context.close();
  const sum = (list: (readonly [string, number])[]) => list.reduce((s, [, n]) => s + n, 0);
  return {
    requests: atUsable.length,
    bytes: sum(atUsable),
    totalRequests: total.length,
    totalBytes: sum(total),
    usableMs,
    fullMs,
    cls,
    slow,
    fast,
    runtimeLoads: total.filter(([u]) => /runtime/.test(u)).length,
    font: atUsable.some(([u]) => u.endsWith('.woff2'))
      ? 'before'
      : total.some(([u]) => u.endsWith('.woff2'))
        ? 'after'
        : 'none',
    heights,
  };
}

const db = await createTestDatabase({
  PORT: String(appPort),
  PUBLIC_URL: appOrigin,
  BCRYPT_COST: '4',
  // Another build's releases, to compare with (the "before" of a change).
  ...(process.env.RELEASES_DIR ? { RELEASES_DIR: process.env.RELEASES_DIR } : {}),
});
const app = createApp({ config: db.config, sequelize: db.sequelize, logger: createLogger(db.config) });
const appServer = createServer(app);
const snippets = new Map<string, string>();
const site = createServer((req, res) => {
  const url = new URL(req.url ?? '/', siteOrigin);
  let html: string | null = null;
  if (url.pathname === '/')
    html = sitePage(snippets.get('tube-rise') ?? '', snippets.get('soil-capillary-rise') ?? '');
  else if (url.pathname === '/plain') html = sitePage('', '');
  else if (url.pathname.startsWith('/one/'))
    html = sitePage(snippets.get(decodeURIComponent(url.pathname.slice(5))) ?? '', '');
  if (html === null) return void res.writeHead(404).end();
  res.writeHead(200, { 'content-type': 'text/html; charset=utf-8', 'cache-control': 'no-store' }).end(html);
});
let browser: Browser | undefined;
try {
  await listen(appServer, appPort);
  await listen(site, sitePort);
  const org = await seedOrgWithTeam('Brackenridge Ground & Damp');
  console.log('seeded');
  const owner = new TestClient(app);
  await owner.login(org.users.owner.email, org.users.owner.password);
  // Every calculator with the default look (the shipped Manrope), and the first again with the
  // visitor's system fonts: the font arrives after first paint, and its swap can move text.
  const systemFont = `${calculators[0]!.id}, system font`;
  for (const [name, calc, font] of [
    ...calculators.map((c) => [c.id, c, null] as const),
    [systemFont, calculators[0]!, 'system-sans'] as const,
  ]) {
    const created = await owner
      .post(`/orgs/${org.id}/widgets`, {
        name: calc.title,
        calculatorId: calc.id,
        allowedOrigins: [siteOrigin],
      })
      .expect(201);
    const defaults: WidgetSettings = defaultWidgetSettings();
    const settings: WidgetSettings =
      font === null ? defaults : { ...defaults, look: { ...defaults.look, font } };
    const live = await owner
      .patch(`/orgs/${org.id}/widgets/${(created.body as { id: number }).id}`, { status: 'live', settings })
      .expect(200);
    snippets.set(name, (live.body as { embed: { snippet: string } }).embed.snippet);
  }
  console.log(`${snippets.size} widgets live; launching Chromium`);
  browser = await launchBrowser();
  // One throwaway load so the first measured one does not pay for Chromium's own start.
  await measure(browser, '/plain', 0, false);
  const base = await measure(browser, '/plain', 0, false);

  const kb = (n: number) => `${(n / 1024).toFixed(1)} KB`;
  const ms = (n: number | null) => (n === null ? '—' : `${Math.round(n)} ms`);
  const ms1 = (n: number | null) => (n === null ? '—' : `${n.toFixed(1)} ms`);
  console.log(
    `first flight, Chromium over ${NETWORK.latency} ms RTT at ${(NETWORK.downloadThroughput / 1024).toFixed(0)} KB/s, CPU ${CPU_SLOWDOWN}× slower; bytes as sent (compressed), from the app's origin`,
  );
  console.log(
    `baseline: the firm's page with no widget, loaded in ${ms(base.usableMs)}; load average ${loadavg()
      .map((n) => n.toFixed(2))
      .join(' ')}`,
  );
  console.log(
    `${'page'.padEnd(24)}${'req→usable'.padStart(11)}${'bytes→usable'.padStart(14)}${'req idle'.padStart(10)}${'bytes idle'.padStart(12)}${'usable'.padStart(10)}${'× page'.padStart(8)}${'full'.padStart(9)}${'CLS'.padStart(8)}${'runtimes'.padStart(10)}${'font'.padStart(8)}   shown/held px`,
  );
  const row = (name: string, f: Figures) =>
    console.log(
      `${name.padEnd(24)}${String(f.requests).padStart(11)}${kb(f.bytes).padStart(14)}${String(f.totalRequests).padStart(10)}${kb(f.totalBytes).padStart(12)}${ms(f.usableMs).padStart(10)}${(f.usableMs / base.usableMs).toFixed(2).padStart(8)}${ms(f.fullMs).padStart(9)}${f.cls.toFixed(3).padStart(8)}${String(f.runtimeLoads).padStart(10)}${f.font.padStart(8)}   ${f.heights}`,
    );
  const typed: [string, Figures][] = [];
  // BENCH_ONLY=<name>,<name>: those widgets alone (and no demo page), to look at one closely.
  const only = process.env.BENCH_ONLY?.split(',') ?? null;
  for (const name of snippets.keys()) {
    if (only && !only.includes(name)) continue;
    const f = await measure(browser, `/one/${encodeURIComponent(name)}`, 1, true);
    row(name, f);
    typed.push([name, f]);
  }
  if (!only) {
    const demo = await measure(browser, '/', 2, true);
    row('two widgets (demo page)', demo);
    typed.push(['two widgets (demo page)', demo]);
  }

  // Typing to result once the full widget has taken over (the first widget on the page; medians of
  // the rounds), from a trusted click's time stamp: "shown" is what the visitor sees, the frame
  // presented after the click (1st: the new result was in it, every round; later: not); "working" the
  // frame after the full run's working and its run report; "stored" after the report's answer;
  // "keystroke" the script time of the keystroke before the click (its event and the form's render).
  const shown = (t: Typing | null) =>
    t === null || t.shown === null
      ? '—'
      : `${t.shown === 0 ? '<16 ms' : ms(t.shown)} ${t.inFirst ? '(1st)' : '(later)'}`;
  console.log(
    `typing to result, median of ${TYPING_ROUNDS}; CPU ${CPU_SLOWDOWN}× slower, then full speed; load average ${loadavg()
      .map((n) => n.toFixed(2))
      .join(' ')}`,
  );
  console.log(
    `${'page'.padEnd(24)}${`shown ${CPU_SLOWDOWN}×`.padStart(16)}${`working ${CPU_SLOWDOWN}×`.padStart(12)}${`stored ${CPU_SLOWDOWN}×`.padStart(12)}${'shown 1×'.padStart(16)}${'working 1×'.padStart(12)}${'stored 1×'.padStart(12)}${`keystroke ${CPU_SLOWDOWN}×`.padStart(14)}${'keystroke 1×'.padStart(14)}`,
  );
  for (const [name, f] of typed)
    console.log(
      `${name.padEnd(24)}${shown(f.slow).padStart(16)}${ms(f.slow?.full ?? null).padStart(12)}${ms(f.slow?.stored ?? null).padStart(12)}${shown(f.fast).padStart(16)}${ms(f.fast?.full ?? null).padStart(12)}${ms(f.fast?.stored ?? null).padStart(12)}${ms1(f.slow?.keystroke ?? null).padStart(14)}${ms1(f.fast?.keystroke ?? null).padStart(14)}`,
    );

  // BENCH_SHOTS=<dir>: the demo page at desktop and phone widths, unthrottled: demo-<width>-first.png
  // with the first view only (the full widget's chunk held back), demo-<width>.png once the full
  // widget has taken over and the page settled. Nothing should move between the two.
  if (process.env.BENCH_SHOTS) {
    for (const width of [1280, 390]) {
      for (const view of ['first', 'full'] as const) {
        const context = await browser.newContext({ viewport: { width, height: 900 } });
        const page = await context.newPage();
        if (view === 'first') await page.route('**/releases/**/app-*.js', (route) => route.abort());
        await page.goto(`${siteOrigin}/`);
        await page.waitForFunction((wanted) => {
          const hosts = [...document.querySelectorAll('wickstone-widget')];
          return (
            hosts.length === 2 &&
            hosts.every(
              (h) =>
                h.getAttribute('data-state') === 'ready' &&
                h.shadowRoot?.querySelector(`div[data-wickstone="mount"][data-view="${wanted}"]`),
            )
          );
        }, view);
        await page.evaluate(() => document.fonts.ready.then(() => undefined));
        await page.waitForTimeout(1000);
        const heights = await page.evaluate(() =>
          [...document.querySelectorAll<HTMLElement>('wickstone-widget')].map(
            (h) =>
              `${Math.round(h.shadowRoot!.querySelector('[data-wickstone="root"] > .body')!.getBoundingClientRect().bottom - h.getBoundingClientRect().top)}/${h.style.minHeight}`,
          ),
        );
        console.log(`${width} px, ${view} view: form bottom / held: ${heights.join(' ')}`);
        const name = view === 'first' ? `demo-${width}-first.png` : `demo-${width}.png`;
        await page.screenshot({ path: `${process.env.BENCH_SHOTS}/${name}`, fullPage: true });
        await context.close();
      }
    }
  }
} finally {
  await browser?.close();
  appServer.closeAllConnections();
  await new Promise((r) => appServer.close(r));
  site.closeAllConnections();
  await new Promise((r) => site.close(r));
  await db.drop();
}
