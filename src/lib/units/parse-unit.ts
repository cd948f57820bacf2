/**
 * Reads the unit strings found in utility exports ("KWH", "Therms", "HCF", "m³", "Mlbs",
 * "ton-hours", "1000 gal") into the shared Unit codes. Matching ignores case, spaces,
 * punctuation and a plural "s"; anything not recognised is a typed failure, never a guess.
 */
import type { Commodity, Unit } from '../domain';
import { isDemandUnitFor, isQuantityUnitFor } from './commodity-units';

export type ParseUnitFailure = 'empty-unit' | 'unknown-unit' | 'unit-not-valid-for-commodity';
export type ParseUnitResult = { ok: true; unit: Unit } | { ok: false; reason: ParseUnitFailure };

// Keys are normalized spellings (see normalizeUnitText); common practice in US utility bills.
// Ambiguous spellings are left out on purpose: "MBtu" (thousand or million?) and "Mgal" / "MG"
// (thousand or million gallons?) must be stated unambiguously by the user.
const ALIASES: ReadonlyMap<string, Unit> = new Map<string, Unit>([
  ...names('kWh', ['kwh', 'kwhr', 'kilowatthour', 'kilowatthr']),
  ...names('MWh', ['mwh', 'mwhr', 'megawatthour']),
  ...names('kW', ['kw', 'kilowatt', 'kwdemand']),
  ...names('therm', ['therm', 'thm']),
  ...names('Dth', ['dth', 'dekatherm', 'decatherm', 'dktherm']),
  ...names('MMBtu', ['mmbtu', 'millionbtu']),
  ...names('cf', ['cf', 'ft3', 'cuft', 'cubicfoot', 'cubicfeet', 'scf']),
  ...names('ccf', ['ccf', 'hcf', '100cf', '100ft3', '100cubicfeet', 'hundredcubicfeet', 'hundredcubicfoot']),
  ...names('Mcf', ['mcf', '1000cf', '1000ft3', 'thousandcubicfeet', 'thousandcubicfoot']),
  ...names('gal', ['gal', 'gallon', 'usgal', 'usgallon']),
  ...names('kgal', ['kgal', '1000gal', '1000gallon', 'thousandgallon', 'thousandgal']),
  ...names('m3', ['m3', 'cubicmeter', 'cubicmetre', 'cbm']),
  ...names('lb', ['lb', 'pound', 'lbm']),
  ...names('Mlb', ['mlb', 'klb', '1000lb', '1000pound', 'thousandpound']),
  ...names('ton_h', ['tonh', 'tonhr', 'tonhour', 'rth', 'refrigerationtonhour']),
]);

function names(unit: Unit, spellings: readonly string[]): [string, Unit][] {
  return spellings.map((s) => [s, unit]);
}

/**
 * Normalizes a unit string: Unicode compatibility form (so "m³" becomes "m3"), lower case,
 * digits and letters only, a trailing plural "s" removed.
 */
export function normalizeUnitText(raw: string): string {
  const flat = raw.normalize('NFKC').toLowerCase().replace(/[^a-z0-9]/g, '');
  // "lbs", "therms", "gallons", "ton-hours": a plural s on three or more characters.
  return flat.length > 2 && flat.endsWith('s') ? flat.slice(0, -1) : flat;
}

/**
 * Parses a messy unit string into a Unit code.
 * @example parseUnit('Therms') // { ok: true, unit: 'therm' }
 * @example parseUnit('HCF') // { ok: true, unit: 'ccf' }
 * @example parseUnit('furlongs') // { ok: false, reason: 'unknown-unit' }
 */
export function parseUnit(raw: string): ParseUnitResult {
  const key = normalizeUnitText(raw);
  if (key === '') return { ok: false, reason: 'empty-unit' };
  const unit = ALIASES.get(key);
  return unit === undefined ? { ok: false, reason: 'unknown-unit' } : { ok: true, unit };
}

/**
 * Parses a unit string for a meter of the given commodity and checks that the unit may state
 * that commodity's quantity (or, with `demand: true`, its peak demand).
 * @example parseUnitFor('kWh', 'natural_gas') // { ok: false, reason: 'unit-not-valid-for-commodity' }
 */
export function parseUnitFor(raw: string, commodity: Commodity, options: { demand?: boolean } = {}): ParseUnitResult {
  const parsed = parseUnit(raw);
  if (!parsed.ok) return parsed;
  const valid = options.demand ? isDemandUnitFor(commodity, parsed.unit) : isQuantityUnitFor(commodity, parsed.unit);
  return valid ? parsed : { ok: false, reason: 'unit-not-valid-for-commodity' };
}
