/**
 * Instrument suggestions from a building's signature. The pairings checked are the ones the
 * walkthrough brief names (high base load → plug-in meter and clamp ammeter; steep heating slope →
 * infrared camera and combustion analyzer; high water intensity → flow-test bags; long lighting
 * hours → light and occupancy loggers); the signatures are constructed. Thresholds are the module's
 * documented screening values (common practice), tested at their edges.
 */
import { describe, expect, it } from 'vitest';
import { hazardsForInstrument } from '../../../src/lib/field/safety';
import {
  EQUIPMENT_AGE_OLD_YEARS,
  LIGHTING_HOURS_HIGH,
  MIN_PEERS,
  PEER_RATIO_HIGH,
  suggestInstruments,
  type BuildingSignature,
  type InstrumentSuggestion,
} from '../../../src/lib/field/suggest-instruments';

const quiet: BuildingSignature = {
  peerNoun: 'peer offices',
  yearBuilt: 1998,
  asOfYear: 2026,
  commodities: ['electricity', 'natural_gas', 'water'],
  electricBaseLoad: { value: 10, peerMedian: 10, peers: 8 },
  baseLoadShare: 0.5,
  heatingSlope: { value: 1.0, peerMedian: 1.0, peers: 8 },
  heatingFuelIntensity: { value: 20, peerMedian: 20, peers: 8 },
  heatingBalanceF: 58,
  coolingSlope: { value: 0.5, peerMedian: 0.5, peers: 8 },
  coolingBalanceF: 66,
  heatingAndCoolingModel: false,
  waterIntensity: { value: 10, peerMedian: 10, peers: 8 },
  lightingHoursPerYear: 2800,
  occupiedHoursPerYear: 2600,
  equipment: [],
};

const types = (xs: InstrumentSuggestion[], basis?: 'signature' | 'routine') => xs.filter((x) => !basis || x.basis === basis).map((x) => x.type);
const get = (xs: InstrumentSuggestion[], t: string) => xs.find((x) => x.type === t);

describe('instrument suggestions', () => {
  it('a building like its peers gets the routine kit only', () => {
    const r = suggestInstruments(quiet);
    expect(types(r.instruments, 'signature')).toEqual([]);
    expect(types(r.instruments, 'routine').sort()).toEqual(['camera', 'flashlight', 'light_meter', 'tape_measure']);
  });

  it('high base load → plug-in power meter and clamp ammeter, with the figure and the peers in words', () => {
    const r = suggestInstruments({ ...quiet, electricBaseLoad: { value: 25, peerMedian: 10, peers: 8 } });
    expect(types(r.instruments, 'signature')).toEqual(expect.arrayContaining(['plug_in_power_meter', 'clamp_ammeter']));
    expect(get(r.instruments, 'plug_in_power_meter')!.reasons[0]).toMatch(/Electric base load 25\.0 kBtu\/ft²·yr is 2\.5× the median of 8 peer offices \(10\.0\)/);
  });

  it(`the peer threshold sits at ${PEER_RATIO_HIGH}× the median and needs ${MIN_PEERS} peers`, () => {
    const at = suggestInstruments({ ...quiet, electricBaseLoad: { value: 15, peerMedian: 10, peers: MIN_PEERS } });
    const below = suggestInstruments({ ...quiet, electricBaseLoad: { value: 14.9, peerMedian: 10, peers: 8 } });
    const fewPeers = suggestInstruments({ ...quiet, electricBaseLoad: { value: 40, peerMedian: 10, peers: MIN_PEERS - 1 }, baseLoadShare: 0.5 });
    expect(types(at.instruments)).toContain('plug_in_power_meter');
    expect(types(below.instruments)).not.toContain('plug_in_power_meter');
    expect(types(fewPeers.instruments)).not.toContain('plug_in_power_meter');
    expect(fewPeers.notChecked.join(' ')).toMatch(/fewer than 3 peer offices/);
  });

  it('steep heating slope → infrared camera and, with a fuel, combustion analyzer', () => {
    const steep = { ...quiet, heatingSlope: { value: 3, peerMedian: 1, peers: 8 } };
    const gas = suggestInstruments(steep);
    expect(types(gas.instruments, 'signature')).toEqual(expect.arrayContaining(['infrared_camera', 'combustion_analyzer']));
    // The heating fuel used at normal weather (slope and balance point together) triggers the same.
    const costly = suggestInstruments({ ...quiet, heatingFuelIntensity: { value: 60, peerMedian: 20, peers: 8 } });
    expect(costly.instruments.find((i) => i.type === 'combustion_analyzer')!.reasons[0]).toMatch(/^Heating fuel at normal weather 60\.0 kBtu\/ft²·yr is 3\.0× the median/);
    const electric = suggestInstruments({ ...steep, commodities: ['electricity'] });
    expect(types(electric.instruments)).toContain('infrared_camera');
    expect(types(electric.instruments)).not.toContain('combustion_analyzer');
  });

  it('high water intensity → flow-test bags', () => {
    const r = suggestInstruments({ ...quiet, waterIntensity: { value: 32, peerMedian: 10, peers: 5 } });
    expect(get(r.instruments, 'flow_test_bags')!.reasons[0]).toMatch(/Water use 32\.0 gal\/ft²·yr is 3\.2× the median of 5 peer offices/);
  });

  it('long lighting hours → light and occupancy loggers', () => {
    const r = suggestInstruments({ ...quiet, lightingHoursPerYear: LIGHTING_HOURS_HIGH });
    expect(types(r.instruments, 'signature')).toContain('light_occupancy_logger');
    const overOccupancy = suggestInstruments({ ...quiet, lightingHoursPerYear: 3200, occupiedHoursPerYear: 2600 });
    expect(types(overOccupancy.instruments, 'signature')).toContain('light_occupancy_logger');
    const unknown = suggestInstruments({ ...quiet, lightingHoursPerYear: null });
    expect(unknown.notChecked.join(' ')).toMatch(/Lighting hours unknown/);
  });

  it('a narrow dead band between heating and cooling suggests loggers for simultaneous heating and cooling', () => {
    const r = suggestInstruments({ ...quiet, heatingAndCoolingModel: true, heatingBalanceF: 62, coolingBalanceF: 63 });
    expect(get(r.instruments, 'temperature_humidity_logger')!.reasons.join(' ')).toMatch(/dead band of 1 °F/);
  });

  it(`equipment ${EQUIPMENT_AGE_OLD_YEARS} years old: combustion analyzer for a fuel-fired boiler, stroboscope for a pump`, () => {
    const r = suggestInstruments({
      ...quiet,
      equipment: [
        { equipment: 'boiler', label: 'Boiler B-1', yearInstalled: 2006, fuel: 'natural_gas' },
        { equipment: 'pump', label: 'Pump P-2', yearInstalled: 1990, fuel: 'electricity' },
        { equipment: 'rooftop-unit', label: 'RTU-1', yearInstalled: 2020, fuel: 'electricity' },
      ],
    });
    expect(get(r.instruments, 'combustion_analyzer')!.reasons[0]).toMatch(/Boiler B-1 installed 2006 \(20 years/);
    expect(get(r.instruments, 'stroboscope')!.reasons[0]).toMatch(/Pump P-2/);
    expect(r.instruments.flatMap((i) => i.reasons).join(' ')).not.toMatch(/RTU-1/);
  });

  it('every suggestion names the hazards safety.ts gives its instrument (combustion analyzer → combustion testing)', () => {
    const r = suggestInstruments({ ...quiet, heatingSlope: { value: 3, peerMedian: 1, peers: 8 }, electricBaseLoad: { value: 30, peerMedian: 10, peers: 8 } });
    for (const s of r.instruments) expect(s.hazards).toEqual(hazardsForInstrument(s.type).map((h) => h.id));
    expect(get(r.instruments, 'combustion_analyzer')!.hazards).toContain('combustion-testing');
    expect(get(r.instruments, 'clamp_ammeter')!.hazards).toContain('energized-electrical');
  });
});
