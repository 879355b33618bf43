import { execFileSync } from 'node:child_process';
import { randomBytes } from 'node:crypto';
import { mkdtempSync, readFileSync, rmSync } from 'node:fs';
import { createServer, type Server } from 'node:http';
import type { AddressInfo } from 'node:net';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { QueryTypes } from 'sequelize';
import type { Browser, BrowserContext, Locator, Page } from 'playwright-core';
import {
  calculate,
  displayUnitOf,
  fromCanonical,
  getCalculator,
  withUnit,
  type CalculationResult,
} from '@wickstone/calc-core';
import { formatResult } from '@wickstone/calc-core/answer';
import { seedOrgWithTeam, type FixtureOrg } from '@wickstone/server/testing';
import { launchBrowser, screenshot, signInThroughForm } from '../support/browser.js';
import { startApp, type RunningApp } from '../support/server.js';
import { ApiSession } from '../support/api-session.js';

/*
 * The calculation sheet end to end: a visitor on the demo firm's website runs a calculation in the
 * widget, names the project, downloads the sheet; the PDF's text (Debian's pdftotext) carries the
 * result as the widget showed it, every step's source, the engine version, the input hash, the
 * cautions and the verification link; that link's page says the engine agrees.
 */

const run = `${Date.now().toString(36)}${randomBytes(2).toString('hex')}`;
const firm = 'Brackenridge Ground & Damp';
const project = {
  project: `Weir Lane terrace, no. 7 (${run})`,
  preparedFor: 'Corrie Vasquez-Hale',
  note: 'Party wall, ground floor',
};
const template = readFileSync(new URL('../../scripts/demo-site/index.html', import.meta.url), 'utf8');
const collapse = (s: string) => s.replace(/\s+/g, ' ');

describe('calculation sheet from the demo site in Chromium: download, read, verify', () => {
  let app: RunningApp;
  let site: Server;
  let siteOrigin = '';
  let snippet = '';
  let browser: Browser;
  let context: BrowserContext;
  let page: Page;
  let org: FixtureOrg;
  const dir = mkdtempSync(path.join(tmpdir(), 'wst-sheet-e2e-'));
  const pageErrors: string[] = [];

  beforeAll(async () => {
    site = createServer((req, res) => {
      if (req.url !== '/') return void res.writeHead(404).end();
      res
        .writeHead(200, { 'content-type': 'text/html; charset=utf-8' })
        .end(template.replace('{{WIDGET_1}}', snippet).replace(/\{\{WIDGET_[A-Z0-9_]+\}\}/g, ''));
    });
    await new Promise<void>((resolve) => site.listen(0, '127.0.0.1', resolve));
    siteOrigin = `http://127.0.0.1:${(site.address() as AddressInfo).port}`;

    app = await startApp();
    org = await seedOrgWithTeam(firm);
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
        name: 'Damp in the wall: how high can water climb?',
        calculatorId: 'tube-rise',
        allowedOrigins: [siteOrigin],
      },
      201,
    );
    const live = await owner.json<{ embed: { snippet: string } }>(
      'PATCH',
      `/orgs/${org.id}/widgets/${created.id}`,
      { status: 'live' },
      200,
    );
    snippet = live.embed.snippet;
    expect(snippet).toContain('<script');

    browser = await launchBrowser();
    context = await browser.newContext({ viewport: { width: 1280, height: 900 }, acceptDownloads: true });
    page = await context.newPage();
    page.on('pageerror', (err) => pageErrors.push(err.message));
  });

  /** Downloads the sheet from a widget (or its sheet block): the run it names, the file and its text. */
  async function downloadSheet(on: Page, within: Locator, name: string) {
    const [download] = await Promise.all([
      on.waitForEvent('download'),
      within.locator('[data-wickstone="sheet-download"]').click(),
    ]);
    const runId = /^calculation-sheet-([0-9a-f-]{36})\.pdf$/.exec(download.suggestedFilename())?.[1];
    expect(runId).toBeDefined();
    const file = path.join(dir, name);
    await download.saveAs(file);
    const text = collapse(execFileSync('pdftotext', ['-enc', 'UTF-8', file, '-'], { encoding: 'utf8' }));
    return { runId: runId!, file, text };
  }

  afterAll(async () => {
    await browser?.close();
    site?.closeAllConnections();
    await new Promise<void>((resolve) => (site ? site.close(() => resolve()) : resolve()));
    await app?.stop();
    rmSync(dir, { recursive: true, force: true });
  });

  it('downloads the sheet the visitor named, whose text carries the working and whose link says "agrees"', async () => {
    await page.goto(siteOrigin);
    const widget = page.locator('wickstone-widget').first();
    await widget.locator('[data-wickstone="calculate"]').click();
    const result = widget.locator('[data-wickstone="result"][data-report="stored"]');
    await result.waitFor();

    const sheet = widget.locator('[data-wickstone="sheet"]');
    await sheet.locator('summary').click();
    await sheet.locator('[data-sheet-field="project"]').fill(project.project);
    await sheet.locator('[data-sheet-field="preparedFor"]').fill(project.preparedFor);
    await sheet.locator('[data-sheet-field="note"]').fill(project.note);
    await screenshot(page, 'sheet-block-desktop');
    const { runId, text } = await downloadSheet(page, sheet, 'sheet.pdf');

    // What the server stored for this run, recomputed here with the engine the test imports.
    const [row] = await app.db.sequelize.query<{ inputs: string | object; sheet_project: string | object }>(
      'SELECT inputs, sheet_project FROM runs WHERE id = ?',
      { replacements: [runId], type: QueryTypes.SELECT },
    );
    const json = (v: string | object) => (typeof v === 'string' ? (JSON.parse(v) as unknown) : v);
    expect(json(row!.sheet_project)).toEqual(project);
    const r: CalculationResult = calculate('tube-rise', json(row!.inputs) as Record<string, number | string>);
    const calc = getCalculator('tube-rise')!;
    const rise = calc.outputs.find((o) => o.id === 'rise')!;
    const unit = displayUnitOf(rise, 'si');
    const figure = withUnit(formatResult(fromCanonical(r.outputs.rise as number, unit)), unit);

    // The result as the widget showed it: one formatting rule for the widget and the sheet.
    expect(collapse(await result.innerText())).toContain(figure);
    expect(text).toContain(figure);
    for (const step of r.working) expect(text).toContain(collapse(step.source as string));
    expect(text).toContain(`calc-core ${r.version}`);
    expect(text).toContain(r.inputHash);
    for (const c of r.cautions) expect(text).toContain(collapse(c.text).slice(0, 60));
    for (const v of Object.values(project)) expect(text).toContain(v);
    const verifyUrl = `${app.url}/verify/${runId}`;
    expect(text).toContain(verifyUrl);

    await page.goto(verifyUrl);
    await expect(page.locator('[data-verdict]').getAttribute('data-verdict')).resolves.toBe('agrees');
    await expect(page.getByText('The engine agrees').isVisible()).resolves.toBe(true);
    await screenshot(page, 'sheet-verify-desktop');
    expect(pageErrors).toEqual([]);
  });

  it('writes the widget’s headline, in the visitor’s units, on the sheet and the run’s page', async () => {
    const visitor = await context.newPage();
    await visitor.goto(siteOrigin);
    const widget = visitor.locator('wickstone-widget').first();
    // The widget opens in metric; this visitor switches to US units before working it out.
    await widget.locator('[data-wickstone="root"]').waitFor({ timeout: 20_000 });
    await widget.locator('input[data-unit="us"]').check();
    await expect.poll(() => widget.locator('[data-wickstone="root"]').getAttribute('data-system')).toBe('us');
    await widget.locator('[data-wickstone="calculate"]').click();
    await widget.locator('[data-wickstone="result"][data-report="stored"]').waitFor();
    const sentence = collapse((await widget.locator('[data-wickstone="headline"]').innerText()).trim());
    // In inches, as the visitor saw it, not the widget's metric.
    expect(sentence).toMatch(/\d in\b/);
    expect(sentence).not.toMatch(/\bmm\b/);
    const { runId, text, file } = await downloadSheet(visitor, widget, 'sheet-us.pdf');
    expect(text).toContain(sentence);
    if (process.env.E2E_SCREENSHOTS) {
      // The sheet's first page as an image, to look at.
      const out = path.resolve(import.meta.dirname, '..', '..', 'var', 'screenshots', 'sheet-headline-page');
      execFileSync('pdftoppm', ['-png', '-r', '80', '-f', '1', '-l', '1', '-singlefile', file, out]);
    }
    await visitor.close();

    // The run's page in the dashboard: the same sentence, from the stored result.
    const firm = await context.newPage();
    await signInThroughForm(firm, app.url, org.users.owner);
    await firm.goto(`${app.url}/orgs/${org.id}/usage/runs/${runId}`);
    const shown = firm.locator('[data-run-headline]');
    await shown.waitFor();
    expect(collapse((await shown.innerText()).trim())).toBe(sentence);
    expect(await firm.locator('[data-visitor-units]').getAttribute('data-visitor-units')).toBe('us');
    await screenshot(firm, 'run-headline-1280');
    await firm.setViewportSize({ width: 390, height: 844 });
    await screenshot(firm, 'run-headline-390');
    await firm.close();
  });

  it('fits a phone: the sheet block and its download on a 390 px screen', async () => {
    const phone = await context.newPage();
    await phone.setViewportSize({ width: 390, height: 844 });
    await phone.goto(siteOrigin);
    const widget = phone.locator('wickstone-widget').first();
    await widget.locator('[data-wickstone="calculate"]').click();
    await widget.locator('[data-wickstone="result"][data-report="stored"]').waitFor();
    const button = widget.locator('[data-wickstone="sheet-download"]');
    await button.scrollIntoViewIfNeeded();
    const box = await button.boundingBox();
    expect(box).not.toBeNull();
    // Within the screen and big enough to tap.
    expect(box!.x).toBeGreaterThanOrEqual(0);
    expect(box!.x + box!.width).toBeLessThanOrEqual(390);
    expect(box!.height).toBeGreaterThanOrEqual(44);
    await widget.locator('[data-wickstone="sheet"] summary').click();
    await screenshot(phone, 'sheet-block-phone');
    await phone.close();
  });
});
