import { CONSTANT_OF_ABERRATION_RAD, LIGHT_TIME_AU_DAYS, SCHWARZSCHILD_RADIUS_SUN_AU, SPEED_OF_LIGHT_AU_PER_DAY } from './constants.ts';
import {
  NC_ACCELERATION, NC_ANGLE, NC_CENTRE_DAYS, NC_COS_LAT, NC_HELIO, NC_INVERSE_HALF_WIDTH, NC_JERK, NC_LOCAL, NC_NPB,
  NC_POSITION, NC_REFRACTION, NC_SIN_LAT, NC_SITE, NC_SITE_VELOCITY, NC_VELOCITY,
} from './night-context.ts';
import { refractionScratch, refractScratch } from './refraction-jacobian.ts';
import { sinCos } from './sine-cosine.ts';

// Offsets copied into this module's own constants: an imported binding is re-read from its module
// cell at every use in optimised code (about a third of the frame's cost, measured), a local one is not.
const POSITION = NC_POSITION, VELOCITY = NC_VELOCITY, ACCELERATION = NC_ACCELERATION, JERK = NC_JERK;
const HELIO = NC_HELIO, NPB = NC_NPB, LOCAL = NC_LOCAL, ANGLE = NC_ANGLE, SITE = NC_SITE;
const SITE_VELOCITY = NC_SITE_VELOCITY, COS_LAT = NC_COS_LAT, SIN_LAT = NC_SIN_LAT;
const REFRACTION = NC_REFRACTION, INVERSE_HALF_WIDTH = NC_INVERSE_HALF_WIDTH, CENTRE_DAYS = NC_CENTRE_DAYS;
const INVERSE_C = 1 / SPEED_OF_LIGHT_AU_PER_DAY;
const C = SPEED_OF_LIGHT_AU_PER_DAY;
const LIGHT_TIME = LIGHT_TIME_AU_DAYS;
const SCHWARZSCHILD = SCHWARZSCHILD_RADIUS_SUN_AU;
const INVERSE_KAPPA = 1 / CONSTANT_OF_ABERRATION_RAD;
const rotation = new Float64Array(2);
const t = refractionScratch();

/**
 * One transit of a night, fused: the instant frame of `fillFrameFromNight` (night-frame.ts) kept in
 * local variables and the observed place with partials of `reduceStar` (reduction-kernel.ts) —
 * same formulas, same order, so results agree with that pair to rounding (< 1e-12 rad, asserted in
 * unit/astrometry/night-transit-kernel.test.ts). `c` are the night's coefficients, the instant is
 * `ttDaysSinceJ2000[k]` (TT days since J2000.0; the caller checks it lies within the night's span),
 * `s` the star's offset in the packed stars (prepared-stars.ts); writes RESULT_STRIDE numbers
 * (layout in reduction-kernel.ts) at `o`. No allocation: only arrays and integers are passed, as
 * numbers passed to a call that is not inlined are boxed.
 *
 * One function rather than frame + kernel: splitting it forces the frame through an array
 * (29 stores and loads per transit) and the offsets through imported bindings.
 */
export function reduceTransitFromNight(c: Float64Array, ttDaysSinceJ2000: Float64Array, k: number, stars: Float64Array, s: number, out: Float64Array, o: number): void {
  const days = ttDaysSinceJ2000[k];
  const dt = days - c[CENTRE_DAYS];
  // --- the frame (night-frame.ts) ---
  const u = dt * c[INVERSE_HALF_WIDTH];
  const theta = quartic(c, ANGLE, u);
  sinCos(theta, rotation);
  const cos = rotation[0], sin = rotation[1];
  // Q = R3(θ)·NPB (GCRS → TIRS), row-major q0…q8; rows 0 and 1 mix the NPB rows, row 2 is NPB's.
  const n00 = quartic(c, NPB, u), n01 = quartic(c, NPB + 5, u), n02 = quartic(c, NPB + 10, u);
  const n10 = quartic(c, NPB + 15, u), n11 = quartic(c, NPB + 20, u), n12 = quartic(c, NPB + 25, u);
  const q6 = quartic(c, NPB + 30, u), q7 = quartic(c, NPB + 35, u), q8 = quartic(c, NPB + 40, u);
  const q0 = cos * n00 + sin * n10, q1 = cos * n01 + sin * n11, q2 = cos * n02 + sin * n12;
  const q3 = cos * n10 - sin * n00, q4 = cos * n11 - sin * n01, q5 = cos * n12 - sin * n02;
  // M = (R3(λ)·W)·Q, R3(λ)·W linear in u.
  const l00 = c[LOCAL] + u * c[LOCAL + 1], l01 = c[LOCAL + 5] + u * c[LOCAL + 6], l02 = c[LOCAL + 10] + u * c[LOCAL + 11];
  const l10 = c[LOCAL + 15] + u * c[LOCAL + 16], l11 = c[LOCAL + 20] + u * c[LOCAL + 21], l12 = c[LOCAL + 25] + u * c[LOCAL + 26];
  const l20 = c[LOCAL + 30] + u * c[LOCAL + 31], l21 = c[LOCAL + 35] + u * c[LOCAL + 36], l22 = c[LOCAL + 40] + u * c[LOCAL + 41];
  const m0 = l00 * q0 + l01 * q3 + l02 * q6, m1 = l00 * q1 + l01 * q4 + l02 * q7, m2 = l00 * q2 + l01 * q5 + l02 * q8;
  const m3 = l10 * q0 + l11 * q3 + l12 * q6, m4 = l10 * q1 + l11 * q4 + l12 * q7, m5 = l10 * q2 + l11 * q5 + l12 * q8;
  const m6 = l20 * q0 + l21 * q3 + l22 * q6, m7 = l20 * q1 + l21 * q4 + l22 * q7, m8 = l20 * q2 + l21 * q5 + l22 * q8;
  const half = 0.5 * dt * dt;
  const sx = c[SITE], sy = c[SITE + 1], sz = c[SITE + 2];
  const wx = c[SITE_VELOCITY], wy = c[SITE_VELOCITY + 1];
  // Site in GCRS = Qᵀ · TIRS; Earth by its Taylor series.
  const siteX = q0 * sx + q3 * sy + q6 * sz, siteY = q1 * sx + q4 * sy + q7 * sz, siteZ = q2 * sx + q5 * sy + q8 * sz;
  const accX = c[ACCELERATION], accY = c[ACCELERATION + 1], accZ = c[ACCELERATION + 2];
  const velX = c[VELOCITY] + dt * accX + half * c[JERK], velY = c[VELOCITY + 1] + dt * accY + half * c[JERK + 1];
  const velZ = c[VELOCITY + 2] + dt * accZ + half * c[JERK + 2];
  const driftX = dt * c[VELOCITY] + half * accX + siteX, driftY = dt * c[VELOCITY + 1] + half * accY + siteY;
  const driftZ = dt * c[VELOCITY + 2] + half * accZ + siteZ;
  const bx = c[POSITION] + driftX, by = c[POSITION + 1] + driftY, bz = c[POSITION + 2] + driftZ;
  const earthBetaX = velX * INVERSE_C, earthBetaY = velY * INVERSE_C, earthBetaZ = velZ * INVERSE_C;
  const betaX = (velX + q0 * wx + q3 * wy) * INVERSE_C, betaY = (velY + q1 * wx + q4 * wy) * INVERSE_C;
  const betaZ = (velZ + q2 * wx + q5 * wy) * INVERSE_C;
  let ex = c[HELIO] + driftX, ey = c[HELIO + 1] + driftY, ez = c[HELIO + 2] + driftZ;
  const em = Math.sqrt(ex * ex + ey * ey + ez * ez);
  const inverseEm = 1 / em;
  const deflection = SCHWARZSCHILD * inverseEm;
  ex *= inverseEm; ey *= inverseEm; ez *= inverseEm;
  const g = Math.sqrt(1 - (betaX * betaX + betaY * betaY + betaZ * betaZ));
  // --- the star (reduction-kernel.ts) ---
  const rx = stars[s], ry = stars[s + 1], rz = stars[s + 2];
  const ux = stars[s + 3], uy = stars[s + 4], uz = stars[s + 5];
  const distance = stars[s + 6];
  let px: number, py: number, pz: number;
  if (distance === Infinity) {
    const elapsed = days + (rx * bx + ry * by + rz * bz) * LIGHT_TIME - stars[s + 7];
    px = rx + ux * elapsed; py = ry + uy * elapsed; pz = rz + uz * elapsed;
  } else {
    const elapsed = days + ((rx * bx + ry * by + rz * bz) / distance) * LIGHT_TIME - stars[s + 7];
    const light = C * elapsed;
    const halfB = (light + distance) * C + (rx * ux + ry * uy + rz * uz);
    const constant = light * (light + 2 * distance);
    const emission = constant / (halfB + Math.sqrt(halfB * halfB - (C * C - (ux * ux + uy * uy + uz * uz)) * constant));
    px = rx + ux * emission - bx; py = ry + uy * emission - by; pz = rz + uz * emission - bz;
  }
  let inverse = 1 / Math.sqrt(px * px + py * py + pz * pz);
  px *= inverse; py *= inverse; pz *= inverse;
  const bDotP = bx * px + by * py + bz * pz;
  const qx0 = -(bx - bDotP * px), qy0 = -(by - bDotP * py), qz0 = -(bz - bDotP * pz);
  const pDotE = px * ex + py * ey + pz * ez;
  const w = deflection / Math.max(1 + pDotE, 1e-6 / Math.max(em * em, 1));
  const dx = px + w * (ex - pDotE * px), dy = py + w * (ey - pDotE * py), dz = pz + w * (ez - pDotE * pz);
  const inverseOnePlusG = 1 / (1 + g), inverseG = 1 / g;
  const uDotBeta = dx * betaX + dy * betaY + dz * betaZ;
  const wa = 1 + uDotBeta * inverseOnePlusG;
  let ax = dx * g + wa * betaX, ay = dy * g + wa * betaY, az = dz * g + wa * betaZ;
  inverse = 1 / Math.sqrt(ax * ax + ay * ay + az * az);
  ax *= inverse; ay *= inverse; az *= inverse;
  const qDotBeta = (qx0 * betaX + qy0 * betaY + qz0 * betaZ) * inverseOnePlusG;
  let fx = g * qx0 + qDotBeta * betaX, fy = g * qy0 + qDotBeta * betaY, fz = g * qz0 + qDotBeta * betaZ;
  let radial = ax * fx + ay * fy + az * fz;
  const pax = (fx - radial * ax) * inverse, pay = (fy - radial * ay) * inverse, paz = (fz - radial * az) * inverse;
  const vx = earthBetaX * INVERSE_KAPPA, vy = earthBetaY * INVERSE_KAPPA, vz = earthBetaZ * INVERSE_KAPPA;
  const dg = -(betaX * vx + betaY * vy + betaZ * vz) * inverseG;
  const dw = ((dx * vx + dy * vy + dz * vz) - uDotBeta * dg * inverseOnePlusG) * inverseOnePlusG;
  fx = dx * dg + dw * betaX + wa * vx; fy = dy * dg + dw * betaY + wa * vy; fz = dz * dg + dw * betaZ + wa * vz;
  radial = ax * fx + ay * fy + az * fz;
  const kx = (fx - radial * ax) * inverse, ky = (fy - radial * ay) * inverse, kz = (fz - radial * az) * inverse;
  // --- rotation to the hour-angle frame, refraction, angles ---
  t[0] = m0 * ax + m1 * ay + m2 * az;
  t[1] = m3 * ax + m4 * ay + m5 * az;
  t[2] = m6 * ax + m7 * ay + m8 * az;
  t[3] = m0 * pax + m1 * pay + m2 * paz;
  t[4] = m3 * pax + m4 * pay + m5 * paz;
  t[5] = m6 * pax + m7 * pay + m8 * paz;
  t[6] = m0 * kx + m1 * ky + m2 * kz;
  t[7] = m3 * kx + m4 * ky + m5 * kz;
  t[8] = m6 * kx + m7 * ky + m8 * kz;
  const cosLat = c[COS_LAT], sinLat = c[SIN_LAT];
  if (c[REFRACTION + 2] !== 0) {
    t[9] = c[REFRACTION]; t[10] = c[REFRACTION + 1]; t[11] = cosLat; t[12] = sinLat;
    refractScratch(t);
  }
  // Angles and their partials, as writeAngles in reduction-kernel.ts (inlined: a call would box
  // its number arguments), with the three reciprocals taken once.
  const x = t[0], y = t[1], z = t[2];
  const horizontal2 = x * x + y * y;
  const horizontal = Math.sqrt(horizontal2);
  const cosZ = x * cosLat + z * sinLat;
  const sinZx = x * sinLat - z * cosLat;
  const sinZ = Math.sqrt(sinZx * sinZx + y * y);
  out[o] = Math.atan2(-y, x);
  out[o + 1] = Math.atan2(z, horizontal);
  out[o + 2] = Math.atan2(sinZ, cosZ);
  const inverseH2 = 1 / horizontal2, inverseH = 1 / horizontal, inverseSinZ = 1 / sinZ;
  out[o + 3] = (y * t[3] - x * t[4]) * inverseH2;
  out[o + 4] = t[5] * inverseH;
  out[o + 5] = -(t[3] * cosLat + t[5] * sinLat) * inverseSinZ;
  out[o + 6] = (y * t[6] - x * t[7]) * inverseH2;
  out[o + 7] = t[8] * inverseH;
  out[o + 8] = -(t[6] * cosLat + t[8] * sinLat) * inverseSinZ;
}

/** Horner form of a quartic in u from the coefficients at `offset` (night-context.ts layout). */
function quartic(c: Float64Array, offset: number, u: number): number {
  return c[offset] + u * (c[offset + 1] + u * (c[offset + 2] + u * (c[offset + 3] + u * c[offset + 4])));
}
