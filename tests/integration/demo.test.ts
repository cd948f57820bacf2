/** The demo scenario loads into an empty database once, with its accounts and scopes. */
import { count, eq } from 'drizzle-orm';
import { describe, expect, it } from 'vitest';
import { getDb } from '../../src/db/client';
import { bill, building, installation, meter, user, weatherDay } from '../../src/db/schema';
import { loadActor } from '../../src/server/actor';
import { seedDemoIfEmpty, demoLoaded } from '../../src/server/demo';
import { generateDemoScenario } from '../../src/db/seed/scenario';

describe('demo scenario loading', () => {
  it('loads everything the generator produces, once', async () => {
    expect(await demoLoaded()).toBe(false);
    expect(await seedDemoIfEmpty({ today: '2026-11-30' })).toBe(true);
    expect(await seedDemoIfEmpty({ today: '2026-11-30' })).toBe(false);
    expect(await demoLoaded()).toBe(true);
    const s = generateDemoScenario({ today: '2026-11-30' });
    const db = await getDb();
    const n = async (t: Parameters<typeof db.select>[0] extends never ? never : any) => Number((await db.select({ n: count() }).from(t))[0]!.n);
    expect(await n(installation)).toBe(s.installations.length);
    expect(await n(building)).toBe(s.buildings.length);
    expect(await n(meter)).toBe(s.meters.length);
    // One duplicate bill (same meter and period) is folded into one row by the unique key.
    const distinct = new Set(s.bills.map((b) => `${b.meterCode}|${b.periodStart}|${b.periodEnd}`)).size;
    expect(await n(bill)).toBe(distinct);
    expect(await n(weatherDay)).toBe(s.stations.reduce((t, st) => t + st.days.length, 0));
    expect(await n(user)).toBe(s.people.length);
  });

  it('the staff account is scoped to one installation', async () => {
    const db = await getDb();
    const [staff] = await db.select().from(user).where(eq(user.email, 'staff@demo.plumbline.test'));
    const actor = await loadActor(staff!);
    expect(actor?.role).toBe('installation_staff');
    expect(actor?.installationIds).toHaveLength(1);
    const [inst] = await db.select().from(installation).where(eq(installation.id, actor!.installationIds[0]!));
    expect(inst!.code).toBe('BNP');
  });
});
