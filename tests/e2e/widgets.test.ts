import { randomBytes } from 'node:crypto';
import { createServer, type Server } from 'node:http';
import type { AddressInfo } from 'node:net';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { QueryTypes } from 'sequelize';
import type { Browser, BrowserContext, Locator, Page, Request } from 'playwright-core';
import { contrastRatio } from '@wickstone/contracts';
import { makePng, seedOrgWithTeam, type FixtureOrg } from '@wickstone/server/testing';
import { launchBrowser, screenshot } from '../support/browser.js';
import { startApp, type RunningApp } from '../support/server.js';

/*
 * The widget story end to end: an admin makes and brands a widget in the dashboard, its snippet
 * goes into a page served from another loopback origin, and a visitor uses it there. Everything
 * runs for real: the app over a fresh MariaDB database, the release bundle the app serves, the
 * fake SMTP server's mailbox, Debian's Chromium.
 */

// Invented firm, staff and visitor; a fresh suffix per run, since the fake mailbox is shared.
const run = `${Date.now().toString(36)}${randomBytes(2).toString('hex')}`;
const firm = 'Brackenridge Ground & Damp';
const notifyAddress = `surveys.${run}@brackenridge-ground.example`;
const visitor = { name: 'Oonagh Treharne', email: `oonagh.treharne.${run}@damp-cottage.example` };
const firmCaution =
  'Brackenridge surveyors confirm every estimate with a moisture survey on site before quoting.';
const brand = { background: '#fbf8f1', text: '#1f2a2e', primary: '#7a3b12', primaryText: '#ffffff' };
const failingText = '#b9b2a6';
const hostileCss =
  '* { color: red !important; font: 30px serif !important; text-transform: uppercase !important; letter-spacing: 3px !important } ' +
  'input, button, select { all: unset !important }';

/** A firm's web page on its own loopback origin (a real server: Chromium refuses loopback scripts to routed pages). */
interface HostSite {
  origin: string;
  server: Server;
}

let snippet = '';

function hostPage(withHostileCss: boolean, copies = 1): string {
  return `<!doctype html><html lang="en"><head><meta charset="utf-8"><title>Damp advice · ${firm}</title>
${withHostileCss ? `<style>${hostileCss}</style>` : ''}</head>
<body><h1>Is it rising damp?</h1><p>Try our calculator before you book a survey.</p>
${Array.from({ length: copies }, () => snippet).join('\n<p>And again, further down.</p>\n')}
<p>Brackenridge Ground &amp; Damp, brackenridge-ground.example</p></body></html>`;
}

async function startHost(): Promise<HostSite> {
  const server = createServer((req, res) => {
    const path = new URL(req.url ?? '/', 'http://host').pathname;
    if (path !== '/' && path !== '/hostile' && path !== '/twice') {
      res.writeHead(404).end();
      return;
    }
    res
      .writeHead(200, { 'content-type': 'text/html; charset=utf-8' })
      .end(hostPage(path === '/hostile', path === '/twice' ? 2 : 1));
  });
  await new Promise<void>((resolve) => server.listen(0, '127.0.0.1', resolve));
  return { origin: `http://127.0.0.1:${(server.address() as AddressInfo).port}`, server };
}

async function stopHost(site: HostSite | undefined): Promise<void> {
  if (!site) return;
  site.server.closeAllConnections();
  await new Promise<void>((resolve) => site.server.close(() => resolve()));
}

interface MailItem {
  to: string[];
  subject: string;
  text: string;
  html: string;
}

async function mailTo(address: string): Promise<MailItem[]> {
  const res = await fetch(`${process.env.FAKE_MAIL_API_URL}/messages?to=${encodeURIComponent(address)}`);
  return ((await res.json()) as { items: MailItem[] }).items;
}

/** JSON columns come back from MariaDB as text. */
function json<T>(value: unknown): T {
  return (typeof value === 'string' ? JSON.parse(value) : value) as T;
}

const isRunReport = (req: Request) => req.method() === 'POST' && req.url().endsWith('/api/v1/embed/runs');

/**
 * Serves the release files matching `pattern` with one changed statement at the end (the kind of
 * edit a compromised server or cache would make); collects the page's console messages. `tampered()`
 * is the URL of the file changed, '' until one was asked for.
 */
async function tamperWith(
  page: Page,
  pattern: string,
): Promise<{ messages: string[]; tampered: () => string }> {
  const messages: string[] = [];
  page.on('console', (m) => messages.push(m.text()));
  let url = '';
  await page.route(pattern, async (route) => {
    const original = await route.fetch();
    url = route.request().url();
    await route.fulfill({
      response: original,
      body: `${await original.text()}\nwindow.__tampered = true;\n`,
    });
  });
  return { messages, tampered: () => url };
}

describe('widgets in Chromium: configure, brand, embed, run, report and capture a lead', () => {
  let app: RunningApp;
  let browser: Browser;
  let org: FixtureOrg;
  let site: HostSite;
  let elsewhere: HostSite;
  const contexts: BrowserContext[] = [];
  const pageErrors: string[] = [];
  let widgetId = 0;
  let publicKey = '';
  let firstReport: string | null = null;

  async function freshPage(opts: { clipboard?: boolean; width?: number } = {}): Promise<Page> {
    const context = await browser.newContext({
      viewport: { width: opts.width ?? 1280, height: 800 },
      permissions: opts.clipboard ? ['clipboard-read', 'clipboard-write'] : [],
    });
    contexts.push(context);
    const page = await context.newPage();
    page.on('pageerror', (err) => pageErrors.push(err.message));
    return page;
  }

  async function signIn(page: Page, email: string, password: string) {
    await page.goto(`${app.url}/login`);
    await page.getByLabel('E-mail address').fill(email);
    await page.getByLabel('Password', { exact: true }).fill(password);
    await page.getByRole('button', { name: 'Sign in', exact: true }).click();
    await page.waitForURL(/\/orgs\/\d+$/);
  }

  const q = <T extends object>(sql: string, replacements: unknown[] = []) =>
    app.db.sequelize.query<T>(sql, { replacements, type: QueryTypes.SELECT });

  /** The widget the snippet placed (or the preview mounted), seen through its open shadow root. */
  const widgetIn = (scope: Page | Locator) => scope.locator('wickstone-widget[data-wickstone="host"]');

  beforeAll(async () => {
    expect(
      process.env.FAKE_MAIL_API_URL,
      'FAKE_MAIL_API_URL must point at the fake SMTP server',
    ).toBeTruthy();
    app = await startApp({
      FAKE_MAIL_API_URL: process.env.FAKE_MAIL_API_URL,
      SMTP_HOST: process.env.SMTP_HOST ?? '127.0.0.1',
      SMTP_PORT: process.env.SMTP_PORT,
    });
    org = await seedOrgWithTeam(firm);
    site = await startHost();
    elsewhere = await startHost();
    browser = await launchBrowser();
  });

  afterAll(async () => {
    for (const c of contexts) await c.close();
    await browser?.close();
    await stopHost(site);
    await stopHost(elsewhere);
    await app?.stop();
  });

  it('lets an admin create a widget from a calculator, brand it, make it live and copy its snippet', async () => {
    const page = await freshPage({ clipboard: true });
    const patches: string[] = [];
    page.on('request', (req) => {
      if (req.method() === 'PATCH' && /\/widgets\/\d+$/.test(new URL(req.url()).pathname))
        patches.push(req.url());
    });
    await signIn(page, org.users.admin.email, org.users.admin.password);

    await page
      .getByRole('navigation', { name: 'Main' })
      .getByRole('link', { name: 'Widgets', exact: true })
      .click();
    await page.getByText('No widgets yet').waitFor();
    await page.getByRole('link', { name: 'Make a widget from a calculator' }).click();
    await page.waitForURL(/\/widgets\/new$/);
    await page.getByRole('radio', { name: /^Capillary rise or depression in a tube/ }).check();
    await page.getByLabel('Name').fill('Rising damp check');
    await page.getByRole('button', { name: 'Create the widget' }).click();
    await page.waitForURL(/\/widgets\/\d+$/);
    widgetId = Number(new URL(page.url()).pathname.split('/').pop());
    const [created] = await q<{ calculatorId: string; status: string; publicKey: string }>(
      'SELECT calculator_id AS calculatorId, status, public_key AS publicKey FROM widgets WHERE id = ? AND organization_id = ?',
      [widgetId, org.id],
    );
    expect(created).toMatchObject({ calculatorId: 'tube-rise', status: 'draft' });
    publicKey = created!.publicKey;

    const editor = page.locator('[data-widget-editor]');
    const preview = widgetIn(page.locator('[data-widget-preview]'));
    await preview.locator('[data-wickstone="root"]').waitFor();
    expect(await preview.getAttribute('data-mode')).toBe('preview');
    // One section at a time, each at its own address; the draft is kept across them.
    const open = async (section: string) => {
      await page.locator(`[data-section-link="${section}"]`).click();
      await page.locator(`[data-editor-section="${section}"]`).waitFor();
    };

    await open('cautions');

    // The calculator's own cautions are listed, read-only, beside the firm's.
    expect(await editor.locator('[data-builtin-caution]').count()).toBeGreaterThanOrEqual(3);
    expect(
      await editor.locator('[data-builtin-caution] input, [data-builtin-caution] textarea').count(),
    ).toBe(0);

    await open('look');
    // A failing pair: its ratio is shown at once, the preview already shows it, and Save refuses it.
    await editor.getByLabel('Background colour', { exact: true }).fill(brand.background);
    await editor.getByLabel('Text colour', { exact: true }).fill(failingText);
    const failing = `${contrastRatio(failingText, brand.background).toFixed(2)}:1`;
    expect(contrastRatio(failingText, brand.background)).toBeLessThan(4.5);
    const textPair = editor.locator('[data-contrast="text"]');
    await expect.poll(() => textPair.getAttribute('data-passes')).toBe('no');
    expect(await textPair.locator('[data-ratio]').textContent()).toBe(failing);
    await expect
      .poll(() => preview.locator('[data-wickstone="root"]').evaluate((el) => getComputedStyle(el).color))
      .toBe('rgb(185, 178, 166)');
    await page.getByRole('button', { name: 'Save changes' }).click();
    const refusal = editor.getByText(
      `Contrast between text and background is ${failing}; WCAG AA needs at least 4.5:1`,
    );
    await refusal.first().waitFor();
    expect(await editor.getByLabel('Text colour', { exact: true }).getAttribute('aria-invalid')).toBe('true');
    expect(patches).toEqual([]);

    for (const [label, value] of [
      ['Text colour', brand.text],
      ['Button colour', brand.primary],
      ['Button text colour', brand.primaryText],
    ] as const) {
      await editor.getByLabel(label, { exact: true }).fill(value);
    }
    await expect.poll(() => textPair.getAttribute('data-passes')).toBe('yes');
    expect(await refusal.count()).toBe(0);

    // A real PNG, checked by the server by its bytes; the preview shows it before anything is saved.
    await editor.getByLabel(/Upload a logo/).setInputFiles({
      name: 'brackenridge-logo.png',
      mimeType: 'image/png',
      buffer: makePng(160, 48),
    });
    await editor.getByText(/Uploaded brackenridge-logo\.png \(160 × 48 px/).waitFor();
    await expect
      .poll(() =>
        preview.locator('[data-wickstone="logo"]').evaluate((img) => (img as HTMLImageElement).naturalWidth),
      )
      .toBe(160);

    // US units; the bore's default is then typed in inches and stored in metres.
    await open('units');
    await editor.getByRole('radio', { name: /^US customary/ }).check();
    await open('inputs');
    await editor.getByLabel('Default of Bore (inside diameter), unit: inch').fill('0.04');
    await editor.getByLabel('For visitors: Liquid', { exact: true }).selectOption('locked');
    await open('cautions');
    await editor.getByLabel("The firm's own cautions").fill(firmCaution);
    await open('requests');
    await editor.getByLabel('Who in the firm is told of each request').fill(notifyAddress);
    await expect
      .poll(() => preview.locator('[data-wickstone="root"]').getAttribute('data-system'))
      .toBe('us');
    expect(await preview.locator('[data-input="diameter"]').inputValue()).toBe('0.04');

    // Sites are checked as typed: a page address is not an origin, and its origin is offered.
    await open('sites');
    const origins = editor.getByLabel('Allowed origins');
    await origins.fill(`${site.origin}/damp-advice`);
    await editor.locator('[data-site-check="bad"]').waitFor();
    await editor.getByRole('button', { name: `Use ${site.origin}` }).click();
    await expect.poll(() => origins.inputValue()).toBe(site.origin);
    expect(await editor.locator('[data-site-check="ok"]').textContent()).toContain(site.origin);
    await open('name');
    await editor.getByRole('radio', { name: /^In service/ }).check();
    // The contents say which sections hold unsaved changes.
    for (const changed of ['name', 'inputs', 'units', 'look', 'cautions', 'requests', 'sites'])
      expect(await page.locator(`[data-section-link="${changed}"]`).getAttribute('data-section-state')).toBe(
        'changed',
      );
    expect(await page.locator('[data-section-link="sheet"]').getAttribute('data-section-state')).toBe('open');

    // A save that never reaches the server loses nothing: the form stays as typed, and saving again works.
    let dropped = 0;
    await page.route(
      (url) => /\/api\/v1\/orgs\/\d+\/widgets\/\d+$/.test(url.pathname),
      async (route) => {
        if (route.request().method() !== 'PATCH' || dropped > 0) return route.continue();
        dropped += 1;
        return route.abort('connectionrefused');
      },
    );
    await page.getByRole('button', { name: 'Save changes' }).click();
    await page.getByText(/Not saved: .*Your changes are still here/).waitFor();
    expect(dropped).toBe(1);
    await open('look');
    expect(await editor.getByLabel('Text colour', { exact: true }).inputValue()).toBe(brand.text);
    await open('cautions');
    expect(await editor.getByLabel("The firm's own cautions").inputValue()).toBe(firmCaution);
    await open('sites');
    expect(await origins.inputValue()).toBe(site.origin);
    const [unsaved] = await q<{ status: string }>('SELECT status FROM widgets WHERE id = ?', [widgetId]);
    expect(unsaved?.status).toBe('draft');

    await page.getByRole('button', { name: 'Save changes' }).click();
    await page
      .locator('[data-save-state="ok"]')
      .getByText(/^Saved at /)
      .waitFor();
    // The saved status in the page's heading follows the save.
    await page.locator('[data-status="live"]').waitFor();

    const [row] = await q<{ status: string; allowedOrigins: unknown; settings: unknown }>(
      'SELECT status, allowed_origins AS allowedOrigins, settings FROM widgets WHERE id = ?',
      [widgetId],
    );
    expect(row?.status).toBe('live');
    expect(json<string[]>(row?.allowedOrigins)).toEqual([site.origin]);
    const settings = json<{
      units: { system: string; visitorMaySwitch: boolean };
      inputs: Record<string, { mode: string; default?: number | string }>;
      look: { colors: Record<string, string>; logoAssetId: number | null };
      cautions: string;
      leadForm: { notify: string[]; enabled: boolean };
    }>(row?.settings);
    expect(settings.units).toEqual({ system: 'us', visitorMaySwitch: true });
    expect(settings.look.colors).toEqual(brand);
    expect(settings.cautions).toBe(firmCaution);
    expect(settings.leadForm).toMatchObject({ enabled: true, notify: [notifyAddress] });
    expect(settings.inputs.liquid).toEqual({ mode: 'locked' });
    // 0.04 in is 1.016 mm exactly (the inch is 25.4 mm): what the API stores is SI.
    expect(settings.inputs.diameter?.default).toBeCloseTo(0.001016, 12);
    const [asset] = await q<{ id: number; contentType: string; width: number; height: number }>(
      'SELECT id, content_type AS contentType, width, height FROM assets WHERE organization_id = ?',
      [org.id],
    );
    expect(asset).toMatchObject({ contentType: 'image/png', width: 160, height: 48 });
    expect(settings.look.logoAssetId).toBe(asset?.id);

    // The save is in the history with what changed.
    await open('revisions');
    const latest = editor.locator('[data-revision]').first();
    await latest.locator('[data-change="settings.units.system"]').waitFor();
    expect(await latest.locator('[data-change="settings.units.system"]').textContent()).toMatch(
      /was\s*Metric \(SI\)\s*now\s*US customary/,
    );
    expect(await latest.locator('[data-change="status"]').textContent()).toMatch(
      /was\s*In preparation\s*now\s*In service/,
    );
    // The revision says in words what was done.
    expect(await latest.locator('[data-revision-words]').textContent()).toMatch(/^Put it in service/);
    expect(await latest.textContent()).toContain(org.users.admin.name);

    // Copied from the page, as a person would.
    await open('embed');
    await page.getByRole('button', { name: 'Copy the code' }).click();
    await page.getByText(/^Copied\./).waitFor();
    snippet = await page.evaluate(() => navigator.clipboard.readText());
    expect(snippet).toBe(await editor.locator('[data-embed-snippet]').inputValue());
    expect(snippet).toContain(`src="${app.url}/releases/`);
    expect(snippet).toMatch(/integrity="sha384-[A-Za-z0-9+/=]+"/);
    expect(snippet).toContain(`data-wickstone-key="${publicKey}"`);

    // Leaving with unsaved changes asks first; staying keeps them, discarding brings back what is saved.
    await open('name');
    const name = editor.getByRole('textbox', { name: 'Name', exact: true });
    await name.fill('Rising damp check, second thoughts');
    await page.getByRole('link', { name: '← All widgets' }).click();
    await page.getByRole('button', { name: 'Stay here' }).click();
    expect(new URL(page.url()).pathname).toBe(`/orgs/${org.id}/widgets/${widgetId}`);
    expect(await name.inputValue()).toBe('Rising damp check, second thoughts');
    await page.getByRole('button', { name: 'Discard changes' }).click();
    await page.getByRole('button', { name: 'Discard', exact: true }).click();
    expect(await name.inputValue()).toBe('Rising damp check');
    await page.getByRole('link', { name: '← All widgets' }).click();
    await page.waitForURL(`${app.url}/orgs/${org.id}/widgets`);
    expect(await page.locator(`[data-widget-row="${widgetId}"]`).textContent()).toContain(site.origin);
  });

  it('shows analysts the same widget read-only, with the snippet to copy but nothing to save', async () => {
    expect(widgetId).toBeGreaterThan(0);
    const page = await freshPage();
    await signIn(page, org.users.analyst.email, org.users.analyst.password);
    await page.goto(`${app.url}/orgs/${org.id}/widgets`);
    await page.getByRole('link', { name: 'Rising damp check' }).click();
    const editor = page.locator('[data-widget-editor]');
    await widgetIn(page.locator('[data-widget-preview]')).locator('[data-wickstone="root"]').waitFor();
    expect(await page.getByRole('button', { name: 'Save changes' }).count()).toBe(0);
    // A summary in words, not a form of greyed-out fields.
    expect(await editor.locator('input, select, textarea:not([data-embed-snippet])').count()).toBe(0);
    expect(await editor.locator('[data-summary="settings.look.colors.text"]').textContent()).toBe(brand.text);
    expect(await editor.locator('[data-summary="allowedOrigins"]').textContent()).toContain(site.origin);
    expect(await editor.locator('[data-summary="settings.units.system"]').textContent()).toBe('US customary');
    expect(await editor.getByLabel(/Upload a logo/).count()).toBe(0);
    await page.locator('[data-section-link="embed"]').click();
    await page.locator('[data-editor-section="embed"]').waitFor();
    // The kind of code (plain, async, CSP nonce) is a choice of view, not a setting: nothing else is a field.
    expect(
      await editor.locator('input:not([type="radio"]), select, textarea:not([data-embed-snippet])').count(),
    ).toBe(0);
    expect(await editor.locator('[data-embed-snippet]').inputValue()).toBe(snippet);
  });

  it('runs on the firm’s page: a calculation, a unit switch, the bore warning and a request with a copy', async () => {
    expect(snippet).not.toBe('');
    const page = await freshPage();
    const reports: string[] = [];
    page.on('request', (req) => {
      if (isRunReport(req)) reports.push(req.postData() ?? '');
    });
    await page.goto(`${site.origin}/`);
    const widget = widgetIn(page);
    const root = widget.locator('[data-wickstone="root"]');
    await root.waitFor({ timeout: 20_000 });
    expect(await widget.getAttribute('data-mode')).toBe('live');
    expect(await root.getAttribute('data-system')).toBe('us');
    expect(await root.evaluate((el) => getComputedStyle(el).color)).toBe('rgb(31, 42, 46)');
    await expect
      .poll(() =>
        widget.locator('[data-wickstone="logo"]').evaluate((img) => (img as HTMLImageElement).naturalWidth),
      )
      .toBe(160);
    expect(await widget.locator('[data-field="liquid"]').getAttribute('data-mode')).toBe('locked');
    expect(await widget.locator('[data-input="diameter"]').inputValue()).toBe('0.04');

    // The firm's default bore, in US units.
    await widget.locator('[data-wickstone="calculate"]').click();
    const result = widget.locator('[data-result]');
    await widget.locator('[data-result][data-report="stored"]').waitFor({ timeout: 20_000 });
    const firstRunId = await result.getAttribute('data-run-id');
    const rise = widget.locator('[data-output="rise"]');
    expect(await rise.getAttribute('data-unit')).toBe('in');
    // Jurin's law by hand: h = 4σ/(ρ g d) for clean water on glass at 20 °C (σ 72.74 mN/m, ρ 998.2 kg/m³).
    const jurin = (4 * 0.07274) / (998.2 * 9.80665 * 0.001016);
    expect(Number(await rise.getAttribute('data-value'))).toBeCloseTo(jurin, 4);
    expect(await widget.locator('[data-caution="firm"]').textContent()).toContain(firmCaution);
    // The calculator's own cautions come with its texts chunk, after first paint, and are listed too.
    for (const code of ['CLEAN_SURFACES', 'DAMP_DIAGNOSIS'])
      await widget.locator(`[data-caution="${code}"]`).waitFor({ timeout: 20_000 });
    // "Results are estimates" is said once, by the standing disclaimer, not again in the notes.
    expect(await widget.locator('[data-caution="ESTIMATE_ONLY"]').count()).toBe(0);
    expect(await widget.locator('[data-wickstone="disclaimer"]').textContent()).toContain(
      'Results are estimates',
    );
    expect((await widget.locator('[data-result]').innerText()).match(/results are estimates/gi)).toHaveLength(
      1,
    );
    // For looking at (E2E_SCREENSHOTS): the result with its cautions, at desktop and phone widths.
    await screenshot(page, 'widget-result-1280');
    await page.setViewportSize({ width: 390, height: 800 });
    await screenshot(page, 'widget-result-390');
    await page.setViewportSize({ width: 1280, height: 800 });
    expect(await widget.locator('[data-warning="BORE_NOT_SMALL"]').count()).toBe(0);
    // What the visitor can file: the assumptions, the engine version and the input hash; no hazard for water.
    expect(await widget.locator('[data-wickstone="assumptions"] li').count()).toBeGreaterThan(3);
    expect(await widget.locator('[data-wickstone="engine-version"]').textContent()).toMatch(/^\d+\.\d+\.\d+/);
    expect(await widget.locator('[data-wickstone="input-hash"]').textContent()).toMatch(/^[0-9a-f]{64}$/);
    expect(await widget.locator('[data-hazard]').count()).toBe(0);

    // Metric: the same result in millimetres.
    await widget.locator('[data-unit="si"]').check();
    await expect.poll(() => root.getAttribute('data-system')).toBe('si');
    await expect.poll(() => rise.getAttribute('data-unit')).toBe('mm');

    // 3 mm is a bore of more than a third of water's capillary length (2.7 mm): the meniscus weight matters.
    await widget.locator('[data-input="diameter"]').fill('3');
    await widget.locator('[data-wickstone="calculate"]').click();
    await widget.locator('[data-warning="BORE_NOT_SMALL"]').waitFor();
    expect(await widget.locator('[data-warning="BORE_NOT_SMALL"]').isVisible()).toBe(true);
    await expect.poll(() => result.getAttribute('data-run-id')).not.toBe(firstRunId);
    await widget.locator('[data-result][data-report="stored"]').waitFor({ timeout: 20_000 });
    const secondRunId = await result.getAttribute('data-run-id');
    const sentence = (await widget.locator('[data-wickstone="headline"]').innerText()).trim();
    expect(sentence).toMatch(/\d mm\b/);

    await widget.locator('[data-lead-field="name"]').fill(visitor.name);
    await widget.locator('[data-lead-field="email"]').fill(visitor.email);
    await widget.locator('[data-lead-field="consent"]').check();
    await widget.locator('[data-lead-field="sendCopy"]').check();
    await widget.locator('[data-wickstone="lead-submit"]').click();
    await widget.locator('[data-wickstone="lead-confirmation"]').waitFor({ timeout: 20_000 });

    const runs = await q<{
      id: string;
      unitSystem: string;
      agreed: number;
      origin: string;
      warningCodes: unknown;
    }>(
      'SELECT id, unit_system AS unitSystem, agreed, origin, warning_codes AS warningCodes FROM runs WHERE widget_id = ?',
      [widgetId],
    );
    const byId = new Map(runs.map((r) => [r.id, r]));
    expect(runs).toHaveLength(2);
    expect(byId.get(firstRunId!)).toMatchObject({ unitSystem: 'us', agreed: 1, origin: site.origin });
    expect(json<string[]>(byId.get(firstRunId!)?.warningCodes)).not.toContain('BORE_NOT_SMALL');
    expect(byId.get(secondRunId!)).toMatchObject({ unitSystem: 'si', agreed: 1, origin: site.origin });
    expect(json<string[]>(byId.get(secondRunId!)?.warningCodes)).toContain('BORE_NOT_SMALL');

    const leads = await q<{ runId: string; name: string; email: string; sendCopy: number; origin: string }>(
      'SELECT run_id AS runId, name, email, send_copy AS sendCopy, origin FROM leads WHERE widget_id = ?',
      [widgetId],
    );
    expect(leads).toEqual([
      { runId: secondRunId, name: visitor.name, email: visitor.email, sendCopy: 1, origin: site.origin },
    ]);

    // Both e-mails go through the fake SMTP server: the firm's notice and the visitor's copy.
    await expect
      .poll(async () => (await mailTo(notifyAddress)).map((m) => m.subject), { timeout: 20_000 })
      .toEqual([expect.stringContaining(`New site-assessment request from ${visitor.name}`)]);
    const [notice] = await mailTo(notifyAddress);
    expect(notice?.text).toContain(visitor.email);
    expect(notice?.text).toContain('BORE_NOT_SMALL');
    await expect.poll(async () => (await mailTo(visitor.email)).length, { timeout: 20_000 }).toBe(1);
    const [copy] = await mailTo(visitor.email);
    expect(copy?.text).toContain('Bore (inside diameter): 3 mm');
    // The widget's headline, word for word, in the visitor's units, in both parts of the copy.
    expect(copy?.text).toContain(`\n${sentence}\n`);
    expect(copy?.html).toContain(sentence.replace(/&/g, '&amp;').replace(/'/g, '&#39;'));
    expect(copy?.text).toContain(firmCaution);

    firstReport = reports.find((body) => body.includes(firstRunId!)) ?? null;
    expect(firstReport).not.toBeNull();
  });

  it('renders the same inside its shadow root on a page with hostile global CSS', async () => {
    expect(snippet).not.toBe('');
    const probe = async (path: string) => {
      const page = await freshPage();
      await page.goto(`${site.origin}${path}`);
      await widgetIn(page).locator('[data-wickstone="root"]').waitFor({ timeout: 20_000 });
      await page.evaluate(() => document.fonts.ready.then(() => undefined));
      const looks = await page.evaluate(() => {
        const shadow = document.querySelector('wickstone-widget')?.shadowRoot;
        const props = [
          'color',
          'background-color',
          'font-family',
          'font-size',
          'font-weight',
          'line-height',
          'text-transform',
          'letter-spacing',
          'padding-top',
          'padding-left',
          'border-top-width',
          'border-top-style',
          'display',
        ];
        const targets = {
          root: '[data-wickstone="root"]',
          title: '.title',
          label: '[data-field="diameter"] label',
          input: '[data-input="diameter"]',
          select: '[data-input="temperatureC"]',
          unitSwitch: '[data-wickstone="unit-switch"] label',
          calculate: '[data-wickstone="calculate"]',
        };
        return Object.fromEntries(
          Object.entries(targets).map(([name, selector]) => {
            const el = shadow?.querySelector(selector);
            if (!el) return [name, null];
            const cs = getComputedStyle(el);
            const box = el.getBoundingClientRect();
            return [
              name,
              {
                ...Object.fromEntries(props.map((p) => [p, cs.getPropertyValue(p)])),
                width: box.width,
                height: box.height,
              },
            ];
          }),
        );
      });
      const pageHeading = await page.locator('h1').evaluate((h) => getComputedStyle(h).color);
      return { looks, pageHeading };
    };
    const plain = await probe('/');
    const hostile = await probe('/hostile');
    // The hostile rules really apply to the page around the widget…
    expect(plain.pageHeading).not.toBe('rgb(255, 0, 0)');
    expect(hostile.pageHeading).toBe('rgb(255, 0, 0)');
    // …and nothing of them reaches inside it.
    for (const [name, look] of Object.entries(plain.looks)) expect(look, `${name} missing`).not.toBeNull();
    expect(hostile.looks).toEqual(plain.looks);
  });

  it('shares one runtime between the widgets on a page, each file fetched once with its SRI hash', async () => {
    expect(snippet).not.toBe('');
    const page = await freshPage();
    const fetched: string[] = [];
    page.on('requestfinished', (req) => {
      if (req.url().includes('/releases/')) fetched.push(new URL(req.url()).pathname.split('/').pop()!);
    });
    await page.goto(`${site.origin}/twice`);
    const hosts = page.locator('wickstone-widget[data-wickstone="host"]');
    await expect.poll(() => hosts.count()).toBe(2);
    for (const i of [0, 1])
      await hosts.nth(i).locator('[data-wickstone="root"]').waitFor({ timeout: 20_000 });
    // Both work: one calculation in the second leaves the first alone.
    await hosts.nth(1).locator('[data-wickstone="calculate"]').click();
    await hosts.nth(1).locator('[data-result]').waitFor();
    expect(await hosts.nth(0).locator('[data-result]').count()).toBe(0);
    // The full widget follows first paint and takes over each first view, fetched once for both.
    for (const i of [0, 1])
      await hosts
        .nth(i)
        .locator('div[data-wickstone="mount"][data-view="full"]')
        .waitFor({ timeout: 20_000 });
    expect(await hosts.nth(1).locator('[data-result]').count()).toBe(1);
    const runtimes = fetched.filter((f) => /^runtime-.*\.js$/.test(f));
    expect(runtimes).toHaveLength(1);
    expect(fetched.filter((f) => /^app-.*\.js$/.test(f))).toHaveLength(1);
    expect(fetched.filter((f) => /^engine-tube-rise-.*\.js$/.test(f))).toHaveLength(1);
    // Every chunk the loader added carries its hash and is fetched in CORS mode.
    const tags = await page.evaluate(() =>
      [...document.querySelectorAll<HTMLScriptElement>('script[src*="/releases/"]')].map((s) => ({
        src: s.src,
        integrity: s.integrity,
        crossOrigin: s.crossOrigin,
      })),
    );
    expect(tags.length).toBeGreaterThan(2);
    // The snippet pins its loader with SHA-384; the loader, the runtime and the app chunk carry SHA-256 for the chunks.
    for (const t of tags) {
      expect(t.integrity, t.src).toMatch(/\/wickstone-[a-z-]+\.js$/.test(t.src) ? /^sha384-/ : /^sha256-/);
      expect(t.crossOrigin, t.src).toBe('anonymous');
    }
  });

  it('refuses a chunk whose bytes differ from the hash its loader carries', async () => {
    expect(snippet).not.toBe('');
    const page = await freshPage();
    const { messages, tampered } = await tamperWith(page, '**/releases/**/runtime-*.js');
    await page.goto(`${site.origin}/`);
    const host = widgetIn(page);
    await page
      .locator('wickstone-widget[data-wickstone="host"][data-state="unavailable"]')
      .waitFor({ state: 'attached', timeout: 20_000 });
    expect(tampered()).not.toBe('');
    expect(
      await page.evaluate(() => (window as unknown as { __tampered?: boolean }).__tampered),
    ).toBeUndefined();
    expect(await host.locator('[data-wickstone="root"]').count()).toBe(0);
    expect(messages.some((m) => /integrity/i.test(m) && m.includes('runtime-'))).toBe(true);
  });

  it('refuses a later chunk whose bytes differ from the hash the runtime carries, and keeps the first view working', async () => {
    expect(snippet).not.toBe('');
    const page = await freshPage();
    // The full widget's chunk: its hash is not in the loader but in the runtime the loader checked.
    const { messages, tampered } = await tamperWith(page, '**/releases/**/app-*.js');
    await page.goto(`${site.origin}/`);
    const host = widgetIn(page);
    await host.locator('div[data-wickstone="mount"][data-view="first"] [data-wickstone="root"]').waitFor({
      timeout: 20_000,
    });
    await expect.poll(() => tampered(), { timeout: 20_000 }).not.toBe('');
    await expect
      .poll(() => messages.some((m) => /integrity/i.test(m) && m.includes('app-')), { timeout: 20_000 })
      .toBe(true);
    expect(
      await page.evaluate(() => (window as unknown as { __tampered?: boolean }).__tampered),
    ).toBeUndefined();
    // The first view stays, and still works out an answer.
    await host.locator('[data-wickstone="calculate"]').click();
    await host.locator('[data-result]').waitFor();
    expect(await host.locator('[data-wickstone="headline"]').textContent()).not.toBe('');
    expect(await host.locator('div[data-wickstone="mount"][data-view="full"]').count()).toBe(0);
  });

  it('refuses a chunk whose bytes differ from the hash the app chunk carries (the texts), while the full widget takes over', async () => {
    expect(snippet).not.toBe('');
    const page = await freshPage();
    // The calculator's texts: their hash is in neither the loader nor the runtime but in the app chunk.
    const { messages, tampered } = await tamperWith(page, '**/releases/**/texts-*.js');
    await page.goto(`${site.origin}/`);
    const host = widgetIn(page);
    await host.locator('div[data-wickstone="mount"][data-view="full"]').waitFor({ timeout: 20_000 });
    await expect.poll(() => tampered(), { timeout: 20_000 }).not.toBe('');
    await expect
      .poll(() => messages.some((m) => /integrity/i.test(m) && m.includes('texts-')), { timeout: 20_000 })
      .toBe(true);
    expect(
      await page.evaluate(() => (window as unknown as { __tampered?: boolean }).__tampered),
    ).toBeUndefined();
    await host.locator('[data-wickstone="calculate"]').click();
    await host.locator('[data-result]').waitFor();
    expect(await host.locator('[data-wickstone="headline"]').textContent()).not.toBe('');
  });

  it('gives a site that is not allowed no widget and stores nothing it sends', async () => {
    expect(snippet).not.toBe('');
    const [{ n: before }] = (await q<{ n: number }>('SELECT COUNT(*) AS n FROM runs')) as [{ n: number }];
    const page = await freshPage();
    await page.goto(`${elsewhere.origin}/`);
    await page.locator('wickstone-widget[data-wickstone="host"][data-state="unavailable"]').waitFor({
      state: 'attached',
      timeout: 20_000,
    });
    expect(await widgetIn(page).locator('[data-wickstone="root"]').count()).toBe(0);
    expect((await widgetIn(page).boundingBox())?.height ?? 0).toBe(0);

    // Even a report forged on that page (a fresh run id, sent past CORS) is refused by its origin.
    expect(firstReport).not.toBeNull();
    const forged = JSON.stringify({ ...(JSON.parse(firstReport!) as object), id: crypto.randomUUID() });
    const status = await page.evaluate(
      async ([url, body]) =>
        (
          await fetch(url!, {
            method: 'POST',
            mode: 'no-cors',
            headers: { 'Content-Type': 'text/plain' },
            body,
          })
        ).type,
      [`${app.url}/api/v1/embed/runs`, forged],
    );
    expect(status).toBe('opaque');
    const [{ n: after }] = (await q<{ n: number }>('SELECT COUNT(*) AS n FROM runs')) as [{ n: number }];
    expect(Number(after)).toBe(Number(before));
    expect(await q('SELECT id FROM runs WHERE origin = ?', [elsewhere.origin])).toEqual([]);
  });

  it('stores a run report sent twice once', async () => {
    expect(firstReport).not.toBeNull();
    const report = JSON.parse(firstReport!) as { id: string };
    const page = await freshPage();
    await page.goto(`${site.origin}/`);
    await widgetIn(page).locator('[data-wickstone="root"]').waitFor({ timeout: 20_000 });
    const answer = await page.evaluate(
      async ([url, body]) => {
        const res = await fetch(url!, { method: 'POST', headers: { 'Content-Type': 'text/plain' }, body });
        return { status: res.status, body: (await res.json()) as unknown };
      },
      [`${app.url}/api/v1/embed/runs`, firstReport!],
    );
    expect(answer).toEqual({ status: 200, body: { id: report.id, agreed: true, duplicate: true } });
    const rows = await q<{ n: number }>('SELECT COUNT(*) AS n FROM runs WHERE id = ?', [report.id]);
    expect(Number(rows[0]?.n)).toBe(1);
    expect(pageErrors).toEqual([]);
  });
});
