import { type CatalogueStar, checkCatalogueStar } from './star.ts';
import { starMotion } from './space-motion.ts';

/**
 * Stars packed for the reduction kernel, `STAR_STRIDE` numbers each: 0–2 position at the
 * catalogue epoch (au; a unit vector for zero parallax), 3–5 inertial velocity (au/day; rad/day
 * for zero parallax), 6 distance (au, Infinity for zero parallax), 7 catalogue epoch (TDB days
 * since J2000.0). See `starMotion` for the physics.
 */
export const STAR_STRIDE = 8;

export function prepareStars(stars: readonly CatalogueStar[]): Float64Array {
  const out = new Float64Array(stars.length * STAR_STRIDE);
  stars.forEach((star, index) => {
    checkCatalogueStar(star, `stars[${index}]`);
    const motion = starMotion(star);
    const o = index * STAR_STRIDE;
    out.set(motion.positionAu, o);
    out.set(motion.velocityAuPerDay, o + 3);
    out[o + 6] = motion.distanceAu;
    out[o + 7] = motion.epochDaysSinceJ2000;
  });
  return out;
}
