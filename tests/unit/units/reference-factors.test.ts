/**
 * The code's factors against the reference tables in tests/fixtures/units (sources in its README
 * and in each row's `source` column).
 */
import { describe, expect, it } from 'vitest';
import type { Commodity, Unit } from '../../../src/lib/domain';
import { ASHRAE_105_2021_RATIOS, conversionFactor, DOE_2015_RATIOS, type EnergyCommodity } from '../../../src/lib/units';
import { readReferenceCsv, referenceRow } from './reference-tables';

const conversions = readReferenceCsv('energy-conversions.csv');

// [energy_type prefix, unit column prefix, commodity, unit]: the EIA rows the code uses.
const CONVERSION_ROWS: [string, string, Commodity, Unit][] = [
  ['electricity', 'kWh', 'electricity', 'kWh'],
  ['electricity', 'MWh', 'electricity', 'MWh'],
  ['natural gas', 'therm', 'natural_gas', 'therm'],
  ['natural gas', 'dekatherm', 'natural_gas', 'Dth'],
  ['natural gas', 'dekatherm', 'natural_gas', 'MMBtu'],
  ['natural gas', 'cubic foot', 'natural_gas', 'cf'],
  ['natural gas', 'hundred cubic feet', 'natural_gas', 'ccf'],
  ['natural gas', 'thousand cubic feet', 'natural_gas', 'Mcf'],
  ['fuel oil No. 2 / heating oil', 'gallon', 'fuel_oil_2', 'gal'],
  ['diesel fuel', 'gallon', 'diesel', 'gal'],
  ['fuel oil No. 6 (residual fuel oil)', 'gallon', 'fuel_oil_6', 'gal'],
  ['propane (liquid)', 'gallon', 'propane', 'gal'],
  ['kerosene', 'gallon', 'kerosene', 'gal'],
  ['district chilled water', 'ton-hour', 'chilled_water', 'ton_h'],
];

describe('conversion factors match energy-conversions.csv (U.S. EIA, Units and calculators explained; MER App. A)', () => {
  it.each(CONVERSION_ROWS)('%s per %s', (type, unitCol, commodity, unit) => {
    const row = referenceRow(conversions, 'energy_type', type, (r) => (r['unit'] ?? '').startsWith(unitCol));
    const expected = Number(row['kbtu_per_unit']);
    const f = conversionFactor(commodity, unit);
    expect(f.ok).toBe(true);
    if (!f.ok) return;
    // The table prints fuel oil No. 6 to three decimals (149.690); the code keeps 6,287/42.
    expect(f.perUnit).toBeCloseTo(expected, 3);
  });
});

const ratios = readReferenceCsv('source-site.csv');
const RATIO_ROWS: [string, EnergyCommodity[]][] = [
  ['electricity', ['electricity']],
  ['natural gas', ['natural_gas']],
  ['fuel oil', ['fuel_oil_2', 'fuel_oil_6', 'diesel', 'kerosene']],
  ['propane', ['propane']],
  ['district steam', ['district_steam']],
  ['district chilled water', ['chilled_water']],
];

describe('source-site ratios match source-site.csv (ASHRAE 105-2021 Table K-2; DOE 2015 ZEB definition)', () => {
  it.each(RATIO_ROWS)('%s', (type, commodities) => {
    const row = referenceRow(ratios, 'energy_type', type);
    for (const c of commodities) {
      expect(ASHRAE_105_2021_RATIOS.ratios[c]).toBe(Number(row['ashrae_105_2021']));
      expect(DOE_2015_RATIOS.ratios[c]).toBe(Number(row['doe_2015']));
    }
  });
});
