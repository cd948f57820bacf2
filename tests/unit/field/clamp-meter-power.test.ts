import { describe, expect, it } from 'vitest';
import { apparentPowerKva, clampMeterPower } from '../../../src/lib/field/clamp-meter-power';
import { expectExact, expectInvalidField, expectWithin, okValue } from './expect-helpers';

describe('clamp-meter power', () => {
  it('three-phase: reproduces the DOE fact-sheet example, 22.9 kW', () => {
    // Source: U.S. DOE, "Determining Electric Motor Load and Efficiency" (DOE/GO-10097-517), Eq. 1:
    // Pi = V·I·PF·√3/1000 with 469.7 V, 37 A, PF 0.763 → 22.9 kW
    const r = okValue(clampMeterPower.run({ phase: 'three', voltageV: 469.7, currentA: 37, powerFactor: 0.763 }));
    expectWithin(r.kw, 22.9, 0.1);
    expect(r.powerFactorAssumed).toBe(false);
    // constructed: kVA = 469.7 × 37 × √3 / 1000 = 30.1011
    expectWithin(r.kva, 30.1011, 1e-4);
  });

  it('single-phase: reproduces the UConn ITAC example, 15 A at 480 V = 7.2 kW, 57.6 kWh in 8 h', () => {
    // Source: UConn ITAC training notes, "Power and Energy": P = 15 A × 480 V = 7,200 W = 7.2 kW; 7.2 kW × 8 h = 57.6 kWh
    const r = okValue(clampMeterPower.run({ phase: 'single', voltageV: 480, currentA: 15, powerFactor: 1, hoursPerYear: 8 }));
    expectExact(r.kw, 7.2);
    expectExact(r.kwhPerYear, 57.6);
  });

  it('assumes PF = 1 when none is given and flags the upper bound', () => {
    // constructed: 120 V × 6.5 A = 780 VA; without PF the result is 0.78 kW, an upper bound
    const out = clampMeterPower.run({ phase: 'single', voltageV: 120, currentA: 6.5 });
    const r = okValue(out);
    expectExact(r.kw, 0.78);
    expect(r.powerFactorAssumed).toBe(true);
    expect(out.ok && out.notes.join(' ')).toContain('upper bound');
  });

  it('costs the annual energy', () => {
    // constructed: 0.78 kW × 2,000 h = 1,560 kWh × $0.10 = $156
    const r = okValue(clampMeterPower.run({ phase: 'single', voltageV: 120, currentA: 6.5, powerFactor: 1, hoursPerYear: 2000, priceUsdPerKwh: 0.1 }));
    expectExact(r.kwhPerYear, 1560);
    expectExact(r.usdPerYear, 156);
  });

  it('three-phase kVA is √3 times single-phase kVA at the same V and I', () => {
    expectExact(apparentPowerKva('three', 208, 10) / apparentPowerKva('single', 208, 10), Math.sqrt(3));
  });

  it('rejects PF > 1, negative current and an unknown phase, naming the field', () => {
    expectInvalidField(clampMeterPower.run({ phase: 'single', voltageV: 120, currentA: 5, powerFactor: 1.2 }), 'powerFactor', 'Power factor must be at most 1');
    expectInvalidField(clampMeterPower.run({ phase: 'single', voltageV: 120, currentA: -5 }), 'currentA', 'Current');
    expectInvalidField(clampMeterPower.run({ phase: 'two', voltageV: 120, currentA: 5 }), 'phase', 'single, three');
    expectInvalidField(clampMeterPower.run({ phase: 'single', currentA: 5 }), 'voltageV', 'Voltage (V) is required');
  });
});
