import { describe, expect, it } from 'vitest';
import { COMMODITY_UNITS, UNITS, type Unit } from '../../../src/lib/domain';
import { isQuantityUnitFor, parseUnit, parseUnitFor } from '../../../src/lib/units';

// Spellings seen in US utility exports and bills (common practice).
const MESSY: [string, Unit][] = [
  ['KWH', 'kWh'],
  ['kwh', 'kWh'],
  ['kW h', 'kWh'],
  ['Kilowatt-hours', 'kWh'],
  ['MWh', 'MWh'],
  ['KW', 'kW'],
  ['Therms', 'therm'],
  ['THM', 'therm'],
  ['Dth', 'Dth'],
  ['Dekatherms', 'Dth'],
  ['MMBTU', 'MMBtu'],
  ['CF', 'cf'],
  ['cubic feet', 'cf'],
  ['CCF', 'ccf'],
  ['HCF', 'ccf'],
  ['hundred cubic feet', 'ccf'],
  ['MCF', 'Mcf'],
  ['Gallons', 'gal'],
  ['GAL', 'gal'],
  ['1000 gal', 'kgal'],
  ['1,000 Gallons', 'kgal'],
  ['kgal', 'kgal'],
  ['Thousand Gallons', 'kgal'],
  ['m³', 'm3'],
  ['M3', 'm3'],
  ['cubic meters', 'm3'],
  ['lbs', 'lb'],
  ['Pounds', 'lb'],
  ['Mlbs', 'Mlb'],
  ['klb', 'Mlb'],
  ['ton-hours', 'ton_h'],
  ['Ton Hrs', 'ton_h'],
  ['  kWh  ', 'kWh'],
];

describe('parseUnit', () => {
  it.each(MESSY)('reads %j as %s', (raw, unit) => {
    expect(parseUnit(raw)).toEqual({ ok: true, unit });
  });

  it('reads every canonical code as itself', () => {
    for (const u of UNITS) expect(parseUnit(u)).toEqual({ ok: true, unit: u });
  });

  it('fails on empty and unknown text instead of guessing', () => {
    expect(parseUnit('   ')).toEqual({ ok: false, reason: 'empty-unit' });
    expect(parseUnit('furlongs')).toEqual({ ok: false, reason: 'unknown-unit' });
    // Ambiguous in the trade: thousand or million?
    expect(parseUnit('MBtu')).toEqual({ ok: false, reason: 'unknown-unit' });
    expect(parseUnit('Mgal')).toEqual({ ok: false, reason: 'unknown-unit' });
  });
});

describe('units per commodity', () => {
  it('checks a parsed unit against the meter commodity', () => {
    expect(parseUnitFor('CCF', 'water')).toEqual({ ok: true, unit: 'ccf' });
    expect(parseUnitFor('CCF', 'natural_gas')).toEqual({ ok: true, unit: 'ccf' });
    expect(parseUnitFor('kWh', 'natural_gas')).toEqual({ ok: false, reason: 'unit-not-valid-for-commodity' });
    expect(parseUnitFor('kW', 'electricity')).toEqual({ ok: false, reason: 'unit-not-valid-for-commodity' });
    expect(parseUnitFor('kW', 'electricity', { demand: true })).toEqual({ ok: true, unit: 'kW' });
    expect(parseUnitFor('kWh', 'electricity', { demand: true })).toEqual({ ok: false, reason: 'unit-not-valid-for-commodity' });
  });

  it('never lists demand as a quantity unit, and lists each unit the brief names', () => {
    for (const units of Object.values(COMMODITY_UNITS)) expect(units).not.toContain('kW');
    expect(isQuantityUnitFor('district_steam', 'Mlb')).toBe(true);
    expect(isQuantityUnitFor('chilled_water', 'ton_h')).toBe(true);
    expect(isQuantityUnitFor('water', 'm3')).toBe(true);
    expect(isQuantityUnitFor('water', 'Mcf')).toBe(false);
  });
});
