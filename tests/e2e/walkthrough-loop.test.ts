/**
 * The field loop in Chromium: the regional manager flags a building and plans a walkthrough with a
 * kit; the auditor, on a phone-sized screen, fills the form, adds a photo and a finding priced as
 * a measure; the walkthrough's report comes out as a PDF and as BuildingSync XML that validates
 * against the official 2.7.0 schema (tests/fixtures/schemas, with its licence).
 */
import { readFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import type { Browser } from 'playwright-core';
import { validateXML } from 'xmllint-wasm';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { base, hasBrowser, islandsReady, launch, signInAs } from '../support/browser';
import { call } from '../support/http';

const schemas = fileURLToPath(new URL('../fixtures/schemas/', import.meta.url));
// A 1×1 PNG (constructed; the PNG signature and IHDR/IDAT/IEND chunks per ISO/IEC 15948).
const PNG = Buffer.from('iVBORw0KGgoAAAANSUhEUgAAAAEAAAABCAYAAAAfFcSJAAAADUlEQVR42mNk+M9QDwADhgGAWjR9awAAAABJRU5ErkJggg==', 'base64');

let browser: Browser;
beforeAll(async () => {
  if (hasBrowser) browser = await launch();
});
afterAll(async () => {
  await browser?.close();
});

const inDays = (n: number) => new Date(Date.now() + n * 86_400_000).toISOString().slice(0, 10);

describe.skipIf(!hasBrowser)('walkthrough loop in the browser', () => {
  it('flag → plan with a kit → phone form with a photo → finding with savings → PDF and BuildingSync', async () => {
    // A kit of its own, calibrated well past the walkthrough, so the demo's loans and due dates
    // (fixed to the demo's day) never decide the outcome.
    const tag = String(Date.now() % 1_000_000);
    const kit = await call('custodian', 'POST', '/api/kits', { code: `E2E-${tag}`, name: 'Walkthrough test kit' });
    expect(kit.status).toBe(201);
    const meter = await call('custodian', 'POST', '/api/instruments', { kitId: kit.body.id, type: 'light_meter', serial: `E2E-LM-${tag}`, calibrationDue: inDays(400) });
    expect(meter.status).toBe(201);

    // 1. The manager flags a BNP building on the shortlist and plans its walkthrough.
    const desk = await browser.newContext({ viewport: { width: 1400, height: 1000 } });
    const mp = await desk.newPage();
    await signInAs(mp, 'manager@demo.plumbline.test');
    await mp.goto(`${base()}/shortlist`);
    await islandsReady(mp);
    await mp.locator('[data-testid=shortlist-row]').first().waitFor();
    await mp.getByLabel('Installation').selectOption('BNP');
    const row = mp.locator('[data-testid=shortlist-row]').filter({ hasNot: mp.locator('.badge', { hasText: 'flagged' }) }).nth(1);
    const label = ((await row.locator('a').first().textContent()) ?? '').trim();
    await row.getByRole('button', { name: /^flag/ }).click();
    await mp.getByLabel('Reason').fill('Boiler short-cycling reported by the occupants; heating slope twice the peers');
    await mp.getByRole('button', { name: 'Flag it' }).click();
    await mp.getByRole('link', { name: 'Plan the walkthrough now' }).click();
    await mp.waitForURL(/\/walkthroughs\/new\?building=/);
    await islandsReady(mp);
    const form = mp.getByRole('form', { name: 'Plan a walkthrough' });
    await form.waitFor();
    await expect(form.textContent()).resolves.toContain(label.replace(/^BNP\s*/, ''));
    const day = inDays(21);
    await mp.getByLabel('Date', { exact: false }).first().fill(day);
    const auditor = mp.getByLabel('Auditor');
    if ((await auditor.inputValue()) === '') await auditor.selectOption({ index: 1 });
    const kitChoice = mp.getByRole('radiogroup', { name: 'Kits' }).locator('label').filter({ hasText: `E2E-${tag}` }).getByRole('radio');
    await expect.poll(() => kitChoice.isEnabled(), { timeout: 15_000 }).toBe(true);
    await kitChoice.check();
    await mp.getByRole('button', { name: 'Plan and reserve the kit' }).click();
    await mp.waitForURL(/\/walkthroughs\/[0-9a-f-]{36}$/, { timeout: 30_000 });
    const id = new URL(mp.url()).pathname.split('/').pop()!;
    const listed = await (await mp.request.get(`${base()}/api/walkthroughs?installation=BNP`)).json();
    const planned = listed.items.find((w: { id: string }) => w.id === id);
    expect(planned).toMatchObject({ status: 'planned', plannedOn: day, loan: { status: 'requested', kitCode: `E2E-${tag}` } });
    await desk.close();

    // 2. The auditor fills the form on a phone.
    const phone = await browser.newContext({ viewport: { width: 390, height: 844 }, isMobile: true, hasTouch: true });
    const ap = await phone.newPage();
    await signInAs(ap, 'auditor@demo.plumbline.test');
    await ap.goto(`${base()}/walkthroughs/${id}`);
    await islandsReady(ap);
    // Nothing wider than the screen.
    expect(await ap.evaluate(() => document.documentElement.scrollWidth)).toBeLessThanOrEqual(390);
    await ap.getByRole('button', { name: 'Add a lighting row' }).click();
    await ap.getByLabel('Fixture', { exact: true }).fill('2×4 troffer, 3 lamps T8');
    await ap.getByLabel('Fixtures', { exact: true }).fill('48');
    await ap.getByLabel(/^Input watts per fixture/).fill('86');
    await ap.getByLabel(/^Hours on per year/).first().fill('4380');
    await ap.getByTestId('section-lighting').getByLabel('Section complete').check();
    await expect.poll(() => ap.getByTestId('save-state').textContent(), { timeout: 20_000 }).toMatch(/All changes saved/);

    await ap.getByRole('tab', { name: /Photos/ }).click();
    const photoForm = ap.getByRole('form', { name: 'Add a photo' });
    await photoForm.getByLabel('Photo', { exact: true }).setInputFiles({ name: 'boiler-nameplate.png', mimeType: 'image/png', buffer: PNG });
    await photoForm.getByLabel('Tag', { exact: false }).selectOption({ label: 'Nameplate' });
    await photoForm.getByLabel('Caption').fill('Boiler 1 nameplate');
    await ap.getByRole('button', { name: 'Upload photo' }).click();
    await ap.getByRole('link', { name: /Open photo: Nameplate, Boiler 1 nameplate/ }).waitFor();

    await ap.getByRole('tab', { name: /Findings/ }).click();
    await ap.getByRole('button', { name: 'Add a finding' }).click();
    await ap.getByLabel('Title', { exact: false }).fill('Boiler short-cycling: reset the high limit and add outdoor reset');
    await ap.getByLabel('Category', { exact: false }).selectOption({ index: 1 });
    await ap.getByLabel('Location', { exact: false }).fill('Mechanical room B');
    await ap.getByRole('button', { name: 'Save the finding' }).click();
    await ap.getByRole('button', { name: 'Price as a measure' }).click();
    await ap.getByRole('button', { name: 'Add a commodity' }).click();
    await ap.getByLabel(/^Quantity 1/).fill('12000');
    await ap.getByLabel(/^Annual energy cost savings/).fill('1500');
    await ap.getByLabel(/^Installed cost/).fill('6000');
    await ap.getByLabel(/^Life/).fill('15');
    await ap.getByRole('button', { name: 'Save the measure' }).click();
    // Simple payback = installed cost / annual savings = 6000 / 1500 = 4 years (10 CFR 436.22).
    await expect.poll(async () => (await ap.locator('body').textContent()) ?? '', { timeout: 15_000 }).toMatch(/4(\.0)?\s*(yr|years)/);

    // The form survived: a fresh load shows the lighting row.
    await ap.reload();
    await islandsReady(ap);
    await ap.getByRole('tab', { name: 'Form' }).click();
    await expect.poll(async () => (await ap.getByRole('tabpanel').textContent()) ?? '', { timeout: 15_000 }).toContain('2×4 troffer, 3 lamps T8');
    const stored = await (await ap.request.get(`${base()}/api/walkthroughs/${id}`)).json();
    expect(JSON.stringify(stored.form)).toContain('2×4 troffer, 3 lamps T8');
    expect(stored.photos).toHaveLength(1);
    expect(stored.findings[0].measure).toMatchObject({ installedCost: 6000, lifeYears: 15 });

    // 3. The report, as the auditor downloads it from the page's links.
    const pdfHref = await ap.getByRole('link', { name: 'Report (PDF)' }).getAttribute('href');
    const xmlHref = await ap.getByRole('link', { name: 'BuildingSync XML' }).getAttribute('href');
    expect(pdfHref).toBe(`/api/walkthroughs/${id}/report.pdf`);
    expect(xmlHref).toBe(`/api/walkthroughs/${id}/buildingsync`);
    const pdf = await ap.request.get(`${base()}${pdfHref}`);
    expect(pdf.status()).toBe(200);
    expect(pdf.headers()['content-type']).toMatch(/application\/pdf/);
    expect((await pdf.body()).subarray(0, 5).toString('latin1')).toBe('%PDF-');
    const xml = await ap.request.get(`${base()}${xmlHref}`);
    expect(xml.status()).toBe(200);
    const text = await xml.text();
    expect(text).toContain('Boiler short-cycling');
    const result = await validateXML({
      xml: { fileName: 'report.xml', contents: text },
      schema: { fileName: 'buildingsync-2.7.0/BuildingSync.xsd', contents: readFileSync(`${schemas}buildingsync-2.7.0/BuildingSync.xsd`, 'utf8') },
      preload: [{ fileName: 'gbxml-stub.xsd', contents: readFileSync(`${schemas}gbxml-stub.xsd`, 'utf8') }],
    });
    expect(result.errors).toEqual([]);
    expect(result.valid).toBe(true);
    await phone.close();
  });
});
