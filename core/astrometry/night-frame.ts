import { SPEED_OF_LIGHT_AU_PER_DAY } from './constants.ts';
import * as F from './instant-frame.ts';
import * as N from './night-context.ts';
import type { NightContext } from './night-context.ts';

const INVERSE_C = 1 / SPEED_OF_LIGHT_AU_PER_DAY;
/** Allowed excursion beyond the half-width (fraction) before an instant is refused. */
const MARGIN = 1.05;

/**
 * Fills the instant frame (instant-frame.ts) for TT `daysSinceJ2000` from a night context: Earth
 * by its Taylor series (position to 2nd, velocity to 2nd order), the NPB and R3(λ)·W matrices and
 * GAST by their quartics, the site rotated by GAST. About 150 floating-point operations, one
 * sine/cosine pair. Throws when the instant is outside the context's span.
 */
export function fillFrameFromNight(night: NightContext, daysSinceJ2000: number, frame: Float64Array): void {
  const c = night.coefficients;
  const dt = daysSinceJ2000 - night.centreDaysSinceJ2000;
  if (!(Math.abs(dt) <= night.halfWidthDays * MARGIN)) {
    throw new RangeError(`night context: instant ${dt.toFixed(4)} days from its centre is outside ±${night.halfWidthDays} days; build a context for that night`);
  }
  const half = 0.5 * dt * dt;
  const u = dt * c[N.NC_INVERSE_HALF_WIDTH];
  const theta = quarticAt(c, N.NC_ANGLE, u);
  const cos = Math.cos(theta), sin = Math.sin(theta);
  // Q = R3(θ)·NPB (GCRS → TIRS), row-major in q.
  const q = scratch;
  for (let e = 0; e < 9; e++) {
    npb[e] = quarticAt(c, N.NC_NPB + N.NC_ORDER * e, u);
    local[e] = quarticAt(c, N.NC_LOCAL + N.NC_ORDER * e, u);
  }
  for (let col = 0; col < 3; col++) {
    q[col] = cos * npb[col] + sin * npb[3 + col];
    q[3 + col] = -sin * npb[col] + cos * npb[3 + col];
    q[6 + col] = npb[6 + col];
  }
  for (let row = 0; row < 3; row++) {
    for (let col = 0; col < 3; col++) {
      frame[F.F_MATRIX + 3 * row + col] = local[3 * row] * q[col] + local[3 * row + 1] * q[3 + col] + local[3 * row + 2] * q[6 + col];
    }
  }
  let beta2 = 0;
  let helio2 = 0;
  for (let i = 0; i < 3; i++) {
    // Site: GCRS = Qᵀ · TIRS.
    const site = q[i] * c[N.NC_SITE] + q[3 + i] * c[N.NC_SITE + 1] + q[6 + i] * c[N.NC_SITE + 2];
    const siteVelocity = q[i] * c[N.NC_SITE_VELOCITY] + q[3 + i] * c[N.NC_SITE_VELOCITY + 1];
    const acceleration = c[N.NC_ACCELERATION + i];
    const velocity = c[N.NC_VELOCITY + i] + dt * acceleration + half * c[N.NC_JERK + i];
    frame[F.F_OBSERVER + i] = c[N.NC_POSITION + i] + dt * c[N.NC_VELOCITY + i] + half * acceleration + site;
    frame[F.F_EARTH_BETA + i] = velocity * INVERSE_C;
    const beta = (velocity + siteVelocity) * INVERSE_C;
    frame[F.F_BETA + i] = beta;
    beta2 += beta * beta;
    const helio = c[N.NC_HELIO + i] + dt * c[N.NC_VELOCITY + i] + half * acceleration + site;
    frame[F.F_SUN_UNIT + i] = helio;
    helio2 += helio * helio;
  }
  const helioDistance = Math.sqrt(helio2);
  frame[F.F_SUN_UNIT] /= helioDistance;
  frame[F.F_SUN_UNIT + 1] /= helioDistance;
  frame[F.F_SUN_UNIT + 2] /= helioDistance;
  frame[F.F_SUN_DISTANCE] = helioDistance;
  frame[F.F_INVERSE_GAMMA] = Math.sqrt(1 - beta2);
  frame[F.F_COS_LAT] = c[N.NC_COS_LAT];
  frame[F.F_SIN_LAT] = c[N.NC_SIN_LAT];
  frame[F.F_REFRACTION_A] = c[N.NC_REFRACTION];
  frame[F.F_REFRACTION_B] = c[N.NC_REFRACTION + 1];
  frame[F.F_HAS_REFRACTION] = c[N.NC_REFRACTION + 2];
  frame[F.F_DAYS] = daysSinceJ2000;
}

function quarticAt(c: Float64Array, o: number, u: number): number {
  return c[o] + u * (c[o + 1] + u * (c[o + 2] + u * (c[o + 3] + u * c[o + 4])));
}

const scratch = new Float64Array(9);
const npb = new Float64Array(9);
const local = new Float64Array(9);
