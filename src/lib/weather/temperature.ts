/**
 * Temperatures and daily degree days. Daily mean by the mean-temperature method
 * T = (Tmax + Tmin) / 2; HDD_b = max(0, b − T), CDD_b = max(0, T − b)
 * (NOAA/NWS definition; US base 65 °F = 18.33 °C). The functions work in any one unit as long
 * as the temperature and the base share it.
 */

export type TemperatureUnit = 'F' | 'C';

// Source: NOAA/NWS degree-day definition, US base 65 °F.
export const US_BASE_F = 65;
// Source: definition of the Fahrenheit scale, (65 − 32) × 5/9 = 18.333 °C.
export const US_BASE_C = ((US_BASE_F - 32) * 5) / 9;

/** °F to °C: (F − 32) × 5/9 (definition). */
export function fToC(tempF: number): number {
  return ((tempF - 32) * 5) / 9;
}

/** °C to °F: C × 9/5 + 32 (definition). */
export function cToF(tempC: number): number {
  return (tempC * 9) / 5 + 32;
}

/** A temperature in `unit` expressed in °F. */
export function toF(temp: number, unit: TemperatureUnit): number {
  return unit === 'F' ? temp : cToF(temp);
}

/**
 * Degree-day (or temperature-difference) amounts in °F·day to °C·day: × 5/9. Differences carry
 * no 32° offset.
 */
export function degreeDaysFToC(degreeDaysF: number): number {
  return (degreeDaysF * 5) / 9;
}

/** Degree days in °C·day to °F·day: × 9/5. */
export function degreeDaysCToF(degreeDaysC: number): number {
  return (degreeDaysC * 9) / 5;
}

/**
 * Daily mean temperature by the mean-temperature method, (Tmax + Tmin) / 2.
 * @example dailyMeanTemperature(75, 65) // 70
 */
export function dailyMeanTemperature(tmax: number, tmin: number): number {
  return (tmax + tmin) / 2;
}

/**
 * Heating degree days of one day: max(0, base − mean).
 * @example heatingDegreeDays(40, 65) // 25
 */
export function heatingDegreeDays(meanTemp: number, base: number): number {
  return meanTemp < base ? base - meanTemp : 0;
}

/**
 * Cooling degree days of one day: max(0, mean − base).
 * @example coolingDegreeDays(70, 65) // 5
 */
export function coolingDegreeDays(meanTemp: number, base: number): number {
  return meanTemp > base ? meanTemp - base : 0;
}

/** Which side of the base a degree-day figure counts. */
export type DegreeDayKind = 'hdd' | 'cdd';

/** HDD or CDD of one day by kind. */
export function degreeDays(kind: DegreeDayKind, meanTemp: number, base: number): number {
  return kind === 'hdd' ? heatingDegreeDays(meanTemp, base) : coolingDegreeDays(meanTemp, base);
}
