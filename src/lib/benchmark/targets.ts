/**
 * Intensity targets per installation (methods §6): a baseline fiscal year and its intensity, a
 * reduction percentage to reach by a target fiscal year, and the straight line between them.
 *
 * - Path: I(fy) = I₀ · (1 − r · (fy − fy₀) / (fy_t − fy₀)) for fy₀ ≤ fy ≤ fy_t; I₀ before fy₀ and
 *   the target level I₀ · (1 − r) after fy_t.
 * - Progress = (I₀ − current) / I₀; on track when current ≤ path at that fiscal year.
 * - Projection: ordinary least-squares line through the (fiscal year, intensity) points available
 *   (centred sums for stability), evaluated at the target year; the year it reaches the target is
 *   the first whole fiscal year, from the latest year with data on, where the line is at or below
 *   the target level. No numeric federal target is built in: 42 U.S.C. 8253(a) (30 % by FY2015 from
 *   FY2003) is one example of the shape.
 */
import { z } from 'zod';

export const installationTargetSchema = z
  .object({
    baselineFy: z.number().int(),
    /** Intensity in the baseline fiscal year (any unit: kBtu/ft²·yr, gal/ft²·yr). */
    baselineIntensity: z.number().positive(),
    /** Reduction by the target year, percent of the baseline (30 = 30 %). */
    targetReductionPct: z.number().gt(0).max(100),
    targetFy: z.number().int(),
  })
  .refine((t) => t.targetFy > t.baselineFy, {
    message: 'target year must come after the baseline year',
    path: ['targetFy'],
  });
export type InstallationTarget = z.infer<typeof installationTargetSchema>;

export interface YearIntensity {
  readonly fy: number;
  readonly intensity: number;
}

/** Target level: baseline × (1 − reduction). */
export function targetIntensity(t: InstallationTarget): number {
  return t.baselineIntensity * (1 - t.targetReductionPct / 100);
}

/**
 * Intensity the straight-line path asks for in fiscal year `fy`.
 * @example pathIntensityAt({ baselineFy: 2015, baselineIntensity: 100, targetReductionPct: 30, targetFy: 2025 }, 2020) // 85
 */
export function pathIntensityAt(t: InstallationTarget, fy: number): number {
  const f = Math.min(1, Math.max(0, (fy - t.baselineFy) / (t.targetFy - t.baselineFy)));
  return t.baselineIntensity * (1 - (t.targetReductionPct / 100) * f);
}

/** One point per fiscal year from the baseline year to the target year. */
export function targetPath(t: InstallationTarget): YearIntensity[] {
  const out: YearIntensity[] = [];
  for (let fy = t.baselineFy; fy <= t.targetFy; fy++) {
    out.push({ fy, intensity: pathIntensityAt(t, fy) });
  }
  return out;
}

export interface TargetStatus {
  readonly fy: number;
  readonly current: number;
  readonly pathIntensity: number;
  /** (baseline − current) / baseline; 0.12 = 12 % below the baseline. */
  readonly progress: number;
  /** Progress the path asks for by this year. */
  readonly requiredProgress: number;
  /** current − path; negative when ahead of the path. */
  readonly gap: number;
  readonly onTrack: boolean;
}

/** Where an installation stands in fiscal year `fy` with intensity `current`. */
export function targetStatus(t: InstallationTarget, fy: number, current: number): TargetStatus {
  const path = pathIntensityAt(t, fy);
  return {
    fy,
    current,
    pathIntensity: path,
    progress: (t.baselineIntensity - current) / t.baselineIntensity,
    requiredProgress: (t.baselineIntensity - path) / t.baselineIntensity,
    gap: current - path,
    onTrack: current <= path,
  };
}

export type TrendProjection =
  | {
      readonly ok: true;
      /** Change per fiscal year (same unit as the intensities). */
      readonly slope: number;
      /** The line passes through (meanFy, meanIntensity) with `slope`. */
      readonly meanFy: number;
      readonly meanIntensity: number;
      readonly projectedAtTargetFy: number;
      readonly meetsTarget: boolean;
      /** First whole FY ≥ the latest year with data at or below the target; null if never. */
      readonly reachFy: number | null;
      readonly yearsUsed: number;
    }
  | { readonly ok: false; readonly reason: 'too-few-years'; readonly yearsUsed: number };

/**
 * Least-squares trend of the fiscal years available, projected to the target year.
 * @example
 * // target: 100 in FY2020, −30 % (70) by FY2030; data fall 4 a year
 * projectTrend(t, [{ fy: 2020, intensity: 100 }, { fy: 2021, intensity: 96 }, { fy: 2022, intensity: 92 }])
 * // slope −4; FY2030 projected 60 (meets); line hits 70 at 2027.5, so reachFy 2028
 */
export function projectTrend(
  t: InstallationTarget,
  history: readonly YearIntensity[],
): TrendProjection {
  const pts = history.filter((p) => Number.isFinite(p.fy) && Number.isFinite(p.intensity));
  const years = new Set(pts.map((p) => p.fy)).size;
  if (years < 2) return { ok: false, reason: 'too-few-years', yearsUsed: years };
  let mx = 0;
  let my = 0;
  for (const p of pts) {
    mx += p.fy;
    my += p.intensity;
  }
  mx /= pts.length;
  my /= pts.length;
  let sxx = 0;
  let sxy = 0;
  for (const p of pts) {
    sxx += (p.fy - mx) ** 2;
    sxy += (p.fy - mx) * (p.intensity - my);
  }
  const slope = sxy / sxx;
  const at = (fy: number) => my + slope * (fy - mx);
  const goal = targetIntensity(t);
  const latest = pts.reduce((m, p) => Math.max(m, p.fy), -Infinity);
  let reachFy: number | null = null;
  if (at(latest) <= goal) reachFy = latest;
  else if (slope < 0) {
    // Solve at(fy) = goal; the tolerance keeps 2027.9999999 from becoming 2028 by rounding noise.
    const exact = mx + (goal - my) / slope;
    reachFy = Math.max(latest, Math.ceil(exact - 1e-9));
  }
  const projected = at(t.targetFy);
  return {
    ok: true,
    slope,
    meanFy: mx,
    meanIntensity: my,
    projectedAtTargetFy: projected,
    meetsTarget: projected <= goal,
    reachFy,
    yearsUsed: years,
  };
}
