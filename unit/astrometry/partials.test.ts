import { describe, expect, it } from 'vitest';
import { earthState } from '../../core/astrometry/earth-state.ts';
import { observedWithPartials } from '../../core/astrometry/observed-partials.ts';
import { observedPlace } from '../../core/astrometry/observed-place.ts';
import { placeContext, type PlaceContext } from '../../core/astrometry/place-context.ts';
import { starMotion } from '../../core/astrometry/space-motion.ts';
import { CONSTANT_OF_ABERRATION_RAD } from '../../core/astrometry/constants.ts';
import type { Vec3 } from '../../core/math/vec3.ts';
import { MAS, UAS } from '../../core/units.ts';
import { loadErfaPlaceFixture, type PlaceCase } from './erfa-place-fixture.ts';
import { angleDifference, toOrientation, toSite, toStar } from './place-helpers.ts';

const fixture = loadErfaPlaceFixture();

function contextOf(c: PlaceCase, withWeather: boolean): PlaceContext {
  const tt = { jd1: c.time.tt[0], jd2: c.time.tt[1] };
  return placeContext(tt.jd1 - 2451545 + tt.jd2, earthState(tt), toOrientation(c.orientation), toSite(c.site), withWeather ? c.weather : null);
}

// Space motion is switched off in the parallax checks: with it, a change of parallax also changes
// the perspective acceleration (radial motion relative to the distance) and the light-time of the
// transverse motion (≈ μ³ d s²/2c, 2e-3 rad/rad for a 10″/yr star over a century), which belong
// to the space motion, not to the parallax factor.
function angles(context: PlaceContext, c: PlaceCase, parallaxMas: number, still = false): [number, number, number] {
  const star = still ? stillStar(c, parallaxMas) : { ...toStar(c.star), parallaxMas };
  const place = observedPlace(context, starMotion(star));
  return [place.observedHourAngleRad, place.observedDeclinationRad, place.observedZenithRad];
}

/** The same context with Earth's barycentric velocity scaled by `factor` (κ → factor·κ₀). */
function withScaledEarthVelocity(context: PlaceContext, factor: number): PlaceContext {
  const e = context.earthBeta, o = context.observerBeta;
  const earthBeta: Vec3 = [e[0] * factor, e[1] * factor, e[2] * factor];
  const observerBeta: Vec3 = [o[0] + e[0] * (factor - 1), o[1] + e[1] * (factor - 1), o[2] + e[2] * (factor - 1)];
  return { ...context, earthBeta, observerBeta };
}

function stillStar(c: PlaceCase, parallaxMas = c.star.parallaxMas) {
  return { ...toStar(c.star), parallaxMas, radialVelocityKmS: 0, pmRaCosDecMasYr: 0, pmDecMasYr: 0 };
}

const cases = fixture.places.filter((c) => c.star.parallaxMas > 1.5);

describe('observedWithPartials(context, motion)', () => {
  it('gives the same observed place as observedPlace to 1 µas (same model, two code paths)', () => {
    for (const c of fixture.places) {
      for (const weather of [false, true]) {
        const context = contextOf(c, weather);
        const fast = observedWithPartials(context, starMotion(toStar(c.star)));
        const full = angles(context, c, c.star.parallaxMas);
        expect(Math.abs(angleDifference(fast[0], full[0])) * Math.cos(full[1]), `${c.kind} hour angle`).toBeLessThan(1 * UAS);
        expect(Math.abs(fast[1] - full[1]), `${c.kind} declination`).toBeLessThan(1 * UAS);
        expect(Math.abs(fast[2] - full[2]), `${c.kind} zenith`).toBeLessThan(1 * UAS);
      }
    }
  });

  it('parallax factors equal central finite differences of the full model (common practice: derivative check)', () => {
    const stepMas = 1;
    for (const c of cases) {
      const context = contextOf(c, true);
      const partials = observedWithPartials(context, starMotion(stillStar(c)));
      const plus = angles(context, c, c.star.parallaxMas + stepMas, true);
      const minus = angles(context, c, c.star.parallaxMas - stepMas, true);
      for (let k = 0; k < 3; k++) {
        const numeric = angleDifference(plus[k], minus[k]) / (2 * stepMas * MAS);
        const scale = k === 0 ? Math.cos(plus[1]) : 1;
        expect(Math.abs(partials[3 + k] - numeric) * scale, `${c.kind} component ${k}: ${partials[3 + k]} vs ${numeric}`).toBeLessThan(2e-5);
      }
    }
  });

  it('aberration factors equal central finite differences in κ of the full model', () => {
    const stepFraction = 1e-3;
    for (const c of fixture.places) {
      const context = contextOf(c, true);
      const motion = starMotion(toStar(c.star));
      const partials = observedWithPartials(context, motion);
      const at = (f: number) => {
        const place = observedPlace(withScaledEarthVelocity(context, f), motion);
        return [place.observedHourAngleRad, place.observedDeclinationRad, place.observedZenithRad];
      };
      const plus = at(1 + stepFraction), minus = at(1 - stepFraction);
      for (let k = 0; k < 3; k++) {
        const numeric = angleDifference(plus[k], minus[k]) / (2 * stepFraction * CONSTANT_OF_ABERRATION_RAD);
        const scale = k === 0 ? Math.cos(plus[1]) : 1;
        expect(Math.abs(partials[6 + k] - numeric) * scale, `${c.kind} component ${k}: ${partials[6 + k]} vs ${numeric}`).toBeLessThan(2e-5);
      }
    }
  });

  it('aberration factors have the size of κ/κ: |∂θ/∂κ| ≤ 1.05 (Earth speed ≤ κ·c·1.02; published κ = 20.49552″)', () => {
    for (const c of fixture.places) {
      const partials = observedWithPartials(contextOf(c, false), starMotion(toStar(c.star)));
      const size = Math.hypot(partials[6] * Math.cos(partials[1]), partials[7]);
      expect(size).toBeLessThan(1.05);
    }
  });
});
