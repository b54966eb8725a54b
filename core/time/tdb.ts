/**
 * TDB − TT at the geocentre.
 *
 * Series: Fairhead & Bretagnon (1990), A&A 229, 240, leading 75 of its 787 terms as tabulated in
 * IAU SOFA/ERFA dtdb (see tdb-terms.ts), plus the quadratic term 0.03638 µs·T² that ERFA adds for
 * the JPL planetary masses; T in Julian millennia. The argument is TT, which differs from TDB by
 * under 2 ms: a negligible change of phase. Topocentric terms (≤ 2 µs, depending on the observer's
 * distance from the Earth's axis) are left out.
 * Accuracy: within 0.21 µs of erfa.dtdb (geocentric, full series) over 1900–2100 (measured, see
 * unit/time/timescale.test.ts); not measured outside that range.
 */
import type { JulianDate } from './julian-date.ts';
import { TDB_TERM_COUNT, TDB_TERMS } from './tdb-terms.ts';
import { JD_J2000, SECONDS_PER_DAY } from '../units.ts';

/** TDB − TT in seconds at TT instant `tt` (geocentric; see the header for accuracy). */
export function tdbMinusTtSeconds(tt: JulianDate): number {
  const t = (tt.jd1 - JD_J2000 + tt.jd2) / 365_250;
  // Sum the series per power of T, then combine with Horner's rule, as the published table does.
  const byPower = [0, 0, 0, 0, 0];
  for (let i = TDB_TERM_COUNT - 1; i >= 0; i--) {
    const row = 4 * i;
    byPower[TDB_TERMS[row + 3]] += TDB_TERMS[row] * Math.sin(TDB_TERMS[row + 1] * t + TDB_TERMS[row + 2]);
  }
  const series = (((byPower[4] * t + byPower[3]) * t + byPower[2]) * t + byPower[1]) * t + byPower[0];
  return series + 0.03638e-6 * t * t;
}

/** TDB of a TT instant (two-part JD; jd1 kept). */
export function ttToTdb(tt: JulianDate): JulianDate {
  return { jd1: tt.jd1, jd2: tt.jd2 + tdbMinusTtSeconds(tt) / SECONDS_PER_DAY };
}
