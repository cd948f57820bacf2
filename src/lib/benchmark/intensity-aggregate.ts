/**
 * Intensity of a group of buildings (an installation, a region): floor-area weighted, that is
 * Σ numerator / Σ floor area over the buildings that have the figure, never a mean of ratios.
 * The result says how many buildings and how much floor area it covers out of the group.
 * Uncertainties of the buildings' totals combine in quadrature (independent buildings).
 */
import { sum } from 'simple-statistics';
import type { BuildingIntensity, Figure, IntensityUnit } from './intensity';

export type IntensityMetric =
  | 'siteEui'
  | 'normalizedEui'
  | 'wui'
  | 'costIntensity'
  | 'energyCostIntensity'
  | 'sourceEui'
  | 'ghgIntensity';

export type AggregateFigure =
  | {
      readonly ok: true;
      readonly value: number;
      readonly unit: IntensityUnit;
      readonly total: number;
      readonly buildingsIncluded: number;
      readonly buildingsTotal: number;
      readonly areaIncludedFt2: number;
      readonly areaTotalFt2: number;
      /** Floor-area-weighted mean of the included buildings' coverage, 0–1. */
      readonly coverage: number;
      /** Lowest coverage of any included building. */
      readonly minCoverage: number;
      /** Buildings whose figure left out a commodity (no NAC or no factor). */
      readonly partialBuildings: number;
      readonly annualizedBuildings: number;
      readonly uncertainty: number | null;
    }
  | {
      readonly ok: false;
      readonly reason: 'no-data';
      readonly buildingsTotal: number;
      readonly areaTotalFt2: number;
    };

type OkFigure = Extract<Figure, { ok: true }>;

function metricOf(b: BuildingIntensity, metric: IntensityMetric): Figure | null {
  return b[metric];
}

/**
 * Floor-area-weighted intensity of `buildings` for one metric.
 * @example
 * // 1,000,000 kBtu on 10,000 ft² and 500,000 kBtu on 40,000 ft²: 1,500,000 / 50,000 = 30
 * aggregateIntensity(twoBuildings, 'siteEui').value // 30
 */
export function aggregateIntensity(
  buildings: readonly BuildingIntensity[],
  metric: IntensityMetric,
): AggregateFigure {
  const areaTotalFt2 = sum(buildings.map((b) => b.areaFt2));
  const figs: OkFigure[] = [];
  for (const b of buildings) {
    const f = metricOf(b, metric);
    if (f !== null && f.ok) figs.push(f);
  }
  if (figs.length === 0) {
    return { ok: false, reason: 'no-data', buildingsTotal: buildings.length, areaTotalFt2 };
  }
  const total = sum(figs.map((f) => f.total));
  const area = sum(figs.map((f) => f.areaFt2));
  const withU = figs.every((f) => f.totalUncertainty !== null);
  return {
    ok: true,
    value: total / area,
    unit: figs[0]!.unit,
    total,
    buildingsIncluded: figs.length,
    buildingsTotal: buildings.length,
    areaIncludedFt2: area,
    areaTotalFt2,
    coverage: sum(figs.map((f) => f.coverage * f.areaFt2)) / area,
    minCoverage: figs.reduce((m, f) => Math.min(m, f.coverage), 1),
    partialBuildings: figs.filter((f) => f.missing.length > 0).length,
    annualizedBuildings: figs.filter((f) => f.annualized).length,
    uncertainty: withU
      ? Math.sqrt(sum(figs.map((f) => (f.totalUncertainty ?? 0) ** 2))) / area
      : null,
  };
}

/**
 * Group buildings by a key (installation code, region) and aggregate each group.
 * @example aggregateBy(intensities, (b) => installationOf[b.buildingId], 'siteEui')
 */
export function aggregateBy(
  buildings: readonly BuildingIntensity[],
  keyOf: (b: BuildingIntensity) => string,
  metric: IntensityMetric,
): Map<string, AggregateFigure> {
  const groups = new Map<string, BuildingIntensity[]>();
  for (const b of buildings) {
    const k = keyOf(b);
    const g = groups.get(k);
    if (g) g.push(b);
    else groups.set(k, [b]);
  }
  const out = new Map<string, AggregateFigure>();
  for (const [k, g] of groups) out.set(k, aggregateIntensity(g, metric));
  return out;
}
