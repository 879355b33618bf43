import { QueryTypes } from 'sequelize';
import { randomUUID } from 'node:crypto';
import { createServer, type Server } from 'node:http';
import type { AddressInfo } from 'node:net';
import { createRequire } from 'node:module';
import path from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Browser, Locator } from 'playwright-core';
import type { calculate as calculateFn } from '@wickstone/calc-core';
import type { Widget } from '@wickstone/contracts';
import {
  publishTestReleases,
  seedOrgWithTeam,
  type FixtureOrg,
  type TestReleases,
} from '@wickstone/server/testing';
import { ApiSession } from '../support/api-session.js';
import { launchBrowser, screenshot } from '../support/browser.js';
import { startApp, type RunningApp } from '../support/server.js';

/*
 * The developer's release story in Chromium: a widget pinned to the older of two published
 * releases, with logged runs; the developer previews the newer release, moves the pin, and the
 * firm's page with the new snippet loads the newer release's script.
 */
const nodeRequire = createRequire(import.meta.url);

/** The release section alone, beside the full-page screenshot, when screenshots are asked for. */
async function sectionShot(section: Locator, name: string): Promise<void> {
  const asked = process.env.E2E_SCREENSHOTS;
  if (!asked || asked === '0') return;
  const dir =
    asked === '1' ? path.resolve(import.meta.dirname, '..', '..', 'var', 'screenshots') : path.resolve(asked);
  await section.screenshot({ path: path.join(dir, `${name}-section.png`) });
}

describe('releases, as the developer', () => {
  let rel: TestReleases;
  let app: RunningApp;
  let org: FixtureOrg;
  let browser: Browser;
  let site: { origin: string; server: Server };
  let widget: Widget;
  let snippet = '';

  beforeAll(async () => {
    rel = await publishTestReleases();
    app = await startApp({ PUBLISHED_RELEASES_DIR: rel.dir });
    org = await seedOrgWithTeam('Ferrowick Survey & Damp');
    const server = createServer((_req, res) => {
      res.writeHead(200, { 'content-type': 'text/html; charset=utf-8' })
        .end(`<!doctype html><html lang="en"><head><meta charset="utf-8"><title>Cellar damp</title></head>
<body><h1>How high can water climb?</h1>${snippet}</body></html>`);
    });
    await new Promise<void>((resolve) => server.listen(0, '127.0.0.1', resolve));
    site = { origin: `http://127.0.0.1:${(server.address() as AddressInfo).port}`, server };

    const owner = await ApiSession.signedIn(app.url, org.users.owner);
    const created = await owner.json<Widget>(
      'POST',
      `/orgs/${org.id}/widgets`,
      { name: 'Cellar wall check', calculatorId: 'tube-rise', allowedOrigins: [site.origin] },
      201,
    );
    await owner.json('PATCH', `/orgs/${org.id}/widgets/${created.id}`, { status: 'live' }, 200);
    // A widget made before reference keys: 0.1.0's loader reads only its older kind of key.
    await app.db.sequelize.query('UPDATE widgets SET public_key = ? WHERE id = ?', {
      replacements: ['wk_cellarwallcheck00001', created.id],
      type: QueryTypes.UPDATE,
    });
    widget = await owner.json<Widget>(
      'PUT',
      `/orgs/${org.id}/widgets/${created.id}/release`,
      { pin: rel.older },
      200,
    );
    // Logged runs made by the older release's engine: some the newer engine changes, some it cannot.
    const engine = nodeRequire(path.join(rel.dir, rel.older, 'engine.mjs')) as {
      calculate: typeof calculateFn;
    };
    for (const [diameter, contactAngleDeg] of [
      [0.0005, 10],
      [0.0008, 20],
      [0.001, 90],
    ] as const) {
      const r = engine.calculate('tube-rise', { diameter, contactAnglePreset: 'custom', contactAngleDeg });
      const res = await fetch(`${app.url}/api/v1/embed/runs`, {
        method: 'POST',
        headers: { Origin: site.origin, 'Content-Type': 'text/plain' },
        body: JSON.stringify({
          id: randomUUID(),
          publicKey: widget.publicKey,
          inputs: r.inputs,
          unitSystem: 'si',
          result: {
            outputs: r.outputs,
            warnings: r.warnings.map((w) => w.code),
            inputHash: r.inputHash,
            version: r.version,
          },
          release: rel.older,
        }),
      });
      expect(res.status).toBe(201);
    }
    browser = await launchBrowser();
  }, 300_000);

  afterAll(async () => {
    await browser?.close();
    site?.server.close();
    await app?.stop();
    rel?.cleanup();
  });

  it('previews the upgrade, moves the pin, and the firm’s page loads the new release', async () => {
    for (const [width, name] of [
      [1280, 'desktop'],
      [390, 'phone'],
    ] as const) {
      const context = await browser.newContext({ viewport: { width, height: 900 } });
      const page = await context.newPage();
      await page.goto(`${app.url}/login`);
      await page.getByLabel('E-mail address').fill(org.users.developer.email);
      await page.getByLabel('Password', { exact: true }).fill(org.users.developer.password);
      await page.getByRole('button', { name: 'Sign in', exact: true }).click();
      await page.waitForURL(/\/orgs\/\d+$/);
      await page.goto(`${app.url}/orgs/${org.id}/widgets/${widget.id}?section=release`);
      const section = page.locator('#widget-release');
      await section.waitFor();
      await section.scrollIntoViewIfNeeded();
      await screenshot(page, `releases-${name}-before`);
      await sectionShot(section, `releases-${name}-before`);
      if (name === 'phone') {
        await context.close();
        continue;
      }
      expect(await section.locator('[data-widget-release]').textContent()).toBe(rel.older);
      await section.getByRole('button', { name: 'Preview the change' }).click();
      const preview = section.locator('[data-upgrade-preview]');
      await preview.waitFor({ timeout: 30_000 });
      // Two of the three runs have a meniscus the newer engine counts differently.
      expect(await preview.textContent()).toContain('2 of 3 logged runs');
      await screenshot(page, `releases-${name}-preview`);
      await sectionShot(section, `releases-${name}-preview`);
      await section.getByRole('button', { name: `Pin to ${rel.newer}` }).click();
      await expect.poll(() => section.locator('[data-widget-release]').textContent()).toBe(rel.newer);
      await screenshot(page, `releases-${name}-pinned`);
      await sectionShot(section, `releases-${name}-pinned`);
      await context.close();
    }

    // The firm's page with the snippet as it is now: the newer release's loader, by its SRI hash.
    const developer = await ApiSession.signedIn(app.url, org.users.developer);
    const now = await developer.json<Widget>('GET', `/orgs/${org.id}/widgets/${widget.id}`, undefined, 200);
    expect(now.embed.snippet).not.toBe(widget.embed.snippet);
    snippet = now.embed.snippet;
    const context = await browser.newContext();
    const page = await context.newPage();
    const scripts: string[] = [];
    page.on('response', (r) => {
      if (r.url().includes('/releases/')) scripts.push(`${r.status()} ${new URL(r.url()).pathname}`);
    });
    await page.goto(`${site.origin}/`);
    await page
      .locator('wickstone-widget[data-wickstone="host"] [data-wickstone="root"]')
      .waitFor({ timeout: 30_000 });
    expect(scripts).toContain(`200 /releases/${rel.newer}/wickstone-tube-rise.js`);
    expect(scripts.filter((s) => s.includes(`/releases/${rel.older}/`))).toEqual([]);
    await context.close();
  });
});
