import { randomBytes } from 'node:crypto';
import { readFileSync } from 'node:fs';
import { createRequire } from 'node:module';
import { createServer, type Server } from 'node:http';
import type { AddressInfo } from 'node:net';
import path from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { QueryTypes } from 'sequelize';
import type { Browser, BrowserContext, Page } from 'playwright-core';
import type { Role } from '@wickstone/contracts';
import { seedOrgWithTeam, type FixtureOrg } from '@wickstone/server/testing';
import { launchBrowser, screenshot } from '../support/browser.js';
import { mailEnv, startApp, type RunningApp } from '../support/server.js';
import { ApiSession } from '../support/api-session.js';
import { demoPage } from '../../scripts/lib/demo-page.mjs';

/*
 * Every screen as each person sees it, checked by axe-core inside Chromium: the public pages, the
 * demo consultancy's site after a visitor's run, and each signed-in screen for each role, at desktop
 * and phone widths. Serious and critical findings fail the test, listed by screen and rule. The same
 * data also shows the run page in the visitor's units, an erasure leaving the usage counts alone,
 * and the audit naming a widget change and an enquiry change.
 */

const run = `${Date.now().toString(36)}${randomBytes(2).toString('hex')}`;
const firm = 'Brackenridge Ground & Damp';
const axeSource = readFileSync(createRequire(import.meta.url).resolve('axe-core/axe.min.js'), 'utf8');
const demoTemplate = readFileSync(
  path.resolve(import.meta.dirname, '..', '..', 'scripts', 'demo-site', 'index.html'),
  'utf8',
);
const visitor = {
  name: 'Ottoline Brisk',
  email: `ottoline.brisk.${run}@hollow-lane-farm.example`,
  siteAddress: 'Hollow Lane Farm, Brackenridge',
};

interface Finding {
  screen: string;
  rule: string;
  impact: string;
  nodes: string[];
}

/** axe-core's serious and critical violations on the page as it stands (open shadow roots included). */
async function axeFindings(page: Page, screen: string): Promise<Finding[]> {
  if (!(await page.evaluate(() => 'axe' in window))) await page.addScriptTag({ content: axeSource });
  const violations = await page.evaluate(async () => {
    const axe = (
      window as unknown as {
        axe: {
          run: (
            ctx: Document,
            opts: object,
          ) => Promise<{
            violations: { id: string; impact: string | null; nodes: { target: unknown[] }[] }[];
          }>;
        };
      }
    ).axe;
    const result = await axe.run(document, { resultTypes: ['violations'] });
    return result.violations.map((v) => ({
      id: v.id,
      impact: v.impact ?? '',
      nodes: v.nodes.slice(0, 3).map((n) => JSON.stringify(n.target)),
    }));
  });
  return violations
    .filter((v) => v.impact === 'serious' || v.impact === 'critical')
    .map((v) => ({ screen, rule: v.id, impact: v.impact, nodes: v.nodes }));
}

describe('every screen, each role, desktop and phone: axe-core finds nothing serious', () => {
  let app: RunningApp;
  let browser: Browser;
  let org: FixtureOrg;
  let site: { origin: string; server: Server };
  let owner: ApiSession;
  const contexts: BrowserContext[] = [];
  const findings: Finding[] = [];
  const pageErrors: string[] = [];
  let tubeId = 0;
  let runId = '';
  let leadId = 0;
  let invitationPath = '';

  const q = <T extends object>(sql: string, replacements: unknown[] = []) =>
    app.db.sequelize.query<T>(sql, { replacements, type: QueryTypes.SELECT });

  async function freshPage(width: number): Promise<Page> {
    const context = await browser.newContext({ viewport: { width, height: width < 600 ? 844 : 900 } });
    contexts.push(context);
    const page = await context.newPage();
    page.on('pageerror', (err) => pageErrors.push(`${page.url()}: ${err.message}`));
    return page;
  }

  async function signIn(page: Page, role: Role): Promise<string> {
    await page.goto(`${app.url}/login`);
    await page.getByLabel('E-mail address').fill(org.users[role].email);
    await page.getByLabel('Password', { exact: true }).fill(org.users[role].password);
    await page.getByRole('button', { name: 'Sign in', exact: true }).click();
    await page.waitForURL(/\/orgs\/\d+$/);
    return new URL(page.url()).pathname;
  }

  /** Opens a screen, waits for its heading and for loading to finish, then asks axe. */
  async function check(page: Page, url: string, screen: string): Promise<void> {
    await page.goto(url);
    await page.locator('h1').first().waitFor({ timeout: 15_000 });
    await expect
      .poll(() => page.locator('[role="status"]:has(.animate-spin)').count(), { timeout: 15_000 })
      .toBe(0);
    findings.push(...(await axeFindings(page, screen)));
  }

  beforeAll(async () => {
    app = await startApp(mailEnv());
    org = await seedOrgWithTeam(firm);
    owner = new ApiSession(app.url);
    await owner.json(
      'POST',
      '/auth/login',
      { email: org.users.owner.email, password: org.users.owner.password },
      200,
    );

    // The demo consultancy's own page, on its own origin, with two widgets pasted in by their snippets.
    const snippets: string[] = [];
    const server = createServer((req, res) => {
      if (new URL(req.url ?? '/', 'http://site').pathname !== '/') {
        res.writeHead(404).end();
        return;
      }
      res
        .writeHead(200, { 'content-type': 'text/html; charset=utf-8' })
        // The demo's own composition: every slot filled or left empty, none printed as a placeholder.
        .end(
          demoPage(
            demoTemplate,
            snippets.map((snippet) => ({ snippet })),
          ),
        );
    });
    await new Promise<void>((resolve) => server.listen(0, '127.0.0.1', resolve));
    site = { origin: `http://127.0.0.1:${(server.address() as AddressInfo).port}`, server };

    for (const [name, calculatorId, system] of [
      ['Rising damp in a pore', 'tube-rise', 'us'],
      ['Slab moisture check', 'soil-capillary-rise', 'si'],
    ] as const) {
      const created = await owner.json<{
        id: number;
        settings: { units: { system: string; visitorMaySwitch: boolean } };
      }>('POST', `/orgs/${org.id}/widgets`, { name, calculatorId, allowedOrigins: [site.origin] }, 201);
      const live = await owner.json<{ embed: { snippet: string } }>(
        'PATCH',
        `/orgs/${org.id}/widgets/${created.id}`,
        {
          status: 'live',
          settings: { ...created.settings, units: { system, visitorMaySwitch: true } },
        },
        200,
      );
      snippets.push(live.embed.snippet);
      if (calculatorId === 'tube-rise') tubeId = created.id;
    }

    await owner.json(
      'POST',
      `/orgs/${org.id}/invitations`,
      { email: `pell.quarrier.${run}@brackenridge-ground.example`, role: 'analyst' },
      201,
    );
    browser = await launchBrowser();
  });

  afterAll(async () => {
    for (const c of contexts) await c.close();
    await browser?.close();
    if (site) {
      site.server.closeAllConnections();
      await new Promise<void>((resolve) => site.server.close(() => resolve()));
    }
    await app?.stop();
  });

  it("runs the US widget on the firm's page in metric, asks for an assessment, and the page passes axe", async () => {
    const page = await freshPage(1280);
    await page.goto(`${site.origin}/`);
    const widget = page.locator('wickstone-widget').first();
    const root = widget.locator('[data-wickstone="root"]');
    await root.waitFor({ timeout: 20_000 });
    // The firm's page shows no unfilled slot of its template.
    expect(await page.locator('body').innerText()).not.toContain('{{');
    expect(await root.getAttribute('data-system')).toBe('us');
    // The visitor switches to metric and tries a 3 mm bore: wide enough to raise the bore warning.
    await widget.locator('[data-unit="si"]').check();
    await expect.poll(() => root.getAttribute('data-system')).toBe('si');
    await widget.locator('[data-input="diameter"]').fill('3');
    await widget.locator('[data-wickstone="calculate"]').click();
    const result = widget.locator('[data-result][data-report="stored"]');
    await result.waitFor({ timeout: 20_000 });
    runId = (await result.getAttribute('data-run-id')) ?? '';
    expect(runId).toMatch(/^[0-9a-f-]{36}$/);
    await widget.locator('[data-lead-field="name"]').fill(visitor.name);
    await widget.locator('[data-lead-field="email"]').fill(visitor.email);
    await widget.locator('[data-lead-field="consent"]').check();
    await widget.locator('[data-wickstone="lead-submit"]').click();
    await widget.locator('[data-wickstone="lead-confirmation"]').waitFor({ timeout: 20_000 });
    const [lead] = await q<{ id: number }>('SELECT id FROM leads WHERE run_id = ?', [runId]);
    leadId = Number(lead!.id);
    findings.push(...(await axeFindings(page, 'demo site after a run (1280)')));
    await screenshot(page, 'screens-demo-site-1280');

    const phone = await freshPage(390);
    await phone.goto(`${site.origin}/`);
    const phoneWidget = phone.locator('wickstone-widget').first();
    await phoneWidget.locator('[data-wickstone="root"]').waitFor({ timeout: 20_000 });
    await phoneWidget.locator('[data-wickstone="calculate"]').click();
    await phoneWidget.locator('[data-result][data-report="stored"]').waitFor({ timeout: 20_000 });
    findings.push(...(await axeFindings(phone, 'demo site after a run (390)')));
    await screenshot(phone, 'screens-demo-site-390');
  });

  it('reports a serious finding when there is one (the check itself can fail)', async () => {
    const page = await freshPage(1280);
    await page.setContent(
      '<!doctype html><html lang="en"><head><title>t</title></head><body><main><img src="data:,"><button></button></main></body></html>',
    );
    const rules = (await axeFindings(page, 'planted')).map((f) => f.rule).sort();
    expect(rules).toEqual(['button-name', 'image-alt']);
  });

  it('finds nothing serious on the public pages', async () => {
    const mail = await fetch(
      `${process.env.FAKE_MAIL_API_URL}/messages?to=${encodeURIComponent(`pell.quarrier.${run}@brackenridge-ground.example`)}`,
    );
    const items = ((await mail.json()) as { items: { text: string }[] }).items;
    invitationPath = /\/invitations\/[^\s/]+/.exec(items[0]?.text ?? '')?.[0] ?? '';
    expect(invitationPath).not.toBe('');
    for (const width of [1280, 390]) {
      const page = await freshPage(width);
      for (const [screen, url] of [
        ['sign-in', '/login'],
        ['sign-up', '/signup'],
        ['forgotten password', '/forgot-password'],
        ['new password', '/reset-password?token=not-a-real-token'],
        ['invitation', invitationPath],
        ['verification', `/verify/${runId}`],
        ['no such page', '/no-such-page'],
      ] as const) {
        await check(page, `${app.url}${url}`, `${screen} (${width})`);
      }
    }
  });

  it('shows the run as the visitor saw it: metric units, the warning in words', async () => {
    const page = await freshPage(1280);
    const home = await signIn(page, 'analyst');
    await page.goto(`${app.url}${home}/usage/runs/${runId}`);
    await page.locator('[data-visitor-units="si"]').waitFor();
    expect(await page.locator('[data-visitor-units]').textContent()).toContain('metric (SI)');
    const results = page.getByRole('heading', { name: 'Results the visitor saw' }).locator('..');
    // The widget opens in US units, but this visitor saw millimetres.
    expect(await results.textContent()).toMatch(/\d mm/);
    expect(await results.textContent()).not.toMatch(/\b(ft|in)\b/);
    const inputs = page.getByRole('heading', { name: 'Inputs the visitor set' }).locator('..');
    expect(await inputs.textContent()).toContain('3 mm');
    const warning = page.locator('[data-run-warning="BORE_NOT_SMALL"]');
    await warning.waitFor();
    // A sentence, not just the code.
    expect(((await warning.textContent()) ?? '').replace('BORE_NOT_SMALL', '').trim().length).toBeGreaterThan(
      20,
    );
    await screenshot(page, 'screens-run-1280');
  });

  it('erases the enquirer’s personal data and the usage figures on screen stay the same', async () => {
    const page = await freshPage(1280);
    const home = await signIn(page, 'analyst');
    await page.goto(`${app.url}${home}/usage`);
    const led = page.locator('[data-total="withLead"]');
    const runs = page.locator('[data-total="runs"]');
    await expect.poll(() => led.textContent()).toBe('1');
    const runsBefore = await runs.textContent();
    await page.goto(`${app.url}${home}/leads/${leadId}`);
    await page.getByRole('button', { name: 'Erase personal data' }).click();
    await page.getByRole('button', { name: 'Erase', exact: true }).click();
    await page.getByText('The personal data of this enquiry was erased').waitFor();
    await page.goto(`${app.url}${home}/usage`);
    await expect.poll(() => runs.textContent()).toBe(runsBefore);
    expect(await led.textContent()).toBe('1');
  });

  it('lists a widget change and an enquiry change in the audit log', async () => {
    // An enquiry change through the API, as the analyst's screen sends it.
    const analyst = new ApiSession(app.url);
    await analyst.json(
      'POST',
      '/auth/login',
      { email: org.users.analyst.email, password: org.users.analyst.password },
      200,
    );
    await analyst.json('PATCH', `/orgs/${org.id}/leads/${leadId}`, { status: 'contacted' }, 200);
    await owner.json(
      'PATCH',
      `/orgs/${org.id}/widgets/${tubeId}`,
      { name: 'Rising damp in a fine pore' },
      200,
    );
    const page = await freshPage(1280);
    const home = await signIn(page, 'owner');
    await page.goto(`${app.url}${home}/audit`);
    const rows = page.getByRole('row');
    await rows.filter({ hasText: 'Widget changed' }).first().waitFor();
    expect(await rows.filter({ hasText: 'Widget changed' }).first().textContent()).toContain(
      'Rising damp in a fine pore',
    );
    const enquiry = rows.filter({ hasText: 'Enquiry updated' }).first();
    await enquiry.waitFor();
    // The stored code reads as the word the screens use.
    expect(await enquiry.textContent()).toContain('Awaiting reply → Replied');
  });

  it('puts back an earlier revision from the editor, as a new revision the audit names', async () => {
    const page = await freshPage(1280);
    const home = await signIn(page, 'admin');
    await page.goto(`${app.url}${home}/widgets/${tubeId}?section=revisions`);
    const first = page.locator('[data-revision]').last();
    await first.getByRole('button', { name: 'Restore revision 1' }).click();
    await first.getByRole('button', { name: 'Restore', exact: true }).click();
    await page.getByText(/^Revision 1 restored at /).waitFor();
    const [row] = await q<{ name: string; status: string; settings: unknown }>(
      'SELECT name, status, settings FROM widgets WHERE id = ?',
      [tubeId],
    );
    const settings = (typeof row!.settings === 'string' ? JSON.parse(row!.settings) : row!.settings) as {
      units: { system: string };
    };
    // The name and unit system it was created with; still in service.
    expect(row).toMatchObject({ name: 'Rising damp in a pore', status: 'live' });
    expect(settings.units.system).toBe('si');
    await expect
      .poll(() => page.locator('[data-revision]').first().locator('[data-revision-words]').textContent())
      .toMatch(/^Renamed it “Rising damp in a pore” and changed the unit system/);
    const [entry] = await q<{ details: unknown }>(
      "SELECT details FROM audit_events WHERE organization_id = ? AND type = 'widget.updated' ORDER BY id DESC LIMIT 1",
      [org.id],
    );
    const details = (typeof entry!.details === 'string' ? JSON.parse(entry!.details) : entry!.details) as {
      restoredRevision?: number;
    };
    expect(details.restoredRevision).toEqual(expect.any(Number));
    await screenshot(page, 'screens-revisions-1280');
  });

  for (const role of ['owner', 'admin', 'analyst', 'developer'] as const) {
    it(`finds nothing serious on any screen the ${role} can open`, { timeout: 300_000 }, async () => {
      for (const width of [1280, 390]) {
        const page = await freshPage(width);
        const home = await signIn(page, role);
        // Every entry of the contents, folded away or not, once the account has loaded.
        await expect.poll(() => page.locator('nav[aria-label="Main"] a').count()).toBeGreaterThan(3);
        const navLinks = await page
          .locator('nav[aria-label="Main"] a')
          .evaluateAll((links) => links.map((a) => (a as HTMLAnchorElement).pathname));
        expect(navLinks.length).toBeGreaterThan(3);
        // The widget editor, one section at a time: what this role works through or reads.
        const sections =
          role === 'owner' || role === 'admin'
            ? [
                'name',
                'inputs',
                'units',
                'look',
                'cautions',
                'requests',
                'sheet',
                'sites',
                'embed',
                'release',
                'revisions',
              ]
            : ['settings', 'embed', 'release', 'revisions'];
        const editor = sections.map((s) => `${home}/widgets/${tubeId}?section=${s}`);
        const extra = [
          `${home}/widgets/${tubeId}`,
          ...editor,
          `${home}/usage/runs/${runId}`,
          ...(role === 'developer' ? [] : [`${home}/leads/${leadId}`]),
          ...(role === 'owner' || role === 'admin' ? [`${home}/widgets/new`] : []),
        ];
        for (const p of [...navLinks, ...extra]) {
          await check(page, `${app.url}${p}`, `${role} ${p} (${width})`);
          const section = /[?&]section=([a-z]+)/.exec(p)?.[1];
          // The editor's sections as admin (every one) and analyst (the summary), to look at.
          if (section && (role === 'admin' || role === 'analyst')) {
            await page.locator(`[data-editor-section="${section}"]`).waitFor();
            await screenshot(page, `screens-editor-${role}-${section}-${width}`);
          }
          if (p.includes('/usage/runs/') && role === 'owner') await screenshot(page, `screens-run-${width}`);
        }
        if (width === 390) {
          // The folded contents on a phone: one button names where you are, and opens every page.
          await page.goto(`${app.url}${home}`);
          const toggle = page.getByRole('button', { name: /Contents/ });
          await toggle.click();
          expect(await toggle.getAttribute('aria-expanded')).toBe('true');
          for (const p of navLinks) {
            expect(
              await page.locator(`nav[aria-label="Main"] a[href="${p}"]`).isVisible(),
              `${p} visible on a phone`,
            ).toBe(true);
          }
          findings.push(...(await axeFindings(page, `${role} contents opened (390)`)));
          await screenshot(page, `screens-${role}-contents-390`);

          // The editor's sections fold the same way on a phone; the preview is one link away.
          await page.goto(`${app.url}${home}/widgets/${tubeId}?section=${sections[1]}`);
          const fold = page.locator('button[aria-controls="editor-contents"]');
          // The button names the section shown and how many there are.
          expect(await fold.textContent()).toMatch(/^Sections · 02 of \d+/);
          await fold.click();
          expect(await fold.getAttribute('aria-expanded')).toBe('true');
          for (const s of sections) {
            expect(
              await page.locator(`[data-section-link="${s}"]`).isVisible(),
              `${s} visible on a phone`,
            ).toBe(true);
          }
          findings.push(...(await axeFindings(page, `${role} editor sections opened (390)`)));
          await screenshot(page, `screens-editor-${role}-contents-390`);
          await page.locator(`[data-section-link="${sections[0]}"]`).click();
          await page.locator(`[data-editor-section="${sections[0]}"]`).waitFor();
          expect(await fold.getAttribute('aria-expanded')).toBe('false');
          await page.getByRole('link', { name: 'Preview ↓' }).click();
          await expect
            .poll(() =>
              page.locator('#widget-preview').evaluate((el) => {
                const top = el.getBoundingClientRect().top;
                return top >= -1 && top < window.innerHeight / 2;
              }),
            )
            .toBe(true);
        }
      }
    });
  }

  it('adds up to no serious or critical finding, and no page error', () => {
    expect(findings.map((f) => `${f.screen}: ${f.rule} (${f.impact}) ${f.nodes.join(' ')}`)).toEqual([]);
    expect(pageErrors).toEqual([]);
  });
});
