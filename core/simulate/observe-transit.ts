import type { InstrumentRecord } from '../archive/records.ts';
import type { Culmination } from '../instrument/culmination.ts';
import { mayerCorrectionRad, mayerFactors } from '../instrument/mayer.ts';
import { reduceToMeanWire, wireHourAngleIntervalRad } from '../instrument/wire-reduction.ts';
import { ARCSEC, SECONDS_PER_DAY, SECOND_OF_TIME_ANGLE } from '../units.ts';
import type { SeededRandom } from './seeded-random.ts';
import { HOUR_ANGLE_RATE_RAD_PER_DAY, type TrueCulmination } from './simulated-sky.ts';
import type { TrueNightState } from './simulation-truth.ts';

/** What the instrument recorded for one transit, before any blunder. */
export interface RecordedTransit {
  /** Clock time of each wire, MJD, NaN for a missed wire (same order as the instrument's intervals). */
  readonly wireClockMjd: number[];
  /** Mean-wire clock time, MJD (reduced from the recorded wires); a single line's time for a camera. */
  readonly clockMjd: number;
  /** UTC MJD of the mean-wire crossing (truth). */
  readonly utcMjd: number;
  readonly zenithReadings: number[];
}

/** Effects added to the perfect sky that are common to all stars (truth: thermal, latitude variation). */
export interface CommonShifts {
  /** Δα·cos δ, rad, positive east (later transit). */
  readonly raOnSkyRad: number;
  /** Δδ, rad, positive north. */
  readonly decRad: number;
  /** Δφ, rad. */
  readonly latitudeRad: number;
}

export interface ObservationNoise {
  readonly wireNoiseS: number;
  readonly zenithNoiseArcsec: number;
  readonly missedWireProbability: number;
  readonly flexureArcsec: number;
}

/**
 * Turns a true culmination into the instrument's record. The instrument's mean wire is crossed
 * where the observed hour angle is −τ (upper) or 12 h − τ (lower), τ = Mayer's correction
 * (core/instrument/mayer.ts) with that night's a, b, c and the star's topocentric (unrefracted)
 * declination, as the nightly reduction (core/reduction) uses it;
 * wire k at a further −(±)I_k (wire-reduction.ts: sin I = sin i sec δ, the sign + at upper culmination
 * with clamp west); clock reading = UTC + offset + rate·(UTC − reference); Gaussian noise per wire;
 * missed wires are NaN (at least three are kept). The zenith distance z_m read on the micrometer
 * satisfies z_m + f·sin z_m = observed (refracted) zenith distance (zenith-distance.ts),
 * reading = (z_m − zero)/(sense·scale) plus noise. Common shifts move the crossing by
 * Δα·cos δ / cos δ and the zenith distance by (∂z/∂δ)·Δδ + (∂z/∂φ)·Δφ for the side and culmination.
 * The shift of longitude that polar motion also causes is not simulated.
 */
export function observeTransit(
  truth: TrueCulmination,
  culmination: Culmination,
  instrument: InstrumentRecord,
  night: TrueNightState,
  shifts: CommonShifts,
  noise: ObservationNoise,
  latitudeRad: number,
  random: SeededRandom,
): RecordedTransit {
  const place = truth.place;
  const declinationRad = place.topocentricDeclinationRad;
  const factors = mayerFactors(latitudeRad, declinationRad, culmination);
  const tauRad = mayerCorrectionRad(
    { azimuthRad: night.azimuthArcsec * ARCSEC, levelRad: night.levelArcsec * ARCSEC, collimationRad: night.collimationArcsec * ARCSEC },
    factors, 'west',
  );
  const shiftDays = shifts.raOnSkyRad / Math.cos(declinationRad) / HOUR_ANGLE_RATE_RAD_PER_DAY;
  const utcMjd = truth.utcMjd + shiftDays - tauRad / HOUR_ANGLE_RATE_RAD_PER_DAY;
  const clockOf = (utc: number): number =>
    utc + (night.clockOffsetS + (night.clockRateSPerDay * (utc - night.clockReferenceUtcMjd))) / SECONDS_PER_DAY;
  const direction = culmination === 'upper' ? 1 : -1;
  const intervals = instrument.wireIntervalsEquatorialS;
  const wireClockMjd = intervals.map((intervalS) => {
    const hourAngleRad = wireHourAngleIntervalRad(intervalS * SECOND_OF_TIME_ANGLE, declinationRad);
    const wireUtc = utcMjd - (direction * hourAngleRad) / HOUR_ANGLE_RATE_RAD_PER_DAY;
    return clockOf(wireUtc) + random.normal(0, noise.wireNoiseS) / SECONDS_PER_DAY;
  });
  const missed = wireClockMjd.map(() => random.chance(noise.missedWireProbability));
  if (missed.filter((m) => !m).length >= 3) missed.forEach((m, k) => { if (m) wireClockMjd[k] = Number.NaN; });
  const clockMjd = intervals.length === 0
    ? clockOf(utcMjd) + random.normal(0, noise.wireNoiseS) / SECONDS_PER_DAY
    : meanWireClockMjd(wireClockMjd, intervals, declinationRad, culmination);
  const zenithReadings = [zenithReading(place.observedZenithRad, place.observedDeclinationRad, culmination, latitudeRad, instrument, night, shifts, noise, random)];
  return { wireClockMjd, clockMjd, utcMjd, zenithReadings };
}

function zenithReading(
  observedZenithRad: number, declinationRad: number, culmination: Culmination, latitudeRad: number,
  instrument: InstrumentRecord, night: TrueNightState, shifts: CommonShifts, noise: ObservationNoise, random: SeededRandom,
): number {
  // z = φ − δ (upper, south), δ − φ (upper, north), 180° − φ − δ (lower): the signs of ∂z/∂δ and ∂z/∂φ.
  const north = culmination === 'upper' && declinationRad > latitudeRad;
  const zPerDec = north ? 1 : -1;
  const zPerLatitude = culmination === 'upper' ? -zPerDec : -1;
  const dz = zPerDec * shifts.decRad + zPerLatitude * shifts.latitudeRad;
  const observed = observedZenithRad + dz;
  const flexureRad = noise.flexureArcsec * ARCSEC;
  let zm = observed;
  for (let i = 0; i < 4; i++) zm = observed - flexureRad * Math.sin(zm);
  const scaleRad = instrument.readingScaleArcsecPerUnit * ARCSEC;
  const noisy = zm + random.normal(0, noise.zenithNoiseArcsec) * ARCSEC;
  return (noisy - night.zeroPointArcsec * ARCSEC) / (instrument.readingSense * scaleRad);
}

/**
 * The mean-wire clock time (MJD) of recorded wire times (NaN = missed), as the observer reduces
 * them: reduceToMeanWire with clamp west and a mean-solar clock, at declination `declinationRad`.
 */
export function meanWireClockMjd(wireClockMjd: readonly number[], intervalsS: readonly number[], declinationRad: number, culmination: Culmination): number {
  const first = wireClockMjd.find((t) => Number.isFinite(t));
  if (first === undefined) throw new RangeError('meanWireClockMjd: every wire is missing; a transit needs at least one observed wire');
  const base = Math.floor(first);
  const wires = wireClockMjd
    .map((mjd, wireIndex) => ({ wireIndex, clockTimeS: (mjd - base) * SECONDS_PER_DAY }))
    .filter((w) => Number.isFinite(w.clockTimeS));
  return base + reduceToMeanWire(wires, intervalsS, declinationRad, culmination, 'west', 'mean-solar').meanWireTimeS / SECONDS_PER_DAY;
}
