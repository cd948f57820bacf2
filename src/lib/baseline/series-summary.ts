/**
 * The compact, serializable summary of one series' fit: the fields a batch run or the CLI
 * prints. Fields that do not apply to the selected shape are null.
 */
import type { BaselineModel } from './model';
import type { BaselineResult, FitFailureReason } from './engine';
import type { AcceptanceStatus } from './acceptance';
import { normalizedAnnualConsumption } from './nac';
import type { NormalYearDegreeDays } from './normal-year';

export interface SelectedSummary extends BaselineModel {
  n: number;
  r2: number;
  adjR2: number;
  cvrmse: number | null;
  nmbe: number | null;
}

export interface SeriesSummary {
  id: string;
  ok: boolean;
  reason?: FitFailureReason;
  selected: SelectedSummary | null;
  nac: number | null;
  status: AcceptanceStatus | null;
}

/** Summarize a fit; NAC when a normal year is known. */
export function summarizeFit(id: string, result: BaselineResult, normal: NormalYearDegreeDays | null): SeriesSummary {
  if (!result.ok) return { id, ok: false, reason: result.reason, selected: null, nac: null, status: null };
  const m = result.selected;
  const nac = normal === null ? null : normalizedAnnualConsumption(m, normal);
  return {
    id,
    ok: true,
    selected: {
      shape: m.shape,
      intercept: m.intercept,
      heatingSlope: m.heatingSlope,
      coolingSlope: m.coolingSlope,
      slope: m.slope,
      heatingBalanceF: m.heatingBalanceF,
      coolingBalanceF: m.coolingBalanceF,
      n: m.quality.n,
      r2: m.quality.r2,
      adjR2: m.quality.adjR2,
      cvrmse: m.quality.cvrmse,
      nmbe: m.quality.nmbe,
    },
    nac: nac !== null && nac.ok ? nac.nac : null,
    status: result.acceptance.status,
  };
}
