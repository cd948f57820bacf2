/**
 * Safety cautions as data: for each hazard met during walkthrough measurements, the cautions to
 * show, the standards behind them, and the calculators and instrument types they apply to. The
 * wording is ours; every hazard defers to local codes, the site's rules and licensed practice.
 */
import type { CalculatorId, HazardId, SourceCitation } from './calculator';
import type { InstrumentType } from './instruments';

export interface Hazard {
  id: HazardId;
  title: string;
  cautions: readonly string[];
  references: readonly SourceCitation[];
  appliesToCalculators: readonly CalculatorId[];
  appliesToInstruments: readonly InstrumentType[];
  /** The deferral to local codes and licensed practice, shown with every hazard. */
  deferral: string;
}

/** Shown with every set of cautions. */
export const SAFETY_DEFERRAL =
  'These reminders do not replace training, the site’s safety rules, local codes or licensed practice. Where they differ, the stricter rule applies.';

const NFPA_70E: SourceCitation = {
  title: 'NFPA 70E, Standard for Electrical Safety in the Workplace (the edition adopted by the owner)',
  publisher: 'National Fire Protection Association',
  kind: 'standards-body',
  confidence: 'secondary',
  detail: 'taking readings counts as working on energized parts: qualified persons, safe work practices and PPE',
};
const OSHA_1910_334_C: SourceCitation = {
  title: '29 CFR 1910.334(c): only qualified persons test circuits; inspect instruments and leads before use',
  publisher: 'U.S. Occupational Safety and Health Administration',
  kind: 'regulation',
  confidence: 'secondary',
};
const ANSI_Z21_CO: SourceCitation = {
  title: 'ANSI Z21 appliance standards: 400 ppm air-free CO for vented heating equipment',
  publisher: 'ANSI / CSA Group',
  kind: 'standards-body',
  confidence: 'secondary',
};
const OSHA_CO_PEL: SourceCitation = {
  title: '29 CFR 1910.1000 Table Z-1: carbon monoxide 50 ppm 8-hour TWA',
  publisher: 'U.S. Occupational Safety and Health Administration',
  kind: 'regulation',
  confidence: 'memory',
};
const OSHA_1910_23: SourceCitation = {
  title: '29 CFR 1910.23(b)(11)–(13): face the ladder, keep one hand on it, carry nothing that upsets balance',
  publisher: 'U.S. Occupational Safety and Health Administration',
  kind: 'regulation',
  confidence: 'secondary',
};
const OSHA_MACHINE_ROOM: SourceCitation = {
  title: '29 CFR 1910.147 (lockout/tagout), 1910.219 (guarding), 1910.95 (noise), 1910.146 (confined spaces)',
  publisher: 'U.S. Occupational Safety and Health Administration',
  kind: 'regulation',
  confidence: 'memory',
};
const ASHRAE_15: SourceCitation = {
  title: 'ASHRAE Standard 15, refrigeration machinery rooms',
  publisher: 'ASHRAE',
  kind: 'standards-body',
  confidence: 'memory',
};

const HAZARD_CAUTIONS: readonly Omit<Hazard, 'deferral'>[] = [
  {
    id: 'energized-electrical',
    title: 'Readings on energized electrical equipment',
    cautions: [
      'Only a qualified person, trained for the equipment and voltage, takes readings inside panels, disconnects or motor terminal boxes.',
      'Wear the PPE that the site’s NFPA 70E assessment calls for; readings count as work on energized parts even when nothing is touched.',
      'Use a meter rated for the point of measurement (CAT III or IV) and look over the meter, leads and clamp before use.',
      'Auditors who are not qualified use plug-in meters, or ask an electrician to place loggers.',
    ],
    references: [NFPA_70E, OSHA_1910_334_C],
    appliesToCalculators: ['clamp-meter-power', 'motor-load-input-power', 'pump-efficiency', 'lighting-retrofit'],
    appliesToInstruments: ['clamp_ammeter', 'power_logger', 'three_phase_power_logger', 'plug_in_power_meter'],
  },
  {
    id: 'combustion-testing',
    title: 'Combustion testing and carbon monoxide',
    cautions: [
      'Wear a personal CO monitor. If the room air reaches 35 ppm, ventilate and step out; at 100 ppm, leave and call the building operator.',
      'Zero the analyzer in fresh outdoor air, and let it purge in fresh air after each test.',
      'Air-free CO above the appliance limit (400 ppm for vented heating equipment) goes to a licensed service technician the same day.',
      'Sample through the test port only; do not open flues or draft hoods.',
    ],
    references: [ANSI_Z21_CO, OSHA_CO_PEL],
    appliesToCalculators: ['combustion-efficiency'],
    appliesToInstruments: ['combustion_analyzer', 'manometer'],
  },
  {
    id: 'rotating-machinery',
    title: 'Rotating machinery and stroboscopes',
    cautions: [
      'A strobe can make a turning shaft look still. Never reach toward equipment lit by a strobe.',
      'Keep every belt and coupling guard in place; take speed readings from outside the guard.',
      'Keep loose clothing, lanyards, hair and cables clear of shafts and belts.',
      'Equipment can start at any time under automatic control.',
    ],
    references: [OSHA_MACHINE_ROOM],
    appliesToCalculators: ['motor-load-slip', 'motor-load-input-power', 'pump-efficiency'],
    appliesToInstruments: ['stroboscope', 'ultrasonic_flow_meter'],
  },
  {
    id: 'hot-surfaces',
    title: 'Hot surfaces',
    cautions: [
      'Lamps, flue pipes, boiler jackets and steam or hot-water lines can burn: measure them with an infrared thermometer, do not touch.',
      'Let halogen and incandescent lamps cool before handling.',
    ],
    references: [],
    appliesToCalculators: ['lamp-type-hint', 'combustion-efficiency', 'pump-efficiency', 'lighting-retrofit'],
    appliesToInstruments: ['infrared_thermometer', 'infrared_camera', 'combustion_analyzer'],
  },
  {
    id: 'ladders',
    title: 'Ladders',
    cautions: [
      'Face the ladder, keep one hand on it, and carry nothing that upsets your balance: use a tool belt or a line for instruments.',
      'Use a non-conductive (fibreglass) ladder near electrical equipment and light fixtures.',
      'Prefer taking readings from the floor with an infrared thermometer or a meter on a pole.',
    ],
    references: [OSHA_1910_23],
    appliesToCalculators: ['lighting-retrofit', 'illuminance-check', 'lamp-type-hint'],
    appliesToInstruments: ['light_meter', 'light_occupancy_logger', 'infrared_thermometer', 'temperature_humidity_logger', 'co2_logger'],
  },
  {
    id: 'mechanical-rooms',
    title: 'Mechanical rooms',
    cautions: [
      'Enter with the building operator; tell someone where you are.',
      'Wear hearing protection where equipment is loud.',
      'Heed refrigerant-detector alarms: leave and report.',
      'Do not enter pits, vaults or other confined spaces.',
    ],
    references: [OSHA_MACHINE_ROOM, ASHRAE_15],
    appliesToCalculators: ['motor-load-slip', 'motor-load-input-power', 'pump-efficiency', 'combustion-efficiency'],
    appliesToInstruments: ['infrared_camera', 'ultrasonic_flow_meter', 'combustion_analyzer', 'manometer', 'stroboscope', 'three_phase_power_logger'],
  },
  {
    id: 'measure-do-not-adjust',
    title: 'Measure, do not adjust',
    cautions: [
      'The auditor measures and records. Burner, valve, setpoint, breaker and drive adjustments belong to the owner’s operators or a licensed technician.',
      'Lockout/tagout is the owner’s process: never open, operate or lock equipment yourself.',
    ],
    references: [OSHA_MACHINE_ROOM],
    appliesToCalculators: ['clamp-meter-power', 'motor-load-slip', 'motor-load-input-power', 'combustion-efficiency', 'pump-efficiency'],
    appliesToInstruments: ['combustion_analyzer', 'manometer', 'clamp_ammeter', 'three_phase_power_logger', 'ultrasonic_flow_meter', 'stroboscope'],
  },
];

export const HAZARDS: readonly Hazard[] = HAZARD_CAUTIONS.map((h) => ({ ...h, deferral: SAFETY_DEFERRAL }));

export function hazardById(id: HazardId): Hazard {
  return HAZARDS.find((h) => h.id === id) as Hazard;
}

export function hazardsForCalculator(id: CalculatorId): Hazard[] {
  return HAZARDS.filter((h) => h.appliesToCalculators.includes(id));
}

export function hazardsForInstrument(type: InstrumentType): Hazard[] {
  return HAZARDS.filter((h) => h.appliesToInstruments.includes(type));
}
