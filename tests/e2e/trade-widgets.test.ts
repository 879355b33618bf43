import { createServer, type Server } from 'node:http';
import type { AddressInfo } from 'node:net';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { QueryTypes } from 'sequelize';
import type { Browser, BrowserContext, Page } from 'playwright-core';
import { seedOrgWithTeam, type FixtureOrg } from '@wickstone/server/testing';
import { launchBrowser, screenshot } from '../support/browser.js';
import { startApp, type RunningApp } from '../support/server.js';

/*
 * The trade calculators in the dashboard and on a firm's page: an admin makes a rising-damp widget,
 * sets a default and locks an input in the editor, puts it live, and a visitor runs it on the firm's
 * own origin; the run is stored like any other. The other three trade calculators are offered in
 * the picker and open in the editor with their own inputs.
 */

const firm = 'Brackenridge Ground & Damp';

interface HostSite {
  origin: string;
  server: Server;
}

describe('trade calculators in the widget editor and on a firm’s page', () => {
  let app: RunningApp;
  let browser: Browser;
  let org: FixtureOrg;
  let site: HostSite;
  let snippet = '';
  const contexts: BrowserContext[] = [];
  const pageErrors: string[] = [];

  async function freshPage(width = 1280): Promise<Page> {
    const context = await browser.newContext({ viewport: { width, height: 900 } });
    contexts.push(context);
    const page = await context.newPage();
    page.on('pageerror', (err) => pageErrors.push(err.message));
    return page;
  }

  async function signIn(page: Page) {
    await page.goto(`${app.url}/login`);
    await page.getByLabel('E-mail address').fill(org.users.admin.email);
    await page.getByLabel('Password', { exact: true }).fill(org.users.admin.password);
    await page.getByRole('button', { name: 'Sign in', exact: true }).click();
    await page.waitForURL(/\/orgs\/\d+$/);
  }

  const q = <T extends object>(sql: string, replacements: unknown[] = []) =>
    app.db.sequelize.query<T>(sql, { replacements, type: QueryTypes.SELECT });

  beforeAll(async () => {
    app = await startApp();
    org = await seedOrgWithTeam(firm);
    const server = createServer((req, res) => {
      res
        .writeHead(200, { 'content-type': 'text/html; charset=utf-8' })
        .end(
          `<!doctype html><html lang="en"><head><meta charset="utf-8"><title>Walls · ${firm}</title></head>` +
            `<body><h1>How high will damp rise in your wall?</h1>${snippet}</body></html>`,
        );
    });
    await new Promise<void>((resolve) => server.listen(0, '127.0.0.1', resolve));
    site = { origin: `http://127.0.0.1:${(server.address() as AddressInfo).port}`, server };
    browser = await launchBrowser();
  });

  afterAll(async () => {
    for (const c of contexts) await c.close();
    await browser?.close();
    site?.server.closeAllConnections();
    await new Promise<void>((resolve) => (site ? site.server.close(() => resolve()) : resolve()));
    await app?.stop();
  });

  it('offers the four trade calculators and makes a rising-damp widget with a default and a lock', async () => {
    const page = await freshPage();
    await signIn(page);
    await page.goto(`${app.url}/orgs/${org.id}/widgets/new`);
    for (const title of [
      'Contact angle from a Wilhelmy plate force',
      'Surface tension or contact angle from a rise in a tube',
      'Height of rising damp in a wall',
      'Frost-susceptibility screening of a soil',
    ]) {
      await page.getByRole('radio', { name: new RegExp(`^${title}`) }).waitFor();
    }
    await page.getByRole('radio', { name: /^Height of rising damp in a wall/ }).check();
    await page.getByLabel('Name').fill('Damp in solid walls');
    await page.getByRole('button', { name: 'Create the widget' }).click();
    await page.waitForURL(/\/widgets\/\d+$/);
    const widgetId = Number(new URL(page.url()).pathname.split('/').pop());

    const editor = page.locator('[data-widget-editor]');
    const preview = page.locator('[data-widget-preview] wickstone-widget[data-wickstone="host"]');
    await preview.locator('[data-wickstone="root"]').waitFor();
    // A 450 mm wall by default, typed in the widget's metric units and stored in metres; faces locked.
    await page.locator('[data-section-link="inputs"]').click();
    await editor.getByLabel('Default of Wall thickness, unit: millimetre').fill('450');
    await editor.getByLabel('For visitors: The wall dries from', { exact: true }).selectOption('locked');
    await expect.poll(() => preview.locator('[data-input="wallThickness"]').inputValue()).toBe('450');
    await page.locator('[data-section-link="sites"]').click();
    await editor.getByLabel('Allowed origins').fill(site.origin);
    await page.locator('[data-section-link="name"]').click();
    await editor.getByRole('radio', { name: /^In service/ }).check();
    await page.getByRole('button', { name: 'Save changes' }).click();
    await page.locator('[data-status="live"]').waitFor();
    await screenshot(page, 'trade-editor-rising-damp-desktop');
    await page.setViewportSize({ width: 390, height: 900 });
    await screenshot(page, 'trade-editor-rising-damp-phone');

    const [row] = await q<{ settings: unknown }>('SELECT settings FROM widgets WHERE id = ?', [widgetId]);
    const settings = (typeof row?.settings === 'string' ? JSON.parse(row.settings) : row?.settings) as {
      inputs: Record<string, { mode: string; default?: number | string }>;
    };
    expect(settings.inputs.wallThickness?.default).toBeCloseTo(0.45, 12);
    expect(settings.inputs.dryingFaces?.mode).toBe('locked');
    await page.goto(`${app.url}/orgs/${org.id}/widgets/${widgetId}?section=embed`);
    snippet = await editor.locator('[data-embed-snippet]').inputValue();
    expect(snippet).toContain('wickstone-rising-damp-height');
  });

  it('runs on the firm’s page with the firm’s default and stores the run', async () => {
    expect(snippet).not.toBe('');
    for (const [width, tag] of [
      [1280, 'desktop'],
      [390, 'phone'],
    ] as const) {
      const page = await freshPage(width);
      await page.goto(`${site.origin}/`);
      const widget = page.locator('wickstone-widget[data-wickstone="host"]');
      await widget.locator('[data-wickstone="root"]').waitFor({ timeout: 20_000 });
      expect(await widget.locator('[data-field="dryingFaces"]').getAttribute('data-mode')).toBe('locked');
      await widget.locator('[data-wickstone="calculate"]').click();
      await widget.locator('[data-result][data-report="stored"]').waitFor({ timeout: 20_000 });
      // Sharp-front steady height by hand: S = 1 mm/min½, b = 0.45 m, e = 1 mm/day from each of two
      // faces, θw = 0.2: h = S·√(b/(4·e·θw)) = 0.9000 m (python3: 1e-3/sqrt(60)*sqrt(0.45/(4*1e-3/86400*0.2))).
      const height = widget.locator('[data-output="steadyHeight"]');
      expect(Number(await height.getAttribute('data-value'))).toBeCloseTo(0.9, 4);
      expect(await height.getAttribute('data-unit')).toBe('m');
      await screenshot(page, `trade-rising-damp-host-${tag}`);
    }
    const runs = await q<{ calculatorId: string; agreed: number }>(
      'SELECT calculator_id AS calculatorId, agreed FROM runs WHERE organization_id = ?',
      [org.id],
    );
    expect(runs).toHaveLength(2);
    expect(runs.every((r) => r.calculatorId === 'rising-damp-height' && Number(r.agreed) === 1)).toBe(true);
  });

  it.each([
    ['contact-angle-from-force', 'Contact angle from a Wilhelmy plate force', 'immersionDepth'],
    ['tension-from-rise', 'Surface tension or contact angle from a rise in a tube', 'rise'],
    ['frost-screening', 'Frost-susceptibility screening of a soil', 'finesShare'],
  ])('opens %s in the editor with its inputs and a working preview', async (id, title, inputId) => {
    const page = await freshPage();
    await signIn(page);
    await page.goto(`${app.url}/orgs/${org.id}/widgets/new`);
    await page.getByRole('radio', { name: new RegExp(`^${title}`) }).check();
    await page.getByLabel('Name').fill(title);
    await page.getByRole('button', { name: 'Create the widget' }).click();
    await page.waitForURL(/\/widgets\/\d+$/);
    const preview = page.locator('[data-widget-preview] wickstone-widget[data-wickstone="host"]');
    await preview.locator(`[data-input="${inputId}"]`).waitFor();
    await preview.locator('[data-wickstone="calculate"]').click();
    await preview.locator('[data-result]').waitFor();
    await screenshot(page, `trade-editor-${id}-desktop`);
    expect(pageErrors).toEqual([]);
  });
});
