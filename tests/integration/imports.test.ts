/**
 * Bill import end to end on the database: a messy file's dry run stores nothing; commit, re-import,
 * change and undo return the bills to their exact prior state; Green Button feeds import to the
 * kWh and therms of the feed; unreadable files are refused without a trace in the bills.
 */
import { readFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { sql } from 'drizzle-orm';
import { beforeAll, describe, expect, it } from 'vitest';
import { getDb, queryRows } from '../../src/db/client';
import { building, meter } from '../../src/db/schema';
import { HttpError } from '../../src/server/http';
import { importBills, type BillImportRequest } from '../../src/server/imports/bills';
import { getImport, undoCommittedImport } from '../../src/server/imports/service';
import type { Actor } from '../../src/server/authz';
import { actor, twoInstallations } from '../support/fixtures';

const fixture = (name: string) => new Uint8Array(readFileSync(fileURLToPath(new URL(`../fixtures/${name}`, import.meta.url))));
const messy = fixture('imports/messy-bills.csv');
const messyMapping = { meter: 'meter', periodStart: 'PERIOD START', periodEnd: 'Period End', quantity: 'Usage', unit: 'Unit', cost: 'total cost', estimated: 'Est?' };

let fx: Awaited<ReturnType<typeof twoInstallations>>;
let staff: Actor;
let req: (bytes: Uint8Array, dryRun: boolean, mapping?: Record<string, string>) => BillImportRequest;

/** Every column of every bill, in a stable order: "exact prior state" means equal to this. */
async function snapshot() {
  return queryRows<Record<string, unknown>>(await getDb(), sql`select * from bill order by id`);
}

beforeAll(async () => {
  fx = await twoInstallations();
  staff = await actor('installation_staff', [fx.a.id]);
  const db = await getDb();
  const [b] = await db.insert(building).values({ installationId: fx.a.id, number: '101', name: 'Messy Hall', useType: 'office', grossAreaFt2: 5000 }).returning();
  await db.insert(meter).values([
    { installationId: fx.a.id, buildingId: b!.id, code: 'B-101-E', commodity: 'electricity', unit: 'kWh' },
    { installationId: fx.a.id, buildingId: b!.id, code: 'B-205-G', commodity: 'natural_gas', unit: 'therm' },
    { installationId: fx.a.id, buildingId: b!.id, code: 'B-310-W', commodity: 'water', unit: 'kgal' },
  ]);
  req = (bytes, dryRun, mapping = messyMapping) => ({ installation: { id: fx.a.id, code: 'AAA' }, fileName: 'messy-bills.csv', bytes, mapping, dryRun, today: '2026-11-30' });
});

describe('a messy file', () => {
  it('dry run: lists every problem by file line and stores nothing', async () => {
    const before = await snapshot();
    const r = await importBills(staff, req(messy, true));
    expect(r.status).toBe('dry-run');
    expect(r.counts).toMatchObject({ rows: 10, new: 7, changed: 0, unchanged: 0, rejected: 3 });
    // Row problems as read by hand from the fixture (see tests/unit/formats/bill-csv-messy.test.ts).
    const rowProblems = r.problems.filter((p) => p.column !== null).map((p) => [p.row, p.column, p.code, p.severity]);
    expect(rowProblems).toEqual([
      [7, 'period END', 'impossible-date', 'error'],
      [8, 'USAGE', 'negative-quantity', 'warning'],
      [9, 'USAGE', 'ambiguous-number', 'warning'],
      [10, 'USAGE', 'cost-without-quantity', 'error'],
      [11, 'unit', 'unknown-unit', 'error'],
    ]);
    // Series findings: the estimated March read on lines 4 and 13.
    expect(r.problems.filter((p) => p.code === 'estimated-read').map((p) => p.row)).toEqual([4, 13]);
    expect(await snapshot()).toEqual(before);
    const record = await getImport(staff, r.id);
    expect(record.status).toBe('dry-run');
  });

  it('commit, re-import, change and undo: bills return to their exact prior state', async () => {
    const initial = await snapshot();
    const first = await importBills(staff, req(messy, false));
    expect(first.status).toBe('committed');
    expect(first.counts).toMatchObject({ new: 7, changed: 0, rejected: 3 });
    const afterFirst = await snapshot();
    expect(afterFirst.length).toBe(initial.length + 7);

    // The same file again changes nothing.
    const again = await importBills(staff, req(messy, false));
    expect(again.counts).toMatchObject({ new: 0, changed: 0, unchanged: 7 });
    expect(await snapshot()).toEqual(afterFirst);

    // A corrected April electricity bill is an update, shown as such.
    const corrected = new TextDecoder().decode(messy).replace('1 020;B-101-E', '1 030;B-101-E');
    const second = await importBills(staff, req(new TextEncoder().encode(corrected), false));
    expect(second.counts).toMatchObject({ new: 0, changed: 1, unchanged: 6 });
    const db = await getDb();
    const april = await queryRows(db, sql`select quantity, import_id from bill where period_start = '2024-04-01' and unit = 'kWh'`);
    expect(april).toEqual([{ quantity: 1030, import_id: second.id }]);

    // The older import cannot be undone while the later one holds a bill it created.
    await expect(undoCommittedImport(staff, first.id)).rejects.toMatchObject({ status: 409 });
    const undone2 = await undoCommittedImport(staff, second.id);
    expect(undone2).toMatchObject({ status: 'undone', removed: 0, restored: 1 });
    expect(await snapshot()).toEqual(afterFirst);
    const undone1 = await undoCommittedImport(staff, first.id);
    expect(undone1).toMatchObject({ status: 'undone', removed: 7, restored: 0 });
    expect(await snapshot()).toEqual(initial);
    await expect(undoCommittedImport(staff, first.id)).rejects.toMatchObject({ status: 409 });
  });

  it('stays inside the actor’s installations', async () => {
    const other = await actor('installation_staff', [fx.b.id]);
    const r = await importBills(staff, req(messy, true));
    await expect(getImport(other, r.id)).rejects.toBeInstanceOf(HttpError);
  });
});

describe('files that cannot be read', () => {
  it.each([
    ['an empty file', new Uint8Array(0), 'empty-file'],
    ['a PDF', new TextEncoder().encode('%PDF-1.7\n%âãÏÓ\n1 0 obj\n'), 'not-csv'],
    ['binary bytes', Uint8Array.from({ length: 400 }, (_, i) => (i * 37) % 256), 'binary-file'],
    ['a CSV without bill columns', new TextEncoder().encode('colour,shape\nred,round\n'), 'no-mappable-columns'],
  ])('%s is refused with a reason and stores no bill', async (_label, bytes, reason) => {
    const before = await snapshot();
    const r = await importBills(staff, { ...req(bytes, false), mapping: undefined });
    expect(r.status).toBe('failed');
    expect(r.failure?.reason).toBe(reason);
    expect(r.failure?.message.length).toBeGreaterThan(10);
    expect(await snapshot()).toEqual(before);
  });
});

describe('Green Button', () => {
  it('imports the sample feed to the kWh and therms it states', async () => {
    const db = await getDb();
    const feed = fixture('schemas/greenbutton-dmd-example.xml');
    const r = await importBills(staff, {
      installation: { id: fx.a.id, code: 'AAA' },
      fileName: 'greenbutton.xml',
      bytes: feed,
      mapping: { electricity: 'B-101-E', natural_gas: 'B-205-G' },
      dryRun: false,
      today: '2026-11-30',
    });
    expect(r.kind).toBe('green-button');
    expect(r.counts.rejected).toBe(0);
    const sums = await queryRows<{ unit: string; q: number; c: number }>(db, sql`select unit, sum(quantity)::float8 as q, sum(cost)::float8 as c from bill where import_id = ${r.id} group by unit order by unit`);
    // Hand arithmetic from the feed: electricity (412345 + 398760 + 405112) Wh × 10^0 / 1000 = 1216.217 kWh;
    // gas 18734 × 10^-2 = 187.34 therm (uom 169). Costs are in hundred-thousandths of a dollar.
    const byUnit = Object.fromEntries(sums.map((x) => [x.unit, x]));
    expect(byUnit.kWh!.q).toBeCloseTo(1216.217, 9);
    expect(byUnit.therm!.q).toBeCloseTo(187.34, 9);
    expect(byUnit.kWh!.c).toBeCloseTo(144.12171, 9);
    expect(byUnit.therm!.c).toBeCloseTo(196.707, 9);
  });

  it('refuses usage points that are not mapped to a meter', async () => {
    const r = await importBills(staff, { installation: { id: fx.a.id, code: 'AAA' }, fileName: 'gb.xml', bytes: fixture('schemas/greenbutton-dmd-example.xml'), mapping: {}, dryRun: true, today: '2026-11-30' });
    expect(r.counts.new).toBe(0);
    expect(r.problems.every((p) => p.code === 'unmapped-usage-point' && p.severity === 'error')).toBe(true);
  });
});
