/**
 * Every main page in Chromium, checked with axe-core (WCAG 2.1 A and AA rules): no serious or
 * critical violation. The same visit records any Content-Security-Policy violation the browser
 * reports, so a page that the policy breaks fails here too.
 * Source: Deque axe-core 4.x rules; W3C WCAG 2.1; W3C CSP Level 3 (violation reports).
 */
import { readFileSync } from 'node:fs';
import { createRequire } from 'node:module';
import type { Browser, Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { base, hasBrowser, islandsReady, launch, signInAs } from '../support/browser';
import { call } from '../support/http';

const AXE = readFileSync(createRequire(import.meta.url).resolve('axe-core/axe.min.js'), 'utf8');

interface AxeViolation {
  id: string;
  impact: string | null;
  help: string;
  nodes: { target: unknown[] }[];
}

/** Runs axe in the page (evaluated through the DevTools protocol, which the page's CSP does not govern). */
async function axeViolations(page: Page): Promise<AxeViolation[]> {
  await page.evaluate(AXE);
  const result = await page.evaluate(async () => {
    const axe = (window as unknown as { axe: { run: (ctx: Document, opts: unknown) => Promise<{ violations: AxeViolation[] }> } }).axe;
    return axe.run(document, { runOnly: { type: 'tag', values: ['wcag2a', 'wcag2aa', 'wcag21a', 'wcag21aa'] }, resultTypes: ['violations'] });
  });
  return result.violations.filter((v) => v.impact === 'serious' || v.impact === 'critical');
}

let browser: Browser;
let ids: { building: string; meter: string; installation: string; station: string; walkthrough?: string; kit?: string } = { building: '', meter: '', installation: 'BNP', station: 'BNPWX' };

beforeAll(async () => {
  if (!hasBrowser) return;
  browser = await launch();
  const buildings = (await call('admin', 'GET', '/api/buildings?installation=BNP')).body.items as { id: string }[];
  const meters = (await call('admin', 'GET', '/api/meters?installation=BNP')).body.items as { id: string }[];
  ids = { ...ids, building: buildings[0]!.id, meter: meters[0]!.id };
  const walks = await call('admin', 'GET', '/api/walkthroughs?status=completed');
  if (walks.status === 200) ids.walkthrough = walks.body.items[0]?.id;
  const kits = await call('admin', 'GET', '/api/kits');
  if (kits.status === 200) ids.kit = kits.body.items[0]?.id;
});
afterAll(async () => {
  await browser?.close();
});

const PAGES: [string, string, () => string | undefined][] = [
  ['admin', 'region board', () => '/'],
  ['admin', 'shortlist', () => '/shortlist'],
  ['admin', 'printable shortlist', () => '/shortlist/print'],
  ['admin', 'targets', () => '/targets'],
  ['admin', 'installations', () => '/installations'],
  ['admin', 'installation', () => `/installations/${ids.installation}`],
  ['admin', 'installation form', () => `/installations/${ids.installation}/edit`],
  ['admin', 'buildings', () => '/buildings'],
  ['admin', 'building', () => `/buildings/${ids.building}`],
  ['admin', 'building form', () => `/buildings/${ids.building}/edit`],
  ['admin', 'new building', () => '/buildings/new'],
  ['admin', 'meter', () => `/meters/${ids.meter}`],
  ['staff', 'bill intake', () => '/intake'],
  ['admin', 'weather', () => '/weather'],
  ['admin', 'weather station', () => `/weather/${ids.station}`],
  ['analyst', 'baselines', () => '/baselines'],
  ['analyst', 'baseline review', () => `/baselines/${ids.meter}`],
  ['custodian', 'kit library', () => '/kits'],
  ['custodian', 'kit', () => (ids.kit ? `/kits/${ids.kit}` : undefined)],
  ['auditor', 'walkthroughs', () => '/walkthroughs'],
  ['auditor', 'walkthrough', () => (ids.walkthrough ? `/walkthroughs/${ids.walkthrough}` : undefined)],
  ['admin', 'people', () => '/admin/users'],
  ['admin', 'outbox', () => '/admin/outbox'],
  ['admin', 'activity', () => '/admin/activity'],
];

const EMAIL: Record<string, string> = {
  admin: 'admin@demo.plumbline.test',
  staff: 'staff@demo.plumbline.test',
  analyst: 'analyst@demo.plumbline.test',
  auditor: 'auditor@demo.plumbline.test',
  custodian: 'custodian@demo.plumbline.test',
};

describe.skipIf(!hasBrowser)('accessibility and content policy of the main pages', () => {
  const pages = new Map<string, Page>();
  const signedIn = async (role: string): Promise<Page> => {
    let page = pages.get(role);
    if (!page) {
      const context = await browser.newContext({ viewport: { width: 1280, height: 900 } });
      page = await context.newPage();
      await signInAs(page, EMAIL[role]!);
      pages.set(role, page);
    }
    return page;
  };

  it.each([
    ['sign-in', '/sign-in'],
    ['forgot password', '/forgot-password'],
  ])('%s (signed out)', async (_name, path) => {
    const context = await browser.newContext();
    const page = await context.newPage();
    const cspErrors: string[] = [];
    page.on('console', (m) => m.type() === 'error' && /Content Security Policy/i.test(m.text()) && cspErrors.push(m.text()));
    await page.goto(`${base()}${path}`, { waitUntil: 'networkidle' });
    expect(await axeViolations(page)).toEqual([]);
    expect(cspErrors).toEqual([]);
    await context.close();
  });

  it.each(PAGES)('%s: %s', async (role, _name, pathOf) => {
    const path = pathOf();
    if (!path) return; // the route has no demo object to show
    const page = await signedIn(role);
    const cspErrors: string[] = [];
    const listener = (m: { type(): string; text(): string }) => {
      if (m.type() === 'error' && /Content Security Policy/i.test(m.text())) cspErrors.push(m.text());
    };
    page.on('console', listener);
    const res = await page.goto(`${base()}${path}`, { waitUntil: 'networkidle' });
    expect(res?.status()).toBe(200);
    await islandsReady(page);
    // Islands have loaded their data: no busy indicator left.
    await page.waitForFunction(() => !document.querySelector('[aria-busy="true"]'), undefined, { timeout: 15_000 }).catch(() => undefined);
    const violations = await axeViolations(page);
    page.off('console', listener);
    expect(violations.map((v) => `${v.id} (${v.impact}): ${v.help} — ${JSON.stringify(v.nodes.slice(0, 3).map((n) => n.target))}`)).toEqual([]);
    expect(cspErrors).toEqual([]);
  });
});
