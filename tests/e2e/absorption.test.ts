import { randomBytes } from 'node:crypto';
import { createServer, type Server } from 'node:http';
import type { AddressInfo } from 'node:net';
import { parse } from 'csv-parse/sync';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { QueryTypes } from 'sequelize';
import type { Browser, Page } from 'playwright-core';
import { calculate } from '@wickstone/calc-core';
import { formatResult } from '@wickstone/calc-core/answer';
import { seedOrgWithTeam, type FixtureOrg } from '@wickstone/server/testing';
import { launchBrowser, screenshot } from '../support/browser.js';
import { startApp, type RunningApp } from '../support/server.js';
import { ApiSession } from '../support/api-session.js';

/*
 * The absorption-coefficient widget end to end: a visitor on the firm's page uploads a CSV of
 * readings (a bad file first, refused with its line and column, the table untouched), calculates,
 * sees the coefficient and the chart, and the firm finds the run with its readings on the run page.
 */

const run = `${Date.now().toString(36)}${randomBytes(2).toString('hex')}`;
const firm = `Fenwick Moisture Laboratory ${run}`;

// An invented test on a brick slip: minutes and grams, as a laboratory sheet has them.
const goodCsv =
  '\uFEFFtime (min);mass (g)\r\n0;912,40\r\n5;915,02\r\n20;917,31\r\n60;920,96\r\n120;924,55\r\n240;929,63\r\n';
const badCsv = 'time (min),mass (g)\n0,912.40\n5,915.02\n20,heavy\n60,920.96\n120,924.55\n';

let snippet = '';
function startHost(): Promise<{ origin: string; server: Server }> {
  const server = createServer((_req, res) => {
    res
      .writeHead(200, { 'content-type': 'text/html; charset=utf-8' })
      .end(
        `<!doctype html><html lang="en"><head><meta charset="utf-8"><title>Laboratory tests · ${firm}</title></head><body><h1>Water absorption</h1>${snippet}</body></html>`,
      );
  });
  return new Promise((resolve) =>
    server.listen(0, '127.0.0.1', () =>
      resolve({ origin: `http://127.0.0.1:${(server.address() as AddressInfo).port}`, server }),
    ),
  );
}

describe('absorption coefficient from an uploaded CSV, in Chromium', () => {
  let app: RunningApp;
  let org: FixtureOrg;
  let browser: Browser;
  let host: { origin: string; server: Server };
  let widgetId = 0;
  const pageErrors: string[] = [];

  beforeAll(async () => {
    app = await startApp({
      SMTP_HOST: process.env.SMTP_HOST ?? '127.0.0.1',
      SMTP_PORT: process.env.SMTP_PORT,
      FAKE_MAIL_API_URL: process.env.FAKE_MAIL_API_URL,
    });
    org = await seedOrgWithTeam(firm);
    host = await startHost();
    const owner = new ApiSession(app.url);
    await owner.json(
      'POST',
      '/auth/login',
      { email: org.users.owner.email, password: org.users.owner.password },
      200,
    );
    const created = await owner.json<{ id: number }>(
      'POST',
      `/orgs/${org.id}/widgets`,
      {
        name: 'Absorption from your readings',
        calculatorId: 'absorption-coefficient',
        allowedOrigins: [host.origin],
      },
      201,
    );
    widgetId = created.id;
    const live = await owner.json<{ embed: { snippet: string } }>(
      'PATCH',
      `/orgs/${org.id}/widgets/${created.id}`,
      { status: 'live' },
      200,
    );
    snippet = live.embed.snippet;
    browser = await launchBrowser();
  });

  afterAll(async () => {
    await browser?.close();
    host?.server.closeAllConnections();
    await new Promise<void>((resolve) => (host ? host.server.close(() => resolve()) : resolve()));
    await app?.stop();
  });

  const widget = (page: Page) => page.locator('wickstone-widget[data-wickstone="host"]');
  const upload = (page: Page, name: string, text: string) =>
    widget(page)
      .locator('[data-wickstone="csv-file"]')
      .setInputFiles({ name, mimeType: 'text/csv', buffer: Buffer.from(text, 'utf8') });
  const massCell = (page: Page, row: number) => widget(page).locator(`[data-cell="${row}.mass"]`);

  it('refuses a bad file naming line and column, then reads a good one and shows the coefficient and the chart', async () => {
    const context = await browser.newContext({ viewport: { width: 1280, height: 900 } });
    const page = await context.newPage();
    page.on('pageerror', (err) => pageErrors.push(err.message));
    await page.goto(host.origin);
    await widget(page).locator('[data-wickstone="table"]').waitFor({ timeout: 20_000 });
    const before = await massCell(page, 2).inputValue();
    await screenshot(page, 'absorption-table-desktop');
    await page.setViewportSize({ width: 390, height: 844 });
    await screenshot(page, 'absorption-table-phone');
    await page.setViewportSize({ width: 1280, height: 900 });

    await upload(page, 'slip-bad.csv', badCsv);
    const error = widget(page).locator('[data-wickstone="table-error"]');
    await error.waitFor();
    expect(await error.textContent()).toContain('Line 4 of the file (row 3), mass: must be a number');
    expect(await widget(page).locator('[data-wickstone="table-notice"]').textContent()).toMatch(
      /nothing in the table changed/,
    );
    // Nothing half-applied: the table still holds what it held.
    expect(await massCell(page, 2).inputValue()).toBe(before);
    await screenshot(page, 'absorption-bad-csv-desktop');
    await page.setViewportSize({ width: 390, height: 844 });
    await screenshot(page, 'absorption-bad-csv-phone');
    await page.setViewportSize({ width: 1280, height: 900 });

    await upload(page, 'slip.csv', goodCsv);
    await widget(page)
      .locator('[data-wickstone="table-notice"]')
      .filter({ hasText: '6 rows read' })
      .waitFor();
    expect(await error.count()).toBe(0);
    expect(await widget(page).locator('[data-cell]').count()).toBe(12);
    await widget(page).locator('[data-wickstone="calculate"]').click();

    // The expected figure from calc-core on the file as an independent CSV parser reads it.
    const cells = parse(goodCsv.replace(/^\uFEFF/, ''), { delimiter: ';', from_line: 2 }) as string[][];
    const readings = cells.map(([t, m]) => ({
      time: Number(t) * 60,
      mass: Number((m ?? '').replace(',', '.')) / 1000,
    }));
    const expected = calculate('absorption-coefficient', { readings, faceArea: 0.01 });
    const aw = expected.outputs.absorptionCoefficient;
    expect(aw).toBeGreaterThan(0);
    const shown = widget(page).locator('[data-output="absorptionCoefficient"]');
    await shown.waitFor();
    expect(await shown.textContent()).toContain(formatResult(aw ?? 0));
    // Per root hour: 60 × the per-root-second figure (√3600 s = 60 √s).
    expect(
      await widget(page).locator('[data-output="absorptionCoefficientPerRootHour"]').textContent(),
    ).toContain(formatResult((aw ?? 0) * 60));
    const chart = widget(page).locator('[data-wickstone="chart"]');
    await chart.waitFor();
    expect(await chart.locator('[data-wickstone="fit-line"]').count()).toBe(1);
    expect(await chart.locator('[data-point="fit"]').count()).toBe(5);
    await screenshot(page, 'absorption-result-desktop');
    await page.setViewportSize({ width: 390, height: 844 });
    await screenshot(page, 'absorption-result-phone');

    // The report reaches the server, which stores the rows it recomputed with.
    let stored: { id: string; inputs: unknown; agreed: number }[] = [];
    for (let i = 0; i < 50 && stored.length === 0; i++) {
      stored = await app.db.sequelize.query('SELECT id, inputs, agreed FROM runs WHERE widget_id = ?', {
        replacements: [widgetId],
        type: QueryTypes.SELECT,
      });
      if (stored.length === 0) await new Promise((r) => setTimeout(r, 200));
    }
    expect(stored).toHaveLength(1);
    expect(stored[0]?.agreed).toBe(1);
    // JSON columns may come back as text or already parsed, depending on the connector.
    const raw = stored[0]?.inputs;
    const sent = (typeof raw === 'string' ? JSON.parse(raw) : raw) as {
      readings: { time: number; mass: number }[];
    };
    expect(sent.readings.map((r) => r.time)).toEqual(readings.map((r) => r.time));
    sent.readings.forEach((r, i) => expect(r.mass).toBeCloseTo(readings[i]?.mass ?? Number.NaN, 12));

    // The firm's run page shows the readings as a table.
    const dash = await browser.newContext({ viewport: { width: 1280, height: 900 } });
    const analyst = await dash.newPage();
    await analyst.goto(`${app.url}/login`);
    await analyst.getByLabel('E-mail address').fill(org.users.analyst.email);
    await analyst.getByLabel('Password', { exact: true }).fill(org.users.analyst.password);
    await analyst.getByRole('button', { name: 'Sign in', exact: true }).click();
    await analyst.waitForURL(/\/orgs\/\d+$/);
    await analyst.goto(`${app.url}/orgs/${org.id}/usage/runs/${stored[0]?.id ?? ''}`);
    const table = analyst.locator('[data-run-table="readings"]');
    await table.waitFor({ timeout: 20_000 });
    expect(await table.locator('tbody tr').count()).toBe(6);
    expect(await table.locator('thead').textContent()).toContain('Mass (g)');
    expect(await table.locator('tbody tr').nth(1).textContent()).toContain('915.02');
    await screenshot(analyst, 'absorption-run-page-desktop');
    await analyst.setViewportSize({ width: 390, height: 844 });
    await screenshot(analyst, 'absorption-run-page-phone');
    await dash.close();
    await context.close();
    expect(pageErrors).toEqual([]);
  });
});
