/**
 * Debian's Chromium through playwright-core. Without /usr/bin/chromium the browser tests are
 * skipped with a loud message, or fail when REQUIRE_BROWSER=1 (as in CI).
 */
import { existsSync } from 'node:fs';
import { chromium, type Browser, type Page } from 'playwright-core';
import { inject } from 'vitest';

export const CHROMIUM = '/usr/bin/chromium';
export const hasBrowser = existsSync(CHROMIUM);
if (!hasBrowser) {
  const msg = `Chromium is missing at ${CHROMIUM}: browser tests cannot run.`;
  if (process.env.REQUIRE_BROWSER === '1') throw new Error(msg);
  console.warn(`\n!!! ${msg} They are skipped. !!!\n`);
}

export async function launch(): Promise<Browser> {
  return chromium.launch({
    executablePath: CHROMIUM,
    args: ['--headless', '--no-sandbox', '--disable-gpu', '--no-first-run', '--disable-background-networking', '--disable-component-update', '--disable-sync', '--disable-quic'],
  });
}

export const base = () => inject('baseUrl');

/** Signs in through the form, as a person would. */
export async function signInAs(page: Page, email: string, password = 'plumbline-demo-2026'): Promise<void> {
  await page.goto(`${base()}/sign-in`);
  await islandsReady(page);
  await page.getByLabel('E-mail').fill(email);
  await page.getByLabel('Password').fill(password);
  await page.getByRole('button', { name: 'Sign in' }).click();
  await page.waitForURL((u) => !u.pathname.startsWith('/sign-in'));
}

/**
 * Waits until every island that hydrates on load has done so (Astro removes `ssr` from an island
 * once it has); islands that wait to be scrolled into view are left as rendered.
 */
export async function islandsReady(page: Page): Promise<void> {
  await page.waitForFunction(() => !document.querySelector('astro-island[ssr]:not([client="visible"])'), undefined, { timeout: 30_000 });
}
