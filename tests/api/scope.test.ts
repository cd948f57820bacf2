/**
 * Every API route, without a session and as installation staff of one installation reaching for
 * another installation's data. The route list is read from src/pages/api, so a new route without
 * an entry here fails the test.
 */
import { beforeAll, describe, expect, it } from 'vitest';
import { generateDemoScenario } from '../../src/db/seed/scenario';
import { apiRoutes } from '../support/routes';
import { call, fileForm, type CallResult } from '../support/http';

interface SideFixture {
  installation: string;
  building: string;
  meter: string;
  meterCode: string;
  station: string;
  dryRun: string;
  committed: string;
  mapping: string;
  /** A walkthrough with a finding priced as a measure, a photo, and a spare finding and photo to delete. */
  walkthrough: string;
  finding: string;
  spareFinding: string;
  measure: string;
  photo: string;
  sparePhoto: string;
}
interface KitFixture {
  kit: string;
  instrument: string;
  /** A kit only the loan requests of this test use. */
  requestKit: string;
  /** Loans requested by BNP's staff (own) and for KSL (foreign). */
  loan: { own: string; foreign: string };
}
interface Fixture {
  own: SideFixture;
  foreign: SideFixture;
  staffUserId: string;
  kits: KitFixture;
}
let fx: Fixture;

beforeAll(async () => {
  const buildings = (await call('admin', 'GET', '/api/buildings')).body.items as { id: string; installationCode: string }[];
  const meters = (await call('admin', 'GET', '/api/meters')).body.items as { id: string; installationCode: string }[];
  const users = (await call('admin', 'GET', '/api/users')).body.items as { id: string; email: string }[];
  // For each side: an import checked and one committed (a bill after the demo's last), and a saved mapping.
  const pick = async (code: string): Promise<SideFixture> => {
    const m = (meters as { id: string; code: string; installationCode: string; commodity?: string }[]).find((x) => x.installationCode === code && x.code.endsWith('-E'))!;
    const csv = `Meter,Start,End,Usage\n${m.code},2026-12-01,2026-12-30,100\n`;
    const dry = await call('admin', 'POST', '/api/imports', fileForm({ name: 'scope.csv', text: csv }, { installation: code, dryRun: 'true' }));
    const done = await call('admin', 'POST', '/api/imports', fileForm({ name: 'scope.csv', text: csv }, { installation: code, dryRun: 'false' }));
    const mapping = await call('admin', 'POST', '/api/mappings', { installation: code, name: `scope ${code}`, mapping: { meter: 'Meter', periodStart: 'Start', periodEnd: 'End', quantity: 'Usage' } });
    const buildingId = buildings.find((b) => b.installationCode === code)!.id;
    const w = await call('admin', 'POST', '/api/walkthroughs', { buildingId, title: `Scope walkthrough ${code}`, plannedOn: '2027-04-01' });
    const finding = await call('admin', 'POST', `/api/walkthroughs/${w.body.id}/findings`, { title: 'Scope finding', category: 'lighting' });
    const spareFinding = await call('admin', 'POST', `/api/walkthroughs/${w.body.id}/findings`, { title: 'Spare finding', category: 'other' });
    const measure = await call('admin', 'PUT', `/api/findings/${finding.body.id}/measure`, { annualEnergyCostSavings: 100, installedCost: 500, lifeYears: 5 });
    const photo = await call('admin', 'POST', `/api/walkthroughs/${w.body.id}/photos`, scopePhoto());
    const sparePhoto = await call('admin', 'POST', `/api/walkthroughs/${w.body.id}/photos`, scopePhoto());
    return {
      installation: code,
      building: buildings.find((b) => b.installationCode === code)!.id,
      meter: m.id,
      meterCode: m.code,
      station: `${code}WX`,
      dryRun: dry.body.id,
      committed: done.body.id,
      mapping: mapping.body.id,
      walkthrough: w.body.id,
      finding: finding.body.id,
      spareFinding: spareFinding.body.id,
      measure: measure.body.id,
      photo: photo.body.id,
      sparePhoto: sparePhoto.body.id,
    };
  };
  fx = { own: await pick('BNP'), foreign: await pick('KSL'), staffUserId: users.find((u) => u.email === 'staff@demo.plumbline.test')!.id, kits: await kitFixture() };
});

/** Kits are region-wide; loans belong to an installation. Dates well ahead of the demo's. */
async function kitFixture(): Promise<KitFixture> {
  const tag = String(Date.now() % 1_000_000);
  const kit = (await call('custodian', 'POST', '/api/kits', { code: `SCOPE-${tag}`, name: 'Scope test kit' })).body.id;
  const requestKit = (await call('custodian', 'POST', '/api/kits', { code: `SCOPE-R-${tag}`, name: 'Scope request kit' })).body.id;
  const instrument = (await call('custodian', 'POST', '/api/instruments', { kitId: kit, type: 'light_meter', serial: `SC-${tag}` })).body.id;
  await call('custodian', 'POST', '/api/instruments', { kitId: requestKit, type: 'flashlight', serial: `SCR-${tag}` });
  const own = (await call('staff', 'POST', '/api/loans', { kitId: kit, start: loanDay(200), end: loanDay(201), purpose: 'Scope test (BNP)' })).body.id;
  const foreign = (await call('admin', 'POST', '/api/loans', { kitId: kit, start: loanDay(210), end: loanDay(211), purpose: 'Scope test (KSL)', installation: 'KSL' })).body.id;
  return { kit, instrument, requestKit, loan: { own, foreign } };
}
const loanDay = (n: number) => new Date(Date.now() + n * 86_400_000).toISOString().slice(0, 10);

/** A photo upload: JPEG start-of-image and JFIF APP0 marker bytes (constructed). */
function scopePhoto(): FormData {
  const jpeg = new Uint8Array([0xff, 0xd8, 0xff, 0xe0, 0x00, 0x10, 0x4a, 0x46, 0x49, 0x46, 0x00, 0x01, 0xff, 0xd9]);
  return fileForm({ name: 'scope.jpg', text: jpeg, type: 'image/jpeg' }, { tag: 'building-number' });
}

type Side = 'own' | 'foreign';
interface RouteCase {
  /** Public routes answer without a session. */
  public?: boolean;
  /** The request installation staff of BNP makes for its own or a foreign object. */
  request: (side: Side) => { path: string; body?: unknown };
  /** Expected status for staff: own side, foreign side. */
  staff: { own: number[]; foreign: number[] };
}

const same = (side: Side) => fx[side];
// Demo walkthroughs have fixed ids (the test server loads the demo with today = 2026-11-30).
const demoWalkthroughs = generateDemoScenario({ today: '2026-11-30' }).field.walkthroughs;
const walkthroughOf = (side: Side) => demoWalkthroughs.find((w) => w.installationCode === same(side).installation)!.id;
const CASES: Record<string, RouteCase> = {
  'GET /api/health': { public: true, request: () => ({ path: '/api/health' }), staff: { own: [200], foreign: [200] } },
  'ALL /api/auth/[...all]': { public: true, request: () => ({ path: '/api/auth/get-session' }), staff: { own: [200], foreign: [200] } },
  'GET /api/me': { request: () => ({ path: '/api/me' }), staff: { own: [200], foreign: [200] } },
  'POST /api/admin/backup': { request: () => ({ path: '/api/admin/backup', body: {} }), staff: { own: [403], foreign: [403] } },
  'GET /api/installations': { request: () => ({ path: '/api/installations' }), staff: { own: [200], foreign: [200] } },
  'POST /api/installations': {
    request: (s) => ({ path: '/api/installations', body: { code: s === 'own' ? 'ZZOWN' : 'ZZFOR', name: 'Nope', timeZone: 'UTC' } }),
    staff: { own: [403], foreign: [403] },
  },
  'GET /api/installations/[code]': { request: (s) => ({ path: `/api/installations/${same(s).installation}` }), staff: { own: [200], foreign: [403] } },
  'PATCH /api/installations/[code]': {
    request: (s) => ({ path: `/api/installations/${same(s).installation}`, body: { climate: 'x' } }),
    staff: { own: [403], foreign: [403] },
  },
  'GET /api/buildings': { request: (s) => ({ path: `/api/buildings?installation=${same(s).installation}` }), staff: { own: [200], foreign: [403] } },
  'POST /api/buildings': {
    request: (s) => ({
      path: '/api/buildings',
      body: { installation: same(s).installation, number: `T${Date.now() % 100000}`, name: 'Scope test', useType: 'office', grossAreaFt2: 1000 },
    }),
    staff: { own: [201], foreign: [403] },
  },
  'GET /api/buildings/[id]': { request: (s) => ({ path: `/api/buildings/${same(s).building}` }), staff: { own: [200], foreign: [404] } },
  'PATCH /api/buildings/[id]': {
    request: (s) => ({ path: `/api/buildings/${same(s).building}`, body: { notes: 'checked by the scope test' } }),
    staff: { own: [200], foreign: [404] },
  },
  'GET /api/meters': { request: (s) => ({ path: `/api/meters?installation=${same(s).installation}` }), staff: { own: [200], foreign: [403] } },
  'POST /api/meters': {
    request: (s) => ({ path: '/api/meters', body: { buildingId: same(s).building, code: `SCOPE-${s}-${Date.now() % 100000}`, commodity: 'water', unit: 'kgal' } }),
    staff: { own: [201], foreign: [404] },
  },
  'GET /api/meters/[id]': { request: (s) => ({ path: `/api/meters/${same(s).meter}` }), staff: { own: [200], foreign: [404] } },
  'PATCH /api/meters/[id]': { request: (s) => ({ path: `/api/meters/${same(s).meter}`, body: { account: 'A-1' } }), staff: { own: [200], foreign: [404] } },
  'GET /api/bills': { request: (s) => ({ path: `/api/bills?meter=${same(s).meter}` }), staff: { own: [200], foreign: [404] } },
  'GET /api/users': { request: () => ({ path: '/api/users' }), staff: { own: [403], foreign: [403] } },
  'POST /api/users': {
    request: () => ({ path: '/api/users', body: { email: 'nobody@example.test', name: 'No Body', role: 'admin' } }),
    staff: { own: [403], foreign: [403] },
  },
  'PATCH /api/users/[id]': { request: () => ({ path: `/api/users/${fx.staffUserId}`, body: { role: 'admin' } }), staff: { own: [403], foreign: [403] } },
  'GET /api/imports': { request: (s) => ({ path: `/api/imports?installation=${same(s).installation}&all=1` }), staff: { own: [200], foreign: [403] } },
  'POST /api/imports': {
    request: (s) => ({ path: '/api/imports', body: fileForm({ name: 'b.csv', text: `Meter,Start,End,Usage\n${same(s).meterCode},2026-12-01,2026-12-30,100\n` }, { installation: same(s).installation, dryRun: 'true' }) }),
    staff: { own: [200], foreign: [403] },
  },
  'GET /api/imports/[id]': { request: (s) => ({ path: `/api/imports/${same(s).dryRun}` }), staff: { own: [200], foreign: [404] } },
  // Undoing a dry run is refused on its merits (409): the caller got past authorization.
  'DELETE /api/imports/[id]': { request: (s) => ({ path: `/api/imports/${same(s).dryRun}` }), staff: { own: [409], foreign: [404] } },
  'GET /api/imports/[id]/report': { request: (s) => ({ path: `/api/imports/${same(s).dryRun}/report` }), staff: { own: [200], foreign: [404] } },
  'GET /api/imports/[id]/original': { request: (s) => ({ path: `/api/imports/${same(s).committed}/original` }), staff: { own: [200], foreign: [404] } },
  'GET /api/imports/progress/[key]': { request: () => ({ path: '/api/imports/progress/no-such-upload-1234' }), staff: { own: [404], foreign: [404] } },
  'GET /api/imports/template': { request: () => ({ path: '/api/imports/template' }), staff: { own: [200], foreign: [200] } },
  'GET /api/mappings': { request: (s) => ({ path: `/api/mappings?installation=${same(s).installation}` }), staff: { own: [200], foreign: [403] } },
  'POST /api/mappings': {
    request: (s) => ({ path: '/api/mappings', body: { installation: same(s).installation, name: 'staff mapping', mapping: { meter: 'M', periodStart: 'S', periodEnd: 'E', quantity: 'Q' } } }),
    staff: { own: [201], foreign: [403] },
  },
  'DELETE /api/mappings/[id]': { request: (s) => ({ path: `/api/mappings/${same(s).mapping}` }), staff: { own: [204, 404], foreign: [404] } },
  'GET /api/weather/stations': { request: () => ({ path: '/api/weather/stations' }), staff: { own: [200], foreign: [200] } },
  'POST /api/weather/stations': {
    request: (s) => ({ path: '/api/weather/stations', body: { code: `SC-${s}-${Date.now() % 100000}`, name: 'Scope station', installation: same(s).installation } }),
    staff: { own: [201], foreign: [403] },
  },
  'GET /api/weather/stations/[code]': { request: (s) => ({ path: `/api/weather/stations/${same(s).station}` }), staff: { own: [200], foreign: [404] } },
  'POST /api/weather/stations/[code]/observations': {
    request: (s) => ({ path: `/api/weather/stations/${same(s).station}/observations`, body: fileForm({ name: 'w.csv', text: 'STATION,DATE,TMAX,TMIN\n,2030-01-01,40,20\n' }, { units: 'standard' }) }),
    staff: { own: [201], foreign: [404] },
  },
  // The demo stations have no weather-service id: refused on its merits (409) once authorized.
  'POST /api/weather/stations/[code]/fetch': { request: (s) => ({ path: `/api/weather/stations/${same(s).station}/fetch`, body: { start: '2026-01-01', end: '2026-01-31' } }), staff: { own: [409], foreign: [404] } },
  'GET /api/weather/degree-days': { request: (s) => ({ path: `/api/weather/degree-days?station=${same(s).station}&start=2025-01-01&end=2025-01-31&base=65` }), staff: { own: [200], foreign: [404] } },
  'GET /api/baselines': { request: (s) => ({ path: `/api/baselines?installation=${same(s).installation}` }), staff: { own: [200], foreign: [403] } },
  'GET /api/baselines/[buildingId]': { request: (s) => ({ path: `/api/baselines/${same(s).building}` }), staff: { own: [200], foreign: [404] } },
  'GET /api/baselines/meter/[meterId]': { request: (s) => ({ path: `/api/baselines/meter/${same(s).meter}` }), staff: { own: [200], foreign: [404] } },
  'GET /api/baselines/run': { request: () => ({ path: '/api/baselines/run' }), staff: { own: [200], foreign: [200] } },
  'POST /api/baselines/run': { request: (s) => ({ path: '/api/baselines/run', body: { installation: same(s).installation } }), staff: { own: [403], foreign: [403] } },
  'POST /api/baseline-decisions': { request: (s) => ({ path: '/api/baseline-decisions', body: { meterId: same(s).meter, action: 'accept', note: 'staff may not' } }), staff: { own: [403], foreign: [403] } },
  'POST /api/baseline-periods': { request: (s) => ({ path: '/api/baseline-periods', body: { meterId: same(s).meter, start: '2023-01-01', end: '2024-06-30', note: 'staff may not' } }), staff: { own: [403], foreign: [403] } },
  'GET /api/settings/baseline-acceptance': { request: () => ({ path: '/api/settings/baseline-acceptance' }), staff: { own: [200], foreign: [200] } },
  'PUT /api/settings/baseline-acceptance': { request: () => ({ path: '/api/settings/baseline-acceptance', body: { maxCvrmse: 0.2, minPeriods: 12, minDays: 365 } }), staff: { own: [403], foreign: [403] } },
  'GET /api/shortlist': { request: (s) => ({ path: `/api/shortlist?installation=${same(s).installation}&limit=5` }), staff: { own: [200], foreign: [200] } },
  'GET /api/shortlist/weights': { request: () => ({ path: '/api/shortlist/weights' }), staff: { own: [200], foreign: [200] } },
  'PUT /api/shortlist/weights': { request: () => ({ path: '/api/shortlist/weights', body: { excessEnergy: 1, excessCost: 1, yoyIncrease: 1, anomalies: 1, evaluationAge: 1, manualFlag: 1 } }), staff: { own: [403], foreign: [403] } },
  'GET /api/shortlist/[buildingId]': { request: (s) => ({ path: `/api/shortlist/${same(s).building}` }), staff: { own: [200], foreign: [404] } },
  'GET /api/flags': { request: () => ({ path: '/api/flags?open=1' }), staff: { own: [200], foreign: [200] } },
  'POST /api/flags': { request: (s) => ({ path: '/api/flags', body: { buildingId: same(s).building, reason: 'staff may not flag' } }), staff: { own: [403], foreign: [403] } },
  'DELETE /api/flags/[id]': { request: () => ({ path: '/api/flags/00000000-0000-4000-8000-000000000000' }), staff: { own: [403], foreign: [403] } },
  'GET /api/targets': { request: () => ({ path: '/api/targets' }), staff: { own: [200], foreign: [200] } },
  'PUT /api/targets/[code]': { request: (s) => ({ path: `/api/targets/${same(s).installation}`, body: { baselineFy: 2024, reductionPct: 30, targetFy: 2030 } }), staff: { own: [403], foreign: [403] } },
  'GET /api/intensity': { request: (s) => ({ path: `/api/intensity?installation=${same(s).installation}` }), staff: { own: [200], foreign: [403] } },
  // Kit library: kits and instruments are region-wide (read by all, changed by custodians only);
  // loans belong to an installation.
  'GET /api/kits': { request: () => ({ path: '/api/kits' }), staff: { own: [200], foreign: [200] } },
  'POST /api/kits': { request: (s) => ({ path: '/api/kits', body: { code: `NOPE-${s}`, name: 'Staff may not' } }), staff: { own: [403], foreign: [403] } },
  'GET /api/kits/[id]': { request: () => ({ path: `/api/kits/${fx.kits.kit}` }), staff: { own: [200], foreign: [200] } },
  'PATCH /api/kits/[id]': { request: () => ({ path: `/api/kits/${fx.kits.kit}`, body: { name: 'Staff may not' } }), staff: { own: [403], foreign: [403] } },
  'GET /api/instruments': { request: () => ({ path: '/api/instruments' }), staff: { own: [200], foreign: [200] } },
  'POST /api/instruments': { request: () => ({ path: '/api/instruments', body: { kitId: fx.kits.kit, type: 'camera', serial: 'NOPE-1' } }), staff: { own: [403], foreign: [403] } },
  'GET /api/instruments/[id]': { request: () => ({ path: `/api/instruments/${fx.kits.instrument}` }), staff: { own: [200], foreign: [200] } },
  'PATCH /api/instruments/[id]': { request: () => ({ path: `/api/instruments/${fx.kits.instrument}`, body: { condition: 'retired' } }), staff: { own: [403], foreign: [403] } },
  'GET /api/loans': { request: () => ({ path: `/api/loans?kit=${fx.kits.kit}` }), staff: { own: [200], foreign: [200] } },
  'POST /api/loans': {
    request: (s) => ({ path: '/api/loans', body: { kitId: fx.kits.requestKit, start: loanDay(220), end: loanDay(221), purpose: 'Scope test request', installation: same(s).installation } }),
    staff: { own: [201], foreign: [403] },
  },
  'GET /api/loans/[id]': { request: (s) => ({ path: `/api/loans/${fx.kits.loan[s]}` }), staff: { own: [200], foreign: [404] } },
  'POST /api/loans/[id]/transition': { request: (s) => ({ path: `/api/loans/${fx.kits.loan[s]}/transition`, body: { to: 'cancelled', note: 'scope test' } }), staff: { own: [200], foreign: [404] } },

  'GET /api/walkthroughs': { request: (s) => ({ path: `/api/walkthroughs?installation=${same(s).installation}` }), staff: { own: [200], foreign: [403] } },
  'POST /api/walkthroughs': { request: (s) => ({ path: '/api/walkthroughs', body: { buildingId: same(s).building, title: 'Planned by the scope test', plannedOn: '2027-04-02' } }), staff: { own: [201], foreign: [404] } },
  'GET /api/walkthroughs/planning': { request: (s) => ({ path: `/api/walkthroughs/planning?building=${same(s).building}` }), staff: { own: [200], foreign: [404] } },
  'GET /api/walkthroughs/[id]': { request: (s) => ({ path: `/api/walkthroughs/${same(s).walkthrough}` }), staff: { own: [200], foreign: [404] } },
  'PATCH /api/walkthroughs/[id]': { request: (s) => ({ path: `/api/walkthroughs/${same(s).walkthrough}`, body: { title: 'Renamed by the scope test' } }), staff: { own: [200], foreign: [404] } },
  'GET /api/walkthroughs/[id]/suggestions': { request: (s) => ({ path: `/api/walkthroughs/${same(s).walkthrough}/suggestions` }), staff: { own: [200], foreign: [404] } },
  'POST /api/walkthroughs/[id]/status': { request: (s) => ({ path: `/api/walkthroughs/${same(s).walkthrough}/status`, body: { status: 'in-progress' } }), staff: { own: [200], foreign: [404] } },
  'GET /api/walkthroughs/[id]/findings': { request: (s) => ({ path: `/api/walkthroughs/${same(s).walkthrough}/findings` }), staff: { own: [200], foreign: [404] } },
  'POST /api/walkthroughs/[id]/findings': { request: (s) => ({ path: `/api/walkthroughs/${same(s).walkthrough}/findings`, body: { title: 'Found by staff', category: 'controls' } }), staff: { own: [201], foreign: [404] } },
  'GET /api/walkthroughs/[id]/photos': { request: (s) => ({ path: `/api/walkthroughs/${same(s).walkthrough}/photos` }), staff: { own: [200], foreign: [404] } },
  'POST /api/walkthroughs/[id]/photos': { request: (s) => ({ path: `/api/walkthroughs/${same(s).walkthrough}/photos`, body: scopePhoto() }), staff: { own: [201], foreign: [404] } },
  'PATCH /api/findings/[id]': { request: (s) => ({ path: `/api/findings/${same(s).finding}`, body: { location: 'Basement' } }), staff: { own: [200], foreign: [404] } },
  'DELETE /api/findings/[id]': { request: (s) => ({ path: `/api/findings/${same(s).spareFinding}` }), staff: { own: [204], foreign: [404] } },
  'PUT /api/findings/[id]/measure': { request: (s) => ({ path: `/api/findings/${same(s).finding}/measure`, body: { annualEnergyCostSavings: 120, installedCost: 500, lifeYears: 5 } }), staff: { own: [200], foreign: [404] } },
  'GET /api/measures': { request: (s) => ({ path: `/api/measures?installation=${same(s).installation}` }), staff: { own: [200], foreign: [403] } },
  'GET /api/measures/[id]': { request: (s) => ({ path: `/api/measures/${same(s).measure}` }), staff: { own: [200], foreign: [404] } },
  // Staff may record an implementation but not approve: refused on the permission once in scope.
  'POST /api/measures/[id]/status': { request: (s) => ({ path: `/api/measures/${same(s).measure}/status`, body: { status: 'approved' } }), staff: { own: [403], foreign: [403, 404] } },
  'GET /api/measures/rollup': { request: (s) => ({ path: `/api/measures/rollup?installation=${same(s).installation}` }), staff: { own: [200], foreign: [403] } },
  'GET /api/measures/verified': { request: (s) => ({ path: `/api/measures/verified?building=${same(s).building}` }), staff: { own: [200], foreign: [404] } },
  'GET /api/photos/[id]': { request: (s) => ({ path: `/api/photos/${same(s).photo}` }), staff: { own: [200], foreign: [404] } },
  'PATCH /api/photos/[id]': { request: (s) => ({ path: `/api/photos/${same(s).photo}`, body: { caption: 'Checked by the scope test' } }), staff: { own: [200], foreign: [404] } },
  'DELETE /api/photos/[id]': { request: (s) => ({ path: `/api/photos/${same(s).sparePhoto}` }), staff: { own: [204], foreign: [404] } },
  'GET /api/settings/discount-rate': { request: () => ({ path: '/api/settings/discount-rate' }), staff: { own: [200], foreign: [200] } },
  'PUT /api/settings/discount-rate': { request: () => ({ path: '/api/settings/discount-rate', body: { realDiscountRatePercent: 4, effectiveFrom: '2026-04-01', source: 'staff may not' } }), staff: { own: [403], foreign: [403] } },
  'GET /api/outbox': { request: () => ({ path: '/api/outbox' }), staff: { own: [403], foreign: [403] } },
  'GET /api/activity': { request: () => ({ path: '/api/activity' }), staff: { own: [403], foreign: [403] } },
  'GET /api/walkthroughs/[id]/buildingsync': { request: (s) => ({ path: `/api/walkthroughs/${walkthroughOf(s)}/buildingsync` }), staff: { own: [200], foreign: [404] } },
  'GET /api/walkthroughs/[id]/report.pdf': { request: (s) => ({ path: `/api/walkthroughs/${walkthroughOf(s)}/report.pdf` }), staff: { own: [200], foreign: [404] } },
};

function methodOf(route: string): string {
  const m = route.split(' ')[0]!;
  return m === 'ALL' ? 'GET' : m;
}

describe('route table', () => {
  it('has an entry for every route under src/pages/api', () => {
    const routes = apiRoutes();
    expect(routes.length).toBeGreaterThan(10);
    expect(routes.filter((r) => !(r in CASES))).toEqual([]);
  });
});

describe.each(Object.keys(CASES))('%s', (route) => {
  const c = CASES[route]!;
  it(c.public ? 'answers without a session' : 'answers 401 without a session', async () => {
    const { path, body } = c.request('own');
    const r = await call(null, methodOf(route), path, body);
    if (c.public) expect(r.status).toBeLessThan(400);
    else {
      expect(r.status).toBe(401);
      expect(r.body.error.code).toBe('unauthenticated');
    }
  });
  it('keeps installation staff inside their installation', async () => {
    const own: CallResult = await call('staff', methodOf(route), c.request('own').path, c.request('own').body);
    expect(c.staff.own, `own: ${JSON.stringify(own.body)}`).toContain(own.status);
    const foreign: CallResult = await call('staff', methodOf(route), c.request('foreign').path, c.request('foreign').body);
    expect(c.staff.foreign, `foreign: ${JSON.stringify(foreign.body)}`).toContain(foreign.status);
    if (foreign.status >= 400 && !c.public) expect(foreign.body.error).toMatchObject({ code: expect.any(String), message: expect.any(String) });
  });
});

describe('lists hold only what the caller may see', () => {
  it('installation staff list only their installation and its buildings', async () => {
    const inst = await call('staff', 'GET', '/api/installations');
    expect(inst.body.items.map((i: { code: string }) => i.code)).toEqual(['BNP']);
    const b = await call('staff', 'GET', '/api/buildings');
    expect(b.body.items.length).toBeGreaterThan(0);
    expect(new Set(b.body.items.map((x: { installationCode: string }) => x.installationCode))).toEqual(new Set(['BNP']));
  });
  it('installation staff see only their installation in the shortlist and intensity tables', async () => {
    const sl = await call('staff', 'GET', '/api/shortlist?limit=500');
    expect(new Set(sl.body.items.map((i: { installationCode: string }) => i.installationCode))).toEqual(new Set(['BNP']));
    const it = await call('staff', 'GET', '/api/intensity');
    expect(new Set(it.body.items.map((i: { installation: string }) => i.installation))).toEqual(new Set(['BNP']));
  });

  it('the regional manager reads every installation', async () => {
    const inst = await call('manager', 'GET', '/api/installations');
    expect(inst.body.items.length).toBe(5);
  });
  it('installation staff list only their installation’s loans; the custodian lists all', async () => {
    const staff = await call('staff', 'GET', `/api/loans?kit=${fx.kits.kit}`);
    expect(staff.body.items.map((l: { id: string }) => l.id)).toContain(fx.kits.loan.own);
    expect(new Set(staff.body.items.map((l: { installationCode: string }) => l.installationCode))).toEqual(new Set(['BNP']));
    const custodian = await call('custodian', 'GET', `/api/loans?kit=${fx.kits.kit}`);
    expect(custodian.body.items.map((l: { id: string }) => l.id)).toEqual(expect.arrayContaining([fx.kits.loan.own, fx.kits.loan.foreign]));
  });
  it('an auditor sees the two installations assigned', async () => {
    const inst = await call('auditor', 'GET', '/api/installations');
    expect(inst.body.items.map((i: { code: string }) => i.code).sort()).toEqual(['BNP', 'KSL']);
  });
});
