/**
 * The invented region and its five installations, each in a different climate with its own
 * synthetic weather station, utilities and prices. Every name, code and account is invented;
 * climate labels use the ASHRAE Standard 169 zone numbers; time zones are real IANA zones.
 */
import type { Unit } from '../../../lib/domain';

export const REGION = { code: 'CWR', name: 'Calderwick Region' } as const;

/** Parameters of a station's synthetic daily weather (°F); see weather.ts for the model. */
export interface WeatherSpec {
  /** Annual mean of the daily mean temperature. */
  meanF: number;
  /** Half the difference between the warmest and coldest mean of the seasonal cycle. */
  amplitudeF: number;
  /** Day of the year (0 = 1 January) at the bottom of the seasonal cycle. */
  coldestDay: number;
  /** Day-to-day anomaly: stationary standard deviation and lag-1 coefficient of an AR(1). */
  fastSdF: number;
  fastPhi: number;
  /** Slow anomaly (spells of weeks, warm and cold seasons): a second, persistent AR(1). */
  slowSdF: number;
  slowPhi: number;
  /** The fast anomaly's sd is scaled by 1 + winterBoost·cos(season): winters vary more. */
  winterBoost: number;
  /** Mean daily range Tmax − Tmin and its day-to-day standard deviation. */
  diurnalRangeF: number;
  diurnalSdF: number;
}

export interface InstallationSpec {
  code: string;
  name: string;
  climate: string;
  timeZone: string;
  station: { code: string; name: string; latitude: number; longitude: number; elevationFt: number };
  weather: WeatherSpec;
  buildingCount: number;
  /** Building numbers are drawn from this block (inclusive), unique across the region. */
  numberBlock: readonly [number, number];
  gasUnit: Extract<Unit, 'therm' | 'ccf'>;
  /** Share of buildings built before 1980 heated with fuel oil No. 2 instead of gas (cold site). */
  oilShareOfOld: number;
  /** Share of ordinary buildings with no heating fuel meter (electric heat or heat pumps). */
  allElectricShare: number;
  waterUnit: Extract<Unit, 'kgal' | 'gal' | 'ccf'>;
  /** Share of annual water that rises with cooling degree days (irrigation, cooling towers). */
  waterCoolingShare: number;
  /** Blended prices in the first billing fiscal year, $ per unit named. */
  prices: { electricityPerKwh: number; gasPerTherm: number; oilPerGal: number; waterPerKgal: number };
  /** Annual price escalation, percent, applied at each new federal fiscal year. */
  escalationPct: number;
  target: { reductionPct: number; yearsToTarget: number };
  utilityPrefix: { electricity: string; gas: string; oil: string; water: string };
}

export const INSTALLATIONS: readonly InstallationSpec[] = [
  {
    code: 'KSL',
    name: 'Kestrowe Lakes',
    climate: '6A cold',
    timeZone: 'America/Chicago',
    station: { code: 'KSLWX', name: 'Kestrowe Lakes airfield (synthetic)', latitude: 47.12, longitude: -94.61, elevationFt: 1340 },
    weather: { meanF: 42, amplitudeF: 28, coldestDay: 18, fastSdF: 7.5, fastPhi: 0.72, slowSdF: 2.2, slowPhi: 0.985, winterBoost: 0.35, diurnalRangeF: 19, diurnalSdF: 4 },
    buildingCount: 22,
    numberBlock: [100, 999],
    gasUnit: 'therm',
    oilShareOfOld: 0.7,
    allElectricShare: 0,
    waterUnit: 'kgal',
    waterCoolingShare: 0.03,
    prices: { electricityPerKwh: 0.128, gasPerTherm: 1.18, oilPerGal: 3.65, waterPerKgal: 11.8 },
    escalationPct: 3,
    target: { reductionPct: 25, yearsToTarget: 6 },
    utilityPrefix: { electricity: 'NLP', gas: 'KGC', oil: 'LFD', water: 'KLW' },
  },
  {
    code: 'SBP',
    name: 'Saltbrake Point',
    climate: '2A hot-humid',
    timeZone: 'America/Chicago',
    station: { code: 'SBPWX', name: 'Saltbrake Point range tower (synthetic)', latitude: 29.91, longitude: -89.74, elevationFt: 18 },
    weather: { meanF: 70, amplitudeF: 13, coldestDay: 20, fastSdF: 5, fastPhi: 0.7, slowSdF: 1.5, slowPhi: 0.985, winterBoost: 0.5, diurnalRangeF: 16, diurnalSdF: 3 },
    buildingCount: 24,
    numberBlock: [2000, 2999],
    gasUnit: 'therm',
    oilShareOfOld: 0,
    allElectricShare: 0.3,
    waterUnit: 'kgal',
    waterCoolingShare: 0.1,
    prices: { electricityPerKwh: 0.112, gasPerTherm: 1.32, oilPerGal: 3.4, waterPerKgal: 8.9 },
    escalationPct: 2.5,
    target: { reductionPct: 20, yearsToTarget: 6 },
    utilityPrefix: { electricity: 'GCE', gas: 'BGS', oil: 'BFO', water: 'SBU' },
  },
  {
    code: 'DMF',
    name: 'Dunmesa Flats',
    climate: '3B hot-dry',
    timeZone: 'America/Phoenix',
    station: { code: 'DMFWX', name: 'Dunmesa Flats test range (synthetic)', latitude: 33.48, longitude: -112.91, elevationFt: 2350 },
    weather: { meanF: 65, amplitudeF: 20, coldestDay: 18, fastSdF: 4.5, fastPhi: 0.72, slowSdF: 1.5, slowPhi: 0.985, winterBoost: 0.3, diurnalRangeF: 27, diurnalSdF: 4 },
    buildingCount: 20,
    numberBlock: [1000, 1999],
    gasUnit: 'ccf',
    oilShareOfOld: 0,
    allElectricShare: 0.2,
    waterUnit: 'ccf',
    waterCoolingShare: 0.15,
    prices: { electricityPerKwh: 0.118, gasPerTherm: 1.05, oilPerGal: 3.5, waterPerKgal: 14.6 },
    escalationPct: 3.5,
    target: { reductionPct: 25, yearsToTarget: 7 },
    utilityPrefix: { electricity: 'MPW', gas: 'DSG', oil: 'DFO', water: 'DMW' },
  },
  {
    code: 'FHS',
    name: 'Fernhollow Sound',
    climate: '4C marine',
    timeZone: 'America/Los_Angeles',
    station: { code: 'FHSWX', name: 'Fernhollow Sound pier (synthetic)', latitude: 47.71, longitude: -122.84, elevationFt: 160 },
    weather: { meanF: 52, amplitudeF: 8.5, coldestDay: 15, fastSdF: 3.5, fastPhi: 0.75, slowSdF: 1.2, slowPhi: 0.985, winterBoost: 0.3, diurnalRangeF: 14, diurnalSdF: 3 },
    buildingCount: 16,
    numberBlock: [5000, 5999],
    gasUnit: 'therm',
    oilShareOfOld: 0,
    allElectricShare: 0.25,
    waterUnit: 'gal',
    waterCoolingShare: 0.05,
    prices: { electricityPerKwh: 0.094, gasPerTherm: 1.41, oilPerGal: 3.7, waterPerKgal: 13.2 },
    escalationPct: 2.5,
    target: { reductionPct: 20, yearsToTarget: 8 },
    utilityPrefix: { electricity: 'SHP', gas: 'PNG', oil: 'SFO', water: 'FSW' },
  },
  {
    code: 'BNP',
    name: 'Brennock Plains',
    climate: '4A mixed-humid',
    timeZone: 'America/New_York',
    station: { code: 'BNPWX', name: 'Brennock Plains airfield (synthetic)', latitude: 38.27, longitude: -84.94, elevationFt: 820 },
    weather: { meanF: 56, amplitudeF: 22, coldestDay: 18, fastSdF: 7, fastPhi: 0.7, slowSdF: 2, slowPhi: 0.985, winterBoost: 0.35, diurnalRangeF: 20, diurnalSdF: 4 },
    buildingCount: 20,
    numberBlock: [3000, 3999],
    gasUnit: 'ccf',
    oilShareOfOld: 0,
    allElectricShare: 0.1,
    waterUnit: 'kgal',
    waterCoolingShare: 0.08,
    prices: { electricityPerKwh: 0.104, gasPerTherm: 1.12, oilPerGal: 3.55, waterPerKgal: 10.4 },
    escalationPct: 3,
    target: { reductionPct: 30, yearsToTarget: 6 },
    utilityPrefix: { electricity: 'BVE', gas: 'TCG', oil: 'BFO', water: 'BPW' },
  },
];

/** Look an installation up by code; the codes above are the only ones the scenario uses. */
export function installationSpec(code: string): InstallationSpec {
  const spec = INSTALLATIONS.find((i) => i.code === code);
  if (!spec) throw new Error(`unknown demo installation ${code}`);
  return spec;
}
