/** The installation scope is part of every query: staff of one installation never reach another's rows. */
import { describe, expect, it, beforeAll } from 'vitest';
import { can, GRANTS, PERMISSIONS } from '../../src/server/authz';
import { HttpError } from '../../src/server/http';
import { createBuilding, getBuilding, listBuildings, updateBuilding } from '../../src/server/services/buildings';
import { listInstallations } from '../../src/server/services/installations';
import { listBills, listMeters } from '../../src/server/services/meters';
import { actor, twoInstallations } from '../support/fixtures';

let fx: Awaited<ReturnType<typeof twoInstallations>>;
beforeAll(async () => {
  fx = await twoInstallations();
});

async function status(p: Promise<unknown>): Promise<number> {
  try {
    await p;
    return 200;
  } catch (e) {
    if (e instanceof HttpError) return e.status;
    throw e;
  }
}

describe('installation scope', () => {
  it('staff see only their installation in lists', async () => {
    const staff = await actor('installation_staff', [fx.a.id]);
    expect((await listInstallations(staff)).map((i) => i.code)).toEqual(['AAA']);
    expect((await listBuildings(staff)).map((b) => b.number)).toEqual(['100']);
    expect((await listMeters(staff, {})).map((m) => m.code)).toEqual(['AAA-100-E']);
  });

  it('staff get 404 for another installation’s building and meter, and 403 for its code', async () => {
    const staff = await actor('installation_staff', [fx.a.id]);
    expect(await status(getBuilding(staff, fx.buildingA.id))).toBe(200);
    expect(await status(getBuilding(staff, fx.buildingB.id))).toBe(404);
    expect(await status(updateBuilding(staff, fx.buildingB.id, { name: 'Taken over' }))).toBe(404);
    expect(await status(listBills(staff, fx.meterB.id))).toBe(404);
    expect(await status(listBuildings(staff, { installation: 'BBB' }))).toBe(403);
    expect(await status(createBuilding(staff, { installation: 'BBB', number: '9', name: 'x', useType: 'office', grossAreaFt2: 1, yearBuilt: null, occupants: null, lastEvaluatedOn: null, notes: '' }))).toBe(403);
    // Nothing changed on the other side.
    const admin = await actor('admin');
    expect((await getBuilding(admin, fx.buildingB.id)).name).toBe('Bravo HQ');
  });

  it('staff with no installation assigned see nothing', async () => {
    const staff = await actor('installation_staff', []);
    expect(await listInstallations(staff)).toEqual([]);
    expect(await listBuildings(staff)).toEqual([]);
  });

  it('unscoped reading roles see both installations', async () => {
    for (const role of ['regional_manager', 'analyst', 'kit_custodian', 'admin'] as const) {
      const a = await actor(role);
      expect((await listInstallations(a)).map((i) => i.code)).toEqual(['AAA', 'BBB']);
    }
  });
});

describe('role grants', () => {
  it('only admins manage people; every permission is held by admin', () => {
    expect(GRANTS.admin).toEqual(PERMISSIONS);
    const holders = Object.entries(GRANTS).filter(([, p]) => p.includes('users:manage')).map(([r]) => r);
    expect(holders).toEqual(['admin']);
  });
  it('auditors may not edit the inventory; staff may', () => {
    const base = { id: 'x', email: 'x', name: 'x', installationIds: [], scoped: true };
    expect(can({ ...base, role: 'auditor' }, 'inventory:write')).toBe(false);
    expect(can({ ...base, role: 'installation_staff' }, 'inventory:write')).toBe(true);
    expect(can(null, 'inventory:read')).toBe(false);
  });
});
