/**
 * Local dates of ESPI instants from a feed's LocalTimeParameters, on integers only.
 *
 * ESPI times (TimeType) are seconds since 1970-01-01T00:00:00Z. LocalTimeParameters carries
 * `tzOffset` (seconds from UTC, without daylight saving), `dstOffset` (seconds added during
 * daylight saving) and two DstRuleType bit maps (schema annotation, espi.xsd 4.0.20231213):
 *   bits 0-11 seconds, 12-16 hours, 17-19 day of week (1 = Monday), 20-24 day of month,
 *   25-27 operator, 28-31 month; 0xFFFFFFFF disables the rule.
 *   Operators: 0 on the day of month; 1 the weekday on or after the day of month; 2-6 the
 *   1st-5th weekday of the month; 7 the last weekday of the month.
 * Choice: the start rule's clock time is read as local standard time and the end rule's as
 * local daylight time (what the clock shows at the change in the US and EU conventions). A
 * change happens in the small hours, so this choice never moves an instant across midnight.
 * A fifth weekday that a month lacks falls back to the last one.
 */
import { civilFromDay, dayFromCivil, daysInMonth, isoFromDays, isoWeekday } from './calendar';
import { integer, text, type XmlNode } from './green-button-feed';

export interface DstRule {
  month: number;
  operator: number;
  dayOfMonth: number;
  dayOfWeek: number;
  secondsOfDay: number;
}

export interface EspiLocalTime {
  tzOffset: number;
  dstOffset: number;
  dstStart: DstRule | null;
  dstEnd: DstRule | null;
}

const DAY = 86_400;

/** Decodes a DstRuleType hex bit map; null when disabled (FFFFFFFF) or not a valid rule. */
export function decodeDstRule(hex: string): DstRule | null {
  if (!/^[0-9a-fA-F]{1,8}$/.test(hex)) return null;
  const v = Number.parseInt(hex, 16);
  if (v === 0xffffffff) return null;
  const rule: DstRule = {
    secondsOfDay: ((v >>> 12) & 0x1f) * 3600 + (v & 0xfff),
    dayOfWeek: (v >>> 17) & 0x7,
    dayOfMonth: (v >>> 20) & 0x1f,
    operator: (v >>> 25) & 0x7,
    month: (v >>> 28) & 0xf,
  };
  if (rule.month < 1 || rule.month > 12) return null;
  if (rule.operator === 0 ? rule.dayOfMonth < 1 : rule.dayOfWeek < 1) return null;
  if (rule.operator <= 1 && (rule.dayOfMonth < 1 || rule.dayOfMonth > 31)) return null;
  return rule;
}

/** Day of month the rule picks in `year`. */
export function ruleDay(rule: DstRule, year: number): number {
  const dim = daysInMonth(year, rule.month);
  const forward = (from: number): number => from + ((rule.dayOfWeek - isoWeekday(dayFromCivil(year, rule.month, from)) + 7) % 7);
  if (rule.operator === 0) return Math.min(rule.dayOfMonth, dim);
  if (rule.operator === 1) return forward(Math.min(rule.dayOfMonth, dim));
  if (rule.operator === 7) return dim - ((isoWeekday(dayFromCivil(year, rule.month, dim)) - rule.dayOfWeek + 7) % 7);
  const nth = forward(1) + 7 * (rule.operator - 2);
  return nth <= dim ? nth : nth - 7;
}

/** Reads LocalTimeParameters; null when tzOffset is missing. */
export function readLocalTime(resource: XmlNode): EspiLocalTime | null {
  const tzOffset = integer(resource, 'tzOffset');
  if (tzOffset === null) return null;
  const start = text(resource['dstStartRule']);
  const end = text(resource['dstEndRule']);
  const dstStart = start === null ? null : decodeDstRule(start);
  const dstEnd = end === null ? null : decodeDstRule(end);
  const withDst = dstStart !== null && dstEnd !== null;
  return {
    tzOffset,
    dstOffset: withDst ? (integer(resource, 'dstOffset') ?? 0) : 0,
    dstStart: withDst ? dstStart : null,
    dstEnd: withDst ? dstEnd : null,
  };
}

function transition(rule: DstRule, year: number, offsetSeconds: number): number {
  return dayFromCivil(year, rule.month, ruleDay(rule, year)) * DAY + rule.secondsOfDay - offsetSeconds;
}

/** Seconds to add to a UTC instant to get local clock time. */
export function localOffset(epochSeconds: number, lt: EspiLocalTime | null): number {
  if (lt === null) return 0;
  if (lt.dstStart === null || lt.dstEnd === null || lt.dstOffset === 0) return lt.tzOffset;
  const year = civilFromDay(Math.floor((epochSeconds + lt.tzOffset) / DAY)).year;
  const start = transition(lt.dstStart, year, lt.tzOffset);
  const end = transition(lt.dstEnd, year, lt.tzOffset + lt.dstOffset);
  const inDst = start < end ? epochSeconds >= start && epochSeconds < end : epochSeconds >= start || epochSeconds < end;
  return lt.tzOffset + (inDst ? lt.dstOffset : 0);
}

/** Local day number (days since 1970-01-01) of an instant. */
export function localDay(epochSeconds: number, lt: EspiLocalTime | null): number {
  return Math.floor((epochSeconds + localOffset(epochSeconds, lt)) / DAY);
}

/** Local ISO date of an instant. */
export function localIsoDate(epochSeconds: number, lt: EspiLocalTime | null): string {
  return isoFromDays(localDay(epochSeconds, lt));
}
