import { utcCountS } from '../formats/utc-instant.ts';
import type { ClockComparisonRow } from '../formats/clock-comparisons.ts';
import { fitClock } from '../instrument/clock-fit.ts';
import type { ClockFit } from '../instrument/clock-fit.ts';
import type { ClockTimeScale } from '../instrument/wire-reduction.ts';
import { STELLAR_REVOLUTIONS_PER_UT1_DAY } from '../instrument/wire-reduction.ts';
import { SECONDS_PER_DAY } from '../units.ts';

/**
 * A clock reading in "nominal seconds": the reading itself for a mean-solar clock, the reading
 * divided by 1.002 737 811 9 (sidereal seconds per UT1 second, IERS Conventions 2010 eq. 5.15)
 * for a sidereal clock, so that one model UTC = u + offset + rate·(u − reference) serves both
 * (a sidereal clock then shows a small residual rate, not 236 s/day). Seconds from 0 h of the
 * clock on the night's date.
 */
export function nominalClockSeconds(clockReadingS: number, scale: ClockTimeScale): number {
  return scale === 'sidereal' ? clockReadingS / STELLAR_REVOLUTIONS_PER_UT1_DAY : clockReadingS;
}

/** Clock correction model of one night: UTC (s from 0 h UTC of the night's date) = u + correctionS(u). */
export interface NightClockModel {
  readonly referenceS: number;
  readonly offsetS: number;
  readonly rateSPerDay: number;
}

/** The correction (s) to add to nominal clock seconds `u` to get UTC seconds of the night. */
export function clockCorrectionAtS(model: NightClockModel, u: number): number {
  return model.offsetS + (model.rateSPerDay / SECONDS_PER_DAY) * (u - model.referenceS);
}

/**
 * Fits the night's comparisons (fitClock: weighted straight line, offset and rate uncorrelated
 * about the mean epoch) after turning the signal UTC into seconds from 0 h UTC of the night's date
 * and each clock reading into nominal seconds. A leap second inside the night is not modelled.
 */
export function fitNightClock(comparisons: readonly ClockComparisonRow[], nightDateMjd: number, scale: ClockTimeScale): ClockFit {
  return fitClock(comparisons.map((c) => ({
    clockReadingS: nominalClockSeconds(c.clockS, scale),
    signalUtcS: utcCountS(c.utc) - nightDateMjd * SECONDS_PER_DAY,
  })));
}
