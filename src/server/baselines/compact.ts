/**
 * What is kept of an engine result with each baseline: every shape's best model with its
 * statistics (for the side-by-side view and overrides), the acceptance checks, the periods used
 * with their predictions, and the notes on how the bills were prepared. The statistics'
 * definitions are constant (STATISTICS_CONVENTIONS) and not repeated per row.
 */
import type { BaselineResult } from '../../lib/baseline';

export function compactFit(result: BaselineResult, notes: object) {
  if (!result.ok) return { ok: false, reason: result.reason, detail: result.detail, periods: { ...result.periods, rows: null }, notes };
  const shapes = Object.fromEntries(
    Object.entries(result.shapes).map(([shape, o]) => [
      shape,
      o.ok ? { ok: true, heatingBalanceF: o.heatingBalanceF, coolingBalanceF: o.coolingBalanceF, adjR2: o.adjR2, candidatesEvaluated: o.candidatesEvaluated, model: o.model } : { ok: false, reason: o.reason, candidatesEvaluated: o.candidatesEvaluated },
    ]),
  );
  return { ok: true, selected: result.selected, acceptance: result.acceptance, shapes, periods: result.periods, notes };
}
