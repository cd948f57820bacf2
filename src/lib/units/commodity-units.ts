/**
 * Which units fit which commodity. The list itself is the shared vocabulary's COMMODITY_UNITS;
 * electricity demand (kW) is a separate bill field, a peak rate and never an energy quantity.
 */
import { type Commodity, COMMODITY_UNITS, type Unit } from '../domain';

/** True when `unit` may state a bill quantity of `commodity`. */
export function isQuantityUnitFor(commodity: Commodity, unit: Unit): boolean {
  return COMMODITY_UNITS[commodity].includes(unit);
}

/** True when `unit` is a demand (power) unit rather than an energy or volume unit. */
export function isDemandUnit(unit: Unit): boolean {
  return unit === 'kW';
}

/** True when `unit` may state the peak demand of `commodity` (electricity kW only). */
export function isDemandUnitFor(commodity: Commodity, unit: Unit): boolean {
  return commodity === 'electricity' && isDemandUnit(unit);
}
