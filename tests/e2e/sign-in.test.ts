/** In Chromium: every demo account signs in through the form and lands on its page; the manager browses. */
import type { Browser } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { base, hasBrowser, launch, signInAs } from '../support/browser';

let browser: Browser;
beforeAll(async () => {
  if (hasBrowser) browser = await launch();
});
afterAll(async () => {
  await browser?.close();
});

const ACCOUNTS: [string, string, RegExp][] = [
  ['admin@demo.plumbline.test', '/', /Region board/],
  ['manager@demo.plumbline.test', '/', /Region board/],
  ['staff@demo.plumbline.test', '/installations', /Installations/],
  ['analyst@demo.plumbline.test', '/baselines', /Baselines/],
  ['auditor@demo.plumbline.test', '/walkthroughs', /Walkthroughs/],
  ['custodian@demo.plumbline.test', '/kits', /Kit library/],
];

describe.skipIf(!hasBrowser)('sign-in in the browser', () => {
  it.each(ACCOUNTS)('%s lands on %s', async (email, path, heading) => {
    const context = await browser.newContext();
    const page = await context.newPage();
    await signInAs(page, email);
    expect(new URL(page.url()).pathname).toBe(path);
    await expect(page.getByRole('heading', { level: 1 }).first().textContent()).resolves.toMatch(heading);
    await context.close();
  });

  it('a wrong password shows a message and stays on the sign-in page', async () => {
    const context = await browser.newContext();
    const page = await context.newPage();
    await page.goto(`${base()}/sign-in`);
    await page.getByLabel('E-mail').fill('analyst@demo.plumbline.test');
    await page.getByLabel('Password').fill('nope nope nope');
    await page.getByRole('button', { name: 'Sign in' }).click();
    await expect(page.getByRole('alert').first().textContent()).resolves.toMatch(/do not match/);
    expect(new URL(page.url()).pathname).toBe('/sign-in');
    await context.close();
  });

  it('the regional manager opens an installation and one of its buildings', async () => {
    const context = await browser.newContext();
    const page = await context.newPage();
    await signInAs(page, 'manager@demo.plumbline.test');
    await page.getByRole('navigation', { name: 'Sections' }).getByRole('link', { name: 'Installations' }).first().click();
    await page.waitForURL('**/installations');
    await page.getByRole('link', { name: 'KSL' }).click();
    await page.waitForURL('**/installations/KSL');
    await expect(page.getByRole('heading', { level: 1 }).textContent()).resolves.toMatch(/Kestrowe Lakes/);
    const firstBuilding = page.locator('table tbody tr').first().getByRole('link');
    const number = (await firstBuilding.textContent())!.trim();
    await firstBuilding.click();
    await page.waitForURL('**/buildings/**');
    await expect(page.getByRole('heading', { level: 1 }).textContent()).resolves.toContain(number);
    await expect(page.getByRole('heading', { name: 'Meters' }).isVisible()).resolves.toBe(true);
    expect(await page.locator('table tbody tr').count()).toBeGreaterThanOrEqual(2);
    await context.close();
  });
});
