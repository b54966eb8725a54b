import { earthState } from '../astrometry/earth-state.ts';
import type { EarthState } from '../astrometry/earth-state.ts';
import type { TwoPartJulianDate } from '../astrometry/instant.ts';
import type { Vec3 } from '../math/vec3.ts';
import { equinoxComplementaryTerms } from '../earth/equation-of-equinoxes-06.ts';
import { nutation06a } from '../earth/nutation-series.ts';
import type { Nutation } from '../earth/nutation-series.ts';
import { JD_J2000 } from '../units.ts';

/** Knots of the interpolation: u = −1, −½, 0, ½, 1 of the half-width. */
const KNOTS = [-1, -0.5, 0, 0.5, 1] as const;
/** Numbers kept per knot: Δψ, Δε, then Earth's barycentric position, velocity and heliocentric position. */
const PER_KNOT = 11;

/**
 * The slowly varying per-instant terms of the full place model over one stretch of a night,
 * evaluated exactly at five instants and interpolated by the quartic through them: IAU 2006/2000A
 * nutation (nutation06a, 1365 terms) and Earth's barycentric and heliocentric state (earthState).
 * The complementary terms of the equation of the equinoxes (≤ 3 mas, periods ≥ 9 days) are taken
 * once, at the centre. Everything fast — precession, the Earth rotation angle, UT1 and polar motion
 * of each instant — stays exact in iauEarthOrientation, which accepts these values.
 * Accuracy of the quartic over ±0.5 day (remainder f⁽⁵⁾h⁵/5!·max|Π(u − uₖ)|, Π ≤ 0.11, with the
 * shortest nutation periods of ~5.6 days and the Moon's 27.3-day wobble of Earth, 12 m/s, from
 * the IERS Conventions 2010 tables): below 1 µas in nutation, below 1e-5 m/s in velocity;
 * checked against the exact terms in unit/reduction/night-slow-terms.test.ts.
 */
export class NightSlowTerms {
  private readonly values = new Float64Array(KNOTS.length * PER_KNOT);
  private readonly centreDays: number;
  /** Complementary terms of the equation of the equinoxes at the centre (rad). */
  readonly complementaryTermsRad: number;

  /** `centreTt` TT of the stretch's centre; `halfWidthDays` its half-width (instants outside are refused). */
  constructor(centreTt: TwoPartJulianDate, readonly halfWidthDays: number) {
    if (!(halfWidthDays > 0 && halfWidthDays <= 1)) throw new RangeError(`NightSlowTerms: halfWidthDays must lie in (0, 1] (got ${halfWidthDays})`);
    this.centreDays = centreTt.jd1 - JD_J2000 + centreTt.jd2;
    this.complementaryTermsRad = equinoxComplementaryTerms(centreTt);
    KNOTS.forEach((u, k) => {
      const tt = { jd1: centreTt.jd1, jd2: centreTt.jd2 + u * halfWidthDays };
      const n = nutation06a(tt);
      const e = earthState(tt);
      this.values.set([n.dpsiRad, n.depsRad, ...e.barycentricPositionAu, ...e.barycentricVelocityAuPerDay, ...e.heliocentricPositionAu], k * PER_KNOT);
    });
  }

  /** True when TT `tt` lies within the stretch. */
  covers(tt: TwoPartJulianDate): boolean {
    return Math.abs(tt.jd1 - JD_J2000 + tt.jd2 - this.centreDays) <= this.halfWidthDays;
  }

  /** Nutation and Earth's state at TT `tt` (throws outside the stretch: check `covers` first). */
  at(tt: TwoPartJulianDate): { nutation: Nutation; earth: EarthState } {
    const u = (tt.jd1 - JD_J2000 + tt.jd2 - this.centreDays) / this.halfWidthDays;
    if (!(Math.abs(u) <= 1)) throw new RangeError(`NightSlowTerms.at: TT ${tt.jd1 + tt.jd2} is outside the stretch (±${this.halfWidthDays} day of its centre); call covers() first`);
    const w = lagrangeWeights(u);
    const value = (i: number): number => w[0] * this.values[i] + w[1] * this.values[PER_KNOT + i] + w[2] * this.values[2 * PER_KNOT + i] + w[3] * this.values[3 * PER_KNOT + i] + w[4] * this.values[4 * PER_KNOT + i];
    const vec = (i: number): Vec3 => [value(i), value(i + 1), value(i + 2)];
    return {
      nutation: { dpsiRad: value(0), depsRad: value(1) },
      earth: { barycentricPositionAu: vec(2), barycentricVelocityAuPerDay: vec(5), heliocentricPositionAu: vec(8) },
    };
  }
}

/** Lagrange weights of the knots −1, −½, 0, ½, 1 at u (the standard product form). */
function lagrangeWeights(u: number): [number, number, number, number, number] {
  const w: [number, number, number, number, number] = [1, 1, 1, 1, 1];
  for (let k = 0; k < KNOTS.length; k++) {
    for (let j = 0; j < KNOTS.length; j++) if (j !== k) w[k] *= (u - KNOTS[j]) / (KNOTS[k] - KNOTS[j]);
  }
  return w;
}
