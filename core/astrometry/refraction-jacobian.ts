import * as F from './instant-frame.ts';

/** Scratch for `applyRefraction`: a direction (0–2) and two tangent vectors (3–5, 6–8). */
export function refractionScratch(): Float64Array {
  return new Float64Array(9);
}

/**
 * Refracts the hour-angle-frame direction t[0..2] in place (as `refractInLocalFrame`: toward the
 * zenith by A tan Z + B tan³ Z at the observed Z, two Newton steps from the true Z, which leave an
 * error below 1e-15 rad for Z < 80°) and carries the tangent vectors t[3..5], t[6..8] through the
 * exact derivative of that map. Does nothing without refraction. Within 1e-9 rad of the zenith the
 * tangents are scaled by 1/(1 + A), the limit of the map there.
 */
export function applyRefraction(frame: Float64Array, t: Float64Array): void {
  if (frame[F.F_HAS_REFRACTION] === 0) return;
  const a = frame[F.F_REFRACTION_A], b = frame[F.F_REFRACTION_B];
  const cosLat = frame[F.F_COS_LAT], sinLat = frame[F.F_SIN_LAT];
  const x = t[0], y = t[1], z = t[2];
  const cosTrue = x * cosLat + z * sinLat;
  const sx = x * sinLat - z * cosLat;
  const sinTrue = Math.sqrt(sx * sx + y * y);
  if (sinTrue < 1e-9) {
    const factor = 1 / (1 + a);
    for (let k = 3; k < 9; k++) t[k] *= factor;
    return;
  }
  const zTrue = Math.atan2(sinTrue, cosTrue);
  let zObs = zTrue;
  let tan = 0;
  for (let step = 0; step < 2; step++) {
    tan = Math.tan(zObs);
    const tan2 = tan * tan;
    zObs -= (zObs + (a + b * tan2) * tan - zTrue) / (1 + (a + 3 * b * tan2) * (1 + tan2));
  }
  tan = Math.tan(zObs);
  const gain = 1 / (1 + (a + 3 * b * tan * tan) * (1 + tan * tan));
  const sinObs = Math.sin(zObs), cosObs = Math.cos(zObs);
  const ratio = sinObs / sinTrue;
  const hx = x - cosLat * cosTrue, hy = y, hz = z - sinLat * cosTrue;
  for (let k = 3; k < 9; k += 3) {
    const dx = t[k], dy = t[k + 1], dz = t[k + 2];
    const dCosTrue = dx * cosLat + dz * sinLat;
    const dTrue = -dCosTrue / sinTrue;
    const dObs = gain * dTrue;
    const dRatio = (cosObs * dObs * sinTrue - sinObs * cosTrue * dTrue) / (sinTrue * sinTrue);
    t[k] = -cosLat * sinObs * dObs + (dx - cosLat * dCosTrue) * ratio + hx * dRatio;
    t[k + 1] = dy * ratio + hy * dRatio;
    t[k + 2] = -sinLat * sinObs * dObs + (dz - sinLat * dCosTrue) * ratio + hz * dRatio;
  }
  t[0] = cosLat * cosObs + hx * ratio;
  t[1] = hy * ratio;
  t[2] = sinLat * cosObs + hz * ratio;
}
