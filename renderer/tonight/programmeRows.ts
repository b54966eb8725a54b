import { ARCSEC, DEG, SECONDS_PER_DAY } from '../../core/units.ts';
import type { InstrumentRecord, StarRecord } from '../../core/archive/records.ts';
import type { PredictedTransit } from '../worker/tasks/tonightProgramme.ts';

/** What the user states for tonight: the micrometer's zero point and the clock's offset. */
export interface TonightSetting {
  /** Zenith distance at reading 0 for tonight's setting, degrees (z = zero + sense·scale·reading). */
  readonly zeroPointDeg: number;
  /** Clock reading minus UTC, seconds; null when neither a comparison nor an offset is known. */
  readonly clockMinusUtcS: number | null;
}

/** One line of the programme table, every number in the unit its name says. */
export interface ProgrammeRow {
  /** Unique within the night: star id, culmination and the minute of the transit. */
  readonly key: string;
  readonly star: StarRecord;
  readonly transit: PredictedTransit;
  /** Predicted transit on the instrument clock (UTC + clock offset), MJD; null without an offset. */
  readonly clockMjd: number | null;
  readonly zenithDistanceDeg: number;
  /** The micrometer (or pixel, or circle) reading at which to set for this star. */
  readonly readingSetting: number;
  /** The Sun is above the horizon at the transit. */
  readonly daylight: boolean;
}

/**
 * The micrometer reading that gives zenith distance `zenithRad`: the inverse of
 * core/instrument/zenith-distance.ts zenithDistanceFromReading, reading = sense·(z − zero)/scale.
 */
export function readingForZenithDistance(zenithRad: number, zeroPointRad: number, instrument: InstrumentRecord): number {
  if (!(instrument.readingScaleArcsecPerUnit > 0)) {
    throw new RangeError(`instrument "${instrument.label}": reading scale ${instrument.readingScaleArcsecPerUnit}″ per unit must be positive; fix it in the Archive view`);
  }
  return (instrument.readingSense * (zenithRad - zeroPointRad)) / (instrument.readingScaleArcsecPerUnit * ARCSEC);
}

/**
 * Programme rows in time order from the worker's predictions: clock time when an offset is known,
 * zenith distance (refracted when the night has weather), micrometer setting, daylight flag.
 * Predictions for stars not in `stars` are dropped (a star deleted since the programme was made).
 */
export function programmeRows(
  transits: readonly PredictedTransit[],
  stars: readonly StarRecord[],
  instrument: InstrumentRecord,
  setting: TonightSetting,
): ProgrammeRow[] {
  const byId = new Map(stars.map((star) => [star.id, star]));
  const rows: ProgrammeRow[] = [];
  for (const transit of transits) {
    const star = byId.get(transit.starId);
    if (star === undefined) continue;
    rows.push({
      key: `${star.id}|${transit.culmination}|${Math.round(transit.utcMjd * 1440)}`,
      star,
      transit,
      clockMjd: setting.clockMinusUtcS === null ? null : transit.utcMjd + setting.clockMinusUtcS / SECONDS_PER_DAY,
      zenithDistanceDeg: transit.observedZenithRad / DEG,
      readingSetting: readingForZenithDistance(transit.observedZenithRad, setting.zeroPointDeg * DEG, instrument),
      daylight: transit.sunAltitudeRad > 0,
    });
  }
  return rows.sort((a, b) => a.transit.utcMjd - b.transit.utcMjd);
}

/** Index of the first row still to come at `nowUtcMjd` that is not in daylight, or −1 when none. */
export function nextObservableIndex(rows: readonly ProgrammeRow[], nowUtcMjd: number, loggedKeys: ReadonlySet<string>): number {
  return rows.findIndex((row) => row.transit.utcMjd > nowUtcMjd && !row.daylight && !loggedKeys.has(row.key));
}

/** A countdown `+H:MM:SS` (or `−…` once past) from `nowUtcMjd` to `utcMjd`. */
export function countdownText(utcMjd: number, nowUtcMjd: number): string {
  const totalSeconds = Math.round((utcMjd - nowUtcMjd) * SECONDS_PER_DAY);
  const sign = totalSeconds < 0 ? '−' : '';
  const s = Math.abs(totalSeconds);
  return `${sign}${Math.floor(s / 3600)}:${String(Math.floor(s / 60) % 60).padStart(2, '0')}:${String(s % 60).padStart(2, '0')}`;
}
