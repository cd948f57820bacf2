/**
 * Which instruments to bring to a walkthrough, read from the building's signature: the stored
 * baseline models (base load, heating and cooling slopes per square foot, the heating fuel used
 * at normal weather per square foot — slope and balance point together — balance points), its
 * water intensity against peers, lighting and occupancy hours and equipment ages from earlier
 * walkthroughs, its fuels and its age. Each suggestion carries the reasons in words, with the
 * figure and the threshold that triggered it.
 *
 * Screening thresholds and their basis (none is a published limit; the published sources are
 * named where one exists):
 * - a figure at least 1.5× the median of at least 3 peers of the same use type: common practice
 *   for screening (the shortlist compares with peer medians the same way);
 * - most energy independent of weather (base-load share ≥ 75 %) when peers are too few: common practice;
 * - heating balance point ≥ 65 °F: the degree-day convention assumes 65 °F, while commercial
 *   buildings with internal gains usually balance lower (ASHRAE Handbook—Fundamentals,
 *   degree-day methods [memory]); a higher one points at setpoints or envelope;
 * - a heating-and-cooling model whose balance points are within 3 °F: simultaneous heating and
 *   cooling (reheat, fighting units), common practice;
 * - lights on ≥ 4,380 h/yr (half the hours of a year) or ≥ 1.2× the occupied hours: common practice;
 * - equipment 20 years old or more: at or past the median service life of most HVAC equipment
 *   (ASHRAE Handbook—HVAC Applications, owning and operating costs [memory]);
 * - built before 1975: before ASHRAE Standard 90-75, the first U.S. energy standard for new
 *   buildings [memory].
 */
import type { Commodity } from '../domain';
import { formatNumber } from '../format';
import type { HazardId } from './calculator';
import { INSTRUMENT_LABELS, INSTRUMENT_TYPES, type InstrumentType } from './instruments';
import { hazardsForInstrument } from './safety';
import type { HVAC_EQUIPMENT } from './walkthrough-form';

/** A figure of the building with the median of its peers (same use type) and how many there are. */
export interface PeerFigure {
  value: number;
  peerMedian: number | null;
  peers: number;
}

export interface EquipmentAge {
  equipment: (typeof HVAC_EQUIPMENT)[number];
  label: string;
  yearInstalled: number | null;
  fuel: string;
}

export interface BuildingSignature {
  /** The peers in a sentence, plural: e.g. "peer offices", "office buildings in your reach". */
  peerNoun: string;
  yearBuilt: number | null;
  /** The year the suggestion is made in (for equipment ages). */
  asOfYear: number;
  commodities: readonly Commodity[];
  /** Electricity not explained by weather, kBtu/ft²·yr (baseline intercept × 365). */
  electricBaseLoad: PeerFigure | null;
  /** Share of normal-year energy not explained by weather, 0–1. */
  baseLoadShare: number | null;
  /** Σ heating slopes of the energy meters, Btu/ft² per heating degree day. */
  heatingSlope: PeerFigure | null;
  /** Heating fuel used because of the weather in a normal year (normal-year use less base load), kBtu/ft²·yr. */
  heatingFuelIntensity: PeerFigure | null;
  heatingBalanceF: number | null;
  /** Σ cooling slopes, Btu/ft² per cooling degree day. */
  coolingSlope: PeerFigure | null;
  coolingBalanceF: number | null;
  /** True when a heating-and-cooling model is in use on some meter. */
  heatingAndCoolingModel: boolean;
  /** Water use intensity, gal/ft²·yr. */
  waterIntensity: PeerFigure | null;
  /** Weighted lighting hours from an earlier walkthrough, h/yr. */
  lightingHoursPerYear: number | null;
  occupiedHoursPerYear: number | null;
  equipment: readonly EquipmentAge[];
}

export interface InstrumentSuggestion {
  type: InstrumentType;
  label: string;
  reasons: string[];
  /** `signature`: the building's figures call for it; `routine`: every walkthrough. */
  basis: 'signature' | 'routine';
  hazards: HazardId[];
}

export interface InstrumentSuggestions {
  instruments: InstrumentSuggestion[];
  /** What could not be judged, and why (too few peers, no baseline, no earlier walkthrough). */
  notChecked: string[];
}

export const PEER_RATIO_HIGH = 1.5; // common practice (screening at 50 % above the peer median)
export const MIN_PEERS = 3; // common practice
export const BASE_LOAD_SHARE_HIGH = 0.75; // common practice
export const HEATING_BALANCE_HIGH_F = 65; // degree-day convention base, ASHRAE Fundamentals [memory]
export const DEAD_BAND_NARROW_F = 3; // common practice
export const LIGHTING_HOURS_HIGH = 4380; // half of 8,760 h: common practice
export const LIGHTING_OVER_OCCUPANCY = 1.2; // common practice
export const EQUIPMENT_AGE_OLD_YEARS = 20; // ASHRAE HVAC Applications service lives [memory]
export const PRE_ENERGY_CODE_YEAR = 1975; // ASHRAE Standard 90-75 [memory]

const COMBUSTION_FUELS: readonly string[] = ['natural_gas', 'fuel_oil_2', 'fuel_oil_6', 'propane', 'kerosene', 'diesel'];
const ROTATING: readonly string[] = ['pump', 'fan', 'air-handler', 'cooling-tower', 'chiller'];

const ROUTINE: readonly [InstrumentType, string][] = [
  ['flashlight', 'Every walkthrough: ceiling spaces, mechanical rooms and nameplates (common practice).'],
  ['camera', 'Every walkthrough: nameplates, fixtures and conditions for the record (common practice).'],
  ['tape_measure', 'Every walkthrough: room and window sizes for the lighting and envelope notes (common practice).'],
  ['light_meter', 'Every walkthrough: illuminance against the levels of 41 CFR 102-74.180 in the rooms you visit.'],
];

/** "2.4× the median of 7 peer offices (5.1)", or null when the figure is not high against peers. */
function highAgainstPeers(f: PeerFigure | null, digits: number, noun: string): string | null {
  if (!f || f.peerMedian === null || f.peers < MIN_PEERS || !(f.peerMedian > 0)) return null;
  const ratio = f.value / f.peerMedian;
  if (ratio < PEER_RATIO_HIGH) return null;
  return `${formatNumber(ratio, 1)}× the median of ${f.peers} ${noun} (${formatNumber(f.peerMedian, digits)})`;
}

function peersMissing(f: PeerFigure | null): boolean {
  return !!f && (f.peerMedian === null || f.peers < MIN_PEERS);
}

/**
 * Instruments for a walkthrough of a building with this signature, signature-driven ones first,
 * each with its reasons; the routine kit last.
 * @example suggestInstruments({ ...signature, electricBaseLoad: { value: 30, peerMedian: 12, peers: 8 } })
 *   // plug-in power meter and clamp ammeter, "Electric base load 30 kBtu/ft²·yr is 2.5× the median of 8 peer offices (12)…"
 */
export function suggestInstruments(s: BuildingSignature): InstrumentSuggestions {
  const reasons = new Map<InstrumentType, string[]>();
  const add = (types: InstrumentType[], reason: string) => {
    for (const t of types) {
      const list = reasons.get(t) ?? [];
      if (!list.includes(reason)) list.push(reason);
      reasons.set(t, list);
    }
  };
  const notChecked: string[] = [];
  const combustion = s.commodities.some((c) => COMBUSTION_FUELS.includes(c));

  // Base load: loads that run whatever the weather.
  const base = highAgainstPeers(s.electricBaseLoad, 1, s.peerNoun);
  if (base && s.electricBaseLoad) {
    add(['plug_in_power_meter', 'clamp_ammeter', 'power_logger'], `Electric base load ${formatNumber(s.electricBaseLoad.value, 1)} kBtu/ft²·yr is ${base}: find what runs around the clock (plug and process loads, servers, lighting).`);
    add(['light_occupancy_logger'], `High electric base load: check whether lights stay on when spaces are empty.`);
  } else if (peersMissing(s.electricBaseLoad) && s.baseLoadShare !== null && s.baseLoadShare >= BASE_LOAD_SHARE_HIGH) {
    add(['plug_in_power_meter', 'clamp_ammeter'], `${formatNumber(s.baseLoadShare * 100, 0)} % of the energy does not depend on the weather (threshold ${BASE_LOAD_SHARE_HIGH * 100} %): measure the loads that run all the time.`);
  }
  if (peersMissing(s.electricBaseLoad)) notChecked.push(`Electric base load not compared: fewer than ${MIN_PEERS} ${s.peerNoun} with a baseline.`);
  if (!s.electricBaseLoad && s.commodities.includes('electricity')) notChecked.push('Electric base load unknown: the electricity meter has no baseline model yet.');

  // Heating: envelope and combustion.
  const slope = highAgainstPeers(s.heatingSlope, 2, s.peerNoun);
  const fuel = highAgainstPeers(s.heatingFuelIntensity, 1, s.peerNoun);
  if ((slope && s.heatingSlope) || (fuel && s.heatingFuelIntensity)) {
    const why =
      slope && s.heatingSlope
        ? `Heating slope ${formatNumber(s.heatingSlope.value, 2)} Btu/ft²·HDD is ${slope}`
        : `Heating fuel at normal weather ${formatNumber(s.heatingFuelIntensity!.value, 1)} kBtu/ft²·yr is ${fuel}`;
    add(['infrared_camera'], `${why}: look for heat loss through the envelope and uninsulated piping.`);
    if (combustion) add(['combustion_analyzer'], `${why}, with fuel-fired heating: test the burners' combustion efficiency.`);
    add(['temperature_humidity_logger'], `${why}: log space temperatures for setpoints and setback.`);
  }
  if (peersMissing(s.heatingSlope)) notChecked.push(`Heating slope not compared: fewer than ${MIN_PEERS} ${s.peerNoun} with a heating model.`);
  if (s.heatingBalanceF !== null && s.heatingBalanceF >= HEATING_BALANCE_HIGH_F) {
    add(['temperature_humidity_logger'], `Heating starts at ${formatNumber(s.heatingBalanceF, 0)} °F outdoors (threshold ${HEATING_BALANCE_HIGH_F} °F): log setpoints and schedules.`);
    add(['infrared_thermometer'], `High heating balance point: check supply and space temperatures.`);
  }

  // Cooling.
  const cool = highAgainstPeers(s.coolingSlope, 2, s.peerNoun);
  if (cool && s.coolingSlope) {
    const why = `Cooling slope ${formatNumber(s.coolingSlope.value, 2)} Btu/ft²·CDD is ${cool}`;
    add(['three_phase_power_logger', 'clamp_ammeter'], `${why}: log the chillers or rooftop units.`);
    add(['temperature_humidity_logger'], `${why}: log space temperatures and humidity.`);
  }
  if (s.heatingAndCoolingModel && s.heatingBalanceF !== null && s.coolingBalanceF !== null && s.coolingBalanceF - s.heatingBalanceF <= DEAD_BAND_NARROW_F) {
    const why = `Heating below ${formatNumber(s.heatingBalanceF, 0)} °F and cooling above ${formatNumber(s.coolingBalanceF, 0)} °F leave a dead band of ${formatNumber(s.coolingBalanceF - s.heatingBalanceF, 0)} °F (threshold ${DEAD_BAND_NARROW_F} °F): heating and cooling may run at once`;
    add(['temperature_humidity_logger', 'infrared_thermometer'], `${why}; log supply and space temperatures.`);
    add(['co2_logger'], `${why}; check whether ventilation follows occupancy.`);
  }

  // Water.
  const water = highAgainstPeers(s.waterIntensity, 1, s.peerNoun);
  if (water && s.waterIntensity) {
    add(['flow_test_bags'], `Water use ${formatNumber(s.waterIntensity.value, 1)} gal/ft²·yr is ${water}: flow-test faucets, showerheads and spray valves against the federal maxima.`);
    add(['ultrasonic_flow_meter'], `High water intensity: measure flows where a fixture test cannot reach (makeup water, process lines).`);
    add(['infrared_thermometer'], `High water intensity: find hot-water leaks by their temperature.`);
  }
  if (peersMissing(s.waterIntensity)) notChecked.push(`Water intensity not compared: fewer than ${MIN_PEERS} ${s.peerNoun} with water bills.`);

  // Lighting hours.
  const lh = s.lightingHoursPerYear;
  if (lh !== null) {
    if (lh >= LIGHTING_HOURS_HIGH) add(['light_occupancy_logger', 'light_meter'], `Lights recorded on ${formatNumber(lh, 0)} h/yr (threshold ${formatNumber(LIGHTING_HOURS_HIGH, 0)} h/yr): log when they are on against occupancy.`);
    else if (s.occupiedHoursPerYear !== null && s.occupiedHoursPerYear > 0 && lh >= LIGHTING_OVER_OCCUPANCY * s.occupiedHoursPerYear) {
      add(['light_occupancy_logger'], `Lights on ${formatNumber(lh, 0)} h/yr against ${formatNumber(s.occupiedHoursPerYear, 0)} occupied hours (≥ ${LIGHTING_OVER_OCCUPANCY}×): log lighting against occupancy.`);
    }
  } else notChecked.push('Lighting hours unknown: no earlier walkthrough recorded them.');

  // Equipment age and kind.
  for (const e of s.equipment) {
    const age = e.yearInstalled === null ? null : s.asOfYear - e.yearInstalled;
    if (age !== null && age >= EQUIPMENT_AGE_OLD_YEARS) {
      const why = `${e.label} installed ${e.yearInstalled} (${age} years, threshold ${EQUIPMENT_AGE_OLD_YEARS})`;
      if (COMBUSTION_FUELS.includes(e.fuel)) add(['combustion_analyzer'], `${why}: test its combustion efficiency.`);
      if (ROTATING.includes(e.equipment)) add(['stroboscope', 'clamp_ammeter'], `${why}: measure motor load by the slip method.`);
      else add(['infrared_thermometer'], `${why}: check jacket and piping temperatures.`);
    }
    if (e.equipment === 'pump') add(['ultrasonic_flow_meter'], `${e.label} on record: flow and pressure give pump efficiency.`);
  }

  // Building age: envelope.
  if (s.yearBuilt !== null && s.yearBuilt < PRE_ENERGY_CODE_YEAR) {
    add(['infrared_camera'], `Built ${s.yearBuilt}, before the first U.S. energy standard for new buildings (1975): look at insulation and air leaks.`);
  }

  const signature: InstrumentSuggestion[] = INSTRUMENT_TYPES.filter((t) => reasons.has(t)).map((t) => ({
    type: t,
    label: INSTRUMENT_LABELS[t],
    reasons: reasons.get(t)!,
    basis: 'signature',
    hazards: hazardsForInstrument(t).map((h) => h.id),
  }));
  const routine: InstrumentSuggestion[] = ROUTINE.filter(([t]) => !reasons.has(t)).map(([t, why]) => ({
    type: t,
    label: INSTRUMENT_LABELS[t],
    reasons: [why],
    basis: 'routine',
    hazards: hazardsForInstrument(t).map((h) => h.id),
  }));
  return { instruments: [...signature, ...routine], notChecked };
}
