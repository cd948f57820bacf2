import { linearRegression } from 'simple-statistics';
import { describe, expect, it } from 'vitest';
import {
  installationTargetSchema,
  pathIntensityAt,
  projectTrend,
  targetIntensity,
  targetPath,
  targetStatus,
  type InstallationTarget,
} from '../../../src/lib/benchmark/targets';

// Constructed target: 100 kBtu/ft² in FY2015, 30 % lower (70) by FY2025.
const t: InstallationTarget = {
  baselineFy: 2015,
  baselineIntensity: 100,
  targetReductionPct: 30,
  targetFy: 2025,
};

describe('target path', () => {
  it('runs in a straight line from the baseline to the target (hand computed)', () => {
    // 100 × (1 − 0.30 × 5/10) = 85 in FY2020; 70 at FY2025; flat at 70 after; 100 before
    expect(pathIntensityAt(t, 2020)).toBeCloseTo(85, 12);
    expect(pathIntensityAt(t, 2025)).toBeCloseTo(70, 12);
    expect(pathIntensityAt(t, 2030)).toBeCloseTo(70, 12);
    expect(pathIntensityAt(t, 2010)).toBe(100);
    expect(targetIntensity(t)).toBeCloseTo(70, 12);
    const path = targetPath(t);
    expect(path).toHaveLength(11);
    expect(path[1]).toEqual({ fy: 2016, intensity: 97 });
  });

  it('reaches 30 % below an FY2003 baseline in FY2015, the end point of 42 U.S.C. 8253(a)', () => {
    // Source: 42 U.S.C. 8253(a)(1): FY2015 intensity 30 % below FY2003. (The statute's yearly steps
    // are not a straight line; only the end point is compared here.)
    const statute = {
      baselineFy: 2003,
      baselineIntensity: 120,
      targetReductionPct: 30,
      targetFy: 2015,
    };
    expect(pathIntensityAt(statute, 2015)).toBeCloseTo(84, 12);
  });

  it('needs a target year after the baseline year', () => {
    expect(installationTargetSchema.safeParse(t).success).toBe(true);
    expect(installationTargetSchema.safeParse({ ...t, targetFy: 2015 }).success).toBe(false);
    expect(installationTargetSchema.safeParse({ ...t, targetReductionPct: 0 }).success).toBe(false);
  });
});

describe('progress and on-track test', () => {
  it('progress = (baseline − current) / baseline: (100 − 88) / 100 = 0.12', () => {
    // Source: methods §6
    const s = targetStatus(t, 2020, 88);
    expect(s.progress).toBeCloseTo(0.12, 12);
    expect(s.requiredProgress).toBeCloseTo(0.15, 12);
    expect(s.gap).toBeCloseTo(3, 12);
    expect(s.onTrack).toBe(false);
  });

  it('is on track at or below the path', () => {
    expect(targetStatus(t, 2020, 85).onTrack).toBe(true);
    expect(targetStatus(t, 2020, 80).onTrack).toBe(true);
  });
});

describe('trend projection', () => {
  it('projects an exact line: 100, 96, 92 → slope −4, FY2030 = 60, reaches 70 in FY2028 (hand computed)', () => {
    const tt: InstallationTarget = {
      baselineFy: 2020,
      baselineIntensity: 100,
      targetReductionPct: 30,
      targetFy: 2030,
    };
    const r = projectTrend(tt, [
      { fy: 2020, intensity: 100 },
      { fy: 2021, intensity: 96 },
      { fy: 2022, intensity: 92 },
    ]);
    expect(r.ok).toBe(true);
    if (!r.ok) return;
    expect(r.slope).toBeCloseTo(-4, 12);
    // 100 − 4 × 10 = 60 at FY2030 ≤ 70: meets
    expect(r.projectedAtTargetFy).toBeCloseTo(60, 12);
    expect(r.meetsTarget).toBe(true);
    // 100 − 4 (fy − 2020) = 70 at fy = 2027.5: first whole fiscal year at or below is 2028
    expect(r.reachFy).toBe(2028);
  });

  it('agrees with simple-statistics linearRegression on noisy data', () => {
    // Reference: simple-statistics linearRegression (ordinary least squares)
    const pts = [
      { fy: 2016, intensity: 98.2 },
      { fy: 2017, intensity: 97.9 },
      { fy: 2018, intensity: 93.1 },
      { fy: 2019, intensity: 94.4 },
      { fy: 2020, intensity: 88.0 },
      { fy: 2021, intensity: 89.7 },
    ];
    const ref = linearRegression(pts.map((p) => [p.fy, p.intensity]));
    const r = projectTrend(t, pts);
    expect(r.ok).toBe(true);
    if (!r.ok) return;
    expect(r.slope).toBeCloseTo(ref.m, 9);
    expect(r.projectedAtTargetFy).toBeCloseTo(ref.m * 2025 + ref.b, 6);
  });

  it('never reaches the target on a flat or rising trend', () => {
    const r = projectTrend(t, [
      { fy: 2016, intensity: 95 },
      { fy: 2017, intensity: 97 },
    ]);
    expect(r).toMatchObject({ ok: true, meetsTarget: false, reachFy: null });
  });

  it('reports the latest year when already at or below the target', () => {
    const r = projectTrend(t, [
      { fy: 2016, intensity: 72 },
      { fy: 2017, intensity: 68 },
    ]);
    expect(r).toMatchObject({ ok: true, reachFy: 2017 });
  });

  it('needs two distinct fiscal years', () => {
    expect(projectTrend(t, [{ fy: 2016, intensity: 90 }])).toEqual({
      ok: false,
      reason: 'too-few-years',
      yearsUsed: 1,
    });
    expect(
      projectTrend(t, [
        { fy: 2016, intensity: 90 },
        { fy: 2016, intensity: 91 },
      ]),
    ).toMatchObject({ ok: false });
  });
});
