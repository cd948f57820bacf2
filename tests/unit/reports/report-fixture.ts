/**
 * Constructed walkthrough reports for the report tests (invented building, people and figures;
 * not demo data and not a reference): a full one with every section, photos and measures on
 * several commodities, and a minimal one with no findings and an empty form.
 */
import { emptyWalkthroughForm } from '../../../src/lib/field/walkthrough-form';
import { computeReportEconomics, type ReportEconomics, type WalkthroughReportInput } from '../../../src/lib/reports';

/** Economics of a measure at a 3 % real rate, as the app stores them with the rate's date and source. */
export function economicsAt3(installedCostUsd: number, incentivesUsd: number, energyUsd: number, waterUsd: number, omUsd: number, lifeYears: number): ReportEconomics {
  const figures = { id: '', title: '', status: 'proposed' as const, savings: [], implementedOn: null, installedCostUsd, incentivesUsd, annualEnergyCostSavingsUsd: energyUsd, annualWaterCostSavingsUsd: waterUsd, annualOmCostSavingsUsd: omUsd, lifeYears };
  const e = computeReportEconomics(figures, { realDiscountRatePercent: 3, effectiveFrom: '2010-04-01', source: 'constructed test rate' });
  if (!e) throw new Error('invalid constructed measure');
  return e;
}

export function fullReport(): WalkthroughReportInput {
  const form = emptyWalkthroughForm();
  form.building = { completed: true, occupiedHoursPerWeek: 60, typicalOccupants: 140, operatingSchedule: 'Mon–Fri 06:00–18:00', spaceUses: 'Offices, server room, break rooms', observedConditions: 'Lights on in empty wings <after hours> & "weekends"' };
  form.lighting = {
    completed: true,
    rows: [
      { id: 'l1', location: 'Open office, 2nd floor', fixture: '2x4 troffer', lampType: 'linear-fluorescent-t8', lampsPerFixture: 3, ballast: 'electronic', fixtureCount: 120, wattsPerFixture: 86, hoursPerYear: 4200, control: 'switch', measuredLux: 420 },
      { id: 'l2', location: 'Corridors', fixture: 'wrap', lampType: 'linear-fluorescent-t12', lampsPerFixture: 2, ballast: 'magnetic', fixtureCount: 40, wattsPerFixture: 94, hoursPerYear: 8760, control: 'always-on', measuredLux: 160 },
    ],
  };
  form.hvac = { completed: true, rows: [{ id: 'h1', equipment: 'boiler', tag: 'B-1', location: 'Mechanical room', make: 'Invented Works', model: 'HB-400', serial: 'SN-0001', capacity: 1200, capacityUnit: 'kBtu/h', fuel: 'natural_gas', yearInstalled: 1986, efficiencyNameplate: '80 % thermal', condition: 'poor', observation: 'Short cycling' }] };
  form.plugLoads = { completed: true, rows: [{ id: 'p1', item: 'Desktop computers', location: 'Offices', count: 90, wattsEach: 65, hoursPerYear: 8760, measured: true, observation: 'No sleep settings' }] };
  form.water = { completed: true, rows: [{ id: 'w1', fixture: 'lavatory-faucet', location: 'Restrooms', count: 12, measuredGallons: 0.5, measuredSeconds: 12, ratedGpm: null, ratedGpf: null, leaking: true, observation: 'Two dripping' }] };
  form.controls = { completed: true, bas: 'partial', occupiedHeatingSetpointF: 72, occupiedCoolingSetpointF: 72, setbackInUse: false, schedulesMatchOccupancy: false, observation: 'No night setback' };
  form.notes = { completed: true, text: 'Server room door propped open.' };
  return {
    generatedAt: '2026-11-30T12:00:00.000Z',
    building: { id: 'b-1', number: '4711', name: 'Test Operations Center', installationCode: 'TST', installationName: 'Test Installation', useType: 'office', grossAreaFt2: 52000, yearBuilt: 1986, occupants: 180, address: '1 Example Road, Testville', climate: '4A' },
    walkthrough: { id: 'w-1', title: 'Base-load walkthrough', plannedOn: '2026-10-05', completedOn: '2026-10-06', status: 'completed', auditor: { name: 'Ada Example', email: 'ada@example.test' }, form },
    photos: [
      { id: 'ph1', tag: 'lighting', caption: 'T12 wraps in corridor', mime: 'image/png', findingTitle: 'Corridor lighting on 24/7' },
      { id: 'ph2', tag: 'nameplate', caption: 'Boiler B-1 nameplate', mime: 'image/heic' },
    ],
    findings: [
      {
        id: 'f1', title: 'Corridor lighting on 24/7', category: 'lighting', location: 'Corridors', description: 'T12 lamps & magnetic ballasts <always on>', status: 'open',
        measure: { id: 'm1', title: 'LED retrofit with occupancy sensors', status: 'approved', savings: [{ commodity: 'electricity', quantity: 21500, unit: 'kWh' }], annualEnergyCostSavingsUsd: 2236, annualWaterCostSavingsUsd: 0, annualOmCostSavingsUsd: 150, installedCostUsd: 14000, incentivesUsd: 2000, lifeYears: 15, implementedOn: null, economics: economicsAt3(14000, 2000, 2236, 0, 150, 15) },
      },
      {
        id: 'f2', title: 'Boiler short cycling', category: 'hvac', location: 'Mechanical room', description: '1986 atmospheric boiler, 80 % nameplate', status: 'open',
        measure: { id: 'm2', title: 'Replace boiler with condensing boiler', status: 'implemented', savings: [{ commodity: 'natural_gas', quantity: 5200, unit: 'ccf', kbtuPerUnit: 104.2 }], annualEnergyCostSavingsUsd: 6070, annualWaterCostSavingsUsd: 0, annualOmCostSavingsUsd: 0, installedCostUsd: 95000, incentivesUsd: 0, lifeYears: 25, implementedOn: '2025-05-01', economics: economicsAt3(95000, 0, 6070, 0, 0, 25) },
      },
      {
        id: 'f3', title: 'Dripping faucets', category: 'water', location: 'Restrooms', description: 'Flow test 2.5 gpm', status: 'open',
        measure: { id: 'm3', title: 'Repair leaks and fit 0.5 gpm aerators', status: 'proposed', savings: [{ commodity: 'water', quantity: 38.5, unit: 'kgal' }, { commodity: 'natural_gas', quantity: 60, unit: 'therm' }], annualEnergyCostSavingsUsd: 67, annualWaterCostSavingsUsd: 400, annualOmCostSavingsUsd: 0, installedCostUsd: 600, incentivesUsd: 0, lifeYears: 10, implementedOn: null, economics: economicsAt3(600, 0, 67, 400, 0, 10) },
      },
      {
        id: 'f4', title: 'Computers never sleep', category: 'plug-loads', location: 'Offices', description: '', status: 'open',
        measure: { id: 'm4', title: 'Computer power management', status: 'rejected', savings: [{ commodity: 'electricity', quantity: 30000, unit: 'kWh' }], annualEnergyCostSavingsUsd: 3120, annualWaterCostSavingsUsd: 0, annualOmCostSavingsUsd: 0, installedCostUsd: 0, incentivesUsd: 0, lifeYears: 4, implementedOn: null, economics: null },
      },
      { id: 'f5', title: 'Fuel oil tank', category: 'other', location: 'Yard', description: 'Kept for reference', status: 'dismissed', measure: null },
      {
        id: 'f6', title: 'Oil burner tune-up', category: 'hvac', location: 'Annex', description: '', status: 'open',
        measure: { id: 'm6', title: 'Tune oil burner', status: 'proposed', savings: [{ commodity: 'fuel_oil_2', quantity: 300, unit: 'gal' }], annualEnergyCostSavingsUsd: 1095, annualWaterCostSavingsUsd: 0, annualOmCostSavingsUsd: -50, installedCostUsd: 800, incentivesUsd: 0, lifeYears: 3, implementedOn: null, economics: economicsAt3(800, 0, 1095, 0, -50, 3) },
      },
    ],
    benchmark: { windowStart: '2025-11-01', windowEnd: '2026-10-31', siteEui: 117.7, euiNormalized: 115.2, peerMedianEui: 53.5, peerGroup: 'Office', peerSource: 'U.S. EIA, 2018 CBECS, Table C12' },
    baselines: [
      { commodity: 'electricity', unit: 'kWh', shape: 'cooling', parameters: 3, r2: 0.91, cvrmse: 0.045, status: 'accepted', periodStart: '2024-11-01', periodEnd: '2025-10-31' },
      { commodity: 'natural_gas', unit: 'therm', shape: 'heating-cooling', parameters: 4, r2: 0.97, cvrmse: 0.08, status: 'accepted', periodStart: '2024-11-01', periodEnd: '2025-10-31' },
      { commodity: 'natural_gas', unit: 'ccf', shape: 'heating', parameters: 3, r2: 0.95, cvrmse: 0.1, status: 'accepted', periodStart: '2024-11-01', periodEnd: '2025-10-31' },
      { commodity: 'water', unit: 'kgal', shape: 'mean', parameters: 1, r2: 0, cvrmse: 0.12, status: 'needs-review', periodStart: '2024-11-01', periodEnd: '2025-10-31' },
    ],
  };
}

export function minimalReport(): WalkthroughReportInput {
  return {
    generatedAt: '2026-11-30T12:00:00.000Z',
    building: { id: 'b-2', number: '12', name: 'Small Store', installationCode: 'TST', installationName: 'Test Installation', useType: 'warehouse', grossAreaFt2: 8000, yearBuilt: null, occupants: null, address: null, climate: null },
    walkthrough: { id: 'w-2', title: '', plannedOn: '2026-12-10', completedOn: null, status: 'planned', auditor: null, form: emptyWalkthroughForm() },
    photos: [],
    findings: [],
    benchmark: null,
    baselines: [],
  };
}
