/**
 * The time-scale object: owns the leap-second table and the Earth orientation table and turns
 * one instant into every scale the reduction needs (UTC, TAI, TT, TDB, UT1) plus the pole.
 *
 * Definitions: TT = TAI + 32.184 s exactly (IAU 1991 Resolution A4); TAI − UTC from the leap-second
 * table; UT1 = TAI + (UT1 − UTC) − (TAI − UTC) with UT1 − UTC from the EOP table (as IAU SOFA
 * utcut1); TDB from tdb.ts (≤ 0.2 µs from the full Fairhead & Bretagnon series).
 *
 * Fallbacks, each reported in `Instant.warnings` (never silent):
 *  - no EOP table, or the instant outside it, 1960 on: UT1 − UTC = 0 and x_p = y_p = 0. UTC is kept
 *    within 0.9 s of UT1 (0.1 s of UT2 before 1972), so UT1 is then good to 0.9 s, the pole to 0.5″.
 *  - before 1960-01-01 UTC did not exist: the given "UTC" is taken as UT1 (GMT of the era's
 *    records) and TT = UT1 + ΔT from the Espenak & Meeus (2006) model (delta-t.ts; about ±1 s
 *    1900–1960).
 *  - after the leap-second table's expiry: its last TAI − UTC is used; a new leap second may have
 *    been announced since.
 *  - EOP predictions: used, with the note that values are predicted.
 */
import { deltaTSeconds } from './delta-t.ts';
import type { EarthOrientationSource } from './earth-orientation-table.ts';
import { parseIsoUtc } from './iso.ts';
import { julianDateToMjd, mjdToCalendarDay, splitMjdDay, type JulianDate } from './julian-date.ts';
import type { LeapSecondTable } from './leap-seconds.ts';
import { ttToTdb } from './tdb.ts';
import { taiToUtc, utcToTai } from './utc-tai.ts';
import { SECONDS_PER_DAY } from '../units.ts';

/** TT − TAI in seconds (exact, by definition). */
export const TT_MINUS_TAI_SECONDS = 32.184;

/** One instant in every time scale, with the Earth orientation used and any fallback warnings. */
export interface Instant {
  /** UTC quasi JD (SOFA convention; see leap-seconds.ts). Before 1960 the given time itself. */
  readonly utc: JulianDate;
  readonly tai: JulianDate;
  readonly tt: JulianDate;
  readonly tdb: JulianDate;
  readonly ut1: JulianDate;
  /** UT1 − UTC in seconds that was applied (0 in the fallbacks). */
  readonly dut1Seconds: number;
  /** Pole coordinate x_p in radians (IERS sign convention), 0 when unknown. */
  readonly xpRad: number;
  /** Pole coordinate y_p in radians (IERS sign convention), 0 when unknown. */
  readonly ypRad: number;
  /** Fallbacks taken for this instant, in words for the user; empty when nothing was assumed. */
  readonly warnings: readonly string[];
}

export class TimeScale {
  readonly leapSeconds: LeapSecondTable;
  readonly eop: EarthOrientationSource | undefined;

  constructor(leapSeconds: LeapSecondTable, eop?: EarthOrientationSource) {
    this.leapSeconds = leapSeconds;
    this.eop = eop;
  }

  /** The instant of a UTC quasi JD. */
  fromUtc(utc: JulianDate): Instant {
    const mjdUtc = julianDateToMjd(utc);
    if (!this.leapSeconds.covers(mjdUtc)) return this.beforeUtc(utc);
    const warnings: string[] = [];
    this.checkExpiry(mjdUtc, warnings);
    const tai = utcToTai(utc, this.leapSeconds);
    return this.complete(utc, tai, warnings);
  }

  /** The instant of an ISO 8601 UTC text (Z or an offset; leap seconds checked, see iso.ts). */
  fromIsoUtc(iso: string): Instant {
    return this.fromUtc(parseIsoUtc(iso, this.leapSeconds).utcJd);
  }

  /** The instant of a TT two-part JD. */
  fromTt(tt: JulianDate): Instant {
    const tai = { jd1: tt.jd1, jd2: tt.jd2 - TT_MINUS_TAI_SECONDS / SECONDS_PER_DAY };
    const firstMjd = this.leapSeconds.firstMjd;
    const taiAtUtcStartMjd = firstMjd + this.leapSeconds.valueOnDay(firstMjd, 0) / SECONDS_PER_DAY;
    if (julianDateToMjd(tai) < taiAtUtcStartMjd) {
      return this.beforeUtc({ jd1: tt.jd1, jd2: tt.jd2 - deltaTSeconds(tt) / SECONDS_PER_DAY }, tt);
    }
    const utc = taiToUtc(tai, this.leapSeconds);
    const warnings: string[] = [];
    this.checkExpiry(julianDateToMjd(utc), warnings);
    return this.complete(utc, tai, warnings);
  }

  private complete(utc: JulianDate, tai: JulianDate, warnings: string[]): Instant {
    const tt = { jd1: tai.jd1, jd2: tai.jd2 + TT_MINUS_TAI_SECONDS / SECONDS_PER_DAY };
    const mjdUtc = julianDateToMjd(utc);
    let dut1Seconds = 0;
    let xpRad = 0;
    let ypRad = 0;
    if (this.eop === undefined) {
      warnings.push(
        'no Earth orientation table is loaded: UT1 − UTC and polar motion are taken as 0 (UT1 good to 0.9 s, ' +
          'the pole to 0.5″); load an IERS finals2000A or C04 file',
      );
    } else {
      const values = this.eop.at(mjdUtc);
      if (values.note !== undefined) warnings.push(values.note);
      dut1Seconds = values.dut1Seconds;
      xpRad = values.xpRad;
      ypRad = values.ypRad;
    }
    // UT1 = TAI + (UT1 − UTC) − (TAI − UTC), TAI − UTC of the UTC day as in IAU SOFA utcut1.
    const { mjdDay, dayFraction } = splitMjdDay(utc);
    const taiMinusUtc = this.leapSeconds.valueOnDay(mjdDay, dayFraction);
    const ut1 = { jd1: tai.jd1, jd2: tai.jd2 + (dut1Seconds - taiMinusUtc) / SECONDS_PER_DAY };
    // TDB on first reading: the per-night contexts of a batch ask for instants but never for TDB.
    let tdb: JulianDate | undefined;
    return { utc, tai, tt, get tdb() { return (tdb ??= ttToTdb(tt)); }, ut1, dut1Seconds, xpRad, ypRad, warnings };
  }

  /** Before 1960: the time is UT1; TT from the ΔT model unless given (see the file header). */
  private beforeUtc(ut1: JulianDate, givenTt?: JulianDate): Instant {
    const deltaT = deltaTSeconds(ut1);
    const tt = givenTt ?? { jd1: ut1.jd1, jd2: ut1.jd2 + deltaT / SECONDS_PER_DAY };
    const tai = { jd1: tt.jd1, jd2: tt.jd2 - TT_MINUS_TAI_SECONDS / SECONDS_PER_DAY };
    const warnings = [
      `UTC did not exist before 1960-01-01: the time is taken as UT1 and TT = UT1 + ΔT with ΔT = ${deltaT.toFixed(1)} s ` +
        'from the Espenak & Meeus (2006) model (about ±1 s in 1900–1960); polar motion taken as 0',
    ];
    return { utc: ut1, tai, tt, tdb: ttToTdb(tt), ut1, dut1Seconds: 0, xpRad: 0, ypRad: 0, warnings };
  }

  private checkExpiry(mjdUtc: number, warnings: string[]): void {
    if (mjdUtc > this.leapSeconds.expiresMjd) {
      const { year, month, day } = mjdToCalendarDay(this.leapSeconds.expiresMjd);
      warnings.push(
        `${this.leapSeconds.sourceName} expired on ${year}-${String(month).padStart(2, '0')}-${String(day).padStart(2, '0')}: ` +
          'a leap second announced since then is missing; load a current leap-seconds.list from the IERS',
      );
    }
  }
}
