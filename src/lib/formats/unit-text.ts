/**
 * Minimal reader of unit strings in bill files ("KWH", "Therms", "HCF", "m³") into the shared
 * Unit codes, private to the format layer. The units module owns the full parser; this one
 * exists so the format layer stands alone and should be replaced by it once both are in.
 * Spellings are common practice in US utility exports; ambiguous ones ("MBtu", "Mgal") are
 * left out on purpose and read as unknown.
 */
import type { Unit } from '../domain';

const SPELLINGS: ReadonlyArray<readonly [Unit, readonly string[]]> = [
  ['kWh', ['kwh', 'kwhr', 'kilowatthour']],
  ['MWh', ['mwh', 'mwhr', 'megawatthour']],
  ['kW', ['kw', 'kilowatt']],
  ['therm', ['therm', 'thm', 'thms']],
  ['Dth', ['dth', 'dekatherm', 'decatherm']],
  ['MMBtu', ['mmbtu']],
  ['cf', ['cf', 'ft3', 'cuft', 'cubicfeet', 'cubicfoot']],
  ['ccf', ['ccf', 'hcf', '100cf', '100ft3']],
  ['Mcf', ['mcf', '1000cf', '1000ft3']],
  ['gal', ['gal', 'gallon', 'usgal']],
  ['kgal', ['kgal', '1000gal', '1000gallon']],
  ['m3', ['m3', 'cubicmeter', 'cubicmetre']],
  ['lb', ['lb', 'pound']],
  ['Mlb', ['mlb', 'klb', '1000lb']],
  ['ton_h', ['tonh', 'tonhr', 'tonhour']],
];

const ALIASES: ReadonlyMap<string, Unit> = new Map(
  SPELLINGS.flatMap(([unit, names]) => names.map((name) => [name, unit] as const)),
);

/** Lower case, letters and digits only ("m³" becomes "m3"), a plural "s" dropped. */
function normalize(raw: string): string {
  const flat = raw.normalize('NFKC').toLowerCase().replace(/[^a-z0-9]/g, '');
  return flat.length > 2 && flat.endsWith('s') && !ALIASES.has(flat) ? flat.slice(0, -1) : flat;
}

const cache = new Map<string, Unit | null>();
const CACHE_LIMIT = 4096;

/**
 * Reads a unit string; null when unknown. Results are cached per distinct string, since a file
 * repeats the same few spellings on every row.
 * @example unitFromText('Therms') // 'therm'
 */
export function unitFromText(raw: string): Unit | null {
  const hit = cache.get(raw);
  if (hit !== undefined) return hit;
  const unit = ALIASES.get(normalize(raw)) ?? null;
  if (cache.size < CACHE_LIMIT) cache.set(raw, unit);
  return unit;
}
