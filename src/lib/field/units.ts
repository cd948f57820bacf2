/**
 * Unit conversions used by the field calculators. Each constant carries its source; exact
 * definitions are marked as such.
 */

/** kW per horsepower as used by the DOE motor fact sheet (DOE/GO-10097-517, Eq. 2): 0.7457. */
export const KW_PER_HP = 0.7457;

/** m² per ft²: exact, from the international foot of 0.3048 m (NIST SP 811 [memory]). */
export const M2_PER_FT2 = 0.09290304;

/** lux per foot-candle: 1 fc = 1 lm/ft² = 1/0.09290304 lx ≈ 10.7639 lx. */
export const LUX_PER_FC = 1 / M2_PER_FT2;

/** Litres per US gallon: exact, 231 in³ × (0.0254 m)³ (NIST SP 811 [memory]). */
export const LITERS_PER_GAL = 3.785411784;

/** US fluid ounces per US gallon: 128 by definition. */
export const FL_OZ_PER_GAL = 128;

/** Heat to warm one US gallon of water by 1 °F: 8.34 lb/gal × 1 Btu/(lb·°F), common practice. */
export const BTU_PER_GAL_DEG_F = 8.34;

export function fahrenheitToCelsius(tempF: number): number {
  return ((tempF - 32) * 5) / 9;
}

export function celsiusToFahrenheit(tempC: number): number {
  return (tempC * 9) / 5 + 32;
}

/** A temperature difference in °F expressed in kelvin (= °C difference). */
export function deltaFahrenheitToKelvin(deltaF: number): number {
  return (deltaF * 5) / 9;
}

export function footCandlesToLux(fc: number): number {
  return fc * LUX_PER_FC;
}

export function luxToFootCandles(lux: number): number {
  return lux / LUX_PER_FC;
}

/** Annual operating hours from a daily schedule. */
export function annualHours(hoursPerDay: number, daysPerYear: number): number {
  return hoursPerDay * daysPerYear;
}
