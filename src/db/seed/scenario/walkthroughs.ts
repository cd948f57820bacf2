/**
 * The demo's walkthroughs: three completed ones, each on the day the building was last evaluated
 * (so the inventory and the walkthrough history agree), and one planned. Savings are worked out
 * the way an auditor would, with the project's own calculators (lighting retrofit, fixture water
 * use) or from the parameters the bills were generated with, and priced at the installation's
 * blended demo prices; economics come from `measureEconomics` at the default discount rate.
 *
 * - BNP 3102 Corrigan Hall: the boiler replacement, implemented on the retrofit date, so the
 *   verified savings have a long reporting period; an approved lighting measure; showerheads.
 * - SBP 2301 Bayside Dining Facility: the hot-water leaks (never fixed, as the bills show).
 * - BNP 3204 Brennock Operations Center: plug loads and lighting on around the clock.
 * - KSL 415 Harwood Hall: planned, with a kit requested (loans.ts).
 */
import type { Commodity } from '../../../lib/domain';
import { DEFAULT_DISCOUNT_RATE_SETTING, measureEconomics } from '../../../lib/economics';
import { fixtureWaterUse } from '../../../lib/field/fixture-water-use';
import { lightingRetrofit } from '../../../lib/field/lighting-retrofit';
import { emptyWalkthroughForm, type FindingCategory, type WalkthroughForm } from '../../../lib/field/walkthrough-form';
import { INSTALLATIONS } from './climates';
import { dayToIso, isoToDay } from './dates';
import { demoUuid } from './field-ids';
import type { DemoFinding, DemoMeasure, DemoWalkthrough } from './field-types';
import { fuelKbtuPerUnit, unitPrice, waterGalPerUnit } from './meters';
import type { Rng } from './prng';
import { POOR_PERFORMERS } from './specials';
import type { DemoBuilding, DemoMeter, DemoScenario } from './types';
import { useTypeProfile } from './use-types';
import { baysideDiningForm, corriganHallForm, operationsCenterForm } from './walkthrough-forms';

export interface FieldContext {
  today: number;
  buildings: readonly DemoBuilding[];
  meters: readonly DemoMeter[];
  truth: DemoScenario['truth'];
  /** Normal-year HDD at a base (°F) at an installation's station. */
  hddNormal: (installationCode: string, baseF: number) => number;
}

export const AUDITOR = 'auditor@demo.plumbline.test';
export const MANAGER = 'manager@demo.plumbline.test';
export const STAFF_BNP = 'staff@demo.plumbline.test';
export const STAFF_SBP = 'tobias.renner@demo.plumbline.test';
export const STAFF_KSL = 'ines.varga@demo.plumbline.test';

/** `YYYY-MM-DDThh:mm:00Z` on a day number. */
export const at = (day: number, hhmm: string): string => `${dayToIso(day)}T${hhmm}:00Z`;
const round = (v: number, step: number) => Math.round(v / step) * step;

type Saving = { meter: DemoMeter; quantity: number };
interface MeasurePlan {
  title: string;
  status: DemoMeasure['status'];
  savings: Saving[];
  installedCost: number;
  incentives?: number;
  omSavings?: number;
  lifeYears: number;
  approvedOn?: number;
  implementedOn?: string;
}
interface FindingPlan {
  title: string;
  category: FindingCategory;
  location: string;
  description: string;
  status?: 'open' | 'dismissed';
  measure?: MeasurePlan;
}

function site(code: string) {
  const s = INSTALLATIONS.find((x) => x.code === code);
  if (!s) throw new Error(`no installation ${code}`);
  return s;
}

function measureOf(rng: Rng, installationCode: string, p: MeasurePlan): DemoMeasure {
  const cost = (water: boolean) => p.savings.filter((s) => (s.meter.commodity === 'water') === water).reduce((t, s) => t + s.quantity * unitPrice(site(installationCode), s.meter), 0);
  const energyUsd = Math.round(cost(false));
  const waterUsd = Math.round(cost(true));
  const rate = DEFAULT_DISCOUNT_RATE_SETTING;
  const outcome = measureEconomics.run({
    installedCostUsd: p.installedCost,
    incentivesUsd: p.incentives ?? 0,
    annualEnergySavingsUsd: energyUsd,
    annualWaterSavingsUsd: waterUsd,
    annualOmSavingsUsd: p.omSavings ?? 0,
    lifeYears: p.lifeYears,
    discountRatePercent: rate.realDiscountRatePercent,
  });
  if (!outcome.ok) throw new Error(`demo measure "${p.title}": ${outcome.message}`);
  return {
    id: demoUuid(rng),
    title: p.title,
    status: p.status,
    savings: p.savings.map((s) => ({ commodity: s.meter.commodity, quantity: s.quantity, unit: s.meter.unit })),
    annualEnergyCostSavings: energyUsd,
    annualWaterCostSavings: waterUsd,
    annualOmCostSavings: p.omSavings ?? 0,
    installedCost: p.installedCost,
    incentives: p.incentives ?? 0,
    lifeYears: p.lifeYears,
    economics: { ...outcome.value, discountRatePercent: rate.realDiscountRatePercent, effectiveFrom: rate.effectiveFrom, source: rate.source },
    approvedBy: p.approvedOn !== undefined ? MANAGER : null,
    approvedAt: p.approvedOn !== undefined ? at(p.approvedOn, '14:00') : null,
    implementedOn: p.implementedOn ?? null,
  };
}

function walkthroughOf(rng: Rng, b: DemoBuilding, w: { title: string; day: number; auditor: string; createdBy: string; flagId: string | null; form: WalkthroughForm; findings: FindingPlan[] }): DemoWalkthrough {
  const id = demoUuid(rng);
  const findings: DemoFinding[] = w.findings.map((f, i) => ({
    id: demoUuid(rng),
    title: f.title,
    category: f.category,
    location: f.location,
    description: f.description,
    status: f.status ?? 'open',
    createdAt: at(w.day, `1${i}:30`),
    measure: f.measure ? measureOf(rng, b.installationCode, f.measure) : null,
  }));
  return {
    id, installationCode: b.installationCode, buildingNumber: b.number, flagId: w.flagId, title: w.title, plannedOn: dayToIso(w.day),
    auditor: w.auditor, createdBy: w.createdBy, createdAt: at(w.day - 21, '09:00'), status: 'completed', form: w.form, completedAt: at(w.day, '16:45'), findings,
  };
}

/** kWh saved per year by a lighting change, with the lighting retrofit calculator. */
function lightingKwh(input: Parameters<typeof lightingRetrofit.run>[0]): number {
  const r = lightingRetrofit.run(input);
  if (!r.ok) throw new Error(r.message);
  return round(r.value.kwhSavedPerYear, 10);
}

export class FieldBuildings {
  constructor(private readonly ctx: FieldContext) {}
  building(code: string, number: string): DemoBuilding {
    const b = this.ctx.buildings.find((x) => x.installationCode === code && x.number === number);
    if (!b) throw new Error(`demo building ${code} ${number} not found`);
    return b;
  }
  meter(b: DemoBuilding, commodity: Commodity | 'fuel'): DemoMeter {
    const m = this.ctx.meters.find((x) => x.installationCode === b.installationCode && x.buildingNumber === b.number && (commodity === 'fuel' ? x.commodity !== 'electricity' && x.commodity !== 'water' : x.commodity === commodity));
    if (!m) throw new Error(`demo building ${b.installationCode} ${b.number} has no ${commodity} meter`);
    return m;
  }
  evaluatedDay(b: DemoBuilding): number {
    if (!b.lastEvaluatedOn) throw new Error(`demo building ${b.number} was never evaluated`);
    return isoToDay(b.lastEvaluatedOn);
  }
}

export function corriganHall(rng: Rng, ctx: FieldContext): DemoWalkthrough {
  const f = new FieldBuildings(ctx);
  const r = ctx.truth.retrofit;
  const b = f.building(r.installationCode, r.buildingNumber);
  const day = f.evaluatedDay(b);
  const gas = f.meter(b, 'natural_gas');
  const water = f.meter(b, 'water');
  // The boiler's savings as the auditor estimated them, and as the bills were made: the drop of the
  // heating slope times the normal-year HDD at the balance point.
  const boilerCcf = round((r.before.heatingSlope - r.after.heatingSlope) * ctx.hddNormal(b.installationCode, r.before.heatingBalanceF ?? 65), 10);
  const showers = fixtureWaterUse.run({ useType: 'showerhead', existingFlowGpm: 2.6, proposedFlowGpm: 1.5, people: b.occupants, daysPerYear: 365, hotWaterPercent: 70, temperatureRiseF: 65, waterHeaterEfficiencyPercent: 80 });
  if (!showers.ok) throw new Error(showers.message);
  return walkthroughOf(rng, b, {
    title: 'Corrigan Hall: heating plant, corridors and guest-room water',
    day, auditor: AUDITOR, createdBy: STAFF_BNP, flagId: null, form: corriganHallForm(b.occupants),
    findings: [
      { title: 'Atmospheric boilers from 1968 at 78 % combustion efficiency', category: 'hvac', location: 'Basement boiler room', description: 'Two 1,500 kBtu/h atmospheric boilers, on/off, no outdoor reset; both firing on a mild day. Measured combustion efficiency 77.8 %.',
        measure: { title: 'Replace the boilers with condensing boilers and outdoor reset', status: 'implemented', savings: [{ meter: gas, quantity: boilerCcf }], installedCost: 185000, incentives: 20000, omSavings: 1800, lifeYears: 25, approvedOn: day + 75, implementedOn: r.date } },
      { title: 'Corridor and stair lighting on around the clock', category: 'lighting', location: 'Corridors and stairwells, floors 1–4', description: '112 two-lamp T8 wraps at 59 W lit 8,760 h a year; corridors empty most of the night.',
        measure: { title: 'LED wraps with occupancy sensors in corridors and stairs', status: 'approved', savings: [{ meter: f.meter(b, 'electricity'), quantity: lightingKwh({ existingFixtureCount: 112, existingWattsPerFixture: 59, proposedWattsPerFixture: 28, hoursPerDay: 24, daysPerYear: 365, controlsReductionPercent: 30 }) }], installedCost: 18480, incentives: 2240, lifeYears: 15, approvedOn: day + 75 } },
      { title: 'Showerheads at 2.6 gpm', category: 'water', location: 'Guest rooms', description: 'Bag tests in 12 rooms: 1.3 gal in 30 s. The federal maximum is 2.5 gpm; WaterSense showerheads use 2.0 gpm or less.',
        measure: { title: 'Fit 1.5 gpm showerheads in the guest rooms', status: 'proposed', savings: [{ meter: water, quantity: round(showers.value.galSavedPerYear / waterGalPerUnit(water.unit), 0.1) }, { meter: gas, quantity: round(showers.value.heaterInputBtuSavedPerYear / 1000 / fuelKbtuPerUnit(gas), 10) }], installedCost: 3840, lifeYears: 10 } },
      { title: 'Single-glazed windows in the north wing', category: 'envelope', location: 'North wing, rooms 210–230', description: 'Original steel sashes; daylight visible at the meeting rails. A capital project for the installation plan, not priced on a walkthrough.' },
    ],
  });
}

export function baysideDining(rng: Rng, ctx: FieldContext, flagId: string): DemoWalkthrough {
  const f = new FieldBuildings(ctx);
  const spec = POOR_PERFORMERS.find((p) => p.kind === 'water-leak')!;
  const b = f.building(spec.installationCode, spec.number);
  const day = f.evaluatedDay(b);
  const water = f.meter(b, 'water');
  const gas = f.meter(b, 'natural_gas');
  const extras = spec.extras(b.grossAreaFt2 * useTypeProfile(b.useType).medianEui);
  const multiple = extras.waterMultiple ?? 1;
  // Repairs stop about 80 % of the excess: the water beyond the peers' and the gas that heats it.
  const leakWater = ctx.truth.meters[water.code]!.basePerDay * 365 * ((multiple - 1) / multiple) * 0.8;
  const leakGas = ((extras.fuelBaseKbtu ?? 0) * 0.8) / fuelKbtuPerUnit(gas);
  return walkthroughOf(rng, b, {
    title: 'Bayside Dining Facility: water and kitchen',
    day, auditor: STAFF_SBP, createdBy: STAFF_SBP, flagId, form: baysideDiningForm(b.occupants),
    findings: [
      { title: 'Hot-water leaks in the dish room', category: 'water', location: 'Dish room and prep sinks', description: 'Pre-rinse valves at 3.3 gpm and dripping, a weeping union under the dish machine, a stuck trap primer and two hot taps that do not close. Water bills about three times the peers.',
        measure: { title: 'Repair the dish-room leaks and fit low-flow pre-rinse spray valves', status: 'proposed', savings: [{ meter: water, quantity: round(leakWater, 0.1) }, { meter: gas, quantity: round(leakGas, 10) }], installedCost: 14500, lifeYears: 10 } },
      { title: 'Halogen downlights in the dining room', category: 'lighting', location: 'Dining room', description: '64 recessed 75 W halogen lamps, 14 hours a day.',
        measure: { title: 'LED downlights in the dining room', status: 'approved', savings: [{ meter: f.meter(b, 'electricity'), quantity: lightingKwh({ existingFixtureCount: 64, existingWattsPerFixture: 75, proposedWattsPerFixture: 12, hoursPerDay: 14, daysPerYear: 365 }) }], installedCost: 5440, lifeYears: 15, approvedOn: day + 40 } },
      { title: 'Kitchen hood exhaust runs all day and night', category: 'controls', location: 'Cook line', description: 'Hood exhaust and make-up air on a wall switch that is never turned off.',
        measure: { title: 'Demand-controlled kitchen ventilation', status: 'rejected', savings: [{ meter: f.meter(b, 'electricity'), quantity: 21000 }, { meter: gas, quantity: 1400 }], installedCost: 46000, lifeYears: 15 } },
      { title: 'Ice machine with a water-cooled condenser', category: 'water', location: 'Kitchen', description: 'Single-pass cooling water. The food-service contractor replaces the machine next year.', status: 'dismissed' },
    ],
  });
}

export function operationsCenter(rng: Rng, ctx: FieldContext, flagId: string): DemoWalkthrough {
  const f = new FieldBuildings(ctx);
  const spec = POOR_PERFORMERS.find((p) => p.kind === 'base-load')!;
  const b = f.building(spec.installationCode, spec.number);
  const day = f.evaluatedDay(b);
  const elec = f.meter(b, 'electricity');
  // Computers and monitors from 8,760 to 3,000 hours a year (office hours plus updates), from the plug-load rows.
  const plugKwh = round(((180 * 65 + 200 * 25) * (8760 - 3000)) / 1000, 10);
  return walkthroughOf(rng, b, {
    title: 'Brennock Operations Center: base load at night',
    day, auditor: AUDITOR, createdBy: STAFF_BNP, flagId, form: operationsCenterForm(b.occupants),
    findings: [
      { title: 'Computers and monitors never sleep', category: 'plug-loads', location: 'Open offices, floors 1–3', description: '180 desktops at 58–71 W idle and 200 monitors on all night; sleep disabled by policy.',
        measure: { title: 'Computer power management and plug-load timers', status: 'proposed', savings: [{ meter: elec, quantity: plugKwh }], installedCost: 9500, lifeYears: 5 } },
      { title: 'Open-office lighting on around the clock', category: 'lighting', location: 'Open offices, floors 1–3', description: '310 three-lamp troffers on the "always occupied" schedule.',
        measure: { title: 'Occupancy sensors and an evening sweep for open-office lighting', status: 'proposed', savings: [{ meter: elec, quantity: lightingKwh({ existingFixtureCount: 310, existingWattsPerFixture: 86, proposedWattsPerFixture: 86, hoursPerDay: 24, daysPerYear: 365, controlsReductionPercent: 45 }) }], installedCost: 11780, lifeYears: 10 } },
      { title: 'Server room cooled to 64 °F by a split system', category: 'hvac', location: 'Server room', description: 'Belongs to the communications squadron; referred to them.', status: 'dismissed' },
    ],
  });
}

export function harwoodHallPlanned(rng: Rng, ctx: FieldContext, flagId: string): DemoWalkthrough {
  const f = new FieldBuildings(ctx);
  const spec = POOR_PERFORMERS.find((p) => p.kind === 'heating')!;
  const b = f.building(spec.installationCode, spec.number);
  return {
    id: demoUuid(rng), installationCode: b.installationCode, buildingNumber: b.number, flagId, title: 'Harwood Hall: oil-fired heating plant',
    plannedOn: dayToIso(ctx.today + 10), auditor: AUDITOR, createdBy: STAFF_KSL, createdAt: at(ctx.today - 5, '10:15'), status: 'planned', form: emptyWalkthroughForm(), completedAt: null, findings: [],
  };
}
