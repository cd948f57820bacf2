/**
 * The demo scenario: an invented region of five installations in different climates, about 100
 * buildings with electricity, heating fuel and water meters, years of monthly bills generated from
 * stated physical parameters over synthetic daily weather, deliberate poor performers, one
 * retrofit, some messy data, and the demo accounts. Pure and deterministic: the same options give
 * byte-identical output. Documented in docs/demo-scenario.md.
 *
 * @example
 *   const scenario = generateDemoScenario({ seed: 2026, today: '2026-11-30' });
 *   scenario.bills.length; // about 15,000
 */
import { draftBills, billCost, type DraftBill } from './bills';
import { meterBuilding, type MeteredBuilding } from './building-meters';
import { planBuildings } from './buildings';
import { INSTALLATIONS, REGION, type InstallationSpec } from './climates';
import { civilToDay, dayToCivil, dayToIso, federalFiscalYear, isoToDay } from './dates';
import { dailyMeans, degreeDayNormals, type DegreeDayNormals } from './degree-days';
import { generateFieldData } from './field';
import { applyMessyData } from './messy';
import { unitPrice } from './meters';
import { demoPeople } from './people';
import { Rng } from './prng';
import { readSchedule } from './read-dates';
import {
  scenarioOptionsSchema,
  type DemoBill,
  type DemoMeter,
  type DemoScenario,
  type MeterTruth,
  type ScenarioOptions,
} from './types';
import { chooseDropouts, generateCompleteWeather, publishWeather } from './weather';
import { useTypeProfile } from './use-types';

export type { DemoScenario, ScenarioOptions } from './types';
export { demoScenarioSchema } from './types';

/** Water meters at this installation are read on a shared read date (next start = previous end). */
export const SHARED_READ_DATE_INSTALLATION = 'FHS';

/**
 * Generate the demo scenario.
 * @throws on invalid options (not an ISO date, fewer than 3 bill years or 10 weather years).
 */
export function generateDemoScenario(options: ScenarioOptions = {}): DemoScenario {
  const opts = scenarioOptionsSchema.parse(options);
  const today = isoToDay(opts.today);
  const todayYear = dayToCivil(today).year;
  const weatherFirst = civilToDay(todayYear - opts.weatherYears, 1, 1);
  // Earliest possible first bill start; weather gaps stay before it.
  const billsFrom = today - Math.round(opts.years * 365.25) - 27;

  const stations: DemoScenario['stations'] = [];
  const installations: DemoScenario['installations'] = [];
  const buildings: DemoScenario['buildings'] = [];
  const meters: DemoMeter[] = [];
  const truthMeters: Record<string, MeterTruth> = {};
  const drafts = new Map<string, DraftBill[]>();
  const metered: MeteredBuilding[] = [];
  const normalsBySite = new Map<string, DegreeDayNormals>();
  let firstBillDay = Number.POSITIVE_INFINITY;

  for (const site of INSTALLATIONS) {
    const weatherRng = new Rng(opts.seed, `weather:${site.code}`);
    const complete = generateCompleteWeather(site.weather, weatherRng, weatherFirst, today);
    const dropouts = chooseDropouts(weatherRng, complete, weatherFirst + 30, billsFrom - 30, 6);
    stations.push({ ...site.station, climate: site.climate, days: publishWeather(complete, dropouts) });
    const normals = degreeDayNormals(complete, todayYear);
    normalsBySite.set(site.code, normals);
    const means = dailyMeans(complete);

    for (const planned of planBuildings(site, new Rng(opts.seed, `buildings:${site.code}`), today)) {
      const m = meterBuilding(site, planned, normals, opts.seed, today);
      metered.push(m);
      buildings.push(planned.building);
      for (const meter of m.meters) {
        meters.push(meter);
        const regimes = m.regimes.get(meter.code);
        if (!regimes?.[0]) throw new Error(`no parameters for ${meter.code}`);
        truthMeters[meter.code] = regimes[0].truth;
        const rng = new Rng(opts.seed, `bills:${meter.code}`);
        const firstStart = today - Math.round(opts.years * 365.25) - rng.int(0, 27);
        const lastEnd = today - rng.int(3, 25);
        const shared = meter.commodity === 'water' && site.code === SHARED_READ_DATE_INSTALLATION;
        const periods = readSchedule(rng, firstStart, lastEnd, shared);
        firstBillDay = Math.min(firstBillDay, firstStart);
        drafts.set(
          meter.code,
          draftBills(
            {
              meter,
              regimes,
              periods,
              dailyMeanF: means,
              weatherFirstDay: weatherFirst,
              unitPrice: unitPrice(site, meter),
              escalationPct: site.escalationPct,
              loadFactor: meter.commodity === 'electricity' ? useTypeProfile(planned.building.useType).loadFactor : null,
            },
            rng,
          ),
        );
      }
    }
  }

  const baselineFy = federalFiscalYear(firstBillDay) + 1;
  for (const site of INSTALLATIONS) installations.push(installationRecord(site, baselineFy));

  const messy = applyMessyData(drafts, pickMessyMeters(metered, new Rng(opts.seed, 'messy')));
  const bills: DemoBill[] = [];
  for (const meter of meters) {
    for (const d of drafts.get(meter.code) ?? []) {
      bills.push({
        meterCode: meter.code,
        periodStart: dayToIso(d.period.start),
        periodEnd: dayToIso(d.period.end),
        quantity: d.quantity,
        unit: meter.unit,
        cost: billCost(d.quantity, d.unitPrice),
        demandKw: d.demandKw,
        estimated: d.estimated,
      });
    }
  }

  const retrofit = metered.find((m) => m.retrofit)?.retrofit;
  if (!retrofit) throw new Error('the retrofit building was not generated');
  const truth = {
    meters: truthMeters,
    retrofit,
    poorPerformers: metered.flatMap((m) => (m.poorPerformer ? [m.poorPerformer] : [])),
    messy,
  };
  const hddNormal = (code: string, baseF: number): number => {
    const n = normalsBySite.get(code);
    if (!n) throw new Error(`no normals for ${code}`);
    return n.hdd(baseF);
  };
  return {
    region: { code: REGION.code, name: REGION.name },
    stations,
    installations,
    buildings,
    meters,
    bills,
    people: demoPeople(),
    truth,
    field: generateFieldData(opts.seed, { today, buildings, meters, truth, hddNormal }),
  };
}

function installationRecord(site: InstallationSpec, baselineFy: number): DemoScenario['installations'][number] {
  return {
    code: site.code,
    name: site.name,
    regionCode: REGION.code,
    climate: site.climate,
    stationCode: site.station.code,
    timeZone: site.timeZone,
    target: { baselineFy, reductionPct: site.target.reductionPct, targetFy: baselineFy + site.target.yearsToTarget },
  };
}

/** Four different ordinary buildings carry the messy data; the estimate needs a heated fuel meter. */
function pickMessyMeters(metered: readonly MeteredBuilding[], rng: Rng): Parameters<typeof applyMessyData>[1] {
  const ordinary = rng.shuffle(metered.filter((m) => m.planned.special === null && !m.retrofit));
  const isFuel = (x: DemoMeter): boolean => x.commodity !== 'electricity' && x.commodity !== 'water';
  const heats = (m: MeteredBuilding, x: DemoMeter): boolean => isFuel(x) && (m.regimes.get(x.code)?.[0]?.truth.heatingSlope ?? 0) > 0;
  const heated = ordinary.find((m) => m.meters.some((x) => heats(m, x)));
  if (!heated) throw new Error('no heated ordinary building for the estimated read');
  const others = ordinary.filter((m) => m !== heated);
  const meterOf = (m: MeteredBuilding | undefined, pick: (x: DemoMeter) => boolean): DemoMeter => {
    const meter = m?.meters.find(pick);
    if (!meter) throw new Error('messy-data meter not found');
    return meter;
  };
  return {
    gap: meterOf(others[0], (x) => x.commodity === 'electricity'),
    estimated: meterOf(heated, (x) => heats(heated, x)),
    duplicate: meterOf(others[1], (x) => x.commodity === 'water'),
    zeroRead: meterOf(others[2], (x) => x.commodity === 'electricity'),
  };
}
