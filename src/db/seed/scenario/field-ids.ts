/**
 * Ids for the demo's field records drawn from a seeded stream, laid out as RFC 9562 version-4
 * UUIDs (version nibble 4, variant bits 10), so the same seed gives the same ids.
 */
import type { Rng } from './prng';

export function demoUuid(rng: Rng): string {
  const hex = (n: number, digits: number) => n.toString(16).padStart(digits, '0');
  const word = () => rng.int(0, 0xffff);
  const a = hex(word(), 4) + hex(word(), 4);
  const b = hex(word(), 4);
  const c = hex(0x4000 | (word() & 0x0fff), 4);
  const d = hex(0x8000 | (word() & 0x3fff), 4);
  const e = hex(word(), 4) + hex(word(), 4) + hex(word(), 4);
  return `${a}-${b}-${c}-${d}-${e}`;
}
