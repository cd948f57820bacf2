/** In Chromium, as the analyst: accept one fit, override another with a note, both kept in the history. */
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

describe.skipIf(!hasBrowser)('baseline review in the browser', () => {
  it('the analyst accepts one fit and overrides another with a note', async () => {
    const context = await browser.newContext({ viewport: { width: 1280, height: 900 } });
    const page = await context.newPage();
    await signInAs(page, 'analyst@demo.plumbline.test');
    await page.goto(`${base()}/baselines?status=needs-review&installation=SBP`);
    const links = page.locator('table tbody tr td:nth-child(2) a');
    const first = (await links.nth(0).textContent())!.trim();
    const second = (await links.nth(1).textContent())!.trim();

    // 1. Accept, after trying without a note.
    await links.nth(0).click();
    await page.getByRole('heading', { name: 'The model against the bills' }).waitFor();
    expect(await page.getByRole('img', { name: /use-vs-temperature/ }).count()).toBe(1);
    await page.getByRole('button', { name: 'Accept this model' }).click();
    await expect(page.getByRole('alert').first().textContent()).resolves.toMatch(/Write a note first/);
    await page.getByLabel('Note (required)').fill('Cooling response is clear; CV(RMSE) well inside the criterion.');
    await page.getByRole('button', { name: 'Accept this model' }).click();
    await expect.poll(() => page.getByTestId('baseline-status').textContent()).toBe('accepted');
    await expect(page.getByTestId('baseline-decisions').textContent()).resolves.toMatch(/accepted.*Cooling response is clear/s);

    // 2. Override the second with the compared shape.
    await page.goto(`${base()}/baselines?installation=SBP`);
    await page.getByRole('link', { name: second }).click();
    await page.getByRole('heading', { name: 'The model against the bills' }).waitFor();
    const compare = page.getByLabel('Compare with');
    const options = await compare.locator('option').evaluateAll((os) => os.map((o) => (o as HTMLOptionElement).value).filter(Boolean));
    expect(options.length).toBeGreaterThan(0);
    await compare.selectOption(options[0]!);
    await page.getByLabel('Note (required)').fill(`Prefer the ${options[0]} shape: the selected one overfits two shoulder months.`);
    await page.getByRole('button', { name: 'Use the compared shape instead' }).click();
    await expect.poll(() => page.getByTestId('baseline-status').textContent(), { timeout: 30_000 }).toBe('accepted');
    await expect(page.getByTestId('baseline-decisions').textContent()).resolves.toMatch(/chose another shape.*overfits two shoulder months/s);

    // 3. The queue shows both as accepted.
    await page.goto(`${base()}/baselines?installation=SBP&status=accepted`);
    await expect(page.locator('table').textContent()).resolves.toContain(first);
    await expect(page.locator('table').textContent()).resolves.toContain(second);
    await context.close();
  });
});
