/**
 * Converts a bill quantity to site energy (kBtu) or to water volume (US gallons), by commodity
 * and unit, with the factors in ./factors. Resolve the factor once per meter with
 * `conversionFactor` and multiply in hot loops; `convertQuantity` does both for one value.
 */
import { z } from 'zod';
import type { Commodity, Unit } from '../domain';
import { isQuantityUnitFor } from './commodity-units';
import {
  CF_PER_CCF,
  CF_PER_MCF,
  DEFAULT_GAS_KBTU_PER_CF,
  GAL_PER_CCF,
  GAL_PER_KGAL,
  GAL_PER_M3,
  isLiquidFuel,
  KBTU_PER_DTH,
  KBTU_PER_GALLON,
  KBTU_PER_KWH,
  KBTU_PER_MMBTU,
  KBTU_PER_MWH,
  KBTU_PER_THERM,
  KBTU_PER_TON_HOUR,
  LB_PER_MLB,
} from './factors';

/** Per-meter heat contents. Both must be positive; steam has no default. */
export const meterHeatContentSchema = z.object({
  /** Natural gas heat content in kBtu per cubic foot (the utility's therm factor / 100). */
  gasKbtuPerCf: z.number().positive().optional(),
  /** District steam energy delivered, Btu per pound (supplier's stated value). */
  steamBtuPerLb: z.number().positive().optional(),
});
export type MeterHeatContent = z.infer<typeof meterHeatContentSchema>;

/** What a converted quantity measures: site energy or water volume. */
export type Measure = 'kBtu' | 'gal';

export type ConversionFailure =
  | 'unit-not-valid-for-commodity'
  | 'demand-not-energy'
  | 'steam-heat-content-missing'
  | 'invalid-heat-content'
  | 'invalid-quantity'
  | 'not-energy'
  | 'not-water';

export type ConversionFactorResult =
  | { ok: true; measure: Measure; perUnit: number }
  | { ok: false; reason: ConversionFailure };

export type ConversionResult =
  | { ok: true; measure: Measure; value: number }
  | { ok: false; reason: ConversionFailure };

function validHeat(v: number | undefined): boolean {
  return v === undefined || (Number.isFinite(v) && v > 0);
}

function energyPerUnit(commodity: Commodity, unit: Unit, meter: MeterHeatContent): number | ConversionFailure {
  switch (unit) {
    case 'kWh':
      return KBTU_PER_KWH;
    case 'MWh':
      return KBTU_PER_MWH;
    case 'therm':
      return KBTU_PER_THERM;
    case 'Dth':
      return KBTU_PER_DTH;
    case 'MMBtu':
      return KBTU_PER_MMBTU;
    case 'cf':
    case 'ccf':
    case 'Mcf': {
      const perCf = meter.gasKbtuPerCf ?? DEFAULT_GAS_KBTU_PER_CF;
      return unit === 'cf' ? perCf : perCf * (unit === 'ccf' ? CF_PER_CCF : CF_PER_MCF);
    }
    case 'gal':
      return isLiquidFuel(commodity) ? KBTU_PER_GALLON[commodity] : 'unit-not-valid-for-commodity';
    case 'lb':
    case 'Mlb': {
      if (meter.steamBtuPerLb === undefined) return 'steam-heat-content-missing';
      const perLb = meter.steamBtuPerLb / 1000;
      return unit === 'lb' ? perLb : perLb * LB_PER_MLB;
    }
    case 'ton_h':
      return KBTU_PER_TON_HOUR;
    default:
      return 'unit-not-valid-for-commodity';
  }
}

function gallonsPerUnit(unit: Unit): number | ConversionFailure {
  switch (unit) {
    case 'gal':
      return 1;
    case 'kgal':
      return GAL_PER_KGAL;
    case 'ccf':
      return GAL_PER_CCF;
    case 'm3':
      return GAL_PER_M3;
    default:
      return 'unit-not-valid-for-commodity';
  }
}

/**
 * The factor that turns one `unit` of `commodity` into kBtu (energy commodities) or gallons
 * (water). Fails with `demand-not-energy` for kW, `steam-heat-content-missing` for steam in lb
 * or Mlb without a per-meter Btu/lb, and `unit-not-valid-for-commodity` otherwise.
 * @example conversionFactor('natural_gas', 'ccf') // { ok: true, measure: 'kBtu', perUnit: 103.6 }
 */
export function conversionFactor(
  commodity: Commodity,
  unit: Unit,
  meter: MeterHeatContent = {},
): ConversionFactorResult {
  if (unit === 'kW') return { ok: false, reason: 'demand-not-energy' };
  if (!isQuantityUnitFor(commodity, unit)) return { ok: false, reason: 'unit-not-valid-for-commodity' };
  if (!validHeat(meter.gasKbtuPerCf) || !validHeat(meter.steamBtuPerLb)) {
    return { ok: false, reason: 'invalid-heat-content' };
  }
  const perUnit = commodity === 'water' ? gallonsPerUnit(unit) : energyPerUnit(commodity, unit, meter);
  if (typeof perUnit === 'string') return { ok: false, reason: perUnit };
  return { ok: true, measure: commodity === 'water' ? 'gal' : 'kBtu', perUnit };
}

/**
 * Converts one bill quantity to kBtu or gallons. Negative quantities (net metering) convert
 * like any other; non-finite ones fail with `invalid-quantity`.
 * @example convertQuantity(10000, 'electricity', 'kWh') // { ok: true, measure: 'kBtu', value: 34120 }
 */
export function convertQuantity(
  quantity: number,
  commodity: Commodity,
  unit: Unit,
  meter: MeterHeatContent = {},
): ConversionResult {
  if (!Number.isFinite(quantity)) return { ok: false, reason: 'invalid-quantity' };
  const f = conversionFactor(commodity, unit, meter);
  return f.ok ? { ok: true, measure: f.measure, value: quantity * f.perUnit } : f;
}

/** Site energy in kBtu; fails with `not-energy` for water. */
export function toSiteKbtu(
  quantity: number,
  commodity: Commodity,
  unit: Unit,
  meter: MeterHeatContent = {},
): ConversionResult {
  if (commodity === 'water') return { ok: false, reason: 'not-energy' };
  return convertQuantity(quantity, commodity, unit, meter);
}

/** Water volume in US gallons; fails with `not-water` for energy commodities. */
export function toWaterGallons(quantity: number, commodity: Commodity, unit: Unit): ConversionResult {
  if (commodity !== 'water') return { ok: false, reason: 'not-water' };
  return convertQuantity(quantity, commodity, unit);
}

/**
 * The heat content a meter states per unit it is billed in (kBtu per ccf, per Mlb, …) as the
 * per-cubic-foot and per-pound values the conversions use. Gas billed by energy (therm, Dth,
 * MMBtu) needs none.
 * @example meterHeatContent('natural_gas', 'ccf', 103.1) // { gasKbtuPerCf: 1.031 }
 */
export function meterHeatContent(commodity: Commodity, unit: Unit, kbtuPerBillingUnit: number | null | undefined): MeterHeatContent {
  if (!kbtuPerBillingUnit || !(kbtuPerBillingUnit > 0)) return {};
  if (commodity === 'natural_gas') {
    const cf = unit === 'cf' ? 1 : unit === 'ccf' ? CF_PER_CCF : unit === 'Mcf' ? CF_PER_MCF : null;
    return cf === null ? {} : { gasKbtuPerCf: kbtuPerBillingUnit / cf };
  }
  if (commodity === 'district_steam') {
    const lb = unit === 'lb' ? 1 : unit === 'Mlb' ? LB_PER_MLB : null;
    return lb === null ? {} : { steamBtuPerLb: (kbtuPerBillingUnit * 1000) / lb };
  }
  return {};
}
