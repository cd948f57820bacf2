import { describe, expect, it } from 'vitest';
import {
  coolingDegreeDays,
  cToF,
  dailyMeanTemperature,
  degreeDaysCToF,
  degreeDaysFToC,
  fToC,
  heatingDegreeDays,
  US_BASE_C,
  US_BASE_F,
} from '../../../src/lib/weather';

describe('published degree-day values', () => {
  it('75/65 °F -> 5 CDD65', () => {
    // Source: NOAA/NWS definition as quoted by the Lawrence Journal-World, 3 Aug 2003
    const mean = dailyMeanTemperature(75, 65);
    expect(mean).toBe(70);
    expect(coolingDegreeDays(mean, US_BASE_F)).toBe(5);
    expect(heatingDegreeDays(mean, US_BASE_F)).toBe(0);
  });

  it('90/70 °F -> 15 CDD65', () => {
    // Source: City of Burlington NC, degree-day FAQ
    expect(coolingDegreeDays(dailyMeanTemperature(90, 70), 65)).toBe(15);
  });

  it('mean 40 °F -> 25 HDD65', () => {
    // Source: WGN-TV weather column, 29 Oct 2017
    expect(heatingDegreeDays(40, 65)).toBe(25);
    expect(coolingDegreeDays(40, 65)).toBe(0);
  });

  it('base 18 °C: 10 °C -> 8, -4 °C -> 22, 20 °C -> 0', () => {
    // Source: Statistics Netherlands (CBS) 2015, heating degree days at base 18 °C
    expect(heatingDegreeDays(10, 18)).toBe(8);
    expect(heatingDegreeDays(-4, 18)).toBe(22);
    expect(heatingDegreeDays(20, 18)).toBe(0);
  });
});

describe('temperature units', () => {
  it('converts scales and degree-day amounts', () => {
    // Source: definition of the scales: 65 °F = 18.333 °C; 212 °F = 100 °C; -40 is the same on both
    expect(US_BASE_C).toBeCloseTo(18.3333333, 6);
    expect(fToC(212)).toBeCloseTo(100, 12);
    expect(cToF(-40)).toBeCloseTo(-40, 12);
    // Source: definition: a difference of 9 °F equals 5 °C (degree days convert by × 5/9)
    expect(degreeDaysFToC(9)).toBeCloseTo(5, 12);
    expect(degreeDaysCToF(5)).toBeCloseTo(9, 12);
    // The same day counted in °F at 65 °F and in °C at 18.333 °C: 25 °F·day = 13.889 °C·day
    expect(heatingDegreeDays(fToC(40), US_BASE_C)).toBeCloseTo(degreeDaysFToC(25), 12);
  });
});
