import { describe, expect, it } from 'vitest';
import { DEG, SECOND_OF_TIME_ANGLE } from '../../core/units.ts';
import { reduceToMeanWire, wireHourAngleIntervalRad, STELLAR_REVOLUTIONS_PER_UT1_DAY } from '../../core/instrument/wire-reduction.ts';
import type { WireObservation } from '../../core/instrument/wire-reduction.ts';

// H. E. Burton, Theory of the astronomical transit instrument applied to the portable transit
// instrument Wuerdemann no. 26 (1903), p. 64: θ Boötis, δ = +52° 17′ 3.4″, fifteen wires C1…E5,
// published mean 14h 22m 31.5s (times below in seconds after 14h 21m).
const THETA_BOOTIS_S = [23, 32, 40.5, 49, 57.5, 74, 83, 91.5, 100, 109, 125.5, 134, 142.5, 151.5, 160];
const THETA_BOOTIS_DEC = (52 + 17 / 60 + 3.4 / 3600) * DEG;
const PUBLISHED_MEAN_S = 60 + 31.5; // 14h 22m 31.5s after 14h 21m

/** Symmetric equatorial intervals consistent with the observed spacings (the text does not list them). */
function symmetricIntervalsS(times: readonly number[], declinationRad: number): number[] {
  // Wire k and wire n−1−k are symmetric about the middle wire: half their separation, made equatorial.
  return times.map((t, k) => ((times[times.length - 1 - k] - t) / 2) * Math.cos(declinationRad));
}

describe('reduceToMeanWire', () => {
  const intervals = symmetricIntervalsS(THETA_BOOTIS_S, THETA_BOOTIS_DEC);
  const wires: WireObservation[] = THETA_BOOTIS_S.map((t, k) => ({ wireIndex: k, clockTimeS: t }));

  it('reproduces Burton (1903) p. 64: θ Boötis mean 14h 22m 31.5s from 15 wires (published to 0.1 s)', () => {
    const r = reduceToMeanWire(wires, intervals, THETA_BOOTIS_DEC, 'upper', 'west', 'sidereal');
    expect(Math.abs(r.meanWireTimeS - PUBLISHED_MEAN_S)).toBeLessThan(0.05 + 1e-9);
    expect(r.wireCount).toBe(15);
    // Residuals of the individual wires are the half-second estimation of the observer.
    for (const v of r.residualsS) expect(Math.abs(v)).toBeLessThan(0.75);
    expect(r.standardErrorS).not.toBeNull();
  });

  it('tolerates missing wires: dropping five wires moves the mean by less than its standard error × 3', () => {
    const full = reduceToMeanWire(wires, intervals, THETA_BOOTIS_DEC, 'upper', 'west', 'sidereal');
    const partial = reduceToMeanWire(wires.filter((w) => ![0, 1, 2, 3, 9].includes(w.wireIndex)), intervals, THETA_BOOTIS_DEC, 'upper', 'west', 'sidereal');
    expect(partial.wireCount).toBe(10);
    expect(Math.abs(partial.meanWireTimeS - full.meanWireTimeS)).toBeLessThan(3 * partial.standardErrorS!);
    // The naive mean of the remaining wires would be far off (the wires are not symmetric any more).
    const naive = wires.filter((w) => ![0, 1, 2, 3, 9].includes(w.wireIndex)).reduce((s, w) => s + w.clockTimeS, 0) / 10;
    expect(Math.abs(naive - full.meanWireTimeS)).toBeGreaterThan(10);
  });

  it('reverses the sign at lower culmination and with clamp east (the star or reticle runs the other way)', () => {
    const one = [{ wireIndex: 0, clockTimeS: 100 }];
    const upper = reduceToMeanWire(one, [10], 0, 'upper', 'west', 'sidereal').meanWireTimeS;
    const lower = reduceToMeanWire(one, [10], 80 * DEG, 'lower', 'west', 'sidereal').meanWireTimeS;
    const east = reduceToMeanWire(one, [10], 0, 'upper', 'east', 'sidereal').meanWireTimeS;
    expect(upper).toBeCloseTo(110, 9);
    expect(east).toBeCloseTo(90, 9);
    expect(lower).toBeLessThan(100);
  });

  it('a mean-solar clock sees the interval shortened by the ratio 1.002 737 811 911 (IERS Conventions 2010, eq. 5.15)', () => {
    const sidereal = reduceToMeanWire([{ wireIndex: 0, clockTimeS: 0 }], [30], 0, 'upper', 'west', 'sidereal').meanWireTimeS;
    const solar = reduceToMeanWire([{ wireIndex: 0, clockTimeS: 0 }], [30], 0, 'upper', 'west', 'mean-solar').meanWireTimeS;
    expect(sidereal / solar).toBeCloseTo(STELLAR_REVOLUTIONS_PER_UT1_DAY, 12);
  });

  it('names a wire the instrument does not have', () => {
    expect(() => reduceToMeanWire([{ wireIndex: 7, clockTimeS: 0 }], [1, 2], 0, 'upper', 'west', 'sidereal')).toThrow(/wire index 7/);
  });
});

describe('wireHourAngleIntervalRad: the exact small-circle form sin I = sin i sec δ', () => {
  it('puts the star at great-circle distance i from the meridian plane (vector check, exact geometry)', () => {
    for (const decDeg of [0, 45, 80, 88, 89.5]) {
      const dec = decDeg * DEG;
      const i = 20 * SECOND_OF_TIME_ANGLE;
      const hourAngle = wireHourAngleIntervalRad(i, dec);
      // Star at hour angle h: unit vector (cos δ cos h, −cos δ sin h, sin δ); the meridian plane's normal is (0, 1, 0).
      const distance = Math.asin(Math.cos(dec) * Math.sin(hourAngle));
      expect(Math.abs(distance - i)).toBeLessThan(1e-15);
    }
  });
  it('differs from i sec δ near the pole (δ = 89.5°, i = 20 s: the arc is a small circle)', () => {
    const dec = 89.5 * DEG;
    const i = 20 * SECOND_OF_TIME_ANGLE;
    const exact = wireHourAngleIntervalRad(i, dec);
    expect(Math.abs(exact - i / Math.cos(dec)) / SECOND_OF_TIME_ANGLE).toBeGreaterThan(0.1);
  });
  it('refuses a wire the star never reaches', () => {
    expect(() => wireHourAngleIntervalRad(1 * DEG, 89.9 * DEG)).toThrow(/never reaches/);
  });
});
