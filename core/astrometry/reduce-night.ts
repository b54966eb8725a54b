import { FRAME_LENGTH } from './instant-frame.ts';
import type { NightContext } from './night-context.ts';
import { fillFrameFromNight } from './night-frame.ts';
import { reduceStar, RESULT_STRIDE } from './reduction-kernel.ts';

const frame = new Float64Array(FRAME_LENGTH);

/**
 * Reduces the transits of one night: transit k is star `starIndex[k]` of `stars` (prepareStars) at
 * TT `ttDaysSinceJ2000[k]` (days from J2000.0); results go to `out` at k·RESULT_STRIDE (layout in
 * reduction-kernel.ts). `first`/`count` select a slice of the arrays, so one set of arrays can hold
 * every night of an archive. No allocation.
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
  for (let k = first; k < first + count; k++) {
    fillFrameFromNight(night, ttDaysSinceJ2000[k], frame);
    reduceStar(frame, stars, starIndex[k], out, k * RESULT_STRIDE);
  }
}
