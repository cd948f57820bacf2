/**
 * Child process of bench:rank: fills a fresh data folder with BENCH_BUILDINGS buildings (an
 * electricity, a gas and a water meter each, 36 monthly bills per meter) over synthetic weather,
 * fits every baseline, computes the building metrics and adds a regional manager account.
 * Invented data for the benchmark only.
 */
import { randomUUID } from 'node:crypto';
import { bulkInsert } from '../../../src/db/bulk';
import { closeDatabase, getDb } from '../../../src/db/client';
import { USE_TYPES } from '../../../src/lib/domain';
import { refitBaselines } from '../../../src/server/baselines/run';
import { computeBuildingMetrics } from '../../../src/server/benchmark/metrics';
import { createUser } from '../../../src/server/services/users';
import { dayFromIso, isoFromDay } from '../../../src/lib/weather/day-number';

const N = Number(process.env.BENCH_BUILDINGS ?? 10_000);
const INSTALLATIONS = 10;
const AS_OF = '2026-11-30';
let seed = 12345;
const rnd = () => ((seed = (seed * 1103515245 + 12345) % 2147483648) / 2147483648);

const db = await getDb();
const regionId = randomUUID();
await bulkInsert(db, 'region', [{ name: 'id', type: 'uuid', values: [regionId] }, { name: 'code', type: 'text', values: ['BEN'] }, { name: 'name', type: 'text', values: ['Bench region'] }]);
const inst = Array.from({ length: INSTALLATIONS }, (_, k) => ({ id: randomUUID(), code: `B${String(k).padStart(2, '0')}`, station: randomUUID(), mean: 45 + k * 2.5 }));
await bulkInsert(db, 'installation', [
  { name: 'id', type: 'uuid', values: inst.map((i) => i.id) },
  { name: 'region_id', type: 'uuid', values: inst.map(() => regionId) },
  { name: 'code', type: 'text', values: inst.map((i) => i.code) },
  { name: 'name', type: 'text', values: inst.map((i) => `Bench installation ${i.code}`) },
]);
await bulkInsert(db, 'weather_station', [
  { name: 'id', type: 'uuid', values: inst.map((i) => i.station) },
  { name: 'code', type: 'text', values: inst.map((i) => `${i.code}WX`) },
  { name: 'name', type: 'text', values: inst.map((i) => `Bench station ${i.code}`) },
]);
await bulkInsert(db, 'installation_station', [
  { name: 'installation_id', type: 'uuid', values: inst.map((i) => i.id) },
  { name: 'station_id', type: 'uuid', values: inst.map((i) => i.station) },
]);
const first = dayFromIso('2022-06-01')!;
const last = dayFromIso(AS_OF)!;
const temps = new Map<string, Float64Array>();
for (const i of inst) {
  const t = new Float64Array(last - first + 1);
  for (let d = 0; d < t.length; d++) t[d] = i.mean - 22 * Math.cos((2 * Math.PI * ((first + d) % 365.25 - 15)) / 365.25) + (rnd() - 0.5) * 12;
  temps.set(i.station, t);
  await bulkInsert(db, 'weather_day', [
    { name: 'station_id', type: 'uuid', values: Array.from(t, () => i.station) },
    { name: 'date', type: 'date', values: Array.from(t, (_, d) => isoFromDay(first + d)) },
    { name: 'tmax_f', type: 'float8', values: Array.from(t, (v) => Math.round(v + 9)) },
    { name: 'tmin_f', type: 'float8', values: Array.from(t, (v) => Math.round(v - 9)) },
    { name: 'source', type: 'text', values: Array.from(t, () => 'demo') },
  ]);
}

const buildings = Array.from({ length: N }, (_, k) => ({ id: randomUUID(), inst: inst[k % INSTALLATIONS]!, area: Math.round(5_000 + rnd() * 95_000), use: USE_TYPES[k % 9]!, eval: rnd() < 0.3 ? null : `20${18 + Math.floor(rnd() * 8)}-0${1 + Math.floor(rnd() * 9)}-15` }));
for (let k = 0; k < N; k += 5000) {
  const part = buildings.slice(k, k + 5000);
  await bulkInsert(db, 'building', [
    { name: 'id', type: 'uuid', values: part.map((b) => b.id) },
    { name: 'installation_id', type: 'uuid', values: part.map((b) => b.inst.id) },
    { name: 'number', type: 'text', values: part.map((_, j) => String(k + j + 1000)) },
    { name: 'name', type: 'text', values: part.map((_, j) => `Building ${k + j + 1000}`) },
    { name: 'use_type', type: 'text', values: part.map((b) => b.use) },
    { name: 'gross_area_ft2', type: 'float8', values: part.map((b) => b.area) },
    { name: 'last_evaluated_on', type: 'date', values: part.map((b) => b.eval) },
  ]);
}
const kinds = [
  { c: 'electricity', u: 'kWh', base: 0.03, slope: 0.0008 },
  { c: 'natural_gas', u: 'therm', base: 0.0004, slope: 0.00018 },
  { c: 'water', u: 'kgal', base: 0.00004, slope: 0.0000005 },
] as const;
let bills = 0;
for (let k = 0; k < N; k += 2000) {
  const part = buildings.slice(k, k + 2000);
  const meters = part.flatMap((b) => kinds.map((x) => ({ id: randomUUID(), b, ...x, scale: b.area * (0.6 + rnd() * 1.2) })));
  await bulkInsert(db, 'meter', [
    { name: 'id', type: 'uuid', values: meters.map((m) => m.id) },
    { name: 'installation_id', type: 'uuid', values: meters.map((m) => m.b.inst.id) },
    { name: 'building_id', type: 'uuid', values: meters.map((m) => m.b.id) },
    { name: 'code', type: 'text', values: meters.map((m) => `${m.b.inst.code}-${m.b.id.slice(0, 8)}-${m.c[0]}`) },
    { name: 'commodity', type: 'text', values: meters.map((m) => m.c) },
    { name: 'unit', type: 'text', values: meters.map((m) => m.u) },
  ]);
  const cols = { m: [] as string[], s: [] as string[], e: [] as string[], q: [] as number[], u: [] as string[], c: [] as number[] };
  for (const m of meters) {
    const t = temps.get(m.b.inst.station)!;
    let s = dayFromIso('2023-11-01')! + Math.floor(rnd() * 5);
    for (let p = 0; p < 36; p++) {
      const days = 28 + Math.floor(rnd() * 6);
      let use = 0;
      for (let d = s; d < s + days; d++) use += m.scale * (m.base + m.slope * Math.max(0, 60 - t[d - first]!)) * (1 + (rnd() - 0.5) * 0.1);
      cols.m.push(m.id);
      cols.s.push(isoFromDay(s));
      cols.e.push(isoFromDay(s + days - 1));
      cols.q.push(Math.round(use * 100) / 100);
      cols.u.push(m.u);
      cols.c.push(Math.round(use * (m.c === 'electricity' ? 0.11 : m.c === 'water' ? 9 : 1.2) * 100) / 100);
      s += days;
    }
  }
  await bulkInsert(db, 'bill', [
    { name: 'meter_id', type: 'uuid', values: cols.m },
    { name: 'period_start', type: 'date', values: cols.s },
    { name: 'period_end', type: 'date', values: cols.e },
    { name: 'quantity', type: 'float8', values: cols.q },
    { name: 'unit', type: 'text', values: cols.u },
    { name: 'cost', type: 'float8', values: cols.c },
  ]);
  bills += cols.m.length;
}
const t0 = Date.now();
const fits = await refitBaselines({}, 'bench');
const t1 = Date.now();
const metrics = await computeBuildingMetrics({}, AS_OF);
await createUser(null, { email: 'manager@bench.plumbline.test', name: 'Bench Manager', role: 'regional_manager', installations: [] }, 'bench-password-2026');
await closeDatabase();
console.log(JSON.stringify({ buildings: N, bills, fitSeconds: (t1 - t0) / 1000, fitted: fits.fitted, metricsSeconds: metrics.seconds }));
