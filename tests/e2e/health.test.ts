import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Browser } from 'playwright-core';
import { launchBrowser } from '../support/browser.js';
import { startApp, type RunningApp } from '../support/server.js';

describe('dashboard in Chromium', () => {
  let app: RunningApp;
  let browser: Browser;
  beforeAll(async () => {
    app = await startApp();
    browser = await launchBrowser();
  });
  afterAll(async () => {
    await browser?.close();
    await app?.stop();
  });

  it('shows the product name and the server version in the footer, with no timings', async () => {
    const page = await browser.newPage();
    const failed: string[] = [];
    const requested: string[] = [];
    page.on('request', (r) => requested.push(r.url()));
    // A request the page itself abandons (a client-side redirect cancels the icon) is not a failure.
    page.on('requestfailed', (r) => {
      if (r.failure()?.errorText !== 'net::ERR_ABORTED') failed.push(`${r.url()} ${r.failure()?.errorText}`);
    });
    await page.goto(app.url);
    await expect.poll(() => page.locator('h1').textContent()).toBe('Wickstone');
    const status = page.locator('[data-health="ok"]');
    await status.waitFor({ timeout: 10_000 });
    // The server's version is named; no timing reaches a public page.
    const line = await status.textContent();
    expect(line).toMatch(/^Wickstone \d+\.\d+\.\d+/);
    expect(line).not.toMatch(/round trip|\d ms\b/);
    // The font ships with the app: every request stayed on our own origin.
    const fontLoaded = await page.evaluate(async () => {
      await document.fonts.ready;
      return document.fonts.check('16px Manrope');
    });
    expect(fontLoaded).toBe(true);
    expect(failed).toEqual([]);
    expect(requested.length).toBeGreaterThan(0);
    expect(requested.filter((u) => !u.startsWith(`${app.url}/`) && !u.startsWith('data:'))).toEqual([]);
    await page.close();
  });

  it('serves the dashboard for client-side routes and 404 JSON for unknown API routes', async () => {
    const html = await fetch(`${app.url}/some/client/route`, { headers: { accept: 'text/html' } });
    expect(html.status).toBe(200);
    expect(await html.text()).toContain('<div id="root">');
    const api = await fetch(`${app.url}/api/v1/missing`);
    expect(api.status).toBe(404);
    expect((await api.json()).error.code).toBe('not_found');
  });
});
