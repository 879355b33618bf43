import { randomBytes } from 'node:crypto';
import { createServer, type Server } from 'node:http';
import type { AddressInfo } from 'node:net';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { QueryTypes } from 'sequelize';
import type { Browser, BrowserContext, Locator, Page } from 'playwright-core';
import { calculate, parseNumber } from '@wickstone/calc-core';
import { formatResult } from '@wickstone/calc-core/answer';
import { seedOrgWithTeam, type FixtureOrg } from '@wickstone/server/testing';
import { launchBrowser, screenshot } from '../support/browser.js';
import { startApp, type RunningApp } from '../support/server.js';
import { ApiSession } from '../support/api-session.js';

/*
 * The visitor's answer end to end: widgets made through the API, placed by their snippets on a
 * firm's page on another loopback origin, run in Chromium in US units. The expected figures are
 * worked out here with calc-core from what the boxes show, never typed in.
 */

const run = `${Date.now().toString(36)}${randomBytes(2).toString('hex')}`;
const firm = `Harrowgate Soil & Damp ${run}`;
const IN = 0.0254;
const FT = 0.3048;
/** Every liquid but water the calculators know, and the sources of their table values. */
const FOREIGN = /mercury|ethanol|methanol|acetone|toluene|glycol|glycerol|Adamson|Jasper|CRC Handbook/i;

describe('the visitor’s answer in Chromium: headline, warning titles and locks, in US units', () => {
  let app: RunningApp;
  let browser: Browser;
  let org: FixtureOrg;
  let server: Server;
  let origin = '';
  const snippets = new Map<string, string>();
  const widgetIds = new Map<string, number>();
  const contexts: BrowserContext[] = [];
  const pageErrors: string[] = [];

  async function liveWidget(
    owner: ApiSession,
    path: string,
    calculatorId: string,
    inputs: Record<string, { mode: 'editable' | 'locked' | 'hidden'; default?: string | number }>,
  ): Promise<void> {
    const created = await owner.json<{
      id: number;
      settings: Record<string, unknown>;
      embed: { snippet: string };
    }>(
      'POST',
      `/orgs/${org.id}/widgets`,
      { name: `${calculatorId} for visitors`, calculatorId, allowedOrigins: [origin] },
      201,
    );
    const settings = { ...created.settings, inputs, units: { system: 'us', visitorMaySwitch: true } };
    await owner.json('PATCH', `/orgs/${org.id}/widgets/${created.id}`, { status: 'live', settings }, 200);
    snippets.set(path, created.embed.snippet);
    widgetIds.set(path, created.id);
  }

  async function open(path: string, width = 1280): Promise<{ page: Page; widget: Locator }> {
    const context = await browser.newContext({ viewport: { width, height: 900 } });
    contexts.push(context);
    const page = await context.newPage();
    page.on('pageerror', (err) => pageErrors.push(err.message));
    await page.goto(`${origin}${path}`);
    const widget = page.locator('wickstone-widget[data-wickstone="host"]');
    await widget.locator('[data-wickstone="root"]').waitFor({ timeout: 20_000 });
    return { page, widget };
  }

  /** What a box shows, read back in metres from inches (the US unit of these inputs). */
  async function inches(widget: Locator, id: string): Promise<number> {
    const n = parseNumber(await widget.locator(`[data-input="${id}"]`).inputValue());
    expect(n, id).not.toBeNull();
    return (n as number) * IN;
  }

  beforeAll(async () => {
    app = await startApp({
      SMTP_HOST: process.env.SMTP_HOST ?? '127.0.0.1',
      SMTP_PORT: process.env.SMTP_PORT,
      FAKE_MAIL_API_URL: process.env.FAKE_MAIL_API_URL,
    });
    org = await seedOrgWithTeam(firm);
    server = createServer((req, res) => {
      const snippet = snippets.get(new URL(req.url ?? '/', 'http://host').pathname);
      if (snippet === undefined) return void res.writeHead(404).end();
      res
        .writeHead(200, { 'content-type': 'text/html; charset=utf-8' })
        .end(
          `<!doctype html><html lang="en"><head><meta charset="utf-8"><title>${firm}</title></head><body><h1>Ask the ground</h1>${snippet}</body></html>`,
        );
    });
    await new Promise<void>((resolve) => server.listen(0, '127.0.0.1', resolve));
    origin = `http://127.0.0.1:${(server.address() as AddressInfo).port}`;
    const owner = new ApiSession(app.url);
    await owner.json(
      'POST',
      '/auth/login',
      { email: org.users.owner.email, password: org.users.owner.password },
      200,
    );
    await liveWidget(owner, '/tube', 'tube-rise', { liquid: { mode: 'locked', default: 'water' } });
    await liveWidget(owner, '/soil', 'soil-capillary-rise', {
      breakLayer: { mode: 'editable', default: 'none' },
    });
    browser = await launchBrowser();
  });

  afterAll(async () => {
    for (const c of contexts) await c.close();
    await browser?.close();
    server?.closeAllConnections();
    await new Promise<void>((resolve) => (server ? server.close(() => resolve()) : resolve()));
    await app?.stop();
  });

  it('says the rise in a sentence in inches, and titles the bore warning in inches too', async () => {
    const { page, widget } = await open('/tube');
    expect(await widget.locator('[data-wickstone="root"]').getAttribute('data-system')).toBe('us');
    const bore = await inches(widget, 'diameter');
    await widget.locator('[data-wickstone="calculate"]').click();
    const headline = widget.locator('[data-wickstone="headline"]');
    await headline.waitFor();
    const expected = calculate('tube-rise', { diameter: bore });
    const rise = expected.outputs.rise as number;
    expect(await headline.textContent()).toBe(
      `Water can climb about ${formatResult(rise / IN)} in in a ${formatResult(bore / IN)} in bore.`,
    );
    await widget.locator('[data-wickstone="picture"]').waitFor();
    await screenshot(page, 'answer-tube-us-desktop');

    // Half of 0.47 in is about 2.2 times water's capillary length: no rise, and the warning says why.
    await widget.locator('[data-input="diameter"]').fill('0.47');
    await widget.locator('[data-wickstone="calculate"]').click();
    const title = widget.locator('[data-warning-title="BORE_TOO_WIDE"]');
    await title.waitFor();
    expect(await title.textContent()).toBe('Bore too wide for this formula');
    const wide = calculate('tube-rise', { diameter: 0.47 * IN });
    const lc = wide.outputs.capillaryLength as number;
    const sentence =
      (await widget.locator('[data-warning="BORE_TOO_WIDE"] .warning-text').textContent()) ?? '';
    expect(sentence).toContain(`the capillary length (${formatResult(lc / IN)} in)`);
    expect(sentence).not.toMatch(/\d m\b|×10/);
    expect(await headline.textContent()).toMatch(/^No rise is given for these inputs\./);
    expect(await widget.locator('[data-output="rise"]').getAttribute('data-withheld')).toBe('BORE_TOO_WIDE');
    // The code is data, not text the visitor reads.
    expect(await widget.locator('[data-wickstone="result"]').innerText()).not.toContain('BORE_TOO_WIDE');
    await screenshot(page, 'answer-tube-warning-us-desktop');
    expect(pageErrors).toEqual([]);
  });

  it('with the liquid locked to water, offers only water presets and shows no other liquid or its sources', async () => {
    for (const width of [1280, 390]) {
      const { page, widget } = await open('/tube', width);
      expect(await widget.locator('[data-field="liquid"]').getAttribute('data-mode')).toBe('locked');
      const presets = await widget
        .locator('[data-input="contactAnglePreset"] option')
        .evaluateAll((os) => os.map((o) => (o as HTMLOptionElement).value));
      expect(presets).toEqual(['water-clean-glass', 'custom']);
      await widget.locator('[data-wickstone="calculate"]').click();
      // The sources come with the working (the extras): wait for them before reading the whole widget.
      const working = widget.locator('[data-wickstone="working"]');
      await working.waitFor();
      await working.locator('summary').click();
      const refs = await widget
        .locator('[data-reference]')
        .evaluateAll((rs) => rs.map((r) => r.getAttribute('data-reference')));
      expect(refs).toEqual(expect.arrayContaining(['jurin-1718', 'iapws-r1-76']));
      expect(refs).not.toContain('adamson-gast-1997');
      expect(refs).not.toContain('crc-handbook');
      const text = await widget.locator('[data-wickstone="root"]').innerText();
      expect(text).toContain('Water can climb');
      expect(text).not.toMatch(FOREIGN);
      expect(text).not.toMatch(/to be checked/i);
      await screenshot(page, `answer-tube-locked-${width === 390 ? 'phone' : 'desktop'}`);
    }
    expect(pageErrors).toEqual([]);
  });

  it('lets an admin limit the presets offered and turn the supporting figures off in the editor', async () => {
    for (const width of [390, 1280]) {
      const context = await browser.newContext({ viewport: { width, height: 900 } });
      contexts.push(context);
      const page = await context.newPage();
      page.on('pageerror', (err) => pageErrors.push(err.message));
      await page.goto(`${app.url}/login`);
      await page.getByLabel('E-mail address').fill(org.users.admin.email);
      await page.getByLabel('Password', { exact: true }).fill(org.users.admin.password);
      await page.getByRole('button', { name: 'Sign in', exact: true }).click();
      await page.waitForURL(/\/orgs\/\d+$/);
      await page.goto(`${app.url}/orgs/${org.id}/widgets/${widgetIds.get('/tube')}?section=inputs`);
      const offered = page.locator('[data-offered-options="contactAnglePreset"]');
      await offered.waitFor();
      await screenshot(page, `answer-editor-${width === 390 ? 'phone' : 'desktop'}`);
      const dir = `${import.meta.dirname}/../../var/screenshots`;
      if (process.env.E2E_SCREENSHOTS) {
        // The two new controls up close, to look at.
        await page
          .locator('[data-input-row="contactAnglePreset"]')
          .screenshot({ path: `${dir}/answer-editor-options-${width}.png` });
      }
      if (width !== 390) await offered.locator('[data-option="mercury-glass"]').uncheck();
      // The next section, Units, keeps the draft: both changes go in one save.
      await page.getByRole('link', { name: /Next →/ }).click();
      const figures = page.getByLabel('Show supporting figures');
      await figures.waitFor();
      if (process.env.E2E_SCREENSHOTS) {
        await figures.locator('xpath=ancestor::section[1]').screenshot({
          path: `${dir}/answer-editor-units-${width}.png`,
        });
      }
      if (width === 390) {
        await context.close();
        continue;
      }
      await figures.uncheck();
      await page.getByRole('button', { name: 'Save changes' }).click();
      await expect
        .poll(async () => {
          const [row] = await app.db.sequelize.query<{ settings: unknown }>(
            'SELECT settings FROM widgets WHERE id = ?',
            { replacements: [widgetIds.get('/tube')], type: QueryTypes.SELECT },
          );
          const settings = (typeof row?.settings === 'string' ? JSON.parse(row.settings) : row?.settings) as {
            inputs: Record<string, { options?: string[] }>;
            result?: { secondary: string };
          };
          return [settings.inputs.contactAnglePreset?.options, settings.result?.secondary];
        })
        .toEqual([['water-clean-glass', 'custom'], 'hidden']);
    }
    // On the firm's page the supporting figures are gone.
    const { widget } = await open('/tube');
    await widget.locator('[data-wickstone="calculate"]').click();
    await widget.locator('[data-wickstone="working"]').waitFor();
    expect(await widget.locator('[data-wickstone="secondary"]').count()).toBe(0);
    expect(pageErrors).toEqual([]);
  });

  it('says whether capillary water stays below the slab, in feet, with help that fits the sign', async () => {
    const { page, widget } = await open('/soil', 390);
    const d10 = await inches(widget, 'd10');
    const depthFt = parseNumber(
      await widget.locator('[data-input="waterTableDepth"]').inputValue(),
    ) as number;
    // A round metric default reads round in US units.
    expect(await widget.locator('[data-input="waterTableDepth"]').inputValue()).toBe('3.3');
    await widget.locator('[data-wickstone="calculate"]').click();
    const headline = widget.locator('[data-wickstone="headline"]');
    await headline.waitFor();
    const expected = calculate('soil-capillary-rise', {
      d10,
      waterTableDepth: depthFt * FT,
      breakLayer: 'none',
    });
    const clearance = expected.outputs.slabClearance as number;
    expect(clearance).toBeGreaterThan(0);
    expect(await headline.textContent()).toBe(
      `Capillary water stays about ${formatResult(clearance / FT)} ft below the slab.`,
    );
    const help = await widget.locator('[data-output="slabClearance"] .help').textContent();
    expect(help).not.toMatch(/reaches/);

    // A water table just under the slab: the fringe reaches it, and the sentence says so.
    await widget.locator('[data-input="waterTableDepth"]').fill('0.5');
    await widget.locator('[data-wickstone="calculate"]').click();
    await expect.poll(() => headline.textContent()).toBe('Capillary water reaches the slab.');
    expect(await widget.locator('[data-output="slabClearance"] .help').textContent()).toMatch(/reaches/);
    await screenshot(page, 'answer-soil-us-phone');
    expect(pageErrors).toEqual([]);
  });
});
