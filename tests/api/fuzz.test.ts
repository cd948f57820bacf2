/**
 * Bad input over HTTP on the built server, generated with fast-check: malformed bill CSVs, Green
 * Button feeds and upload forms on POST /api/imports, malformed weather CSVs on a station's
 * observations upload, and malformed bodies on every route that reads a JSON body. Nothing may answer 5xx; a refusal is a 4xx with `{ error: { code, message } }`; and a
 * refused request writes nothing (the bills, the resource behind the route and the fuzzing
 * account's activity log are compared before and after). The base files are the constructed
 * fixtures tests/fixtures/imports/messy-bills.csv and tests/fixtures/schemas/greenbutton-dmd-example.xml.
 *
 * To add a route that reads a JSON body: add an entry to JSON_ROUTES keyed `METHOD /api/path`
 * as the file declares it (`[param]` kept), with the concrete path, a body the route accepts
 * (never sent; mutated into bad ones), the route's schema as `accepts`, and GET probes (each must
 * answer 200) of what the route would change. The route list comes from the files under
 * src/pages/api, so a new JSON route without an entry fails the first test here; an entry whose
 * file is absent is skipped. Each route must refuse some bodies with 400 (they reached validation).
 */
import { existsSync, readFileSync } from 'node:fs';
import { join } from 'node:path';
import fc from 'fast-check';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { z } from 'zod';
import { priorityWeightsSchema } from '../../src/lib/benchmark/priority-weights';
import { discountRateSettingSchema } from '../../src/lib/economics/discount-rate';
import { findingInputSchema, findingPatchSchema, formSaveSchema, photoPatchSchema, walkthroughPlanPatchSchema, walkthroughPlanSchema, walkthroughStatusChangeSchema } from '../../src/lib/field/walkthrough-api';
import { instrumentInputSchema, instrumentPatchSchema, kitInputSchema, kitPatchSchema, loanRequestSchema, loanTransitionSchema } from '../../src/lib/kits/schemas';
import { measureInputSchema, measureStatusChangeSchema } from '../../src/lib/savings/measure-input';
import { acceptanceSettingSchema, baselineDecisionSchema, baselinePeriodSchema, baselineRunSchema } from '../../src/lib/schemas/baselines';
import { savedMappingSchema } from '../../src/lib/schemas/imports';
import { buildingInputSchema, buildingPatchSchema, installationInputSchema, installationPatchSchema, installationTargetSchema, meterInputSchema, meterPatchSchema } from '../../src/lib/schemas/inventory';
import { flagInputSchema } from '../../src/lib/schemas/shortlist';
import { userInputSchema, userPatchSchema } from '../../src/lib/schemas/users';
import { fetchRangeSchema, stationInputSchema } from '../../src/lib/schemas/weather';
import { malformedBytes } from '../support/fuzz-inputs';
import { baseUrl, call, DEMO_PASSWORD, fileForm, freshAccount } from '../support/http';
import { apiRoutes } from '../support/routes';
import { ROOT } from '../support/server-process';

const RUNS = 200;
const stamp = Date.now().toString(36).slice(-5).toUpperCase();
const fixture = (p: string) => readFileSync(join(ROOT, 'tests', 'fixtures', p), 'utf8');
const day = (n: number) => new Date(Date.now() + n * 86_400_000).toISOString().slice(0, 10);
/** Smallest JPEG-looking bytes: SOI and a JFIF APP0 marker (JPEG File Interchange Format 1.02, §A). */
const JPEG_BYTES = new Uint8Array([0xff, 0xd8, 0xff, 0xe0, 0x00, 0x10, 0x4a, 0x46, 0x49, 0x46, 0x00, 0x01, 0x02, 0x00, 0x00, 0x01, 0x00, 0x01, 0x00, 0x00, 0xff, 0xd9]);

interface Setup {
  fuzzer: string; // e-mail of a fresh administrator used for every fuzzed request
  buildingId: string;
  /** Meters (ids and codes) of the fuzz building: one set for CSV files, one for Green Button feeds. */
  meters: Record<Kind, MeterSet>;
  station: string;
  targetUserId: string;
  /** A demo meter with a baseline, for the baseline decisions and periods. */
  baselineMeterId: string;
  /** The kit library and a walkthrough of the fuzz building, for the routes that change them. */
  kitId: string;
  instrumentId: string;
  loanId: string;
  walkthroughId: string;
  findingId: string;
  measureId: string;
  photoId: string;
}
type Kind = 'csv' | 'xml' | 'form';
interface MeterSet {
  ids: { E: string; G: string; W: string };
  codes: { E: string; G: string; W: string };
}
let s: Setup;

async function ok<T = any>(p: Promise<{ status: number; body: T }>, status = 201): Promise<T> {
  const r = await p;
  if (r.status !== status) throw new Error(`setup: ${r.status} ${JSON.stringify(r.body)}`);
  return r.body;
}

beforeAll(async () => {
  const fuzzer = (await freshAccount('admin', [], DEMO_PASSWORD)).email;
  const building = await ok(call('admin', 'POST', '/api/buildings', { installation: 'BNP', number: `FZ${stamp}`, name: 'Fuzz annex', useType: 'office', grossAreaFt2: 10_000 }));
  const meterSet = async (kind: Kind): Promise<MeterSet> => {
    const codes = { E: `FZ${stamp}-${kind}-E`, G: `FZ${stamp}-${kind}-G`, W: `FZ${stamp}-${kind}-W` };
    const meter = async (code: string, commodity: string, unit: string): Promise<string> => (await ok(call('admin', 'POST', '/api/meters', { buildingId: building.id, code, commodity, unit }))).id;
    return { codes, ids: { E: await meter(codes.E, 'electricity', 'kWh'), G: await meter(codes.G, 'natural_gas', 'therm'), W: await meter(codes.W, 'water', 'kgal') } };
  };
  const meters = { csv: await meterSet('csv'), xml: await meterSet('xml'), form: await meterSet('form') };
  const station = `FZ${stamp}`;
  await ok(call('admin', 'POST', '/api/weather/stations', { code: station, name: 'Fuzz station', installation: 'BNP' }));
  const target = await ok(call('admin', 'POST', '/api/users', { email: `target.${stamp.toLowerCase()}@fuzz.test`, name: 'Fuzz Target', role: 'analyst' }));
  const baselines = await ok(call('admin', 'GET', '/api/baselines?installation=BNP'), 200);
  const baselineMeterId: string = baselines.items.at(-1).meterId;
  const kit = await ok(call('admin', 'POST', '/api/kits', { code: `FZ${stamp}`, name: 'Fuzz kit', homeLocation: 'Store' }));
  const instrument = await ok(call('admin', 'POST', '/api/instruments', { kitId: kit.id, type: 'light_meter', model: 'M', serial: `FZ${stamp}-1`, calibrationDue: day(400) }));
  const walkthrough = await ok(call('admin', 'POST', '/api/walkthroughs', { buildingId: building.id, title: 'Fuzz walkthrough', plannedOn: day(30) }));
  const finding = await ok(call('admin', 'POST', `/api/walkthroughs/${walkthrough.id}/findings`, { title: 'Fuzz finding', category: 'lighting' }));
  const measure = await ok(call('admin', 'PUT', `/api/findings/${finding.id}/measure`, { savings: [{ commodity: 'electricity', quantity: 1000, unit: 'kWh' }], annualEnergyCostSavings: 100, installedCost: 500, lifeYears: 10 }), 200);
  const photo = await ok(call('admin', 'POST', `/api/walkthroughs/${walkthrough.id}/photos`, fileForm({ name: 'fuzz.jpg', text: JPEG_BYTES, type: 'image/jpeg' }, { tag: 'nameplate', caption: 'Fuzz photo', findingId: finding.id })));
  const loan = await ok(call('admin', 'POST', '/api/loans', { kitId: kit.id, start: day(60), end: day(62), purpose: 'Fuzz loan', installation: 'BNP' }));
  s = {
    fuzzer, buildingId: building.id, meters, station, targetUserId: target.id, baselineMeterId,
    kitId: kit.id, instrumentId: instrument.id, loanId: loan.id, walkthroughId: walkthrough.id, findingId: finding.id, measureId: measure.id, photoId: photo.id,
  };
}, 120_000);

/** Everything stored for one set of fuzz meters. */
async function billsFingerprint(kind: Kind): Promise<{ count: number; text: string }> {
  const lists = await Promise.all(Object.values(s.meters[kind].ids).map(async (id) => (await call(s.fuzzer, 'GET', `/api/bills?meter=${id}`)).body.items as unknown[]));
  return { count: lists.reduce((n, l) => n + l.length, 0), text: JSON.stringify(lists) };
}

interface ActivityItem {
  id: number;
  actor: string;
  action: string;
}

/** The newest id in the activity log (every write the API makes is logged). */
async function lastActivityId(): Promise<number> {
  const r = await call('admin', 'GET', '/api/activity?limit=1');
  return (r.body.items as ActivityItem[])[0]?.id ?? 0;
}

/** Entries the fuzzing account caused after `since`, sign-ins left out. */
async function activityOfFuzzerSince(since: number): Promise<ActivityItem[]> {
  const r = await call('admin', 'GET', '/api/activity?limit=1000');
  return (r.body.items as ActivityItem[]).filter((i) => i.id > since && i.actor === s.fuzzer && !i.action.startsWith('auth.'));
}

function expectErrorShape(r: { status: number; body: any }): void {
  expect(r.body?.error, JSON.stringify(r.body).slice(0, 300)).toBeTypeOf('object');
  expect(typeof r.body.error.code === 'string' && r.body.error.code.length > 0).toBe(true);
  expect(typeof r.body.error.message === 'string' && r.body.error.message.length > 0).toBe(true);
}

describe('uploads: POST /api/imports (dryRun false) and weather observations, with malformed files', () => {
  const csv = fixture('imports/messy-bills.csv');
  const xml = fixture('schemas/greenbutton-dmd-example.xml');
  const csvMapping = JSON.stringify({ meter: 'Meter', periodStart: 'Period Start', periodEnd: 'period END', quantity: 'USAGE', unit: 'unit', cost: 'Total Cost', estimated: 'EST?' });

  // The bills after one request are the bills before the next (only this file writes to these meters).
  const last: Partial<Record<Kind, { count: number; text: string }>> = {};
  const outcomes: Record<Kind, { stored: number; refused: number }> = { csv: { stored: 0, refused: 0 }, xml: { stored: 0, refused: 0 }, form: { stored: 0, refused: 0 } };

  afterAll(() => {
    // Both outcomes must occur, or the property only ever saw one branch.
    console.log(`[fuzz] imports (stored / refused): ${Object.entries(outcomes).map(([k, o]) => `${k} ${o.stored}/${o.refused}`).join(', ')}`);
    for (const o of Object.values(outcomes)) if (o.stored + o.refused === RUNS) expect(Math.min(o.stored, o.refused)).toBeGreaterThan(0);
  });

  async function property(kind: Kind, bytes: Uint8Array, file: { name: string; type: string }, mapping: string | null, extra: Record<string, string> = {}): Promise<void> {
    const before = last[kind] ?? (await billsFingerprint(kind));
    const fields: Record<string, string> = { installation: 'BNP', dryRun: 'false', ...extra };
    if (mapping !== null) fields.mapping = mapping;
    const r = await call(s.fuzzer, 'POST', '/api/imports', fileForm({ name: file.name, text: bytes, type: file.type }, fields));
    const after = await billsFingerprint(kind);
    last[kind] = after;
    expect(r.status, JSON.stringify(r.body).slice(0, 300)).toBeLessThan(500);
    outcomes[kind][r.status < 300 ? 'stored' : 'refused']++;
    if (r.status === 200) {
      expect(r.body.status).toBe('dry-run');
      expect(after.text).toBe(before.text);
    } else if (r.status === 201) {
      expect(r.body.status).toBe('committed');
      const c = r.body.counts;
      expect(c.new + c.changed + c.unchanged + c.rejected).toBe(c.rows);
      for (const p of r.body.problems) {
        expect(Number.isInteger(p.row)).toBe(true);
        expect(p.column === null || typeof p.column === 'string').toBe(true);
        expect(typeof p.code === 'string' && typeof p.message === 'string' && p.message.length > 0).toBe(true);
      }
      // All of the import or none: exactly its new bills were added.
      expect(after.count).toBe(before.count + c.new);
    } else {
      expect(r.status).toBeGreaterThanOrEqual(400);
      expectErrorShape(r);
      expect(after.text).toBe(before.text);
    }
  }

  it.concurrent(`${RUNS} malformed bill CSVs: a committed import or a 4xx that stores no bill`, async () => {
    const { codes } = s.meters.csv;
    const base = csv.replaceAll('B-101-E', codes.E).replaceAll('B-205-G', codes.G).replaceAll('B-310-W', codes.W);
    await fc.assert(
      fc.asyncProperty(malformedBytes(base), fc.boolean(), (bytes, withMapping) => property('csv', bytes, { name: 'fuzz.csv', type: 'text/csv' }, withMapping ? csvMapping : null)),
      { numRuns: RUNS },
    );
  }, 120_000);

  it.concurrent(`${RUNS} malformed Green Button feeds: a committed import or a 4xx that stores no bill`, async () => {
    const { codes } = s.meters.xml;
    const mapping = JSON.stringify({ electricity: codes.E, natural_gas: codes.G, water: codes.W });
    await fc.assert(
      fc.asyncProperty(malformedBytes(xml), fc.boolean(), (bytes, withMapping) => property('xml', bytes, { name: 'feed.xml', type: 'application/xml' }, withMapping ? mapping : null)),
      { numRuns: RUNS },
    );
  }, 120_000);

  it.concurrent(`${RUNS} malformed upload forms (installation, mapping, dryRun, progressKey, file name and type)`, async () => {
    const { codes } = s.meters.form;
    const file = `meter,period_start,period_end,quantity,unit\n${codes.E},2019-01-01,2019-01-31,100,kWh\n${codes.G},2019-01-01,2019-01-31,7,therm\n`;
    const text = (samples: string[]) =>
      fc.oneof({ arbitrary: fc.constantFrom(...samples), weight: 6 }, fc.string({ unit: 'binary', maxLength: 40 }), fc.integer({ min: 300, max: 30_000 }).map((n) => 'x'.repeat(n)));
    const mapping = fc.oneof(
      fc.constant(null),
      text(['', '{}', '[]', 'null', '{"meter":1}', '{"meter":"meter"}', '{"meter":"a\\u0000"}', '{"__proto__":{"meter":"meter"}}', '{"constructor":"x"}']),
      fc.dictionary(fc.string({ maxLength: 12 }), fc.jsonValue({ maxDepth: 2 })).map((d) => JSON.stringify(d)),
    );
    // Each field is mostly right, so that a good share of the forms differ from a valid one in one field.
    const field = (good: string, bad: string[]) => fc.oneof({ arbitrary: fc.constant(good), weight: 3 }, text(bad));
    const fields = fc.record({
      installation: field('BNP', ['bnp', ' BNP ', 'KSL', 'NOPE', '', 'B\u0000NP']),
      dryRun: field('false', ['true', 'TRUE', '1', '']),
      progressKey: field(`fuzz-${stamp}`, ['short', '../../etc', 'a\u0000bcdefghij']),
    }, { requiredKeys: [] });
    const name = text(['bills.csv', '', '../../x.csv', 'a\u0000b.csv', 'név\r\n.csv', 'x'.repeat(300)]);
    const type = fc.constantFrom('text/csv', 'application/octet-stream', 'application/xml', '', 'text/csv; charset=utf-16');
    await fc.assert(
      fc.asyncProperty(fields, mapping, name, type, (f, m, n, t) => property('form', new TextEncoder().encode(file), { name: n, type: t }, m, f as Record<string, string>)),
      { numRuns: RUNS },
    );
  }, 120_000);

  it.concurrent(`${RUNS} malformed daily-summaries CSVs (POST /api/weather/stations/[code]/observations): stored with counts that add up, or a 4xx that stores no day`, async () => {
    const base = fixture('imports/weather-daily-summaries.csv').replaceAll('XXC00000001', s.station);
    // What the station holds: its coverage and gaps, and degree days over the fixture's span (values).
    const weather = async () => {
      const [detail, dd] = await Promise.all([
        call(s.fuzzer, 'GET', `/api/weather/stations/${s.station}`),
        call(s.fuzzer, 'GET', `/api/weather/degree-days?station=${s.station}&start=2023-01-01&end=2025-12-31`),
      ]);
      return JSON.stringify([detail.status, detail.body, dd.status, dd.body]);
    };
    let before = await weather();
    const tally = { stored: 0, refused: 0 };
    await fc.assert(
      fc.asyncProperty(malformedBytes(base), fc.constantFrom('standard', 'metric'), async (bytes, units) => {
        const r = await call(s.fuzzer, 'POST', `/api/weather/stations/${s.station}/observations`, fileForm({ name: 'weather.csv', text: bytes }, { units }));
        const after = await weather();
        expect(r.status, JSON.stringify(r.body).slice(0, 300)).toBeLessThan(500);
        if (r.status === 201) {
          tally.stored++;
          const c = r.body.counts;
          expect(c.new + c.changed + c.unchanged + c.rejected).toBe(c.rows);
          for (const p of r.body.problems) expect(Number.isInteger(p.row) && typeof p.code === 'string' && p.message.length > 0).toBe(true);
        } else {
          tally.refused++;
          expect(r.status).toBeGreaterThanOrEqual(400);
          expectErrorShape(r);
          expect(after).toBe(before);
        }
        before = after;
      }),
      { numRuns: RUNS },
    );
    console.log(`[fuzz] weather observations (stored / refused): ${tally.stored}/${tally.refused}`);
    expect(Math.min(tally.stored, tally.refused)).toBeGreaterThan(0);
  }, 120_000);
});

describe('regressions found by the fuzzing (U+0000, which PostgreSQL text and jsonb cannot store)', () => {
  it('a JSON body with NUL in a text field is a 400 naming the field, and nothing is saved', async () => {
    const before = await call(s.fuzzer, 'GET', '/api/mappings?installation=BNP');
    const r = await call(s.fuzzer, 'POST', '/api/mappings', { installation: 'BNP', name: 'nul\u0000name', mapping: { meter: 'Meter' } });
    expect(r.status).toBe(400);
    expect(r.body.error.details).toEqual([{ field: 'name', message: expect.stringMatching(/NUL/) }]);
    expect((await call(s.fuzzer, 'GET', '/api/mappings?installation=BNP')).body).toEqual(before.body);
    const patch = await call(s.fuzzer, 'PATCH', `/api/buildings/${s.buildingId}`, { notes: 'x\u0000y' });
    expect(patch.status).toBe(400);
    expect(patch.body.error.message).toMatch(/notes: contains the NUL character/);
  });

  it('an upload whose file name holds NUL is read, and stored under the name without it', async () => {
    const csv = `meter,period_start,period_end,quantity,unit\n${s.meters.form.codes.E},2018-01-01,2018-01-31,100,kWh\n`;
    const r = await call(s.fuzzer, 'POST', '/api/imports', fileForm({ name: 'a\u0000b.csv', text: csv }, { installation: 'BNP', dryRun: 'true' }));
    expect(r.status).toBe(200);
    const one = await call(s.fuzzer, 'GET', `/api/imports/${r.body.id}`);
    expect(one.body.fileName).toBe('ab.csv');
  });

  it('a Green Button mapping to a meter code holding NUL is a 400', async () => {
    const xml = fixture('schemas/greenbutton-dmd-example.xml');
    const r = await call(s.fuzzer, 'POST', '/api/imports', fileForm({ name: 'feed.xml', text: xml, type: 'application/xml' }, { installation: 'BNP', dryRun: 'false', mapping: '{"electricity":"A\\u0000"}' }));
    expect(r.status).toBe(400);
    expect(r.body.error.message).toMatch(/mapping/);
  });

  it('a Green Button feed with NUL in a title is refused as malformed XML (XML 1.0 §2.2 excludes U+0000)', async () => {
    const xml = fixture('schemas/greenbutton-dmd-example.xml').replace('<title>Building 101 - electric service</title>', '<title>Building 101\u0000</title>');
    const r = await call(s.fuzzer, 'POST', '/api/imports', fileForm({ name: 'feed.xml', text: xml, type: 'application/xml' }, { installation: 'BNP', dryRun: 'false' }));
    expect(r.status).toBe(422);
    expect(r.body.error.details.reason).toBe('malformed-xml');
  });
});

// ---------------------------------------------------------------------------------------------
// JSON bodies

/** `METHOD /api/path` of every export that reads a JSON body (readJson), from the route files. */
function jsonBodyRoutes(): string[] {
  const pages = join(ROOT, 'src', 'pages');
  return apiRoutes().filter((route) => {
    const [method, path] = route.split(' ') as [string, string];
    const file = [`${path}.ts`, `${path}/index.ts`, `${path}.js`, `${path}/index.js`].map((f) => join(pages, f)).find(existsSync)!;
    const src = readFileSync(file, 'utf8');
    const exports = [...src.matchAll(/export const (GET|POST|PUT|PATCH|DELETE|ALL)\b/g)];
    // A helper above the first export that reads the body counts for every write method.
    if (src.slice(0, exports[0]?.index ?? 0).includes('readJson(') && method !== 'GET') return true;
    const i = exports.findIndex((m) => m[1] === method);
    return src.slice(exports[i]!.index, exports[i + 1]?.index ?? src.length).includes('readJson(');
  });
}

interface Probe {
  path: string;
  /** The part of the answer the route could change (leaves out figures other tests move). */
  pick?: (body: any) => unknown;
}

interface JsonRouteSpec {
  path: () => string;
  /** A body the route accepts. It is never sent: bad bodies are made from it. */
  valid: () => Record<string, unknown>;
  /** The route's own validation (the schema its handler reads the body with). */
  accepts: (value: unknown) => boolean;
  probes: () => Probe[];
}

const passes = (schema: z.ZodType) => (v: unknown) => schema.safeParse(v).success;
const byId = (id: () => string) => (body: any) => body.items.find((i: { id: string }) => i.id === id());
/** Every decision and period choice is recorded with its actor; other test files decide on demo baselines too. */
const decisionsOfFuzzer = (body: any) => body.decisions.filter((d: { actor: string }) => d.actor === s.fuzzer);

const JSON_ROUTES: Record<string, JsonRouteSpec> = {
  'POST /api/users': {
    path: () => '/api/users',
    valid: () => ({ email: `new.${stamp.toLowerCase()}@fuzz.test`, name: 'Fuzz Person', role: 'analyst', installations: ['BNP'] }),
    accepts: passes(userInputSchema),
    probes: () => [{ path: '/api/users', pick: (b) => b.items.filter((u: { email: string }) => u.email.endsWith('@fuzz.test')) }],
  },
  'PATCH /api/users/[id]': {
    path: () => `/api/users/${s.targetUserId}`,
    valid: () => ({ name: 'Fuzz Renamed', role: 'auditor', installations: ['BNP'], banned: false }),
    accepts: passes(userPatchSchema),
    probes: () => [{ path: '/api/users', pick: byId(() => s.targetUserId) }],
  },
  'PUT /api/shortlist/weights': {
    path: () => '/api/shortlist/weights',
    valid: () => ({ excessEnergy: 1, excessCost: 1, yoyIncrease: 1, anomalies: 1, evaluationAge: 1, manualFlag: 1 }),
    accepts: passes(priorityWeightsSchema),
    probes: () => [{ path: '/api/shortlist/weights' }],
  },
  'POST /api/buildings': {
    path: () => '/api/buildings',
    valid: () => ({ installation: 'BNP', number: `FZN${stamp}`, name: 'Fuzz new', useType: 'office', grossAreaFt2: 5000, yearBuilt: 1990, occupants: 10, lastEvaluatedOn: '2024-01-01', notes: '' }),
    accepts: passes(buildingInputSchema),
    probes: () => [{ path: '/api/buildings?installation=BNP', pick: (b) => b.items.filter((x: { number: string }) => x.number.startsWith('FZ')) }],
  },
  'PATCH /api/buildings/[id]': {
    path: () => `/api/buildings/${s.buildingId}`,
    valid: () => ({ name: 'Fuzz annex 2', useType: 'office', grossAreaFt2: 12_000, yearBuilt: 1970, occupants: 5, notes: 'x', archived: false }),
    accepts: passes(buildingPatchSchema),
    probes: () => [{ path: `/api/buildings/${s.buildingId}` }],
  },
  'PUT /api/targets/[code]': {
    path: () => '/api/targets/BNP',
    valid: () => ({ baselineFy: 2024, reductionPct: 30, targetFy: 2030 }),
    accepts: passes(installationTargetSchema),
    probes: () => [{ path: '/api/targets', pick: (b) => b.items.map((i: Record<string, unknown>) => Object.fromEntries(Object.entries(i).filter(([k]) => /code|target/i.test(k)))) }],
  },
  'POST /api/baseline-periods': {
    path: () => '/api/baseline-periods',
    valid: () => ({ meterId: s.baselineMeterId, start: '2023-01-01', end: '2024-01-01', note: 'fuzz period' }),
    accepts: passes(baselinePeriodSchema),
    probes: () => [{ path: `/api/baselines/meter/${s.baselineMeterId}`, pick: decisionsOfFuzzer }],
  },
  'POST /api/meters': {
    path: () => '/api/meters',
    valid: () => ({ buildingId: s.buildingId, code: `FZ${stamp}-X`, commodity: 'electricity', unit: 'kWh', account: 'A1', heatContentKbtuPerUnit: null }),
    accepts: passes(meterInputSchema),
    probes: () => [{ path: '/api/meters?installation=BNP', pick: (b) => b.items.filter((m: { code: string }) => m.code.startsWith(`FZ${stamp}`)) }],
  },
  'PATCH /api/meters/[id]': {
    path: () => `/api/meters/${s.meters.csv.ids.G}`,
    valid: () => ({ code: `FZ${stamp}-G2`, account: 'A2', unit: 'ccf', heatContentKbtuPerUnit: null, active: false }),
    accepts: passes(meterPatchSchema),
    probes: () => [{ path: `/api/meters/${s.meters.csv.ids.G}`, pick: (b) => [b.code, b.account, b.unit, b.heatContentKbtuPerUnit, b.active] }],
  },
  'POST /api/installations': {
    path: () => '/api/installations',
    valid: () => ({ code: `FZ${stamp}`, name: 'Fuzz installation', climate: '', timeZone: 'America/Chicago', address: '' }),
    accepts: passes(installationInputSchema),
    probes: () => [{ path: '/api/installations', pick: (b) => b.items.map((i: { code: string }) => i.code) }],
  },
  'PATCH /api/installations/[code]': {
    path: () => '/api/installations/BNP',
    valid: () => ({ name: 'Renamed', climate: 'cold', timeZone: 'America/Chicago', address: 'x' }),
    accepts: passes(installationPatchSchema),
    probes: () => [{ path: '/api/installations/BNP', pick: (b) => [b.code, b.name, b.climate, b.timeZone, b.address] }],
  },
  'POST /api/baselines/run': {
    path: () => '/api/baselines/run',
    valid: () => ({ installation: 'BNP' }),
    accepts: passes(baselineRunSchema),
    probes: () => [{ path: '/api/baselines/run', pick: (b) => String(b.trigger ?? '').includes(s.fuzzer) }],
  },
  'PUT /api/settings/baseline-acceptance': {
    path: () => '/api/settings/baseline-acceptance',
    valid: () => ({ maxCvrmse: 0.2, minPeriods: 12, minDays: 365 }),
    accepts: passes(acceptanceSettingSchema),
    probes: () => [{ path: '/api/settings/baseline-acceptance' }],
  },
  'POST /api/weather/stations/[code]/fetch': {
    path: () => `/api/weather/stations/${s.station}/fetch`,
    valid: () => ({ start: '2024-01-01', end: '2024-12-31' }),
    accepts: passes(fetchRangeSchema),
    probes: () => [{ path: '/api/weather/stations', pick: (b) => b.items.find((x: { code: string }) => x.code === s.station) }],
  },
  'POST /api/weather/stations': {
    path: () => '/api/weather/stations',
    valid: () => ({ code: `FZN${stamp}`, name: 'Fuzz new station', latitude: 40, longitude: -90, elevationFt: 600, serviceId: null, installation: 'BNP' }),
    accepts: passes(stationInputSchema),
    probes: () => [{ path: '/api/weather/stations', pick: (b) => b.items.map((x: { code: string }) => x.code).sort() }],
  },
  'POST /api/flags': {
    path: () => '/api/flags',
    valid: () => ({ buildingId: s.buildingId, reason: 'fuzz flag reason' }),
    accepts: passes(flagInputSchema),
    probes: () => [{ path: `/api/flags?building=${s.buildingId}` }],
  },
  'POST /api/baseline-decisions': {
    path: () => '/api/baseline-decisions',
    valid: () => ({ meterId: s.baselineMeterId, action: 'accept', note: 'fuzz decision' }),
    accepts: passes(baselineDecisionSchema),
    probes: () => [{ path: `/api/baselines/meter/${s.baselineMeterId}`, pick: decisionsOfFuzzer }],
  },
  'POST /api/mappings': {
    path: () => '/api/mappings',
    valid: () => ({ installation: 'BNP', name: 'Fuzz mapping', mapping: { meter: 'Meter' } }),
    accepts: passes(savedMappingSchema),
    probes: () => [{ path: '/api/mappings?installation=BNP', pick: (b) => b.items.map((m: { name: string }) => m.name).sort() }],
  },
  'POST /api/kits': {
    path: () => '/api/kits',
    valid: () => ({ code: `FZN${stamp}`, name: 'Fuzz new kit', description: 'd', homeLocation: 'Store' }),
    accepts: passes(kitInputSchema),
    probes: () => [{ path: '/api/kits', pick: (b) => b.items.filter((k: { code: string }) => k.code.startsWith('FZ')) }],
  },
  'PATCH /api/kits/[id]': {
    path: () => `/api/kits/${s.kitId}`,
    valid: () => ({ code: `FZ${stamp}-2`, name: 'Fuzz kit 2', description: 'd', homeLocation: 'Shelf', active: false }),
    accepts: passes(kitPatchSchema),
    probes: () => [{ path: `/api/kits/${s.kitId}` }],
  },
  'POST /api/instruments': {
    path: () => '/api/instruments',
    valid: () => ({ kitId: s.kitId, type: 'light_meter', model: 'M', serial: `FZ${stamp}-2`, calibrationDue: '2030-01-01', condition: 'good', notes: '' }),
    accepts: passes(instrumentInputSchema),
    probes: () => [
      { path: `/api/instruments?kit=${s.kitId}&retired=include` },
      { path: '/api/instruments?kit=none&retired=include', pick: (b) => b.items.filter((i: { serial: string }) => i.serial.startsWith('FZ')) },
    ],
  },
  'PATCH /api/instruments/[id]': {
    path: () => `/api/instruments/${s.instrumentId}`,
    valid: () => ({ kitId: null, type: 'light_meter', model: 'M2', serial: `FZ${stamp}-3`, calibrationDue: '2030-01-01', condition: 'needs-repair', notes: 'n' }),
    accepts: passes(instrumentPatchSchema),
    probes: () => [{ path: `/api/instruments/${s.instrumentId}` }, { path: `/api/kits/${s.kitId}` }],
  },
  'POST /api/loans': {
    path: () => '/api/loans',
    valid: () => ({ kitId: s.kitId, start: day(90), end: day(92), purpose: 'Fuzz request', walkthroughId: s.walkthroughId, installation: 'BNP' }),
    accepts: passes(loanRequestSchema),
    probes: () => [{ path: `/api/loans?kit=${s.kitId}` }, { path: `/api/kits/${s.kitId}` }],
  },
  'POST /api/loans/[id]/transition': {
    path: () => `/api/loans/${s.loanId}/transition`,
    valid: () => ({ to: 'approved', note: 'n', conditions: [{ instrumentId: s.instrumentId, condition: 'good' }] }),
    accepts: passes(loanTransitionSchema),
    probes: () => [{ path: `/api/loans/${s.loanId}` }, { path: `/api/instruments/${s.instrumentId}` }],
  },
  'POST /api/walkthroughs': {
    path: () => '/api/walkthroughs',
    valid: () => ({ buildingId: s.buildingId, title: 'Fuzz plan', plannedOn: '2027-03-15', auditorId: null, flagId: null }),
    accepts: passes(walkthroughPlanSchema),
    probes: () => [{ path: `/api/walkthroughs?building=${s.buildingId}` }],
  },
  // An autosave (the body names formVersion) or a change of plan, as the handler decides.
  'PATCH /api/walkthroughs/[id]': {
    path: () => `/api/walkthroughs/${s.walkthroughId}`,
    valid: () => ({ formVersion: 0, form: { notes: { completed: true, text: 'fuzz notes' }, controls: { bas: 'partial', occupiedHeatingSetpointF: 68 } } }),
    accepts: (v) => {
      const r = z.record(z.string(), z.unknown()).safeParse(v);
      return r.success && passes('formVersion' in r.data ? formSaveSchema : walkthroughPlanPatchSchema)(r.data);
    },
    probes: () => [{ path: `/api/walkthroughs/${s.walkthroughId}` }],
  },
  'POST /api/walkthroughs/[id]/status': {
    path: () => `/api/walkthroughs/${s.walkthroughId}/status`,
    valid: () => ({ status: 'in-progress', acknowledgeIncomplete: false, note: 'n' }),
    accepts: passes(walkthroughStatusChangeSchema),
    probes: () => [{ path: `/api/walkthroughs/${s.walkthroughId}` }],
  },
  'POST /api/walkthroughs/[id]/findings': {
    path: () => `/api/walkthroughs/${s.walkthroughId}/findings`,
    valid: () => ({ title: 'Fuzz new finding', category: 'hvac', location: 'Roof', description: 'd' }),
    accepts: passes(findingInputSchema),
    probes: () => [{ path: `/api/walkthroughs/${s.walkthroughId}/findings` }],
  },
  'PATCH /api/findings/[id]': {
    path: () => `/api/findings/${s.findingId}`,
    valid: () => ({ title: 'Fuzz finding 2', category: 'hvac', location: 'L', description: 'D', status: 'dismissed' }),
    accepts: passes(findingPatchSchema),
    probes: () => [{ path: `/api/walkthroughs/${s.walkthroughId}/findings`, pick: byId(() => s.findingId) }],
  },
  'PUT /api/findings/[id]/measure': {
    path: () => `/api/findings/${s.findingId}/measure`,
    valid: () => ({
      title: 'Fuzz measure',
      savings: [{ commodity: 'electricity', quantity: 2000, unit: 'kWh' }],
      annualEnergyCostSavings: 200,
      annualWaterCostSavings: 0,
      annualOmCostSavings: -10,
      installedCost: 900,
      incentives: 50,
      lifeYears: 12,
      energyEscalationPercent: 1,
    }),
    accepts: passes(measureInputSchema),
    probes: () => [{ path: `/api/measures/${s.measureId}` }],
  },
  'POST /api/measures/[id]/status': {
    path: () => `/api/measures/${s.measureId}/status`,
    valid: () => ({ status: 'implemented', implementedOn: '2027-01-01', note: 'n' }),
    accepts: passes(measureStatusChangeSchema),
    probes: () => [{ path: `/api/measures/${s.measureId}` }],
  },
  'PATCH /api/photos/[id]': {
    path: () => `/api/photos/${s.photoId}`,
    valid: () => ({ tag: 'lighting', caption: 'c', findingId: null }),
    accepts: passes(photoPatchSchema),
    probes: () => [{ path: `/api/walkthroughs/${s.walkthroughId}/photos`, pick: byId(() => s.photoId) }],
  },
  'PUT /api/settings/discount-rate': {
    path: () => '/api/settings/discount-rate',
    valid: () => ({ realDiscountRatePercent: 4, effectiveFrom: '2026-10-01', source: `Fuzz rate ${stamp}` }),
    accepts: passes(discountRateSettingSchema),
    // Whether the rate in force came from a fuzzed body: the walkthrough tests set and restore the
    // rate while this file runs, so the rate itself may move (the activity log catches any write).
    probes: () => [{ path: '/api/settings/discount-rate', pick: (b) => String(b.source).includes(stamp) }],
  },
};

interface BodyCase {
  text: string;
  contentType: string | null;
}

const JSON_TYPE = 'application/json';
const nested = (n: number, open: string, close: string, inner = '1') => open.repeat(n) + inner + close.repeat(n);

/** Values of the wrong type or size for any field. */
const wrongValue: fc.Arbitrary<unknown> = fc.oneof(
  fc.constantFrom(null, true, false, 0, -1, 1e308, -1e308, 2 ** 53 + 1, '', ' ', '0', 'null', 'NaN', '1e309', [], {}, [null], { $gt: '' }),
  fc.integer(),
  fc.double({ noNaN: true, noDefaultInfinity: true }),
  fc.string({ unit: 'binary', maxLength: 40 }),
  fc.integer({ min: 2_001, max: 60_000 }).map((n) => 'x'.repeat(n)),
  fc.array(fc.jsonValue({ maxDepth: 2 }), { maxLength: 5 }),
  fc.dictionary(fc.string({ maxLength: 8 }), fc.jsonValue({ maxDepth: 2 }), { maxKeys: 4 }),
  fc.integer({ min: 50, max: 2000 }).map((n) => JSON.parse(nested(n, '[', ']'))),
);

const POLLUTION_KEYS = ['__proto__', 'constructor', 'prototype', 'toString', 'hasOwnProperty'] as const;

function bodyCases(valid: Record<string, unknown>): fc.Arbitrary<BodyCase> {
  const keys = Object.keys(valid);
  const asJson = (v: unknown): BodyCase => ({ text: JSON.stringify(v) ?? '', contentType: JSON_TYPE });
  const validText = JSON.stringify(valid);
  return fc.oneof(
    // Any JSON value, and any object of arbitrary keys.
    fc.jsonValue({ maxDepth: 4 }).map(asJson),
    fc.anything({ maxDepth: 3, withBigInt: false, withMap: false, withSet: false, withTypedArray: false }).map((v) => {
      try {
        return asJson(v);
      } catch {
        return asJson(String(v));
      }
    }),
    // One field of the wrong type or size, or missing.
    fc.tuple(fc.constantFrom(...keys), wrongValue).map(([k, v]) => asJson({ ...valid, [k]: v })),
    fc.constantFrom(...keys).map((k) => asJson(Object.fromEntries(Object.entries(valid).filter(([x]) => x !== k)))),
    // A NUL character (U+0000) inside a text field or a key of an otherwise valid body.
    fc.tuple(fc.constantFrom(...keys), fc.nat()).map(([k, at]) => {
      const v = valid[k];
      const text = typeof v === 'string' ? v : JSON.stringify(v);
      const i = at % (text.length + 1);
      return asJson({ ...valid, [k]: `${text.slice(0, i)}\u0000${text.slice(i)}` });
    }),
    fc.constantFrom('\u0000', 'a\u0000', '\u0000__proto__').map((k) => asJson({ ...valid, [k]: 'x' })),
    // Prototype-pollution keys as own JSON keys (raw text: JSON.parse keeps "__proto__" as a key).
    fc.tuple(fc.constantFrom(...POLLUTION_KEYS), fc.jsonValue({ maxDepth: 2 }), fc.constantFrom(...keys)).map(([k, v, drop]) => {
      const rest = JSON.stringify(Object.fromEntries(Object.entries(valid).filter(([x]) => x !== drop)));
      const polluted = JSON.stringify({ role: 'admin', isAdmin: true, installations: ['BNP'], polluted: v });
      return { text: `{${JSON.stringify(k)}:${polluted}${rest.length > 2 ? ',' : ''}${rest.slice(1)}`, contentType: JSON_TYPE };
    }),
    fc.constantFrom(...POLLUTION_KEYS).map((k) => ({ text: `{"constructor":{"prototype":{"polluted":true}},${JSON.stringify(k)}:{"polluted":true}}`, contentType: JSON_TYPE })),
    // Deep nesting, as the whole body or inside a field.
    fc.integer({ min: 100, max: 30_000 }).map((n) => ({ text: nested(n, '[', ']'), contentType: JSON_TYPE })),
    fc.tuple(fc.constantFrom(...keys), fc.integer({ min: 100, max: 10_000 })).map(([k, n]) => ({ text: `{${JSON.stringify(k)}:${nested(n, '{"a":', '}')}}`, contentType: JSON_TYPE })),
    // Text that is not JSON.
    fc.string({ unit: 'binary', maxLength: 200 }).map((t) => ({ text: t, contentType: JSON_TYPE })),
    fc.integer({ min: 0, max: validText.length - 1 }).map((n) => ({ text: validText.slice(0, n), contentType: JSON_TYPE })),
    fc.constantFrom(`\ufeff${validText}`, `${validText}}`, `${validText},`, validText.replaceAll('"', "'"), `[${validText}`, 'NaN', 'undefined', '{"a":1,}', '{"a":01}', '{"a":"\\u12"}', '\u0000').map((t) => ({ text: t, contentType: JSON_TYPE })),
    // A valid body under a content type that is not JSON (or none).
    fc.constantFrom('text/plain', 'application/x-www-form-urlencoded', 'multipart/form-data; boundary=x', 'application/xml', 'text/json', null).map((t) => ({ text: validText, contentType: t })),
  );
}

function isMalformed(c: BodyCase, accepts: (v: unknown) => boolean): boolean {
  if (c.contentType === null || !/^application\/json\b/i.test(c.contentType)) return true;
  try {
    // PostgreSQL text and jsonb cannot store U+0000 (PostgreSQL docs §8.3, §8.14): a body with
    // it in any string or key is refused.
    let nul = false;
    // The server reads the body with Request.text(), whose UTF-8 decode drops a leading BOM
    // (WHATWG Encoding, "UTF-8 decode"; RFC 8259 §8.1 lets a parser ignore it).
    const value: unknown = JSON.parse(c.text.replace(/^\ufeff/, ''), (k, v: unknown) => {
      if (k.includes('\u0000') || (typeof v === 'string' && v.includes('\u0000'))) nul = true;
      return v;
    });
    return nul || !accepts(value);
  } catch {
    return true;
  }
}

async function send(method: string, path: string, c: BodyCase): Promise<{ status: number; body: any }> {
  // A Blob without a type sends no Content-Type header at all.
  if (c.contentType === null) return call(s.fuzzer, method, path, undefined, { raw: new Blob([c.text]) });
  return call(s.fuzzer, method, path, undefined, { raw: c.text, contentType: c.contentType });
}

async function snapshot(spec: JsonRouteSpec): Promise<unknown[]> {
  return Promise.all(
    spec.probes().map(async (p) => {
      // A probe that finds nothing would compare equal whatever happened.
      const r = await call(s.fuzzer, 'GET', p.path);
      expect(r.status, `probe ${p.path}`).toBe(200);
      const body = p.pick ? p.pick(r.body) : r.body;
      expect(body, `probe ${p.path}`).toBeDefined();
      return body;
    }),
  );
}

describe('JSON bodies', () => {
  const present = jsonBodyRoutes();

  it('every route that reads a JSON body has a fuzz entry (JSON_ROUTES)', () => {
    expect(present.length).toBeGreaterThan(10);
    expect(present.filter((r) => !(r in JSON_ROUTES))).toEqual([]);
  });

  it('each entry describes a body its route accepts (else the mutations would prove nothing)', () => {
    for (const [route, spec] of Object.entries(JSON_ROUTES)) expect(spec.accepts(spec.valid()), route).toBe(true);
  });

  for (const [route, spec] of Object.entries(JSON_ROUTES)) {
    const [method, pattern] = route.split(' ') as [string, string];
    (present.includes(route) ? it.concurrent : it.skip)(`${route}: ${RUNS} malformed bodies → 4xx with an error, nothing written`, async () => {
      const before = await snapshot(spec);
      const since = await lastActivityId();
      const statuses: Record<number, number> = {};
      await fc.assert(
        fc.asyncProperty(bodyCases(spec.valid()).filter((c) => isMalformed(c, spec.accepts)), async (c) => {
          const r = await send(method, spec.path(), c);
          expect(r.status, `${pattern} ${c.contentType} ${c.text.slice(0, 200)} → ${JSON.stringify(r.body).slice(0, 300)}`).toBeGreaterThanOrEqual(400);
          expect(r.status).toBeLessThan(500);
          expectErrorShape(r);
          statuses[r.status] = (statuses[r.status] ?? 0) + 1;
        }),
        { numRuns: RUNS },
      );
      console.log(`[fuzz] ${route}: ${JSON.stringify(statuses)}`);
      // Bodies reached validation (a route that refused them all for another reason, say a 403 or
      // a 404 for its path, would prove nothing about its body).
      expect(statuses[400] ?? 0).toBeGreaterThan(0);
      expect(await snapshot(spec)).toEqual(before);
      expect(await activityOfFuzzerSince(since)).toEqual([]);
      // The server still answers normally after the batch.
      expect((await fetch(`${baseUrl()}/api/health`)).status).toBe(200);
    }, 120_000);
  }
});
