import { SECOND_OF_TIME_ANGLE } from '../units.ts';
import { clampSign } from './culmination.ts';
import type { ClampPosition, Culmination } from './culmination.ts';

/**
 * Earth's rotation rate relative to the stars in revolutions per UT1 day, from the Earth
 * rotation angle (IERS Conventions 2010, eq. 5.15). A clock keeping mean solar time runs this
 * much slower than the stars' hour angle; the precession part of sidereal rate (1e-7) is
 * negligible over a wire interval.
 */
export const STELLAR_REVOLUTIONS_PER_UT1_DAY = 1.002737811911354; // 1.00273781191135448 to double precision

/** What the clock counts: sidereal seconds or mean solar (UTC-like) seconds. */
export type ClockTimeScale = 'sidereal' | 'mean-solar';

/** One observed wire: its number (index into the instrument's interval list) and clock time (s). */
export interface WireObservation {
  readonly wireIndex: number;
  readonly clockTimeS: number;
}

/** The reduction of one transit to the mean wire. */
export interface MeanWireReduction {
  /** Mean of the individually reduced wire times (clock seconds). */
  readonly meanWireTimeS: number;
  /** Each observed wire's reduced time minus the mean (clock s), in input order. */
  readonly residualsS: readonly number[];
  /** Standard error of the mean from the scatter (s); null with fewer than two wires. */
  readonly standardErrorS: number | null;
  readonly wireCount: number;
}

/**
 * Hour-angle interval (rad) between a wire at equatorial distance `intervalRad` from the mean wire
 * and the mean wire, for a star of declination δ: the exact small-circle form sin I = sin i sec δ
 * (Chauvenet, Manual of Spherical and Practical Astronomy, vol. II, reduction to the middle wire);
 * for stars far from the pole this is the familiar I = i sec δ. Throws when |sin i sec δ| > 1:
 * the star's diurnal circle never reaches that wire.
 */
export function wireHourAngleIntervalRad(intervalRad: number, declinationRad: number): number {
  const sine = Math.sin(intervalRad) / Math.cos(declinationRad);
  if (!(Math.abs(sine) <= 1)) {
    throw new RangeError(
      `wireHourAngleIntervalRad: a star at declination ${declinationRad} rad never reaches a wire ${intervalRad} rad from the mean wire (sin i sec δ = ${sine}); drop that wire for this star`,
    );
  }
  return Math.asin(sine);
}

/**
 * Reduces each observed wire time to the mean wire, then averages (missing wires are simply
 * absent; each wire is reduced on its own, so an incomplete set stays unbiased).
 *
 * `equatorialIntervalsS[k]`: equatorial interval of wire k from the mean wire in seconds of
 * (sidereal) time, positive for a wire that a star at upper culmination with clamp west crosses
 * BEFORE the mean wire. The sign is reversed at lower culmination (the star moves east) and with
 * clamp east (the reticle is turned over). `clockTimeScale` says whether the clock counts
 * sidereal or mean solar seconds; the hour-angle interval is converted accordingly.
 * Accuracy: exact for a great-circle wire perpendicular to the star's path on the meridian; the
 * curvature of the path across a wire of length L adds ~(L²/2) tan δ, not modelled.
 */
export function reduceToMeanWire(
  wires: readonly WireObservation[],
  equatorialIntervalsS: readonly number[],
  declinationRad: number,
  culmination: Culmination,
  clamp: ClampPosition,
  clockTimeScale: ClockTimeScale,
): MeanWireReduction {
  if (wires.length === 0) throw new RangeError('reduceToMeanWire: no wire times given; a transit needs at least one observed wire');
  const direction = (culmination === 'upper' ? 1 : -1) * clampSign(clamp);
  const clockSecondsPerSiderealSecond = clockTimeScale === 'sidereal' ? 1 : 1 / STELLAR_REVOLUTIONS_PER_UT1_DAY;
  const reduced = wires.map((wire) => {
    const intervalS = equatorialIntervalsS[wire.wireIndex];
    if (intervalS === undefined || !Number.isFinite(intervalS)) {
      throw new RangeError(
        `reduceToMeanWire: wire index ${wire.wireIndex} has no equatorial interval (the instrument lists ${equatorialIntervalsS.length}); check the wire numbering against the instrument description`,
      );
    }
    const hourAngleRad = wireHourAngleIntervalRad(intervalS * SECOND_OF_TIME_ANGLE, declinationRad);
    return wire.clockTimeS + direction * (hourAngleRad / SECOND_OF_TIME_ANGLE) * clockSecondsPerSiderealSecond;
  });
  const mean = reduced.reduce((sum, t) => sum + (t - reduced[0]), 0) / reduced.length + reduced[0];
  const residualsS = reduced.map((t) => t - mean);
  const n = reduced.length;
  const standardErrorS = n < 2 ? null : Math.sqrt(residualsS.reduce((s, r) => s + r * r, 0) / (n - 1) / n);
  return { meanWireTimeS: mean, residualsS, standardErrorS, wireCount: n };
}
