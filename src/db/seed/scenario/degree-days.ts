/**
 * Degree days for the generator: daily HDD/CDD at a base, and a station's normal-year sums used
 * to turn an annual energy budget into slopes.
 *
 * Daily mean T = (Tmax + Tmin)/2; HDD_b = max(0, b − T); CDD_b = max(0, T − b)
 * (NOAA/NWS mean-temperature method, US base 65 °F). Summed over a bill's days this equals
 * n·HDD_p, CalTRACK 2.0 §3.3.4–3.3.5's period average, so a bill's expected use is
 * n·base + βH·Σ HDD + βC·Σ CDD.
 */
import { civilToDay, dayToCivil } from './dates';
import type { CompleteWeather } from './weather';

/** Heating degree days of one day at base `baseF`. */
export function heatingDegreeDays(meanF: number, baseF: number): number {
  return Math.max(0, baseF - meanF);
}

/** Cooling degree days of one day at base `baseF`. */
export function coolingDegreeDays(meanF: number, baseF: number): number {
  return Math.max(0, meanF - baseF);
}

/** Daily mean temperatures of a complete series. */
export function dailyMeans(weather: CompleteWeather): Float64Array {
  const means = new Float64Array(weather.tmaxF.length);
  for (let i = 0; i < means.length; i++) means[i] = ((weather.tmaxF[i] as number) + (weather.tminF[i] as number)) / 2;
  return means;
}

export const NORMAL_BASE_MIN_F = 30;
export const NORMAL_BASE_MAX_F = 90;

/** Normal-year HDD and CDD sums for each whole-°F base from 30 to 90. */
export interface DegreeDayNormals {
  years: number;
  hdd(baseF: number): number;
  cdd(baseF: number): number;
}

/**
 * Mean over the complete calendar years of the series, before `beforeYear`, of the annual sum of
 * daily degree days at each base (methods.md §3: normal-year degree days).
 * @throws when the series holds no complete calendar year (a bug in the options).
 */
export function degreeDayNormals(weather: CompleteWeather, beforeYear: number): DegreeDayNormals {
  const means = dailyMeans(weather);
  const first = dayToCivil(weather.firstDay);
  const firstYear = first.month === 1 && first.day === 1 ? first.year : first.year + 1;
  const years = beforeYear - firstYear;
  if (years < 1) throw new Error('no complete calendar year of weather for normals');
  const from = civilToDay(firstYear, 1, 1) - weather.firstDay;
  const to = civilToDay(beforeYear, 1, 1) - weather.firstDay; // exclusive
  const count = NORMAL_BASE_MAX_F - NORMAL_BASE_MIN_F + 1;
  const hdd = new Float64Array(count);
  const cdd = new Float64Array(count);
  for (let k = 0; k < count; k++) {
    const base = NORMAL_BASE_MIN_F + k;
    let h = 0;
    let c = 0;
    for (let i = from; i < to; i++) {
      const t = means[i] as number;
      if (t < base) h += base - t;
      else c += t - base;
    }
    hdd[k] = h / years;
    cdd[k] = c / years;
  }
  const at = (arr: Float64Array, baseF: number): number => {
    const k = Math.round(baseF) - NORMAL_BASE_MIN_F;
    const v = arr[k];
    if (v === undefined) throw new Error(`normal degree days asked at base ${baseF} °F, outside 30–90`);
    return v;
  };
  return { years, hdd: (b) => at(hdd, b), cdd: (b) => at(cdd, b) };
}
