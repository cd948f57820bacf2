/**
 * In Chromium, as the regional manager: change a weight and see the order change, flag a building
 * for a walkthrough; then, as the administrator, find the mail to the installation's staff in the Outbox.
 */
import type { Browser, Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { base, hasBrowser, launch, signInAs } from '../support/browser';

let browser: Browser;
beforeAll(async () => {
  if (hasBrowser) browser = await launch();
});
afterAll(async () => {
  await browser?.close();
});

async function order(page: Page): Promise<string[]> {
  return page.locator('[data-testid=shortlist-row] a').evaluateAll((as) => as.slice(0, 8).map((a) => a.textContent!.trim()));
}

describe.skipIf(!hasBrowser)('shortlist in the browser', () => {
  it('weights reorder the list; a flag sends the staff a mail that lands in the Outbox', async () => {
    const context = await browser.newContext({ viewport: { width: 1400, height: 1000 } });
    const page = await context.newPage();
    await signInAs(page, 'manager@demo.plumbline.test');
    await page.goto(`${base()}/shortlist`);
    await page.locator('[data-testid=shortlist-row]').first().waitFor();
    const before = await order(page);

    // Put all the weight on the time since the last evaluation.
    for (const label of ['Excess energy over the peer median', 'Cost of that excess', 'Rise in normalized use over last year', 'Recent bills off the baseline', 'Flagged by a manager']) {
      await page.getByLabel(new RegExp(`^${label}`)).fill('0');
    }
    await page.getByLabel(/^Time since the last evaluation/).fill('100');
    await page.getByRole('button', { name: 'Save weights' }).click();
    await expect.poll(() => order(page), { timeout: 15_000 }).not.toEqual(before);
    const after = await order(page);
    expect(after).not.toEqual(before);

    // Back to the defaults, then flag a building of the staff's installation (BNP).
    await page.getByLabel(/^Excess energy over the peer median/).fill('30');
    await page.getByLabel(/^Cost of that excess/).fill('20');
    await page.getByLabel(/^Rise in normalized use over last year/).fill('15');
    await page.getByLabel(/^Recent bills off the baseline/).fill('10');
    await page.getByLabel(/^Time since the last evaluation/).fill('15');
    await page.getByLabel(/^Flagged by a manager/).fill('10');
    await page.getByRole('button', { name: 'Save weights' }).click();
    await expect.poll(() => order(page), { timeout: 15_000 }).toEqual(before);

    await page.getByLabel('Installation').selectOption('BNP');
    const row = page.locator('[data-testid=shortlist-row]').filter({ hasNot: page.locator('.badge', { hasText: 'flagged' }) }).first();
    const number = ((await row.locator('a').first().textContent()) ?? '').replace('BNP', '').trim();
    await row.getByRole('button', { name: /^flag/ }).click();
    await page.getByLabel('Reason').fill('Lights on all night in the east wing, reported by security');
    await page.getByRole('button', { name: 'Flag it' }).click();
    await expect(page.getByRole('status').filter({ hasText: 'is flagged' }).textContent()).resolves.toMatch(/staff@demo\.plumbline\.test/);
    await context.close();

    const admin = await browser.newContext();
    const ap = await admin.newPage();
    await signInAs(ap, 'admin@demo.plumbline.test');
    await ap.goto(`${base()}/admin/outbox`);
    const mail = ap.getByTestId('outbox').locator('li').filter({ hasText: `Walkthrough wanted: building ${number} at BNP` }).first();
    await expect(mail.textContent()).resolves.toMatch(/staff@demo\.plumbline\.test/);
    await expect(mail.textContent()).resolves.toMatch(/delivered/);
    await mail.locator('summary').click();
    await expect(mail.textContent()).resolves.toMatch(/Lights on all night in the east wing/);
    await admin.close();
  });
});
