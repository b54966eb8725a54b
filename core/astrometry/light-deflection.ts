import type { Vec3 } from '../math/vec3.ts';
import { SCHWARZSCHILD_RADIUS_SUN_AU } from './constants.ts';

/**
 * Light deflection by the Sun for a star at infinite distance: p₁ = p + (2GM/c²)/(d·(1 + p·e)) ·
 * (e − (p·e)p), with `direction` p the unit vector to the star, `sunToObserver` e the unit vector
 * from the Sun to the observer and `sunDistanceAu` d their distance (au). First-order post-
 * Newtonian deflection (e.g. Klioner 2003, AJ 125, 1580; the form of the IAU SOFA solar-deflection
 * routine). 1.75″ at the limb, 4 mas at 90° from the Sun.
 * The factor 1/(1 + p·e) is limited to 1e6·max(d², 1) so a star behind the Sun stays finite; it is
 * reached only within 0.1° of the Sun's centre, inside the disk, where no star is observable.
 */
export function deflectBySun(direction: Vec3, sunToObserver: Vec3, sunDistanceAu: number): Vec3 {
  const [x, y, z] = direction;
  const [ex, ey, ez] = sunToObserver;
  const pDotE = x * ex + y * ey + z * ez;
  const limit = 1e-6 / Math.max(sunDistanceAu * sunDistanceAu, 1);
  const w = SCHWARZSCHILD_RADIUS_SUN_AU / sunDistanceAu / Math.max(1 + pDotE, limit);
  return [x + w * (ex - pDotE * x), y + w * (ey - pDotE * y), z + w * (ez - pDotE * z)];
}
