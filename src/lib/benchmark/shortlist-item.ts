/**
 * One building of the audit shortlist as `GET /api/shortlist` sends it: shared by the server that
 * builds it and the islands that show it.
 */
import type { PriorityBreakdown } from './priority-breakdown';

export interface ShortlistItem {
  buildingId: string;
  buildingNumber: string;
  name: string;
  installationCode: string;
  useType: string;
  areaFt2: number;
  score: number;
  rank: number;
  euiNormalized: number | null;
  /** What the excess was measured on: the weather-normalized EUI, or the actual one when there is none. */
  euiBasis: 'normalized' | 'actual' | 'none';
  normalizedProvisional: boolean;
  siteEui: number | null;
  wui: number | null;
  peerMedian: number;
  peerActivity: string;
  excessKbtu: number;
  excessCost: number | null;
  lastEvaluatedOn: string | null;
  flag: { id: string; reason: string } | null;
  commodities: string[];
  breakdown: PriorityBreakdown | null;
}
