/**
 * Walkthrough services on a small invented inventory: planning with an assigned auditor, the
 * autosave's optimistic concurrency, the status path and what completing does, scope, photos on
 * disk with their limits (a renamed non-image refused by its bytes), findings.
 * (Behaviour checks on constructed data; no published values are involved.)
 */
import { existsSync, mkdtempSync, readdirSync, readFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { and, eq } from 'drizzle-orm';
import { beforeAll, describe, expect, it } from 'vitest';
import { getDb } from '../../src/db/client';
import { activityLog, building, buildingFlag, mailOutbox, walkthrough } from '../../src/db/schema';
import { emptyWalkthroughForm, lightingRowSchema, PHOTO_MAX_BYTES, SECTION_IDS } from '../../src/lib/field/walkthrough-form';
import type { Actor } from '../../src/server/authz';
import { changeWalkthroughStatus, saveForm } from '../../src/server/walkthroughs/form';
import { createFinding, deleteFinding, updateFinding } from '../../src/server/walkthroughs/findings';
import { addPhoto, deletePhoto, photoFile, updatePhoto } from '../../src/server/walkthroughs/photos';
import { getWalkthrough, listWalkthroughs, planWalkthrough, updatePlan } from '../../src/server/walkthroughs/service';
import { actor, twoInstallations } from '../support/fixtures';
import { rejects } from './walkthroughs-support';

const FILES = mkdtempSync(join(tmpdir(), 'plumbline-photos-'));
process.env.PLUMBLINE_FILES_DIR = FILES;

// A 1×1 PNG (PNG specification signature and chunks).
const PNG = Uint8Array.from(Buffer.from('iVBORw0KGgoAAAANSUhEUgAAAAEAAAABCAYAAAAfFcSJAAAADUlEQVR42mNk+M9QDwADhgGAWjR9awAAAABJRU5ErkJggg==', 'base64'));

let inv: Awaited<ReturnType<typeof twoInstallations>>;
let manager: Actor;
let staffA: Actor;
let auditorA: Actor;
let auditorB: Actor;
let flagId: string;


beforeAll(async () => {
  inv = await twoInstallations();
  manager = await actor('regional_manager');
  staffA = await actor('installation_staff', [inv.a.id]);
  auditorA = await actor('auditor', [inv.a.id], 'auditor.a@example.test');
  auditorB = await actor('auditor', [inv.b.id]);
  const db = await getDb();
  const [f] = await db.insert(buildingFlag).values({ buildingId: inv.buildingA.id, installationId: inv.a.id, reason: 'Lights on all night', flaggedBy: manager.id }).returning();
  flagId = f!.id;
});

describe('planning', () => {
  it('plans a walkthrough of a flagged building with an auditor of that installation, and mails the auditor', async () => {
    const { id } = await planWalkthrough(manager, { buildingId: inv.buildingA.id, title: 'Walkthrough of Alpha HQ', plannedOn: '2026-11-20', auditorId: auditorA.id });
    const w = await getWalkthrough(staffA, id);
    expect(w).toMatchObject({ status: 'planned', formVersion: 0, auditor: { id: auditorA.id }, flag: { id: flagId, open: true }, progress: { completed: 0, total: 8 } });
    const db = await getDb();
    const mail = await db.select().from(mailOutbox).where(eq(mailOutbox.toAddress, 'auditor.a@example.test'));
    expect(mail[0]!.subject).toMatch(/Walkthrough on 20 Nov 2026: AAA 100 Alpha HQ/);
    expect(mail[0]!.text).toContain(`/walkthroughs/${id}`);
  });

  it('refuses an auditor of another installation (422 naming the field) and a building outside the scope (404)', async () => {
    const e = await rejects(planWalkthrough(manager, { buildingId: inv.buildingA.id, title: 'Walk', plannedOn: '2026-11-20', auditorId: auditorB.id }));
    expect(e.status).toBe(422);
    expect(e.details).toEqual([{ field: 'auditorId', message: 'not an auditor assigned to AAA' }]);
    expect((await rejects(planWalkthrough(staffA, { buildingId: inv.buildingB.id, title: 'Walk', plannedOn: '2026-11-20', auditorId: null }))).status).toBe(404);
  });
});

describe('the form autosave', () => {
  it('takes the first edit, moves the walkthrough in progress, and refuses a save made on an older version', async () => {
    const { id } = await planWalkthrough(manager, { buildingId: inv.buildingA.id, title: 'Concurrency', plannedOn: '2026-11-21', auditorId: auditorA.id, flagId: null });
    const base = emptyWalkthroughForm();
    const lighting = { ...base.lighting, rows: [lightingRowSchema.parse({ id: 'r1', location: 'Lobby', fixtureCount: 12, wattsPerFixture: 64, hoursPerYear: 4000 })] };
    // Phone and laptop both opened version 0.
    const first = await saveForm(auditorA, id, { formVersion: 0, form: { lighting } });
    expect(first).toMatchObject({ formVersion: 1, status: 'in-progress' });
    const e = await rejects(saveForm(staffA, id, { formVersion: 0, form: { notes: { completed: false, text: 'from the laptop' } } }));
    expect(e.status).toBe(409);
    expect(e.details).toMatchObject({ reason: 'stale-version', formVersion: 1 });
    // The refused save changed nothing; a save on the current version merges by section.
    const second = await saveForm(staffA, id, { formVersion: 1, form: { notes: { completed: true, text: 'from the laptop' } } });
    expect(second.formVersion).toBe(2);
    const w = await getWalkthrough(auditorA, id);
    expect(w.form.lighting.rows.map((r) => r.location)).toEqual(['Lobby']);
    expect(w.form.notes).toEqual({ completed: true, text: 'from the laptop' });
    expect(w.progress.completed).toBe(1);
    const db = await getDb();
    const started = await db.select().from(activityLog).where(and(eq(activityLog.entityId, id), eq(activityLog.action, 'walkthrough.start')));
    expect(started).toHaveLength(1);
  });

  it('keeps a stored section that no longer parses as it was when other sections are saved', async () => {
    const { id } = await planWalkthrough(manager, { buildingId: inv.buildingA.id, title: 'Old form', plannedOn: '2026-11-22', auditorId: null });
    const db = await getDb();
    await db.update(walkthrough).set({ form: { hvac: { completed: 'yes', rows: 'legacy' } } }).where(eq(walkthrough.id, id));
    await saveForm(auditorA, id, { formVersion: 0, form: { notes: { completed: false, text: 'x' } } });
    const [row] = await db.select({ form: walkthrough.form }).from(walkthrough).where(eq(walkthrough.id, id));
    expect((row!.form as Record<string, unknown>).hvac).toEqual({ completed: 'yes', rows: 'legacy' });
    expect((await getWalkthrough(auditorA, id)).form.hvac).toEqual(emptyWalkthroughForm().hvac);
  });
});

describe('status', () => {
  it('completing lists what is open unless acknowledged; then dates the evaluation and clears the flag', async () => {
    const { id } = await planWalkthrough(manager, { buildingId: inv.buildingA.id, title: 'To complete', plannedOn: '2026-11-25', auditorId: auditorA.id, flagId });
    await saveForm(auditorA, id, { formVersion: 0, form: { notes: { completed: true, text: 'done' } } });
    const e = await rejects(changeWalkthroughStatus(auditorA, id, { status: 'completed', acknowledgeIncomplete: false, note: '' }));
    expect(e.status).toBe(409);
    const gaps = (e.details as { reason: string; gaps: { section: string }[] }).gaps;
    expect(gaps.map((g) => g.section)).toEqual(SECTION_IDS.filter((s) => s !== 'notes'));
    await changeWalkthroughStatus(auditorA, id, { status: 'completed', acknowledgeIncomplete: true, note: 'roof not accessible' });
    const db = await getDb();
    const [b] = await db.select({ last: building.lastEvaluatedOn }).from(building).where(eq(building.id, inv.buildingA.id));
    expect(b!.last).toBe('2026-11-25');
    const [f] = await db.select().from(buildingFlag).where(eq(buildingFlag.id, flagId));
    expect(f!.clearedAt).not.toBeNull();
    expect(f!.clearedBy).toBe(auditorA.id);
    // Closed: the form refuses edits, and a completed walkthrough cannot be cancelled.
    const closed = await rejects(saveForm(auditorA, id, { formVersion: 1, form: { notes: { completed: true, text: 'late edit' } } }));
    expect(closed.details).toMatchObject({ reason: 'not-editable' });
    expect((await rejects(changeWalkthroughStatus(manager, id, { status: 'cancelled', acknowledgeIncomplete: false, note: '' }))).status).toBe(409);
    // Reopened, it takes edits again.
    await changeWalkthroughStatus(auditorA, id, { status: 'in-progress', acknowledgeIncomplete: false, note: 'one more photo' });
    expect((await saveForm(auditorA, id, { formVersion: 1, form: { notes: { completed: true, text: 'late edit' } } })).formVersion).toBe(2);
  });

  it('only planners cancel; a cancelled walkthrough can be planned again', async () => {
    const { id } = await planWalkthrough(manager, { buildingId: inv.buildingA.id, title: 'To cancel', plannedOn: '2026-12-02', auditorId: null });
    expect((await rejects(changeWalkthroughStatus(auditorA, id, { status: 'cancelled', acknowledgeIncomplete: false, note: '' }))).status).toBe(403);
    await changeWalkthroughStatus(staffA, id, { status: 'cancelled', acknowledgeIncomplete: false, note: 'building closed' });
    expect((await rejects(updatePlan(manager, id, { title: 'Renamed' }))).status).toBe(409);
    await changeWalkthroughStatus(staffA, id, { status: 'planned', acknowledgeIncomplete: false, note: '' });
    expect((await updatePlan(manager, id, { title: 'Renamed' })).title).toBe('Renamed');
  });
});

describe('scope', () => {
  it('an auditor of one installation neither lists nor reads another installation’s walkthroughs', async () => {
    const { id } = await planWalkthrough(manager, { buildingId: inv.buildingB.id, title: 'Bravo walk', plannedOn: '2026-11-26', auditorId: auditorB.id });
    const mine = await listWalkthroughs(auditorA);
    expect(mine.length).toBeGreaterThan(0);
    expect(new Set(mine.map((w) => w.installationCode))).toEqual(new Set(['AAA']));
    expect((await rejects(getWalkthrough(auditorA, id))).status).toBe(404);
    expect((await rejects(saveForm(auditorA, id, { formVersion: 0, form: { notes: { completed: false, text: 'x' } } }))).status).toBe(404);
    expect((await listWalkthroughs(manager, { status: ['planned'], installation: 'BBB' })).map((w) => w.id)).toEqual([id]);
  });
});

describe('photos', () => {
  let id: string;
  beforeAll(async () => {
    id = (await planWalkthrough(manager, { buildingId: inv.buildingA.id, title: 'Photos', plannedOn: '2026-11-27', auditorId: auditorA.id })).id;
  });

  it('stores a photo under the data folder and serves it back only within the scope', async () => {
    const p = await addPhoto(auditorA, id, { bytes: PNG, thumb: PNG, tag: 'nameplate', caption: 'Boiler B-1', findingId: null });
    expect(p).toMatchObject({ tag: 'nameplate', mime: 'image/png', bytes: PNG.length, hasThumb: true });
    const files = readdirSync(join(FILES, 'photos', id));
    expect(files.filter((f) => !f.includes('.thumb.'))).toEqual([expect.stringMatching(/^[0-9a-f-]{36}\.png$/)]);
    expect(Buffer.from((await photoFile(staffA, p.id, 'full')).bytes).equals(Buffer.from(PNG))).toBe(true);
    expect((await photoFile(staffA, p.id, 'thumb')).mime).toBe('image/png');
    expect((await rejects(photoFile(auditorB, p.id, 'full'))).status).toBe(404);
    expect((await rejects(updatePhoto(auditorB, p.id, { tag: 'other' }))).status).toBe(404);
    await deletePhoto(auditorA, p.id);
    expect(readdirSync(join(FILES, 'photos', id))).toEqual([]);
  });

  it('refuses a renamed non-image by its bytes (415) and a photo over the size limit (413), storing nothing', async () => {
    const text = new TextEncoder().encode('These are my notes, saved as boiler.jpg');
    expect((await rejects(addPhoto(auditorA, id, { bytes: text, thumb: null, tag: 'nameplate', caption: '', findingId: null }))).status).toBe(415);
    const big = new Uint8Array(PHOTO_MAX_BYTES + 1);
    big.set([0xff, 0xd8, 0xff, 0xe0]);
    expect((await rejects(addPhoto(auditorA, id, { bytes: big, thumb: null, tag: 'nameplate', caption: '', findingId: null }))).status).toBe(413);
    expect(existsSync(join(FILES, 'photos', id)) ? readdirSync(join(FILES, 'photos', id)) : []).toEqual([]);
  });

  it('attaches a photo to a finding of the same walkthrough only', async () => {
    const f = await createFinding(auditorA, id, { title: 'T12 lamps in the corridor', category: 'lighting', location: 'Corridor 1', description: '' });
    const p = await addPhoto(auditorA, id, { bytes: PNG, thumb: null, tag: 'lighting', caption: '', findingId: f.id });
    const other = (await planWalkthrough(manager, { buildingId: inv.buildingA.id, title: 'Other', plannedOn: '2026-11-28', auditorId: null })).id;
    const g = await createFinding(auditorA, other, { title: 'Other finding', category: 'other', location: '', description: '' });
    expect((await rejects(updatePhoto(auditorA, p.id, { findingId: g.id }))).status).toBe(422);
    const w = await getWalkthrough(auditorA, id);
    expect(w.findings.find((x) => x.id === f.id)!.photoIds).toEqual([p.id]);
    expect(readFileSync(join(FILES, 'photos', id, readdirSync(join(FILES, 'photos', id))[0]!)).length).toBe(PNG.length);
  });
});

describe('findings', () => {
  it('are added, edited and removed within the scope', async () => {
    const { id } = await planWalkthrough(manager, { buildingId: inv.buildingA.id, title: 'Findings', plannedOn: '2026-11-29', auditorId: auditorA.id });
    const f = await createFinding(auditorA, id, { title: 'Leaking urinal flush valve', category: 'water', location: 'Men’s room 2nd floor', description: 'Runs continuously.' });
    expect((await updateFinding(auditorA, f.id, { status: 'dismissed' })).status).toBe('dismissed');
    expect((await rejects(updateFinding(auditorB, f.id, { title: 'Mine now' }))).status).toBe(404);
    await deleteFinding(auditorA, f.id);
    expect((await getWalkthrough(auditorA, id)).findings).toEqual([]);
  });
});
