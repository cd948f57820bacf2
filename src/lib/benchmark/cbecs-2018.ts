/**
 * CBECS 2018 site energy use intensity by building activity, as a typed table.
 *
 * Source: U.S. EIA, 2018 Commercial Buildings Energy Consumption Survey, Table C12 "Sum of major
 * fuel consumption totals and gross energy intensities by building activity subcategories, 2018",
 * release December 2022 (data source: Forms EIA-871A, C, D, E and F of the 2018 CBECS).
 * Transcribed from a public CSV export of the EIA workbook; re-check against EIA's c12.xlsx before
 * publishing figures. Site energy of the major fuels only (electricity, natural gas, fuel oil,
 * district heat), kBtu per gross ft² per year.
 *
 * `mean` is total energy / total floorspace of the group (floorspace-weighted); `p25`, `median`,
 * `p75` are percentiles of the building-level intensities. A cell EIA withheld ("Q": relative
 * standard error above 50 % or fewer than 20 sample buildings) is `null`.
 */

export type CbecsLevel = 'total' | 'activity' | 'subcategory' | 'subcategory2';

export interface CbecsRow<A extends string = string> {
  /** Row level in Table C12: all buildings, principal activity, subcategory, sub-subcategory. */
  readonly level: CbecsLevel;
  /** Row label exactly as EIA prints it. */
  readonly activity: A;
  /** Label of the row this one is a subcategory of; null for principal activities and the total. */
  readonly parent: string | null;
  /** Mean site EUI, kBtu/ft²·yr (total energy / total floorspace). */
  readonly mean: number | null;
  /** 25th percentile of building-level site EUI, kBtu/ft²·yr. */
  readonly p25: number | null;
  /** Median building-level site EUI, kBtu/ft²·yr. */
  readonly median: number | null;
  /** 75th percentile of building-level site EUI, kBtu/ft²·yr. */
  readonly p75: number | null;
}

function row<const A extends string>(
  level: CbecsLevel,
  activity: A,
  parent: string | null,
  mean: number | null,
  p25: number | null,
  median: number | null,
  p75: number | null,
): CbecsRow<A> {
  return { level, activity, parent, mean, p25, median, p75 };
}

/** Short citation shown next to any figure taken from this table. */
export const CBECS_2018_CITATION = 'U.S. EIA, CBECS 2018, Table C12 (released Dec 2022)';

// Source: U.S. EIA CBECS 2018 Table C12, release Dec 2022 (all 69 rows, in the table's order).
// level, activity, parent, mean, p25, median, p75 (kBtu/ft²·yr, site, major fuels)
export const CBECS_2018_C12 = [
  row('total', 'All buildings', null, 70.4, 22.6, 45.0, 80.6),
  row('activity', 'Education', null, 62.7, 31.1, 48.6, 74.4),
  row('subcategory', 'College or university', 'Education', 85.8, 32.7, 48.6, 78.4),
  row('subcategory', 'K–12', 'Education', 59.5, 31.9, 48.6, 69.5),
  row('subcategory2', 'Elementary school', 'K–12', 53.5, 29.5, 45.2, 59.8),
  row('subcategory2', 'Middle/junior high school', 'K–12', 61.7, 51.3, 67.9, 77.5),
  row('subcategory2', 'High school', 'K–12', 65.8, 31.6, 52.2, 75.0),
  row('subcategory2', 'Multi-grade school (any K–12)', 'K–12', 56.7, 31.9, 45.4, 69.1),
  row('subcategory', 'Preschool or daycare', 'Education', 57.7, 26.8, 52.4, 74.4),
  row('subcategory', 'Other classroom education', 'Education', 54.4, 11.2, 34.3, 72.4),
  row('activity', 'Food sales', null, 232.0, 150.5, 215.2, 311.2),
  row(
    'subcategory',
    'Convenience store (with or without gas station)',
    'Food sales',
    224.7,
    167.9,
    231.9,
    313.9,
  ),
  row('subcategory', 'Grocery store or food market', 'Food sales', 243.3, 150.5, 242.2, 273.2),
  row('subcategory', 'Other food sales', 'Food sales', null, null, null, null),
  row('activity', 'Food service', null, 263.3, 141.0, 232.9, 381.5),
  row('subcategory', 'Fast food', 'Food service', 326.8, 243.1, 324.9, 479.6),
  row('subcategory', 'Restaurant or cafeteria', 'Food service', 265.0, 132.2, 225.8, 365.8),
  row('subcategory', 'Other food service', 'Food service', 145.9, 80.6, 142.8, 188.2),
  row('activity', 'Health care', null, 144.5, 40.7, 61.1, 98.8),
  row('subcategory', 'Inpatient', 'Health care', 193.3, 140.4, 208.6, 252.9),
  row('subcategory', 'Outpatient', 'Health care', 82.0, 39.2, 60.6, 89.0),
  row('subcategory2', 'Office (diagnostic)', 'Outpatient', 63.0, 38.1, 51.2, 67.6),
  row('subcategory2', 'Clinic or other outpatient', 'Outpatient', 92.8, 45.1, 69.5, 102.8),
  row('activity', 'Lodging', null, 85.7, 53.3, 86.1, 120.3),
  row('subcategory', 'Hotel', 'Lodging', 77.7, 37.7, 72.8, 98.7),
  row('subcategory', 'Motel or inn', 'Lodging', 80.0, 57.6, 75.3, 108.1),
  row('subcategory', 'Dormitory, fraternity, or sorority', 'Lodging', 76.7, 46.8, 103.0, 123.3),
  row('subcategory', 'Nursing home or assisted living', 'Lodging', 115.6, 62.6, 122.2, 185.0),
  row('subcategory', 'Other lodging', 'Lodging', 72.2, 55.7, 75.7, 115.0),
  row('activity', 'Mercantile', null, 88.4, 33.1, 62.8, 108.1),
  row('subcategory', 'Retail (other than mall)', 'Mercantile', 64.1, 25.8, 40.8, 63.5),
  row('subcategory2', 'Retail store', 'Retail (other than mall)', 64.4, 25.0, 38.7, 63.1),
  row('subcategory2', 'Other retail', 'Retail (other than mall)', 62.3, 33.0, 56.9, 71.0),
  row('subcategory', 'Enclosed and strip malls', 'Mercantile', 111.0, 78.0, 113.5, 140.1),
  row(
    'subcategory2',
    'Strip shopping center',
    'Enclosed and strip malls',
    119.3,
    78.0,
    113.5,
    140.1,
  ),
  row('subcategory2', 'Enclosed mall', 'Enclosed and strip malls', 51.4, 26.8, 47.9, 68.6),
  row('activity', 'Office', null, 65.6, 36.3, 53.5, 77.2),
  row('subcategory', 'Administrative or professional', 'Office', 63.2, 33.5, 52.2, 72.0),
  row('subcategory', 'Bank or other financial', 'Office', 70.6, 46.3, 63.0, 92.1),
  row('subcategory', 'Government', 'Office', 64.7, 36.3, 52.9, 68.5),
  row('subcategory', 'Medical (non-diagnostic)', 'Office', 64.2, 34.1, 54.5, 85.3),
  row('subcategory', 'Mixed-use', 'Office', 73.8, 42.4, 57.9, 82.2),
  row('subcategory', 'Other office', 'Office', 54.5, 40.4, 51.9, 77.2),
  row('activity', 'Public assembly', null, 81.1, 26.8, 53.2, 90.0),
  row('subcategory', 'Library', 'Public assembly', 98.6, 63.3, 75.5, 97.7),
  row('subcategory', 'Entertainment or culture', 'Public assembly', 82.6, 8.5, 38.5, 53.9),
  row('subcategory', 'Recreation', 'Public assembly', 89.5, 30.4, 53.2, 121.8),
  row('subcategory', 'Social or meeting', 'Public assembly', 64.0, 21.2, 54.7, 82.1),
  row('subcategory', 'Other assembly', 'Public assembly', 100.3, 61.0, 64.8, 112.0),
  row('activity', 'Public order and safety', null, 86.3, 54.6, 75.0, 99.9),
  row('subcategory', 'Fire or police station', 'Public order and safety', 76.1, 47.1, 75.5, 99.9),
  row(
    'subcategory',
    'Courthouse or probation office',
    'Public order and safety',
    65.3,
    33.9,
    58.6,
    69.8,
  ),
  row('subcategory', 'Other public order', 'Public order and safety', 117.3, 59.0, 77.6, 112.5),
  row('activity', 'Religious worship', null, 35.3, 17.8, 32.9, 48.5),
  row('activity', 'Service', null, 50.9, 19.9, 37.3, 66.7),
  row('subcategory', 'Post office or postal center', 'Service', 72.1, 24.8, 38.6, 96.1),
  row('subcategory', 'Vehicle service or repair', 'Service', 44.4, 18.0, 37.5, 53.5),
  row('subcategory', 'Vehicle storage or maintenance', 'Service', 36.8, 16.1, 29.4, 50.4),
  row('subcategory', 'Other service', 'Service', 89.6, 36.7, 58.7, 94.5),
  row('activity', 'Warehouse and storage', null, 30.2, 2.2, 14.0, 35.2),
  row('subcategory', 'Nonrefrigerated', 'Warehouse and storage', 28.8, 2.2, 14.0, 35.2),
  row('subcategory2', 'Warehouse', 'Nonrefrigerated', 26.1, 5.5, 18.8, 40.1),
  row('subcategory2', 'Distribution or shipping center', 'Nonrefrigerated', 34.4, 15.1, 27.6, 52.6),
  row('subcategory2', 'Self storage units', 'Nonrefrigerated', 16.2, 0.0, 2.1, 5.5),
  row('subcategory', 'Refrigerated', 'Warehouse and storage', 107.0, 105.8, 113.5, 147.7),
  row('activity', 'Other', null, 134.8, 25.0, 54.2, 106.5),
  row('subcategory', 'Laboratory', 'Other', 184.5, 41.9, 86.4, 106.6),
  row('subcategory', 'Other (subcategory of Other)', 'Other', 114.3, 25.0, 51.9, 104.9),
  row('activity', 'Vacant', null, 16.8, 0.0, 1.9, 20.4),
] as const;

export type CbecsActivity = (typeof CBECS_2018_C12)[number]['activity'];

const BY_ACTIVITY: ReadonlyMap<string, CbecsRow> = new Map(
  CBECS_2018_C12.map((r) => [r.activity, r] as const),
);

/**
 * The Table C12 row with this exact label, or undefined.
 * @example cbecsRow('Office')?.median // 53.5
 */
export function cbecsRow(activity: string): CbecsRow | undefined {
  return BY_ACTIVITY.get(activity);
}

/** True when `activity` is a row label of Table C12. */
export function isCbecsActivity(activity: string): activity is CbecsActivity {
  return BY_ACTIVITY.has(activity);
}
