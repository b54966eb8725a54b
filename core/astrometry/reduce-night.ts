import { writeLocalAngles } from './local-angles.ts';
import { refractLocal } from './local-refraction.ts';
import type { NightContext } from './night-context.ts';
import { LOCAL_STRIDE, localTransitsFromNight } from './night-transit-kernel.ts';
import { STAR_STRIDE } from './prepared-stars.ts';
import { RESULT_STRIDE } from './reduction-kernel.ts';

/** Allowed excursion beyond the half-width (fraction) before an instant is refused, as night-frame.ts. */
const MARGIN = 1.05;
/** Transits per pass: the scratch (9 numbers each, 9 KB) stays in the first-level cache. */
const CHUNK = 128;
const local = new Float64Array(CHUNK * LOCAL_STRIDE);

/**
 * Reduces the transits of one night: transit k is star `starIndex[k]` of `stars` (prepareStars) at
 * TT `ttDaysSinceJ2000[k]` (days from J2000.0); results go to `out` at k·RESULT_STRIDE (layout in
 * reduction-kernel.ts). `first`/`count` select a slice of the arrays, so one set of arrays can hold
 * every night of an archive. Every instant and star index is checked before anything is written.
 * No allocation. Same results as `fillFrameFromNight` + `reduceStar` per transit (to rounding),
 * in three passes over up to 128 transits at a time: up to the hour-angle frame
 * (night-transit-kernel.ts), refraction (local-refraction.ts), angles (local-angles.ts).
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
  checkTransits(night, stars.length / STAR_STRIDE, starIndex, ttDaysSinceJ2000, first, count);
  const c = night.coefficients;
  for (let start = first; start < first + count; start += CHUNK) {
    const n = Math.min(CHUNK, first + count - start);
    localTransitsFromNight(c, ttDaysSinceJ2000, starIndex, stars, start, n, local);
    refractLocal(c, local, n);
    writeLocalAngles(c, local, n, out, start);
  }
}

function checkTransits(night: NightContext, starCount: number, starIndex: Int32Array, ttDaysSinceJ2000: Float64Array, first: number, count: number): void {
  const centre = night.centreDaysSinceJ2000, limit = night.halfWidthDays * MARGIN;
  for (let k = first; k < first + count; k++) {
    const dt = ttDaysSinceJ2000[k] - centre;
    if (!(Math.abs(dt) <= limit)) {
      throw new RangeError(`night context: instant ${dt.toFixed(4)} days from its centre is outside ±${night.halfWidthDays} days; build a context for that night`);
    }
    const star = starIndex[k];
    if (!(star >= 0 && star < starCount)) {
      throw new RangeError(`reduceNight: starIndex[${k}] = ${star} is not one of the ${starCount} packed stars; index into the array prepareStars returned`);
    }
  }
}
