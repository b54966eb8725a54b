import { CONSTANT_OF_ABERRATION_RAD, LIGHT_TIME_AU_DAYS, SCHWARZSCHILD_RADIUS_SUN_AU, SPEED_OF_LIGHT_AU_PER_DAY } from './constants.ts';
import { F_BETA, F_COS_LAT, F_DAYS, F_EARTH_BETA, F_INVERSE_GAMMA, F_MATRIX, F_OBSERVER, F_SIN_LAT, F_SUN_DISTANCE, F_SUN_UNIT } from './instant-frame.ts';
import { STAR_STRIDE } from './prepared-stars.ts';
import { applyRefraction, refractionScratch } from './refraction-jacobian.ts';

/**
 * Output layout of `reduceStar`, `RESULT_STRIDE` numbers per transit: observed hour angle
 * (rad, positive west, (−π, π]), observed declination (rad), observed zenith distance (rad), then
 * the partial derivatives of those three with respect to the parallax ϖ (rad per rad: the
 * parallax factors, Δθ = ϖ·∂θ/∂ϖ) and with respect to the constant of aberration κ (rad per rad:
 * the aberration factors, Δθ = Δκ·∂θ/∂κ; κ scales Earth's barycentric velocity, κ₀ = 20.49552″).
 * The partials of right ascension are minus those of the hour angle.
 */
export const RESULT_STRIDE = 9;
export const R_HOUR_ANGLE = 0;
export const R_DECLINATION = 1;
export const R_ZENITH = 2;
export const R_HOUR_ANGLE_PER_PARALLAX = 3;
export const R_DECLINATION_PER_PARALLAX = 4;
export const R_ZENITH_PER_PARALLAX = 5;
export const R_HOUR_ANGLE_PER_ABERRATION = 6;
export const R_DECLINATION_PER_ABERRATION = 7;
export const R_ZENITH_PER_ABERRATION = 8;

const C = SPEED_OF_LIGHT_AU_PER_DAY;
const scratch = refractionScratch();

/**
 * The observed place and its partials for star `starIndex` of `stars` (see prepared-stars.ts) at
 * the instant described by `frame` (see instant-frame.ts), written to `out` at `offset`. Same
 * physics as `observedPlace`; the partials are the exact linearisation of parallax, aberration,
 * rotation and refraction (the solar deflection's own derivative, < 3e-5 relative beyond 1° from
 * the Sun, is left out). No allocation: this is the solver's inner loop.
 */
export function reduceStar(frame: Float64Array, stars: Float64Array, starIndex: number, out: Float64Array, offset: number): void {
  const s = starIndex * STAR_STRIDE;
  const bx = frame[F_OBSERVER], by = frame[F_OBSERVER + 1], bz = frame[F_OBSERVER + 2];
  const rx = stars[s], ry = stars[s + 1], rz = stars[s + 2];
  const ux = stars[s + 3], uy = stars[s + 4], uz = stars[s + 5];
  const distance = stars[s + 6];
  let px: number, py: number, pz: number;
  if (distance === Infinity) {
    const elapsed = frame[F_DAYS] + (rx * bx + ry * by + rz * bz) * LIGHT_TIME_AU_DAYS - stars[s + 7];
    px = rx + ux * elapsed; py = ry + uy * elapsed; pz = rz + uz * elapsed;
  } else {
    const elapsed = frame[F_DAYS] + ((rx * bx + ry * by + rz * bz) / distance) * LIGHT_TIME_AU_DAYS - stars[s + 7];
    // Emission interval of the straight-line motion with light-time, as in space-motion.ts.
    const light = C * elapsed;
    const half = (light + distance) * C + (rx * ux + ry * uy + rz * uz);
    const constant = light * (light + 2 * distance);
    const emission = constant / (half + Math.sqrt(half * half - (C * C - (ux * ux + uy * uy + uz * uz)) * constant));
    px = rx + ux * emission - bx; py = ry + uy * emission - by; pz = rz + uz * emission - bz;
  }
  let inverse = 1 / Math.sqrt(px * px + py * py + pz * pz);
  px *= inverse; py *= inverse; pz *= inverse;
  // Parallax direction: ∂p/∂ϖ = −(b − (b·p)p), b the observer's barycentric position (au).
  const bDotP = bx * px + by * py + bz * pz;
  const qx0 = -(bx - bDotP * px), qy0 = -(by - bDotP * py), qz0 = -(bz - bDotP * pz);
  // Solar deflection (light-deflection.ts).
  const ex = frame[F_SUN_UNIT], ey = frame[F_SUN_UNIT + 1], ez = frame[F_SUN_UNIT + 2];
  const em = frame[F_SUN_DISTANCE];
  const pDotE = px * ex + py * ey + pz * ez;
  const w = SCHWARZSCHILD_RADIUS_SUN_AU / em / Math.max(1 + pDotE, 1e-6 / Math.max(em * em, 1));
  const dx = px + w * (ex - pDotE * px), dy = py + w * (ey - pDotE * py), dz = pz + w * (ez - pDotE * pz);
  // Aberration (aberration.ts) and its derivatives with respect to the direction and to κ.
  const betaX = frame[F_BETA], betaY = frame[F_BETA + 1], betaZ = frame[F_BETA + 2];
  const g = frame[F_INVERSE_GAMMA];
  const onePlusG = 1 + g;
  const uDotBeta = dx * betaX + dy * betaY + dz * betaZ;
  const wa = 1 + uDotBeta / onePlusG;
  let ax = dx * g + wa * betaX, ay = dy * g + wa * betaY, az = dz * g + wa * betaZ;
  inverse = 1 / Math.sqrt(ax * ax + ay * ay + az * az);
  ax *= inverse; ay *= inverse; az *= inverse;
  const qDotBeta = (qx0 * betaX + qy0 * betaY + qz0 * betaZ) / onePlusG;
  let fx = g * qx0 + qDotBeta * betaX, fy = g * qy0 + qDotBeta * betaY, fz = g * qz0 + qDotBeta * betaZ;
  let radial = ax * fx + ay * fy + az * fz;
  const pax = (fx - radial * ax) * inverse, pay = (fy - radial * ay) * inverse, paz = (fz - radial * az) * inverse;
  const scale = 1 / CONSTANT_OF_ABERRATION_RAD;
  const vx = frame[F_EARTH_BETA] * scale, vy = frame[F_EARTH_BETA + 1] * scale, vz = frame[F_EARTH_BETA + 2] * scale;
  const dg = -(betaX * vx + betaY * vy + betaZ * vz) / g;
  const dw = (dx * vx + dy * vy + dz * vz) / onePlusG - (uDotBeta * dg) / (onePlusG * onePlusG);
  fx = dx * dg + dw * betaX + wa * vx; fy = dy * dg + dw * betaY + wa * vy; fz = dz * dg + dw * betaZ + wa * vz;
  radial = ax * fx + ay * fy + az * fz;
  const kx = (fx - radial * ax) * inverse, ky = (fy - radial * ay) * inverse, kz = (fz - radial * az) * inverse;
  // Rotation to the hour-angle frame.
  const m = F_MATRIX;
  const lx = frame[m] * ax + frame[m + 1] * ay + frame[m + 2] * az;
  const ly = frame[m + 3] * ax + frame[m + 4] * ay + frame[m + 5] * az;
  const lz = frame[m + 6] * ax + frame[m + 7] * ay + frame[m + 8] * az;
  const t = scratch;
  t[0] = lx; t[1] = ly; t[2] = lz;
  t[3] = frame[m] * pax + frame[m + 1] * pay + frame[m + 2] * paz;
  t[4] = frame[m + 3] * pax + frame[m + 4] * pay + frame[m + 5] * paz;
  t[5] = frame[m + 6] * pax + frame[m + 7] * pay + frame[m + 8] * paz;
  t[6] = frame[m] * kx + frame[m + 1] * ky + frame[m + 2] * kz;
  t[7] = frame[m + 3] * kx + frame[m + 4] * ky + frame[m + 5] * kz;
  t[8] = frame[m + 6] * kx + frame[m + 7] * ky + frame[m + 8] * kz;
  applyRefraction(frame, t);
  writeAngles(t, frame[F_COS_LAT], frame[F_SIN_LAT], out, offset);
}

/** Hour angle, declination, zenith distance of t[0..2] and the partials of the tangents t[3..8]. */
function writeAngles(t: Float64Array, cosLat: number, sinLat: number, out: Float64Array, offset: number): void {
  const x = t[0], y = t[1], z = t[2];
  const horizontal2 = x * x + y * y;
  const horizontal = Math.sqrt(horizontal2);
  const cosZ = x * cosLat + z * sinLat;
  const sinZx = x * sinLat - z * cosLat;
  const sinZ = Math.sqrt(sinZx * sinZx + y * y);
  out[offset + R_HOUR_ANGLE] = Math.atan2(-y, x);
  out[offset + R_DECLINATION] = Math.atan2(z, horizontal);
  out[offset + R_ZENITH] = Math.atan2(sinZ, cosZ);
  for (let k = 0; k < 2; k++) {
    const tx = t[3 + 3 * k], ty = t[4 + 3 * k], tz = t[5 + 3 * k];
    out[offset + 3 + 3 * k] = (y * tx - x * ty) / horizontal2;
    out[offset + 4 + 3 * k] = tz / horizontal;
    out[offset + 5 + 3 * k] = -(tx * cosLat + tz * sinLat) / sinZ;
  }
}
