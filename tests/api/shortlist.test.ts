/** The shortlist contract for scripts, its exports (spreadsheet-safe), weights and flags over HTTP. */
import ExcelJS from 'exceljs';
import Papa from 'papaparse';
import { describe, expect, it } from 'vitest';
import { baseUrl, call, signIn, DEMO } from '../support/http';

describe('GET /api/shortlist', () => {
  it('answers the documented shape, ordered by score', async () => {
    const r = await call('manager', 'GET', '/api/shortlist?limit=20');
    expect(r.status).toBe(200);
    expect(Object.keys(r.body.weights).sort()).toEqual(['anomalies', 'evaluationAge', 'excessCost', 'excessEnergy', 'manualFlag', 'yoyIncrease']);
    const first = r.body.items[0];
    expect(first).toMatchObject({ buildingId: expect.any(String), buildingNumber: expect.any(String), name: expect.any(String), installationCode: expect.any(String), useType: expect.any(String), score: expect.any(Number), rank: 1, peerMedian: expect.any(Number), excessKbtu: expect.any(Number) });
    expect(first.breakdown.terms.length).toBe(6);
    for (let k = 1; k < r.body.items.length; k++) expect(r.body.items[k - 1].score).toBeGreaterThanOrEqual(r.body.items[k].score);
  });
});

describe('exports', () => {
  it('CSV neutralizes text cells that could run as formulas, and keeps numbers as numbers', async () => {
    // A building whose name would run as a formula in a spreadsheet (OWASP, CSV Injection).
    const created = await call('staff', 'POST', '/api/buildings', { installation: 'BNP', number: `X${Date.now() % 100000}`, name: '=HYPERLINK("http://evil.example","click")', useType: 'office', grossAreaFt2: 1234 });
    expect(created.status).toBe(201);
    const cookie = await signIn(DEMO.manager);
    const res = await fetch(`${baseUrl()}/api/shortlist?format=csv&installation=BNP`, { headers: { cookie } });
    expect(res.headers.get('content-type')).toMatch(/text\/csv/);
    expect(res.headers.get('content-disposition')).toMatch(/attachment; filename="plumbline-shortlist-.*\.csv"/);
    const text = (await res.text()).replace(/^\uFEFF/, '');
    expect(text).toContain(`"'=HYPERLINK(""http://evil.example"",""click"")"`);
    expect(text).not.toMatch(/(^|,)"?=HYPERLINK/m);
    const parsed = Papa.parse<string[]>(text.trim(), { skipEmptyLines: true }).data;
    const header = parsed[0]!;
    const rank = header.indexOf('Rank');
    const area = header.indexOf('Gross floor area (ft2)');
    // Numbers are written bare (unquoted, unprefixed) so a spreadsheet reads them as numbers.
    const firstLine = text.split('\r\n')[1]!;
    expect(firstLine.startsWith(`${parsed[1]![rank]},`)).toBe(true);
    expect(Number(parsed[1]![area])).toBeGreaterThan(0);
  });

  it('XLSX has typed cells: numbers as numbers, neutralized text as text', async () => {
    const cookie = await signIn(DEMO.manager);
    const res = await fetch(`${baseUrl()}/api/shortlist?format=xlsx&installation=BNP`, { headers: { cookie } });
    expect(res.status).toBe(200);
    const wb = new ExcelJS.Workbook();
    await wb.xlsx.load(await res.arrayBuffer());
    const ws = wb.getWorksheet('Shortlist')!;
    expect(typeof ws.getRow(2).getCell(1).value).toBe('number');
    const names = ws.getColumn(5).values.filter((v): v is string => typeof v === 'string');
    expect(names.some((n) => n.startsWith("'=HYPERLINK"))).toBe(true);
    expect(names.some((n) => n.startsWith('=HYPERLINK'))).toBe(false);
  });

  it('exports are logged, and roles without export rights are refused', async () => {
    const log = await call('admin', 'GET', '/api/activity?action=export.shortlist-csv');
    expect(log.body.items.length).toBeGreaterThan(0);
    const r = await call('auditor', 'GET', '/api/shortlist?format=csv');
    expect(r.status).toBe(403);
  });
});

describe('weights', () => {
  it('are validated: all zero is refused', async () => {
    const r = await call('manager', 'PUT', '/api/shortlist/weights', { excessEnergy: 0, excessCost: 0, yoyIncrease: 0, anomalies: 0, evaluationAge: 0, manualFlag: 0 });
    expect(r.status).toBe(400);
    expect(r.body.error.message).toMatch(/at least one weight/);
  });
});
