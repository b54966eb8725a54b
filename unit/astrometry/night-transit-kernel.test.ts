import { describe, expect, it } from 'vitest';
import { FRAME_LENGTH } from '../../core/astrometry/instant-frame.ts';
import type { TwoPartJulianDate } from '../../core/astrometry/instant.ts';
import { createNightContext, NC_ANGLE, NC_HELIO } from '../../core/astrometry/night-context.ts';
import { fillFrameFromNight } from '../../core/astrometry/night-frame.ts';
import { prepareStars } from '../../core/astrometry/prepared-stars.ts';
import { reduceNight } from '../../core/astrometry/reduce-night.ts';
import { reduceStar, RESULT_STRIDE } from '../../core/astrometry/reduction-kernel.ts';
import type { CatalogueStar } from '../../core/astrometry/star.ts';
import { ARCSEC, DEG, MAS } from '../../core/units.ts';
import { angleDifference } from './place-helpers.ts';

/** mulberry32: a small seeded generator, so a failure reproduces. */
function random(seed: number): () => number {
  let a = seed >>> 0;
  return () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = Math.imul(a ^ (a >>> 15), a | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

function randomStar(next: () => number): CatalogueStar {
  const distant = next() < 0.2;
  return {
    raRad: next() * 2 * Math.PI, decRad: Math.asin(2 * next() - 1),
    pmRaCosDecMasYr: (next() - 0.5) * 8000, pmDecMasYr: (next() - 0.5) * 8000,
    parallaxMas: distant ? 0 : next() * 800, radialVelocityKmS: (next() - 0.5) * 400, epochJulianYear: 1991.25 + next() * 30,
  };
}

// The fused batch kernel (night-transit-kernel.ts, behind reduceNight) against the per-transit
// pair fillFrameFromNight + reduceStar, which the ERFA-based tests pin (night-context.test.ts,
// partials.test.ts): same model, two code paths, so they must agree to rounding.
describe('reduceNight (fused kernel) against fillFrameFromNight + reduceStar', () => {
  it('agrees to < 0.01 mas in place and < 1e-9 in the factors over random stars, sites, weather and instants', () => {
    const next = random(20261202);
    const frame = new Float64Array(FRAME_LENGTH);
    const single = new Float64Array(RESULT_STRIDE);
    let worstPlace = 0, worstFactor = 0, compared = 0;
    for (let nightIndex = 0; nightIndex < 40; nightIndex++) {
      const centreTt = { jd1: 2_415_020.5 + Math.floor(next() * 73_000), jd2: next() };
      const site = { latitudeRad: (next() * 170 - 85) * DEG, longitudeRad: (next() * 360 - 180) * DEG, heightM: next() * 4000 };
      const weather = next() < 0.25 ? null : { pressureHpa: 600 + next() * 450, temperatureC: -30 + next() * 60, relativeHumidity: next(), wavelengthUm: 0.4 + next() };
      const instantFromTt = (tt: TwoPartJulianDate) => ({ tt, ut1: { jd1: tt.jd1, jd2: tt.jd2 - 64 / 86400 }, xpRad: 0.2 * ARCSEC, ypRad: 0.35 * ARCSEC });
      const night = createNightContext({ centreTt, site, weather, instantFromTt });
      const catalogue = Array.from({ length: 30 }, () => randomStar(next));
      const stars = prepareStars(catalogue);
      const starIndex = Int32Array.from({ length: 60 }, () => Math.floor(next() * catalogue.length));
      const days = Float64Array.from(starIndex, () => night.centreDaysSinceJ2000 + (next() - 0.5) * 2 * night.halfWidthDays);
      const out = new Float64Array(starIndex.length * RESULT_STRIDE);
      reduceNight(night, stars, starIndex, days, out);
      for (let k = 0; k < starIndex.length; k++) {
        fillFrameFromNight(night, days[k], frame);
        reduceStar(frame, stars, starIndex[k], single, 0);
        const o = k * RESULT_STRIDE;
        // Below the horizon both paths skip refraction alike; the comparison holds everywhere.
        const cosDec = Math.cos(single[1]);
        const place = [angleDifference(out[o], single[0]) * cosDec, out[o + 1] - single[1], out[o + 2] - single[2]].map(Math.abs);
        for (const e of place) expect(e / MAS, `night ${nightIndex} transit ${k}`).toBeLessThan(0.01);
        for (let p = 3; p < RESULT_STRIDE; p++) {
          const e = Math.abs(out[o + p] - single[p]) * (p % 3 === 0 ? cosDec : 1);
          expect(e, `night ${nightIndex} transit ${k} factor ${p}`).toBeLessThan(1e-9);
          worstFactor = Math.max(worstFactor, e);
        }
        worstPlace = Math.max(worstPlace, ...place);
        compared++;
      }
    }
    expect(compared).toBe(40 * 60);
    console.log(`fused vs per-transit kernel: worst ${(worstPlace / MAS).toExponential(2)} mas, factors ${worstFactor.toExponential(2)} over ${compared} transits`);
  });

  it('agrees as closely near the Sun and on both sides of the refraction switch at Z = 80°, in the densest air', () => {
    const frame = new Float64Array(FRAME_LENGTH);
    const single = new Float64Array(RESULT_STRIDE);
    const centreTt = { jd1: 2_460_310.5, jd2: 0 };
    const site = { latitudeRad: 40 * DEG, longitudeRad: -3 * DEG, heightM: 0 };
    const weather = { pressureHpa: 1050, temperatureC: -30, relativeHumidity: 0, wavelengthUm: 0.4 };
    const instantFromTt = (tt: TwoPartJulianDate) => ({ tt, ut1: tt, xpRad: 0, ypRad: 0 });
    const night = createNightContext({ centreTt, site, weather, instantFromTt });
    // The Sun's direction from Earth: minus Earth's heliocentric position.
    const [hx, hy, hz] = [0, 1, 2].map((i) => -night.coefficients[NC_HELIO + i]);
    const sunRa = Math.atan2(hy, hx), sunDec = Math.atan2(hz, Math.hypot(hx, hy));
    const catalogue: CatalogueStar[] = [];
    // 0.3°, 1° and 3° from the Sun, then declinations whose upper transit lies at Z = 75° … 85°.
    for (const offset of [0.3, 1, 3]) catalogue.push({ raRad: sunRa, decRad: sunDec + offset * DEG, pmRaCosDecMasYr: 0, pmDecMasYr: 0, parallaxMas: 0, radialVelocityKmS: 0, epochJulianYear: 2016 });
    for (let z = 75; z <= 85; z += 0.25) catalogue.push({ raRad: (z * 7) % 6, decRad: (40 - z) * DEG, pmRaCosDecMasYr: 50, pmDecMasYr: -30, parallaxMas: 20, radialVelocityKmS: 10, epochJulianYear: 2016 });
    const stars = prepareStars(catalogue);
    const starIndex = Int32Array.from(catalogue, (_, k) => k);
    // Each star at its upper transit: hour angle 0 when the local sidereal angle equals its RA.
    const angle = night.coefficients[NC_ANGLE] + site.longitudeRad;
    const days = Float64Array.from(catalogue, (star) => night.centreDaysSinceJ2000 + Math.atan2(Math.sin(star.raRad - angle), Math.cos(star.raRad - angle)) / (2 * Math.PI * 1.0027379));
    const out = new Float64Array(catalogue.length * RESULT_STRIDE);
    reduceNight(night, stars, starIndex, days, out);
    let worstPlace = 0, worstFactor = 0, above = 0, below = 0;
    for (let k = 0; k < catalogue.length; k++) {
      fillFrameFromNight(night, days[k], frame);
      reduceStar(frame, stars, k, single, 0);
      const o = k * RESULT_STRIDE;
      if (k >= 3 && single[2] > 80 * DEG) above++;
      else if (k >= 3) below++;
      worstPlace = Math.max(worstPlace, Math.abs(angleDifference(out[o], single[0])), Math.abs(out[o + 1] - single[1]), Math.abs(out[o + 2] - single[2]));
      for (let p = 3; p < RESULT_STRIDE; p++) worstFactor = Math.max(worstFactor, Math.abs(out[o + p] - single[p]));
    }
    expect(above).toBeGreaterThan(10);
    expect(below).toBeGreaterThan(10);
    expect(worstPlace / MAS).toBeLessThan(0.001);
    expect(worstFactor).toBeLessThan(1e-9);
    console.log(`near the Sun and at Z 75–85°: worst ${(worstPlace / MAS).toExponential(2)} mas, factors ${worstFactor.toExponential(2)}`);
  });

  it('refuses a star index outside the packed stars, naming it', () => {
    const night = createNightContext({
      centreTt: { jd1: 2_460_000.5, jd2: 0 }, site: { latitudeRad: 0.8, longitudeRad: 0.1, heightM: 100 }, weather: null,
      instantFromTt: (tt) => ({ tt, ut1: tt, xpRad: 0, ypRad: 0 }),
    });
    const stars = prepareStars([{ raRad: 1, decRad: 0.5, pmRaCosDecMasYr: 0, pmDecMasYr: 0, parallaxMas: 10, radialVelocityKmS: 0, epochJulianYear: 2016 }]);
    const out = new Float64Array(RESULT_STRIDE);
    expect(() => reduceNight(night, stars, Int32Array.of(3), Float64Array.of(night.centreDaysSinceJ2000), out)).toThrow(/starIndex\[0\] = 3 is not one of the 1 packed stars/);
  });
});
