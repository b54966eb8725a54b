import { describe, expect, it } from 'vitest';
import { earthState } from '../../core/astrometry/earth-state.ts';
import { FRAME_BIAS } from '../../core/astrometry/frame-bias.ts';
import { iauEarthOrientation } from '../../core/astrometry/iau-earth-orientation.ts';
import { observedPlace } from '../../core/astrometry/observed-place.ts';
import { placeContext } from '../../core/astrometry/place-context.ts';
import { starMotion } from '../../core/astrometry/space-motion.ts';
import { ARCSEC, MAS, UAS } from '../../core/units.ts';
import { loadErfaPlaceFixture, type PlaceCase } from './erfa-place-fixture.ts';
import { angleDifference, toOrientation, toSite, toStar } from './place-helpers.ts';

const fixture = loadErfaPlaceFixture();
const source = `ERFA ${fixture.header.erfaVersion} (${fixture.header.generator})`;

function placeWithErfaOrientation(c: PlaceCase, withWeather: boolean) {
  const tt = { jd1: c.time.tt[0], jd2: c.time.tt[1] };
  const days = tt.jd1 - 2451545 + tt.jd2;
  const context = placeContext(days, earthState(tt), toOrientation(c.orientation), toSite(c.site), withWeather ? c.weather : null);
  return observedPlace(context, starMotion(toStar(c.star)));
}

describe('FRAME_BIAS', () => {
  it(`equals erfa.bp06's bias matrix within 1 µas (${source})`, () => {
    const rb = fixture.places[0].orientation.frameBias;
    for (let k = 0; k < 9; k++) expect(Math.abs(FRAME_BIAS[k] - rb[k])).toBeLessThan(1 * UAS);
  });
});

describe('observedPlace(context, star) with ERFA Earth orientation', () => {
  it(`gives the geocentric apparent place of erfa.atci13 within 3 mas (${source})`, () => {
    let worst = 0;
    for (const c of fixture.places) {
      const ours = placeWithErfaOrientation(c, false);
      const dRa = angleDifference(ours.apparentRaRad, c.apparent.raRad) * Math.cos(c.apparent.decRad);
      const dDec = ours.apparentDecRad - c.apparent.decRad;
      const error = Math.hypot(dRa, dDec);
      worst = Math.max(worst, error);
      expect(error, `${c.kind} star ${JSON.stringify(c.star)} at TT ${c.time.tt}`).toBeLessThan(3 * MAS);
    }
    console.log(`apparent place vs atci13: worst ${(worst / MAS).toFixed(3)} mas over ${fixture.places.length} cases`);
  });

  it(`gives erfa.atco13's observed hour angle, declination and zenith distance within 3 mas (${source})`, () => {
    let worst = 0;
    for (const c of fixture.places) {
      for (const withWeather of [false, true]) {
        const expected = withWeather ? c.observed : c.observedNoRefraction;
        const ours = placeWithErfaOrientation(c, withWeather);
        const hour = withWeather ? ours.observedHourAngleRad : ours.topocentricHourAngleRad;
        const dec = withWeather ? ours.observedDeclinationRad : ours.topocentricDeclinationRad;
        const zenith = withWeather ? ours.observedZenithRad : ours.topocentricZenithRad;
        const label = `${c.kind} ${withWeather ? 'refracted' : 'geometric'} ${JSON.stringify(c.star)} site ${JSON.stringify(c.site)}`;
        const dHour = angleDifference(hour, expected.hourAngleRad) * Math.cos(expected.declinationRad);
        expect(Math.abs(dHour), `hour angle × cos δ, ${label}`).toBeLessThan(3 * MAS);
        expect(Math.abs(dec - expected.declinationRad), `declination, ${label}`).toBeLessThan(3 * MAS);
        expect(Math.abs(zenith - expected.zenithRad), `zenith distance, ${label}`).toBeLessThan(3 * MAS);
        worst = Math.max(worst, Math.abs(dHour), Math.abs(dec - expected.declinationRad), Math.abs(zenith - expected.zenithRad));
      }
    }
    console.log(`observed place vs atco13: worst ${(worst / MAS).toFixed(3)} mas`);
  });
});

describe('observedPlace with iauEarthOrientation (core/earth)', () => {
  it(`gives erfa.atco13's observed place within 3 mas with our own Earth orientation (${source})`, () => {
    let worst = 0;
    for (const c of fixture.places) {
      const tt = { jd1: c.time.tt[0], jd2: c.time.tt[1] };
      const ut1 = { jd1: c.time.ut1[0], jd2: c.time.ut1[1] };
      const instant = { tt, ut1, xpRad: c.eop.xpArcsec * ARCSEC, ypRad: c.eop.ypArcsec * ARCSEC };
      const context = placeContext(tt.jd1 - 2451545 + tt.jd2, earthState(tt), iauEarthOrientation(instant), toSite(c.site), c.weather);
      const ours = observedPlace(context, starMotion(toStar(c.star)));
      const dHour = angleDifference(ours.observedHourAngleRad, c.observed.hourAngleRad) * Math.cos(c.observed.declinationRad);
      const errors = [dHour, ours.observedDeclinationRad - c.observed.declinationRad, ours.observedZenithRad - c.observed.zenithRad];
      for (const e of errors) expect(Math.abs(e), `${c.kind} ${JSON.stringify(c.star)}`).toBeLessThan(3 * MAS);
      worst = Math.max(worst, ...errors.map(Math.abs));
    }
    console.log(`observed place (own Earth orientation) vs atco13: worst ${(worst / MAS).toFixed(3)} mas`);
  });
});
