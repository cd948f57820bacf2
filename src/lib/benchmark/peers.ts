/**
 * National peers: which CBECS 2018 row a building is compared with, and where its EUI sits
 * against that row's quartiles.
 *
 * Method: each use type maps to the Table C12 row that describes it most literally (a subcategory
 * where EIA publishes one, else the principal activity). When the chosen row has a withheld (Q)
 * median or quartile, the comparison climbs to the parent row, and finally to "All buildings".
 * Source of the figures: U.S. EIA CBECS 2018 Table C12 (see ./cbecs-2018.ts).
 */
import type { UseType } from '../domain';
import { CBECS_2018_CITATION, cbecsRow, type CbecsActivity, type CbecsRow } from './cbecs-2018';

/**
 * Use type → CBECS 2018 activity row. Choices (project decisions, not EIA's):
 * - training → Education (principal activity; the classroom rows are dominated by K–12 schools);
 * - fitness → Public assembly / Recreation; clinic → Health care / Outpatient;
 * - retail → Mercantile / Retail (other than mall): a shop, not a mall;
 * - vehicle_maintenance → Service / Vehicle storage or maintenance;
 * - laboratory → Other / Laboratory;
 * - data_center → none: CBECS 2018 publishes no data-center row, so it falls back to All buildings
 *   and the match says so (a data center will look intensive against that median);
 * - other → All buildings (CBECS "Other" mixes laboratories, hangars and other intensive uses).
 */
export const USE_TYPE_TO_CBECS: Readonly<Record<UseType, CbecsActivity | null>> = {
  office: 'Office',
  lodging: 'Lodging',
  dining: 'Food service',
  warehouse: 'Warehouse and storage',
  retail: 'Retail (other than mall)',
  clinic: 'Outpatient',
  training: 'Education',
  fitness: 'Recreation',
  laboratory: 'Laboratory',
  vehicle_maintenance: 'Vehicle storage or maintenance',
  religious: 'Religious worship',
  data_center: null,
  other: 'All buildings',
};

/** How the peer row was found: the mapped row itself, a parent of it, or the all-buildings row. */
export type PeerMatch = 'mapped' | 'parent' | 'all-buildings';

export interface NationalPeer {
  /** The row whose median and quartiles are used. */
  readonly row: CbecsRow & { median: number; p25: number; p75: number };
  /** The row the use type (or override) asked for, before any fallback; null when none exists. */
  readonly requested: string | null;
  readonly match: PeerMatch;
  /** Citation to print beside the figures. */
  readonly source: string;
}

function complete(r: CbecsRow | undefined): r is NationalPeer['row'] {
  return r !== undefined && r.median !== null && r.p25 !== null && r.p75 !== null;
}

/**
 * The CBECS 2018 row a building of this use type is compared with. `override` names a Table C12
 * row directly (e.g. 'Dormitory, fraternity, or sorority' for barracks); an unknown label is
 * ignored and the use type's mapping applies.
 * @example nationalPeer('office').row.median // 53.5 (EIA CBECS 2018 Table C12)
 */
export function nationalPeer(useType: UseType, override?: string | null): NationalPeer {
  const requested =
    override != null && cbecsRow(override) !== undefined ? override : USE_TYPE_TO_CBECS[useType];
  let r = requested === null ? undefined : cbecsRow(requested);
  let match: PeerMatch = 'mapped';
  while (r !== undefined && !complete(r) && r.parent !== null) {
    r = cbecsRow(r.parent);
    match = 'parent';
  }
  if (!complete(r)) {
    r = cbecsRow('All buildings');
    match = 'all-buildings';
  }
  if (!complete(r)) throw new Error('CBECS table lacks the All buildings row'); // a bug, not input
  return { row: r, requested, match, source: CBECS_2018_CITATION };
}

/**
 * Where a site EUI sits against a row's quartiles. Boundaries belong to the upper band:
 * `first` < p25 ≤ `second` < median ≤ `third` < p75 ≤ `fourth`.
 */
export type QuartileBand = 'first' | 'second' | 'third' | 'fourth';

export interface QuartilePosition {
  readonly band: QuartileBand;
  /** (EUI − median) / median: +0.62 means 62 % above the median. */
  readonly vsMedian: number;
}

/**
 * Quartile band of `eui` (kBtu/ft²·yr) against the peer row, and its distance from the median.
 * @example quartilePosition(70, nationalPeer('office')).band // 'third' (53.5 ≤ 70 < 77.2)
 */
export function quartilePosition(eui: number, peer: NationalPeer): QuartilePosition {
  const { p25, median, p75 } = peer.row;
  const band: QuartileBand =
    eui < p25 ? 'first' : eui < median ? 'second' : eui < p75 ? 'third' : 'fourth';
  // A zero median exists only for vacant-type rows; report no relative distance then.
  const vsMedian = median > 0 ? (eui - median) / median : 0;
  return { band, vsMedian };
}
