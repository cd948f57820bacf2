/** The baselines API: the contract for scripts, the analyst's decisions over HTTP, and validation. */
import { describe, expect, it } from 'vitest';
import { call } from '../support/http';

describe('GET /api/baselines', () => {
  it('lists fits with statistics and counts per status for an installation', async () => {
    const r = await call('analyst', 'GET', '/api/baselines?installation=KSL');
    expect(r.status).toBe(200);
    expect(r.body.items.length).toBeGreaterThan(40);
    const b = r.body.items.find((x: { shape: string | null }) => x.shape);
    expect(b).toMatchObject({ meterId: expect.any(String), meterCode: expect.stringMatching(/^KSL-/), commodity: expect.any(String), r2: expect.any(Number), cvrmse: expect.any(Number), nac: expect.any(Number), status: expect.any(String) });
    expect(Object.keys(r.body.counts).sort()).toEqual(['accepted', 'failing-criteria', 'insufficient-data', 'needs-review']);
  });

  it('answers the fits of one building with the full statistics', async () => {
    const b = (await call('analyst', 'GET', '/api/buildings?installation=SBP')).body.items[0];
    const r = await call('analyst', 'GET', `/api/baselines/${b.id}`);
    expect(r.status).toBe(200);
    expect(r.body.building.number).toBe(b.number);
    const fit = r.body.items[0].fit;
    expect(fit.selected.coefficients[0]).toMatchObject({ name: 'intercept', estimate: expect.any(Number), standardError: expect.any(Number), pValue: expect.any(Number) });
    expect(fit.selected.quality).toMatchObject({ n: expect.any(Number), totalDays: expect.any(Number), r2: expect.any(Number), adjR2: expect.any(Number) });
    expect(fit.acceptance.cvrmse.threshold).toBe(0.2);
  });
});

describe('decisions over HTTP', () => {
  it('a decision without a note is refused, naming the field; with one it is recorded', async () => {
    const list = await call('analyst', 'GET', '/api/baselines?installation=FHS&status=needs-review');
    const meterId = list.body.items[0].meterId;
    const bad = await call('analyst', 'POST', '/api/baseline-decisions', { meterId, action: 'accept', note: '' });
    expect(bad.status).toBe(400);
    expect(bad.body.error.details[0].field).toBe('note');
    const ok = await call('analyst', 'POST', '/api/baseline-decisions', { meterId, action: 'accept', note: 'checked against the criteria' });
    expect(ok.status).toBe(201);
    expect(ok.body.status).toBe('accepted');
    const log = await call('admin', 'GET', '/api/activity?action=baseline.accept');
    expect(log.body.items.some((e: { entityId: string }) => e.entityId === meterId)).toBe(true);
  });

  it('a baseline period shorter than a year is refused', async () => {
    const list = await call('analyst', 'GET', '/api/baselines?installation=FHS');
    const r = await call('analyst', 'POST', '/api/baseline-periods', { meterId: list.body.items[0].meterId, start: '2024-01-01', end: '2024-06-30', note: 'too short' });
    expect(r.status).toBe(400);
    expect(r.body.error.message).toMatch(/12 months/);
  });

  it('the regional manager reads baselines but may not decide', async () => {
    const list = await call('manager', 'GET', '/api/baselines?installation=DMF');
    expect(list.status).toBe(200);
    const r = await call('manager', 'POST', '/api/baseline-decisions', { meterId: list.body.items[0].meterId, action: 'accept', note: 'not mine to say' });
    expect(r.status).toBe(403);
  });
});
