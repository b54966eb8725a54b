import { calendarDayToMjd } from '../../core/time/julian-date.ts';

/** The observing night of a site: its local date and the UTC window searched for transits. */
export interface NightWindow {
  /** Local date on which the night begins, `YYYY-MM-DD` (the NightRecord's `localDate`). */
  readonly localDate: string;
  /** From local mean noon of that date to the next local mean noon, UTC as MJD. */
  readonly fromUtcMjd: number;
  readonly untilUtcMjd: number;
}

/**
 * The night that `utcMjd` belongs to at east longitude `longitudeDeg`: local mean time is UTC +
 * longitude/15 h; before local noon the instant still belongs to the night that began on the
 * previous date (common practice: an observing night is dated by its evening). The window is the
 * 24 h from local mean noon to local mean noon, so daylight transits are listed too (greyed).
 */
export function nightWindowAt(utcMjd: number, longitudeDeg: number): NightWindow {
  if (!Number.isFinite(utcMjd)) throw new RangeError(`nightWindowAt: the instant ${utcMjd} is not a number of days (UTC MJD)`);
  if (!(Math.abs(longitudeDeg) <= 180)) throw new RangeError(`nightWindowAt: longitude ${longitudeDeg}° must lie in [−180, 180], east positive`);
  const localMeanMjd = utcMjd + longitudeDeg / 360;
  const eveningMjd = Math.floor(localMeanMjd - 0.5);
  const fromUtcMjd = eveningMjd + 0.5 - longitudeDeg / 360;
  return { localDate: mjdToIsoDate(eveningMjd), fromUtcMjd, untilUtcMjd: fromUtcMjd + 1 };
}

/** The night window of a given local date `YYYY-MM-DD`; refuses anything else with the reason. */
export function nightWindowOfDate(localDate: string, longitudeDeg: number): NightWindow {
  const match = /^(\d{4})-(\d{2})-(\d{2})$/.exec(localDate);
  if (match === null) throw new RangeError(`night date "${localDate}" must be written YYYY-MM-DD`);
  const mjd = calendarDayToMjd(Number(match[1]), Number(match[2]), Number(match[3]));
  return nightWindowAt(mjd + 0.5 - longitudeDeg / 360 + 1e-9, longitudeDeg);
}

/** `YYYY-MM-DD` of an integer MJD (proleptic Gregorian; Fliegel & Van Flandern 1968, CACM 11, 657). */
export function mjdToIsoDate(mjd: number): string {
  let l = Math.floor(mjd) + 2_400_001 + 68_569;
  const n = Math.floor((4 * l) / 146_097);
  l -= Math.floor((146_097 * n + 3) / 4);
  const i = Math.floor((4000 * (l + 1)) / 1_461_001);
  l = l - Math.floor((1461 * i) / 4) + 31;
  const j = Math.floor((80 * l) / 2447);
  const day = l - Math.floor((2447 * j) / 80);
  l = Math.floor(j / 11);
  const month = j + 2 - 12 * l;
  const year = 100 * (n - 49) + i + l;
  return `${String(year).padStart(4, '0')}-${String(month).padStart(2, '0')}-${String(day).padStart(2, '0')}`;
}

/** `HH:MM:SS.s` of the time of day of an MJD (any scale), to tenths of a second. */
export function formatTimeOfDay(mjd: number): string {
  const tenths = Math.round((mjd - Math.floor(mjd)) * 864_000) % 864_000;
  const seconds = Math.floor(tenths / 10);
  const two = (value: number) => String(value).padStart(2, '0');
  return `${two(Math.floor(seconds / 3600))}:${two(Math.floor(seconds / 60) % 60)}:${two(seconds % 60)}.${tenths % 10}`;
}
