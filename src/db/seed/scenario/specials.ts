/**
 * The buildings that carry the story of the demo: five deliberate poor performers, each with one
 * clear fault, and one building retrofitted partway through. Their identity (installation, number,
 * name, type, size) is fixed so the documentation can name them; the seed only moves their noise.
 */
import type { UseType } from '../../../lib/domain';
import type { LoadExtras } from './load-parameters';
import type { PoorPerformer } from './types';

export type HeatingFuel = 'natural_gas' | 'fuel_oil_2';

export interface SpecialBuilding {
  installationCode: string;
  number: string;
  name: string;
  useType: UseType;
  areaFt2: number;
  yearBuilt: number;
  fuel: HeatingFuel | null;
  /** Years before `today` of the last evaluation, or null for never. */
  evaluatedYearsAgo: number | null;
  /** Site EUI factor over the type's median before any fault is added. */
  euiFactor: number;
  /** Fixed balance points, when the fault is in them. */
  heatingBalanceF?: number;
  coolingBalanceF?: number;
}

export interface PoorPerformerSpec extends SpecialBuilding {
  kind: PoorPerformer['kind'];
  /** Which meter carries the fault. */
  faultMeter: 'electricity' | 'fuel' | 'water';
  intendedEuiMultiple: number;
  /** Extra energy as a function of the type's median budget (area × median, kBtu/yr). */
  extras: (medianBudgetKbtu: number) => LoadExtras;
  /** For a change partway through: months before today's month when it begins. */
  changeMonthsAgo?: number;
  reason: string;
}

export const POOR_PERFORMERS: readonly PoorPerformerSpec[] = [
  {
    kind: 'base-load', installationCode: 'BNP', number: '3204', name: 'Brennock Operations Center', useType: 'office',
    areaFt2: 52000, yearBuilt: 1986, fuel: 'natural_gas', evaluatedYearsAgo: 7.2, euiFactor: 1,
    faultMeter: 'electricity', intendedEuiMultiple: 2.2,
    extras: (m) => ({ electricBaseKbtu: 1.2 * m }),
    reason: 'Electric base load about 3x that of a typical office: plug loads, servers and lighting left on around the clock. Site EUI about 2.2x the CBECS 2018 office median.',
  },
  {
    kind: 'heating', installationCode: 'KSL', number: '415', name: 'Harwood Hall', useType: 'lodging',
    areaFt2: 64000, yearBuilt: 1962, fuel: 'fuel_oil_2', evaluatedYearsAgo: 8.5, euiFactor: 1,
    heatingBalanceF: 66, coolingBalanceF: 70,
    faultMeter: 'fuel', intendedEuiMultiple: 2.1,
    extras: (m) => ({ heatingKbtu: 1.1 * m }),
    reason: 'Heating starts at a 66 °F balance point (peers 56–62 °F) with a steep heating slope: an uncontrolled oil-fired heating plant and open windows. Site EUI about 2.1x the CBECS 2018 lodging median.',
  },
  {
    kind: 'water-leak', installationCode: 'SBP', number: '2301', name: 'Bayside Dining Facility', useType: 'dining',
    areaFt2: 18000, yearBuilt: 1978, fuel: 'natural_gas', evaluatedYearsAgo: 6.1, euiFactor: 1,
    faultMeter: 'water', intendedEuiMultiple: 1.9,
    extras: (m) => ({ waterMultiple: 3.2, fuelBaseKbtu: 0.9 * m }),
    reason: 'Water use about 3.2x that of its peers from hot-water leaks (dish room and pre-rinse lines), with the gas to heat it. Site EUI about 1.9x the CBECS 2018 food-service median.',
  },
  {
    kind: 'year-over-year', installationCode: 'DMF', number: '1650', name: 'Simulation Center', useType: 'training',
    areaFt2: 45000, yearBuilt: 2004, fuel: 'natural_gas', evaluatedYearsAgo: 4.3, euiFactor: 1.1,
    faultMeter: 'electricity', intendedEuiMultiple: 2.3, changeMonthsAgo: 11,
    extras: (m) => ({ electricBaseKbtu: 1.3 * m }),
    reason: 'Electricity jumped in the last year: simulators installed and left running, base load more than tripled from the change date. Site EUI over the last 12 months about 2.3x the CBECS 2018 education median.',
  },
  {
    kind: 'never-evaluated', installationCode: 'BNP', number: '3310', name: 'Health Clinic', useType: 'clinic',
    areaFt2: 30000, yearBuilt: 1971, fuel: 'natural_gas', evaluatedYearsAgo: null, euiFactor: 1,
    heatingBalanceF: 64, coolingBalanceF: 60,
    faultMeter: 'fuel', intendedEuiMultiple: 2,
    extras: (m) => ({ heatingKbtu: 0.5 * m, coolingKbtu: 0.5 * m }),
    reason: 'Never evaluated. Heats below 64 °F and cools above 60 °F at once (constant-volume reheat), with steep slopes on both. Site EUI about 2x the CBECS 2018 outpatient median.',
  },
];

export interface RetrofitSpec extends SpecialBuilding {
  measure: string;
  /** Months before today's month when the retrofit took effect (first of that month). */
  monthsAgo: number;
  /** Drop of the gas heating slope, percent. */
  heatingSlopeDropPct: number;
}

export const RETROFIT: RetrofitSpec = {
  installationCode: 'BNP', number: '3102', name: 'Corrigan Hall', useType: 'lodging',
  areaFt2: 58000, yearBuilt: 1968, fuel: 'natural_gas', evaluatedYearsAgo: 3.6, euiFactor: 1.05,
  measure: 'Boiler replacement: 1968 atmospheric boilers replaced by condensing boilers with outdoor reset',
  monthsAgo: 18,
  heatingSlopeDropPct: 35,
};

/** Every special building, poor performers first. */
export const SPECIAL_BUILDINGS: readonly SpecialBuilding[] = [...POOR_PERFORMERS, RETROFIT];
