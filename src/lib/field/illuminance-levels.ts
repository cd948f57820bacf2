/**
 * Reference illuminance levels, only from government, standards-body and university sources:
 * - 41 CFR 102-74.180 (Federal Management Regulation): levels Federal agencies maintain.
 * - IESNA Lighting Handbook 8th/9th ed. illuminance categories A–F (low–mid–high), as reproduced.
 * - UFC 3-530-01 (DoD, 2006): waiting areas 10 fc ±10 %.
 * Values in foot-candles; lux follows from 1 fc = 10.7639 lx.
 */
import type { SourceCitation } from './calculator';
import { CFR_41_102_74_180, IES_HANDBOOK_CATEGORIES, UFC_3_530_01 } from './sources';

interface ReferenceBase {
  id: string;
  label: string;
  source: SourceCitation;
  /** Where and how to take the reading. */
  measurement: string;
}

/** A level to maintain: a reading below it is short. */
export interface MinimumLevel extends ReferenceBase {
  kind: 'minimum';
  minimumFc: number;
}

/** A recommended range with a target in the middle. */
export interface RangeLevel extends ReferenceBase {
  kind: 'range';
  lowFc: number;
  targetFc: number;
  highFc: number;
}

/** A target with a tolerance either side. */
export interface ToleranceLevel extends ReferenceBase {
  kind: 'tolerance';
  targetFc: number;
  tolerancePercent: number;
}

export type IlluminanceReference = MinimumLevel | RangeLevel | ToleranceLevel;

const AT_30_IN = 'horizontal, 30 in above the floor';

function federal(id: string, label: string, minimumFc: number, measurement = AT_30_IN): MinimumLevel {
  return { id, label, kind: 'minimum', minimumFc, measurement, source: CFR_41_102_74_180 };
}

function iesCategory(letter: string, activity: string, lowFc: number, targetFc: number, highFc: number): RangeLevel {
  return {
    id: `ies-category-${letter.toLowerCase()}`,
    label: `IES category ${letter}: ${activity}`,
    kind: 'range',
    lowFc,
    targetFc,
    highFc,
    // A–C are general lighting over large areas; D–F are localized tasks (IESNA Handbook).
    measurement: 'ABC'.includes(letter) ? 'general lighting over the area' : 'on the task',
    source: IES_HANDBOOK_CATEGORIES,
  };
}

export const ILLUMINANCE_REFERENCES: readonly IlluminanceReference[] = [
  // 41 CFR 102-74.180(a)–(c)
  federal('federal-work-station', 'Federal facility: work-station surface', 50, `${AT_30_IN}, during working hours`),
  federal('federal-work-area', 'Federal facility: work area', 30),
  federal('federal-non-work-area', 'Federal facility: non-work area (not less than 1 fc anywhere)', 10),
  federal('federal-elevator-boarding', 'Federal facility: elevator boarding area', 5),
  federal('federal-corridor-stairwell', 'Federal facility: middle of corridors and stairwells', 1, 'at the walking surface'),
  federal('federal-storage', 'Federal facility: storage area', 10),
  // IESNA Handbook illuminance categories (fc: low–mid–high)
  iesCategory('A', 'public spaces with dark surroundings', 2, 3, 5),
  iesCategory('B', 'simple orientation for short, temporary visits', 5, 7.5, 10),
  iesCategory('C', 'working spaces where visual tasks are only occasional', 10, 15, 20),
  iesCategory('D', 'visual tasks of high contrast or large size', 20, 30, 50),
  iesCategory('E', 'visual tasks of medium contrast or small size', 50, 75, 100),
  iesCategory('F', 'visual tasks of low contrast or very small size', 100, 150, 200),
  // UFC 3-530-01 (2006)
  {
    id: 'ufc-waiting-area',
    label: 'DoD facility: waiting area',
    kind: 'tolerance',
    targetFc: 10,
    tolerancePercent: 10,
    measurement: 'horizontal',
    source: UFC_3_530_01,
  },
];

export const ILLUMINANCE_REFERENCE_IDS = ILLUMINANCE_REFERENCES.map((r) => r.id) as [string, ...string[]];

export function findIlluminanceReference(id: string): IlluminanceReference | undefined {
  return ILLUMINANCE_REFERENCES.find((r) => r.id === id);
}
