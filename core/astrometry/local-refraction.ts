import { NC_COS_LAT, NC_REFRACTION, NC_SIN_LAT } from './night-context.ts';
import { LOCAL_STRIDE } from './night-transit-kernel.ts';

/** cos Z below which (Z > 89.5°) no refraction is applied, as refraction-jacobian.ts and observedPlace. */
const HORIZON_COS = Math.cos((89.5 * Math.PI) / 180);
/** tan² 80°: below it δ takes the cheaper closed first step (see below). */
const FAST_REFRACTION_TAN2 = Math.tan((80 * Math.PI) / 180) ** 2;
const STRIDE = LOCAL_STRIDE, COS_LAT = NC_COS_LAT, SIN_LAT = NC_SIN_LAT, REFRACTION = NC_REFRACTION;

/**
 * Refracts the first `count` transits of the hour-angle-frame scratch `local` (layout
 * LOCAL_STRIDE, night-transit-kernel.ts) in place with the night's constants A, B of `c`: each
 * direction is turned toward the zenith by δ = A tan Z + B tan³ Z at the observed Z = Z₀ − δ and its
 * two tangent vectors are carried through the exact derivative of that map — the map of
 * refractScratch (refraction-jacobian.ts), the same numbers to rounding. Nothing without
 * refraction or beyond Z₀ = 89.5°; within 1e-9 rad of the zenith the tangents are scaled by
 * 1/(1 + A), the limit of the map there. No allocation.
 */
export function refractLocal(c: Float64Array, local: Float64Array, count: number): void {
  if (c[REFRACTION + 2] === 0) return;
  const a = c[REFRACTION], b = c[REFRACTION + 1];
  const cosLat = c[COS_LAT], sinLat = c[SIN_LAT];
  for (let j = 0; j < count * STRIDE; j += STRIDE) {
    let x = local[j], y = local[j + 1], z = local[j + 2];
    let p0 = local[j + 3], p1 = local[j + 4], p2 = local[j + 5];
    let k0 = local[j + 6], k1 = local[j + 7], k2 = local[j + 8];
    const cosTrue = x * cosLat + z * sinLat;
    if (cosTrue >= HORIZON_COS) {
      const sx = x * sinLat - z * cosLat;
      const sinTrue = Math.sqrt(sx * sx + y * y);
      if (sinTrue < 1e-9) {
        const factor = 1 / (1 + a);
        p0 *= factor; p1 *= factor; p2 *= factor; k0 *= factor; k1 *= factor; k2 *= factor;
      } else {
        // δ solves δ = R(Z₀ − δ). Below Z₀ = 80°: Newton's step from δ = 0, then one more, each as
        // one fraction in sin and cos (s² + c² = 1; tan Z₀ = s/c, tan(Z₀ − δ₁) = n/d), so only two
        // divisions lie on the chain; the gain R′/(1 + R′) is carried from δ₁ to δ₂ to first order
        // (residual < 1e-15 rad, < 1e-12 in the gain; agreement with refractScratch is asserted in
        // unit/astrometry/night-transit-kernel.test.ts). Beyond: refractScratch's two steps from δ = R(Z₀).
        const c2 = cosTrue * cosTrue, s2 = sinTrue * sinTrue;
        let delta: number, gain: number;
        if (s2 < FAST_REFRACTION_TAN2 * c2) {
          const delta1 = (sinTrue * cosTrue * (a * c2 + b * s2)) / (c2 * c2 + a * c2 + 3 * b * s2);
          const e2 = delta1 * delta1;
          const tanDelta = delta1 * (1 + e2 * (1 / 3 + e2 * (2 / 15)));
          const n = sinTrue - cosTrue * tanDelta, d = cosTrue + sinTrue * tanDelta;
          const n2 = n * n, d2 = d * d, m2 = n2 + d2;
          const slopeTop = (a * d2 + 3 * b * n2) * m2;
          const inverse = 1 / (d2 * d2 + slopeTop);
          delta = delta1 - (delta1 * d2 * d2 - n * d * (a * d2 + b * n2)) * inverse;
          // Z falls by δ₂ − δ₁: R′ changes by −R″·(δ₂ − δ₁), R″ = 2t(1 + t²)(A + 3B + 6Bt²) at
          // t = tan(Z₀ − δ₁) to first order in δ₁ (off the division chain); 1/(1 + R′) to first order.
          const tanTrue = sinTrue / cosTrue, t = tanTrue - (1 + tanTrue * tanTrue) * delta1, t2 = t * t;
          const curvature = 2 * t * (1 + t2) * (a + 3 * b + 6 * b * t2);
          const inverse1 = d2 * d2 * inverse;
          gain = 1 - inverse1 * (1 + curvature * (delta - delta1) * inverse1);
        } else {
          const tanTrue = sinTrue / cosTrue;
          delta = (a + b * tanTrue * tanTrue) * tanTrue;
          gain = 0;
          for (let step = 0; step < 2; step++) {
            const e2 = delta * delta;
            const tanDelta = delta * (1 + e2 * (1 / 3 + e2 * (2 / 15)));
            const tanObs = (tanTrue - tanDelta) / (1 + tanTrue * tanDelta);
            const tan2 = tanObs * tanObs;
            const slope = (a + 3 * b * tan2) * (1 + tan2);
            const inverse = 1 / (1 + slope);
            delta -= (delta - (a + b * tan2) * tanObs) * inverse;
            gain = slope * inverse;
          }
        }
        const d2 = delta * delta;
        const cosDelta = 1 - d2 * (0.5 - d2 / 24);
        const sinDelta = delta * (1 - d2 * (1 / 6 - d2 / 120));
        const inverseSin = 1 / sinTrue;
        const wx = (cosLat - cosTrue * x) * inverseSin, wy = -cosTrue * y * inverseSin, wz = (sinLat - cosTrue * z) * inverseSin;
        const ex = y * sinLat * inverseSin, ey = -sx * inverseSin, ez = -y * cosLat * inverseSin;
        const vertical = 1 - gain, across = cosDelta - sinDelta * cosTrue * inverseSin;
        const turnedX = wx * cosDelta - x * sinDelta, turnedY = wy * cosDelta - y * sinDelta, turnedZ = wz * cosDelta - z * sinDelta;
        let along = (p0 * wx + p1 * wy + p2 * wz) * vertical, side = (p0 * ex + p1 * ey + p2 * ez) * across;
        p0 = along * turnedX + side * ex; p1 = along * turnedY + side * ey; p2 = along * turnedZ + side * ez;
        along = (k0 * wx + k1 * wy + k2 * wz) * vertical; side = (k0 * ex + k1 * ey + k2 * ez) * across;
        k0 = along * turnedX + side * ex; k1 = along * turnedY + side * ey; k2 = along * turnedZ + side * ez;
        x = x * cosDelta + wx * sinDelta; y = y * cosDelta + wy * sinDelta; z = z * cosDelta + wz * sinDelta;
      }
    }
    local[j] = x; local[j + 1] = y; local[j + 2] = z;
    local[j + 3] = p0; local[j + 4] = p1; local[j + 5] = p2;
    local[j + 6] = k0; local[j + 7] = k1; local[j + 8] = k2;
  }
}
