/**
 * The field form's autosave and the walkthrough's status.
 *
 * Autosave is optimistic: the client sends the form version its edits were made on, and the
 * changed sections. A save on an older version is refused (409, `stale-version`, with the
 * current version) so that nothing typed elsewhere is overwritten silently; the client keeps its
 * edits and offers to reload. The first saved edit moves a planned walkthrough to in progress.
 */
import { and, eq, isNull, sql } from 'drizzle-orm';
import { getDb } from '../../db/client';
import { building, buildingFlag, walkthrough } from '../../db/schema';
import { formProgress, type WalkthroughStatus } from '../../lib/field/walkthrough-form';
import { canMoveWalkthrough, completionGaps, isFieldWorkOpen, WALKTHROUGH_STATUS_LABELS } from '../../lib/field/walkthrough-lifecycle';
import type { formSaveSchema, walkthroughStatusChangeSchema } from '../../lib/field/walkthrough-api';
import type { z } from 'zod';
import { logActivity } from '../activity';
import type { Actor } from '../authz';
import { errors } from '../http';
import { requireAny, walkthroughRef } from './access';
import { readForm } from './service';

export async function saveForm(actor: Actor, id: string, save: z.output<typeof formSaveSchema>, ip = '') {
  const db = await getDb();
  return db.transaction(async (tx) => {
    const w = await walkthroughRef(tx, actor, id, true);
    if (!isFieldWorkOpen(w.status)) {
      throw errors.conflict(`This walkthrough is ${WALKTHROUGH_STATUS_LABELS[w.status].toLowerCase()}: reopen it to change the form.`, { reason: 'not-editable', status: w.status });
    }
    if (w.formVersion !== save.formVersion) {
      const [cur] = await tx.select({ updatedAt: walkthrough.updatedAt }).from(walkthrough).where(eq(walkthrough.id, id));
      throw errors.conflict('This walkthrough was saved from somewhere else since you opened it. Your edits are kept on this device: reload to see the other changes and apply yours again.', {
        reason: 'stale-version',
        formVersion: w.formVersion,
        updatedAt: cur!.updatedAt.toISOString(),
      });
    }
    const sections = Object.fromEntries(Object.entries(save.form).filter(([, v]) => v !== undefined));
    const [stored] = await tx.select({ form: walkthrough.form }).from(walkthrough).where(eq(walkthrough.id, id));
    // Merge onto the stored document itself, so a section the client did not send stays exactly as stored.
    const merged = { ...((stored!.form ?? {}) as Record<string, unknown>), ...sections };
    const status: WalkthroughStatus = w.status === 'planned' ? 'in-progress' : w.status;
    const [after] = await tx
      .update(walkthrough)
      .set({ form: merged, formVersion: sql`${walkthrough.formVersion} + 1`, status, updatedAt: new Date() })
      .where(and(eq(walkthrough.id, id), eq(walkthrough.formVersion, save.formVersion)))
      .returning({ formVersion: walkthrough.formVersion, updatedAt: walkthrough.updatedAt });
    if (!after) throw errors.conflict('This walkthrough was saved from somewhere else at the same moment. Reload and apply your edits again.', { reason: 'stale-version', formVersion: w.formVersion + 1 });
    if (status !== w.status) {
      await logActivity({ action: 'walkthrough.start', userId: actor.id, actor: actor.email, entityType: 'walkthrough', entityId: id, installationId: w.installationId, ip }, tx);
    }
    return { formVersion: after.formVersion, status, updatedAt: after.updatedAt.toISOString(), progress: formProgress(readForm(merged)) };
  });
}

/**
 * Moves a walkthrough along its status path. Completing with open sections needs
 * `acknowledgeIncomplete` (409 `incomplete` with the list otherwise). Completion dates the
 * building's last evaluation and clears the flag the walkthrough answered.
 */
export async function changeWalkthroughStatus(actor: Actor, id: string, change: z.output<typeof walkthroughStatusChangeSchema>, ip = '') {
  const db = await getDb();
  return db.transaction(async (tx) => {
    const w = await walkthroughRef(tx, actor, id, true);
    const to = change.status;
    if (w.status === to) return { status: to, changed: false };
    if (!canMoveWalkthrough(w.status, to)) throw errors.conflict(`A walkthrough cannot go from ${WALKTHROUGH_STATUS_LABELS[w.status].toLowerCase()} to ${WALKTHROUGH_STATUS_LABELS[to].toLowerCase()}.`, { reason: 'not-allowed' });
    if (to === 'cancelled' || (w.status === 'cancelled' && to === 'planned')) requireAny(actor, ['walkthroughs:plan'], 'cancel or restore a walkthrough (walkthroughs:plan)');
    else requireAny(actor, ['walkthroughs:field', 'walkthroughs:plan'], 'change this walkthrough (walkthroughs:field)');
    if (to === 'completed') {
      const [row] = await tx.select({ form: walkthrough.form }).from(walkthrough).where(eq(walkthrough.id, id));
      const gaps = completionGaps(readForm(row!.form));
      if (gaps.length > 0 && !change.acknowledgeIncomplete) {
        throw errors.conflict(`${gaps.length} section${gaps.length === 1 ? ' is' : 's are'} not complete. Complete anyway, or go back to the form.`, { reason: 'incomplete', gaps });
      }
    }
    await tx
      .update(walkthrough)
      .set({ status: to, updatedAt: new Date(), completedAt: to === 'completed' ? new Date() : null })
      .where(eq(walkthrough.id, id));
    if (to === 'completed') {
      await tx.update(building).set({ lastEvaluatedOn: sql`greatest(coalesce(${building.lastEvaluatedOn}, ${w.plannedOn}::date), ${w.plannedOn}::date)` }).where(eq(building.id, w.buildingId));
      if (w.flagId) await tx.update(buildingFlag).set({ clearedAt: new Date(), clearedBy: actor.id }).where(and(eq(buildingFlag.id, w.flagId), isNull(buildingFlag.clearedAt)));
    }
    await logActivity(
      { action: `walkthrough.${to}`, userId: actor.id, actor: actor.email, entityType: 'walkthrough', entityId: id, installationId: w.installationId, ip, details: { from: w.status, to, note: change.note, acknowledgedIncomplete: change.acknowledgeIncomplete } },
      tx,
    );
    return { status: to, changed: true };
  });
}
