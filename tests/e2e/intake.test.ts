/**
 * In Chromium, as installation staff: a messy bill file is checked (every problem by line),
 * committed, seen in the history and undone; the weather page shows coverage and degree days.
 */
import { writeFileSync, mkdtempSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import type { Browser } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { base, hasBrowser, islandsReady, launch, signInAs } from '../support/browser';

let browser: Browser;
beforeAll(async () => {
  if (hasBrowser) browser = await launch();
});
afterAll(async () => {
  await browser?.close();
});

// Constructed file: `;` separators, CRLF, US dates, an impossible date (line 4), an unknown meter
// (line 5) and a negative reading (line 6). Periods before the demo's first bills.
const MESSY = [
  'Account/Meter;From;To;Usage (kWh);Total Charges;Est?',
  'BNP-3204-E;1/3/2021;2/1/2021;12250;"$1.903,10";N',
  'BNP-3204-E;2/2/2021;3/3/2021;11870;"$1.744,55";N',
  'BNP-3204-E;3/4/2021;4/31/2021;11100;"$1.170,00";N',
  'BNP-9999-E;4/2/2021;5/3/2021;9420;"$990,05";Y',
  'BNP-3204-E;4/2/2021;5/3/2021;-5;;Y',
  '',
].join('\r\n');

describe.skipIf(!hasBrowser)('bill intake in the browser', () => {
  it('check, commit, undo', async () => {
    const dir = mkdtempSync(join(tmpdir(), 'plumbline-e2e-'));
    const file = join(dir, 'portal-export.csv');
    writeFileSync(file, MESSY);
    const context = await browser.newContext({ viewport: { width: 1280, height: 900 } });
    const page = await context.newPage();
    await signInAs(page, 'staff@demo.plumbline.test');
    await page.goto(`${base()}/intake`);
    await islandsReady(page);
    await page.setInputFiles('#intake-file', file);
    await page.getByRole('heading', { name: '2. Which column is what' }).waitFor();
    // The suggested mapping picked the columns from their headers.
    expect(await page.locator('#map-meter').inputValue()).toBe('Account/Meter');
    expect(await page.locator('#map-quantity').inputValue()).toBe('Usage (kWh)');
    await page.getByRole('button', { name: 'Check the file' }).click();
    const report = page.getByTestId('dry-run-report');
    await report.waitFor();
    const table = page.getByRole('table', { name: 'Problems by file line' });
    await expect(table.getByRole('row').filter({ hasText: 'impossible-date' }).textContent()).resolves.toMatch(/^4\s*error\s*To/);
    await expect(table.getByRole('row').filter({ hasText: 'unknown-meter' }).textContent()).resolves.toMatch(/^5\s*error/);
    await expect(table.getByRole('row').filter({ hasText: 'negative-quantity' }).textContent()).resolves.toMatch(/^6\s*warning/);

    page.once('dialog', (d) => void d.accept());
    await page.getByRole('button', { name: /^Commit 3 bills/ }).click();
    await page.getByTestId('commit-result').waitFor();
    await expect(page.getByTestId('commit-result').textContent()).resolves.toMatch(/Committed: 3 new and 0 changed bills; 2 rows left out/);
    const row = page.getByRole('row').filter({ hasText: 'portal-export.csv' }).first();
    await expect(row.textContent()).resolves.toMatch(/in effect/);

    page.once('dialog', (d) => void d.accept());
    await row.getByRole('button', { name: /undo/ }).click();
    await expect.poll(async () => row.textContent(), { timeout: 10_000 }).toMatch(/undone/);
    await context.close();
  });

  it('the weather page shows coverage and recomputes degree days at another base', async () => {
    const context = await browser.newContext();
    const page = await context.newPage();
    await signInAs(page, 'staff@demo.plumbline.test');
    await page.goto(`${base()}/weather/BNPWX`);
    await page.getByRole('heading', { name: 'Coverage' }).waitFor();
    await expect(page.getByTestId('weather-gaps').textContent()).resolves.toMatch(/days\)/);
    const hddCard = page.locator('dt', { hasText: 'HDD in the period' }).locator('..');
    await expect.poll(async () => (await hddCard.textContent()) ?? '').toMatch(/per day/);
    const at65 = await hddCard.textContent();
    await page.getByLabel('Base temperature').fill('55');
    await expect.poll(async () => hddCard.textContent()).not.toBe(at65);
    await context.close();
  });
});
