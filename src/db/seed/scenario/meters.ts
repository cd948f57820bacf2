/**
 * Meters of a building: electricity always (kWh, with monthly peak demand), a heating fuel when
 * the building has one (natural gas in therm or ccf, fuel oil No. 2 in gallons), water always
 * (kgal, gal or ccf by site). Codes are `<installation>-<building>-<E|G|O|W>`, unique in the region;
 * account numbers are invented.
 */
import type { Commodity, Unit } from '../../../lib/domain';
import type { InstallationSpec } from './climates';
import { GAL_PER_CCF, KBTU_PER_GAL_OIL_2, KBTU_PER_THERM } from './load-parameters';
import type { Rng } from './prng';
import type { HeatingFuel } from './specials';
import type { DemoMeter } from './types';

/**
 * Heat content the gas utility states on its ccf bills, kBtu/ccf, per site (invented; within the
 * 100–106 range of typical utility factors, EIA national average 103.6).
 */
const STATED_CCF_HEAT_CONTENT: Record<string, number> = { DMF: 103.1, BNP: 104.2 };

export interface MeterSet {
  electricity: DemoMeter;
  fuel: DemoMeter | null;
  water: DemoMeter;
}

export function metersFor(site: InstallationSpec, buildingNumber: string, fuel: HeatingFuel | null, rng: Rng): MeterSet {
  const make = (suffix: string, commodity: Commodity, unit: Unit, prefix: string, heat?: number): DemoMeter => {
    const meter: DemoMeter = {
      installationCode: site.code,
      buildingNumber,
      code: `${site.code}-${buildingNumber}-${suffix}`,
      commodity,
      unit,
      account: `${prefix}-${String(rng.int(1000000, 9999999))}`,
    };
    if (heat !== undefined) meter.heatContentKbtuPerUnit = heat;
    return meter;
  };
  const electricity = make('E', 'electricity', 'kWh', site.utilityPrefix.electricity);
  let fuelMeter: DemoMeter | null = null;
  if (fuel === 'fuel_oil_2') fuelMeter = make('O', 'fuel_oil_2', 'gal', site.utilityPrefix.oil);
  else if (fuel === 'natural_gas') {
    fuelMeter = site.gasUnit === 'ccf'
      ? make('G', 'natural_gas', 'ccf', site.utilityPrefix.gas, STATED_CCF_HEAT_CONTENT[site.code] ?? 103.6)
      : make('G', 'natural_gas', 'therm', site.utilityPrefix.gas);
  }
  const water = make('W', 'water', site.waterUnit, site.utilityPrefix.water);
  return { electricity, fuel: fuelMeter, water };
}

/** kBtu per unit of a fuel meter: the utility's stated heat content, else the EIA figure. */
export function fuelKbtuPerUnit(meter: DemoMeter): number {
  if (meter.heatContentKbtuPerUnit !== undefined) return meter.heatContentKbtuPerUnit;
  if (meter.unit === 'therm') return KBTU_PER_THERM;
  if (meter.unit === 'gal' && meter.commodity === 'fuel_oil_2') return KBTU_PER_GAL_OIL_2;
  throw new Error(`no heat content for ${meter.code} (${meter.unit})`);
}

/** Gallons per unit of a water meter (1 kgal = 1000 gal; 1 ccf = 748.052 gal by definition). */
export function waterGalPerUnit(unit: Unit): number {
  if (unit === 'kgal') return 1000;
  if (unit === 'gal') return 1;
  if (unit === 'ccf') return GAL_PER_CCF;
  throw new Error(`not a water unit: ${unit}`);
}

/**
 * Blended price per unit of a meter in the first billing year, from the site's prices.
 * Gas in ccf is priced through its heat content; water in gal or ccf through gallons.
 */
export function unitPrice(site: InstallationSpec, meter: DemoMeter): number {
  switch (meter.commodity) {
    case 'electricity':
      return site.prices.electricityPerKwh;
    case 'natural_gas':
      return (site.prices.gasPerTherm * fuelKbtuPerUnit(meter)) / KBTU_PER_THERM;
    case 'fuel_oil_2':
      return site.prices.oilPerGal;
    case 'water':
      return (site.prices.waterPerKgal * waterGalPerUnit(meter.unit)) / 1000;
    default:
      throw new Error(`the demo has no price for ${meter.commodity}`);
  }
}

/** Decimals a bill states its quantity with, by unit. */
export function quantityDecimals(unit: Unit): number {
  if (unit === 'kWh') return 0;
  if (unit === 'gal') return 1;
  if (unit === 'kgal') return 3;
  return 2;
}
