/**
 * Which units a bill quantity may be stated in for each commodity. Electricity demand (kW) is
 * listed apart: it is a peak rate, never an energy quantity.
 */
import type { Commodity, Unit } from '../domain';

/** Units accepted for the quantity (energy or volume) of a bill, per commodity. */
export const QUANTITY_UNITS: Readonly<Record<Commodity, readonly Unit[]>> = {
  electricity: ['kWh', 'MWh'],
  natural_gas: ['therm', 'Dth', 'MMBtu', 'cf', 'ccf', 'Mcf'],
  fuel_oil_2: ['gal', 'kgal'],
  fuel_oil_6: ['gal', 'kgal'],
  propane: ['gal', 'kgal'],
  kerosene: ['gal', 'kgal'],
  diesel: ['gal', 'kgal'],
  // Energy-metered steam is billed in therm or MMBtu; mass-metered steam in lb or Mlb.
  district_steam: ['lb', 'Mlb', 'therm', 'MMBtu'],
  chilled_water: ['ton_h', 'MMBtu'],
  water: ['gal', 'kgal', 'ccf', 'm3'],
};

/** Units accepted for the peak-demand column of a bill, per commodity. */
export const DEMAND_UNITS: Readonly<Record<Commodity, readonly Unit[]>> = {
  electricity: ['kW'],
  natural_gas: [],
  fuel_oil_2: [],
  fuel_oil_6: [],
  propane: [],
  kerosene: [],
  diesel: [],
  district_steam: [],
  chilled_water: [],
  water: [],
};

/** True when `unit` may state a bill quantity of `commodity`. */
export function isQuantityUnitFor(commodity: Commodity, unit: Unit): boolean {
  return QUANTITY_UNITS[commodity].includes(unit);
}

/** True when `unit` is a demand (power) unit rather than an energy or volume unit. */
export function isDemandUnit(unit: Unit): boolean {
  return unit === 'kW';
}
