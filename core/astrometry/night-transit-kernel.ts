import { CONSTANT_OF_ABERRATION_RAD, LIGHT_TIME_AU_DAYS, SCHWARZSCHILD_RADIUS_SUN_AU, SPEED_OF_LIGHT_AU_PER_DAY } from './constants.ts';
import {
  NC_ACCELERATION, NC_ANGLE, NC_CENTRE_DAYS, NC_COS_LAT, NC_HELIO, NC_INVERSE_HALF_WIDTH, NC_JERK, NC_LOCAL, NC_NPB,
  NC_POSITION, NC_REFRACTION, NC_SIN_LAT, NC_SITE, NC_SITE_VELOCITY, NC_VELOCITY,
} from './night-context.ts';
import { atan2Fast } from './arctangent.ts';
import { SINE_TABLE_NODES, SINE_TAU_HIGH, SINE_TAU_LOW, sineTableCos, sineTableSin } from './sine-cosine.ts';

// Offsets copied into this module's own constants: an imported binding is re-read from its module
// cell at every use in optimised code (about a third of the frame's cost, measured), a local one is not.
const POSITION = NC_POSITION, VELOCITY = NC_VELOCITY, ACCELERATION = NC_ACCELERATION, JERK = NC_JERK;
const HELIO = NC_HELIO, LOCAL = NC_LOCAL, ANGLE = NC_ANGLE, SITE = NC_SITE;
const SITE_VELOCITY = NC_SITE_VELOCITY, COS_LAT = NC_COS_LAT, SIN_LAT = NC_SIN_LAT;
const N00 = NC_NPB, N01 = NC_NPB + 5, N02 = NC_NPB + 10, N10 = NC_NPB + 15, N11 = NC_NPB + 20, N12 = NC_NPB + 25;
const N20 = NC_NPB + 30, N21 = NC_NPB + 35, N22 = NC_NPB + 40;
const REFRACTION = NC_REFRACTION, INVERSE_HALF_WIDTH = NC_INVERSE_HALF_WIDTH, CENTRE_DAYS = NC_CENTRE_DAYS;
const INVERSE_C = 1 / SPEED_OF_LIGHT_AU_PER_DAY;
const C = SPEED_OF_LIGHT_AU_PER_DAY;
const LIGHT_TIME = LIGHT_TIME_AU_DAYS;
const SCHWARZSCHILD = SCHWARZSCHILD_RADIUS_SUN_AU;
const INVERSE_KAPPA = 1 / CONSTANT_OF_ABERRATION_RAD;
// The table and range reduction of sine-cosine.ts (two-part 2π, Cody & Waite), as local bindings.
const NODES = SINE_TABLE_NODES, nodeCos = sineTableCos, nodeSin = sineTableSin;
const INVERSE_TAU = 1 / (2 * Math.PI), TAU_HIGH = SINE_TAU_HIGH, TAU_LOW = SINE_TAU_LOW;
const STEP = (2 * Math.PI) / NODES, INVERSE_STEP = NODES / (2 * Math.PI);
/** cos Z below which (Z > 89.5°) no refraction is applied, as refraction-jacobian.ts and observedPlace. */
const HORIZON_COS = Math.cos((89.5 * Math.PI) / 180);
/** tan² 80°: below it the refraction takes the cheaper closed first step (see the kernel). */
const FAST_REFRACTION_TAN2 = Math.tan((80 * Math.PI) / 180) ** 2;

/**
 * One transit of a night, fused: the instant frame of `fillFrameFromNight` (night-frame.ts) kept in
 * local variables and the observed place with partials of `reduceStar` (reduction-kernel.ts) —
 * same formulas, same order, but the angles by `atan2Fast` (< 1e-15 rad from Math.atan2) and, below
 * Z = 80°, refraction's δ by one fewer division; results agree with that pair to rounding
 * (< 1e-12 rad, asserted in unit/astrometry/night-transit-kernel.test.ts). `c` are the night's coefficients, the instant is
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
  // Quartics in u written out (Horner) and the sine and cosine of sine-cosine.ts inlined by hand:
  // V8's inlining budget goes to the three arctangents, and a call left in place boxes numbers.
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
  // --- rotation to the hour-angle frame, refraction (refraction-jacobian.ts), angles ---
  let x = m0 * ax + m1 * ay + m2 * az, y = m3 * ax + m4 * ay + m5 * az, z = m6 * ax + m7 * ay + m8 * az;
  let p0 = m0 * pax + m1 * pay + m2 * paz, p1 = m3 * pax + m4 * pay + m5 * paz, p2 = m6 * pax + m7 * pay + m8 * paz;
  let k0 = m0 * kx + m1 * ky + m2 * kz, k1 = m3 * kx + m4 * ky + m5 * kz, k2 = m6 * kx + m7 * ky + m8 * kz;
  const cosLat = c[COS_LAT], sinLat = c[SIN_LAT];
  const cosTrue = x * cosLat + z * sinLat;
  if (c[REFRACTION + 2] !== 0 && cosTrue >= HORIZON_COS) {
    // refractScratch inlined: a call would take its numbers boxed and its vectors through an array.
    const a = c[REFRACTION], b = c[REFRACTION + 1];
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
  // Angles and their partials, as writeAngles in reduction-kernel.ts (inlined: a call would box
  // its number arguments), with the three reciprocals taken once.
  const horizontal2 = x * x + y * y;
  const horizontal = Math.sqrt(horizontal2);
  const cosZ = x * cosLat + z * sinLat;
  const sinZx = x * sinLat - z * cosLat;
  const sinZ = Math.sqrt(sinZx * sinZx + y * y);
  out[o] = atan2Fast(-y, x);
  out[o + 1] = atan2Fast(z, horizontal);
  out[o + 2] = atan2Fast(sinZ, cosZ);
  const inverseH = 1 / horizontal, inverseH2 = inverseH * inverseH, inverseSinZ = 1 / sinZ;
  out[o + 3] = (y * p0 - x * p1) * inverseH2;
  out[o + 4] = p2 * inverseH;
  out[o + 5] = -(p0 * cosLat + p2 * sinLat) * inverseSinZ;
  out[o + 6] = (y * k0 - x * k1) * inverseH2;
  out[o + 7] = k2 * inverseH;
  out[o + 8] = -(k0 * cosLat + k2 * sinLat) * inverseSinZ;
}
