/**
 * The loaner kit library of the demo region: five kits kept at the installations, each a set of
 * instruments for one kind of walkthrough, together covering every instrument type. Models and
 * serial numbers are invented. Calibration due dates spread over the coming year, with a few due
 * within a month and one past due, so the calibration views have something to show.
 */
import type { InstrumentType } from '../../../lib/field/instruments';
import { dayToIso } from './dates';
import type { DemoInstrument, DemoKit } from './field-types';
import type { Rng } from './prng';

/** Instrument types that are not calibrated (no due date). */
const UNCALIBRATED: ReadonlySet<InstrumentType> = new Set(['tape_measure', 'flashlight', 'camera', 'flow_test_bags']);

/** Invented model names per type. */
const MODELS: Record<InstrumentType, string> = {
  light_meter: 'LM-200',
  plug_in_power_meter: 'PM-15',
  clamp_ammeter: 'CA-400',
  infrared_thermometer: 'IT-12',
  infrared_camera: 'TC-160',
  stroboscope: 'ST-9',
  flow_test_bags: 'FB-1 set',
  temperature_humidity_logger: 'TH-4',
  light_occupancy_logger: 'LO-8',
  co2_logger: 'CL-3',
  power_logger: 'PL-30',
  combustion_analyzer: 'CX-5',
  manometer: 'DM-2',
  ultrasonic_flow_meter: 'UF-50',
  three_phase_power_logger: 'TP-3',
  tape_measure: 'TM-30',
  flashlight: 'FL-500',
  camera: 'DC-12',
};

interface KitPlan {
  code: string;
  name: string;
  description: string;
  home: string;
  homeLocation: string;
  /** Types with how many of each. */
  items: readonly (readonly [InstrumentType, number])[];
}

export const KIT_PLANS: readonly KitPlan[] = [
  {
    code: 'KIT-01', name: 'Lighting and plug-load kit', home: 'BNP', homeLocation: 'Brennock Plains, energy office, cabinet 2',
    description: 'Light levels, lighting hours and occupancy, plug loads and base load.',
    items: [['light_meter', 1], ['plug_in_power_meter', 2], ['clamp_ammeter', 1], ['light_occupancy_logger', 4], ['power_logger', 2], ['tape_measure', 1], ['flashlight', 1], ['camera', 1]],
  },
  {
    code: 'KIT-02', name: 'Heating plant kit', home: 'KSL', homeLocation: 'Kestrowe Lakes, central heating plant office',
    description: 'Boilers and furnaces: combustion, draft, surface temperatures and envelope losses.',
    items: [['combustion_analyzer', 1], ['manometer', 1], ['infrared_thermometer', 1], ['infrared_camera', 1], ['temperature_humidity_logger', 4], ['flashlight', 1], ['camera', 1]],
  },
  {
    code: 'KIT-03', name: 'Water kit', home: 'SBP', homeLocation: 'Saltbrake Point, utilities shop',
    description: 'Fixture flow tests, pipe flow and hot-water temperatures.',
    items: [['flow_test_bags', 1], ['ultrasonic_flow_meter', 1], ['infrared_thermometer', 1], ['tape_measure', 1], ['flashlight', 1], ['camera', 1]],
  },
  {
    code: 'KIT-04', name: 'Electrical and motors kit', home: 'DMF', homeLocation: 'Dunmesa Flats, facilities engineering',
    description: 'Three-phase logging, motor load by slip and current, pump and fan checks.',
    items: [['three_phase_power_logger', 1], ['power_logger', 1], ['clamp_ammeter', 1], ['stroboscope', 1], ['infrared_thermometer', 1], ['camera', 1]],
  },
  {
    code: 'KIT-05', name: 'Indoor environment kit', home: 'FHS', homeLocation: 'Fernhollow Sound, building 5010 mail room',
    description: 'Ventilation and comfort: CO₂, temperature and humidity, light and occupancy over a week or two.',
    items: [['co2_logger', 3], ['temperature_humidity_logger', 3], ['light_occupancy_logger', 2], ['light_meter', 1], ['camera', 1]],
  },
];

/** Fixed calibration states that give the views something to show: [kit, type, days from today]. */
const DUE_SOON: readonly (readonly [string, InstrumentType, number])[] = [
  ['KIT-02', 'combustion_analyzer', 12],
  ['KIT-01', 'light_meter', 25],
  ['KIT-04', 'three_phase_power_logger', 28],
  ['KIT-05', 'co2_logger', -9], // past due: KIT-05 cannot go out until it is recalibrated
];

export function demoKits(rng: Rng, today: number): DemoKit[] {
  return KIT_PLANS.map((plan) => {
    const instruments: DemoInstrument[] = [];
    for (const [type, count] of plan.items) {
      for (let k = 0; k < count; k++) {
        const fixed = k === count - 1 ? DUE_SOON.find(([c, t]) => c === plan.code && t === type) : undefined;
        const due = UNCALIBRATED.has(type) ? null : dayToIso(today + (fixed ? fixed[2] : rng.int(60, 420)));
        instruments.push({
          type,
          model: MODELS[type],
          serial: `${MODELS[type].replace(/[^A-Z0-9]/g, '')}-${rng.int(10000, 99999)}`,
          calibrationDue: due,
          condition: 'good',
          notes: fixed && fixed[2] < 0 ? 'Calibration lapsed; booked with the calibration lab.' : '',
        });
      }
    }
    return { code: plan.code, name: plan.name, description: plan.description, homeInstallationCode: plan.home, homeLocation: plan.homeLocation, instruments };
  }).map((kit) => wearAndTear(kit));
}

/** A little wear: one fair flashlight in the heating kit, one IR thermometer out for repair in the water kit. */
function wearAndTear(kit: DemoKit): DemoKit {
  const mark = (type: InstrumentType, condition: DemoInstrument['condition'], notes: string) => {
    const i = kit.instruments.find((x) => x.type === type);
    if (i) Object.assign(i, { condition, notes });
  };
  if (kit.code === 'KIT-02') mark('flashlight', 'fair', 'Lens scratched; works.');
  if (kit.code === 'KIT-03') mark('infrared_thermometer', 'needs-repair', 'Reads 4 °F low against the reference; sent for repair.');
  return kit;
}
