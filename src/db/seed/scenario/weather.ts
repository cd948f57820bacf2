/**
 * Synthetic daily weather for one station: a seasonal sinusoid of the daily mean temperature plus
 * two AR(1) anomalies (day to day, and slow spells), and a diurnal range split around the mean.
 * Temperatures are whole °F, as a cooperative observer reports them.
 *
 *   Tmean_d = meanF − amplitudeF·cos(2π(doy − coldestDay)/365.25) + fast_d + slow_d
 *   fast_d  = φf·fast_{d−1} + √(1−φf²)·σf·(1 + winterBoost·cos(…))·z
 *   slow_d  = φs·slow_{d−1} + √(1−φs²)·σs·z'
 *   range_d = max(4, diurnalRangeF + diurnalSdF·z''),  Tmax = round(T + range/2), Tmin = round(T − range/2)
 *
 * The complete series drives the bills; the published series then loses a few single days (values
 * null) and one run of days (rows absent), so the coverage view has something to show.
 */
import type { WeatherSpec } from './climates';
import { Rng } from './prng';
import { civilToDay, dayToCivil, dayToIso } from './dates';
import type { WeatherDay } from './types';

/** The complete series (every day has both values) as parallel arrays from `firstDay`. */
export interface CompleteWeather {
  firstDay: number;
  tmaxF: number[];
  tminF: number[];
}

const YEAR_DAYS = 365.25; // mean Gregorian-Julian year length, common practice for seasonal cycles

/** Generate every day from firstDay to lastDay (day numbers, inclusive). */
export function generateCompleteWeather(spec: WeatherSpec, rng: Rng, firstDay: number, lastDay: number): CompleteWeather {
  const tmaxF: number[] = [];
  const tminF: number[] = [];
  const fastInnovation = Math.sqrt(1 - spec.fastPhi * spec.fastPhi);
  const slowInnovation = Math.sqrt(1 - spec.slowPhi * spec.slowPhi);
  // Start both anomalies from their stationary distributions so the first year is not special.
  let fast = spec.fastSdF * rng.normal();
  let slow = spec.slowSdF * rng.normal();
  let year = dayToCivil(firstDay).year;
  let yearStart = civilToDay(year, 1, 1);
  let nextYearStart = civilToDay(year + 1, 1, 1);
  for (let d = firstDay; d <= lastDay; d++) {
    if (d === nextYearStart) {
      year += 1;
      yearStart = nextYearStart;
      nextYearStart = civilToDay(year + 1, 1, 1);
    }
    const season = Math.cos((2 * Math.PI * (d - yearStart - spec.coldestDay)) / YEAR_DAYS);
    const fastSd = spec.fastSdF * (1 + spec.winterBoost * season);
    fast = spec.fastPhi * fast + fastInnovation * fastSd * rng.normal();
    slow = spec.slowPhi * slow + slowInnovation * spec.slowSdF * rng.normal();
    const mean = spec.meanF - spec.amplitudeF * season + fast + slow;
    const range = Math.max(4, spec.diurnalRangeF + spec.diurnalSdF * rng.normal());
    tmaxF.push(Math.round(mean + range / 2));
    tminF.push(Math.round(mean - range / 2));
  }
  return { firstDay, tmaxF, tminF };
}

/** What was taken out of the published series. */
export interface WeatherDropouts {
  /** Day numbers whose values are null in the published series (one or both values). */
  singleDays: number[];
  /** First day and length of the run of days absent from the published series. */
  gap: { firstDay: number; days: number };
}

/**
 * Choose the dropouts: `singles` isolated days anywhere except the last 30 days, and one gap of
 * 5–12 days between `gapFrom` and `gapTo` (day numbers), kept clear of the isolated days.
 */
export function chooseDropouts(rng: Rng, weather: CompleteWeather, gapFrom: number, gapTo: number, singles: number): WeatherDropouts {
  const lastDay = weather.firstDay + weather.tmaxF.length - 1;
  const gapDays = rng.int(5, 12);
  const gapFirst = rng.int(gapFrom, gapTo - gapDays);
  const chosen = new Set<number>();
  while (chosen.size < singles) {
    const d = rng.int(weather.firstDay + 1, lastDay - 30);
    const nearGap = d >= gapFirst - 2 && d <= gapFirst + gapDays + 1;
    const nearOther = chosen.has(d - 1) || chosen.has(d + 1);
    if (!nearGap && !nearOther) chosen.add(d);
  }
  return { singleDays: [...chosen].sort((a, b) => a - b), gap: { firstDay: gapFirst, days: gapDays } };
}

/**
 * The published series: single dropouts lose both values, except every third one, which loses
 * only its minimum (a half-reported day); the gap's rows are absent.
 */
export function publishWeather(weather: CompleteWeather, dropouts: WeatherDropouts): WeatherDay[] {
  const singleIndex = new Map(dropouts.singleDays.map((d, i) => [d, i] as const));
  const gapEnd = dropouts.gap.firstDay + dropouts.gap.days - 1;
  const days: WeatherDay[] = [];
  for (let i = 0; i < weather.tmaxF.length; i++) {
    const d = weather.firstDay + i;
    if (d >= dropouts.gap.firstDay && d <= gapEnd) continue;
    const tmax = weather.tmaxF[i] as number;
    const tmin = weather.tminF[i] as number;
    const k = singleIndex.get(d);
    if (k === undefined) days.push({ date: dayToIso(d), tmaxF: tmax, tminF: tmin });
    else if (k % 3 === 2) days.push({ date: dayToIso(d), tmaxF: tmax, tminF: null });
    else days.push({ date: dayToIso(d), tmaxF: null, tminF: null });
  }
  return days;
}
