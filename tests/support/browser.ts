import { mkdirSync } from 'node:fs';
import path from 'node:path';
import { chromium, type Browser, type Page } from 'playwright-core';

/** Debian's Chromium, headless, never a downloaded browser. */
export function launchBrowser(): Promise<Browser> {
  return chromium.launch({
    executablePath: process.env.CHROMIUM_PATH ?? '/usr/bin/chromium',
    headless: true,
    args: [
      '--no-sandbox',
      '--disable-gpu',
      '--disable-quic',
      '--no-first-run',
      '--disable-background-networking',
      '--disable-component-update',
      '--disable-sync',
    ],
  });
}

/**
 * Screenshots for a person to look at, only when asked: `E2E_SCREENSHOTS=1` writes them to
 * var/screenshots/, `E2E_SCREENSHOTS=<folder>` there. A normal run writes nothing.
 */
export async function screenshot(page: Page, name: string): Promise<void> {
  const asked = process.env.E2E_SCREENSHOTS;
  if (!asked || asked === '0') return;
  const dir =
    asked === '1' ? path.resolve(import.meta.dirname, '..', '..', 'var', 'screenshots') : path.resolve(asked);
  mkdirSync(dir, { recursive: true });
  await page.screenshot({ path: path.join(dir, `${name}.png`), fullPage: true });
}

/** Signs in through the dashboard's own form and waits for the organisation's overview. */
export async function signInThroughForm(
  page: Page,
  appUrl: string,
  user: { email: string; password: string },
): Promise<void> {
  await page.goto(`${appUrl}/login`);
  await page.getByLabel('E-mail address').fill(user.email);
  await page.getByLabel('Password', { exact: true }).fill(user.password);
  await page.getByRole('button', { name: 'Sign in', exact: true }).click();
  await page.waitForURL(/\/orgs\/\d+$/);
}
