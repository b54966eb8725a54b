import type { NightContext } from './night-context.ts';
import { reduceTransitFromNight } from './night-transit-kernel.ts';
import { STAR_STRIDE } from './prepared-stars.ts';
import { RESULT_STRIDE } from './reduction-kernel.ts';

/** Allowed excursion beyond the half-width (fraction) before an instant is refused, as night-frame.ts. */
const MARGIN = 1.05;

/**
 * Reduces the transits of one night: transit k is star `starIndex[k]` of `stars` (prepareStars) at
 * TT `ttDaysSinceJ2000[k]` (days from J2000.0); results go to `out` at k·RESULT_STRIDE (layout in
 * reduction-kernel.ts). `first`/`count` select a slice of the arrays, so one set of arrays can hold
 * every night of an archive. No allocation. Same results as `fillFrameFromNight` + `reduceStar`
 * per transit (to rounding), through the fused kernel of night-transit-kernel.ts.
 */
export function reduceNight(
  night: NightContext,
  stars: Float64Array,
  starIndex: Int32Array,
  ttDaysSinceJ2000: Float64Array,
  out: Float64Array,
  first = 0,
  count = starIndex.length - first,
): void {
  if (out.length < (first + count) * RESULT_STRIDE) {
    throw new RangeError(`reduceNight: out holds ${out.length / RESULT_STRIDE} results, ${first + count} needed; allocate RESULT_STRIDE × transits`);
  }
  const c = night.coefficients, centre = night.centreDaysSinceJ2000, limit = night.halfWidthDays * MARGIN;
  const starCount = stars.length / STAR_STRIDE;
  for (let k = first; k < first + count; k++) {
    const days = ttDaysSinceJ2000[k];
    const dt = days - centre;
    if (!(Math.abs(dt) <= limit)) {
      throw new RangeError(`night context: instant ${dt.toFixed(4)} days from its centre is outside ±${night.halfWidthDays} days; build a context for that night`);
    }
    const star = starIndex[k];
    if (!(star >= 0 && star < starCount)) {
      throw new RangeError(`reduceNight: starIndex[${k}] = ${star} is not one of the ${starCount} packed stars; index into the array prepareStars returned`);
    }
    reduceTransitFromNight(c, ttDaysSinceJ2000, k, stars, star * STAR_STRIDE, out, k * RESULT_STRIDE);
  }
}
