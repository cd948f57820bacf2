import { describe, expect, it } from 'vitest';
import { FLOW_LIMITS, FLUSH_LIMITS, troughUrinalMaxGalPerFlush } from '../../../src/lib/field/fixture-standards';
import { bagFillFlowGpm, fixtureFlowTest } from '../../../src/lib/field/fixture-flow-test';
import { expectExact, expectInvalidField, expectWithin, okValue } from './expect-helpers';

describe('bag-fill flow', () => {
  it('gives 3.0 gpm for 1 gallon in 20 seconds', () => {
    // Source: New Hampshire DES: "60 seconds / # of seconds recorded × 1 gallon = gallons/minute"
    const r = okValue(fixtureFlowTest.run({ fixtureType: 'showerhead', volumeGal: 1, durationS: 20 }));
    expectExact(r.flowGpm, 3);
  });

  it('gives 10.2 L/min for 0.85 L in 5 seconds', () => {
    // Source: Hydro-Québec, "How to check water flow": collect for 5 s and multiply by 12; 0.85 L → 10.2 L/min
    const r = okValue(fixtureFlowTest.run({ fixtureType: 'showerhead', volumeLiters: 0.85, durationS: 5 }));
    expectExact(r.flowLitersPerMin, 10.2);
    // 10.2 L/min ÷ 3.785411784 L/gal = 2.6946 gpm
    expectWithin(r.flowGpm, 2.6946, 0.0001);
  });

  it('passes a showerhead filling 64 oz in 15 s at exactly the WaterSense 2.0 gpm', () => {
    // Source: EPA WaterSense new-home checklist (NEPIS P10180T5): a showerhead passes if no more than
    // 0.5 gal (64 oz) is collected in 15 s, i.e. 2.0 gpm
    const r = okValue(fixtureFlowTest.run({ fixtureType: 'showerhead', volumeFlOz: 64, durationS: 15 }));
    expectExact(r.flowGpm, 2);
    expect(r.meetsWaterSense).toBe(true);
    expect(okValue(fixtureFlowTest.run({ fixtureType: 'showerhead', volumeFlOz: 66, durationS: 15 })).meetsWaterSense).toBe(false);
  });

  it('gives 2.5 gpm for 16 oz in 3 s (constructed: 16/128 gal × 60/3)', () => {
    expectExact(bagFillFlowGpm(16 / 128, 3), 2.5);
  });
});

describe('comparison with federal and WaterSense levels', () => {
  it('flags a 2.8 gpm showerhead above the 2.5 gpm federal maximum', () => {
    // Source: 10 CFR 430.32(p): showerheads 2.5 gpm at 80 psi. 2.8 gpm = 1.4 gal in 30 s.
    const r = okValue(fixtureFlowTest.run({ fixtureType: 'showerhead', volumeGal: 1.4, durationS: 30 }));
    expectExact(r.flowGpm, 2.8);
    expect(r.exceedsFederalMaximum).toBe(true);
    expect(r.meetsWaterSense).toBe(false);
  });

  it('passes a 1.4 gpm lavatory faucet against 2.2 gpm federal and 1.5 gpm WaterSense, not the 0.5 gpm public-restroom level', () => {
    // Source: 10 CFR 430.32(o) lavatory faucets 2.2 gpm at 60 psi; EPA WaterSense lavatory faucets 1.5 gpm;
    // EPA WaterSense at Work p. 75: 0.5 gpm in public restrooms. 1.4 gpm = 0.7 gal in 30 s.
    const r = okValue(fixtureFlowTest.run({ fixtureType: 'lavatory_faucet', volumeGal: 0.7, durationS: 30 }));
    expect(r.exceedsFederalMaximum).toBe(false);
    expect(r.meetsWaterSense).toBe(true);
    const byId = Object.fromEntries(r.comparisons.map((c) => [c.limit.id, c]));
    expect(byId['federal-maximum']?.limit.maxGpm).toBe(2.2);
    expect(byId['watersense-maximum']?.limit.maxGpm).toBe(1.5);
    expect(byId['public-restroom-recommendation']?.exceeds).toBe(true);
  });

  it('has no WaterSense level for kitchen faucets', () => {
    // Source: DOE Building Science Education page: kitchen faucets are not WaterSense-labeled; federal 2.2 gpm (10 CFR 430.32(o))
    const r = okValue(fixtureFlowTest.run({ fixtureType: 'kitchen_faucet', volumeGal: 1, durationS: 30 }));
    expect(r.meetsWaterSense).toBeNull();
    expect(r.comparisons.map((c) => [c.limit.id, c.limit.maxGpm])).toEqual([['federal-maximum', 2.2]]);
  });

  it('states the federal maxima of 10 CFR 430.32 at their test pressures', () => {
    // Source: 10 CFR 430.32(o)–(r) (eCFR text): showerhead 2.5 gpm at 80 psi; faucets 2.2 gpm at 60 psi;
    // tank and flushometer-valve water closets 1.6 gpf; blowout 3.5 gpf; urinals 1.0 gpf; metering faucets 0.25 gal/cycle
    expect(FLOW_LIMITS.showerhead[0]).toMatchObject({ id: 'federal-maximum', maxGpm: 2.5, ratedPressurePsi: 80 });
    expect(FLOW_LIMITS.lavatory_faucet[0]).toMatchObject({ maxGpm: 2.2, ratedPressurePsi: 60 });
    expect(FLUSH_LIMITS.water_closet_tank.federalMaxGalPerFlush).toBe(1.6);
    expect(FLUSH_LIMITS.water_closet_flushometer_valve.federalMaxGalPerFlush).toBe(1.6);
    expect(FLUSH_LIMITS.water_closet_blowout.federalMaxGalPerFlush).toBe(3.5);
    expect(FLUSH_LIMITS.urinal).toMatchObject({ federalMaxGalPerFlush: 1.0, waterSenseMaxGalPerFlush: 0.5 });
    expect(FLUSH_LIMITS.metering_faucet.federalMaxGalPerFlush).toBe(0.25);
  });

  it('allows a 48 in trough urinal 3.0 gal per flush', () => {
    // Source: 10 CFR 430.32(r): trough urinals, 1.0 gal per flush per 16 in of length (constructed: 48/16 = 3.0)
    expect(troughUrinalMaxGalPerFlush(48)).toBe(3);
  });
});

describe('flow-test validation', () => {
  it('rejects negative or zero seconds, naming the field', () => {
    expectInvalidField(fixtureFlowTest.run({ fixtureType: 'showerhead', volumeGal: 1, durationS: -3 }), 'durationS', 'Fill time (s) must be greater than 0');
    expectInvalidField(fixtureFlowTest.run({ fixtureType: 'showerhead', volumeGal: 1, durationS: 0 }), 'durationS', 'greater than 0');
  });

  it('asks for exactly one volume', () => {
    expectInvalidField(fixtureFlowTest.run({ fixtureType: 'showerhead', durationS: 10 }), 'volumeGal', 'exactly one');
    expectInvalidField(fixtureFlowTest.run({ fixtureType: 'showerhead', volumeGal: 1, volumeLiters: 3.8, durationS: 10 }), 'volumeGal', 'exactly one');
  });
});
