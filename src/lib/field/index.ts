/**
 * Registry of the walkthrough field calculators: each with its metadata (title, formulas, inputs
 * with units, sources, limitations) and the safety cautions that apply, so that the UI can list,
 * render and run any calculator without knowing its types.
 */
import type { AnyFieldCalculator, CalcOutcome, CalculatorId, CalculatorMeta } from './calculator';
import { clampMeterPower } from './clamp-meter-power';
import { combustionEfficiency } from './combustion-efficiency';
import { fixtureFlowTest } from './fixture-flow-test';
import { fixtureWaterUse } from './fixture-water-use';
import { illuminanceCheck } from './illuminance-check';
import { lampTypeHint } from './lamp-type-hint';
import { lightingRetrofit } from './lighting-retrofit';
import { motorLoadInputPower } from './motor-load-input-power';
import { motorLoadSlip } from './motor-load-slip';
import { pumpEfficiency } from './pump-efficiency';
import { SAFETY_DEFERRAL, hazardsForCalculator, type Hazard } from './safety';

export interface RegisteredCalculator extends AnyFieldCalculator {
  hazards: Hazard[];
  /** Shown beside the cautions whenever there are any. */
  safetyDeferral: string | null;
}

function register(calc: AnyFieldCalculator): RegisteredCalculator {
  const hazards = hazardsForCalculator(calc.meta.id);
  return { ...calc, hazards, safetyDeferral: hazards.length > 0 ? SAFETY_DEFERRAL : null };
}

/** Every field calculator, in the order the UI lists them. */
export const FIELD_CALCULATORS: readonly RegisteredCalculator[] = [
  lightingRetrofit,
  illuminanceCheck,
  lampTypeHint,
  fixtureFlowTest,
  fixtureWaterUse,
  clampMeterPower,
  motorLoadSlip,
  motorLoadInputPower,
  pumpEfficiency,
  combustionEfficiency,
].map(register);

export function getFieldCalculator(id: CalculatorId): RegisteredCalculator {
  return FIELD_CALCULATORS.find((c) => c.meta.id === id) as RegisteredCalculator;
}

export function listFieldCalculatorMeta(): CalculatorMeta[] {
  return FIELD_CALCULATORS.map((c) => c.meta);
}

/** Parses untrusted input for the calculator `id` and computes; failures are values. */
export function runFieldCalculator(id: CalculatorId, raw: unknown): CalcOutcome<unknown> {
  return getFieldCalculator(id).run(raw);
}

export * from './calculator';
export * from './instruments';
export * from './safety';
export * from './units';
export * from './sources';
export * from './illuminance-levels';
export * from './fixture-standards';
export * from './lighting-retrofit';
export * from './illuminance-check';
export * from './lamp-type-hint';
export * from './fixture-flow-test';
export * from './fixture-water-use';
export * from './clamp-meter-power';
export * from './motor-load-slip';
export * from './motor-load-input-power';
export * from './pump-efficiency';
export * from './siegert';
export * from './doe-combustion-table';
export * from './excess-air';
export * from './co-air-free';
export * from './combustion-efficiency';
