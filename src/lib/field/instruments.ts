/**
 * Instrument types of the loaner kits, as codes. The kit library, the walkthrough planner, the
 * calculators and the safety cautions all name instruments with these codes.
 */
import { z } from 'zod';

export const INSTRUMENT_TYPES = [
  'light_meter',
  'plug_in_power_meter',
  'clamp_ammeter',
  'infrared_thermometer',
  'infrared_camera',
  'stroboscope',
  'flow_test_bags',
  'temperature_humidity_logger',
  'light_occupancy_logger',
  'co2_logger',
  'power_logger',
  'combustion_analyzer',
  'manometer',
  'ultrasonic_flow_meter',
  'three_phase_power_logger',
  'tape_measure',
  'flashlight',
  'camera',
] as const;
export const instrumentTypeSchema = z.enum(INSTRUMENT_TYPES);
export type InstrumentType = z.infer<typeof instrumentTypeSchema>;

export const INSTRUMENT_LABELS: Record<InstrumentType, string> = {
  light_meter: 'Light meter',
  plug_in_power_meter: 'Plug-in power meter',
  clamp_ammeter: 'Clamp ammeter',
  infrared_thermometer: 'Infrared thermometer',
  infrared_camera: 'Infrared camera',
  stroboscope: 'Stroboscope',
  flow_test_bags: 'Flow-test bags',
  temperature_humidity_logger: 'Temperature/humidity logger',
  light_occupancy_logger: 'Light/occupancy logger',
  co2_logger: 'CO₂ logger',
  power_logger: 'Power logger',
  combustion_analyzer: 'Combustion analyzer',
  manometer: 'Manometer',
  ultrasonic_flow_meter: 'Ultrasonic flow meter',
  three_phase_power_logger: 'Three-phase power logger',
  tape_measure: 'Tape measure',
  flashlight: 'Flashlight',
  camera: 'Camera',
};
