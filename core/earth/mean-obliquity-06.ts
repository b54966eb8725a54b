/**
 * Mean obliquity of the ecliptic ε_A, IAU 2006 (Hilton et al. 2006, Celest. Mech. 94, 351, eq. 39;
 * IERS Conventions 2010 eq. 5.40): ε_A = 84381.406″ − 46.836769″ t − 0.0001831″ t² + 0.00200340″ t³
 * − 0.000000576″ t⁴ − 0.0000000434″ t⁵, t in Julian centuries TT since J2000.0. Radians.
 * The polynomial is the definition; it is valid to 0.1 mas over several centuries.
 */
import { julianCenturiesSinceJ2000, type JulianDate } from '../time/julian-date.ts';
import { ARCSEC } from '../units.ts';

/** Mean obliquity of date ε_A in radians, at TT `tt`. */
export function meanObliquity06(tt: JulianDate): number {
  const t = julianCenturiesSinceJ2000(tt);
  return (84381.406 + t * (-46.836769 + t * (-0.0001831 + t * (0.0020034 + t * (-0.000000576 + t * -0.0000000434))))) * ARCSEC;
}
