/**
 * Per use type: the peer median the demo aims at, typical floor areas, how the energy splits
 * between base load, heating and cooling, water intensity, occupancy and load factor, and the
 * invented building names to draw from. The medians are published figures; every other number is
 * a demo choice (documented in docs/demo-scenario.md), picked so that most buildings sit near
 * their peers.
 */
import type { UseType } from '../../../lib/domain';

export interface UseTypeProfile {
  /** CBECS 2018 building activity the type is compared with. */
  cbecsActivity: string;
  /** Median site EUI of that activity, kBtu/ft²·yr. */
  medianEui: number;
  /** Gross floor area range, ft² (drawn log-uniform). */
  areaFt2: readonly [number, number];
  /** Relative weights of base load, heating and cooling at reference weather (see load-parameters.ts). */
  base: number;
  heat: number;
  cool: number;
  /** Share of the base load met by the heating fuel (hot water, cooking) when the building has one. */
  fuelBaseShare: number;
  /** Heating balance point range, whole °F. */
  heatingBalanceF: readonly [number, number];
  /** Water use intensity, gal/ft²·yr. */
  wuiGalPerFt2: number;
  /** Floor area per occupant, ft². */
  ft2PerOccupant: number;
  /** Average over peak electric demand in a billing period. */
  loadFactor: number;
  names: readonly string[];
}

// Medians: U.S. EIA, 2018 CBECS, Table C12 (Dec 2022), median site EUI by building activity.
export const USE_TYPE_PROFILES: Partial<Record<UseType, UseTypeProfile>> = {
  office: {
    cbecsActivity: 'Office', medianEui: 53.5, // Source: EIA CBECS 2018 Table C12
    areaFt2: [8000, 60000], base: 0.55, heat: 0.3, cool: 0.2, fuelBaseShare: 0.06, heatingBalanceF: [54, 60],
    wuiGalPerFt2: 14, ft2PerOccupant: 250, loadFactor: 0.45,
    names: ['Headquarters', 'Administration Building', 'Engineering Office', 'Logistics Office', 'Personnel Center', 'Finance Office', 'Operations Center', 'Public Works Office', 'Records Office', 'Planning Annex'],
  },
  lodging: {
    cbecsActivity: 'Lodging', medianEui: 86.1, // Source: EIA CBECS 2018 Table C12
    areaFt2: [20000, 90000], base: 0.5, heat: 0.4, cool: 0.15, fuelBaseShare: 0.35, heatingBalanceF: [56, 62],
    wuiGalPerFt2: 45, ft2PerOccupant: 400, loadFactor: 0.6,
    names: ['Abernell Hall', 'Corrigan Hall', 'Delacourt Hall', 'Everly Hall', 'Fenwick Hall', 'Galloway Hall', 'Harwood Hall', 'Ingram Hall', 'Jessup Hall', 'Lorimer Hall', 'Northcott Hall', 'Pendry Hall', 'Quillon Hall', 'Tolland Hall', 'Whitlock Hall', 'Yardley Hall'],
  },
  dining: {
    cbecsActivity: 'Food service', medianEui: 232.9, // Source: EIA CBECS 2018 Table C12
    areaFt2: [8000, 20000], base: 0.8, heat: 0.15, cool: 0.1, fuelBaseShare: 0.45, heatingBalanceF: [52, 58],
    wuiGalPerFt2: 110, ft2PerOccupant: 300, loadFactor: 0.55,
    names: ['Dining Facility', 'Galley', 'Mess Hall', 'Cafeteria'],
  },
  warehouse: {
    cbecsActivity: 'Warehouse and storage', medianEui: 14.0, // Source: EIA CBECS 2018 Table C12
    areaFt2: [20000, 110000], base: 0.5, heat: 0.45, cool: 0.03, fuelBaseShare: 0.02, heatingBalanceF: [45, 52],
    wuiGalPerFt2: 3, ft2PerOccupant: 5000, loadFactor: 0.5,
    names: ['Supply Warehouse', 'Storage Depot', 'Distribution Warehouse', 'Bulk Storage', 'Parts Warehouse'],
  },
  retail: {
    cbecsActivity: 'Retail (other than mall)', medianEui: 40.8, // Source: EIA CBECS 2018 Table C12
    areaFt2: [5000, 40000], base: 0.6, heat: 0.25, cool: 0.2, fuelBaseShare: 0.03, heatingBalanceF: [52, 58],
    wuiGalPerFt2: 10, ft2PerOccupant: 800, loadFactor: 0.55,
    names: ['Exchange Store', 'Commissary', 'Convenience Store', 'Outfitters Shop'],
  },
  clinic: {
    cbecsActivity: 'Outpatient health care', medianEui: 60.6, // Source: EIA CBECS 2018 Table C12
    areaFt2: [6000, 30000], base: 0.6, heat: 0.25, cool: 0.2, fuelBaseShare: 0.1, heatingBalanceF: [54, 60],
    wuiGalPerFt2: 25, ft2PerOccupant: 350, loadFactor: 0.5,
    names: ['Health Clinic', 'Dental Clinic', 'Medical Annex', 'Occupational Health Clinic'],
  },
  training: {
    cbecsActivity: 'Education', medianEui: 48.6, // Source: EIA CBECS 2018 Table C12
    areaFt2: [10000, 50000], base: 0.5, heat: 0.35, cool: 0.18, fuelBaseShare: 0.05, heatingBalanceF: [54, 60],
    wuiGalPerFt2: 12, ft2PerOccupant: 200, loadFactor: 0.45,
    names: ['Training Center', 'Learning Center', 'Classroom Building', 'Leadership Academy'],
  },
  fitness: {
    cbecsActivity: 'Recreation', medianEui: 53.2, // Source: EIA CBECS 2018 Table C12
    areaFt2: [12000, 45000], base: 0.55, heat: 0.3, cool: 0.18, fuelBaseShare: 0.3, heatingBalanceF: [54, 60],
    wuiGalPerFt2: 55, ft2PerOccupant: 600, loadFactor: 0.5,
    names: ['Fitness Center', 'Gymnasium', 'Aquatics Center', 'Recreation Center'],
  },
  laboratory: {
    cbecsActivity: 'Laboratory', medianEui: 86.4, // Source: EIA CBECS 2018 Table C12
    areaFt2: [10000, 35000], base: 0.65, heat: 0.22, cool: 0.2, fuelBaseShare: 0.1, heatingBalanceF: [54, 60],
    wuiGalPerFt2: 40, ft2PerOccupant: 400, loadFactor: 0.65,
    names: ['Test Laboratory', 'Materials Laboratory', 'Environmental Laboratory'],
  },
  vehicle_maintenance: {
    cbecsActivity: 'Vehicle storage or maintenance', medianEui: 29.4, // Source: EIA CBECS 2018 Table C12
    areaFt2: [8000, 30000], base: 0.45, heat: 0.5, cool: 0.04, fuelBaseShare: 0.03, heatingBalanceF: [50, 56],
    wuiGalPerFt2: 15, ft2PerOccupant: 1500, loadFactor: 0.45,
    names: ['Motor Pool', 'Vehicle Maintenance Shop', 'Fleet Garage'],
  },
  religious: {
    cbecsActivity: 'Religious worship', medianEui: 32.9, // Source: EIA CBECS 2018 Table C12
    areaFt2: [4000, 12000], base: 0.35, heat: 0.5, cool: 0.15, fuelBaseShare: 0.02, heatingBalanceF: [54, 60],
    wuiGalPerFt2: 8, ft2PerOccupant: 300, loadFactor: 0.35,
    names: ['Chapel', 'Chapel Annex'],
  },
};

/** Relative frequency of each type among ordinary buildings (a demo choice). */
export const USE_TYPE_WEIGHTS: readonly (readonly [UseType, number])[] = [
  ['office', 18],
  ['lodging', 14],
  ['warehouse', 12],
  ['vehicle_maintenance', 6],
  ['training', 6],
  ['retail', 5],
  ['clinic', 4],
  ['laboratory', 4],
  ['religious', 4],
  ['dining', 3],
  ['fitness', 3],
];

/** Types every installation has at least one of (office and lodging twice), before the weighted draws. */
export const REQUIRED_USE_TYPES: readonly UseType[] = [
  'office', 'office', 'lodging', 'lodging', 'dining', 'warehouse', 'training', 'fitness', 'retail', 'clinic',
];

/** The profile of a type the demo uses; throws for a type it never generates (a bug). */
export function useTypeProfile(useType: UseType): UseTypeProfile {
  const profile = USE_TYPE_PROFILES[useType];
  if (!profile) throw new Error(`the demo scenario has no profile for use type ${useType}`);
  return profile;
}
