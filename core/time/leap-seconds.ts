/**
 * TAI − UTC: the leap-second table, including the 1960–1971 era of "rubber" UTC seconds.
 *
 * UTC convention (that of IAU SOFA / ERFA): a UTC instant is a two-part quasi Julian date whose day
 * fraction runs uniformly over the whole UTC day, so on a day that ends with a positive leap second
 * the fraction spans 86 401 SI seconds, and 23:59:60.5 has fraction 86 400.5 / 86 401. Before 1972
 * each day also carries the drift of the rubber second. This makes UTC ↔ TAI exact and monotonic
 * through a leap second.
 *
 * Sources: 1972 on, the IERS/IETF leap-seconds.list (parse-leap-seconds-list.ts); 1960–1971, the
 * offsets and drift rates published by the US Naval Observatory in tai-utc.dat (the same values
 * appear in the IAU SOFA routine dat). Before 1960-01-01 UTC is not defined: `covers()` is false and
 * taiMinusUtcSeconds throws; TimeScale then applies its stated fallback with a warning.
 */
import { splitMjdDay, type JulianDate } from './julian-date.ts';
import { SECONDS_PER_DAY } from '../units.ts';

/** One expression of TAI − UTC, in force from 0h UTC of `startMjd` until the next step. */
export interface LeapSecondStep {
  /** First UTC day (whole MJD) on which this expression holds. */
  readonly startMjd: number;
  /** TAI − UTC in SI seconds at the drift reference (or always, when the drift rate is 0). */
  readonly offsetSeconds: number;
  /** MJD (UTC) from which the pre-1972 drift is counted; ignored when the rate is 0. */
  readonly driftReferenceMjd: number;
  /** Pre-1972 drift of TAI − UTC in seconds per day; 0 from 1972 on. */
  readonly driftSecondsPerDay: number;
}

/** Where a table came from and how long it is valid. */
export interface LeapSecondTableInfo {
  /** A human name of the source, shown in warnings (file name, "bundled IERS list of ..."). */
  readonly sourceName: string;
  /** UTC MJD after which the publisher no longer vouches for the table (the '#@' line). */
  readonly expiresMjd: number;
  /** UTC MJD of the publisher's last update (the '#$' line), when known. */
  readonly updatedMjd?: number;
}

/**
 * 1960–1971 expressions: TAI − UTC = offset + (MJD − reference) × rate, from USNO tai-utc.dat
 * (also reproduced in IAU SOFA dat.c). Start days are MJDs of 1960-01-01, 1961-01-01, 1961-08-01,
 * 1962-01-01, 1963-11-01, 1964-01-01, 1964-04-01, 1964-09-01, 1965-01-01, 1965-03-01, 1965-07-01,
 * 1965-09-01, 1966-01-01 and 1968-02-01.
 */
export const RUBBER_SECOND_ERA: readonly LeapSecondStep[] = [
  [36934, 1.417818, 37300, 0.001296],
  [37300, 1.422818, 37300, 0.001296],
  [37512, 1.372818, 37300, 0.001296],
  [37665, 1.845858, 37665, 0.0011232],
  [38334, 1.945858, 37665, 0.0011232],
  [38395, 3.24013, 38761, 0.001296],
  [38486, 3.34013, 38761, 0.001296],
  [38639, 3.44013, 38761, 0.001296],
  [38761, 3.54013, 38761, 0.001296],
  [38820, 3.64013, 38761, 0.001296],
  [38942, 3.74013, 38761, 0.001296],
  [39004, 3.84013, 38761, 0.001296],
  [39126, 4.31317, 39126, 0.002592],
  [39887, 4.21317, 39126, 0.002592],
].map(([startMjd, offsetSeconds, driftReferenceMjd, driftSecondsPerDay]) => ({
  startMjd,
  offsetSeconds,
  driftReferenceMjd,
  driftSecondsPerDay,
}));

/** MJD of 1972-01-01, when UTC took integral TAI − UTC steps (10 s). */
export const INTEGRAL_LEAP_SECOND_START_MJD = 41317;

export class LeapSecondTable {
  readonly steps: readonly LeapSecondStep[];
  readonly sourceName: string;
  readonly expiresMjd: number;
  readonly updatedMjd: number | undefined;

  /**
   * `steps` from 1972 on (integral seconds, rate 0), ascending; the 1960–1971 era is prepended
   * here, so every table covers 1960-01-01 onward. Throws on unordered or non-integral steps.
   */
  constructor(stepsFrom1972: readonly LeapSecondStep[], info: LeapSecondTableInfo) {
    for (let i = 0; i < stepsFrom1972.length; i++) {
      const step = stepsFrom1972[i];
      if (step.startMjd < INTEGRAL_LEAP_SECOND_START_MJD || step.driftSecondsPerDay !== 0) {
        throw new RangeError(`${info.sourceName}: step ${i + 1} (MJD ${step.startMjd}) must be on or after 1972-01-01 with no drift`);
      }
      if (i > 0 && step.startMjd <= stepsFrom1972[i - 1].startMjd) {
        throw new RangeError(`${info.sourceName}: step ${i + 1} (MJD ${step.startMjd}) is not after the one before it; sort the table by date`);
      }
    }
    if (stepsFrom1972.length === 0 || stepsFrom1972[0].startMjd !== INTEGRAL_LEAP_SECOND_START_MJD) {
      throw new RangeError(`${info.sourceName}: the table must start on 1972-01-01 (MJD 41317) with TAI−UTC = 10 s`);
    }
    this.steps = [...RUBBER_SECOND_ERA, ...stepsFrom1972];
    this.sourceName = info.sourceName;
    this.expiresMjd = info.expiresMjd;
    this.updatedMjd = info.updatedMjd;
  }

  /** First UTC day (MJD) the table covers: 1960-01-01. */
  get firstMjd(): number {
    return this.steps[0].startMjd;
  }

  /** True when UTC is defined at this MJD (on or after 1960-01-01). Expiry is not checked here. */
  covers(mjdUtc: number): boolean {
    return mjdUtc >= this.firstMjd;
  }

  /** TAI − UTC in SI seconds at a UTC instant (whole-day table lookup plus pre-1972 drift). */
  taiMinusUtcSeconds(utc: JulianDate): number {
    const { mjdDay, dayFraction } = splitMjdDay(utc);
    return this.valueOnDay(mjdDay, dayFraction);
  }

  /** TAI − UTC in SI seconds on UTC day `mjdDay` at `dayFraction` of it (drift only before 1972). */
  valueOnDay(mjdDay: number, dayFraction: number): number {
    const step = this.stepOnDay(mjdDay);
    return step.offsetSeconds + (mjdDay + dayFraction - step.driftReferenceMjd) * step.driftSecondsPerDay;
  }

  /**
   * The jump of TAI − UTC at the end of UTC day `mjdDay`, in SI seconds: +1 for a positive leap
   * second (23:59:60 exists), −1 for a negative one (23:59:59 is skipped), 0 otherwise; fractional
   * before 1972.
   */
  leapAtEndOfDaySeconds(mjdDay: number): number {
    const endOfToday = this.valueOnDay(mjdDay, 1);
    const startOfTomorrow = this.valueOnDay(mjdDay + 1, 0);
    const jump = startOfTomorrow - endOfToday;
    return Math.abs(jump) < 1e-9 ? 0 : jump;
  }

  /**
   * The UTC day's length: `leapSeconds` is its jump (see leapAtEndOfDaySeconds) and `driftSeconds`
   * the pre-1972 rubber-second growth of TAI − UTC over the day, both in SI seconds. The UTC clock
   * counts 86 400 + leapSeconds seconds on that day.
   */
  dayLength(mjdDay: number): { leapSeconds: number; driftSeconds: number } {
    const step = this.stepOnDay(mjdDay);
    return { leapSeconds: this.leapAtEndOfDaySeconds(mjdDay), driftSeconds: step.driftSecondsPerDay };
  }

  /** The step in force on UTC day `mjdDay`; throws before 1960 with the way out. */
  stepOnDay(mjdDay: number): LeapSecondStep {
    if (mjdDay < this.firstMjd) {
      throw new RangeError(
        `TAI−UTC: UTC is not defined before 1960-01-01 (MJD ${this.firstMjd}); got MJD ${mjdDay}. ` +
          'Give such times as UT1 or TT (TimeScale.fromTt) instead.',
      );
    }
    let low = 0;
    let high = this.steps.length - 1;
    while (low < high) {
      const middle = (low + high + 1) >> 1;
      if (this.steps[middle].startMjd <= mjdDay) low = middle;
      else high = middle - 1;
    }
    return this.steps[low];
  }

  /** Seconds of UTC clock time on day `mjdDay`: 86 400 plus that day's leap. */
  utcSecondsInDay(mjdDay: number): number {
    return SECONDS_PER_DAY + this.leapAtEndOfDaySeconds(mjdDay);
  }
}
