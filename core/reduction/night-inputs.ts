import type { InstantFromUtc } from '../astrometry/transit.ts';
import type { ClockComparisonRow } from '../formats/clock-comparisons.ts';
import type { InstrumentRecord, SiteRecord } from '../formats/site-description.ts';
import type { StarListRow } from '../formats/star-list.ts';
import type { TransitLogRow } from '../formats/transit-log.ts';
import type { StridingLevelReadings } from '../instrument/striding-level.ts';

/**
 * How one night constant enters the reduction:
 * - `free`: fitted from this night's transits (on top of the a priori value, see below);
 * - `readings`: taken from the night's own readings (clock comparisons for the clock terms, the
 *   striding level for b, collimator readings for c); an error when the night has none;
 * - `fixed`: held at `value` (units in NightConstantName);
 * - `carried`: held at the previous night's value (`NightReductionInput.previous`).
 */
export type ConstantSetting =
  | { readonly mode: 'free' }
  | { readonly mode: 'readings' }
  | { readonly mode: 'fixed'; readonly value: number }
  | { readonly mode: 'carried' };

/**
 * The night constants and the unit each is stated in:
 * clockOffsetS (s; UTC = clock + offset + rate·(clock − reference)), clockRateSPerDay (s/day),
 * azimuthArcsec a, levelArcsec b, collimationArcsec c (Mayer's constants, signs of
 * core/instrument/mayer.ts, c for clamp west), zenithZeroArcsec (zenith distance of reading 0,
 * core/instrument/zenith-distance.ts).
 */
export const NIGHT_CONSTANT_NAMES = ['clockOffsetS', 'clockRateSPerDay', 'azimuthArcsec', 'levelArcsec', 'collimationArcsec', 'zenithZeroArcsec'] as const;
export type NightConstantName = (typeof NIGHT_CONSTANT_NAMES)[number];

export type NightConfiguration = { readonly [K in NightConstantName]: ConstantSetting };

/** Values of the night constants (units in NightConstantName). */
export type NightConstants = { readonly [K in NightConstantName]: number };

/** Collimator readings of one night (core/instrument/collimation.ts collimationFromCollimator). */
export interface CollimatorReadings {
  readonly clampWestTurns: number;
  readonly clampEastTurns: number;
  readonly meanWireTurns: number;
  /** Value of one turn of the right-ascension micrometer (arcsec) and its sense (+1: east with clamp west). */
  readonly arcsecPerTurn: number;
  readonly sense: 1 | -1;
}

/** The night's weather, used for every transit that has no weather of its own. */
export interface NightWeather {
  readonly temperatureC: number;
  readonly pressureHpa: number;
  readonly humidityPercent: number;
}

/** Everything the nightly reduction of one instrument on one night needs. */
export interface NightReductionInput {
  readonly site: SiteRecord;
  readonly instrument: InstrumentRecord;
  /** Local date of the night (MJD of its calendar date: the evening's date). */
  readonly nightDateMjd: number;
  readonly stars: readonly StarListRow[];
  /** Transit rows of this night and instrument (any order), as parseTransitLog gave them. */
  readonly transits: readonly TransitLogRow[];
  /** Clock comparisons of this night and instrument (empty when none). */
  readonly clockComparisons: readonly ClockComparisonRow[];
  readonly levelReadings: StridingLevelReadings | null;
  readonly collimatorReadings: CollimatorReadings | null;
  /** Night weather; null means none was recorded (transits then need their own, or get no refraction). */
  readonly weather: NightWeather | null;
  readonly configuration: NightConfiguration;
  /** The previous night's constants, for settings `carried`; null when there is none. */
  readonly previous: NightConstants | null;
  /** Horizontal flexure f (arcsec), z = z_obs + f sin z_obs + R; 0 when the instrument has none determined. */
  readonly flexureArcsec: number;
  /** UTC → every time scale (e.g. `(utc) => timeScale.fromUtc(utc)`). */
  readonly instantFromUtc: InstantFromUtc;
}

/**
 * The default configuration: clock offset and rate from the comparisons when the night has any
 * (offset free and rate 0 otherwise: one night of stars fixes the offset well, the rate poorly),
 * a and c free, b from the level when read (0 otherwise, said in the notes), zenith zero free.
 */
export function defaultNightConfiguration(hasComparisons: boolean, hasLevel: boolean): NightConfiguration {
  return {
    clockOffsetS: hasComparisons ? { mode: 'readings' } : { mode: 'free' },
    clockRateSPerDay: hasComparisons ? { mode: 'readings' } : { mode: 'fixed', value: 0 },
    azimuthArcsec: { mode: 'free' },
    levelArcsec: hasLevel ? { mode: 'readings' } : { mode: 'fixed', value: 0 },
    collimationArcsec: { mode: 'free' },
    zenithZeroArcsec: { mode: 'free' },
  };
}
