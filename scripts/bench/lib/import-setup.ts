/**
 * Child process of bench:import: creates and migrates a fresh database in PLUMBLINE_DATA_DIR,
 * adds an installation with BENCH_METERS electricity meters, and writes the bill file of
 * BENCH_ROWS rows to the path given as the first argument. Run apart so that neither initdb nor
 * the generation of the test file counts in the importing process's memory.
 */
import { writeFileSync } from 'node:fs';
import { bulkInsert } from '../../../src/db/bulk';
import { closeDatabase, getDb } from '../../../src/db/client';
import { installation, region } from '../../../src/db/schema';
import { dayFromIso, isoFromDay } from '../../../src/lib/weather/day-number';

const ROWS = Number(process.env.BENCH_ROWS);
const MONTHS = 36;
const METERS = Math.ceil(ROWS / MONTHS);
const out = process.argv[2]!;

const db = await getDb();
const [reg] = await db.insert(region).values({ code: 'BEN', name: 'Bench region' }).returning();
const [inst] = await db.insert(installation).values({ regionId: reg!.id, code: 'BENCH', name: 'Bench installation', timeZone: 'UTC' }).returning();
const buildingCount = Math.ceil(METERS / 3);
const buildingIds = Array.from({ length: buildingCount }, () => crypto.randomUUID());
await bulkInsert(db, 'building', [
  { name: 'id', type: 'uuid', values: buildingIds },
  { name: 'installation_id', type: 'uuid', values: buildingIds.map(() => inst!.id) },
  { name: 'number', type: 'text', values: buildingIds.map((_, i) => `B${i}`) },
  { name: 'name', type: 'text', values: buildingIds.map((_, i) => `Building ${i}`) },
  { name: 'use_type', type: 'text', values: buildingIds.map(() => 'office') },
  { name: 'gross_area_ft2', type: 'float8', values: buildingIds.map(() => 10_000) },
]);
const meterCodes = Array.from({ length: METERS }, (_, i) => `M${String(i).padStart(6, '0')}-E`);
await bulkInsert(db, 'meter', [
  { name: 'installation_id', type: 'uuid', values: meterCodes.map(() => inst!.id) },
  { name: 'building_id', type: 'uuid', values: meterCodes.map((_, i) => buildingIds[i % buildingCount]) },
  { name: 'code', type: 'text', values: meterCodes },
  { name: 'commodity', type: 'text', values: meterCodes.map(() => 'electricity') },
  { name: 'unit', type: 'text', values: meterCodes.map(() => 'kWh') },
]);
await closeDatabase();

// 36 consecutive monthly bills per meter (irregular 28-33 day reads), US dates, $ costs.
const lines: string[] = ['Meter,Start Date,End Date,Usage,Unit,Amount,Peak kW,Estimated'];
const firstDay = dayFromIso('2022-01-03')!;
let rows = 0;
for (let m = 0; m < METERS && rows < ROWS; m++) {
  let start = firstDay + (m % 5);
  for (let k = 0; k < MONTHS && rows < ROWS; k++, rows++) {
    const days = 28 + ((m * 7 + k * 3) % 6);
    const end = start + days - 1;
    const q = 20_000 + ((m * 131 + k * 977) % 15_000);
    const [y, mo, d] = isoFromDay(start).split('-');
    const [y2, mo2, d2] = isoFromDay(end).split('-');
    lines.push(`${meterCodes[m]},${Number(mo)}/${Number(d)}/${y},${Number(mo2)}/${Number(d2)}/${y2},${q},kWh,$${(q * 0.11).toFixed(2)},${(q / 300).toFixed(1)},N`);
    start = end + 1;
  }
}
writeFileSync(out, lines.join('\r\n') + '\r\n');
console.log(JSON.stringify({ rows, meters: METERS, installationId: inst!.id }));
