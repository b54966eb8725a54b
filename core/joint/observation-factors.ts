import { createNightContext } from '../astrometry/night-context.ts';
import { PlanetaryNutationGrid } from '../earth/planetary-nutation-grid.ts';
import { prepareStars } from '../astrometry/prepared-stars.ts';
import { reduceNight } from '../astrometry/reduce-night.ts';
import {
  R_HOUR_ANGLE_PER_ABERRATION, R_HOUR_ANGLE_PER_PARALLAX, R_ZENITH_PER_ABERRATION, R_ZENITH_PER_PARALLAX, RESULT_STRIDE,
} from '../astrometry/reduction-kernel.ts';
import type { Site } from '../astrometry/site.ts';
import type { StarListRow } from '../formats/star-list.ts';
import type { TimeScale } from '../time/timescale.ts';
import { DEG } from '../units.ts';
import type { JointObservation } from './joint-observations.ts';

/**
 * Fills each observation's parallax and aberration factors (∂H/∂ϖ, ∂z/∂ϖ, ∂H/∂κ, ∂z/∂κ, rad per
 * rad) from the reduction kernel at its observed instant, one night context per night (weather
 * left out: refraction changes these factors by < 1e-4 relative at z < 60°, which is 0.01 mas on
 * a 100 mas parallax). Observations must be grouped by night.
 */
export function fillObservationFactors(observations: JointObservation[], stars: readonly StarListRow[], site: Site, timeScale: TimeScale): void {
  const packed = prepareStars(stars.map((s) => ({
    raRad: s.raDeg * DEG, decRad: s.decDeg * DEG, pmRaCosDecMasYr: s.pmRaCosDecMasYr ?? 0, pmDecMasYr: s.pmDecMasYr ?? 0,
    parallaxMas: s.parallaxMas ?? 0, radialVelocityKmS: s.radialVelocityKmS ?? 0, epochJulianYear: s.epochJyear,
  })));
  let first = 0;
  // One grid of the slow planetary nutation terms for all nights (< 1 µas from the full series; planetary-nutation-grid.ts).
  const planetaryNutation = new PlanetaryNutationGrid();
  while (first < observations.length) {
    let end = first;
    while (end < observations.length && observations[end].night === observations[first].night) end++;
    const count = end - first;
    const tt = new Float64Array(count);
    const starIndex = new Int32Array(count);
    let low = Infinity, high = -Infinity;
    for (let k = 0; k < count; k++) {
      tt[k] = observations[first + k].ttDaysSinceJ2000;
      starIndex[k] = observations[first + k].star;
      low = Math.min(low, tt[k]); high = Math.max(high, tt[k]);
    }
    const centre = (low + high) / 2;
    const night = createNightContext({
      centreTt: { jd1: 2451545, jd2: centre }, halfWidthDays: Math.max(0.5, (high - low) / 2 + 0.01), site, weather: null,
      instantFromTt: (t) => timeScale.fromTt(t), planetaryNutation,
    });
    const out = new Float64Array(count * RESULT_STRIDE);
    reduceNight(night, packed, starIndex, tt, out);
    for (let k = 0; k < count; k++) {
      const o = observations[first + k];
      o.hourAnglePerParallax = out[k * RESULT_STRIDE + R_HOUR_ANGLE_PER_PARALLAX];
      o.zenithPerParallax = out[k * RESULT_STRIDE + R_ZENITH_PER_PARALLAX];
      o.hourAnglePerAberration = out[k * RESULT_STRIDE + R_HOUR_ANGLE_PER_ABERRATION];
      o.zenithPerAberration = out[k * RESULT_STRIDE + R_ZENITH_PER_ABERRATION];
    }
    first = end;
  }
}
