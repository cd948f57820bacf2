/**
 * Every API route, without a session and as installation staff of one installation reaching for
 * another installation's data. The route list is read from src/pages/api, so a new route without
 * an entry here fails the test.
 */
import { beforeAll, describe, expect, it } from 'vitest';
import { apiRoutes } from '../support/routes';
import { call, fileForm, type CallResult, type DemoRole } from '../support/http';

interface SideFixture {
  installation: string;
  building: string;
  meter: string;
  meterCode: string;
  station: string;
  dryRun: string;
  committed: string;
  mapping: string;
  /** A walkthrough with a finding priced as a measure and a photo. */
  walkthrough: string;
  finding: string;
  measure: string;
  photo: string;
}
interface KitFixture {
  kit: string;
  instrument: string;
  /** A kit only the loan requests of this test use. */
  requestKit: string;
  /** Loans requested by BNP's staff (own) and for the foreign installation. */
  loan: { own: string; foreign: string };
}
interface Fixture {
  own: SideFixture;
  foreign: SideFixture;
  staffUserId: string;
  kits: KitFixture;
}
let fx: Fixture;
/** The other side: an installation neither the demo's staff (BNP) nor its auditor (BNP, KSL) is assigned to. */
const FOREIGN = 'DMF';

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
    const measure = await call('admin', 'PUT', `/api/findings/${finding.body.id}/measure`, { annualEnergyCostSavings: 100, installedCost: 500, lifeYears: 5 });
    const photo = await call('admin', 'POST', `/api/walkthroughs/${w.body.id}/photos`, scopePhoto());
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
      measure: measure.body.id,
      photo: photo.body.id,
    };
  };
  fx = { own: await pick('BNP'), foreign: await pick(FOREIGN), staffUserId: users.find((u) => u.email === 'staff@demo.plumbline.test')!.id, kits: await kitFixture() };
});

/** Kits are region-wide; loans belong to an installation. Dates well ahead of the demo's. */
async function kitFixture(): Promise<KitFixture> {
  const tag = String(Date.now() % 1_000_000);
  const kit = (await call('custodian', 'POST', '/api/kits', { code: `SCOPE-${tag}`, name: 'Scope test kit' })).body.id;
  const requestKit = (await call('custodian', 'POST', '/api/kits', { code: `SCOPE-R-${tag}`, name: 'Scope request kit' })).body.id;
  const instrument = (await call('custodian', 'POST', '/api/instruments', { kitId: kit, type: 'light_meter', serial: `SC-${tag}` })).body.id;
  await call('custodian', 'POST', '/api/instruments', { kitId: requestKit, type: 'flashlight', serial: `SCR-${tag}` });
  const own = (await call('staff', 'POST', '/api/loans', { kitId: kit, start: loanDay(200), end: loanDay(201), purpose: 'Scope test (BNP)' })).body.id;
  const foreign = (await call('admin', 'POST', '/api/loans', { kitId: kit, start: loanDay(210), end: loanDay(211), purpose: `Scope test (${FOREIGN})`, installation: FOREIGN })).body.id;
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
  /** The request made for an object of the own installation (BNP) or of the foreign one. */
  request: (side: Side) => { path: string; body?: unknown } | Promise<{ path: string; body?: unknown }>;
  /** Expected status for installation staff of BNP: own side, foreign side. */
  staff: { own: number[]; foreign: number[] };
  /** Who may call it: a permission of the role table (README.md), or a rule named below. */
  who?: keyof typeof MAY;
  /** Statuses a caller who may call it gets on its own side (default: `staff.own`). */
  ok?: number[];
}

/** A body the route refuses on its merits once the caller is authorized: settings stay untouched. */
const INVALID = [400, 422];

type Role = DemoRole;
const EVERYONE: Role[] = ['admin', 'manager', 'staff', 'analyst', 'auditor', 'custodian'];
/**
 * The role table of README.md, written out here independently of src/server/authz.ts: who may
 * do what. Scoped roles (staff: BNP; auditor: BNP and KSL) reach only their installations.
 */
const MAY = {
  'signed-in': EVERYONE,
  'inventory:read': EVERYONE,
  'inventory:write': ['admin', 'staff'],
  'installations:write': ['admin'],
  'targets:write': ['admin', 'manager'],
  'bills:read': ['admin', 'manager', 'staff', 'analyst', 'auditor'],
  'bills:import': ['admin', 'staff'],
  'weather:write': ['admin', 'staff', 'analyst'],
  'baselines:review': ['admin', 'analyst'],
  'shortlist:read': ['admin', 'manager', 'staff', 'analyst'],
  'weights:write': ['admin', 'manager'],
  'flags:write': ['admin', 'manager'],
  'walkthroughs:read': EVERYONE,
  'walkthroughs:plan': ['admin', 'manager', 'staff'],
  'walkthroughs:field': ['admin', 'staff', 'auditor'],
  'walkthroughs:plan|field': ['admin', 'manager', 'staff', 'auditor'],
  'walkthroughs:field|measures:approve': ['admin', 'manager', 'staff', 'auditor'],
  'measures:approve': ['admin', 'manager'],
  'settings:discount': ['admin', 'manager'],
  'kits:read': EVERYONE,
  'kits:manage': ['admin', 'custodian'],
  'loans:request': ['admin', 'manager', 'staff', 'auditor'],
  /** Cancelling a requested loan: its requester's installation staff, the custodian, an admin. */
  'loan-cancel': ['admin', 'custodian', 'staff'],
  'users:manage': ['admin'],
  'outbox:read': ['admin'],
  'activity:read': ['admin'],
  backups: ['admin'],
} satisfies Record<string, Role[]>;
const SCOPED: Role[] = ['staff', 'auditor'];

const same = (side: Side) => fx[side];
// Objects a DELETE consumes: a fresh one for every call, made by the administrator.
async function spareFinding(side: Side): Promise<string> {
  return (await call('admin', 'POST', `/api/walkthroughs/${same(side).walkthrough}/findings`, { title: 'Spare finding', category: 'other' })).body.id;
}
async function sparePhoto(side: Side): Promise<string> {
  return (await call('admin', 'POST', `/api/walkthroughs/${same(side).walkthrough}/photos`, scopePhoto())).body.id;
}
/** A loan requested by BNP's staff (own) or by the administrator for the foreign installation, on its own days. */
let loanSeq = 0;
async function freshLoan(side: Side): Promise<string> {
  const start = loanDay(300 + 3 * loanSeq++);
  const end = loanDay(300 + 3 * loanSeq - 2);
  const body = { kitId: fx.kits.kit, start, end, purpose: 'Scope test loan', ...(side === 'foreign' ? { installation: FOREIGN } : {}) };
  const r = await call(side === 'own' ? 'staff' : 'admin', 'POST', '/api/loans', body);
  if (r.status !== 201) throw new Error(`loan fixture: ${r.status} ${JSON.stringify(r.body)}`);
  return r.body.id;
}
async function spareMapping(side: Side): Promise<string> {
  const name = `spare ${side} ${Math.random().toString(36).slice(2, 8)}`;
  return (await call('admin', 'POST', '/api/mappings', { installation: same(side).installation, name, mapping: { meter: 'M', periodStart: 'S', periodEnd: 'E', quantity: 'Q' } })).body.id;
}
const CASES: Record<string, RouteCase> = {
  'GET /api/health': { public: true, request: () => ({ path: '/api/health' }), staff: { own: [200], foreign: [200] } },
  'ALL /api/auth/[...all]': { public: true, request: () => ({ path: '/api/auth/get-session' }), staff: { own: [200], foreign: [200] } },
  'GET /api/me': { who: 'signed-in', request: () => ({ path: '/api/me' }), staff: { own: [200], foreign: [200] } },
  'POST /api/admin/backup': { who: 'backups', ok: [200], request: () => ({ path: '/api/admin/backup', body: {} }), staff: { own: [403], foreign: [403] } },
  'GET /api/installations': { who: 'inventory:read', request: () => ({ path: '/api/installations' }), staff: { own: [200], foreign: [200] } },
  'POST /api/installations': { who: 'installations:write', ok: INVALID,
    request: (s) => ({ path: '/api/installations', body: { code: s === 'own' ? 'zz own!' : 'zz for!', name: '', timeZone: 'Nowhere/Nope' } }),
    staff: { own: [403], foreign: [403] },
  },
  'GET /api/installations/[code]': { who: 'inventory:read', request: (s) => ({ path: `/api/installations/${same(s).installation}` }), staff: { own: [200], foreign: [403] } },
  'PATCH /api/installations/[code]': { who: 'installations:write', ok: INVALID,
    request: (s) => ({ path: `/api/installations/${same(s).installation}`, body: { timeZone: 'Nowhere/Nope' } }),
    staff: { own: [403], foreign: [403] },
  },
  'GET /api/buildings': { who: 'inventory:read', request: (s) => ({ path: `/api/buildings?installation=${same(s).installation}` }), staff: { own: [200], foreign: [403] } },
  'POST /api/buildings': { who: 'inventory:write', ok: [201, 409],
    request: (s) => ({
      path: '/api/buildings',
      body: { installation: same(s).installation, number: `T${Date.now() % 100000}`, name: 'Scope test', useType: 'office', grossAreaFt2: 1000 },
    }),
    staff: { own: [201], foreign: [403] },
  },
  'GET /api/buildings/[id]': { who: 'inventory:read', request: (s) => ({ path: `/api/buildings/${same(s).building}` }), staff: { own: [200], foreign: [404] } },
  'PATCH /api/buildings/[id]': { who: 'inventory:write',
    request: (s) => ({ path: `/api/buildings/${same(s).building}`, body: { notes: 'checked by the scope test' } }),
    staff: { own: [200], foreign: [404] },
  },
  'GET /api/meters': { who: 'inventory:read', request: (s) => ({ path: `/api/meters?installation=${same(s).installation}` }), staff: { own: [200], foreign: [403] } },
  'POST /api/meters': { who: 'inventory:write', ok: [201, 409],
    request: (s) => ({ path: '/api/meters', body: { buildingId: same(s).building, code: `SCOPE-${s}-${Date.now() % 100000}`, commodity: 'water', unit: 'kgal' } }),
    staff: { own: [201], foreign: [404] },
  },
  'GET /api/meters/[id]': { who: 'inventory:read', request: (s) => ({ path: `/api/meters/${same(s).meter}` }), staff: { own: [200], foreign: [404] } },
  'PATCH /api/meters/[id]': { who: 'inventory:write', request: (s) => ({ path: `/api/meters/${same(s).meter}`, body: { account: 'A-1' } }), staff: { own: [200], foreign: [404] } },
  'GET /api/bills': { who: 'bills:read', request: (s) => ({ path: `/api/bills?meter=${same(s).meter}` }), staff: { own: [200], foreign: [404] } },
  'GET /api/users': { who: 'users:manage', ok: [200], request: () => ({ path: '/api/users' }), staff: { own: [403], foreign: [403] } },
  'POST /api/users': { who: 'users:manage', ok: INVALID,
    request: () => ({ path: '/api/users', body: { email: 'not-an-address', name: '', role: 'admin' } }),
    staff: { own: [403], foreign: [403] },
  },
  'PATCH /api/users/[id]': { who: 'users:manage', ok: INVALID, request: () => ({ path: `/api/users/${fx.staffUserId}`, body: { role: 'wizard' } }), staff: { own: [403], foreign: [403] } },
  'GET /api/imports': { who: 'bills:read', request: (s) => ({ path: `/api/imports?installation=${same(s).installation}&all=1` }), staff: { own: [200], foreign: [403] } },
  'POST /api/imports': { who: 'bills:import',
    request: (s) => ({ path: '/api/imports', body: fileForm({ name: 'b.csv', text: `Meter,Start,End,Usage\n${same(s).meterCode},2026-12-01,2026-12-30,100\n` }, { installation: same(s).installation, dryRun: 'true' }) }),
    staff: { own: [200], foreign: [403] },
  },
  'GET /api/imports/[id]': { who: 'bills:read', request: (s) => ({ path: `/api/imports/${same(s).dryRun}` }), staff: { own: [200], foreign: [404] } },
  // Undoing a dry run is refused on its merits (409): the caller got past authorization.
  'DELETE /api/imports/[id]': { who: 'bills:import', request: (s) => ({ path: `/api/imports/${same(s).dryRun}` }), staff: { own: [409], foreign: [404] } },
  'GET /api/imports/[id]/report': { who: 'bills:read', request: (s) => ({ path: `/api/imports/${same(s).dryRun}/report` }), staff: { own: [200], foreign: [404] } },
  'GET /api/imports/[id]/original': { who: 'bills:read', request: (s) => ({ path: `/api/imports/${same(s).committed}/original` }), staff: { own: [200], foreign: [404] } },
  'GET /api/imports/progress/[key]': { who: 'bills:import', request: () => ({ path: '/api/imports/progress/no-such-upload-1234' }), staff: { own: [404], foreign: [404] } },
  'GET /api/imports/template': { who: 'bills:read', request: () => ({ path: '/api/imports/template' }), staff: { own: [200], foreign: [200] } },
  'GET /api/mappings': { who: 'bills:import', request: (s) => ({ path: `/api/mappings?installation=${same(s).installation}` }), staff: { own: [200], foreign: [403] } },
  'POST /api/mappings': { who: 'bills:import',
    request: (s) => ({ path: '/api/mappings', body: { installation: same(s).installation, name: 'staff mapping', mapping: { meter: 'M', periodStart: 'S', periodEnd: 'E', quantity: 'Q' } } }),
    staff: { own: [201], foreign: [403] },
  },
  'DELETE /api/mappings/[id]': { who: 'bills:import', request: async (s) => ({ path: `/api/mappings/${await spareMapping(s)}` }), staff: { own: [204], foreign: [404] } },
  'GET /api/weather/stations': { who: 'inventory:read', request: () => ({ path: '/api/weather/stations' }), staff: { own: [200], foreign: [200] } },
  'POST /api/weather/stations': { who: 'weather:write', ok: [201, 409],
    request: (s) => ({ path: '/api/weather/stations', body: { code: `SC-${s}-${Date.now() % 100000}`, name: 'Scope station', installation: same(s).installation } }),
    staff: { own: [201], foreign: [403] },
  },
  'GET /api/weather/stations/[code]': { who: 'inventory:read', request: (s) => ({ path: `/api/weather/stations/${same(s).station}` }), staff: { own: [200], foreign: [404] } },
  'POST /api/weather/stations/[code]/observations': { who: 'weather:write', ok: [200, 201],
    request: (s) => ({ path: `/api/weather/stations/${same(s).station}/observations`, body: fileForm({ name: 'w.csv', text: 'STATION,DATE,TMAX,TMIN\n,2030-01-01,40,20\n' }, { units: 'standard' }) }),
    staff: { own: [201], foreign: [404] },
  },
  // The demo stations have no weather-service id: refused on its merits (409) once authorized.
  'POST /api/weather/stations/[code]/fetch': { who: 'weather:write', request: (s) => ({ path: `/api/weather/stations/${same(s).station}/fetch`, body: { start: '2026-01-01', end: '2026-01-31' } }), staff: { own: [409], foreign: [404] } },
  'GET /api/weather/degree-days': { who: 'inventory:read', request: (s) => ({ path: `/api/weather/degree-days?station=${same(s).station}&start=2025-01-01&end=2025-01-31&base=65` }), staff: { own: [200], foreign: [404] } },
  'GET /api/baselines': { who: 'bills:read', request: (s) => ({ path: `/api/baselines?installation=${same(s).installation}` }), staff: { own: [200], foreign: [403] } },
  'GET /api/baselines/[buildingId]': { who: 'bills:read', request: (s) => ({ path: `/api/baselines/${same(s).building}` }), staff: { own: [200], foreign: [404] } },
  'GET /api/baselines/meter/[meterId]': { who: 'bills:read', request: (s) => ({ path: `/api/baselines/meter/${same(s).meter}` }), staff: { own: [200], foreign: [404] } },
  'GET /api/baselines/run': { who: 'bills:read', request: () => ({ path: '/api/baselines/run' }), staff: { own: [200], foreign: [200] } },
  'POST /api/baselines/run': { who: 'baselines:review', ok: [200, 202], request: (s) => ({ path: '/api/baselines/run', body: { installation: same(s).installation } }), staff: { own: [403], foreign: [403] } },
  'POST /api/baseline-decisions': { who: 'baselines:review', ok: [200, 201, 409, 422], request: (s) => ({ path: '/api/baseline-decisions', body: { meterId: same(s).meter, action: 'accept', note: 'staff may not' } }), staff: { own: [403], foreign: [403] } },
  'POST /api/baseline-periods': { who: 'baselines:review', ok: INVALID, request: (s) => ({ path: '/api/baseline-periods', body: { meterId: same(s).meter, start: '2024-06-30', end: '2023-01-01', note: '' } }), staff: { own: [403], foreign: [403] } },
  'GET /api/settings/baseline-acceptance': { who: 'bills:read', request: () => ({ path: '/api/settings/baseline-acceptance' }), staff: { own: [200], foreign: [200] } },
  'PUT /api/settings/baseline-acceptance': { who: 'baselines:review', ok: INVALID, request: () => ({ path: '/api/settings/baseline-acceptance', body: { maxCvrmse: -1, minPeriods: 0, minDays: -5 } }), staff: { own: [403], foreign: [403] } },
  'GET /api/shortlist': { who: 'shortlist:read', request: (s) => ({ path: `/api/shortlist?installation=${same(s).installation}&limit=5` }), staff: { own: [200], foreign: [200] } },
  'GET /api/shortlist/weights': { who: 'shortlist:read', request: () => ({ path: '/api/shortlist/weights' }), staff: { own: [200], foreign: [200] } },
  'PUT /api/shortlist/weights': { who: 'weights:write', ok: INVALID, request: () => ({ path: '/api/shortlist/weights', body: { excessEnergy: -1, excessCost: 'x', yoyIncrease: 1, anomalies: 1, evaluationAge: 1, manualFlag: 1 } }), staff: { own: [403], foreign: [403] } },
  'GET /api/shortlist/[buildingId]': { who: 'shortlist:read', request: (s) => ({ path: `/api/shortlist/${same(s).building}` }), staff: { own: [200], foreign: [404] } },
  'GET /api/flags': { who: 'shortlist:read', request: () => ({ path: '/api/flags?open=1' }), staff: { own: [200], foreign: [200] } },
  'POST /api/flags': { who: 'flags:write', ok: [201, 409], request: (s) => ({ path: '/api/flags', body: { buildingId: same(s).building, reason: 'staff may not flag' } }), staff: { own: [403], foreign: [403] } },
  'DELETE /api/flags/[id]': { who: 'flags:write', ok: [404], request: () => ({ path: '/api/flags/00000000-0000-4000-8000-000000000000' }), staff: { own: [403], foreign: [403] } },
  'GET /api/targets': { who: 'inventory:read', request: () => ({ path: '/api/targets' }), staff: { own: [200], foreign: [200] } },
  'PUT /api/targets/[code]': { who: 'targets:write', ok: INVALID, request: (s) => ({ path: `/api/targets/${same(s).installation}`, body: { baselineFy: 1800, reductionPct: 250, targetFy: 1700 } }), staff: { own: [403], foreign: [403] } },
  'GET /api/intensity': { who: 'inventory:read', request: (s) => ({ path: `/api/intensity?installation=${same(s).installation}` }), staff: { own: [200], foreign: [403] } },
  // Kit library: kits and instruments are region-wide (read by all, changed by custodians only);
  // loans belong to an installation.
  'GET /api/kits': { who: 'kits:read', request: () => ({ path: '/api/kits' }), staff: { own: [200], foreign: [200] } },
  'POST /api/kits': { who: 'kits:manage', ok: [201, 409], request: (s) => ({ path: '/api/kits', body: { code: `NOPE-${s}`, name: 'Staff may not' } }), staff: { own: [403], foreign: [403] } },
  'GET /api/kits/[id]': { who: 'kits:read', request: () => ({ path: `/api/kits/${fx.kits.kit}` }), staff: { own: [200], foreign: [200] } },
  'PATCH /api/kits/[id]': { who: 'kits:manage', ok: [200], request: () => ({ path: `/api/kits/${fx.kits.kit}`, body: { name: 'Staff may not' } }), staff: { own: [403], foreign: [403] } },
  'GET /api/instruments': { who: 'kits:read', request: () => ({ path: '/api/instruments' }), staff: { own: [200], foreign: [200] } },
  'POST /api/instruments': { who: 'kits:manage', ok: [201, 409], request: () => ({ path: '/api/instruments', body: { kitId: fx.kits.kit, type: 'camera', serial: 'NOPE-1' } }), staff: { own: [403], foreign: [403] } },
  'GET /api/instruments/[id]': { who: 'kits:read', request: () => ({ path: `/api/instruments/${fx.kits.instrument}` }), staff: { own: [200], foreign: [200] } },
  'PATCH /api/instruments/[id]': { who: 'kits:manage', ok: [200], request: () => ({ path: `/api/instruments/${fx.kits.instrument}`, body: { notes: 'Checked by the scope test' } }), staff: { own: [403], foreign: [403] } },
  'GET /api/loans': { who: 'kits:read', request: () => ({ path: `/api/loans?kit=${fx.kits.kit}` }), staff: { own: [200], foreign: [200] } },
  'POST /api/loans': { who: 'loans:request', ok: [201, 409],
    request: (s) => ({ path: '/api/loans', body: { kitId: fx.kits.requestKit, start: loanDay(220), end: loanDay(221), purpose: 'Scope test request', installation: same(s).installation } }),
    staff: { own: [201], foreign: [403] },
  },
  'GET /api/loans/[id]': { who: 'kits:read', request: (s) => ({ path: `/api/loans/${fx.kits.loan[s]}` }), staff: { own: [200], foreign: [404] } },
  'POST /api/loans/[id]/transition': { who: 'loan-cancel', request: async (s) => ({ path: `/api/loans/${await freshLoan(s)}/transition`, body: { to: 'cancelled', note: 'scope test' } }), staff: { own: [200], foreign: [404] } },

  'GET /api/walkthroughs': { who: 'walkthroughs:read', request: (s) => ({ path: `/api/walkthroughs?installation=${same(s).installation}` }), staff: { own: [200], foreign: [403] } },
  'POST /api/walkthroughs': { who: 'walkthroughs:plan', ok: [201], request: (s) => ({ path: '/api/walkthroughs', body: { buildingId: same(s).building, title: 'Planned by the scope test', plannedOn: '2027-04-02' } }), staff: { own: [201], foreign: [404] } },
  'GET /api/walkthroughs/planning': { who: 'walkthroughs:plan', request: (s) => ({ path: `/api/walkthroughs/planning?building=${same(s).building}` }), staff: { own: [200], foreign: [404] } },
  'GET /api/walkthroughs/[id]': { who: 'walkthroughs:read', request: (s) => ({ path: `/api/walkthroughs/${same(s).walkthrough}` }), staff: { own: [200], foreign: [404] } },
  'PATCH /api/walkthroughs/[id]': { who: 'walkthroughs:plan', request: (s) => ({ path: `/api/walkthroughs/${same(s).walkthrough}`, body: { title: 'Renamed by the scope test' } }), staff: { own: [200], foreign: [404] } },
  'GET /api/walkthroughs/[id]/suggestions': { who: 'walkthroughs:read', request: (s) => ({ path: `/api/walkthroughs/${same(s).walkthrough}/suggestions` }), staff: { own: [200], foreign: [404] } },
  'POST /api/walkthroughs/[id]/status': { who: 'walkthroughs:plan|field', ok: [200, 409], request: (s) => ({ path: `/api/walkthroughs/${same(s).walkthrough}/status`, body: { status: 'in-progress' } }), staff: { own: [200], foreign: [404] } },
  'GET /api/walkthroughs/[id]/findings': { who: 'walkthroughs:read', request: (s) => ({ path: `/api/walkthroughs/${same(s).walkthrough}/findings` }), staff: { own: [200], foreign: [404] } },
  'POST /api/walkthroughs/[id]/findings': { who: 'walkthroughs:field', request: (s) => ({ path: `/api/walkthroughs/${same(s).walkthrough}/findings`, body: { title: 'Found by staff', category: 'controls' } }), staff: { own: [201], foreign: [404] } },
  'GET /api/walkthroughs/[id]/photos': { who: 'walkthroughs:read', request: (s) => ({ path: `/api/walkthroughs/${same(s).walkthrough}/photos` }), staff: { own: [200], foreign: [404] } },
  'POST /api/walkthroughs/[id]/photos': { who: 'walkthroughs:field', request: (s) => ({ path: `/api/walkthroughs/${same(s).walkthrough}/photos`, body: scopePhoto() }), staff: { own: [201], foreign: [404] } },
  'PATCH /api/findings/[id]': { who: 'walkthroughs:field', request: (s) => ({ path: `/api/findings/${same(s).finding}`, body: { location: 'Basement' } }), staff: { own: [200], foreign: [404] } },
  'DELETE /api/findings/[id]': { who: 'walkthroughs:field', request: async (s) => ({ path: `/api/findings/${await spareFinding(s)}` }), staff: { own: [204], foreign: [404] } },
  'PUT /api/findings/[id]/measure': { who: 'walkthroughs:field|measures:approve', ok: [200, 409], request: (s) => ({ path: `/api/findings/${same(s).finding}/measure`, body: { annualEnergyCostSavings: 120, installedCost: 500, lifeYears: 5 } }), staff: { own: [200], foreign: [404] } },
  'GET /api/measures': { who: 'walkthroughs:read', request: (s) => ({ path: `/api/measures?installation=${same(s).installation}` }), staff: { own: [200], foreign: [403] } },
  'GET /api/measures/[id]': { who: 'walkthroughs:read', request: (s) => ({ path: `/api/measures/${same(s).measure}` }), staff: { own: [200], foreign: [404] } },
  // Staff may record an implementation but not approve: refused on the permission once in scope.
  'POST /api/measures/[id]/status': { who: 'measures:approve', ok: [200, 409], request: (s) => ({ path: `/api/measures/${same(s).measure}/status`, body: { status: 'approved' } }), staff: { own: [403], foreign: [403, 404] } },
  'GET /api/measures/rollup': { who: 'walkthroughs:read', request: (s) => ({ path: `/api/measures/rollup?installation=${same(s).installation}` }), staff: { own: [200], foreign: [403] } },
  'GET /api/measures/verified': { who: 'walkthroughs:read', request: (s) => ({ path: `/api/measures/verified?building=${same(s).building}` }), staff: { own: [200], foreign: [404] } },
  'GET /api/photos/[id]': { who: 'walkthroughs:read', request: (s) => ({ path: `/api/photos/${same(s).photo}` }), staff: { own: [200], foreign: [404] } },
  'PATCH /api/photos/[id]': { who: 'walkthroughs:field', request: (s) => ({ path: `/api/photos/${same(s).photo}`, body: { caption: 'Checked by the scope test' } }), staff: { own: [200], foreign: [404] } },
  'DELETE /api/photos/[id]': { who: 'walkthroughs:field', request: async (s) => ({ path: `/api/photos/${await sparePhoto(s)}` }), staff: { own: [204], foreign: [404] } },
  'GET /api/settings/discount-rate': { who: 'walkthroughs:read', request: () => ({ path: '/api/settings/discount-rate' }), staff: { own: [200], foreign: [200] } },
  'PUT /api/settings/discount-rate': { who: 'settings:discount', ok: INVALID, request: () => ({ path: '/api/settings/discount-rate', body: { realDiscountRatePercent: 55, effectiveFrom: 'not a date', source: '' } }), staff: { own: [403], foreign: [403] } },
  'GET /api/outbox': { who: 'outbox:read', ok: [200], request: () => ({ path: '/api/outbox' }), staff: { own: [403], foreign: [403] } },
  'GET /api/activity': { who: 'activity:read', ok: [200], request: () => ({ path: '/api/activity' }), staff: { own: [403], foreign: [403] } },
  'GET /api/walkthroughs/[id]/buildingsync': { who: 'walkthroughs:read', request: (s) => ({ path: `/api/walkthroughs/${same(s).walkthrough}/buildingsync` }), staff: { own: [200], foreign: [404] } },
  'GET /api/walkthroughs/[id]/report.pdf': { who: 'walkthroughs:read', request: (s) => ({ path: `/api/walkthroughs/${same(s).walkthrough}/report.pdf` }), staff: { own: [200], foreign: [404] } },
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
    const { path, body } = await c.request('own');
    const r = await call(null, methodOf(route), path, body);
    if (c.public) expect(r.status).toBeLessThan(400);
    else {
      expect(r.status).toBe(401);
      expect(r.body.error.code).toBe('unauthenticated');
    }
  });
  it('keeps installation staff inside their installation', async () => {
    const ownReq = await c.request('own');
    const own: CallResult = await call('staff', methodOf(route), ownReq.path, ownReq.body);
    expect(c.staff.own, `own: ${JSON.stringify(own.body)}`).toContain(own.status);
    const foreignReq = await c.request('foreign');
    const foreign: CallResult = await call('staff', methodOf(route), foreignReq.path, foreignReq.body);
    expect(c.staff.foreign, `foreign: ${JSON.stringify(foreign.body)}`).toContain(foreign.status);
    if (foreign.status >= 400 && !c.public) expect(foreign.body.error).toMatchObject({ code: expect.any(String), message: expect.any(String) });
  });
});

/**
 * The authorization matrix: every route × every role × own and foreign installation. A role that
 * may not call a route gets 403 (a scoped role reaching another installation may get 404: the
 * object is not there for it); one that may gets what the route answers on the merits, and a
 * scoped role reaching outside its installations gets what installation staff get there.
 */
function expected(route: string, role: Role, side: Side): number[] {
  const c = CASES[route]!;
  const ok = c.ok ?? c.staff.own;
  if (c.public) return ok;
  const may = (MAY[c.who!] as Role[]).includes(role);
  const scopedAway = SCOPED.includes(role) && side === 'foreign';
  if (!may) return scopedAway ? [403, 404] : [403];
  return scopedAway ? c.staff.foreign : ok;
}

describe('authorization matrix', () => {
  it('every route says who may call it and what they get', () => {
    const incomplete = Object.entries(CASES).filter(([, c]) => !c.public && (!c.who || (!c.ok && !(MAY[c.who] as Role[]).includes('staff'))));
    expect(incomplete.map(([r]) => r)).toEqual([]);
  });
  describe.each(['admin', 'manager', 'analyst', 'auditor', 'custodian', 'staff'] as Role[])('as %s', (role) => {
    it.each(Object.keys(CASES).filter((r) => !CASES[r]!.public))('%s', async (route) => {
      const c = CASES[route]!;
      for (const side of ['own', 'foreign'] as Side[]) {
        const { path, body } = await c.request(side);
        const r: CallResult = await call(role, methodOf(route), path, body);
        expect(expected(route, role, side), `${role} ${side} ${route} → ${r.status} ${JSON.stringify(r.body).slice(0, 300)}`).toContain(r.status);
        if (r.status === 403 || r.status === 404) expect(r.body.error).toMatchObject({ code: expect.any(String), message: expect.any(String) });
      }
    });
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
