import { describe, expect, it } from 'vitest';
import { iauEarthOrientation } from '../../core/astrometry/iau-earth-orientation.ts';
import type { TwoPartJulianDate } from '../../core/astrometry/instant.ts';
import { starMotion } from '../../core/astrometry/space-motion.ts';
import { predictTransit } from '../../core/astrometry/transit.ts';
import { BUNDLED_LEAP_SECONDS } from '../../core/time/bundled-leap-seconds.ts';
import { TimeScale } from '../../core/time/timescale.ts';
import { ARCSEC, MAS, SECONDS_PER_DAY } from '../../core/units.ts';
import { loadErfaPlaceFixture, type FixtureEop } from './erfa-place-fixture.ts';
import { toSite, toStar } from './place-helpers.ts';

const fixture = loadErfaPlaceFixture();
const source = `ERFA ${fixture.header.erfaVersion} (${fixture.header.generator})`;
const timeScale = new TimeScale(BUNDLED_LEAP_SECONDS);

/** Instants with the case's fixed EOP, as ERFA got them (UT1 = UTC + DUT1). */
function instantsWith(eop: FixtureEop) {
  return (utc: TwoPartJulianDate) => {
    const instant = timeScale.fromUtc(utc);
    return {
      ...instant,
      ut1: { jd1: utc.jd1, jd2: utc.jd2 + eop.dut1S / SECONDS_PER_DAY },
      xpRad: eop.xpArcsec * ARCSEC,
      ypRad: eop.ypArcsec * ARCSEC,
    };
  };
}

describe('predictTransit(...)', () => {
  const results = fixture.transits.map((c) => {
    const instants = instantsWith(c.eop);
    const prediction = predictTransit(
      starMotion(toStar(c.star)), toSite(c.site), c.weather,
      { jd1: c.afterUtc[0], jd2: c.afterUtc[1] }, c.culmination, instants, iauEarthOrientation,
    );
    return { c, prediction };
  });

  it(`finds the culmination instant of erfa.atco13 within 3 mas of hour angle (${source})`, () => {
    let worstMas = 0;
    for (const { c, prediction } of results) {
      const dtSeconds = (prediction.utc.jd1 - c.transit.utc[0] + (prediction.utc.jd2 - c.transit.utc[1])) * SECONDS_PER_DAY;
      const skyMas = (Math.abs(dtSeconds) * 15 * ARCSEC * Math.cos(c.declinationRad)) / MAS;
      worstMas = Math.max(worstMas, skyMas);
      expect(skyMas, `${c.kind} ${c.culmination} ${JSON.stringify(c.star)}: Δt = ${dtSeconds} s`).toBeLessThan(3);
    }
    console.log(`transit instants vs ERFA: worst ${worstMas.toFixed(3)} mas of hour angle × cos δ`);
  });

  it(`gives the observed and geometric zenith distances of erfa.atco13 within 3 mas (${source})`, () => {
    for (const { c, prediction } of results) {
      expect(Math.abs(prediction.place.observedZenithRad - c.observedZenithRad) / MAS, `${c.kind} observed`).toBeLessThan(3);
      expect(Math.abs(prediction.place.topocentricZenithRad - c.geometricZenithRad) / MAS, `${c.kind} geometric`).toBeLessThan(3);
    }
  });

  it(`gives the geocentric apparent place of erfa.atci13 at the transit within 3 mas (${source})`, () => {
    for (const { c, prediction } of results) {
      const dRa = Math.atan2(Math.sin(prediction.place.apparentRaRad - c.apparent.raRad), Math.cos(prediction.place.apparentRaRad - c.apparent.raRad));
      expect(Math.abs(dRa * Math.cos(c.apparent.decRad)) / MAS).toBeLessThan(3);
      expect(Math.abs(prediction.place.apparentDecRad - c.apparent.decRad) / MAS).toBeLessThan(3);
    }
  });

  it('puts the star on the side of the zenith its observed declination implies', () => {
    for (const { c, prediction } of results) {
      const lat = c.site.latDeg * (Math.PI / 180);
      const expected = c.culmination === 'upper'
        ? (c.declinationRad > lat ? 'north' : 'south')
        : (lat > 0 ? 'north' : 'south');
      expect(prediction.side, `${c.kind} ${c.culmination} lat ${c.site.latDeg}`).toBe(expected);
    }
  });

  it('round trip: the hour angle at the predicted instant is 0 (upper) or 12h (lower) to 1e-9 rad', () => {
    for (const { c, prediction } of results) {
      const target = c.culmination === 'upper' ? 0 : Math.PI;
      const residual = Math.atan2(Math.sin(prediction.place.observedHourAngleRad - target), Math.cos(prediction.place.observedHourAngleRad - target));
      expect(Math.abs(residual)).toBeLessThan(1e-9);
      const after = prediction.utc.jd1 - c.afterUtc[0] + (prediction.utc.jd2 - c.afterUtc[1]);
      expect(after).toBeGreaterThan(0);
      expect(after).toBeLessThan(1.0);
    }
  });
});
