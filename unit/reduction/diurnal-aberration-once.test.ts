import { describe, expect, it } from 'vitest';
import { iauEarthOrientation } from '../../core/astrometry/iau-earth-orientation.ts';
import { DIURNAL_ABERRATION_CONSTANT_RAD } from '../../core/instrument/diurnal-aberration.ts';
import { starMotion } from '../../core/astrometry/space-motion.ts';
import { predictTransit } from '../../core/astrometry/transit.ts';
import type { StarListRow } from '../../core/formats/star-list.ts';
import { catalogueStarOf } from '../../core/reduction/star-predictions.ts';
import { DEG, SECOND_OF_TIME_ANGLE } from '../../core/units.ts';
import { instantFromUtc, passage, PROGRAMME, simulateNight, SITE, transitLogCsv, TRUTH } from './forward-night.ts';
import { expectReduced, reduceTestNight } from './reduce-helpers.ts';

// Diurnal aberration at transit: 0.0213 s · cos φ · sec δ of time, the star transiting late at upper
// culmination (Smart, Text-Book on Spherical Astronomy, diurnal aberration; 0.021 s from memory,
// 0.02133 s = ω a / c with GRS80 values in core/instrument/diurnal-aberration.ts).

function starOf(index: number): StarListRow {
  const [id, raDeg, decDeg] = PROGRAMME[index];
  return { row: 0, line: 0, id, label: '', raDeg, decDeg, epochJyear: 2016, pmRaCosDecMasYr: 0, pmDecMasYr: 0, parallaxMas: 0, parallaxSigmaMas: null, radialVelocityKmS: null, magnitude: null, source: '', programmes: [] };
}

describe('diurnal aberration is applied exactly once', () => {
  it('the predicted passage (core/astrometry) already contains it: topocentric transit − geocentric apparent transit = k cos φ sec δ', () => {
    const cosPhi = Math.cos(SITE.latitudeDeg * DEG);
    for (let index = 0; index < PROGRAMME.length; index++) {
      const [id, , , culmination] = PROGRAMME[index];
      if (culmination !== 'upper') continue;
      // The pole set to zero, so that the site's meridian is the one of GAST + λ (polar motion would shift it by ~ms).
      const noPole = (utc: { jd1: number; jd2: number }) => ({ ...instantFromUtc(utc), xpRad: 0, ypRad: 0 });
      const site = { latitudeRad: SITE.latitudeDeg * DEG, longitudeRad: SITE.longitudeDeg * DEG, heightM: SITE.heightM };
      const p = predictTransit(starMotion(catalogueStarOf(starOf(index))), site, null, { jd1: passage(index).utc.jd1, jd2: passage(index).utc.jd2 - 0.01 }, 'upper', noPole, iauEarthOrientation);
      const instant = noPole(p.utc);
      // Geocentric apparent hour angle at the topocentric passage, with the pole as the prediction used it.
      const orientation = iauEarthOrientation(instant);
      const localApparentSiderealRad = orientation.gastRad + SITE.longitudeDeg * DEG;
      const hourAngle = Math.atan2(Math.sin(localApparentSiderealRad - p.place.apparentRaRad), Math.cos(localApparentSiderealRad - p.place.apparentRaRad));
      const lateS = hourAngle / SECOND_OF_TIME_ANGLE;
      const expectedS = (DIURNAL_ABERRATION_CONSTANT_RAD / SECOND_OF_TIME_ANGLE) * cosPhi / Math.cos(p.place.apparentDecRad);
      // Left over: geocentric vs geodetic radius in the constant (0.34 %), light-time and deflection differences.
      expect(Math.abs(lateS - expectedS), `${id}: late by ${lateS} s, expected ${expectedS} s`).toBeLessThan(0.0003);
    }
  });

  it('the reduction adds none: a noise-free night with c held at its true value leaves residuals < 1 ms (a second application would leave 14–60 ms)', async () => {
    const log = transitLogCsv(simulateNight(3, TRUTH, 0, 0));
    const r = expectReduced(await reduceTestNight(log, null, (c) => ({ ...c, collimationArcsec: { mode: 'fixed', value: TRUTH.collimationArcsec }, clockRateSPerDay: { mode: 'fixed', value: TRUTH.clockRateSPerDay } }), TRUTH.levelArcsec));
    for (const t of r.transits) expect(Math.abs(t.ocTimeS), t.starId).toBeLessThan(0.001);
    expect(Math.abs(r.constants.azimuthArcsec.value - TRUTH.azimuthArcsec)).toBeLessThan(0.003);
  });
});
