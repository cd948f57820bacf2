/**
 * Shared vocabulary of the domain: commodities, their units and the roles of the people who use
 * Plumbline. Every other module imports these codes from here so that a meter, a bill row, a
 * conversion and a chart all speak of the same thing.
 */
import { z } from 'zod';

/** Commodities a meter can measure. Fuels are energy; `water` is volume. */
export const COMMODITIES = [
  'electricity',
  'natural_gas',
  'fuel_oil_2',
  'fuel_oil_6',
  'propane',
  'kerosene',
  'diesel',
  'district_steam',
  'chilled_water',
  'water',
] as const;
export const commoditySchema = z.enum(COMMODITIES);
export type Commodity = z.infer<typeof commoditySchema>;

export const COMMODITY_LABELS: Record<Commodity, string> = {
  electricity: 'Electricity',
  natural_gas: 'Natural gas',
  fuel_oil_2: 'Fuel oil No. 2',
  fuel_oil_6: 'Fuel oil No. 6',
  propane: 'Propane',
  kerosene: 'Kerosene',
  diesel: 'Diesel',
  district_steam: 'District steam',
  chilled_water: 'Chilled water',
  water: 'Water',
};

/**
 * Units a bill quantity can be stated in. `ccf` is 100 cubic feet of gas for natural gas and
 * 100 cubic feet (one HCF) of water for water: the meter's commodity tells which.
 * `kW` is peak demand, never energy.
 */
export const UNITS = [
  'kWh',
  'MWh',
  'kW',
  'therm',
  'Dth',
  'MMBtu',
  'cf',
  'ccf',
  'Mcf',
  'gal',
  'kgal',
  'm3',
  'lb',
  'Mlb',
  'ton_h',
] as const;
export const unitSchema = z.enum(UNITS);
export type Unit = z.infer<typeof unitSchema>;

/** True for commodities whose use is energy (kBtu); water is counted in gallons. */
export function isEnergyCommodity(c: Commodity): boolean {
  return c !== 'water';
}

/** True for commodities that heat a building (used to decide which baseline shapes apply). */
export function isHeatingFuel(c: Commodity): boolean {
  return c !== 'electricity' && c !== 'water' && c !== 'chilled_water';
}

export const ROLES = [
  'admin',
  'regional_manager',
  'installation_staff',
  'analyst',
  'auditor',
  'kit_custodian',
] as const;
export const roleSchema = z.enum(ROLES);
export type Role = z.infer<typeof roleSchema>;

export const ROLE_LABELS: Record<Role, string> = {
  admin: 'Administrator',
  regional_manager: 'Regional energy manager',
  installation_staff: 'Installation energy staff',
  analyst: 'Analyst',
  auditor: 'Field auditor',
  kit_custodian: 'Kit custodian',
};

/**
 * Building use types as installation staff know them. Each maps to a published building-activity
 * category for peer comparison (see src/lib/benchmark).
 */
export const USE_TYPES = [
  'office',
  'lodging',
  'dining',
  'warehouse',
  'retail',
  'clinic',
  'training',
  'fitness',
  'laboratory',
  'vehicle_maintenance',
  'religious',
  'data_center',
  'other',
] as const;
export const useTypeSchema = z.enum(USE_TYPES);
export type UseType = z.infer<typeof useTypeSchema>;

export const USE_TYPE_LABELS: Record<UseType, string> = {
  office: 'Office / administration',
  lodging: 'Lodging / dormitory',
  dining: 'Dining facility',
  warehouse: 'Warehouse / storage',
  retail: 'Shop / retail',
  clinic: 'Clinic / outpatient health',
  training: 'Training / classroom',
  fitness: 'Fitness / recreation',
  laboratory: 'Laboratory',
  vehicle_maintenance: 'Vehicle maintenance',
  religious: 'Chapel / worship',
  data_center: 'Data center',
  other: 'Other',
};

/** The units a bill for each commodity may be stated in (demand kW is a separate bill field). */
export const COMMODITY_UNITS: Record<Commodity, readonly Unit[]> = {
  electricity: ['kWh', 'MWh'],
  natural_gas: ['therm', 'Dth', 'MMBtu', 'cf', 'ccf', 'Mcf'],
  fuel_oil_2: ['gal'],
  fuel_oil_6: ['gal'],
  propane: ['gal'],
  kerosene: ['gal'],
  diesel: ['gal'],
  district_steam: ['lb', 'Mlb'],
  chilled_water: ['ton_h'],
  water: ['gal', 'kgal', 'ccf', 'm3'],
};
