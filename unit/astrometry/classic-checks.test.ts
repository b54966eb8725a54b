import { describe, expect, it } from 'vitest';
import { aberration, nutation, positionRonVondrak } from 'astronomia/apparent';
import { JDEToJulianYear } from 'astronomia/base';
import { Equatorial } from 'astronomia/coord';
import { Angle, HourAngle } from 'astronomia/sexagesimal';
import { AstroTime, Body, Equator, Horizon, Observer } from 'astronomy-engine';
import { aberrate } from '../../core/astrometry/aberration.ts';
import { SPEED_OF_LIGHT_AU_PER_DAY } from '../../core/astrometry/constants.ts';
import { biasPrecessionMatrix06 } from '../../core/earth/precession-06.ts';
import { apply } from '../../core/math/mat3.ts';
import { toSpherical, type Vec3 } from '../../core/math/vec3.ts';
import { earthState } from '../../core/astrometry/earth-state.ts';
import { iauEarthOrientation } from '../../core/astrometry/iau-earth-orientation.ts';
import { observedPlace } from '../../core/astrometry/observed-place.ts';
import { placeContext } from '../../core/astrometry/place-context.ts';
import { starMotion, starPositionAt } from '../../core/astrometry/space-motion.ts';
import { sunAtTransit } from '../../core/astrometry/sun-at-transit.ts';
import { ARCSEC, DEG, HOUR_ANGLE } from '../../core/units.ts';

function contextAt(ttJd: number, latDeg = 0, lonDeg = 0) {
  const tt = { jd1: ttJd, jd2: 0 };
  const instant = { tt, ut1: tt, xpRad: 0, ypRad: 0 };
  return placeContext(ttJd - 2451545, earthState(tt), iauEarthOrientation(instant), { latitudeRad: latDeg * DEG, longitudeRad: lonDeg * DEG, heightM: 0 }, null);
}

// Meeus, Astronomical Algorithms (2nd ed.), example 23.a: θ Persei, J2000 α = 2h44m11.986s,
// δ = +49°13′42.48″, μα = +0.03425 s/yr, μδ = −0.0895″/yr, at 2028 Nov 13.19 TD (JDE 2462088.69).
const JDE = 2462088.69;
const RA0 = (2 + 44 / 60 + 11.986 / 3600) * HOUR_ANGLE;
const DEC0 = (49 + 13 / 60 + 42.48 / 3600) * DEG;
const thetaPersei = {
  raRad: RA0, decRad: DEC0, pmRaCosDecMasYr: 0.03425 * 15 * 1000 * Math.cos(DEC0), pmDecMasYr: -89.5,
  parallaxMas: 0, radialVelocityKmS: 0, epochJulianYear: 2000,
};

describe('apparent place of θ Persei (Meeus example 23.a)', () => {
  const place = observedPlace(contextAt(JDE), starMotion(thetaPersei));

  it('agrees with astronomia positionRonVondrak (Meeus ch. 23 method) within 0.1″', () => {
    // Differences expected: IAU 1976/1980 vs 2006/2000A precession-nutation, the 23 mas frame bias
    // and solar light deflection (absent from Meeus' method): a few 10 mas in all.
    const theirs = positionRonVondrak(new Equatorial(RA0, DEC0), JDEToJulianYear(JDE), new HourAngle(false, 0, 0, 0.03425), new Angle(true, 0, 0, 0.0895));
    const dRa = (place.apparentRaRad - theirs.ra) * Math.cos(theirs.dec);
    expect(Math.abs(dRa) / ARCSEC).toBeLessThan(0.1);
    expect(Math.abs(place.apparentDecRad - theirs.dec) / ARCSEC).toBeLessThan(0.1);
  });

  it('agrees with the book\'s result α = 2h46m14.390s, δ = +49°21′07.45″ within 0.1″ (printed values, from memory)', () => {
    const ra = (2 + 46 / 60 + 14.39 / 3600) * HOUR_ANGLE;
    const dec = (49 + 21 / 60 + 7.45 / 3600) * DEG;
    expect(Math.abs(place.apparentRaRad - ra) * Math.cos(dec) / ARCSEC).toBeLessThan(0.1);
    expect(Math.abs(place.apparentDecRad - dec) / ARCSEC).toBeLessThan(0.1);
  });
});

describe('components of the θ Persei place (Meeus example 23.a)', () => {
  // Astrometric direction at the date (space motion only), then the two corrections one at a time.
  const context = contextAt(JDE);
  const days = JDE - 2451545;
  const direction = starPositionAt(starMotion(thetaPersei), days);
  const ofDate = (v: Vec3) => toSpherical(apply(context.npb, v));
  const meanOfDate = (v: Vec3) => toSpherical(apply(biasPrecessionMatrix06({ jd1: JDE, jd2: 0 }), v));
  const difference = (a: ReturnType<typeof toSpherical>, b: ReturnType<typeof toSpherical>) => [(a.alphaRad - b.alphaRad) / ARCSEC, (a.deltaRad - b.deltaRad) / ARCSEC];

  it('annual aberration Δα = +30.045″, Δδ = +6.697″ (book values, from memory; astronomia aberration() too) within 0.03″', () => {
    const [dRa, dDec] = difference(ofDate(aberrate(direction, context.earthBeta)), ofDate(direction));
    console.log(`θ Persei aberration: Δα ${dRa.toFixed(3)}″, Δδ ${dDec.toFixed(3)}″`);
    expect(Math.abs(dRa - 30.045)).toBeLessThan(0.03);
    expect(Math.abs(dDec - 6.697)).toBeLessThan(0.03);
    const mean = meanOfDate(direction);
    const [theirRa, theirDec] = aberration(mean.alphaRad, mean.deltaRad, JDE);
    expect(Math.abs(dRa - theirRa / ARCSEC)).toBeLessThan(0.03);
    expect(Math.abs(dDec - theirDec / ARCSEC)).toBeLessThan(0.03);
  });

  it('nutation Δα = +15.843″, Δδ = +6.218″ (book values, IAU 1980, from memory; astronomia nutation() too) within 0.05″', () => {
    const [dRa, dDec] = difference(ofDate(direction), meanOfDate(direction));
    console.log(`θ Persei nutation: Δα ${dRa.toFixed(3)}″, Δδ ${dDec.toFixed(3)}″`);
    expect(Math.abs(dRa - 15.843)).toBeLessThan(0.05);
    expect(Math.abs(dDec - 6.218)).toBeLessThan(0.05);
    const mean = meanOfDate(direction);
    const [theirRa, theirDec] = nutation(mean.alphaRad, mean.deltaRad, JDE);
    expect(Math.abs(dRa - theirRa / ARCSEC)).toBeLessThan(0.05);
    expect(Math.abs(dDec - theirDec / ARCSEC)).toBeLessThan(0.05);
  });
});

describe('published constants (sanity checks)', () => {
  it('Earth\'s mean orbital speed / c over a year is the constant of aberration 20.49552″ (IAU 1976) within 0.05″', () => {
    let sum = 0;
    const days = 365;
    for (let d = 0; d < days; d++) {
      const v = earthState({ jd1: 2460000.5 + d, jd2: 0 }).barycentricVelocityAuPerDay;
      sum += Math.hypot(...v) / SPEED_OF_LIGHT_AU_PER_DAY;
    }
    expect(Math.abs(sum / days / ARCSEC - 20.49552)).toBeLessThan(0.05);
  });

  it('the site velocity / c is the diurnal aberration 0.32″ cos φ (published constant) within 0.002″', () => {
    for (const latDeg of [0, 30, 52, 70]) {
      const c = contextAt(2460000.5, latDeg);
      const site = c.observerBeta.map((b, k) => b - c.earthBeta[k]);
      expect(Math.abs(Math.hypot(...site) / ARCSEC - 0.32 * Math.cos(latDeg * DEG))).toBeLessThan(0.002);
    }
  });
});

describe('sunAtTransit(context, ...)', () => {
  it('gives the Sun altitude of astronomy-engine (Equator + Horizon) within 0.05°', () => {
    for (const [utcIso, latDeg, lonDeg] of [['2025-06-21T12:00:00Z', 52, 5], ['2025-12-01T15:30:00Z', -33, 18], ['2030-03-20T06:00:00Z', 10, -70]] as const) {
      const time = new AstroTime(new Date(utcIso));
      const observer = new Observer(latDeg, lonDeg, 0);
      const eq = Equator(Body.Sun, time, observer, true, true);
      const altitude = Horizon(time, observer, eq.ra, eq.dec).altitude;
      // Our context from astronomy-engine's own TT and UT so the comparison shares the instant.
      const tt = { jd1: 2451545, jd2: time.tt };
      const ut1 = { jd1: 2451545, jd2: time.ut };
      const context = placeContext(time.tt, earthState(tt), iauEarthOrientation({ tt, ut1, xpRad: 0, ypRad: 0 }), { latitudeRad: latDeg * DEG, longitudeRad: lonDeg * DEG, heightM: 0 }, null);
      const sun = sunAtTransit(context, 0, 0);
      expect(Math.abs(sun.sunAltitudeRad / DEG - altitude), utcIso).toBeLessThan(0.05);
    }
  });

  it('flags a daylight transit near the Sun with the safety caution, and not a night one', () => {
    const context = contextAt(2460846.0, 40, 0); // 2025 June 21 12h TT: the Sun is near the meridian
    const e = context.sunToObserverUnit;
    const local = [0, 1, 2].map((row) => -(context.gcrsToLocal[3 * row] * e[0] + context.gcrsToLocal[3 * row + 1] * e[1] + context.gcrsToLocal[3 * row + 2] * e[2]));
    const sunHa = Math.atan2(-local[1], local[0]);
    const sunDec = Math.atan2(local[2], Math.hypot(local[0], local[1]));
    const near = sunAtTransit(context, sunHa, sunDec + 5 * DEG);
    expect(near.starSunSeparationRad / DEG).toBeCloseTo(5, 1);
    expect(near.caution).toMatch(/daylight .* unfiltered instrument/);
    expect(sunAtTransit(context, sunHa + Math.PI, -sunDec).caution).toBeUndefined();
  });
});
