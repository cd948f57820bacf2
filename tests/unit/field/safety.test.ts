import { describe, expect, it } from 'vitest';
import { CALCULATOR_IDS, HAZARD_IDS } from '../../../src/lib/field/calculator';
import { INSTRUMENT_TYPES } from '../../../src/lib/field/instruments';
import { HAZARDS, SAFETY_DEFERRAL, hazardById, hazardsForCalculator, hazardsForInstrument } from '../../../src/lib/field/safety';

const text = (id: (typeof HAZARD_IDS)[number]) => hazardById(id).cautions.join(' ');

describe('safety cautions', () => {
  it('covers every hazard id once, each with cautions', () => {
    expect(HAZARDS.map((h) => h.id).sort()).toEqual([...HAZARD_IDS].sort());
    for (const h of HAZARDS) expect(h.cautions.length).toBeGreaterThan(0);
  });

  it('defers to local codes and licensed practice, on every hazard', () => {
    expect(SAFETY_DEFERRAL).toContain('local codes');
    expect(SAFETY_DEFERRAL).toContain('licensed practice');
    for (const h of HAZARDS) expect(h.deferral).toBe(SAFETY_DEFERRAL);
  });

  it('requires qualified persons and PPE per NFPA 70E for live electrical readings', () => {
    expect(text('energized-electrical')).toContain('qualified person');
    expect(text('energized-electrical')).toContain('PPE');
    expect(hazardById('energized-electrical').references.map((r) => r.title).join(' ')).toContain('NFPA 70E');
  });

  it('warns about carbon monoxide during combustion testing', () => {
    expect(text('combustion-testing')).toContain('CO monitor');
  });

  it('warns never to reach toward a strobe-lit shaft and to keep guards on', () => {
    expect(text('rotating-machinery')).toContain('Never reach toward equipment lit by a strobe');
    expect(text('rotating-machinery')).toContain('guard');
  });

  it('tells the auditor to measure, not adjust', () => {
    expect(text('measure-do-not-adjust')).toContain('measures and records');
  });

  it('names only known calculators and instrument types', () => {
    for (const h of HAZARDS) {
      for (const c of h.appliesToCalculators) expect(CALCULATOR_IDS).toContain(c);
      for (const i of h.appliesToInstruments) expect(INSTRUMENT_TYPES).toContain(i);
    }
  });

  it('finds the hazards of an instrument and of a calculator', () => {
    expect(hazardsForInstrument('clamp_ammeter').map((h) => h.id)).toContain('energized-electrical');
    expect(hazardsForInstrument('stroboscope').map((h) => h.id)).toContain('rotating-machinery');
    expect(hazardsForInstrument('combustion_analyzer').map((h) => h.id)).toContain('combustion-testing');
    expect(hazardsForInstrument('tape_measure')).toEqual([]);
    expect(hazardsForCalculator('lamp-type-hint').map((h) => h.id).sort()).toEqual(['hot-surfaces', 'ladders']);
  });
});
