import type { Vec3 } from '../math/vec3.ts';
import { aberrate } from './aberration.ts';
import { LIGHT_TIME_AU_DAYS } from './constants.ts';
import { deflectBySun } from './light-deflection.ts';
import { type StarMotion, starPositionAt } from './space-motion.ts';

/**
 * The observer's view of a star, BCRS/GCRS axes: the unit vector after space motion, parallax
 * (observer at `observerAu`, barycentric, au), light deflection by the Sun and aberration
 * (`beta` = observer velocity / c). The star is propagated to the epoch at which the light seen at
 * the observer passes the barycentre (Rømer delay u·b/c, up to 500 s). Returns the "natural"
 * direction too (after parallax only), which the partial derivatives start from.
 */
export function starDirection(
  motion: StarMotion,
  daysSinceJ2000: number,
  observerAu: Vec3,
  sunToObserverUnit: Vec3,
  sunToObserverAu: number,
  beta: Vec3,
): { readonly natural: Vec3; readonly apparent: Vec3 } {
  const r = motion.positionAu;
  const scale = motion.distanceAu === Infinity ? 1 : 1 / motion.distanceAu;
  const roemerDays = (r[0] * observerAu[0] + r[1] * observerAu[1] + r[2] * observerAu[2]) * scale * LIGHT_TIME_AU_DAYS;
  const star = starPositionAt(motion, daysSinceJ2000 + roemerDays);
  let natural: Vec3;
  if (motion.distanceAu === Infinity) {
    natural = star;
  } else {
    const x = star[0] - observerAu[0], y = star[1] - observerAu[1], z = star[2] - observerAu[2];
    const length = Math.hypot(x, y, z);
    natural = [x / length, y / length, z / length];
  }
  const deflected = deflectBySun(natural, sunToObserverUnit, sunToObserverAu);
  return { natural, apparent: aberrate(deflected, beta) };
}
