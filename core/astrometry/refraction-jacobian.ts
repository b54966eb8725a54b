import { F_COS_LAT, F_HAS_REFRACTION, F_REFRACTION_A, F_REFRACTION_B, F_SIN_LAT } from './instant-frame.ts';

/**
 * Scratch for `applyRefraction` and `refractScratch`: a direction (0–2), two tangent vectors
 * (3–5, 6–8), then the refraction constants A, B (rad) and cos φ, sin φ (9–12).
 */
export function refractionScratch(): Float64Array {
  return new Float64Array(13);
}

/** cos Z below which (Z > 89.5°) the kernel applies no refraction, as observedPlace does. */
const HORIZON_COS = Math.cos((89.5 * Math.PI) / 180);

/**
 * Refracts the hour-angle-frame unit vector t[0..2] in place — turns it toward the zenith by
 * δ = A tan Z + B tan³ Z at the observed Z = Z₀ − δ (refraction.ts) — and carries the tangent
 * vectors t[3..5], t[6..8] (perpendicular to t[0..2]) through the exact derivative of that map. No trigonometric calls:
 * tan Z = tan(Z₀ − δ) from tan Z₀ and the series of tan δ, two Newton steps on δ starting from
 * δ = R(Z₀) (residual < 1e-15 rad for Z < 85°), cos δ and sin δ by their series (δ < 0.01 rad, 1e-16).
 * Does nothing without refraction or beyond Z₀ = 89.5°; within 1e-9 rad of the zenith the tangents
 * are scaled by 1/(1 + A), the limit of the map there.
 */
export function applyRefraction(frame: Float64Array, t: Float64Array): void {
  if (frame[F_HAS_REFRACTION] === 0) return;
  t[9] = frame[F_REFRACTION_A];
  t[10] = frame[F_REFRACTION_B];
  t[11] = frame[F_COS_LAT];
  t[12] = frame[F_SIN_LAT];
  refractScratch(t);
}

/**
 * `applyRefraction` with the constants in the scratch itself (t[9..12]: A and B of refraction.ts
 * in radians, cos φ and sin φ of the site's latitude): refracts t[0..2] and carries t[3..8] in
 * place, as described there. The constants travel in the array because numbers passed to a call
 * that is not inlined are boxed, one allocation each per transit.
 */
export function refractScratch(t: Float64Array): void {
  const a = t[9], b = t[10], cosLat = t[11], sinLat = t[12];
  const x = t[0], y = t[1], z = t[2];
  const cosZ = x * cosLat + z * sinLat;
  if (cosZ < HORIZON_COS) return;
  const sx = x * sinLat - z * cosLat;
  const sinZ = Math.sqrt(sx * sx + y * y);
  if (sinZ < 1e-9) {
    const factor = 1 / (1 + a);
    for (let k = 3; k < 9; k++) t[k] *= factor;
    return;
  }
  const tanTrue = sinZ / cosZ;
  let delta = (a + b * tanTrue * tanTrue) * tanTrue;
  // Two Newton steps on δ; the map's slope dδ/dZ₀ = R′/(1 + R′) is taken at the second iterate,
  // which differs from the converged δ by < 2e-8 rad at Z = 85° (a relative 1e-8 in the gain).
  let gain = 0;
  for (let step = 0; step < 2; step++) {
    const d2 = delta * delta;
    const tanDelta = delta * (1 + d2 * (1 / 3 + d2 * (2 / 15)));
    const tanObs = (tanTrue - tanDelta) / (1 + tanTrue * tanDelta);
    const tan2 = tanObs * tanObs;
    const slope = (a + 3 * b * tan2) * (1 + tan2);
    const inverse = 1 / (1 + slope);
    delta -= (delta - (a + b * tan2) * tanObs) * inverse;
    gain = slope * inverse;
  }
  const d2 = delta * delta;
  const cosDelta = 1 - d2 * (0.5 - d2 / 24);
  const sinDelta = delta * (1 - d2 * (1 / 6 - d2 / 120));
  // w: unit vector toward the zenith, perpendicular to the direction; e = x × w, along the almucantar.
  const inverseSin = 1 / sinZ;
  const wx = (cosLat - cosZ * x) * inverseSin, wy = -cosZ * y * inverseSin, wz = (sinLat - cosZ * z) * inverseSin;
  const ex = y * sinLat * inverseSin, ey = -sx * inverseSin, ez = -y * cosLat * inverseSin;
  // The map keeps the azimuth and sends Z₀ to Z₀ − δ(Z₀): a tangent's part along w is scaled by
  // 1 − dδ/dZ₀ and turned with the direction (w → w cos δ − x sin δ), its part along e by
  // sin Z / sin Z₀ = cos δ − sin δ / tan Z₀. Exact for tangents (perpendicular to x).
  const vertical = 1 - gain, horizontal = cosDelta - sinDelta * cosZ * inverseSin;
  const turnedX = wx * cosDelta - x * sinDelta, turnedY = wy * cosDelta - y * sinDelta, turnedZ = wz * cosDelta - z * sinDelta;
  for (let k = 3; k < 9; k += 3) {
    const dx = t[k], dy = t[k + 1], dz = t[k + 2];
    const along = (dx * wx + dy * wy + dz * wz) * vertical;
    const across = (dx * ex + dy * ey + dz * ez) * horizontal;
    t[k] = along * turnedX + across * ex;
    t[k + 1] = along * turnedY + across * ey;
    t[k + 2] = along * turnedZ + across * ez;
  }
  t[0] = x * cosDelta + wx * sinDelta;
  t[1] = y * cosDelta + wy * sinDelta;
  t[2] = z * cosDelta + wz * sinDelta;
}
