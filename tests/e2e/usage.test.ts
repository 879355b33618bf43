import { randomBytes, randomUUID } from 'node:crypto';
import { readFile } from 'node:fs/promises';
import { parse } from 'csv-parse/sync';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { QueryTypes } from 'sequelize';
import type { Browser, BrowserContext, Page } from 'playwright-core';
import { calculate } from '@wickstone/calc-core';
import { seedOrgWithTeam, type FixtureOrg } from '@wickstone/server/testing';
import { launchBrowser, screenshot } from '../support/browser.js';
import { startApp, type RunningApp } from '../support/server.js';
import { ApiSession } from '../support/api-session.js';

/*
 * The analysts' screens end to end: real runs reported through the public embed API (computed
 * with calc-core, as the widget does), one request for an assessment, then the analyst in Chromium
 * filters the runs, reads one run's working, works the lead and downloads a CSV.
 */

const run = `${Date.now().toString(36)}${randomBytes(2).toString('hex')}`;
const firm = 'Brackenridge Ground & Damp';
const SITE = 'https://www.brackenridge-ground.example';
const visitor = {
  name: 'Ffion Aldercott',
  email: `ffion.aldercott.${run}@old-mill-cottage.example`,
  siteAddress: '3 Weir Lane, Brackenridge',
};

interface LiveWidget {
  id: number;
  name: string;
  calculatorId: string;
  publicKey: string;
  system: 'si' | 'us';
}

describe('usage and leads in Chromium: filter runs, read the working, work a lead, download CSV', () => {
  let app: RunningApp;
  let browser: Browser;
  let org: FixtureOrg;
  let context: BrowserContext;
  let page: Page;
  const pageErrors: string[] = [];
  let tube: LiveWidget;
  let soil: LiveWidget;
  const reported: { id: string; widget: LiveWidget; warned: boolean; firstStep: string }[] = [];
  let leadRunId = '';
  let leadId = 0;

  const q = <T extends object>(sql: string, replacements: unknown[] = []) =>
    app.db.sequelize.query<T>(sql, { replacements, type: QueryTypes.SELECT });

  async function liveWidget(owner: ApiSession, name: string, calculatorId: string): Promise<LiveWidget> {
    const created = await owner.json<{
      id: number;
      publicKey: string;
      settings: { units: { system: 'si' | 'us' } };
    }>('POST', `/orgs/${org.id}/widgets`, { name, calculatorId, allowedOrigins: [SITE] }, 201);
    await owner.json('PATCH', `/orgs/${org.id}/widgets/${created.id}`, { status: 'live' }, 200);
    return {
      id: created.id,
      name,
      calculatorId,
      publicKey: created.publicKey,
      system: created.settings.units.system,
    };
  }

  /** What the widget's script sends after a visitor's calculation: a text/plain beacon from the firm's page. */
  async function report(w: LiveWidget, inputs: Record<string, number | string>): Promise<string> {
    const r = calculate(w.calculatorId, inputs);
    const id = randomUUID();
    const body = {
      id,
      publicKey: w.publicKey,
      inputs: r.inputs,
      unitSystem: w.system,
      result: {
        outputs: r.outputs,
        warnings: r.warnings.map((x) => x.code),
        inputHash: r.inputHash,
        version: r.version,
      },
      pageUrl: `${SITE}/advice/rising-damp`,
    };
    const res = await fetch(`${app.url}/api/v1/embed/runs`, {
      method: 'POST',
      headers: { 'Content-Type': 'text/plain', Origin: SITE },
      body: JSON.stringify(body),
    });
    expect(res.status, await res.clone().text()).toBe(201);
    reported.push({ id, widget: w, warned: r.warnings.length > 0, firstStep: r.working[0]?.label ?? '' });
    return id;
  }

  const runsTotal = () => page.getByTestId('runs-total').textContent();
  const rowIds = () =>
    page.locator('[data-run-row]').evaluateAll((rows) => rows.map((r) => r.getAttribute('data-run-row')));

  beforeAll(async () => {
    app = await startApp({
      SMTP_HOST: process.env.SMTP_HOST ?? '127.0.0.1',
      SMTP_PORT: process.env.SMTP_PORT,
      FAKE_MAIL_API_URL: process.env.FAKE_MAIL_API_URL,
    });
    org = await seedOrgWithTeam(firm);
    const owner = new ApiSession(app.url);
    await owner.json(
      'POST',
      '/auth/login',
      { email: org.users.owner.email, password: org.users.owner.password },
      200,
    );
    tube = await liveWidget(owner, 'Rising damp in a pore', 'tube-rise');
    soil = await liveWidget(owner, 'Slab moisture check', 'soil-capillary-rise');
    for (const diameter of [0.0005, 0.0008, 0.004, 0.006]) await report(tube, { diameter });
    await report(soil, { d10: 0.0001, waterTableDepth: 1 });
    await report(soil, { d10: 0.00002, waterTableDepth: 0.5 });
    leadRunId = reported[0]!.id;
    const lead = await fetch(`${app.url}/api/v1/embed/leads`, {
      method: 'POST',
      headers: { 'Content-Type': 'text/plain', Origin: SITE },
      body: JSON.stringify({ runId: leadRunId, publicKey: tube.publicKey, fields: visitor, consent: true }),
    });
    expect(lead.status, await lead.clone().text()).toBe(201);
    leadId = ((await lead.json()) as { id: number }).id;

    browser = await launchBrowser();
    context = await browser.newContext({ viewport: { width: 1280, height: 800 }, acceptDownloads: true });
    page = await context.newPage();
    page.on('pageerror', (err) => pageErrors.push(err.message));
  });

  afterAll(async () => {
    await context?.close();
    await browser?.close();
    await app?.stop();
  });

  it('has runs both with and without warnings to filter (the fixture must be able to tell them apart)', () => {
    const warned = reported.filter((r) => r.warned).length;
    expect(warned).toBeGreaterThan(0);
    expect(warned).toBeLessThan(reported.length);
  });

  it('shows the analyst the summary and runs, and the filters change the rows and stay in the URL', async () => {
    await page.goto(`${app.url}/login`);
    await page.getByLabel('E-mail address').fill(org.users.analyst.email);
    await page.getByLabel('Password', { exact: true }).fill(org.users.analyst.password);
    await page.getByRole('button', { name: 'Sign in', exact: true }).click();
    await page.waitForURL(/\/orgs\/\d+$/);
    await page
      .getByRole('navigation', { name: 'Main' })
      .getByRole('link', { name: 'Usage', exact: true })
      .click();
    await page.waitForURL(/\/usage$/);

    await expect.poll(runsTotal).toBe(`${reported.length} runs match`);
    expect(await page.locator('[data-total="runs"]').textContent()).toBe(String(reported.length));
    expect(await page.locator('[data-total="withLead"]').textContent()).toBe('1');
    await expect
      .poll(() =>
        page.getByRole('img', { name: new RegExp(`^${reported.length} runs over 30 days`) }).count(),
      )
      .toBe(1);
    await screenshot(page, 'usage-summary');

    await page.getByLabel('Warnings').selectOption('true');
    const warned = reported.filter((r) => r.warned);
    await expect.poll(runsTotal).toBe(`${warned.length} ${warned.length === 1 ? 'run' : 'runs'} match`);
    expect(new URL(page.url()).searchParams.get('hasWarning')).toBe('true');
    expect((await rowIds()).sort()).toEqual(warned.map((r) => r.id).sort());

    await page.getByLabel('Warnings').selectOption('');
    await expect.poll(runsTotal).toBe(`${reported.length} runs match`);
    await page.getByLabel('Widget').selectOption(String(soil.id));
    const soilRuns = reported.filter((r) => r.widget === soil).map((r) => r.id);
    await expect.poll(runsTotal).toBe(`${soilRuns.length} runs match`);
    expect((await rowIds()).sort()).toEqual([...soilRuns].sort());
    expect(new URL(page.url()).searchParams.get('widgetId')).toBe(String(soil.id));
    await screenshot(page, 'usage-runs-filtered');
  });

  it('downloads the filtered runs as CSV', async () => {
    const [download] = await Promise.all([
      page.waitForEvent('download'),
      page.getByRole('link', { name: 'Download CSV' }).click(),
    ]);
    // Read back by an independent parser (csv-parse: equal column counts, quotes closed).
    const [header, ...records] = parse(await readFile(await download.path(), 'utf8'), {
      bom: true,
    }) as string[][];
    expect(header?.join(',')).toBe(
      'Time (UTC),Run,Widget ID,Widget,Calculator,Inputs,Outputs,Units,Warnings,Site,Page,Release,Agreed,Lead',
    );
    // Only the chosen widget's runs, the same filter as the table.
    const soilRuns = reported.filter((r) => r.widget === soil).map((r) => r.id);
    expect(records.map((r) => r[1]).sort()).toEqual([...soilRuns].sort());
    expect(records.map((r) => r[1])).not.toContain(leadRunId);
  });

  it('opens a run and shows its working as stored, the check and its lead', async () => {
    await page.getByLabel('Widget').selectOption('');
    await expect.poll(runsTotal).toBe(`${reported.length} runs match`);
    await page.locator(`[data-run-row="${leadRunId}"] a`).click();
    await page.waitForURL(new RegExp(`/usage/runs/${leadRunId}$`));
    await page.getByRole('heading', { name: 'Working', exact: true }).waitFor();
    // Runs keep their figures, not their working: the page makes it again from the stored inputs
    // with the run's engine, step for step what calc-core gives for those inputs.
    const [stored] = await q<{ calculator_id: string; inputs: unknown }>(
      'SELECT calculator_id, inputs FROM runs WHERE id = ?',
      [leadRunId],
    );
    const inputs = typeof stored!.inputs === 'string' ? JSON.parse(stored!.inputs) : stored!.inputs;
    const working = calculate(stored!.calculator_id, inputs).working;
    expect(working.length).toBeGreaterThan(0);
    expect(await page.locator('[data-working-step]').count()).toBe(working.length);
    expect(await page.locator('[data-working-step]').first().textContent()).toContain(reported[0]!.firstStep);
    await page.getByText('reached the same result').waitFor();
    await screenshot(page, 'usage-run');
  });

  it('moves the lead to contacted, adds a dated note, and the database holds both', async () => {
    await page.getByRole('link', { name: 'Open the enquiry' }).click();
    await page.waitForURL(new RegExp(`/leads/${leadId}$`));
    await page.getByText(visitor.email).first().waitFor();
    // The stored code stays 'contacted'; people read the status as 'Replied'.
    await page.getByLabel('Status').selectOption({ label: 'Replied' });
    await page.getByRole('button', { name: 'Save', exact: true }).click();
    await page.getByText('Saved. Status: Replied.').waitFor();
    await page.getByLabel('Add a note').fill('Rang back; survey pencilled in for Thursday.');
    await page.getByRole('button', { name: 'Add the note' }).click();
    await page
      .getByRole('list', { name: 'Notes, oldest first' })
      .getByText('Rang back; survey pencilled in for Thursday.')
      .waitFor();
    expect(await page.getByLabel('Add a note').inputValue()).toBe('');
    const [row] = await q<{ status: string }>(
      'SELECT status FROM leads WHERE id = ? AND organization_id = ?',
      [leadId, org.id],
    );
    expect(row).toEqual({ status: 'contacted' });
    const notes = await q<{ body: string }>('SELECT body FROM lead_notes WHERE lead_id = ?', [leadId]);
    expect(notes).toEqual([{ body: 'Rang back; survey pencilled in for Thursday.' }]);
    await screenshot(page, 'usage-lead');
  });

  it('lists the lead under its new status', async () => {
    await page
      .getByRole('navigation', { name: 'Main' })
      .getByRole('link', { name: 'Enquiries', exact: true })
      .click();
    await page.locator(`[data-lead-row="${leadId}"]`).waitFor();
    await page.getByLabel('Status').selectOption('new');
    await page.getByText('No enquiry matches these filters').waitFor();
    await page.getByLabel('Status').selectOption('contacted');
    await page.locator(`[data-lead-row="${leadId}"]`).waitFor();
    expect(new URL(page.url()).searchParams.get('status')).toBe('contacted');
    await screenshot(page, 'usage-leads');
    expect(pageErrors).toEqual([]);
  });

  it("erases the lead's personal data after a confirmation; the run stays linked and the usage counts do not change", async () => {
    await page.locator(`[data-lead-row="${leadId}"] a`).click();
    await page.waitForURL(new RegExp(`/leads/${leadId}$`));
    const ledBefore = await q<{ n: string }>('SELECT SUM(led) AS n FROM run_daily');
    await page.getByRole('button', { name: 'Erase personal data' }).click();
    // Nothing is erased by the first press.
    const [before] = await q<{ name: string | null }>('SELECT name FROM leads WHERE id = ?', [leadId]);
    expect(before!.name).toBe(visitor.name);
    await page.getByRole('button', { name: 'Erase', exact: true }).click();
    await page.getByText('The personal data of this enquiry was erased').waitFor();
    expect(await page.getByText(visitor.email).count()).toBe(0);
    const [after] = await q<{ name: string | null; email: string | null; runId: string | null }>(
      'SELECT name, email, run_id AS runId FROM leads WHERE id = ?',
      [leadId],
    );
    expect(after).toEqual({ name: null, email: null, runId: leadRunId });
    expect(await q('SELECT id FROM runs WHERE id = ?', [leadRunId])).toHaveLength(1);
    expect(await q<{ n: string }>('SELECT SUM(led) AS n FROM run_daily')).toEqual(ledBefore);
    await screenshot(page, 'usage-lead-erased');
    expect(pageErrors).toEqual([]);
  });
});
