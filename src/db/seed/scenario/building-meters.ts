/**
 * Meters and their physical parameters for one planned building, with the poor performers'
 * faults and the retrofit applied: the truth each meter's bills are generated from, and the
 * regimes (parameters by date) when something changes partway.
 */
import type { InstallationSpec } from './climates';
import { firstOfMonthOffset, dayToIso } from './dates';
import type { DegreeDayNormals } from './degree-days';
import { computeLoads, drawLoadShape, sig, type BuildingLoads, type LoadInputs } from './load-parameters';
import { fuelKbtuPerUnit, metersFor, waterGalPerUnit, type MeterSet } from './meters';
import type { PlannedBuilding } from './buildings';
import { Rng } from './prng';
import type { Regime } from './bills';
import { POOR_PERFORMERS, RETROFIT, type PoorPerformerSpec } from './specials';
import type { DemoMeter, MeterTruth, PoorPerformer, Retrofit } from './types';
import { useTypeProfile } from './use-types';

export interface MeteredBuilding {
  planned: PlannedBuilding;
  meters: DemoMeter[];
  /** Parameters by date per meter code (one regime unless something changes). */
  regimes: Map<string, Regime[]>;
  poorPerformer: PoorPerformer | null;
  retrofit: Retrofit | null;
}

export function meterBuilding(
  site: InstallationSpec,
  planned: PlannedBuilding,
  normals: DegreeDayNormals,
  seed: number,
  today: number,
): MeteredBuilding {
  const b = planned.building;
  const profile = useTypeProfile(b.useType);
  const set = metersFor(site, b.number, planned.fuel, new Rng(seed, `meters:${b.number}`));
  const shape = drawLoadShape(new Rng(seed, `loads:${b.number}`), profile, planned.fuel === 'fuel_oil_2');
  const special = planned.special;
  if (special?.heatingBalanceF !== undefined) shape.heatingBalanceF = special.heatingBalanceF;
  if (special?.coolingBalanceF !== undefined) shape.coolingBalanceF = special.coolingBalanceF;

  const input: LoadInputs = {
    profile,
    areaFt2: b.grossAreaFt2,
    euiFactor: planned.euiFactor,
    site,
    normals,
    fuel: set.fuel ? { unit: set.fuel.unit, kbtuPerUnit: fuelKbtuPerUnit(set.fuel) } : null,
    waterGalPerUnit: waterGalPerUnit(set.water.unit),
  };
  const medianBudget = b.grossAreaFt2 * profile.medianEui;
  const meters = [set.electricity, ...(set.fuel ? [set.fuel] : []), set.water];
  const poorSpec = POOR_PERFORMERS.find((p) => p.number === b.number) ?? null;

  if (poorSpec) {
    const changeDay = poorSpec.changeMonthsAgo === undefined ? null : firstOfMonthOffset(today, -poorSpec.changeMonthsAgo);
    const normal = computeLoads(input, shape);
    const faulty = computeLoads(input, shape, poorSpec.extras(medianBudget));
    const before = changeDay === null ? faulty : normal;
    const regimes = regimesFrom(set, before);
    const faultMeter = pickMeter(set, poorSpec.faultMeter);
    const entry: PoorPerformer = {
      buildingNumber: b.number,
      installationCode: site.code,
      kind: poorSpec.kind,
      meterCode: faultMeter.code,
      reason: poorSpec.reason,
      intendedEuiMultiple: poorSpec.intendedEuiMultiple,
    };
    if (changeDay !== null) {
      const after = truthOf(faulty, poorSpec.faultMeter);
      regimes.get(faultMeter.code)?.push({ fromDay: changeDay, truth: after });
      entry.changedOn = dayToIso(changeDay);
      entry.after = after;
    }
    return { planned, meters, regimes, poorPerformer: entry, retrofit: null };
  }

  const loads = computeLoads(input, shape);
  const regimes = regimesFrom(set, loads);
  if (b.number !== RETROFIT.number || !set.fuel) return { planned, meters, regimes, poorPerformer: null, retrofit: null };

  const before = loads.fuel as MeterTruth;
  const after: MeterTruth = { ...before, heatingSlope: sig(before.heatingSlope * (1 - RETROFIT.heatingSlopeDropPct / 100)) };
  const date = firstOfMonthOffset(today, -RETROFIT.monthsAgo);
  regimes.get(set.fuel.code)?.push({ fromDay: date, truth: after });
  const retrofit: Retrofit = {
    meterCode: set.fuel.code,
    buildingNumber: b.number,
    installationCode: site.code,
    measure: RETROFIT.measure,
    date: dayToIso(date),
    reductionPct: RETROFIT.heatingSlopeDropPct,
    before,
    after,
  };
  return { planned, meters, regimes, poorPerformer: null, retrofit };
}

function regimesFrom(set: MeterSet, loads: BuildingLoads): Map<string, Regime[]> {
  const regimes = new Map<string, Regime[]>();
  regimes.set(set.electricity.code, [{ fromDay: 0, truth: loads.electricity }]);
  if (set.fuel && loads.fuel) regimes.set(set.fuel.code, [{ fromDay: 0, truth: loads.fuel }]);
  regimes.set(set.water.code, [{ fromDay: 0, truth: loads.water }]);
  return regimes;
}

function pickMeter(set: MeterSet, which: PoorPerformerSpec['faultMeter']): DemoMeter {
  if (which === 'fuel') {
    if (!set.fuel) throw new Error('a fuel fault needs a fuel meter');
    return set.fuel;
  }
  return which === 'electricity' ? set.electricity : set.water;
}

function truthOf(loads: BuildingLoads, which: PoorPerformerSpec['faultMeter']): MeterTruth {
  if (which === 'fuel') {
    if (!loads.fuel) throw new Error('a fuel fault needs a fuel meter');
    return loads.fuel;
  }
  return which === 'electricity' ? loads.electricity : loads.water;
}
