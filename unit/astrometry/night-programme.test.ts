import { describe, expect, it } from 'vitest';
import { iauEarthOrientation } from '../../core/astrometry/iau-earth-orientation.ts';
import { nightProgramme } from '../../core/astrometry/night-programme.ts';
import { starMotion } from '../../core/astrometry/space-motion.ts';
import { predictTransit } from '../../core/astrometry/transit.ts';
import { BUNDLED_LEAP_SECONDS } from '../../core/time/bundled-leap-seconds.ts';
import { TimeScale } from '../../core/time/timescale.ts';
import { DEG } from '../../core/units.ts';

// Invented observatory and stars (demo scenario style), checked only for internal consistency.
const scale = new TimeScale(BUNDLED_LEAP_SECONDS);
const instants = (utc: { jd1: number; jd2: number }) => scale.fromUtc(utc);
const site = { latitudeRad: 46.2 * DEG, longitudeRad: 7.4 * DEG, heightM: 820 };
const weather = { pressureHpa: 925, temperatureC: 5, relativeHumidity: 0.6, wavelengthUm: 0.6 };
const stars = [10, 95, 180, 250, 330].map((raDeg, k) => starMotion({
  raRad: raDeg * DEG, decRad: (20 + 12 * k) * DEG, pmRaCosDecMasYr: 30, pmDecMasYr: -10,
  parallaxMas: 12, radialVelocityKmS: 0, epochJulianYear: 2016,
}));

describe('nightProgramme(...)', () => {
  const from = { jd1: 2460736.5, jd2: 0.7 }; // 2025-03-02 16:48 UTC
  const until = { jd1: 2460736.5, jd2: 1.3 }; // 14.4 hours later
  const entries = nightProgramme(stars, site, weather, from, until, ['upper', 'lower'], instants, iauEarthOrientation);

  it('lists transits inside the window in time order, each equal to predictTransit from the window start', () => {
    expect(entries.length).toBeGreaterThan(3);
    let previous = -Infinity;
    for (const entry of entries) {
      const t = entry.prediction.utc.jd1 + entry.prediction.utc.jd2;
      expect(t).toBeGreaterThanOrEqual(previous);
      expect(t).toBeGreaterThan(from.jd1 + from.jd2);
      expect(t).toBeLessThanOrEqual(until.jd1 + until.jd2);
      previous = t;
      expect(entry.prediction.place.topocentricZenithRad).toBeLessThan(Math.PI / 2);
      const alone = predictTransit(stars[entry.starIndex], site, weather, from, entry.prediction.culmination, instants, iauEarthOrientation);
      expect(Math.abs(alone.utc.jd1 + alone.utc.jd2 - t) * 86400).toBeLessThan(1e-6);
    }
  });

  it('gives each star at least once in a 14.4 h window when both culminations are asked and kept', () => {
    const all = nightProgramme(stars, site, weather, from, until, ['upper', 'lower'], instants, iauEarthOrientation, true);
    for (let k = 0; k < stars.length; k++) expect(all.some((e) => e.starIndex === k)).toBe(true);
    expect(all.length).toBeGreaterThan(entries.length);
  });

  it('refuses an empty window', () => {
    expect(() => nightProgramme(stars, site, weather, until, from, ['upper'], instants, iauEarthOrientation)).toThrow(/untilUtc must be later/);
  });
});
