/**
 * POST /api/imports over HTTP, as scripts use it: the contract's answer, dry run then commit then
 * undo, the history, the report, and every kind of bad upload refused with a clear message and
 * nothing stored.
 */
import { describe, expect, it } from 'vitest';
import { call, fileForm } from '../support/http';

// Periods before the demo's first bills, so they are new; one bad line (a date that does not exist).
const CSV = [
  'Account/Meter,From,To,Usage (kWh),Total Charges,Est?',
  'BNP-3134-E,1/3/2021,2/1/2021,"41,250","$4,903.10",N',
  'BNP-3134-E,2/2/2021,3/3/2021,"39,870","$4,744.55",N',
  'BNP-3134-E,3/4/2021,4/31/2021,"35,100","$4,170.00",N',
  'BNP-3134-E,4/2/2021,5/3/2021,"33,420","$3,990.05",Y',
  '',
].join('\r\n');
const MAPPING = JSON.stringify({ meter: 'Account/Meter', periodStart: 'From', periodEnd: 'To', quantity: 'Usage (kWh)', cost: 'Total Charges', estimated: 'Est?' });

async function bills() {
  const meters = await call('staff', 'GET', '/api/meters?installation=BNP');
  const m = meters.body.items.find((x: { code: string }) => x.code === 'BNP-3134-E');
  return (await call('staff', 'GET', `/api/bills?meter=${m.id}`)).body.items as { periodStart: string; quantity: number }[];
}

describe('POST /api/imports', () => {
  it('dry run, commit, history, report and undo', async () => {
    const before = await bills();
    const dry = await call('staff', 'POST', '/api/imports', fileForm({ name: 'portal.csv', text: CSV }, { installation: 'BNP', mapping: MAPPING, dryRun: 'true' }));
    expect(dry.status).toBe(200);
    expect(dry.body).toMatchObject({ id: expect.any(String), dryRun: true, counts: { rows: 4, new: 3, changed: 0, unchanged: 0, rejected: 1 } });
    expect(dry.body.problems).toContainEqual(expect.objectContaining({ row: 4, column: 'To', code: 'impossible-date', severity: 'error', message: expect.stringContaining('4/31/2021') }));
    for (const p of dry.body.problems) expect(Object.keys(p).sort()).toEqual(['code', 'column', 'message', 'row', 'severity']);
    expect(await bills()).toEqual(before);

    const done = await call('staff', 'POST', '/api/imports', fileForm({ name: 'portal.csv', text: CSV }, { installation: 'BNP', mapping: MAPPING, dryRun: 'false' }));
    expect(done.status).toBe(201);
    expect(done.body.counts).toMatchObject({ new: 3, rejected: 1 });
    const after = await bills();
    expect(after.length).toBe(before.length + 3);
    expect(after.find((b) => b.periodStart === '2021-01-03')?.quantity).toBe(41250);

    const list = await call('staff', 'GET', '/api/imports?installation=BNP');
    expect(list.body.items.map((i: { id: string }) => i.id)).toContain(done.body.id);
    const one = await call('staff', 'GET', `/api/imports/${done.body.id}`);
    expect(one.body).toMatchObject({ status: 'committed', fileName: 'portal.csv', uploadedByEmail: 'staff@demo.plumbline.test' });

    const report = await fetch(`${(await import('../support/http')).baseUrl()}/api/imports/${done.body.id}/report`, { headers: { cookie: await (await import('../support/http')).signIn('staff@demo.plumbline.test') } });
    expect(report.headers.get('content-type')).toMatch(/text\/csv/);
    expect(await report.text()).toMatch(/4,"To","error","impossible-date"/);

    const original = await call('staff', 'GET', `/api/imports/${done.body.id}/original`);
    expect(original.status).toBe(200);
    expect(original.body).toBe(CSV);

    const undo = await call('staff', 'DELETE', `/api/imports/${done.body.id}`);
    expect(undo.status).toBe(200);
    expect(undo.body).toMatchObject({ status: 'undone', removed: 3, restored: 0 });
    expect(await bills()).toEqual(before);
    expect((await call('staff', 'DELETE', `/api/imports/${done.body.id}`)).status).toBe(409);
  });
});

describe('bad uploads are refused and store nothing', () => {
  it.each([
    ['no file', () => { const f = new FormData(); f.set('installation', 'BNP'); return f; }, 400, /file: attach a file/],
    ['an empty file', () => fileForm({ name: 'e.csv', text: '' }, { installation: 'BNP' }), 400, /empty/],
    ['a mapping that is not JSON', () => fileForm({ name: 'b.csv', text: CSV }, { installation: 'BNP', mapping: '{meter:' }), 400, /mapping: must be a JSON object/],
    ['an installation that does not exist', () => fileForm({ name: 'b.csv', text: CSV }, { installation: 'NOPE' }), 404, /No installation with code NOPE/],
    ['another installation', () => fileForm({ name: 'b.csv', text: CSV }, { installation: 'KSL' }), 403, /not assigned to installation KSL/],
    ['a PDF', () => fileForm({ name: 'bill.pdf', text: '%PDF-1.7\n1 0 obj\n', type: 'application/pdf' }, { installation: 'BNP' }), 422, /PDF/],
    ['XML that is not a Green Button feed', () => fileForm({ name: 'x.xml', text: '<?xml version="1.0"?><root><a>1</a></root>', type: 'application/xml' }, { installation: 'BNP' }), 422, /Green Button|usage/i],
    ['a CSV without bill columns', () => fileForm({ name: 'c.csv', text: 'colour,shape\nred,round\n' }, { installation: 'BNP' }), 422, /looks like a bill column/],
  ])('%s', async (_label, form, status, message) => {
    const before = await bills();
    const r = await call('staff', 'POST', '/api/imports', form());
    expect(r.status).toBe(status);
    expect(r.body.error.message).toMatch(message);
    expect(await bills()).toEqual(before);
  });

  it('a body that is not multipart gets 415', async () => {
    const r = await call('staff', 'POST', '/api/imports', { installation: 'BNP' });
    expect(r.status).toBe(415);
  });

  it('a file over the size limit gets 413', async () => {
    const big = new Uint8Array(51 * 1024 * 1024).fill(0x41);
    const r = await call('staff', 'POST', '/api/imports', fileForm({ name: 'big.csv', text: big }, { installation: 'BNP' }));
    expect(r.status).toBe(413);
    expect(r.body.error.message).toMatch(/50 MB/);
  });

  it('roles without intake rights are refused', async () => {
    const r = await call('auditor', 'POST', '/api/imports', fileForm({ name: 'b.csv', text: CSV }, { installation: 'BNP' }));
    expect(r.status).toBe(403);
  });
});
