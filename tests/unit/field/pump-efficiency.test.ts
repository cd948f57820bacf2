import { describe, expect, it } from 'vitest';
import {
  FT_PER_PSI,
  WHP_DIVISOR,
  feetOfHeadToPsi,
  psiToFeetOfHead,
  pumpEfficiency,
  waterHorsepower,
} from '../../../src/lib/field/pump-efficiency';
import { expectExact, expectInvalidField, expectWithin, failureOf, okValue } from './expect-helpers';

describe('pump hydraulics', () => {
  it('reproduces the UConn ITAC pump example: 300 gpm, 60 ft, 5 hp → 90.9 %', () => {
    // Source: UConn ITAC training notes, "Pumps": η = 300 × 60 × 1.0 / (3,960 × 5) = 18,000 / 19,800 = 0.909
    const r = okValue(pumpEfficiency.run({ flowGpm: 300, headFt: 60, shaftPowerHp: 5 }));
    expectWithin(r.pumpEfficiency, 0.909, 0.0005);
    expect(r.pumpEfficiencyFrom).toBe('shaft-power');
  });

  it('uses the 3960 divisor that follows from the unit definitions (≈ 3956)', () => {
    // Source: Merkley & Allen, Utah State University, Sprinkle & Trickle Irrigation Lectures, Lecture 11:
    // 33,000 ft·lbf/(min·hp) ÷ (62.4 lb/ft³ ÷ 7.48052 gal/ft³) = 3956, rounded to 3960 in practice
    const derived = 33_000 / (62.4 / 7.48052);
    expectWithin(derived, 3956, 1);
    expectWithin(WHP_DIVISOR, derived, 0.002 * derived);
  });

  it('gives 0.10 hp for 20 gpm lifted 20 ft', () => {
    // Source: Engineering ToolBox, "Pumping Water – Required Horsepower" (supplementary): 0.10 hp (exact 0.101)
    expectWithin(waterHorsepower(20, 20), 0.1, 0.005);
  });

  it('converts pressure and head: 80 psi ≈ 185 ft; 120 ft ≈ 52 psi', () => {
    // Source: L. Nelik, "The Importance of Velocity Head", Pumps & Systems 2012 (supplementary): 80 psig × 2.31 ≈ 185 ft
    expectWithin(psiToFeetOfHead(80), 185, 0.5);
    // Source: Engineering ToolBox "pump head to pressure" example (supplementary): 0.433 × 120 ≈ 52 psi
    expectWithin(feetOfHeadToPsi(120), 52, 0.1);
    // 2.31 ft/psi follows from 144 in²/ft² ÷ 62.4 lb/ft³ = 2.3077 (Utah State lecture constants)
    expectWithin(FT_PER_PSI, 144 / 62.4, 0.005);
  });

  it('takes head from differential pressure and specific gravity', () => {
    // constructed: 40 psi × 2.31 / 1.2 = 77 ft; WHP = 200 × 77 × 1.2 / 3960 = 4.6667 hp
    const r = okValue(pumpEfficiency.run({ flowGpm: 200, differentialPressurePsi: 40, specificGravity: 1.2 }));
    expectExact(r.headFt, 77);
    expectExact(r.waterHp, (200 * 77 * 1.2) / 3960);
    expect(r.pumpEfficiency).toBeNull();
  });

  it('gives wire-to-water and pump efficiency from electrical input and motor efficiency', () => {
    // constructed: WHP = 300 × 60 / 3960 = 4.5455 hp = 3.3895 kW; η_ww = 3.3895 / 5.5 = 0.6163;
    // with η_motor 0.9 and a 0.97 drive, η_pump = 0.6163 / 0.873 = 0.7059
    const r = okValue(pumpEfficiency.run({ flowGpm: 300, headFt: 60, electricalInputKw: 5.5, motorEfficiencyPercent: 90, driveEfficiencyPercent: 97 }));
    expectWithin(r.wireToWaterEfficiency, 0.6163, 0.0001);
    expectWithin(r.pumpEfficiency, 0.7059, 0.0001);
    expect(r.pumpEfficiencyFrom).toBe('electrical-input-and-motor-efficiency');
  });

  it('reports impossible readings (efficiency above 100 %) as a reason', () => {
    expect(failureOf(pumpEfficiency.run({ flowGpm: 300, headFt: 60, shaftPowerHp: 4 })).reason).toBe('efficiency-above-100-percent');
  });

  it('asks for exactly one of pressure or head, naming the field', () => {
    expectInvalidField(pumpEfficiency.run({ flowGpm: 300 }), 'differentialPressurePsi', 'exactly one');
    expectInvalidField(pumpEfficiency.run({ flowGpm: 300, headFt: 60, differentialPressurePsi: 26 }), 'differentialPressurePsi', 'exactly one');
    expectInvalidField(pumpEfficiency.run({ flowGpm: 0, headFt: 60 }), 'flowGpm', 'Flow (gpm) must be greater than 0');
  });
});
