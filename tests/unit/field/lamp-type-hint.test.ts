import { describe, expect, it } from 'vitest';
import { lampTypeHint } from '../../../src/lib/field/lamp-type-hint';
import { expectInvalidField, expectWithin, okValue } from './expect-helpers';

// The thresholds are a heuristic built from informal lamp readings (not a published method), so these
// are constructed vectors: they pin the heuristic, they do not check it against an outside source.
describe('lamp type hint', () => {
  const at77F = (surfaceTempF: number, surface = 'glass_or_diffuser') => okValue(lampTypeHint.run({ surfaceTempF, ambientTempF: 77, surface }));

  it('hints LED for a 98 °F diffuser in a 77 °F room (rise 11.7 K)', () => {
    // constructed: informal reading of a 60 W-equivalent LED bulb, 98 °F
    const r = at77F(98);
    expectWithin(r.riseK, 11.67, 0.01);
    expect(r.hint).toBe('led');
    expect(r.isHint).toBe(true);
  });

  it('leaves a 157 °F CFL in the middle band (rise 44 K)', () => {
    // constructed: informal reading of a 60 W-equivalent CFL, 157 °F
    expect(at77F(157).hint).toBe('fluorescent_or_cfl_or_undetermined');
  });

  it('hints incandescent or halogen for a 300 °F bulb (rise 124 K)', () => {
    // constructed: informal average reading of an incandescent bulb, about 300 °F
    expect(at77F(300).hint).toBe('incandescent_or_halogen');
  });

  it('draws no hint from a metal base or heat sink', () => {
    // constructed: a reading near an LED base of 160 °F was hotter than an incandescent base; metal misleads
    const out = lampTypeHint.run({ surfaceTempF: 160, ambientTempF: 77, surface: 'metal_base_or_heat_sink' });
    expect(okValue(out).hint).toBe('undetermined');
    expect(out.ok && out.notes.join(' ')).toContain('tape');
  });

  it('works from a rise, so a warm room does not turn an LED into a CFL', () => {
    // constructed: 60 °C diffuser in a 35 °C ceiling space: rise 25 K → LED
    expect(okValue(lampTypeHint.run({ surfaceTempC: 60, ambientTempC: 35, surface: 'glass_or_diffuser' })).hint).toBe('led');
  });

  it('needs one surface and one room temperature, naming the field', () => {
    expectInvalidField(lampTypeHint.run({ ambientTempF: 77, surface: 'glass_or_diffuser' }), 'surfaceTempF', 'exactly one');
    expectInvalidField(lampTypeHint.run({ surfaceTempF: 120, surface: 'glass_or_diffuser' }), 'ambientTempF', 'exactly one');
  });
});
