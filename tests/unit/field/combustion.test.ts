import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { checkCoAirFree, coAirFreePpm } from '../../../src/lib/field/co-air-free';
import { combustionEfficiency } from '../../../src/lib/field/combustion-efficiency';
import {
  DOE_TABLE_EFFICIENCY_PERCENT,
  DOE_TABLE_EXCESS_AIR_PERCENT,
  DOE_TABLE_NET_STACK_F,
  DOE_TABLE_O2_PERCENT,
  combustionTuneUpSavings,
  doeNaturalGasCombustionEfficiency,
} from '../../../src/lib/field/doe-combustion-table';
import { excessAirPercent } from '../../../src/lib/field/excess-air';
import { SIEGERT_CONSTANTS, siegertFlueGasLossPercent, siegertLossLimitPercent } from '../../../src/lib/field/siegert';
import { expectInvalidField, expectWithin, failureOf, okValue } from './expect-helpers';

function readCsv(name: string): string[][] {
  const text = readFileSync(new URL(`../../fixtures/field/${name}`, import.meta.url), 'utf8');
  return text.trim().split('\n').slice(1).map((line) => line.match(/("[^"]*"|[^,]+|(?<=,)(?=,))/g) ?? []);
}

describe('DOE natural-gas combustion-efficiency table', () => {
  it('matches the table of DOE Steam Tip Sheet #4 at every grid point', () => {
    // Source: U.S. DOE Steam Tip Sheet #4 (Jan 2006), "Combustion Efficiency for Natural Gas", copied to
    // tests/fixtures/field/doe-steam-tip-4-natural-gas.csv
    const rows = readCsv('doe-steam-tip-4-natural-gas.csv');
    expect(rows).toHaveLength(5);
    rows.forEach((row, i) => {
      expect(Number(row[0])).toBe(DOE_TABLE_EXCESS_AIR_PERCENT[i]);
      expect(Number(row[1])).toBe(DOE_TABLE_O2_PERCENT[i]);
      DOE_TABLE_NET_STACK_F.forEach((tempF, j) => {
        const published = Number(row[2 + j]);
        expect(DOE_TABLE_EFFICIENCY_PERCENT[i]?.[j]).toBe(published);
        const lookup = doeNaturalGasCombustionEfficiency(DOE_TABLE_O2_PERCENT[i] as number, tempF);
        expect(lookup).toEqual({ ok: true, efficiencyPercent: published, interpolated: false });
      });
    });
  });

  it('gives the published tune-up efficiencies E1 = 78.2 % and E2 = 83.1 %', () => {
    // Source: DOE Steam Tip Sheet #4 example: 44.9 % excess air (7 % O2), ΔT 400 °F → 78.2 %;
    // 9.5 % excess air (2 % O2), ΔT 300 °F → 83.1 %
    expect(doeNaturalGasCombustionEfficiency(7, 400)).toMatchObject({ ok: true, efficiencyPercent: 78.2 });
    expect(doeNaturalGasCombustionEfficiency(2, 300)).toMatchObject({ ok: true, efficiencyPercent: 83.1 });
  });

  it('reproduces the tip-sheet savings: 29,482 MMBtu/yr and $235,856/yr', () => {
    // Source: DOE Steam Tip Sheet #4: 500,000 MMBtu/yr × (1 − 78.2/83.1) = 29,482 MMBtu/yr; × $8.00 = $235,856
    const s = combustionTuneUpSavings(500_000, 78.2, 83.1, 8);
    expectWithin(s.savedMMBtu, 29_482, 1);
    expectWithin(s.savedUsd, 235_856, 10);
  });

  it('interpolates between grid points and refuses to extrapolate', () => {
    // constructed: midway between 2 % and 3 % O2 at ΔT 250 °F: mean of 85.4, 83.1, 85.2, 82.8 = 84.125
    expect(doeNaturalGasCombustionEfficiency(2.5, 250)).toEqual({ ok: true, efficiencyPercent: 84.125, interpolated: true });
    expect(doeNaturalGasCombustionEfficiency(1.5, 300)).toMatchObject({ ok: false, reason: 'outside-table-range' });
    expect(doeNaturalGasCombustionEfficiency(3, 650)).toMatchObject({ ok: false, reason: 'outside-table-range' });
  });
});

describe('excess air from O2', () => {
  it('gives 15 % excess air at 3 % O2 for natural gas', () => {
    // Source: Handbook of Energy Engineering Calculations p. 56 (V. Ganapathy): EA = 90 × 3 / (21 − 3) = 15 %
    expectWithin(excessAirPercent('natural_gas', 3), 15, 0.05);
  });

  it('agrees with the excess-air column of the DOE table within 0.4 points', () => {
    // Source: DOE Steam Tip Sheet #4 excess-air column (9.5, 15.0, 28.1, 44.9, 81.6 % at 2, 3, 5, 7, 10 % O2)
    DOE_TABLE_O2_PERCENT.forEach((o2, i) => {
      expectWithin(excessAirPercent('natural_gas', o2), DOE_TABLE_EXCESS_AIR_PERCENT[i] as number, 0.4);
    });
  });

  it('has no excess-air constant for propane', () => {
    expect(excessAirPercent('propane', 4)).toBeNull();
  });
});

describe('Siegert flue-gas loss (1. BImSchV, net basis)', () => {
  it('uses the fuel constants of Anlage 2 Nr. 3.4.1', () => {
    // Source: 1. BImSchV Anlage 2 Nr. 3.4.1, copied to tests/fixtures/field/siegert-1-bimschv.csv
    const byFuel = new Map(readCsv('siegert-1-bimschv.csv').filter((r) => r[1] !== '').map((r) => [r[1], { A: Number(r[2]), B: Number(r[3]) }]));
    for (const [fuel, constants] of Object.entries(SIEGERT_CONSTANTS)) {
      expect(byFuel.get(fuel)).toEqual({ A: constants.A, B: constants.B });
    }
  });

  it('gives 5.94 % for gas and 7.52 % for oil (constructed from the regulation formula)', () => {
    // constructed (regression): 130 K × (0.66/18 + 0.009) = 5.9367 %; 160 K × (0.68/17 + 0.007) = 7.52 %
    expectWithin(siegertFlueGasLossPercent('natural_gas', 150, 20, 3), 5.94, 0.01);
    expectWithin(siegertFlueGasLossPercent('fuel_oil_2', 180, 20, 4), 7.52, 0.01);
  });

  it('applies the §10(1) limits by rated output: 11 / 10 / 9 %', () => {
    // Source: 1. BImSchV §10(1): 4–25 kW 11 %, 25–50 kW 10 %, over 50 kW 9 %
    expect([20, 30, 60].map(siegertLossLimitPercent)).toEqual([11, 10, 9]);
    expect(siegertLossLimitPercent(3)).toBeNull();
  });
});

describe('air-free CO', () => {
  it('reproduces the published furnace example: 75 ppm and 1680 ppm air-free', () => {
    // Source: HVAC Today, "CO Air Free and As Measured" (citing ANSI Z21): O2 7 %, CO 50 ppm → 75 ppm air-free;
    // O2 6 %, CO 1200 ppm → 1680 ppm air-free (exact arithmetic 75.2 and 1683.2)
    expectWithin(coAirFreePpm(50, 7), 75, 1);
    expectWithin(coAirFreePpm(1200, 6), 1680, 5);
  });

  it('flags 450 ppm air-free on a vented furnace against the 400 ppm ANSI Z21 limit', () => {
    // Source: ANSI Z21 air-free limits as quoted by HVAC Today: 400 ppm vented heating, 200 ppm unvented/water heaters, 800 ppm ovens
    expect(checkCoAirFree(450, 'vented_heating')).toEqual({ limitPpm: 400, exceedsLimit: true, exceedsPracticeTarget: true });
    expect(checkCoAirFree(450, 'unvented_oven').exceedsLimit).toBe(false);
    expect(checkCoAirFree(250, 'unvented_or_residential_water_heater').exceedsLimit).toBe(true);
  });
});

describe('combustion-efficiency calculator', () => {
  it('reports the DOE (HHV) and Siegert (LHV) results separately, each labelled', () => {
    // Source: DOE Steam Tip Sheet #4: 2 % O2, net 300 °F → 83.1 % (gross basis [memory]).
    // constructed: Siegert at 2 % O2, 166.67 K: loss 166.67 × (0.66/19 + 0.009) = 7.29 %, 92.71 % net
    const r = okValue(combustionEfficiency.run({ fuel: 'natural_gas', o2PercentDry: 2, stackTempF: 370, combustionAirTempF: 70 }));
    const doe = r.estimates.find((e) => e.method === 'doe-steam-tip-4-table');
    const siegert = r.estimates.find((e) => e.method === 'siegert-1-bimschv');
    expect(doe).toMatchObject({ basis: 'HHV (gross)', efficiencyPercent: 83.1, interpolated: false });
    expect(siegert?.basis).toBe('LHV (net)');
    expectWithin(siegert?.lossPercent, 7.29, 0.01);
    expectWithin(siegert?.efficiencyPercent, 92.71, 0.01);
    expect(r.netStackTempF).toBe(300);
  });

  it('accepts °C readings and gives the same answer as °F', () => {
    // constructed: 150 °C stack, 20 °C air (302 °F, 68 °F) at 3 % O2 → Siegert loss 5.94 %
    const c = okValue(combustionEfficiency.run({ fuel: 'natural_gas', o2PercentDry: 3, stackTempC: 150, combustionAirTempC: 20 }));
    const f = okValue(combustionEfficiency.run({ fuel: 'natural_gas', o2PercentDry: 3, stackTempF: 302, combustionAirTempF: 68 }));
    expectWithin(c.estimates[0]?.lossPercent, 5.94, 0.01);
    expectWithin(f.estimates[0]?.lossPercent, c.estimates[0]?.lossPercent as number, 1e-9);
  });

  it('gives oil no DOE-table value and says why', () => {
    const r = okValue(combustionEfficiency.run({ fuel: 'fuel_oil_2', o2PercentDry: 4, stackTempC: 180, combustionAirTempC: 20 }));
    expect(r.estimates.map((e) => e.method)).toEqual(['siegert-1-bimschv']);
    expect(r.unavailable[0]?.reason).toContain('natural gas only');
  });

  it('corrects CO to air-free and flags the appliance limit', () => {
    // Source: HVAC Today example, O2 6 %, CO 1200 ppm → 1680 ppm air-free, above the 400 ppm vented-heating limit
    const out = combustionEfficiency.run({ fuel: 'natural_gas', o2PercentDry: 6, stackTempF: 420, combustionAirTempF: 70, coPpm: 1200 });
    const r = okValue(out);
    expectWithin(r.co?.airFreePpm, 1680, 5);
    expect(r.co?.check.exceedsLimit).toBe(true);
    expect(out.ok && out.notes.join(' ')).toContain('licensed service technician');
  });

  it('rejects a stack colder than the combustion air as a reason', () => {
    expect(failureOf(combustionEfficiency.run({ fuel: 'natural_gas', o2PercentDry: 3, stackTempF: 60, combustionAirTempF: 70 })).reason).toBe('stack-not-above-combustion-air');
  });

  it('rejects O2 at or above 20.9 % and missing temperatures, naming the field', () => {
    expectInvalidField(combustionEfficiency.run({ fuel: 'natural_gas', o2PercentDry: 21, stackTempF: 400, combustionAirTempF: 70 }), 'o2PercentDry', 'Flue-gas O2 (%) must be less than 20.9');
    expectInvalidField(combustionEfficiency.run({ fuel: 'natural_gas', o2PercentDry: 3, combustionAirTempF: 70 }), 'stackTempF', 'exactly one');
    expectInvalidField(combustionEfficiency.run({ fuel: 'coal', o2PercentDry: 3, stackTempF: 400, combustionAirTempF: 70 }), 'fuel', 'natural_gas');
  });
});
