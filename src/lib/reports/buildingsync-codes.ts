/**
 * Plumbline's codes in BuildingSync 2.7.0's enumerations (BuildingSync.xsd v2.7.0, namespace
 * http://buildingsync.net/schemas/bedes-auc/2019): fuels (FuelTypes), resource units
 * (ResourceUnits), occupancy classifications, measure technology categories with their enumerated
 * measure names, implementation statuses and Guideline 14 model types. Every string on the right
 * is copied from the schema; the schema test in tests/unit/reports checks documents built with them.
 */
import type { Commodity, Unit, UseType } from '../domain';
import type { FindingCategory, MeasureStatus } from '../field/walkthrough-form';
import { CF_PER_CCF, CF_PER_MCF, GAL_PER_CCF, GAL_PER_KGAL, LB_PER_MLB } from '../units/factors';

/** FuelTypes for each energy commodity; water is a WaterResource ("Potable water"), not a fuel. */
export const FUEL_TYPE: Readonly<Record<Exclude<Commodity, 'water'>, string>> = {
  electricity: 'Electricity',
  natural_gas: 'Natural gas',
  fuel_oil_2: 'Fuel oil no 2',
  fuel_oil_6: 'Fuel oil no 6',
  propane: 'Propane',
  kerosene: 'Kerosene',
  diesel: 'Diesel',
  district_steam: 'District steam',
  chilled_water: 'District chilled water',
};

export const WATER_RESOURCE = 'Potable water';

/**
 * A quantity in Plumbline's unit as a quantity in one of the schema's ResourceUnits: the unit name
 * and the factor to multiply by. Null for demand (kW), which is not a resource quantity.
 * One dekatherm is one MMBtu (10 therms); cf, ccf and Mcf of gas become kcf and MCF by volume.
 */
export function resourceUnits(commodity: Commodity, unit: Unit): { units: string; factor: number } | null {
  if (commodity === 'water') {
    if (unit === 'gal') return { units: 'Gallons', factor: 1 };
    if (unit === 'kgal') return { units: 'Gallons', factor: GAL_PER_KGAL };
    if (unit === 'ccf') return { units: 'Gallons', factor: GAL_PER_CCF };
    if (unit === 'cf') return { units: 'Gallons', factor: GAL_PER_CCF / CF_PER_CCF };
    if (unit === 'm3') return { units: 'Cubic Meters', factor: 1 };
    return null;
  }
  switch (unit) {
    case 'kWh':
      return { units: 'kWh', factor: 1 };
    case 'MWh':
      return { units: 'MWh', factor: 1 };
    case 'therm':
      return { units: 'therms', factor: 1 };
    case 'Dth':
    case 'MMBtu':
      return { units: 'MMBtu', factor: 1 };
    case 'cf':
      return { units: 'kcf', factor: 1 / CF_PER_MCF };
    case 'ccf':
      return { units: 'kcf', factor: CF_PER_CCF / CF_PER_MCF };
    case 'Mcf':
      return { units: 'MCF', factor: 1 };
    case 'gal':
      return { units: 'Gallons', factor: 1 };
    case 'm3':
      return { units: 'Cubic Meters', factor: 1 };
    case 'lb':
      return { units: 'lbs', factor: 1 };
    case 'Mlb':
      // Plumbline's Mlb is a thousand pounds; written in plain pounds so no reader mistakes it for a million.
      return { units: 'lbs', factor: LB_PER_MLB };
    case 'ton_h':
      return { units: 'Ton-hour', factor: 1 };
    default:
      return null;
  }
}

/** OccupancyClassification for each use type (the nearest value of the schema's list). */
export const OCCUPANCY_CLASSIFICATION: Readonly<Record<UseType, string>> = {
  office: 'Office',
  lodging: 'Lodging',
  dining: 'Food service',
  warehouse: 'Warehouse',
  retail: 'Retail',
  clinic: 'Health care-Outpatient facility',
  training: 'Education',
  fitness: 'Recreation-Fitness center',
  laboratory: 'Laboratory',
  vehicle_maintenance: 'Service-Repair',
  religious: 'Assembly-Religious',
  data_center: 'Data center',
  other: 'Other',
};

/** ImplementationStatus for each measure status; Recommended is false only for a rejected one. */
export const IMPLEMENTATION_STATUS: Readonly<Record<MeasureStatus, string>> = {
  proposed: 'Proposed',
  approved: 'Selected',
  implemented: 'Completed',
  rejected: 'Discarded',
};

export interface TechnologyChoice {
  /** Child element of TechnologyCategory. */
  category: string;
  /** One of that category's MeasureName enumerations. */
  measureName: string;
  /** SystemCategoryAffected, when the category names one. */
  system: string | null;
}

type Rule = { words: RegExp } & TechnologyChoice;

/** Per finding category: keyword rules tried on the measure and finding titles, then the default. */
const TECHNOLOGY_RULES: Readonly<Record<FindingCategory, { rules: Rule[]; fallback: TechnologyChoice }>> = {
  lighting: {
    rules: [
      { words: /\bLED\b|light.emitting/i, category: 'LightingImprovements', measureName: 'Retrofit with light emitting diode technologies', system: 'Lighting' },
      { words: /occupancy|vacancy/i, category: 'LightingImprovements', measureName: 'Add occupancy sensors', system: 'Lighting' },
      { words: /daylight/i, category: 'LightingImprovements', measureName: 'Add daylight controls', system: 'Lighting' },
      { words: /exit sign/i, category: 'LightingImprovements', measureName: 'Upgrade exit signs to LED', system: 'Lighting' },
      { words: /exterior|parking|pole/i, category: 'LightingImprovements', measureName: 'Upgrade exterior lighting', system: 'Lighting' },
      { words: /timer|schedule/i, category: 'LightingImprovements', measureName: 'Install timers', system: 'Lighting' },
    ],
    fallback: { category: 'LightingImprovements', measureName: 'Other', system: 'Lighting' },
  },
  hvac: {
    rules: [
      { words: /boiler/i, category: 'BoilerPlantImprovements', measureName: 'Replace boiler', system: 'Heating System' },
      { words: /burner/i, category: 'BoilerPlantImprovements', measureName: 'Replace burner', system: 'Heating System' },
      { words: /chiller/i, category: 'ChillerPlantImprovements', measureName: 'Replace chiller', system: 'Cooling System' },
      { words: /economi[sz]er/i, category: 'OtherHVAC', measureName: 'Add or repair economizer', system: 'Other HVAC' },
      { words: /constant.volume|\bVAV\b|reheat/i, category: 'OtherHVAC', measureName: 'Convert CV system to VAV system', system: 'Air Distribution' },
      { words: /duct/i, category: 'OtherHVAC', measureName: 'Repair leaks / seal ducts', system: 'Air Distribution' },
      { words: /steam trap/i, category: 'ChilledWaterHotWaterAndSteamDistributionSystems', measureName: 'Repair and/or replace steam traps', system: 'Heating System' },
      { words: /pipe insulation|insulate.*pip/i, category: 'ChilledWaterHotWaterAndSteamDistributionSystems', measureName: 'Add pipe insulation', system: 'Heating System' },
      { words: /rooftop|package unit|packaged unit/i, category: 'OtherHVAC', measureName: 'Replace package units', system: 'Other HVAC' },
      { words: /demand.control/i, category: 'OtherHVAC', measureName: 'Install demand control ventilation', system: 'Air Distribution' },
    ],
    fallback: { category: 'OtherHVAC', measureName: 'Other', system: 'Other HVAC' },
  },
  envelope: {
    rules: [
      { words: /air.seal|weather.?strip|infiltration|draft/i, category: 'BuildingEnvelopeModifications', measureName: 'Air seal envelope', system: null },
      { words: /roof insulation/i, category: 'BuildingEnvelopeModifications', measureName: 'Increase roof insulation', system: 'Roof' },
      { words: /ceiling insulation|attic/i, category: 'BuildingEnvelopeModifications', measureName: 'Increase ceiling insulation', system: 'Ceiling' },
      { words: /wall insulation/i, category: 'BuildingEnvelopeModifications', measureName: 'Increase wall insulation', system: 'Wall' },
      { words: /window film/i, category: 'BuildingEnvelopeModifications', measureName: 'Add window films', system: 'Fenestration' },
      { words: /window|glazing/i, category: 'BuildingEnvelopeModifications', measureName: 'Replace windows', system: 'Fenestration' },
    ],
    fallback: { category: 'BuildingEnvelopeModifications', measureName: 'Other', system: null },
  },
  'plug-loads': {
    rules: [
      { words: /computer|sleep|shutdown|shut.down|power management/i, category: 'PlugLoadReductions', measureName: 'Automatic shutdown or sleep mode for computers', system: 'Plug Load' },
      { words: /control|timer|smart strip|power strip/i, category: 'PlugLoadReductions', measureName: 'Install plug load controls', system: 'Plug Load' },
      { words: /vending/i, category: 'PlugLoadReductions', measureName: 'De-lamp vending machines', system: 'Plug Load' },
      { words: /server|virtuali[sz]/i, category: 'DataCenterImprovements', measureName: 'Implement server virtualization', system: 'Critical IT System' },
    ],
    fallback: { category: 'PlugLoadReductions', measureName: 'Other', system: 'Plug Load' },
  },
  water: {
    rules: [
      { words: /showerhead/i, category: 'WaterAndSewerConservationSystems', measureName: 'Install low-flow faucets and showerheads', system: 'Water Use' },
      { words: /aerator|faucet/i, category: 'WaterAndSewerConservationSystems', measureName: 'Install low-flow faucets and showerheads', system: 'Water Use' },
      { words: /pre.rinse|spray valve/i, category: 'KitchenImprovements', measureName: 'Install WaterSense-qualified pre-rinse spray valves', system: 'Water Use' },
      { words: /toilet|flush/i, category: 'WaterAndSewerConservationSystems', measureName: 'Install low-flow plumbing equipment', system: 'Water Use' },
      { words: /urinal/i, category: 'WaterAndSewerConservationSystems', measureName: 'Install low-flow plumbing equipment', system: 'Water Use' },
      { words: /irrigation/i, category: 'IrrigationSystemsAndLandscapingImprovements', measureName: 'Other', system: 'Water Use' },
      { words: /leak/i, category: 'WaterAndSewerConservationSystems', measureName: 'Clean and/or repair', system: 'Water Use' },
    ],
    fallback: { category: 'WaterAndSewerConservationSystems', measureName: 'Other', system: 'Water Use' },
  },
  controls: {
    rules: [
      { words: /pneumatic/i, category: 'BuildingAutomationSystems', measureName: 'Convert pneumatic controls to DDC', system: 'General Controls and Operations' },
      { words: /schedul|setback|setpoint|set point|sequenc/i, category: 'BuildingAutomationSystems', measureName: 'Upgrade operating protocols, calibration, and/or sequencing', system: 'General Controls and Operations' },
    ],
    fallback: { category: 'BuildingAutomationSystems', measureName: 'Add or upgrade controls', system: 'General Controls and Operations' },
  },
  'domestic-hot-water': {
    rules: [
      { words: /temperature|setpoint|set point/i, category: 'ServiceHotWaterSystems', measureName: 'Decrease SHW temperature', system: 'Domestic Hot Water' },
      { words: /insulat.*pip|pipe insulation/i, category: 'ServiceHotWaterSystems', measureName: 'Insulate SHW piping', system: 'Domestic Hot Water' },
      { words: /heat pump/i, category: 'ServiceHotWaterSystems', measureName: 'Install heat pump SHW system', system: 'Domestic Hot Water' },
      { words: /tankless/i, category: 'ServiceHotWaterSystems', measureName: 'Install tankless water heaters', system: 'Domestic Hot Water' },
    ],
    fallback: { category: 'ServiceHotWaterSystems', measureName: 'Other', system: 'Domestic Hot Water' },
  },
  motors: {
    rules: [
      { words: /\bVSD\b|\bVFD\b|variable.speed|variable.frequency/i, category: 'OtherElectricMotorsAndDrives', measureName: 'Add VSD motor controller', system: 'Motor' },
      { words: /premium|high.efficiency|replace/i, category: 'OtherElectricMotorsAndDrives', measureName: 'Replace with higher efficiency', system: 'Motor' },
    ],
    fallback: { category: 'OtherElectricMotorsAndDrives', measureName: 'Other', system: 'Motor' },
  },
  operations: {
    rules: [{ words: /training|documentation/i, category: 'BuildingAutomationSystems', measureName: 'Upgrade operating protocols, calibration, and/or sequencing', system: 'General Controls and Operations' }],
    fallback: { category: 'Uncategorized', measureName: 'Other', system: 'General Controls and Operations' },
  },
  other: { rules: [], fallback: { category: 'Uncategorized', measureName: 'Other', system: null } },
};

/**
 * The technology category, enumerated measure name and affected system for a finding category,
 * refined by words in the titles (e.g. "LED" → "Retrofit with light emitting diode technologies").
 * @example technologyFor('hvac', 'Replace atmospheric boilers').measureName // 'Replace boiler'
 */
export function technologyFor(category: FindingCategory, text: string): TechnologyChoice {
  const entry = TECHNOLOGY_RULES[category];
  const hit = entry.rules.find((r) => r.words.test(text));
  return hit ? { category: hit.category, measureName: hit.measureName, system: hit.system } : entry.fallback;
}

/**
 * Guideline14Model ModelType for a baseline shape, or null for a constant (mean-only) model,
 * which the schema's list does not name. heating-cooling is 4-parameter when both slopes meet
 * at one balance point, else 5-parameter (ASHRAE Guideline 14-2014 Annex D).
 */
export function guideline14ModelType(shape: string | null, parameters: number | null): string | null {
  switch (shape) {
    case 'linear':
      return '2 parameter simple linear regression';
    case 'heating':
      return '3 parameter heating change point model';
    case 'cooling':
      return '3 parameter cooling change point model';
    case 'heating-cooling':
      return parameters === 4 ? '4 parameter change point model' : '5 parameter change point model';
    default:
      return null;
  }
}
