/**
 * From an annual energy budget to the physical parameters of each meter.
 *
 * A building's site energy is E = area × (CBECS median of its type) × factor. It is split into
 * base load, heating and cooling with weights that follow the climate:
 *   w_base = profile.base,  w_heat = profile.heat · HDD65_normal / 4500,  w_cool = profile.cool · CDD65_normal / 1500
 * so a cold site spends more of the same budget on heat. Then, in each meter's unit u (kBtu per
 * unit k_u):
 *   base per day   = E_base / (365 · k_u)
 *   heating slope  = E_heat / (HDD_normal(τH) · k_u)       (unit per °F·day)
 *   cooling slope  = E_cool / (CDD_normal(τC) · k_u)
 * which makes the normal-year use equal the budget exactly (365·base + βH·HDD + βC·CDD).
 */
import type { Unit } from '../../../lib/domain';
import type { DegreeDayNormals } from './degree-days';
import type { InstallationSpec } from './climates';
import type { Rng } from './prng';
import type { MeterTruth } from './types';
import type { UseTypeProfile } from './use-types';

// Source: U.S. EIA, Units and calculators explained: British thermal units (3,412 Btu/kWh).
export const KBTU_PER_KWH = 3.412;
// Source: U.S. EIA, Units and calculators explained (1 therm = 100,000 Btu).
export const KBTU_PER_THERM = 100;
// Source: U.S. EIA, Units and calculators explained (heating oil 138,500 Btu/gal).
export const KBTU_PER_GAL_OIL_2 = 138.5;
// Definition: 1 ccf = 100 ft³ = 748.052 gal (1 gal = 231 in³).
export const GAL_PER_CCF = 748.052;

const REFERENCE_HDD65 = 4500; // demo choice: weights are stated for a mixed climate
const REFERENCE_CDD65 = 1500; // demo choice
const MIN_ANNUAL_HDD = 250; // below this the heating slope is dropped into the base (demo choice)
const MIN_ANNUAL_CDD = 150; // likewise for cooling
const WATER_COOLING_BALANCE_F = 65; // demo choice: irrigation and towers follow CDD65

/** Random shape of one building's loads, drawn once so a changed budget keeps the same shape. */
export interface LoadShape {
  heatingBalanceF: number;
  coolingBalanceF: number;
  electricityCv: number;
  fuelCv: number;
  waterCv: number;
  waterFactor: number;
}

export function drawLoadShape(rng: Rng, profile: UseTypeProfile, fuelIsOil: boolean): LoadShape {
  const heatingBalanceF = rng.int(profile.heatingBalanceF[0], profile.heatingBalanceF[1]);
  const coolingBalanceF = rng.int(Math.max(heatingBalanceF + 3, 62), 70);
  return {
    heatingBalanceF,
    coolingBalanceF,
    electricityCv: round(rng.between(0.03, 0.06), 3),
    fuelCv: round(fuelIsOil ? rng.between(0.08, 0.12) : rng.between(0.05, 0.09), 3),
    waterCv: round(rng.between(0.08, 0.14), 3),
    waterFactor: rng.between(0.8, 1.2),
  };
}

/** Energy added on top of the budget (kBtu/yr) to make a deliberate poor performer. */
export interface LoadExtras {
  electricBaseKbtu?: number;
  fuelBaseKbtu?: number;
  heatingKbtu?: number;
  coolingKbtu?: number;
  waterMultiple?: number;
}

export interface LoadInputs {
  profile: UseTypeProfile;
  areaFt2: number;
  euiFactor: number;
  site: InstallationSpec;
  normals: DegreeDayNormals;
  /** Heating fuel meter, or null for an all-electric building. */
  fuel: { unit: Unit; kbtuPerUnit: number } | null;
  waterGalPerUnit: number;
}

export interface BuildingLoads {
  electricity: MeterTruth;
  fuel: MeterTruth | null;
  water: MeterTruth;
  /** Normal-year site energy the parameters add up to, kBtu. */
  annualKbtu: number;
}

export function computeLoads(input: LoadInputs, shape: LoadShape, extras: LoadExtras = {}): BuildingLoads {
  const { profile, normals } = input;
  const tauH = shape.heatingBalanceF;
  const tauC = shape.coolingBalanceF;
  const hddH = normals.hdd(tauH);
  const cddC = normals.cdd(tauC);
  const wBase = profile.base;
  const wHeat = hddH >= MIN_ANNUAL_HDD ? (profile.heat * normals.hdd(65)) / REFERENCE_HDD65 : 0;
  const wCool = cddC >= MIN_ANNUAL_CDD ? (profile.cool * normals.cdd(65)) / REFERENCE_CDD65 : 0;
  const total = input.areaFt2 * profile.medianEui * input.euiFactor;
  const wSum = wBase + wHeat + wCool;
  const baseKbtu = (total * wBase) / wSum;
  const heatKbtu = (total * wHeat) / wSum + (extras.heatingKbtu ?? 0);
  const coolKbtu = (total * wCool) / wSum + (extras.coolingKbtu ?? 0);
  const fuelBaseKbtu = input.fuel ? baseKbtu * profile.fuelBaseShare + (extras.fuelBaseKbtu ?? 0) : 0;
  const elecBaseKbtu = baseKbtu - (input.fuel ? baseKbtu * profile.fuelBaseShare : 0) + (extras.electricBaseKbtu ?? 0);

  const electricHeat = input.fuel === null && heatKbtu > 0;
  const electricity = meterTruth(
    {
      base: elecBaseKbtu / 365 / KBTU_PER_KWH,
      heating: electricHeat ? heatKbtu / hddH / KBTU_PER_KWH : 0,
      tauH,
      cooling: coolKbtu > 0 ? coolKbtu / cddC / KBTU_PER_KWH : 0,
      tauC,
    },
    shape.electricityCv,
    'kWh',
  );
  const fuel = input.fuel
    ? meterTruth(
        { base: fuelBaseKbtu / 365 / input.fuel.kbtuPerUnit, heating: heatKbtu > 0 ? heatKbtu / hddH / input.fuel.kbtuPerUnit : 0, tauH, cooling: 0, tauC },
        shape.fuelCv,
        input.fuel.unit,
      )
    : null;

  const waterGal = profile.wuiGalPerFt2 * input.areaFt2 * shape.waterFactor * (extras.waterMultiple ?? 1);
  const cdd65 = normals.cdd(WATER_COOLING_BALANCE_F);
  const coolingShare = cdd65 >= MIN_ANNUAL_CDD ? input.site.waterCoolingShare : 0;
  const water = meterTruth(
    {
      base: (waterGal * (1 - coolingShare)) / 365 / input.waterGalPerUnit,
      heating: 0,
      tauH,
      cooling: coolingShare > 0 ? (waterGal * coolingShare) / cdd65 / input.waterGalPerUnit : 0,
      tauC: WATER_COOLING_BALANCE_F,
    },
    shape.waterCv,
    input.site.waterUnit,
  );
  return { electricity, fuel, water, annualKbtu: total + (extras.electricBaseKbtu ?? 0) + (extras.fuelBaseKbtu ?? 0) + (extras.heatingKbtu ?? 0) + (extras.coolingKbtu ?? 0) };
}

/** Truth record with values rounded to 4 significant digits; bills are generated from these. */
function meterTruth(
  p: { base: number; heating: number; tauH: number; cooling: number; tauC: number },
  noiseCv: number,
  unit: Unit,
): MeterTruth {
  return {
    basePerDay: sig(p.base),
    heatingSlope: sig(p.heating),
    heatingBalanceF: p.heating > 0 ? p.tauH : null,
    coolingSlope: sig(p.cooling),
    coolingBalanceF: p.cooling > 0 ? p.tauC : null,
    noiseCv,
    unit,
  };
}

export function sig(x: number, digits = 4): number {
  return x === 0 ? 0 : Number(x.toPrecision(digits));
}

export function round(x: number, decimals: number): number {
  const f = 10 ** decimals;
  return Math.round(x * f) / f;
}
