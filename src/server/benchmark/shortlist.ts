/**
 * The audit shortlist: buildings ranked by audit priority (src/lib/benchmark/priority.ts) from
 * their stored metrics, the region's weights and the open flags. The ranking is cached per set of
 * inputs (metrics run, weights, flags, the actor's scope) so that requests only slice and send it.
 */
import { sql } from 'drizzle-orm';
import { scorePriority, type PriorityCandidate, type PriorityScores } from '../../lib/benchmark/priority';
import { priorityBreakdown } from '../../lib/benchmark/priority-breakdown';
import { DEFAULT_PRIORITY_WEIGHTS, priorityWeightsSchema, type PriorityWeights } from '../../lib/benchmark/priority-weights';
import type { UseType } from '../../lib/domain';
import type { ShortlistItem } from '../../lib/benchmark/shortlist-item';
import { getDb, queryRows } from '../../db/client';
import { rankingWeights, region } from '../../db/schema';
import { logActivity } from '../activity';
import { scopeToInstallations, type Actor } from '../authz';

export type { ShortlistItem };

interface Row {
  building_id: string;
  number: string;
  name: string;
  use_type: UseType;
  installation_code: string;
  area: number;
  eui_normalized: number | null;
  site_eui: number | null;
  wui: number | null;
  normalized_provisional: boolean;
  price_per_kbtu: number | null;
  yoy_current_kbtu: number | null;
  yoy_previous_kbtu: number | null;
  anomaly_periods: number | null;
  anomaly_beyond: number | null;
  last_evaluated_on: string | null;
  flag_id: string | null;
  flag_reason: string | null;
  commodities: string[];
}

type Candidate = PriorityCandidate & { row: Row };

const KEY = Symbol.for('plumbline.shortlist-cache');
interface Ranking {
  candidates: Candidate[];
  scores: PriorityScores;
  weights: PriorityWeights;
  /** Serialized JSON answers already sent for this ranking, by query. */
  bodies: Map<string, Uint8Array<ArrayBuffer>>;
}
const MAX_BODIES = 32;
type Holder = typeof globalThis & { [KEY]?: Map<string, Ranking> };
const cache = ((globalThis as Holder)[KEY] ??= new Map());

export async function getWeights(): Promise<PriorityWeights & { updatedAt: string | null }> {
  const db = await getDb();
  const [row] = await db.select().from(rankingWeights).limit(1);
  const parsed = row ? priorityWeightsSchema.safeParse(row.weights) : null;
  return parsed?.success ? { ...parsed.data, updatedAt: row!.updatedAt.toISOString() } : { ...DEFAULT_PRIORITY_WEIGHTS, updatedAt: null };
}

export async function saveWeights(actor: Actor, weights: PriorityWeights, ip = ''): Promise<void> {
  const db = await getDb();
  const regions = await db.select({ id: region.id }).from(region);
  for (const r of regions) {
    await db
      .insert(rankingWeights)
      .values({ regionId: r.id, weights, updatedBy: actor.id })
      .onConflictDoUpdate({ target: rankingWeights.regionId, set: { weights, updatedBy: actor.id, updatedAt: new Date() } });
  }
  await logActivity({ action: 'shortlist.weights', userId: actor.id, actor: actor.email, ip, details: { weights } });
}

/**
 * What the cached ranking depends on: the `ranking` change counter (raised by triggers in the same
 * transaction as any change to buildings, meters, metrics, flags or weights; drizzle/0009) and the
 * actor's scope.
 */
async function version(actor: Actor): Promise<string> {
  return `${await rankingCounter()}|${actor.scoped ? actor.installationIds.join(',') : 'all'}`;
}

/**
 * The counter, read at most once at a time: callers that arrive while a read is running share the
 * next one, which starts after they arrived and so sees every change committed before they did.
 */
const COUNTER = Symbol.for('plumbline.ranking-counter');
type CounterHolder = typeof globalThis & { [COUNTER]?: { running: Promise<string> | null; next: Promise<string> | null } };
const counter = ((globalThis as CounterHolder)[COUNTER] ??= { running: null, next: null });

async function readCounter(): Promise<string> {
  const db = await getDb();
  const [v] = await queryRows<{ v: string | null }>(db, sql`select version::text as v from change_counter where topic = 'ranking'`);
  return v?.v ?? '0';
}

function rankingCounter(): Promise<string> {
  if (!counter.running) {
    const run: Promise<string> = readCounter().finally(() => {
      if (counter.running === run) counter.running = null;
    });
    counter.running = run;
    return run;
  }
  counter.next ??= counter.running
    .catch(() => undefined)
    .then(() => {
      counter.next = null;
      return rankingCounter();
    });
  return counter.next;
}

async function candidates(actor: Actor): Promise<Candidate[]> {
  const db = await getDb();
  const scope = scopeToInstallations(actor, sql`b.installation_id`);
  const rows = await queryRows<Row>(
    db,
    sql`select b.id as building_id, b.number, b.name, b.use_type, i.code as installation_code, b.gross_area_ft2 as area,
               m.eui_normalized, m.site_eui, m.wui, coalesce(m.normalized_provisional, false) as normalized_provisional, m.price_per_kbtu,
               m.yoy_current_kbtu, m.yoy_previous_kbtu, m.anomaly_periods, m.anomaly_beyond, b.last_evaluated_on::text,
               f.id as flag_id, f.reason as flag_reason,
               coalesce((select array_agg(distinct mt.commodity) from meter mt where mt.building_id = b.id and mt.active), '{}') as commodities
          from building b
          join installation i on i.id = b.installation_id
          left join building_metric m on m.building_id = b.id
          left join lateral (select id, reason from building_flag where building_id = b.id and cleared_at is null order by flagged_at desc limit 1) f on true
         where not b.archived ${scope ? sql`and ${scope}` : sql``}`,
  );
  return rows.map((r) => ({
    row: r,
    buildingId: r.building_id,
    buildingNumber: r.number,
    useType: r.use_type,
    areaFt2: r.area,
    euiNormalized: r.eui_normalized ?? r.site_eui,
    pricePerKbtu: r.price_per_kbtu,
    yoy: r.yoy_current_kbtu !== null && r.yoy_previous_kbtu !== null ? { current: r.yoy_current_kbtu, previous: r.yoy_previous_kbtu } : null,
    anomalies: r.anomaly_periods ? { recentPeriods: r.anomaly_periods, beyond2Se: r.anomaly_beyond ?? 0 } : null,
    lastEvaluated: r.last_evaluated_on,
    manualFlag: r.flag_id !== null,
    flagReason: r.flag_reason,
  }));
}

export interface ShortlistQuery {
  installation?: string | undefined;
  useType?: string | undefined;
  commodity?: string | undefined;
  minAreaFt2?: number | undefined;
  maxAreaFt2?: number | undefined;
  limit: number;
  offset: number;
  explain: number;
}

async function ranking(actor: Actor, asOf: string): Promise<Ranking> {
  const v = `${await version(actor)}|${asOf}`;
  let entry = cache.get(v);
  if (!entry) {
    const { updatedAt: _u, ...weights } = await getWeights();
    const list = await candidates(actor);
    entry = { candidates: list, scores: scorePriority(list, weights, { asOf }), weights, bodies: new Map() };
    if (cache.size > 50) cache.clear();
    cache.set(v, entry);
  }
  return entry;
}

/** The ranked shortlist the actor may see, filtered and paged; breakdowns for the first `explain` rows returned. */
export async function shortlist(actor: Actor, q: ShortlistQuery, asOf = new Date().toISOString().slice(0, 10)) {
  return slice(await ranking(actor, asOf), q, asOf);
}

/**
 * The same answer as `shortlist`, serialized as JSON (UTF-8). Identical queries against an
 * unchanged ranking are answered from the bytes sent before.
 */
export async function shortlistJson(actor: Actor, q: ShortlistQuery, asOf = new Date().toISOString().slice(0, 10)): Promise<Uint8Array<ArrayBuffer>> {
  const entry = await ranking(actor, asOf);
  const key = JSON.stringify([q.installation, q.useType, q.commodity, q.minAreaFt2, q.maxAreaFt2, q.limit, q.offset, q.explain]);
  let body = entry.bodies.get(key);
  if (!body) {
    body = new TextEncoder().encode(JSON.stringify(slice(entry, q, asOf)));
    if (entry.bodies.size >= MAX_BODIES) entry.bodies.delete(entry.bodies.keys().next().value!);
    entry.bodies.set(key, body);
  }
  return body;
}

function slice(entry: Ranking, q: ShortlistQuery, asOf: string) {
  const { candidates: list, scores } = entry;
  const keep = (row: Row) =>
    (!q.installation || row.installation_code === q.installation) &&
    (!q.useType || row.use_type === q.useType) &&
    (!q.commodity || row.commodities.includes(q.commodity)) &&
    (q.minAreaFt2 === undefined || row.area >= q.minAreaFt2) &&
    (q.maxAreaFt2 === undefined || row.area <= q.maxAreaFt2);
  const items: ShortlistItem[] = [];
  let total = 0;
  for (let r = 0; r < scores.n; r++) {
    const i = scores.order[r]!;
    const c = list[i]!;
    if (!keep(c.row)) continue;
    total++;
    if (total <= q.offset || items.length >= q.limit) continue;
    const row = c.row;
    const peer = scores.peers[i]!.row;
    items.push({
      buildingId: row.building_id,
      buildingNumber: row.number,
      name: row.name,
      installationCode: row.installation_code,
      useType: row.use_type,
      areaFt2: row.area,
      score: scores.score[i]!,
      rank: scores.rank[i]!,
      euiNormalized: row.eui_normalized,
      euiBasis: row.eui_normalized !== null ? 'normalized' : row.site_eui !== null ? 'actual' : 'none',
      normalizedProvisional: row.normalized_provisional,
      siteEui: row.site_eui,
      wui: row.wui,
      peerMedian: peer.median ?? 0,
      peerActivity: peer.activity,
      excessKbtu: scores.raw[0]![i]!,
      excessCost: c.pricePerKbtu === null ? null : scores.raw[1]![i]!,
      lastEvaluatedOn: row.last_evaluated_on,
      flag: row.flag_id ? { id: row.flag_id, reason: row.flag_reason ?? '' } : null,
      commodities: row.commodities,
      breakdown: items.length < q.explain ? priorityBreakdown(list, scores, i, asOf) : null,
    });
  }
  return { items, total, weights: entry.weights, asOf };
}

/** One building's place and breakdown in the actor's shortlist (for the building page). */
export async function shortlistEntry(actor: Actor, buildingId: string, asOf = new Date().toISOString().slice(0, 10)) {
  const entry = await ranking(actor, asOf);
  const i = entry.candidates.findIndex((c: Candidate) => c.buildingId === buildingId);
  if (i < 0) return null;
  return { rank: entry.scores.rank[i]!, of: entry.scores.n, score: entry.scores.score[i]!, breakdown: priorityBreakdown(entry.candidates, entry.scores, i, asOf) };
}
