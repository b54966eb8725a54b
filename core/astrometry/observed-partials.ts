import { frameFromContext } from './instant-frame.ts';
import type { PlaceContext } from './place-context.ts';
import { STAR_STRIDE } from './prepared-stars.ts';
import { reduceStar, RESULT_STRIDE } from './reduction-kernel.ts';
import type { StarMotion } from './space-motion.ts';

/**
 * Observed hour angle, declination, zenith distance and their parallax and aberration factors
 * (see reduction-kernel.ts for the layout and units) of one star at one context.
 */
export function observedWithPartials(context: PlaceContext, motion: StarMotion): Float64Array {
  const star = new Float64Array(STAR_STRIDE);
  star.set(motion.positionAu, 0);
  star.set(motion.velocityAuPerDay, 3);
  star[6] = motion.distanceAu;
  star[7] = motion.epochDaysSinceJ2000;
  const out = new Float64Array(RESULT_STRIDE);
  reduceStar(frameFromContext(context), star, 0, out, 0);
  return out;
}
