import { randomBytes } from 'node:crypto';
import { createServer, type Server } from 'node:http';
import type { AddressInfo } from 'node:net';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Browser, Locator, Page } from 'playwright-core';
import type { Widget } from '@wickstone/contracts';
import { seedOrgWithTeam, type FixtureOrg } from '@wickstone/server/testing';
import { ApiSession } from '../support/api-session.js';
import { launchBrowser, screenshot } from '../support/browser.js';
import { startApp, type RunningApp } from '../support/server.js';

/*
 * The developer's embed keys and the firm's Content-Security-Policy in Chromium: a page served with
 * exactly the policy the dashboard shows runs the widget with no violation; the developer replaces
 * the key on the integration screen and the embed code changes, while the page with the old code
 * keeps working through the overlap.
 */

const STRANGER = 'https://intranet.ashgrove-survey.example';

/** One part of a screen, when screenshots are asked for (E2E_SCREENSHOTS), beside the full pages. */
async function partShot(part: Locator, name: string): Promise<void> {
  const asked = process.env.E2E_SCREENSHOTS;
  if (!asked || asked === '0') return;
  const dir = asked === '1' ? 'var/screenshots' : asked;
  await part.screenshot({ path: `${dir}/${name}.png` });
}

/** What the page under test sends: its body and its Content-Security-Policy header (none when null). */
interface SitePage {
  html: string;
  csp: string | null;
  /** The widget has a table input (the tables chunk, its styles and the readings chart load too). */
  table?: boolean;
}

/** The policy the dashboard lists, with the page's nonce in place of the placeholder. */
const policyOf = (w: Widget, nonce: string, leaveOut: string[] = []) =>
  [
    "default-src 'none'",
    ...w.embed.csp
      .filter((d) => !leaveOut.includes(d.directive))
      .map((d) => `${d.directive} ${d.sources.join(' ')}`.replaceAll('{{csp-nonce}}', nonce)),
  ].join('; ');

describe('embed keys and CSP, as the developer', () => {
  let app: RunningApp;
  let org: FixtureOrg;
  let browser: Browser;
  let site: { origin: string; server: Server };
  let served: SitePage = { html: '', csp: null };
  let widget: Widget;

  /** A live widget the owner makes, allowed on the test site. */
  async function liveWidget(name: string, calculatorId: string): Promise<Widget> {
    const owner = await ApiSession.signedIn(app.url, org.users.owner);
    const created = await owner.json<Widget>(
      'POST',
      `/orgs/${org.id}/widgets`,
      { name, calculatorId, allowedOrigins: [site.origin] },
      201,
    );
    return owner.json<Widget>('PATCH', `/orgs/${org.id}/widgets/${created.id}`, { status: 'live' }, 200);
  }

  beforeAll(async () => {
    app = await startApp();
    org = await seedOrgWithTeam('Ashgrove Survey & Damp');
    const server = createServer((_req, res) => {
      res
        .writeHead(200, {
          'content-type': 'text/html; charset=utf-8',
          ...(served.csp ? { 'content-security-policy': served.csp } : {}),
        })
        .end(
          `<!doctype html><html lang="en"><head><meta charset="utf-8"><title>Rising damp survey</title></head>` +
            `<body><h1>How high does the damp climb?</h1>${served.html}</body></html>`,
        );
    });
    await new Promise<void>((resolve) => server.listen(0, '127.0.0.1', resolve));
    site = { origin: `http://127.0.0.1:${(server.address() as AddressInfo).port}`, server };
    widget = await liveWidget('Rising damp check', 'tube-rise');
    // A page on a site nobody allowed asks for the widget: the developer sees it refused.
    for (let i = 0; i < 3; i++) {
      const res = await fetch(`${app.url}/api/v1/embed/widgets/${widget.publicKey}`, {
        headers: { Origin: STRANGER },
      });
      expect(res.status).toBe(403);
    }
    browser = await launchBrowser();
  }, 300_000);

  afterAll(async () => {
    await browser?.close();
    site?.server.close();
    await app?.stop();
  });

  /** Loads the site's page and runs one calculation; returns the CSP violations the page saw. */
  async function runOnSite(page: SitePage): Promise<string[]> {
    served = page;
    const context = await browser.newContext();
    const tab = await context.newPage();
    const violations: string[] = [];
    await tab.exposeFunction('reportViolation', (v: string) => violations.push(v));
    await tab.addInitScript(() => {
      document.addEventListener(
        'securitypolicyviolation',
        (e) =>
          void (window as unknown as { reportViolation(v: string): void }).reportViolation(
            `${e.effectiveDirective} ${e.blockedURI}`,
          ),
        true,
      );
    });
    tab.on('console', (m) => {
      if (m.text().includes('Content Security Policy')) violations.push(m.text());
    });
    await tab.goto(`${site.origin}/`);
    const w = tab.locator('wickstone-widget[data-wickstone="host"]');
    await w.locator('[data-wickstone="root"]').waitFor({ timeout: 30_000 });
    // A table input comes with the tables chunk and its styles: wait for the table to be here.
    if (page.table) await w.locator('[data-wickstone="table"]').waitFor({ timeout: 30_000 });
    await w.locator('[data-wickstone="calculate"]').click();
    await w.locator('[data-result][data-report="stored"]').waitFor({ timeout: 30_000 });
    if (page.table) {
      // The readings chart is drawn with the tables chunk's styles, as the table is.
      const chart = w.locator('[data-wickstone="chart"]');
      await chart.waitFor({ timeout: 30_000 });
      // The tables chunk's styles did arrive, as a constructed sheet the policy does not govern.
      expect(
        await w.evaluate(
          (host) =>
            host.shadowRoot?.adoptedStyleSheets.some((s) =>
              [...s.cssRules].some((r) => r instanceof CSSStyleRule && r.selectorText === '.table-field'),
            ) ?? false,
        ),
      ).toBe(true);
    }
    // The texts chunk (cautions) arrives after first paint: wait for it too ("results are estimates"
    // is the standing disclaimer's, so a caution of the calculator's own).
    const caution = page.table ? 'LABORATORY_RESULT' : 'CLEAN_SURFACES';
    await w.locator(`[data-caution="${caution}"]`).waitFor({ timeout: 30_000 });
    await tab.evaluate(() => document.fonts.ready);
    await context.close();
    return violations;
  }

  it('runs the widget under exactly the policy shown, with no violation; without connect-src it is caught', async () => {
    const nonce = randomBytes(16).toString('base64');
    const html = widget.embed.variants.nonce.replaceAll('{{csp-nonce}}', nonce);
    expect(html).toContain(`nonce="${nonce}"`);
    expect(widget.embed.csp.map((d) => d.directive)).toEqual([
      'script-src',
      'connect-src',
      'font-src',
      'img-src',
    ]);
    expect(await runOnSite({ html, csp: policyOf(widget, nonce) })).toEqual([]);

    // A widget with a table input under the same listed directives: its tables chunk's styles go in
    // as the main styles do, so there is no violation either.
    const tableWidget = await liveWidget('Brick absorption', 'absorption-coefficient');
    const tableHtml = tableWidget.embed.variants.nonce.replaceAll('{{csp-nonce}}', nonce);
    expect(await runOnSite({ html: tableHtml, csp: policyOf(tableWidget, nonce), table: true })).toEqual([]);

    // The check itself can fail: leave connect-src out and the widget's settings request is refused.
    served = { html, csp: policyOf(widget, nonce, ['connect-src']) };
    const context = await browser.newContext();
    const tab = await context.newPage();
    const seen: string[] = [];
    tab.on('console', (m) => {
      if (m.text().includes('Content Security Policy')) seen.push(m.text());
    });
    await tab.goto(`${site.origin}/`);
    await expect.poll(() => seen.some((s) => s.includes('connect-src')), { timeout: 20_000 }).toBe(true);
    await context.close();
  });

  async function signIn(page: Page, who: { email: string; password: string }) {
    await page.goto(`${app.url}/login`);
    await page.getByLabel('E-mail address').fill(who.email);
    await page.getByLabel('Password', { exact: true }).fill(who.password);
    await page.getByRole('button', { name: 'Sign in', exact: true }).click();
    await page.waitForURL(/\/orgs\/\d+$/);
  }

  it('the developer replaces the key: the code changes, both keys show, the old page keeps working', async () => {
    const oldSnippet = widget.embed.snippet;
    const oldKey = widget.publicKey;
    const context = await browser.newContext({ viewport: { width: 1280, height: 900 } });
    const page = await context.newPage();
    await signIn(page, org.users.developer);
    // The overview: refused sites and the release status.
    await page.locator('[data-refused-summary]').waitFor({ timeout: 20_000 });
    expect(await page.locator('[data-refused-summary]').textContent()).toContain('3 refusals');
    // The editor shows one section at a time: the embed code first, then the release and sites.
    const widgetPage = `${app.url}/orgs/${org.id}/widgets/${widget.id}`;
    await page.goto(`${widgetPage}?section=embed`);
    const code = page.locator('[data-embed-snippet]');
    await code.waitFor();
    expect(await code.inputValue()).toBe(oldSnippet);
    await page.goto(`${widgetPage}?section=release`);
    const section = page.locator('#widget-release');
    await section.locator('[data-current-key]').waitFor();
    // The refused site, one click from allowed (and back off again: it is not the firm's).
    const refused = section.locator('[data-refused-origins]');
    expect(await refused.textContent()).toContain(STRANGER);
    await refused.getByRole('button', { name: /Allow this origin/ }).click();
    await section.getByRole('button', { name: `Remove ${STRANGER}` }).waitFor();
    await section.getByRole('button', { name: `Remove ${STRANGER}` }).click();
    await expect.poll(() => section.locator('[data-allowed-origins] li').count()).toBe(1);

    const until = new Date(Date.now() + 10 * 86_400_000).toISOString().slice(0, 10);
    await section.getByLabel(/Keep serving the current key through/).fill(until);
    await section.getByRole('button', { name: 'Replace the key' }).click();
    await section.locator('[data-widget-keys]').scrollIntoViewIfNeeded();
    await partShot(section.locator('[data-widget-keys]'), 'keys-rotation-developer-1280-confirm');
    await section.getByRole('button', { name: 'Replace it' }).click();
    await section.locator('[data-previous-key="served"]').waitFor({ timeout: 20_000 });
    await partShot(section.locator('[data-widget-keys]'), 'keys-rotation-developer-1280-after');
    const newKey = (await section.locator('[data-current-key]').textContent()) ?? '';
    expect(newKey).not.toBe(widget.publicKey);
    expect(newKey).toMatch(/^[0-9A-HJKMNP-TV-Z]{4}(-[0-9A-HJKMNP-TV-Z]{4}){3}-[0-9A-HJKMNP-TV-Z]$/);
    expect(await section.locator('[data-previous-key]').textContent()).toContain(widget.publicKey);
    await page.goto(`${widgetPage}?section=embed`);
    await expect.poll(() => code.inputValue()).toContain(`data-wickstone-key="${newKey}"`);
    await context.close();

    // The page still carrying the old code is served through the overlap; the new code works too.
    expect(await runOnSite({ html: oldSnippet, csp: null })).toEqual([]);
    const developer = await ApiSession.signedIn(app.url, org.users.developer);
    widget = await developer.json<Widget>('GET', `/orgs/${org.id}/widgets/${widget.id}`, undefined, 200);
    expect(widget.publicKey).toBe(newKey);
    expect(await runOnSite({ html: widget.embed.snippet, csp: null })).toEqual([]);

    // The old key leaked after all: the developer stops serving it now, with a confirm step.
    const again = await browser.newContext({ viewport: { width: 1280, height: 900 } });
    const tab = await again.newPage();
    await signIn(tab, org.users.developer);
    await tab.goto(`${widgetPage}?section=release`);
    const keys = tab.locator('#widget-release [data-widget-keys]');
    await keys.locator('[data-previous-key="served"]').waitFor();
    await keys.getByRole('button', { name: 'Stop serving the replaced key now' }).click();
    await partShot(keys, 'keys-end-overlap-developer-1280-confirm');
    await keys.getByRole('button', { name: 'Stop it now' }).click();
    await keys.locator('[data-previous-key="refused"]').waitFor({ timeout: 20_000 });
    await expect.poll(() => keys.textContent()).toContain(`${oldKey} is refused from now on.`);
    await partShot(keys, 'keys-end-overlap-developer-1280-after');
    // The key may be replaced again at once.
    expect(await keys.getByRole('button', { name: 'Replace the key' }).count()).toBe(1);
    await again.close();
  });

  it('screens for looking at: the integration screen and the overview, as developer and analyst', async () => {
    for (const [role, who] of [
      ['developer', org.users.developer],
      ['analyst', org.users.analyst],
    ] as const) {
      for (const width of [1280, 390]) {
        const context = await browser.newContext({ viewport: { width, height: 900 } });
        const page = await context.newPage();
        await signIn(page, who);
        await page.locator('main').waitFor();
        if (role === 'developer') await page.locator('[data-refused-summary]').waitFor({ timeout: 20_000 });
        await screenshot(page, `keys-overview-${role}-${width}`);
        const widgetPage = `${app.url}/orgs/${org.id}/widgets/${widget.id}`;
        await page.goto(`${widgetPage}?section=embed`);
        await page.locator('#widget-embed [data-embed-snippet]').waitFor();
        await partShot(page.locator('#widget-embed'), `keys-embed-${role}-${width}-section`);
        await page.goto(`${widgetPage}?section=release`);
        const section = page.locator('#widget-release');
        await section.locator('[data-current-key]').waitFor();
        if (role === 'analyst')
          expect(await section.getByRole('button', { name: 'Replace the key' }).count()).toBe(0);
        await section.scrollIntoViewIfNeeded();
        await screenshot(page, `keys-integration-${role}-${width}`);
        await partShot(section, `keys-release-${role}-${width}-section`);
        await context.close();
      }
    }
  });
});
