import { SPEED_OF_LIGHT_AU_PER_DAY } from './constants.ts';
import {
  F_BETA, F_COS_LAT, F_DAYS, F_EARTH_BETA, F_HAS_REFRACTION, F_INVERSE_GAMMA, F_MATRIX, F_OBSERVER,
  F_REFRACTION_A, F_REFRACTION_B, F_SIN_LAT, F_SUN_DISTANCE, F_SUN_UNIT,
} from './instant-frame.ts';
import {
  NC_ACCELERATION, NC_ANGLE, NC_COS_LAT, NC_HELIO, NC_INVERSE_HALF_WIDTH, NC_JERK, NC_LOCAL, NC_NPB, NC_ORDER,
  NC_POSITION, NC_REFRACTION, NC_SIN_LAT, NC_SITE, NC_SITE_VELOCITY, NC_VELOCITY, type NightContext,
} from './night-context.ts';

const INVERSE_C = 1 / SPEED_OF_LIGHT_AU_PER_DAY;
/** Allowed excursion beyond the half-width (fraction) before an instant is refused. */
const MARGIN = 1.05;
const q = new Float64Array(9);

/**
 * Fills the instant frame (instant-frame.ts) for TT `daysSinceJ2000` from a night context: Earth
 * by its Taylor series (position to 2nd, velocity to 2nd order), the NPB and R3(λ)·W matrices and
 * GAST by their quartics, the site rotated by GAST. About 250 floating-point operations, one
 * sine/cosine pair, two square roots. Throws when the instant is outside the context's span.
 */
export function fillFrameFromNight(night: NightContext, daysSinceJ2000: number, frame: Float64Array): void {
  const c = night.coefficients;
  const dt = daysSinceJ2000 - night.centreDaysSinceJ2000;
  if (!(Math.abs(dt) <= night.halfWidthDays * MARGIN)) {
    throw new RangeError(`night context: instant ${dt.toFixed(4)} days from its centre is outside ±${night.halfWidthDays} days; build a context for that night`);
  }
  const u = dt * c[NC_INVERSE_HALF_WIDTH];
  const theta = quarticAt(c, NC_ANGLE, u);
  const cos = Math.cos(theta), sin = Math.sin(theta);
  // Q = R3(θ)·NPB (GCRS → TIRS), row-major.
  for (let col = 0; col < 3; col++) {
    const n0 = quarticAt(c, NC_NPB + NC_ORDER * col, u);
    const n1 = quarticAt(c, NC_NPB + NC_ORDER * (3 + col), u);
    q[col] = cos * n0 + sin * n1;
    q[3 + col] = cos * n1 - sin * n0;
    q[6 + col] = quarticAt(c, NC_NPB + NC_ORDER * (6 + col), u);
  }
  // M = (R3(λ)·W)·Q, the polar-motion part linear in u (it drifts by ~5 mas a day).
  for (let row = 0; row < 3; row++) {
    const o0 = NC_LOCAL + NC_ORDER * 3 * row;
    const l0 = c[o0] + u * c[o0 + 1], l1 = c[o0 + NC_ORDER] + u * c[o0 + NC_ORDER + 1], l2 = c[o0 + 2 * NC_ORDER] + u * c[o0 + 2 * NC_ORDER + 1];
    frame[F_MATRIX + 3 * row] = l0 * q[0] + l1 * q[3] + l2 * q[6];
    frame[F_MATRIX + 3 * row + 1] = l0 * q[1] + l1 * q[4] + l2 * q[7];
    frame[F_MATRIX + 3 * row + 2] = l0 * q[2] + l1 * q[5] + l2 * q[8];
  }
  const half = 0.5 * dt * dt;
  const sx = c[NC_SITE], sy = c[NC_SITE + 1], sz = c[NC_SITE + 2];
  const wx = c[NC_SITE_VELOCITY], wy = c[NC_SITE_VELOCITY + 1];
  let beta2 = 0;
  let helio2 = 0;
  for (let i = 0; i < 3; i++) {
    // Site: GCRS = Qᵀ · TIRS.
    const site = q[i] * sx + q[3 + i] * sy + q[6 + i] * sz;
    const siteVelocity = q[i] * wx + q[3 + i] * wy;
    const acceleration = c[NC_ACCELERATION + i];
    const velocity = c[NC_VELOCITY + i] + dt * acceleration + half * c[NC_JERK + i];
    const drift = dt * c[NC_VELOCITY + i] + half * acceleration + site;
    frame[F_OBSERVER + i] = c[NC_POSITION + i] + drift;
    frame[F_EARTH_BETA + i] = velocity * INVERSE_C;
    const beta = (velocity + siteVelocity) * INVERSE_C;
    frame[F_BETA + i] = beta;
    beta2 += beta * beta;
    const helio = c[NC_HELIO + i] + drift;
    frame[F_SUN_UNIT + i] = helio;
    helio2 += helio * helio;
  }
  const helioDistance = Math.sqrt(helio2);
  const inverseDistance = 1 / helioDistance;
  frame[F_SUN_UNIT] *= inverseDistance;
  frame[F_SUN_UNIT + 1] *= inverseDistance;
  frame[F_SUN_UNIT + 2] *= inverseDistance;
  frame[F_SUN_DISTANCE] = helioDistance;
  frame[F_INVERSE_GAMMA] = Math.sqrt(1 - beta2);
  frame[F_COS_LAT] = c[NC_COS_LAT];
  frame[F_SIN_LAT] = c[NC_SIN_LAT];
  frame[F_REFRACTION_A] = c[NC_REFRACTION];
  frame[F_REFRACTION_B] = c[NC_REFRACTION + 1];
  frame[F_HAS_REFRACTION] = c[NC_REFRACTION + 2];
  frame[F_DAYS] = daysSinceJ2000;
}

function quarticAt(c: Float64Array, o: number, u: number): number {
  return c[o] + u * (c[o + 1] + u * (c[o + 2] + u * (c[o + 3] + u * c[o + 4])));
}
