import { describe, expect, it } from 'vitest';
import { refractionConstants } from '../../core/astrometry/refraction-constants.ts';
import {
  observedFromTrueZenith,
  refractionAtObserved,
  refractionWarning,
  trueFromObservedZenith,
} from '../../core/astrometry/refraction.ts';
import { observedPlace } from '../../core/astrometry/observed-place.ts';
import { placeContext } from '../../core/astrometry/place-context.ts';
import { starMotion } from '../../core/astrometry/space-motion.ts';
import { ARCSEC, DEG, UAS } from '../../core/units.ts';
import { loadErfaPlaceFixture } from './erfa-place-fixture.ts';

const fixture = loadErfaPlaceFixture();
const standard = { pressureHpa: 1013.25, temperatureC: 10, relativeHumidity: 0.5, wavelengthUm: 0.55 };

describe('refractionConstants(weather)', () => {
  it(`matches erfa.refco within 0.1% (ERFA ${fixture.header.erfaVersion}, ${fixture.refco.length} conditions)`, () => {
    for (const c of fixture.refco) {
      const ours = refractionConstants(c);
      expect(Math.abs(ours.aRad / c.aRad - 1), `A for ${JSON.stringify(c)}`).toBeLessThan(1e-3);
      expect(Math.abs(ours.bRad / c.bRad - 1), `B for ${JSON.stringify(c)}`).toBeLessThan(1e-3);
    }
  });

  it('gives about 58″ tan z at standard conditions (published rule of thumb, e.g. Green 1987 §4.3)', () => {
    const r45 = refractionAtObserved(45 * DEG, refractionConstants(standard));
    expect(r45 / ARCSEC).toBeGreaterThan(56);
    expect(r45 / ARCSEC).toBeLessThan(60);
  });

  it('reproduces the published 1005 hPa, 7 °C, 80 %, 0.574 µm table at z = 45° and 70° (58.18″, 158.68″; SOFA refco notes)', () => {
    const c = refractionConstants({ pressureHpa: 1005, temperatureC: 7, relativeHumidity: 0.8, wavelengthUm: 0.574 });
    expect(refractionAtObserved(45 * DEG, c) / ARCSEC).toBeCloseTo(58.18, 1);
    expect(refractionAtObserved(70 * DEG, c) / ARCSEC).toBeCloseTo(158.68, 1);
  });

  it('gives zero at zero pressure', () => {
    const c = refractionConstants({ ...standard, pressureHpa: 0 });
    expect(c.aRad).toBe(0);
    expect(c.bRad === 0).toBe(true);
  });

  it('rejects impossible input with a message naming the field', () => {
    expect(() => refractionConstants({ ...standard, relativeHumidity: 50 })).toThrow(/relativeHumidity.*divided by 100/);
    expect(() => refractionConstants({ ...standard, pressureHpa: -1 })).toThrow(/pressureHpa/);
    expect(() => refractionConstants({ ...standard, temperatureC: Number.NaN })).toThrow(/temperatureC/);
    expect(() => refractionConstants({ ...standard, wavelengthUm: 0 })).toThrow(/wavelengthUm/);
  });

  it('warns outside the tested range and not inside it', () => {
    expect(refractionConstants(standard).warnings).toEqual([]);
    expect(refractionConstants({ ...standard, pressureHpa: 300 }).warnings.join()).toMatch(/pressureHpa 300/);
    expect(refractionConstants({ ...standard, temperatureC: -60 }).warnings.join()).toMatch(/temperatureC -60/);
    expect(refractionConstants({ ...standard, wavelengthUm: 10 }).warnings.join()).toMatch(/wavelengthUm 10/);
  });
});

describe('observedFromTrueZenith / trueFromObservedZenith', () => {
  const constants = refractionConstants(standard);
  it('round-trips to < 1 µas for z from 0° to 85° (common practice: inverse consistent with forward)', () => {
    for (let zDeg = 0; zDeg <= 85; zDeg += 0.5) {
      const observed = observedFromTrueZenith(zDeg * DEG, constants);
      expect(Math.abs(trueFromObservedZenith(observed, constants) - zDeg * DEG)).toBeLessThan(1 * UAS);
      if (zDeg > 1) expect(observed).toBeLessThan(zDeg * DEG);
    }
  });

  it('warns beyond 75° and refuses the horizon', () => {
    expect(refractionWarning(70 * DEG)).toBeUndefined();
    expect(refractionWarning(78 * DEG)).toMatch(/78\.00° exceeds 75°/);
    expect(() => observedFromTrueZenith(90 * DEG, constants)).toThrow(/0–89\.5°/);
  });
});

describe('observedPlace refraction warnings', () => {
  it('warns beyond 75° and at the horizon (no refraction applied there), and not high in the sky', () => {
    const identity = [1, 0, 0, 0, 1, 0, 0, 0, 1] as const;
    // GCRS = the hour-angle frame (identity orientation, Greenwich site); Earth at rest far away.
    const earth = { barycentricPositionAu: [1, 0, 0] as const, barycentricVelocityAuPerDay: [0, 0, 0] as const, heliocentricPositionAu: [1, 0, 0] as const };
    const context = placeContext(0, earth, { npb: identity, gastRad: 0, polarMotion: identity }, { latitudeRad: 0, longitudeRad: 0, heightM: 0 }, standard);
    const place = (decDeg: number) => observedPlace(context, starMotion({ raRad: 0, decRad: decDeg * DEG, pmRaCosDecMasYr: 0, pmDecMasYr: 0, parallaxMas: 0, radialVelocityKmS: 0, epochJulianYear: 2000 }));
    expect(place(30).warnings).toEqual([]);
    expect(place(30).observedZenithRad).toBeLessThan(place(30).topocentricZenithRad);
    expect(place(80).warnings.join()).toMatch(/exceeds 75°/);
    const below = place(-89.9);
    expect(below.warnings.join()).toMatch(/below the horizon: no refraction applied/);
    expect(below.observedZenithRad).toBe(below.topocentricZenithRad);
  });
});
