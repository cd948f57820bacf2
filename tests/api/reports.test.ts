/**
 * The walkthrough report downloads over HTTP: BuildingSync 2.7.0 XML and the PDF, for whoever may
 * read the walkthrough (auditors included), not found outside the caller's installations, logged.
 */
import { XMLParser } from 'fast-xml-parser';
import { describe, expect, it } from 'vitest';
import { generateDemoScenario } from '../../src/db/seed/scenario';
import { baseUrl, call, signIn, DEMO } from '../support/http';

// The test server loads the demo with today = 2026-11-30 (tests/support/server-process.ts).
const walkthroughs = generateDemoScenario({ today: '2026-11-30' }).field.walkthroughs;
const at = (code: string, number: string) => walkthroughs.find((w) => w.installationCode === code && w.buildingNumber === number)!;
const corrigan = at('BNP', '3102');
const bayside = at('SBP', '2301');

async function download(as: string, path: string) {
  const res = await fetch(`${baseUrl()}${path}`, { headers: { cookie: await signIn(as) } });
  return { status: res.status, headers: res.headers, bytes: Buffer.from(await res.arrayBuffer()) };
}

describe('GET /api/walkthroughs/:id/buildingsync', () => {
  it('answers a BuildingSync 2.7.0 document named after the building and the audit date', async () => {
    const r = await download(DEMO.manager, `/api/walkthroughs/${corrigan.id}/buildingsync`);
    expect(r.status).toBe(200);
    expect(r.headers.get('content-type')).toMatch(/^application\/xml/);
    expect(r.headers.get('content-disposition')).toBe(`attachment; filename="walkthrough-BNP-3102-${corrigan.plannedOn}-buildingsync.xml"`);
    const doc = new XMLParser({ ignoreAttributes: false, attributeNamePrefix: '@_' }).parse(r.bytes.toString('utf8')).BuildingSync;
    expect(doc['@_version']).toBe('2.7.0');
    const facility = doc.Facilities.Facility;
    expect(facility.Sites.Site.Buildings.Building.PremisesName).toBe('3102 Corrigan Hall');
    expect(facility.Measures.Measure).toHaveLength(3);
    expect(facility.Reports.Report.ASHRAEAuditLevel).toBe('Level 1: Walk-through');
  });

  it('lets an auditor export a walkthrough of their installations, and finds none elsewhere', async () => {
    expect((await download(DEMO.auditor, `/api/walkthroughs/${corrigan.id}/buildingsync`)).status).toBe(200);
    const foreign = await call('auditor', 'GET', `/api/walkthroughs/${bayside.id}/buildingsync`);
    expect(foreign.status).toBe(404);
    expect(foreign.body.error.code).toBe('not_found');
    expect((await download('tobias.renner@demo.plumbline.test', `/api/walkthroughs/${bayside.id}/buildingsync`)).status).toBe(200);
  });

  it('404 for an unknown or malformed id, 401 without a session', async () => {
    expect((await call('manager', 'GET', '/api/walkthroughs/00000000-0000-4000-8000-000000000000/buildingsync')).status).toBe(404);
    expect((await call('manager', 'GET', '/api/walkthroughs/not-an-id/buildingsync')).status).toBe(404);
    expect((await call(null, 'GET', `/api/walkthroughs/${corrigan.id}/buildingsync`)).status).toBe(401);
  });
});

describe('GET /api/walkthroughs/:id/report.pdf', () => {
  it('answers a PDF for the auditor, and 404 for a walkthrough outside their installations', async () => {
    const r = await download(DEMO.auditor, `/api/walkthroughs/${corrigan.id}/report.pdf`);
    expect(r.status).toBe(200);
    expect(r.headers.get('content-type')).toBe('application/pdf');
    expect(r.headers.get('content-disposition')).toBe(`attachment; filename="walkthrough-BNP-3102-${corrigan.plannedOn}.pdf"`);
    // Source: ISO 32000-1 §7.5.2 and §7.5.5: a PDF starts with %PDF-1.n and ends with %%EOF.
    expect(r.bytes.subarray(0, 7).toString('latin1')).toBe('%PDF-1.');
    expect(r.bytes.subarray(-6).toString('latin1')).toMatch(/%%EOF/);
    expect(Number(r.headers.get('content-length'))).toBe(r.bytes.length);
    expect((await call('auditor', 'GET', `/api/walkthroughs/${bayside.id}/report.pdf`)).status).toBe(404);
  });

  it('a planned walkthrough with an empty form still gives a report', async () => {
    const planned = walkthroughs.find((w) => w.status === 'planned')!;
    expect((await download('ines.varga@demo.plumbline.test', `/api/walkthroughs/${planned.id}/report.pdf`)).status).toBe(200);
  });
});

describe('exports are logged', () => {
  it('the activity log names who exported which walkthrough, in which format', async () => {
    await download(DEMO.analyst, `/api/walkthroughs/${bayside.id}/report.pdf`);
    await download(DEMO.analyst, `/api/walkthroughs/${bayside.id}/buildingsync`);
    const pdf = await call('admin', 'GET', '/api/activity?action=export.walkthrough-pdf&limit=50');
    const xml = await call('admin', 'GET', '/api/activity?action=export.walkthrough-buildingsync&limit=50');
    const mine = (items: { actor: string; entityId: string }[]) => items.filter((i) => i.actor === DEMO.analyst && i.entityId === bayside.id);
    expect(mine(pdf.body.items)).toHaveLength(1);
    expect(mine(xml.body.items)).toHaveLength(1);
  });
});
