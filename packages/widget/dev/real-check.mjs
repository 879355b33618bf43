// Dev-only smoke check against the real server (from its source) over a fresh test database:
// a widget made through the API, its real embed snippet on a page of another origin in Debian's
// Chromium, a run and a lead, then the rows in MariaDB. The product's end-to-end test lives in
// tests/; this is for checking the bundle against the server while both are being built.
// Usage: npm run test:env, then set -a; . ../../var/test-env.env; set +a; npx tsx dev/real-check.mjs
// (after building the widget; tsx, because the server's test helpers are TypeScript in no build)
import assert from 'node:assert/strict';
import { createServer } from 'node:http';
import { fileURLToPath } from 'node:url';
import { QueryTypes } from 'sequelize';
import { chromium } from 'playwright-core';

// The server's test helpers (apps/server/testing/), which ship in no build: SERVER_TESTING may point
// at another copy of them.
const { createTestApp, seedOrgWithTeam, TestClient } = await import(
  process.env.SERVER_TESTING ?? new URL('../../../apps/server/testing/index.ts', import.meta.url).href
);

// The host pages come from real loopback servers too (in this process): Chromium will not let a
// page it takes for a public site load scripts from a loopback address.
let pageHtml = '';
const sites = [
  createServer((_req, res) => res.writeHead(200, { 'content-type': 'text/html' }).end(pageHtml)),
  createServer((_req, res) => res.writeHead(200, { 'content-type': 'text/html' }).end(pageHtml)),
];
for (const s of sites) await new Promise((resolve) => s.listen(0, '127.0.0.1', resolve));
const SITE = `http://127.0.0.1:${sites[0].address().port}`;
const ELSEWHERE = `http://127.0.0.1:${sites[1].address().port}`;

const server = createServer();
await new Promise((resolve) => server.listen(0, '127.0.0.1', resolve));
const port = server.address().port;
const url = `http://127.0.0.1:${port}`;
const releases = fileURLToPath(new URL('../dist/releases', import.meta.url));
const t = await createTestApp({
  HOST: '127.0.0.1',
  PORT: String(port),
  PUBLIC_URL: url,
  RELEASES_DIR: releases,
});
server.on('request', t.app);
let browser;
try {
  const org = await seedOrgWithTeam('Brackenridge Ground & Damp');
  const owner = new TestClient(t.app);
  await owner.login(org.users.owner.email, org.users.owner.password);
  const created = (
    await owner
      .post(`/orgs/${org.id}/widgets`, {
        name: 'Damp check',
        calculatorId: 'tube-rise',
        allowedOrigins: [SITE],
      })
      .expect(201)
  ).body;
  const settings = {
    ...created.settings,
    units: { system: 'us', visitorMaySwitch: true },
    cautions: 'Our surveyors measure on site before any quote.',
    inputs: { gravity: { mode: 'hidden' } },
  };
  const widget = (
    await owner.patch(`/orgs/${org.id}/widgets/${created.id}`, { status: 'live', settings }).expect(200)
  ).body;
  assert.ok(
    widget.embed.snippet.includes('integrity="sha384-'),
    `no snippet: ${JSON.stringify(widget.embed)}`,
  );
  pageHtml = `<!doctype html><html lang="en"><head><meta charset="utf-8"><title>Site</title></head><body><h1>Damp advice</h1>${widget.embed.snippet}<p>After.</p></body></html>`;

  browser = await chromium.launch({
    executablePath: '/usr/bin/chromium',
    headless: true,
    args: [
      '--no-sandbox',
      '--disable-gpu',
      '--disable-background-networking',
      '--disable-component-update',
      '--no-first-run',
    ],
  });
  const context = await browser.newContext();
  const tab = await context.newPage();
  const errors = [];
  tab.on('pageerror', (e) => errors.push(e.message));
  tab.on('console', (m) => console.log(`[page ${m.type()}] ${m.text()}`));
  tab.on('requestfailed', (r) => console.log(`[request failed] ${r.url()} ${r.failure()?.errorText}`));
  await tab.goto(`${SITE}/`);
  const host = tab.locator('wickstone-widget');
  await host.locator('[data-wickstone="root"]').waitFor({ timeout: 15000 });
  assert.equal(await host.locator('[data-wickstone="root"]').getAttribute('data-system'), 'us');
  await host.locator('[data-input="diameter"]').fill('0.02');
  await host.locator('[data-wickstone="calculate"]').click();
  await host.locator('[data-result][data-report="stored"]').waitFor({ timeout: 15000 });
  const runId = await host.locator('[data-result]').getAttribute('data-run-id');
  await host.locator('[data-lead-field="name"]').fill('Imogen Tarrant');
  await host.locator('[data-lead-field="email"]').fill('imogen.tarrant@visitor.example');
  await host.locator('[data-lead-field="consent"]').check();
  await host.locator('[data-lead-field="sendCopy"]').check();
  await host.locator('[data-wickstone="lead-submit"]').click();
  await host.locator('[data-wickstone="lead-confirmation"]').waitFor({ timeout: 15000 });

  const q = (sql, replacements) => t.db.sequelize.query(sql, { replacements, type: QueryTypes.SELECT });
  const runs = await q('SELECT id, agreed, unit_system AS unitSystem FROM runs WHERE widget_id = ?', [
    widget.id,
  ]);
  assert.deepEqual(
    runs.map((r) => [r.id, Boolean(r.agreed), r.unitSystem]),
    [[runId, true, 'us']],
  );
  const leads = await q('SELECT run_id AS runId, email FROM leads WHERE widget_id = ?', [widget.id]);
  assert.deepEqual(leads, [{ runId, email: 'imogen.tarrant@visitor.example' }]);

  // The same snippet on a site the widget does not allow: nothing shown, nothing reported.
  const other = await context.newPage();
  await other.goto(`${ELSEWHERE}/`);
  await other
    .locator('wickstone-widget[data-state="unavailable"]')
    .waitFor({ state: 'attached', timeout: 15000 });
  assert.equal((await other.locator('wickstone-widget').boundingBox())?.height ?? 0, 0);
  assert.equal((await q('SELECT COUNT(*) AS n FROM runs', []))[0].n, 1);
  assert.deepEqual(errors, []);
  console.log(
    'real server check passed: run',
    runId,
    'stored and agreed, lead stored, unknown origin shown nothing',
  );
} finally {
  await browser?.close();
  for (const s of [server, ...sites]) {
    s.closeAllConnections();
    await new Promise((resolve) => s.close(resolve));
  }
  await t.close();
}
