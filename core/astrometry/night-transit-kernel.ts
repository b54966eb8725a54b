import { CONSTANT_OF_ABERRATION_RAD, LIGHT_TIME_AU_DAYS, SCHWARZSCHILD_RADIUS_SUN_AU, SPEED_OF_LIGHT_AU_PER_DAY } from './constants.ts';
import {
  NC_ACCELERATION, NC_ANGLE, NC_CENTRE_DAYS, NC_HELIO, NC_INVERSE_HALF_WIDTH, NC_JERK, NC_LOCAL, NC_NPB,
  NC_POSITION, NC_SITE, NC_SITE_VELOCITY, NC_VELOCITY,
} from './night-context.ts';
import { STAR_STRIDE } from './prepared-stars.ts';
import { SINE_TABLE_NODES, SINE_TAU_HIGH, SINE_TAU_LOW, sineTableCos, sineTableSin } from './sine-cosine.ts';

// Offsets copied into this module's own constants: an imported binding is re-read from its module
// cell at every use in optimised code (about a third of the frame's cost, measured), a local one is not.
const POSITION = NC_POSITION, VELOCITY = NC_VELOCITY, ACCELERATION = NC_ACCELERATION, JERK = NC_JERK;
const HELIO = NC_HELIO, LOCAL = NC_LOCAL, ANGLE = NC_ANGLE, SITE = NC_SITE;
const SITE_VELOCITY = NC_SITE_VELOCITY;
const N00 = NC_NPB, N01 = NC_NPB + 5, N02 = NC_NPB + 10, N10 = NC_NPB + 15, N11 = NC_NPB + 20, N12 = NC_NPB + 25;
const N20 = NC_NPB + 30, N21 = NC_NPB + 35, N22 = NC_NPB + 40;
const INVERSE_HALF_WIDTH = NC_INVERSE_HALF_WIDTH, CENTRE_DAYS = NC_CENTRE_DAYS;
const INVERSE_C = 1 / SPEED_OF_LIGHT_AU_PER_DAY;
const C = SPEED_OF_LIGHT_AU_PER_DAY;
const LIGHT_TIME = LIGHT_TIME_AU_DAYS;
const SCHWARZSCHILD = SCHWARZSCHILD_RADIUS_SUN_AU;
const INVERSE_KAPPA = 1 / CONSTANT_OF_ABERRATION_RAD;
// The table and range reduction of sine-cosine.ts (two-part 2π, Cody & Waite), as local bindings.
const NODES = SINE_TABLE_NODES, nodeCos = sineTableCos, nodeSin = sineTableSin;
const INVERSE_TAU = 1 / (2 * Math.PI), TAU_HIGH = SINE_TAU_HIGH, TAU_LOW = SINE_TAU_LOW;
const STEP = (2 * Math.PI) / NODES, INVERSE_STEP = NODES / (2 * Math.PI);
/**
 * Numbers per transit in the hour-angle-frame scratch: the unit direction (0–2; x toward hour
 * angle 0 on the equator, y toward −6 h, z toward the celestial pole, so the hour angle is
 * atan2(−y, x) as in reduction-kernel.ts), then its derivatives ∂/∂ϖ (3–5) and ∂/∂κ (6–8).
 */
export const LOCAL_STRIDE = 9;

/**
 * Transits `first` … `first + count − 1` of a night, up to the hour-angle frame: the instant frame
 * of `fillFrameFromNight` (night-frame.ts) kept in local variables and the observed place with
 * partials of `reduceStar` (reduction-kernel.ts) — same formulas, same order — before refraction.
 * Transit k is star `starIndex[k]` of the packed `stars` (prepared-stars.ts) at TT
 * `ttDaysSinceJ2000[k]` (days since J2000.0; the caller checks both); `c` are the night's
 * coefficients. Writes LOCAL_STRIDE numbers per transit to `local` from 0: the unit direction in
 * the hour-angle frame and its derivatives with respect to the parallax and to the constant of
 * aberration (tangent vectors), for `refractLocal` (local-refraction.ts) and `writeLocalAngles`
 * (local-angles.ts).
 *
 * One loop over the transits in one function, rather than a frame and a kernel per transit:
 * splitting per transit forces the frame through an array (29 stores and loads) and numbers
 * through boxed call arguments. The three passes cost the same as the single fused function
 * they replace (A/B runs, within 2%) and keep each function readable.
 */
export function localTransitsFromNight(
  c: Float64Array, ttDaysSinceJ2000: Float64Array, starIndex: Int32Array, stars: Float64Array,
  first: number, count: number, local: Float64Array,
): void {
  const centre = c[CENTRE_DAYS], inverseHalfWidth = c[INVERSE_HALF_WIDTH];
  for (let k = first, j = 0; k < first + count; k++, j += LOCAL_STRIDE) {
    const s = starIndex[k] * STAR_STRIDE;
    const days = ttDaysSinceJ2000[k];
    const dt = days - centre;
    // --- the frame (night-frame.ts) ---
    const u = dt * inverseHalfWidth;
    // Quartics in u written out (Horner) and the sine and cosine of sine-cosine.ts inlined by hand:
    // V8's inlining budget does not cover them all, and a call left in place boxes numbers.
    const theta = c[ANGLE] + u * (c[ANGLE + 1] + u * (c[ANGLE + 2] + u * (c[ANGLE + 3] + u * c[ANGLE + 4])));
    const turns = Math.floor(theta * INVERSE_TAU);
    const reduced = theta - turns * TAU_HIGH - turns * TAU_LOW;
    const node = Math.round(reduced * INVERSE_STEP);
    const r = reduced - node * STEP, r2 = r * r;
    const cosR = 1 - r2 * (0.5 - r2 * (1 / 24 - r2 * (1 / 720))), sinR = r * (1 - r2 * (1 / 6 - r2 * (1 / 120)));
    const index = node < 0 ? node + NODES : node;
    const nodeC = nodeCos[index], nodeS = nodeSin[index];
    const cos = nodeC * cosR - nodeS * sinR, sin = nodeS * cosR + nodeC * sinR;
    // Q = R3(θ)·NPB (GCRS → TIRS), row-major q0…q8; rows 0 and 1 mix the NPB rows, row 2 is NPB's.
    const n00 = c[N00] + u * (c[N00 + 1] + u * (c[N00 + 2] + u * (c[N00 + 3] + u * c[N00 + 4])));
    const n01 = c[N01] + u * (c[N01 + 1] + u * (c[N01 + 2] + u * (c[N01 + 3] + u * c[N01 + 4])));
    const n02 = c[N02] + u * (c[N02 + 1] + u * (c[N02 + 2] + u * (c[N02 + 3] + u * c[N02 + 4])));
    const n10 = c[N10] + u * (c[N10 + 1] + u * (c[N10 + 2] + u * (c[N10 + 3] + u * c[N10 + 4])));
    const n11 = c[N11] + u * (c[N11 + 1] + u * (c[N11 + 2] + u * (c[N11 + 3] + u * c[N11 + 4])));
    const n12 = c[N12] + u * (c[N12 + 1] + u * (c[N12 + 2] + u * (c[N12 + 3] + u * c[N12 + 4])));
    const q6 = c[N20] + u * (c[N20 + 1] + u * (c[N20 + 2] + u * (c[N20 + 3] + u * c[N20 + 4])));
    const q7 = c[N21] + u * (c[N21 + 1] + u * (c[N21 + 2] + u * (c[N21 + 3] + u * c[N21 + 4])));
    const q8 = c[N22] + u * (c[N22 + 1] + u * (c[N22 + 2] + u * (c[N22 + 3] + u * c[N22 + 4])));
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
    // √(1 − β²), 1/√(1 − β²) and 1/(1 + √(1 − β²)) by their series in β²: β < 1.1e-4 for an
    // observer on Earth, so the first omitted terms (β⁶/16 and like) are below 1e-24.
    const beta2 = betaX * betaX + betaY * betaY + betaZ * betaZ;
    const g = 1 - beta2 * (0.5 + 0.125 * beta2);
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
    // The floor of light-deflection.ts, 1e-6/max(em², 1), with its division turned into a product.
    const w = deflection / Math.max(1 + pDotE, 1e-6 * Math.min(inverseEm * inverseEm, 1));
    const dx = px + w * (ex - pDotE * px), dy = py + w * (ey - pDotE * py), dz = pz + w * (ez - pDotE * pz);
    const inverseOnePlusG = 0.5 + beta2 * (0.125 + 0.0625 * beta2), inverseG = 1 + beta2 * (0.5 + 0.375 * beta2);
    const uDotBeta = dx * betaX + dy * betaY + dz * betaZ;
    const wa = 1 + uDotBeta * inverseOnePlusG;
    let ax = dx * g + wa * betaX, ay = dy * g + wa * betaY, az = dz * g + wa * betaZ;
    // |a| = 1 + d·β exactly for a unit d (the aberration formula's own denominator), so no square
    // root; the deflection lengthens d by (w sin ψ)²/2, < 4e-11 at the Sun's limb, < 2e-13 at 1°.
    inverse = 1 / (1 + uDotBeta);
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
    // --- rotation to the hour-angle frame ---
    const x = m0 * ax + m1 * ay + m2 * az, y = m3 * ax + m4 * ay + m5 * az, z = m6 * ax + m7 * ay + m8 * az;
    const p0 = m0 * pax + m1 * pay + m2 * paz, p1 = m3 * pax + m4 * pay + m5 * paz, p2 = m6 * pax + m7 * pay + m8 * paz;
    const k0 = m0 * kx + m1 * ky + m2 * kz, k1 = m3 * kx + m4 * ky + m5 * kz, k2 = m6 * kx + m7 * ky + m8 * kz;
    local[j] = x; local[j + 1] = y; local[j + 2] = z;
    local[j + 3] = p0; local[j + 4] = p1; local[j + 5] = p2;
    local[j + 6] = k0; local[j + 7] = k1; local[j + 8] = k2;
  }
}
