/**
 * A building's signature for instrument suggestions, read from what Plumbline already holds:
 * its baseline models (base load, heating and cooling slopes per ft², balance points), its water
 * intensity, and lighting hours, occupancy and equipment from its latest earlier walkthrough;
 * each figure beside the median of buildings of the same use type in the actor's reach.
 */
import { and, desc, eq, ne, sql } from 'drizzle-orm';
import { median } from 'simple-statistics';
import { getDb, queryRows } from '../../db/client';
import { building, walkthrough } from '../../db/schema';
import { isEnergyCommodity, isHeatingFuel, USE_TYPE_LABELS, type Commodity, type Unit, type UseType } from '../../lib/domain';
import { suggestInstruments, type BuildingSignature, type EquipmentAge, type InstrumentSuggestions, type PeerFigure } from '../../lib/field/suggest-instruments';
import { conversionFactor, meterHeatContent } from '../../lib/units/convert';
import { scopeToInstallations, type Actor } from '../authz';
import { errors } from '../http';
import { readForm } from './service';

interface ModelRow {
  building_id: string;
  area: number;
  commodity: Commodity;
  unit: Unit;
  heat: number | null;
  shape: string | null;
  intercept: number | null;
  heating_slope: number | null;
  cooling_slope: number | null;
  heating_balance: number | null;
  cooling_balance: number | null;
  nac_converted: number | null;
  wui: number | null;
}

interface Figures {
  electricBaseLoad: number | null;
  baseLoadShare: number | null;
  heatingSlope: number | null;
  heatingFuel: number | null;
  heatingBalanceF: number | null;
  coolingSlope: number | null;
  coolingBalanceF: number | null;
  heatingAndCoolingModel: boolean;
  wui: number | null;
}

/** Per building: Σ of its meters' model terms in kBtu (base load per year, slopes per degree day), per ft². */
function figuresOf(rows: ModelRow[]): Figures {
  const area = rows[0]!.area;
  let elecBase: number | null = null;
  let base = 0;
  let nac = 0;
  let shareKnown = true;
  let heating: number | null = null;
  let heatingFuel: number | null = null;
  let cooling: number | null = null;
  let heatBal: { slope: number; f: number } | null = null;
  let coolBal: { slope: number; f: number } | null = null;
  let both = false;
  for (const r of rows) {
    if (r.shape === null || !isEnergyCommodity(r.commodity)) continue;
    const f = conversionFactor(r.commodity, r.unit, meterHeatContent(r.commodity, r.unit, r.heat ?? undefined));
    if (!f.ok) continue;
    const k = f.perUnit; // kBtu per billing unit
    // The linear shape's intercept is use at 0 °F, not a base load.
    const baseKbtu = r.shape !== 'linear' && r.intercept !== null ? r.intercept * 365 * k : null;
    if (r.commodity === 'electricity' && baseKbtu !== null) elecBase = (elecBase ?? 0) + baseKbtu / area;
    if (baseKbtu !== null && r.nac_converted !== null && r.nac_converted > 0) {
      base += baseKbtu;
      nac += r.nac_converted;
    } else shareKnown = false;
    // Weather-dependent use of a heating fuel at normal weather: what the slope and the balance point cost in a year.
    if (isHeatingFuel(r.commodity) && r.shape === 'heating' && baseKbtu !== null && r.nac_converted !== null) heatingFuel = (heatingFuel ?? 0) + (r.nac_converted - baseKbtu) / area;
    if (r.heating_slope !== null) {
      const v = (r.heating_slope * k * 1000) / area; // Btu/ft² per HDD
      heating = (heating ?? 0) + v;
      if (r.heating_balance !== null && (!heatBal || v > heatBal.slope)) heatBal = { slope: v, f: r.heating_balance };
    }
    if (r.cooling_slope !== null) {
      const v = (r.cooling_slope * k * 1000) / area;
      cooling = (cooling ?? 0) + v;
      if (r.cooling_balance !== null && (!coolBal || v > coolBal.slope)) coolBal = { slope: v, f: r.cooling_balance };
    }
    if (r.shape === 'heating-cooling') both = true;
  }
  return {
    electricBaseLoad: elecBase,
    baseLoadShare: shareKnown && nac > 0 ? base / nac : null,
    heatingSlope: heating,
    heatingFuel,
    heatingBalanceF: heatBal?.f ?? null,
    coolingSlope: cooling,
    coolingBalanceF: coolBal?.f ?? null,
    heatingAndCoolingModel: both,
    wui: rows[0]!.wui,
  };
}

function peerFigure(value: number | null, peers: (number | null)[]): PeerFigure | null {
  if (value === null) return null;
  const known = peers.filter((p): p is number => p !== null && Number.isFinite(p));
  return { value, peerMedian: known.length ? median(known) : null, peers: known.length };
}

/** The latest earlier walkthrough's lighting hours, occupancy and equipment, if any was recorded. */
async function fromEarlierWalkthroughs(buildingId: string, excludeId: string | null) {
  const db = await getDb();
  const rows = await db
    .select({ form: walkthrough.form })
    .from(walkthrough)
    .where(and(eq(walkthrough.buildingId, buildingId), ne(walkthrough.status, 'cancelled'), excludeId ? ne(walkthrough.id, excludeId) : undefined))
    .orderBy(desc(walkthrough.plannedOn))
    .limit(10);
  let lightingHoursPerYear: number | null = null;
  let occupiedHoursPerYear: number | null = null;
  let equipment: EquipmentAge[] = [];
  for (const { form: raw } of rows) {
    const form = readForm(raw);
    const lit = form.lighting.rows.filter((r) => r.hoursPerYear !== null);
    if (lightingHoursPerYear === null && lit.length) {
      const w = (r: (typeof lit)[number]) => (r.fixtureCount ?? 1) * (r.wattsPerFixture ?? 1);
      const total = lit.reduce((s, r) => s + w(r), 0);
      lightingHoursPerYear = total > 0 ? lit.reduce((s, r) => s + w(r) * r.hoursPerYear!, 0) / total : null;
    }
    if (occupiedHoursPerYear === null && form.building.occupiedHoursPerWeek !== null) occupiedHoursPerYear = form.building.occupiedHoursPerWeek * 52; // 52 weeks: common practice
    if (equipment.length === 0 && form.hvac.rows.length) {
      equipment = form.hvac.rows.map((r) => ({ equipment: r.equipment, label: [r.tag, r.equipment.replace(/-/g, ' ')].filter(Boolean).join(' ') || r.equipment, yearInstalled: r.yearInstalled, fuel: r.fuel }));
    }
  }
  return { lightingHoursPerYear, occupiedHoursPerYear, equipment };
}

/**
 * Instruments to bring to a walkthrough of the building, with the reasons.
 * @param excludeWalkthroughId the walkthrough being planned or filled (its own form is not "earlier")
 * @throws 404 when the building is outside the actor's scope
 */
export async function suggestionsForBuilding(actor: Actor, buildingId: string, excludeWalkthroughId: string | null = null, asOf = new Date()): Promise<InstrumentSuggestions & { signature: BuildingSignature }> {
  const db = await getDb();
  const [b] = await db
    .select({ useType: building.useType, yearBuilt: building.yearBuilt })
    .from(building)
    .where(and(eq(building.id, buildingId), scopeToInstallations(actor, building.installationId)));
  if (!b) throw errors.notFound('No such building in your installations.');
  const commodities = (await queryRows<{ commodity: Commodity }>(db, sql`select distinct commodity from meter where building_id = ${buildingId} and active`)).map((r) => r.commodity);
  const rows = await queryRows<ModelRow>(
    db,
    sql`select b.id as building_id, b.gross_area_ft2 as area, m.commodity, m.unit, m.heat_content_kbtu_per_unit as heat, bl.shape, bl.nac_converted,
               (bl.fit->'selected'->>'intercept')::float8 as intercept, (bl.fit->'selected'->>'heatingSlope')::float8 as heating_slope,
               (bl.fit->'selected'->>'coolingSlope')::float8 as cooling_slope, (bl.fit->'selected'->>'heatingBalanceF')::float8 as heating_balance,
               (bl.fit->'selected'->>'coolingBalanceF')::float8 as cooling_balance, bm.wui
          from building b
          left join meter m on m.building_id = b.id and m.active
          left join baseline bl on bl.meter_id = m.id and bl.shape is not null
          left join building_metric bm on bm.building_id = b.id
         where b.use_type = ${b.useType} and not b.archived and b.gross_area_ft2 > 0
           ${actor.scoped ? sql`and ${scopeToInstallations(actor, sql`b.installation_id`)}` : sql``}`,
  );
  const byBuilding = new Map<string, ModelRow[]>();
  for (const r of rows) {
    const list = byBuilding.get(r.building_id) ?? [];
    list.push(r);
    byBuilding.set(r.building_id, list);
  }
  const mine = byBuilding.has(buildingId) ? figuresOf(byBuilding.get(buildingId)!) : null;
  const peers = [...byBuilding.entries()].filter(([id]) => id !== buildingId).map(([, r]) => figuresOf(r));
  const earlier = await fromEarlierWalkthroughs(buildingId, excludeWalkthroughId);
  const label = USE_TYPE_LABELS[b.useType as UseType] ?? b.useType;
  const signature: BuildingSignature = {
    peerNoun: `buildings of type ${label} in your reach`,
    yearBuilt: b.yearBuilt,
    asOfYear: asOf.getUTCFullYear(),
    commodities,
    electricBaseLoad: peerFigure(mine?.electricBaseLoad ?? null, peers.map((p) => p.electricBaseLoad)),
    baseLoadShare: mine?.baseLoadShare ?? null,
    heatingSlope: peerFigure(mine?.heatingSlope ?? null, peers.map((p) => p.heatingSlope)),
    heatingFuelIntensity: peerFigure(mine?.heatingFuel ?? null, peers.map((p) => p.heatingFuel)),
    heatingBalanceF: mine?.heatingBalanceF ?? null,
    coolingSlope: peerFigure(mine?.coolingSlope ?? null, peers.map((p) => p.coolingSlope)),
    coolingBalanceF: mine?.coolingBalanceF ?? null,
    heatingAndCoolingModel: mine?.heatingAndCoolingModel ?? false,
    waterIntensity: peerFigure(mine?.wui ?? null, peers.map((p) => p.wui)),
    ...earlier,
  };
  return { ...suggestInstruments(signature), signature };
}
