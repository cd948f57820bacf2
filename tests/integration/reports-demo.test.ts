/**
 * The loaded demo region has field work to show, and its walkthroughs make reports: kits and
 * instruments, loans with their history (one in use, none overlapping), completed walkthroughs
 * with measures, a measure implemented long enough ago for verified savings; the reports load
 * within the reader's installations, and the BuildingSync document validates against the
 * official BuildingSync 2.7.0 schema.
 */
import { readFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { count, eq, sql } from 'drizzle-orm';
import { beforeAll, describe, expect, it } from 'vitest';
import { validateXML } from 'xmllint-wasm';
import { getDb, queryRows } from '../../src/db/client';
import { instrument, kit, loan, loanEvent, measure, user, walkthrough } from '../../src/db/schema';
import { generateDemoScenario } from '../../src/db/seed/scenario';
import { INSTRUMENT_TYPES } from '../../src/lib/field/instruments';
import { toBuildingSync } from '../../src/lib/reports';
import { loadActor } from '../../src/server/actor';
import type { Actor } from '../../src/server/authz';
import { seedDemoIfEmpty } from '../../src/server/demo';
import { loadWalkthroughReport } from '../../src/server/reports/load';
import { renderWalkthroughPdf } from '../../src/server/reports/pdf';

const TODAY = '2026-11-30';
const s = generateDemoScenario({ today: TODAY });

async function demoActor(email: string): Promise<Actor> {
  const db = await getDb();
  const [u] = await db.select().from(user).where(eq(user.email, email));
  return (await loadActor(u!))!;
}

beforeAll(async () => {
  expect(await seedDemoIfEmpty({ today: TODAY })).toBe(true);
}, 180_000);

describe('the demo field work, as loaded', () => {
  it('has every kit, instrument, loan and event of the scenario', async () => {
    const db = await getDb();
    const n = async (t: typeof kit | typeof instrument | typeof loan | typeof loanEvent | typeof walkthrough | typeof measure) => Number((await db.select({ n: count() }).from(t))[0]!.n);
    expect(await n(kit)).toBe(s.field.kits.length);
    expect(s.field.kits.length).toBeGreaterThanOrEqual(4);
    expect(s.field.kits.length).toBeLessThanOrEqual(6);
    expect(await n(instrument)).toBe(s.field.kits.reduce((t, k) => t + k.instruments.length, 0));
    expect(await n(loan)).toBe(s.field.loans.length);
    expect(await n(loanEvent)).toBe(s.field.loans.reduce((t, l) => t + l.events.length, 0));
    expect(await n(walkthrough)).toBe(4);
    const types = await queryRows<{ type: string }>(db, sql`select distinct type from instrument`);
    expect(new Set(types.map((t) => t.type))).toEqual(new Set(INSTRUMENT_TYPES));
  });

  it('has at least two completed walkthroughs with measures, and one planned with a kit requested', async () => {
    const db = await getDb();
    const rows = await queryRows<{ status: string; measures: number; loan_status: string | null }>(
      db,
      sql`select w.status, (select count(*)::int from measure m where m.walkthrough_id = w.id) as measures,
                 (select l.status from loan l where l.walkthrough_id = w.id and l.status in ('requested','approved','shipped','in-use') limit 1) as loan_status
            from walkthrough w`,
    );
    expect(rows.filter((r) => r.status === 'completed' && r.measures > 0).length).toBeGreaterThanOrEqual(2);
    expect(rows.filter((r) => r.status === 'planned' && r.loan_status === 'requested')).toHaveLength(1);
  });

  it('has exactly one loan in use today, and no two holding loans of one kit overlap', async () => {
    const db = await getDb();
    const inUse = await queryRows<{ start_date: string; end_date: string }>(db, sql`select start_date::text, end_date::text from loan where status = 'in-use'`);
    expect(inUse).toHaveLength(1);
    expect(inUse[0]!.start_date <= TODAY && TODAY <= inUse[0]!.end_date).toBe(true);
    const overlaps = await queryRows<{ n: number }>(
      db,
      sql`select count(*)::int as n from loan a join loan b on a.kit_id = b.kit_id and a.id < b.id
           where a.status in ('requested','approved','shipped','in-use') and b.status in ('requested','approved','shipped','in-use')
             and daterange(a.start_date, a.end_date, '[]') && daterange(b.start_date, b.end_date, '[]')`,
    );
    expect(overlaps[0]!.n).toBe(0);
    // Calibration: one instrument past due, some due within 30 days.
    const cal = await queryRows<{ past: number; soon: number }>(db, sql`select count(*) filter (where calibration_due < ${TODAY}::date)::int as past, count(*) filter (where calibration_due between ${TODAY}::date and ${TODAY}::date + 30)::int as soon from instrument`);
    expect(cal[0]!.past).toBe(1);
    expect(cal[0]!.soon).toBeGreaterThanOrEqual(2);
  });

  it('has a measure implemented long enough ago for 12 or more bills of reporting period', async () => {
    const db = await getDb();
    const rows = await queryRows<{ implemented_on: string; bills: number }>(
      db,
      sql`select m.implemented_on::text, (select count(*)::int from bill b join meter mt on mt.id = b.meter_id
                                          where mt.building_id = m.building_id and mt.commodity = 'natural_gas' and b.period_start >= m.implemented_on) as bills
            from measure m where m.status = 'implemented'`,
    );
    expect(rows.length).toBeGreaterThanOrEqual(1);
    expect(rows[0]!.implemented_on).toBe(s.truth.retrofit.date);
    expect(rows[0]!.bills).toBeGreaterThanOrEqual(12);
  });
});

describe('reports of the demo walkthroughs', () => {
  const completed = s.field.walkthroughs.filter((w) => w.status === 'completed');
  const sbp = completed.find((w) => w.installationCode === 'SBP')!;
  const bnp = completed.find((w) => w.installationCode === 'BNP' && w.buildingNumber === '3102')!;

  it('load for the manager with findings, measures, stored economics, benchmark and baselines', async () => {
    const loaded = await loadWalkthroughReport(await demoActor('manager@demo.plumbline.test'), bnp.id);
    expect(loaded).not.toBeNull();
    const r = loaded!.report;
    expect(r.building.number).toBe('3102');
    expect(r.walkthrough.auditor?.email).toBe('auditor@demo.plumbline.test');
    expect(r.walkthrough.form.lighting.rows.length).toBeGreaterThan(0);
    const measures = r.findings.flatMap((f) => (f.measure ? [f.measure] : []));
    expect(measures).toHaveLength(3);
    for (const m of measures) expect(m.economics?.discountRatePercent).toBe(3);
    expect(r.benchmark?.siteEui).toBeGreaterThan(0);
    expect(r.baselines.length).toBeGreaterThan(0);
  });

  it('are not found for an auditor outside the walkthrough’s installations', async () => {
    const auditor = await demoActor('auditor@demo.plumbline.test'); // BNP and KSL
    expect(await loadWalkthroughReport(auditor, sbp.id)).toBeNull();
    expect(await loadWalkthroughReport(auditor, bnp.id)).not.toBeNull();
  });

  it('every demo walkthrough gives a BuildingSync document valid against the 2.7.0 schema, and a PDF', async () => {
    // Source: BuildingSync.xsd v2.7.0 (tests/fixtures/schemas/buildingsync-2.7.0, BSD-style licence).
    const dir = fileURLToPath(new URL('../fixtures/schemas/', import.meta.url));
    const admin = await demoActor('admin@demo.plumbline.test');
    for (const w of s.field.walkthroughs) {
      const { report } = (await loadWalkthroughReport(admin, w.id))!;
      const result = await validateXML({
        xml: { fileName: 'demo.xml', contents: toBuildingSync(report) },
        schema: { fileName: 'buildingsync-2.7.0/BuildingSync.xsd', contents: readFileSync(`${dir}buildingsync-2.7.0/BuildingSync.xsd`, 'utf8') },
        preload: [{ fileName: 'gbxml-stub.xsd', contents: readFileSync(`${dir}gbxml-stub.xsd`, 'utf8') }],
      });
      expect(result.errors, `${w.installationCode} ${w.buildingNumber}`).toEqual([]);
      const pdf = await renderWalkthroughPdf(report);
      expect(pdf.subarray(0, 5).toString('latin1')).toBe('%PDF-');
    }
  }, 120_000);
});
