/**
 * The building inventory of one installation: its special buildings (specials.ts) plus ordinary
 * buildings drawn at random: a few types every installation has, the rest by weight; log-uniform
 * floor areas per type; year built 1940–2020 (most around 1975); occupants from area; a heating
 * fuel by site; and the date of the last evaluation (about one in five never evaluated).
 */
import type { UseType } from '../../../lib/domain';
import type { InstallationSpec } from './climates';
import { dayToIso } from './dates';
import type { Rng } from './prng';
import { SPECIAL_BUILDINGS, type HeatingFuel, type SpecialBuilding } from './specials';
import type { DemoBuilding } from './types';
import { REQUIRED_USE_TYPES, USE_TYPE_WEIGHTS, useTypeProfile } from './use-types';

/** A building with the hidden choices the loads are computed from. */
export interface PlannedBuilding {
  building: DemoBuilding;
  euiFactor: number;
  fuel: HeatingFuel | null;
  special: SpecialBuilding | null;
}

const ROMAN = ['', ' II', ' III', ' IV', ' V', ' VI', ' VII', ' VIII'];

/** Numbers of every special building: ordinary buildings never take them. */
const RESERVED_NUMBERS = new Set(SPECIAL_BUILDINGS.map((b) => b.number));

export function planBuildings(site: InstallationSpec, rng: Rng, today: number): PlannedBuilding[] {
  const specials = SPECIAL_BUILDINGS.filter((b) => b.installationCode === site.code);
  const nameCount = new Map<string, number>();
  const usedNumbers = new Set<number>();
  const planned: PlannedBuilding[] = specials.map((s) => {
    nameCount.set(s.name, 1);
    usedNumbers.add(Number(s.number));
    return {
      building: {
        installationCode: site.code,
        number: s.number,
        name: s.name,
        useType: s.useType,
        grossAreaFt2: s.areaFt2,
        yearBuilt: s.yearBuilt,
        occupants: occupantsFor(s.useType, s.areaFt2, rng),
        lastEvaluatedOn: s.evaluatedYearsAgo === null ? null : dayToIso(today - Math.round(s.evaluatedYearsAgo * 365.25)),
      },
      euiFactor: s.euiFactor,
      fuel: s.fuel,
      special: s,
    };
  });

  const ordinaryCount = site.buildingCount - specials.length;
  const types: UseType[] = REQUIRED_USE_TYPES.slice(0, ordinaryCount);
  while (types.length < ordinaryCount) types.push(rng.weighted(USE_TYPE_WEIGHTS));

  for (const useType of rng.shuffle(types)) {
    const profile = useTypeProfile(useType);
    const number = drawNumber(site, rng, usedNumbers);
    const baseName = rng.pick(profile.names);
    const seen = nameCount.get(baseName) ?? 0;
    nameCount.set(baseName, seen + 1);
    const areaFt2 = Math.round(rng.logBetween(profile.areaFt2[0], profile.areaFt2[1]) / 10) * 10;
    // Mean of two uniforms: a triangular spread over 1940–2020 peaking in 1980.
    const yearBuilt = Math.round(1940 + 40 * (rng.uniform() + rng.uniform()));
    planned.push({
      building: {
        installationCode: site.code,
        number: String(number),
        name: baseName + (ROMAN[seen] ?? ` ${seen + 1}`),
        useType,
        grossAreaFt2: areaFt2,
        yearBuilt,
        occupants: occupantsFor(useType, areaFt2, rng),
        lastEvaluatedOn: drawLastEvaluation(rng, today),
      },
      euiFactor: rng.between(0.8, 1.2),
      fuel: drawFuel(site, rng, yearBuilt),
      special: null,
    });
  }
  return planned.sort((a, b) => Number(a.building.number) - Number(b.building.number));
}

function drawNumber(site: InstallationSpec, rng: Rng, used: Set<number>): number {
  for (;;) {
    const n = rng.int(site.numberBlock[0], site.numberBlock[1]);
    if (!used.has(n) && !RESERVED_NUMBERS.has(String(n))) {
      used.add(n);
      return n;
    }
  }
}

function occupantsFor(useType: UseType, areaFt2: number, rng: Rng): number {
  return Math.max(1, Math.round((areaFt2 / useTypeProfile(useType).ft2PerOccupant) * rng.between(0.8, 1.2)));
}

/** 20 % never; 55 % within the last four years; 25 % four to nine years ago. */
function drawLastEvaluation(rng: Rng, today: number): string | null {
  const r = rng.uniform();
  if (r < 0.2) return null;
  const yearsAgo = r < 0.75 ? rng.between(0.2, 3.9) : rng.between(4.1, 9);
  return dayToIso(today - Math.round(yearsAgo * 365.25));
}

function drawFuel(site: InstallationSpec, rng: Rng, yearBuilt: number): HeatingFuel | null {
  if (yearBuilt < 1980 && rng.chance(site.oilShareOfOld)) return 'fuel_oil_2';
  if (rng.chance(site.allElectricShare)) return null;
  return 'natural_gas';
}
