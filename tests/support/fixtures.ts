/** Small invented inventories for integration tests (behaviour checks, not published values). */
import { getDb } from '../../src/db/client';
import { building, installation, meter, region, userInstallation, user } from '../../src/db/schema';
import type { Actor } from '../../src/server/authz';
import type { Role } from '../../src/lib/domain';

export async function twoInstallations() {
  const db = await getDb();
  const [reg] = await db.insert(region).values({ code: 'TST', name: 'Test region' }).returning();
  const [a, b] = await db
    .insert(installation)
    .values([
      { regionId: reg!.id, code: 'AAA', name: 'Alpha Yard', timeZone: 'UTC' },
      { regionId: reg!.id, code: 'BBB', name: 'Bravo Yard', timeZone: 'UTC' },
    ])
    .returning();
  const [ba, bb] = await db
    .insert(building)
    .values([
      { installationId: a!.id, number: '100', name: 'Alpha HQ', useType: 'office', grossAreaFt2: 10_000 },
      { installationId: b!.id, number: '200', name: 'Bravo HQ', useType: 'office', grossAreaFt2: 20_000 },
    ])
    .returning();
  const [ma, mb] = await db
    .insert(meter)
    .values([
      { installationId: a!.id, buildingId: ba!.id, code: 'AAA-100-E', commodity: 'electricity', unit: 'kWh' },
      { installationId: b!.id, buildingId: bb!.id, code: 'BBB-200-E', commodity: 'electricity', unit: 'kWh' },
    ])
    .returning();
  return { region: reg!, a: a!, b: b!, buildingA: ba!, buildingB: bb!, meterA: ma!, meterB: mb! };
}

/** An actor with a real user row (activity rows reference user ids loosely, assignments strictly). */
export async function actor(role: Role, installationIds: string[] = [], email = `${role}.${Math.random().toString(36).slice(2)}@example.test`): Promise<Actor> {
  const db = await getDb();
  const id = `u_${Math.random().toString(36).slice(2, 12)}`;
  await db.insert(user).values({ id, email, name: role, role });
  if (installationIds.length) await db.insert(userInstallation).values(installationIds.map((installationId) => ({ userId: id, installationId })));
  const scoped = role === 'installation_staff' || role === 'auditor';
  return { id, email, name: role, role, installationIds: scoped ? installationIds : [], scoped };
}
