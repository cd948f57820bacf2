/** Inventory API: validation names the field and stores nothing; conflicts; edits round-trip. */
import { describe, expect, it } from 'vitest';
import { call } from '../support/http';

async function bnpBuildingCount(): Promise<number> {
  return (await call('admin', 'GET', '/api/buildings?installation=BNP&archived=include')).body.items.length;
}

describe('POST /api/buildings', () => {
  it('rejects a bad body with 400, names each field, and stores nothing', async () => {
    const before = await bnpBuildingCount();
    const r = await call('staff', 'POST', '/api/buildings', { installation: 'BNP', number: '', name: 'X', useType: 'castle', grossAreaFt2: -5, yearBuilt: 1700 });
    expect(r.status).toBe(400);
    expect(r.body.error.code).toBe('invalid_request');
    const fields = r.body.error.details.map((d: { field: string }) => d.field).sort();
    expect(fields).toEqual(['grossAreaFt2', 'number', 'useType', 'yearBuilt']);
    expect(r.body.error.message).toMatch(/grossAreaFt2: must be greater than 0/);
    expect(await bnpBuildingCount()).toBe(before);
  });

  it('answers 415 to a body that is not JSON, and 400 to broken JSON', async () => {
    const a = await call('staff', 'POST', '/api/buildings', undefined, { contentType: 'text/plain', raw: 'number=1' });
    expect([403, 415]).toContain(a.status); // Astro's origin check may refuse text/plain first
    const b = await call('staff', 'POST', '/api/buildings', undefined, { contentType: 'application/json', raw: '{"installation":' });
    expect(b.status).toBe(400);
    expect(b.body.error.message).toMatch(/not valid JSON/);
  });

  it('creates a building, refuses the same number twice with 409, and reads it back', async () => {
    const number = `V${Date.now() % 1_000_000}`;
    const body = { installation: 'BNP', number, name: 'Validation annex', useType: 'warehouse', grossAreaFt2: '12,500'.replace(',', ''), yearBuilt: 1988 };
    const created = await call('staff', 'POST', '/api/buildings', body);
    expect(created.status).toBe(201);
    expect(created.body).toMatchObject({ number, name: 'Validation annex', useType: 'warehouse', grossAreaFt2: 12500, yearBuilt: 1988, installationCode: 'BNP' });
    const again = await call('staff', 'POST', '/api/buildings', body);
    expect(again.status).toBe(409);
    expect(again.body.error.details[0].field).toBe('number');
    const read = await call('manager', 'GET', `/api/buildings/${created.body.id}`);
    expect(read.status).toBe(200);
    expect(read.body.meters).toEqual([]);
  });
});

describe('PATCH /api/buildings/:id', () => {
  it('changes only the fields sent and rejects unknown values', async () => {
    const list = await call('staff', 'GET', '/api/buildings?installation=BNP');
    const b = list.body.items[0];
    const ok = await call('staff', 'PATCH', `/api/buildings/${b.id}`, { occupants: 42 });
    expect(ok.status).toBe(200);
    expect(ok.body).toMatchObject({ id: b.id, number: b.number, name: b.name, occupants: 42 });
    const bad = await call('staff', 'PATCH', `/api/buildings/${b.id}`, { occupants: -1 });
    expect(bad.status).toBe(400);
    expect(bad.body.error.details[0]).toMatchObject({ field: 'occupants' });
    const after = await call('staff', 'GET', `/api/buildings/${b.id}`);
    expect(after.body.occupants).toBe(42);
  });

  it('the regional manager may read but not edit buildings', async () => {
    const list = await call('manager', 'GET', '/api/buildings?installation=BNP');
    const r = await call('manager', 'PATCH', `/api/buildings/${list.body.items[0].id}`, { notes: 'x' });
    expect(r.status).toBe(403);
  });

  it('an id that is not a UUID is simply not found', async () => {
    expect((await call('staff', 'GET', '/api/buildings/not-an-id')).status).toBe(404);
  });
});

describe('meters and bills', () => {
  it('lists meters with code and commodity, and bills with inclusive day counts', async () => {
    const meters = await call('staff', 'GET', '/api/meters?installation=BNP');
    expect(meters.status).toBe(200);
    const m = meters.body.items.find((x: { commodity: string }) => x.commodity === 'electricity');
    expect(m).toMatchObject({ id: expect.any(String), code: expect.any(String), commodity: 'electricity' });
    const bills = await call('staff', 'GET', `/api/bills?meter=${m.id}`);
    expect(bills.body.items.length).toBeGreaterThanOrEqual(36);
    for (const b of bills.body.items) {
      // Bill periods are inclusive of both dates: days = end − start + 1.
      const days = (Date.parse(b.periodEnd) - Date.parse(b.periodStart)) / 86_400_000 + 1;
      expect(b.days).toBe(days);
    }
  });

  it('refuses a unit the commodity is not billed in', async () => {
    const b = (await call('staff', 'GET', '/api/buildings?installation=BNP')).body.items[0];
    const r = await call('staff', 'POST', '/api/meters', { buildingId: b.id, code: `BAD-${Date.now() % 10000}`, commodity: 'water', unit: 'kWh' });
    expect(r.status).toBe(400);
    expect(r.body.error.details).toContainEqual({ field: 'unit', message: 'is not a unit this commodity is billed in' });
  });
});
