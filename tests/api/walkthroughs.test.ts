/**
 * Walkthroughs over HTTP: planning from a building, the list by status, the versioned autosave,
 * photo limits (by the bytes, not the name), findings priced as measures at the dated discount
 * rate, the measure status path, and the reach of scoped roles.
 */
import { beforeAll, describe, expect, it } from 'vitest';
import { call, fileForm } from '../support/http';

interface Building { id: string; number: string; installationCode: string; archived?: boolean }
let buildings: Building[];
let auditorId: string;
/** An installation the demo auditor (BNP and KSL) is not assigned to. */
let elsewhere: string;

const plannedOn = '2027-03-15';
const plan = async (as: string, b: Building, title = `API walkthrough ${Date.now() % 100000}`, extra: Record<string, unknown> = {}) =>
  call(as, 'POST', '/api/walkthroughs', { buildingId: b.id, title, plannedOn, ...extra });
const inInstallation = (code: string) => buildings.find((b) => b.installationCode === code && !b.archived)!;

/** Smallest JPEG-looking bytes: SOI and a JFIF APP0 marker (JPEG File Interchange Format 1.02, §A). */
const JPEG_BYTES = new Uint8Array([0xff, 0xd8, 0xff, 0xe0, 0x00, 0x10, 0x4a, 0x46, 0x49, 0x46, 0x00, 0x01, 0x02, 0x00, 0x00, 0x01, 0x00, 0x01, 0x00, 0x00, 0xff, 0xd9]);
const photoForm = (bytes: Uint8Array, name: string, type: string, tag = 'nameplate') => fileForm({ name, text: bytes, type }, { tag, caption: 'Air handler nameplate' });

beforeAll(async () => {
  buildings = (await call('admin', 'GET', '/api/buildings')).body.items;
  const users = (await call('admin', 'GET', '/api/users')).body.items as { id: string; email: string }[];
  auditorId = users.find((u) => u.email === 'auditor@demo.plumbline.test')!.id;
  const codes = ((await call('admin', 'GET', '/api/installations')).body.items as { code: string }[]).map((i) => i.code);
  elsewhere = codes.find((c) => c !== 'BNP' && c !== 'KSL')!;
});

describe('planning', () => {
  it('creates a planned walkthrough with the auditor, an empty form at version 0, and lists it by status', async () => {
    const b = inInstallation('BNP');
    const r = await plan('manager', b, 'Planned from the API test', { auditorId });
    expect(r.status).toBe(201);
    expect(r.headers.get('location')).toBe(`/api/walkthroughs/${r.body.id}`);
    expect(r.body).toMatchObject({ buildingId: b.id, installationCode: 'BNP', plannedOn, status: 'planned', formVersion: 0, auditor: { id: auditorId } });
    expect(r.body.progress).toEqual({ completed: 0, total: 8 });

    const planned = await call('manager', 'GET', '/api/walkthroughs?status=planned&installation=BNP');
    expect(planned.status).toBe(200);
    const item = planned.body.items.find((i: { id: string }) => i.id === r.body.id);
    expect(item).toMatchObject({ title: 'Planned from the API test', buildingNumber: b.number, status: 'planned', findings: 0, measures: 0, loan: null });
    expect(planned.body.items.every((i: { status: string; installationCode: string }) => i.status === 'planned' && i.installationCode === 'BNP')).toBe(true);
    const done = await call('manager', 'GET', '/api/walkthroughs?status=completed');
    expect(done.body.items.some((i: { id: string }) => i.id === r.body.id)).toBe(false);
  });

  it('refuses an unknown status, a bad date and an auditor not assigned to the installation', async () => {
    expect((await call('manager', 'GET', '/api/walkthroughs?status=finished')).status).toBe(400);
    const bad = await call('manager', 'POST', '/api/walkthroughs', { buildingId: inInstallation('BNP').id, title: 'Bad date', plannedOn: '2027-02-30' });
    expect(bad.status).toBe(400);
    const foreignAuditor = await plan('manager', inInstallation(elsewhere), 'Auditor not assigned here', { auditorId });
    expect([400, 422]).toContain(foreignAuditor.status);
    expect(foreignAuditor.body.error.message).toEqual(expect.any(String));
  });

  it('suggests instruments with a reason in words for every suggestion', async () => {
    const w = await plan('manager', inInstallation('BNP'));
    const s = await call('auditor', 'GET', `/api/walkthroughs/${w.body.id}/suggestions`);
    expect(s.status).toBe(200);
    expect(s.body.instruments.length).toBeGreaterThan(0);
    for (const i of s.body.instruments) {
      expect(['signature', 'routine']).toContain(i.basis);
      expect(i.reasons.length).toBeGreaterThan(0);
      for (const r of i.reasons) expect(r.length).toBeGreaterThan(10);
    }
  });
});

describe('autosave', () => {
  it('saves a section at the current version, then refuses a save made on the old version (409) and keeps the newer form', async () => {
    const w = (await plan('manager', inInstallation('BNP'), 'Autosave test', { auditorId })).body;
    const rows = [{ id: 'row-1', location: 'Office 101', fixture: '2x4 troffer', lampType: 'linear-fluorescent-t12', lampsPerFixture: 3, ballast: 'electronic', fixtureCount: 12, wattsPerFixture: 86, hoursPerYear: 3000 }];
    const first = await call('auditor', 'PATCH', `/api/walkthroughs/${w.id}`, { formVersion: 0, form: { lighting: { completed: true, rows } } });
    expect(first.status).toBe(200);
    expect(first.body.formVersion).toBe(1);
    expect(first.body.progress.completed).toBe(1);
    expect(first.body.status).toBe('in-progress'); // the first save on site starts the walkthrough

    const stale = await call('auditor', 'PATCH', `/api/walkthroughs/${w.id}`, { formVersion: 0, form: { notes: { text: 'made on an old copy' } } });
    expect(stale.status).toBe(409);
    expect(stale.body.error.message).toMatch(/saved from somewhere else/);

    const now = (await call('auditor', 'GET', `/api/walkthroughs/${w.id}`)).body;
    expect(now.formVersion).toBe(1);
    expect(now.form.notes.text).toBe('');
    expect(now.form.lighting.rows[0]).toMatchObject({ fixture: '2x4 troffer', fixtureCount: 12, hoursPerYear: 3000 });
  });

  it('refuses out-of-range values with the field named', async () => {
    const w = (await plan('manager', inInstallation('BNP'), 'Invalid autosave')).body;
    // 8,784 h is a leap year's hours: more lighting hours per year cannot exist. (common practice)
    const r = await call('auditor', 'PATCH', `/api/walkthroughs/${w.id}`, { formVersion: 0, form: { lighting: { rows: [{ id: 'r', hoursPerYear: 9000 }] } } });
    expect(r.status).toBe(400);
    expect(JSON.stringify(r.body.error)).toMatch(/hoursPerYear/);
  });
});

describe('photos', () => {
  let id: string;
  beforeAll(async () => {
    id = (await plan('manager', inInstallation('BNP'), 'Photo test')).body.id;
  });
  const count = async () => (await call('auditor', 'GET', `/api/walkthroughs/${id}/photos`)).body.items.length as number;

  it('stores a JPEG with its tag and serves it back', async () => {
    const r = await call('auditor', 'POST', `/api/walkthroughs/${id}/photos`, photoForm(JPEG_BYTES, 'nameplate.jpg', 'image/jpeg'));
    expect(r.status).toBe(201);
    expect(r.body).toMatchObject({ tag: 'nameplate', mime: 'image/jpeg', bytes: JPEG_BYTES.length });
    const got = await call('auditor', 'GET', `/api/photos/${r.body.id}`);
    expect(got.status).toBe(200);
    expect(got.headers.get('content-type')).toBe('image/jpeg');
  });

  it('refuses a text file named .jpg (415) and stores nothing', async () => {
    const before = await count();
    const fake = new TextEncoder().encode('this is not a photo at all');
    const r = await call('auditor', 'POST', `/api/walkthroughs/${id}/photos`, photoForm(fake, 'holiday.jpg', 'image/jpeg'));
    expect(r.status).toBe(415);
    expect(r.body.error.message).toMatch(/not a .*image, whatever its name says/);
    expect(await count()).toBe(before);
  });

  it('refuses a photo over 15 MB (413) with the limit in the message and stores nothing', async () => {
    const before = await count();
    const big = new Uint8Array(15 * 1024 * 1024 + 1);
    big.set(JPEG_BYTES.subarray(0, 4));
    const r = await call('auditor', 'POST', `/api/walkthroughs/${id}/photos`, photoForm(big, 'huge.jpg', 'image/jpeg'));
    expect(r.status).toBe(413);
    expect(r.body.error.message).toMatch(/15 MB/);
    expect(await count()).toBe(before);
  });

  it('refuses an unknown tag with the accepted tags named', async () => {
    const r = await call('auditor', 'POST', `/api/walkthroughs/${id}/photos`, photoForm(JPEG_BYTES, 'a.jpg', 'image/jpeg', 'selfie'));
    expect(r.status).toBe(400);
    expect(JSON.stringify(r.body.error)).toMatch(/nameplate/);
  });
});

describe('findings and measures', () => {
  let walkthroughId: string;
  let measureId: string;
  beforeAll(async () => {
    // Planned in the past: an implementation date must fall between the walkthrough and today.
    walkthroughId = (await plan('manager', inInstallation('BNP'), 'Measure test', { auditorId, plannedOn: '2026-06-01' })).body.id;
    // A known rate for the economics below; put back the one in force afterwards.
    const before = (await call('admin', 'GET', '/api/settings/discount-rate')).body;
    const set = await call('admin', 'PUT', '/api/settings/discount-rate', { realDiscountRatePercent: 3, effectiveFrom: '2026-04-01', source: 'test rate, 10 CFR 436.14 floor' });
    expect(set.status).toBe(200);
    return async () => {
      await call('admin', 'PUT', '/api/settings/discount-rate', { realDiscountRatePercent: before.realDiscountRatePercent, effectiveFrom: before.effectiveFrom, source: before.source });
    };
  });

  it('the discount rate is bounded 3 %–10 % (10 CFR 436.14)', async () => {
    const low = await call('admin', 'PUT', '/api/settings/discount-rate', { realDiscountRatePercent: 2.5, effectiveFrom: '2026-04-01', source: 'x' });
    expect(low.status).toBe(400);
    const high = await call('admin', 'PUT', '/api/settings/discount-rate', { realDiscountRatePercent: 10.5, effectiveFrom: '2026-04-01', source: 'x' });
    expect(high.status).toBe(400);
    expect((await call('auditor', 'PUT', '/api/settings/discount-rate', { realDiscountRatePercent: 4, effectiveFrom: '2026-04-01', source: 'x' })).status).toBe(403);
  });

  it('a finding priced as a measure gets payback, present value and SIR at the dated rate', async () => {
    const f = await call('auditor', 'POST', `/api/walkthroughs/${walkthroughId}/findings`, { title: 'T12 troffers in the offices', category: 'lighting', location: 'Floor 1' });
    expect(f.status).toBe(201);
    const m = await call('auditor', 'PUT', `/api/findings/${f.body.id}/measure`, {
      savings: [{ commodity: 'electricity', quantity: 15000, unit: 'kWh' }],
      annualEnergyCostSavings: 1500,
      installedCost: 10000,
      lifeYears: 10,
    });
    expect(m.status).toBe(200);
    measureId = m.body.id;
    expect(m.body.status).toBe('proposed');
    const e = m.body.economics;
    expect(e.rate).toMatchObject({ realDiscountRatePercent: 3, effectiveFrom: '2026-04-01' });
    // Simple payback = net investment / annual savings = 10,000 / 1,500 (10 CFR 436.23).
    expect(e.result.simplePaybackYears).toBeCloseTo(6.667, 3);
    // Uniform present value factor, 3 % real, 10 years: 8.530 (NIST Handbook 135, 1995 ed., UPV
    // formula (1 − (1 + d)^−n) / d and its Table A-2 [memory]).
    expect(e.result.upv).toBeCloseTo(8.530, 3);
    // PV of savings = 1,500 × 8.5302 = 12,795; SIR = 12,795 / 10,000 (NIST Handbook 135 §5.5).
    expect(e.result.pvSavingsUsd).toBeCloseTo(12795.3, 0);
    expect(e.result.sir).toBeCloseTo(1.2795, 3);

    const rollup = await call('manager', 'GET', '/api/measures/rollup?installation=BNP');
    expect(rollup.status).toBe(200);
    expect(rollup.body.items[0].installationCode).toBe('BNP');
  });

  it('follows proposed → approved → implemented (dated); the auditor may not approve', async () => {
    expect((await call('auditor', 'POST', `/api/measures/${measureId}/status`, { status: 'approved' })).status).toBe(403);
    const approved = await call('manager', 'POST', `/api/measures/${measureId}/status`, { status: 'approved' });
    expect(approved.status).toBe(200);
    expect(approved.body.status).toBe('approved');
    expect(approved.body.approvedAt).toEqual(expect.any(String));
    const undated = await call('manager', 'POST', `/api/measures/${measureId}/status`, { status: 'implemented' });
    expect(undated.status).toBe(400);
    expect(JSON.stringify(undated.body.error)).toMatch(/implementedOn/);
    const early = await call('manager', 'POST', `/api/measures/${measureId}/status`, { status: 'implemented', implementedOn: '2026-05-01' });
    expect(early.status).toBe(422);
    expect(early.body.error.message).toMatch(/before the walkthrough/);
    const future = await call('manager', 'POST', `/api/measures/${measureId}/status`, { status: 'implemented', implementedOn: '2999-01-01' });
    expect(future.status).toBe(422);
    const done = await call('manager', 'POST', `/api/measures/${measureId}/status`, { status: 'implemented', implementedOn: '2026-07-01' });
    expect(done.status).toBe(200);
    expect(done.body).toMatchObject({ status: 'implemented', implementedOn: '2026-07-01' });
    const list = await call('manager', 'GET', '/api/measures?status=implemented&installation=BNP');
    expect(list.body.items.some((x: { id: string }) => x.id === measureId)).toBe(true);
  });
});

describe('walkthrough status', () => {
  it('completing with open sections answers 409 with the gaps, and completes once acknowledged', async () => {
    const w = (await plan('manager', inInstallation('BNP'), 'Status test')).body;
    expect((await call('auditor', 'POST', `/api/walkthroughs/${w.id}/status`, { status: 'in-progress' })).status).toBe(200);
    const refused = await call('auditor', 'POST', `/api/walkthroughs/${w.id}/status`, { status: 'completed' });
    expect(refused.status).toBe(409);
    expect(refused.body.error.details.reason).toBe('incomplete');
    expect(refused.body.error.details.gaps.length).toBe(8);
    const done = await call('auditor', 'POST', `/api/walkthroughs/${w.id}/status`, { status: 'completed', acknowledgeIncomplete: true });
    expect(done.status).toBe(200);
    expect(done.body.status).toBe('completed');
    const late = await call('auditor', 'PATCH', `/api/walkthroughs/${w.id}`, { formVersion: done.body.formVersion, form: { notes: { text: 'after completion' } } });
    expect(late.status).toBe(409);
  });
});

describe('scope', () => {
  it('an auditor cannot reach a walkthrough of an installation not assigned (404), nor plan or list there', async () => {
    const w = (await plan('admin', inInstallation(elsewhere), 'Elsewhere')).body;
    const get = await call('auditor', 'GET', `/api/walkthroughs/${w.id}`);
    expect([403, 404]).toContain(get.status);
    const save = await call('auditor', 'PATCH', `/api/walkthroughs/${w.id}`, { formVersion: 0, form: { notes: { text: 'no' } } });
    expect([403, 404]).toContain(save.status);
    const photo = await call('auditor', 'POST', `/api/walkthroughs/${w.id}/photos`, photoForm(JPEG_BYTES, 'a.jpg', 'image/jpeg'));
    expect([403, 404]).toContain(photo.status);
    const finding = await call('auditor', 'POST', `/api/walkthroughs/${w.id}/findings`, { title: 'Not mine', category: 'other' });
    expect([403, 404]).toContain(finding.status);
    const list = await call('auditor', 'GET', '/api/walkthroughs');
    expect(list.body.items.some((i: { id: string }) => i.id === w.id)).toBe(false);
    expect(list.body.items.every((i: { installationCode: string }) => ['BNP', 'KSL'].includes(i.installationCode))).toBe(true);
    expect((await call('auditor', 'GET', `/api/walkthroughs?installation=${elsewhere}`)).status).toBe(403);
    // Auditors do not plan.
    expect((await plan('auditor', inInstallation('BNP'))).status).toBe(403);
  });
});
