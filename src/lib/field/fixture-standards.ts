/**
 * Maximum water use of plumbing fixtures: the federal maxima (EPAct 1992 as codified at
 * 10 CFR 430.32(o)–(r)) and the EPA WaterSense label maxima, plus EPA's public-restroom
 * recommendation for lavatory faucets.
 */
import type { SourceCitation } from './calculator';
import { CFR_10_430_32, WATERSENSE_AT_WORK, WATERSENSE_SPECIFICATIONS } from './sources';

/** Fixtures whose flow a bag test measures. */
export const FLOW_FIXTURE_TYPES = ['showerhead', 'lavatory_faucet', 'kitchen_faucet'] as const;
export type FlowFixtureType = (typeof FLOW_FIXTURE_TYPES)[number];

export const FLOW_FIXTURE_LABELS: Record<FlowFixtureType, string> = {
  showerhead: 'Showerhead',
  lavatory_faucet: 'Lavatory faucet or aerator',
  kitchen_faucet: 'Kitchen faucet or aerator',
};

export interface FlowLimit {
  id: 'federal-maximum' | 'watersense-maximum' | 'public-restroom-recommendation';
  label: string;
  maxGpm: number;
  /** Pressure at which the rule or specification states the flow. */
  ratedPressurePsi: number;
  source: SourceCitation;
}

export const FLOW_LIMITS: Record<FlowFixtureType, readonly FlowLimit[]> = {
  showerhead: [
    // 10 CFR 430.32(p): 2.5 gpm at 80 psi, made after 1 Jan 1994
    { id: 'federal-maximum', label: 'Federal maximum', maxGpm: 2.5, ratedPressurePsi: 80, source: CFR_10_430_32 },
    // EPA WaterSense showerhead specification: 2.0 gpm
    { id: 'watersense-maximum', label: 'WaterSense label', maxGpm: 2.0, ratedPressurePsi: 80, source: WATERSENSE_SPECIFICATIONS },
  ],
  lavatory_faucet: [
    // 10 CFR 430.32(o): 2.2 gpm at 60 psi, made after 1 Jan 1994
    { id: 'federal-maximum', label: 'Federal maximum', maxGpm: 2.2, ratedPressurePsi: 60, source: CFR_10_430_32 },
    // EPA WaterSense lavatory faucet specification: 1.5 gpm at 60 psi
    { id: 'watersense-maximum', label: 'WaterSense label', maxGpm: 1.5, ratedPressurePsi: 60, source: WATERSENSE_SPECIFICATIONS },
    // EPA WaterSense at Work p. 75: 0.5 gpm in public restrooms
    { id: 'public-restroom-recommendation', label: 'EPA recommendation for public restrooms', maxGpm: 0.5, ratedPressurePsi: 60, source: WATERSENSE_AT_WORK },
  ],
  kitchen_faucet: [
    // 10 CFR 430.32(o): 2.2 gpm at 60 psi; kitchen faucets carry no WaterSense label
    { id: 'federal-maximum', label: 'Federal maximum', maxGpm: 2.2, ratedPressurePsi: 60, source: CFR_10_430_32 },
  ],
};

/** Flushing fixtures and metering faucets: limits per flush or cycle. */
export const FLUSH_FIXTURE_TYPES = [
  'water_closet_tank',
  'water_closet_flushometer_valve',
  'water_closet_blowout',
  'urinal',
  'metering_faucet',
] as const;
export type FlushFixtureType = (typeof FLUSH_FIXTURE_TYPES)[number];

export interface FlushLimit {
  label: string;
  federalMaxGalPerFlush: number;
  waterSenseMaxGalPerFlush: number | null;
}

export const FLUSH_LIMITS: Record<FlushFixtureType, FlushLimit> = {
  // 10 CFR 430.32(q): gravity tank, flushometer tank, electromechanical hydraulic 1.6 gpf
  water_closet_tank: { label: 'Water closet, tank type', federalMaxGalPerFlush: 1.6, waterSenseMaxGalPerFlush: 1.28 },
  // 10 CFR 430.32(q): flushometer valve (non-blowout) 1.6 gpf, made after 1 Jan 1997
  water_closet_flushometer_valve: { label: 'Water closet, flushometer valve', federalMaxGalPerFlush: 1.6, waterSenseMaxGalPerFlush: 1.28 },
  // 10 CFR 430.32(q): blowout bowl 3.5 gpf
  water_closet_blowout: { label: 'Water closet, blowout bowl', federalMaxGalPerFlush: 3.5, waterSenseMaxGalPerFlush: null },
  // 10 CFR 430.32(r): urinals 1.0 gpf; WaterSense flushing urinals 0.5 gpf
  urinal: { label: 'Urinal', federalMaxGalPerFlush: 1.0, waterSenseMaxGalPerFlush: 0.5 },
  // 10 CFR 430.32(o): metering faucets 0.25 gal per cycle
  metering_faucet: { label: 'Metering faucet (per cycle)', federalMaxGalPerFlush: 0.25, waterSenseMaxGalPerFlush: null },
};

/** 10 CFR 430.32(r): a trough urinal may use 1.0 gal per flush per 16 inches of length. */
export function troughUrinalMaxGalPerFlush(lengthIn: number): number {
  return lengthIn / 16;
}
