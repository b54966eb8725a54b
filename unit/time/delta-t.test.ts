import { DeltaT_EspenakMeeus } from 'astronomy-engine';
import { describe, expect, it } from 'vitest';
import { deltaTSeconds, deltaTSecondsAtDecimalYear } from '../../core/time/delta-t.ts';
import { calendarToJulianDate } from '../../core/time/julian-date.ts';

describe('deltaTSecondsAtDecimalYear (Espenak & Meeus 2006 polynomials)', () => {
  it('equals astronomy-engine DeltaT_EspenakMeeus (an independent transcription) to 1 µs over −600 … 2200', () => {
    const daysPerTropicalYear = 365.24217; // astronomy-engine's conversion of its ut to the decimal year
    for (let ut = -950_000; ut < 75_000; ut += 1234.5) {
      const y = 2000 + (ut - 14) / daysPerTropicalYear;
      expect(Math.abs(deltaTSecondsAtDecimalYear(y) - DeltaT_EspenakMeeus(ut))).toBeLessThan(1e-6);
    }
  });

  it('gives the canon’s values at the polynomial epochs (NASA/TP-2006-214141 §2.6)', () => {
    expect(deltaTSecondsAtDecimalYear(1900)).toBeCloseTo(-2.79, 10);
    expect(deltaTSecondsAtDecimalYear(1950)).toBeCloseTo(29.07, 10);
    expect(deltaTSecondsAtDecimalYear(1975)).toBeCloseTo(45.45, 10);
    expect(deltaTSecondsAtDecimalYear(2000)).toBeCloseTo(63.86, 10);
  });

  it('deltaTSeconds at 1990.0 is within 0.5 s of the measured 56.86 s (IERS, from memory)', () => {
    expect(Math.abs(deltaTSeconds(calendarToJulianDate(1990, 1, 1)) - 56.86)).toBeLessThan(0.5);
  });
});
