import type { Mat3 } from '../math/mat3.ts';

/**
 * Earth orientation at one instant, in the equinox-based form.
 * `npb`: bias-precession-nutation matrix, GCRS → true equator and equinox of date (v_date = npb·v).
 * `gastRad`: Greenwich apparent sidereal time (radians), so that TIRS = R3(GAST)·(true of date).
 * `polarMotion`: TIRS → ITRS (v_ITRS = polarMotion·v_TIRS), i.e. the IAU SOFA `pom00` matrix
 * R1(−y_p)·R2(−x_p)·R3(s′) (IERS Conventions 2010 eq. 5.3 transposed).
 */
export interface EarthOrientation {
  readonly npb: Mat3;
  readonly gastRad: number;
  readonly polarMotion: Mat3;
}
