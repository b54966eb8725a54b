import type { Vec3 } from '../math/vec3.ts';

/**
 * Relativistic aberration: the direction in which an observer moving with velocity `beta` (v/c,
 * BCRS, dimensionless) sees a source whose direction at rest is the unit vector `direction`.
 * u′ ∝ u·√(1−β²) + (1 + u·β/(1 + √(1−β²)))·β, renormalised — the Lorentz transformation of
 * a light ray (e.g. Klioner 2003, AJ 125, 1580; the form used by the IAU SOFA aberration
 * routine, whose tiny gravitational correction of order 2e-12 rad we omit). Exact to rounding.
 */
export function aberrate(direction: Vec3, beta: Vec3): Vec3 {
  const out: [number, number, number] = [0, 0, 0];
  aberrateInto(direction[0], direction[1], direction[2], beta, out);
  return out;
}

/** The allocation-free form of `aberrate` for inner loops: writes the result into `out`. */
export function aberrateInto(x: number, y: number, z: number, beta: Vec3, out: [number, number, number]): void {
  const bx = beta[0], by = beta[1], bz = beta[2];
  const inverseGamma = Math.sqrt(1 - (bx * bx + by * by + bz * bz));
  const uDotBeta = x * bx + y * by + z * bz;
  const w = 1 + uDotBeta / (1 + inverseGamma);
  const ax = x * inverseGamma + w * bx, ay = y * inverseGamma + w * by, az = z * inverseGamma + w * bz;
  const inverseLength = 1 / Math.sqrt(ax * ax + ay * ay + az * az);
  out[0] = ax * inverseLength;
  out[1] = ay * inverseLength;
  out[2] = az * inverseLength;
}
