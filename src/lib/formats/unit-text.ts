/**
 * Unit strings of bill files ("KWH", "Therms", "HCF", "m³") to Unit codes through the units
 * module's parser (src/lib/units/parse-unit.ts), with a cache per distinct string: a file repeats
 * the same few spellings on every row, and the parser normalizes with a regular expression.
 */
import type { Unit } from '../domain';
import { parseUnit } from '../units/parse-unit';

const cache = new Map<string, Unit | null>();
const CACHE_LIMIT = 4096;

/**
 * Reads a unit string; null when blank or unknown.
 * @example unitFromText('Therms') // 'therm'
 */
export function unitFromText(raw: string): Unit | null {
  const hit = cache.get(raw);
  if (hit !== undefined) return hit;
  const parsed = parseUnit(raw);
  const unit = parsed.ok ? parsed.unit : null;
  if (cache.size < CACHE_LIMIT) cache.set(raw, unit);
  return unit;
}
