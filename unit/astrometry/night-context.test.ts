import { describe, expect, it } from 'vitest';
import { earthState } from '../../core/astrometry/earth-state.ts';
import { iauEarthOrientation } from '../../core/astrometry/iau-earth-orientation.ts';
import { createNightContext } from '../../core/astrometry/night-context.ts';
import { observedWithPartials } from '../../core/astrometry/observed-partials.ts';
import { placeContext } from '../../core/astrometry/place-context.ts';
import { prepareStars } from '../../core/astrometry/prepared-stars.ts';
import { reduceNight } from '../../core/astrometry/reduce-night.ts';
import { RESULT_STRIDE } from '../../core/astrometry/reduction-kernel.ts';
import { starMotion } from '../../core/astrometry/space-motion.ts';
import type { TwoPartJulianDate } from '../../core/astrometry/instant.ts';
import { BUNDLED_LEAP_SECONDS } from '../../core/time/bundled-leap-seconds.ts';
import { TimeScale } from '../../core/time/timescale.ts';
import { ARCSEC, DEG, MAS } from '../../core/units.ts';
import { loadErfaPlaceFixture } from './erfa-place-fixture.ts';
import { angleDifference, toSite, toStar } from './place-helpers.ts';

const fixture = loadErfaPlaceFixture();
const scale = new TimeScale(BUNDLED_LEAP_SECONDS);

describe('createNightContext + reduceNight', () => {
  for (const [mode, toleranceMas] of [['fast', 0.2], ['exact', 0.02]] as const) it(`reproduce the per-instant model (observedWithPartials) within ${toleranceMas} mas over ±0.5 day in '${mode}' mode (internal consistency)`, () => {
    let worst = 0;
    let worstPartial = 0;
    for (const c of fixture.places.slice(0, 24)) {
      // A smooth UT1 (TT − 64 s): without an EOP table UT1 would follow UTC and jump at leap seconds,
      // which a context spanning the step cannot (and should not) follow.
      const instantFromTt = (tt: TwoPartJulianDate) => ({
        tt, ut1: { jd1: tt.jd1, jd2: tt.jd2 - 64 / 86400 }, xpRad: c.eop.xpArcsec * ARCSEC, ypRad: c.eop.ypArcsec * ARCSEC,
      });
      const centreTt = { jd1: c.time.tt[0], jd2: c.time.tt[1] };
      const site = toSite(c.site);
      const night = createNightContext({ centreTt, site, weather: c.weather, instantFromTt, mode });
      const star = toStar(c.star);
      const stars = prepareStars([star]);
      const offsets = Array.from({ length: 21 }, (_, k) => -0.5 + k * 0.05);
      const days = Float64Array.from(offsets, (o) => centreTt.jd1 - 2451545 + centreTt.jd2 + o);
      const out = new Float64Array(offsets.length * RESULT_STRIDE);
      reduceNight(night, stars, new Int32Array(offsets.length), days, out);
      offsets.forEach((offset, k) => {
        const tt = { jd1: centreTt.jd1, jd2: centreTt.jd2 + offset };
        const instant = instantFromTt(tt);
        const context = placeContext(days[k], earthState(tt), iauEarthOrientation(instant), site, c.weather);
        const full = observedWithPartials(context, starMotion(star));
        // Beyond 75° the refraction model amplifies any difference (dR/dZ ≈ 10 at 89°): not compared.
        if (c.weather !== null && full[2] > 75 * DEG) return;
        const o = k * RESULT_STRIDE;
        const errors = [
          angleDifference(out[o], full[0]) * Math.cos(full[1]), out[o + 1] - full[1], out[o + 2] - full[2],
        ].map(Math.abs);
        for (const e of errors) expect(e / MAS, `${c.kind} offset ${offset} d`).toBeLessThan(toleranceMas);
        worst = Math.max(worst, ...errors);
        for (let p = 3; p < RESULT_STRIDE; p++) {
          const scaleHa = p % 3 === 0 ? Math.cos(full[1]) : 1;
          const d = Math.abs(out[o + p] - full[p]) * scaleHa;
          // 5e-5 rad/rad of a factor is 1 µas for a 20 mas change of κ or parallax; in 'fast' mode
          // Earth's position differs by up to 3e-5 au (earthStateFast), which moves parallax
          // factors by the same relative amount.
          expect(d, `${c.kind} partial ${p} offset ${offset}`).toBeLessThan(5e-5);
          worstPartial = Math.max(worstPartial, d);
        }
      });
    }
    console.log(`night context (${mode}) vs per-instant model: worst ${(worst / MAS).toFixed(4)} mas, partials ${worstPartial.toExponential(2)}`);
  });

  it('refuses an instant outside the night, naming the offset', () => {
    const centreTt = { jd1: 2460000.5, jd2: 0 };
    const night = createNightContext({ centreTt, site: { latitudeRad: 0.8, longitudeRad: 0.1, heightM: 100 }, weather: null, instantFromTt: (tt) => scale.fromTt(tt) });
    const out = new Float64Array(RESULT_STRIDE);
    const stars = prepareStars([{ raRad: 1, decRad: 0.5, pmRaCosDecMasYr: 0, pmDecMasYr: 0, parallaxMas: 10, radialVelocityKmS: 0, epochJulianYear: 2016 }]);
    expect(() => reduceNight(night, stars, new Int32Array(1), Float64Array.of(9000.0), out)).toThrow(/outside ±0\.5 days/);
  });
});
