/**
 * Lamp type hint from the surface temperature rise of a lit lamp, read with an infrared
 * thermometer on the glass or diffuser.
 *
 * Method (heuristic): an envelope far above 100 °C points to incandescent or halogen; a diffuser
 * below 60 °C points to LED (informal bench readings: LED 60 W-equivalent ≈ 98 °F, CFL ≈ 130–157 °F,
 * incandescent ≈ 300 °F). Expressed as a rise over the room so that it holds in warm and cold
 * spaces: the thresholds are those surface temperatures less a 25 °C room, i.e. a rise above 75 K
 * suggests incandescent or halogen and a rise below 35 K suggests LED [constructed from informal
 * readings, not a standard]. It is a hint, never a determination: the lamp label settles it.
 *
 * @example
 * lampTypeHint.run({ surfaceTempF: 98, ambientTempF: 77, surface: 'glass_or_diffuser' })
 * // rise 11.7 K, hint 'led'
 */
import { z } from 'zod';
import { defineCalculator, success } from './calculator';
import { choiceField, exactlyOneOf, numberField } from './inputs';
import { fahrenheitToCelsius } from './units';

/** Rise over the room above which an incandescent or halogen lamp is likely, K (see module note). */
export const INCANDESCENT_MIN_RISE_K = 75;
/** Rise over the room below which an LED is likely, K (see module note). */
export const LED_MAX_RISE_K = 35;

export const LAMP_SURFACES = ['glass_or_diffuser', 'metal_base_or_heat_sink'] as const;
export const LAMP_HINTS = ['incandescent_or_halogen', 'fluorescent_or_cfl_or_undetermined', 'led', 'undetermined'] as const;
export type LampHint = (typeof LAMP_HINTS)[number];

export const lampTypeHintInputSchema = z
  .object({
    surfaceTempF: numberField('Lamp surface temperature (°F)', { min: -40, max: 1500 }).optional(),
    surfaceTempC: numberField('Lamp surface temperature (°C)', { min: -40, max: 800 }).optional(),
    ambientTempF: numberField('Room temperature (°F)', { min: -40, max: 140 }).optional(),
    ambientTempC: numberField('Room temperature (°C)', { min: -40, max: 60 }).optional(),
    surface: choiceField('Surface aimed at', LAMP_SURFACES),
  })
  .refine(...exactlyOneOf(['surfaceTempF', 'surfaceTempC'], 'Lamp surface temperature'))
  .refine(...exactlyOneOf(['ambientTempF', 'ambientTempC'], 'Room temperature'));
export type LampTypeHintInput = z.output<typeof lampTypeHintInputSchema>;

export interface LampTypeHintResult {
  surfaceTempC: number;
  ambientTempC: number;
  riseK: number;
  riseF: number;
  hint: LampHint;
  /** Always true: the result is a hint for the inventory, not a determination. */
  isHint: true;
}

export function lampHintFromRise(riseK: number, surface: (typeof LAMP_SURFACES)[number]): LampHint {
  // Bare metal has a low emissivity and reads falsely low, so no hint is drawn from it.
  if (surface === 'metal_base_or_heat_sink') return 'undetermined';
  if (riseK > INCANDESCENT_MIN_RISE_K) return 'incandescent_or_halogen';
  if (riseK < LED_MAX_RISE_K) return 'led';
  return 'fluorescent_or_cfl_or_undetermined';
}

export function computeLampTypeHint(input: LampTypeHintInput) {
  const surfaceC = input.surfaceTempC ?? fahrenheitToCelsius(input.surfaceTempF as number);
  const ambientC = input.ambientTempC ?? fahrenheitToCelsius(input.ambientTempF as number);
  const riseK = surfaceC - ambientC;
  const hint = lampHintFromRise(riseK, input.surface);
  const value: LampTypeHintResult = { surfaceTempC: surfaceC, ambientTempC: ambientC, riseK, riseF: (riseK * 9) / 5, hint, isHint: true };
  const notes = ['A hint only: confirm the lamp type from the lamp or ballast label before counting savings.'];
  if (input.surface === 'metal_base_or_heat_sink') {
    notes.push('Bare or glossy metal reads low on an infrared thermometer; aim at the glass or diffuser, or put tape on the target.');
  }
  return success(
    value,
    [
      { label: 'Surface', value: surfaceC, unit: '°C' },
      { label: 'Room', value: ambientC, unit: '°C' },
      { label: 'Rise over room', value: riseK, unit: 'K' },
    ],
    notes,
  );
}

export const lampTypeHint = defineCalculator(
  {
    id: 'lamp-type-hint',
    title: 'Lamp type hint from surface temperature',
    summary: 'Suggests incandescent/halogen, fluorescent or LED from how much hotter than the room a lit lamp is.',
    formulas: [
      'rise = lamp surface temperature − room temperature',
      `rise > ${INCANDESCENT_MIN_RISE_K} K: incandescent or halogen likely`,
      `rise < ${LED_MAX_RISE_K} K: LED likely; between: fluorescent, CFL or undetermined`,
    ],
    inputs: [
      { name: 'surfaceTempF', label: 'Lamp surface temperature (°F)', unit: '°F', kind: 'number', required: false },
      { name: 'surfaceTempC', label: 'Lamp surface temperature (°C)', unit: '°C', kind: 'number', required: false },
      { name: 'ambientTempF', label: 'Room temperature (°F)', unit: '°F', kind: 'number', required: false },
      { name: 'ambientTempC', label: 'Room temperature (°C)', unit: '°C', kind: 'number', required: false },
      {
        name: 'surface',
        label: 'Surface aimed at',
        unit: null,
        kind: 'choice',
        required: true,
        choices: [
          { value: 'glass_or_diffuser', label: 'Glass or diffuser' },
          { value: 'metal_base_or_heat_sink', label: 'Metal base or heat sink' },
        ],
      },
    ],
    sources: [],
    instruments: ['infrared_thermometer', 'infrared_camera'],
    limitations: [
      'A heuristic from informal lamp readings, not a published method.',
      'Let the lamp run for several minutes first; set emissivity to the surface (0.95 suits glass and paint).',
    ],
  },
  lampTypeHintInputSchema,
  computeLampTypeHint,
);
