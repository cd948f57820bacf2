import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { illuminanceCheck } from '../../../src/lib/field/illuminance-check';
import { ILLUMINANCE_REFERENCES, findIlluminanceReference } from '../../../src/lib/field/illuminance-levels';
import { footCandlesToLux, luxToFootCandles } from '../../../src/lib/field/units';
import { expectInvalidField, expectWithin, okValue } from './expect-helpers';

describe('illuminance units', () => {
  it('converts 50 fc to 538.2 lx', () => {
    // Source: definition of the international foot (0.3048 m): 1 fc = 1 lm/ft² = 1/0.09290304 lx = 10.76391 lx (NIST SP 811 [memory])
    expectWithin(footCandlesToLux(50), 538.2, 0.1);
    expectWithin(luxToFootCandles(10.76391), 1, 1e-6);
  });
});

describe('reference levels', () => {
  it('holds the 41 CFR 102-74.180 levels', () => {
    // Source: 41 CFR 102-74.180(a)–(c), copied to tests/fixtures/field/illuminance-41cfr102-74-180.csv:
    // work-station 50, work area 30, non-work 10, elevator boarding 5, corridor middle 1, storage 10 fc
    const csv = readFileSync(new URL('../../fixtures/field/illuminance-41cfr102-74-180.csv', import.meta.url), 'utf8');
    const rows = csv.trim().split('\n').slice(1).map((line) => line.split(','));
    expect(rows).toHaveLength(6);
    for (const [id, , fc] of rows) {
      expect(findIlluminanceReference(id as string)).toMatchObject({ kind: 'minimum', minimumFc: Number(fc) });
    }
  });

  it('holds IES category D as 20–30–50 fc', () => {
    // Source: IESNA Lighting Handbook 8th/9th ed. categories (reproduction): D = 200–300–500 lx (20–30–50 fc)
    expect(findIlluminanceReference('ies-category-d')).toMatchObject({ kind: 'range', lowFc: 20, targetFc: 30, highFc: 50 });
    // The handbook pairs lux and fc with a nominal factor of 10 (300 lx ~ 30 fc); the fc values are used here.
  });

  it('cites only government, standards-body and university sources', () => {
    for (const ref of ILLUMINANCE_REFERENCES) {
      expect(['regulation', 'government', 'standards-body', 'university']).toContain(ref.source.kind);
    }
  });
});

describe('illuminance check', () => {
  it('finds a 250 lx work area below the 30 fc federal level', () => {
    // Source: 41 CFR 102-74.180(b): work areas 30 fc at 30 in above the floor. 250 lx = 23.2 fc.
    const r = okValue(illuminanceCheck.run({ referenceId: 'federal-work-area', measuredLux: 250 }));
    expectWithin(r.measuredFc, 23.23, 0.01);
    expect(r.status).toBe('below');
  });

  it('finds a 50 fc work-station surface meeting the federal level', () => {
    // Source: 41 CFR 102-74.180(a): work-station surfaces 50 fc
    const r = okValue(illuminanceCheck.run({ referenceId: 'federal-work-station', measuredFc: 50 }));
    expect(r.status).toBe('meets');
    expect(r.ratioToReference).toBe(1);
  });

  it('places readings below, within and above an IES range', () => {
    // Source: IES category D 20–30–50 fc
    const status = (fc: number) => okValue(illuminanceCheck.run({ referenceId: 'ies-category-d', measuredFc: fc })).status;
    expect([status(15), status(20), status(50), status(65)]).toEqual(['below', 'within', 'within', 'above']);
  });

  it('applies the UFC ±10 % band to a 10 fc waiting area', () => {
    // Source: UFC 3-530-01 (2006): waiting areas 100 lx (10 fc) horizontal ±10 %
    const status = (fc: number) => okValue(illuminanceCheck.run({ referenceId: 'ufc-waiting-area', measuredFc: fc })).status;
    expect([status(8.9), status(9.5), status(11), status(11.2)]).toEqual(['below', 'within', 'within', 'above']);
  });

  it('rejects unknown spaces and double readings, naming the field', () => {
    expectInvalidField(illuminanceCheck.run({ referenceId: 'ballroom', measuredFc: 20 }), 'referenceId', 'Space type');
    expectInvalidField(illuminanceCheck.run({ referenceId: 'ies-category-d', measuredFc: 20, measuredLux: 215 }), 'measuredFc', 'exactly one');
    expectInvalidField(illuminanceCheck.run({ referenceId: 'ies-category-d', measuredFc: -1 }), 'measuredFc', 'at least 0');
  });
});
