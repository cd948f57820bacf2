/**
 * The filled field forms of the demo's completed walkthroughs: what the auditor recorded in each
 * building, section by section (src/lib/field/walkthrough-form.ts). Makes, models and serials of
 * equipment are invented. The lighting, plug-load and water rows are the ones the measures in
 * walkthroughs.ts are computed from, so form and findings tell the same story.
 */
import { walkthroughFormSchema, type WalkthroughForm } from '../../../lib/field/walkthrough-form';

const done = { completed: true };

/** BNP 3102 Corrigan Hall (lodging, 1968): the walkthrough that led to the boiler replacement. */
export function corriganHallForm(occupants: number): WalkthroughForm {
  return walkthroughFormSchema.parse({
    building: { ...done, occupiedHoursPerWeek: 168, typicalOccupants: occupants, operatingSchedule: 'Occupied around the clock; front desk staffed 06:00–22:00', spaceUses: 'Guest rooms on four floors, lobby, laundry, vending alcoves', observedConditions: 'Corridors bright at night with no one about; boiler room hot; several rooms with windows open in January.' },
    envelope: { ...done, items: [
      { id: 'e1', component: 'window', location: 'North wing, rooms 210–230', condition: 'poor', observation: 'Original single-glazed steel sashes; daylight visible at meeting rails.' },
      { id: 'e2', component: 'roof', location: 'Main roof', condition: 'fair', observation: 'Membrane replaced 2009; insulation depth unknown.' },
    ] },
    lighting: { ...done, rows: [
      { id: 'l1', location: 'Corridors, floors 1–4', fixture: '1x4 surface wrap', lampType: 'linear-fluorescent-t8', lampsPerFixture: 2, ballast: 'electronic instant start', fixtureCount: 96, wattsPerFixture: 59, hoursPerYear: 8760, control: 'always-on', measuredLux: 310 },
      { id: 'l2', location: 'Guest rooms', fixture: 'table and floor lamps', lampType: 'compact-fluorescent', lampsPerFixture: 1, ballast: 'integral', fixtureCount: 240, wattsPerFixture: 23, hoursPerYear: 1460, control: 'switch', measuredLux: 180 },
      { id: 'l3', location: 'Stairwells', fixture: 'wall pack', lampType: 'linear-fluorescent-t8', lampsPerFixture: 2, ballast: 'electronic', fixtureCount: 16, wattsPerFixture: 59, hoursPerYear: 8760, control: 'always-on', measuredLux: 140 },
    ] },
    hvac: { ...done, rows: [
      { id: 'h1', equipment: 'boiler', tag: 'B-1', location: 'Basement boiler room', make: 'Brasswick Thermal', model: 'AB-1500', serial: 'BT68-0412', capacity: 1500, capacityUnit: 'kBtu/h input', fuel: 'natural_gas', yearInstalled: 1968, efficiencyNameplate: 'none legible', condition: 'poor', observation: 'Atmospheric, on/off; combustion efficiency 77.8 % measured (O₂ 9.1 %, stack 465 °F); no outdoor reset.' },
      { id: 'h2', equipment: 'boiler', tag: 'B-2', location: 'Basement boiler room', make: 'Brasswick Thermal', model: 'AB-1500', serial: 'BT68-0413', capacity: 1500, capacityUnit: 'kBtu/h input', fuel: 'natural_gas', yearInstalled: 1968, efficiencyNameplate: 'none legible', condition: 'poor', observation: 'Lead/lag by hand; both firing on a 38 °F day.' },
      { id: 'h3', equipment: 'pump', tag: 'P-1', location: 'Basement boiler room', make: 'Oaklin Pump', model: 'OP-7.5', serial: 'OP-22871', capacity: 7.5, capacityUnit: 'hp', fuel: 'electricity', yearInstalled: 1994, efficiencyNameplate: '84 %', condition: 'fair', observation: 'Constant speed; runs all year.' },
      { id: 'h4', equipment: 'water-heater', tag: 'WH-1', location: 'Laundry', make: 'Brasswick Thermal', model: 'SW-199', serial: 'BT05-7781', capacity: 199, capacityUnit: 'kBtu/h input', fuel: 'natural_gas', yearInstalled: 2005, efficiencyNameplate: '80 % thermal', condition: 'fair', observation: 'Set at 140 °F.' },
    ] },
    plugLoads: { ...done, rows: [
      { id: 'p1', item: 'Vending machines', location: 'Alcoves, floors 1–4', count: 4, wattsEach: 410, hoursPerYear: 8760, measured: true, observation: 'Lit around the clock.' },
      { id: 'p2', item: 'Commercial washers and dryers', location: 'Laundry', count: 6, wattsEach: 1800, hoursPerYear: 1500, measured: false, observation: 'Dryers gas-fired; washers electric.' },
    ] },
    water: { ...done, rows: [
      { id: 'w1', fixture: 'showerhead', location: 'Guest rooms (sample of 12)', count: 120, measuredGallons: 1.3, measuredSeconds: 30, ratedGpm: 2.5, ratedGpf: null, leaking: false, observation: 'Bag test 2.6 gpm at the tap pressure.' },
      { id: 'w2', fixture: 'lavatory-faucet', location: 'Guest rooms (sample of 12)', count: 120, measuredGallons: 0.5, measuredSeconds: 15, ratedGpm: 2.2, ratedGpf: null, leaking: false, observation: '' },
      { id: 'w3', fixture: 'toilet', location: 'Guest rooms', count: 120, measuredGallons: null, measuredSeconds: null, ratedGpm: null, ratedGpf: 1.6, leaking: true, observation: 'Three running after flush.' },
    ] },
    controls: { ...done, bas: 'none', occupiedHeatingSetpointF: 74, occupiedCoolingSetpointF: 72, setbackInUse: false, schedulesMatchOccupancy: null, observation: 'Boilers on a manual switch from October to May; room thermostats locked at 74 °F.' },
    notes: { ...done, text: 'Combustion test at the boiler breeching with the analyzer from the heating plant kit; CO below 100 ppm air-free. No adjustments made. Boilers are at the end of their life: recommend replacement before the next heating season if funds allow.' },
  });
}

/** SBP 2301 Bayside Dining Facility (dining, 1978): hot-water leaks in the dish room. */
export function baysideDiningForm(occupants: number): WalkthroughForm {
  return walkthroughFormSchema.parse({
    building: { ...done, occupiedHoursPerWeek: 98, typicalOccupants: occupants, operatingSchedule: 'Three meals a day, 05:00–19:00, seven days', spaceUses: 'Kitchen, dish room, serving line, dining room for 400', observedConditions: 'Standing water and steam in the dish room; floor drains running with warm water during the lull after lunch.' },
    envelope: { ...done, items: [{ id: 'e1', component: 'door', location: 'Loading dock', condition: 'poor', observation: 'Dock door propped open all afternoon.' }] },
    lighting: { ...done, rows: [
      { id: 'l1', location: 'Dining room', fixture: 'recessed downlight', lampType: 'halogen', lampsPerFixture: 1, ballast: 'none', fixtureCount: 64, wattsPerFixture: 75, hoursPerYear: 5110, control: 'switch', measuredLux: 260 },
      { id: 'l2', location: 'Kitchen and dish room', fixture: '2x4 vaportight', lampType: 'linear-fluorescent-t8', lampsPerFixture: 4, ballast: 'electronic', fixtureCount: 30, wattsPerFixture: 112, hoursPerYear: 5110, control: 'switch', measuredLux: 520 },
    ] },
    hvac: { ...done, rows: [
      { id: 'h1', equipment: 'water-heater', tag: 'WH-1', location: 'Mechanical room', make: 'Brasswick Thermal', model: 'SW-400', serial: 'BT96-1180', capacity: 400, capacityUnit: 'kBtu/h input', fuel: 'natural_gas', yearInstalled: 1996, efficiencyNameplate: '80 % thermal', condition: 'fair', observation: 'Booster for the dish machine runs continuously.' },
      { id: 'h2', equipment: 'fan', tag: 'EF-1', location: 'Roof over the cook line', make: 'Oaklin Air', model: 'OA-KH5', serial: 'OA-55120', capacity: 5, capacityUnit: 'hp', fuel: 'electricity', yearInstalled: 2001, efficiencyNameplate: '', condition: 'fair', observation: 'Hood exhaust runs 24 h; make-up air unit with it.' },
      { id: 'h3', equipment: 'rooftop-unit', tag: 'RTU-1', location: 'Roof over dining', make: 'Oaklin Air', model: 'OA-RT20', serial: 'OA-48213', capacity: 20, capacityUnit: 'tons', fuel: 'electricity', yearInstalled: 2008, efficiencyNameplate: 'EER 10.1', condition: 'fair', observation: '' },
    ] },
    plugLoads: { ...done, rows: [
      { id: 'p1', item: 'Steam tables', location: 'Serving line', count: 4, wattsEach: 3000, hoursPerYear: 4400, measured: false, observation: 'Switched on at 05:00 for a 06:30 opening.' },
      { id: 'p2', item: 'Ice machines', location: 'Kitchen', count: 2, wattsEach: 1100, hoursPerYear: 6000, measured: true, observation: 'Water-cooled condenser on one.' },
    ] },
    water: { ...done, rows: [
      { id: 'w1', fixture: 'pre-rinse-spray-valve', location: 'Dish room', count: 3, measuredGallons: 1.1, measuredSeconds: 20, ratedGpm: null, ratedGpf: null, leaking: true, observation: '3.3 gpm measured (federal maximum 1.28 gpm); two valves drip constantly and the hose of one leaks at the coupling.' },
      { id: 'w2', fixture: 'kitchen-faucet', location: 'Prep sinks', count: 6, measuredGallons: 1.0, measuredSeconds: 20, ratedGpm: 2.2, ratedGpf: null, leaking: true, observation: 'Hot side of two faucets will not shut off fully.' },
      { id: 'w3', fixture: 'lavatory-faucet', location: 'Restrooms', count: 8, measuredGallons: 0.5, measuredSeconds: 15, ratedGpm: 2.2, ratedGpf: null, leaking: false, observation: '' },
      { id: 'w4', fixture: 'other', location: 'Dish room, under the machine', count: 1, measuredGallons: null, measuredSeconds: null, ratedGpm: null, ratedGpf: null, leaking: true, observation: 'Hot-water supply line weeping at a corroded union; trap primer valve stuck open.' },
    ] },
    controls: { ...done, bas: 'none', occupiedHeatingSetpointF: 70, occupiedCoolingSetpointF: 72, setbackInUse: false, schedulesMatchOccupancy: false, observation: 'Hood exhaust and make-up air on a wall switch, never turned off.' },
    notes: { ...done, text: 'Flow tests with the bags from the water kit. The water bills run at about three times the peers; the dish-room leaks and the open pre-rinse valves explain most of it, and the booster heats all of it.' },
  });
}

/** BNP 3204 Brennock Operations Center (office, 1986): everything on around the clock. */
export function operationsCenterForm(occupants: number): WalkthroughForm {
  return walkthroughFormSchema.parse({
    building: { ...done, occupiedHoursPerWeek: 55, typicalOccupants: occupants, operatingSchedule: 'Mon–Fri 07:00–18:00; a duty desk of two at night', spaceUses: 'Open offices, conference rooms, a server room, break rooms', observedConditions: 'At 21:00 every floor was lit and most screens were on.' },
    envelope: { ...done, items: [{ id: 'e1', component: 'air-sealing', location: 'Main entrance', condition: 'fair', observation: 'Vestibule doors both open on a hold-open.' }] },
    lighting: { ...done, rows: [
      { id: 'l1', location: 'Open offices, floors 1–3', fixture: '2x4 troffer', lampType: 'linear-fluorescent-t8', lampsPerFixture: 3, ballast: 'electronic', fixtureCount: 310, wattsPerFixture: 86, hoursPerYear: 8760, control: 'bas', measuredLux: 450 },
      { id: 'l2', location: 'Conference rooms', fixture: '2x2 troffer', lampType: 'linear-fluorescent-t8', lampsPerFixture: 2, ballast: 'electronic', fixtureCount: 48, wattsPerFixture: 59, hoursPerYear: 3000, control: 'switch', measuredLux: 380 },
    ] },
    hvac: { ...done, rows: [
      { id: 'h1', equipment: 'air-handler', tag: 'AHU-1', location: 'Penthouse', make: 'Oaklin Air', model: 'OA-AH30', serial: 'OA-19077', capacity: 30, capacityUnit: 'hp supply fan', fuel: 'electricity', yearInstalled: 1986, efficiencyNameplate: '', condition: 'fair', observation: 'Runs 24/7 on the building automation schedule "always occupied".' },
      { id: 'h2', equipment: 'split-system', tag: 'SR-1', location: 'Server room', make: 'Oaklin Air', model: 'OA-MS2', serial: 'OA-77310', capacity: 2, capacityUnit: 'tons', fuel: 'electricity', yearInstalled: 2012, efficiencyNameplate: 'SEER 13', condition: 'fair', observation: 'Room at 64 °F.' },
      { id: 'h3', equipment: 'boiler', tag: 'B-1', location: 'Basement', make: 'Brasswick Thermal', model: 'CB-900', serial: 'BT86-2211', capacity: 900, capacityUnit: 'kBtu/h input', fuel: 'natural_gas', yearInstalled: 1986, efficiencyNameplate: '80 % thermal', condition: 'fair', observation: '' },
    ] },
    plugLoads: { ...done, rows: [
      { id: 'p1', item: 'Desktop computers', location: 'Open offices', count: 180, wattsEach: 65, hoursPerYear: 8760, measured: true, observation: 'Plug-in meter on six: 58–71 W idle; sleep disabled by policy.' },
      { id: 'p2', item: 'Monitors', location: 'Open offices', count: 200, wattsEach: 25, hoursPerYear: 8760, measured: true, observation: 'Screens never blank.' },
      { id: 'p3', item: 'Printers and copiers', location: 'Print rooms', count: 12, wattsEach: 120, hoursPerYear: 8760, measured: true, observation: '' },
      { id: 'p4', item: 'Server rack', location: 'Server room', count: 1, wattsEach: 4500, hoursPerYear: 8760, measured: true, observation: 'Clamp ammeter on the rack feed: 19.6 A at 230 V.' },
    ] },
    water: { ...done, rows: [{ id: 'w1', fixture: 'lavatory-faucet', location: 'Restrooms', count: 14, measuredGallons: 0.5, measuredSeconds: 14, ratedGpm: 2.2, ratedGpf: null, leaking: false, observation: '' }] },
    controls: { ...done, bas: 'partial', occupiedHeatingSetpointF: 72, occupiedCoolingSetpointF: 72, setbackInUse: false, schedulesMatchOccupancy: false, observation: 'Lighting and air handler on the "always occupied" schedule since a night event years ago.' },
    notes: { ...done, text: 'Live readings at the server rack feed taken by the facility electrician; the auditor read the clamp meter only.' },
  });
}
