import { DEG } from '../units.ts';
import { mjdToCalendarDay, calendarDayToMjd } from '../time/julian-date.ts';
import { darkWindow } from './darkness.ts';
import type { SeededRandom } from './seeded-random.ts';
import { nextDayWeather, type DayWeather } from './weather-model.ts';

/** Sun altitude below which stars are observed, degrees (nautical darkness, common practice). */
export const DARKNESS_SUN_LIMIT_DEG = -12;

/** One date on which the sky was at least partly clear and an observer was at the instrument. */
export interface PlannedNight {
  /** Local civil date on which the night began, `YYYY-MM-DD`. */
  readonly localDate: string;
  readonly dayOfYear: number;
  /** UTC MJD of local noon of `localDate`. */
  readonly localNoonUtcMjd: number;
  /** Intervals (UTC MJD) during which the observer observed in clear, dark sky. */
  readonly sessions: readonly { readonly startMjd: number; readonly endMjd: number }[];
  readonly darkHours: number;
  readonly day: DayWeather;
  readonly quality: 'good' | 'fair' | 'poor';
}

export interface CalendarSite {
  readonly latitudeDeg: number;
  readonly longitudeDeg: number;
  readonly utcOffsetHours: number;
}

/** Mean length of a run of bad-weather days (Markov chain), days; common practice for such a site. */
const MEAN_BAD_RUN_DAYS = 3.5;

/**
 * The observing calendar: a two-state Markov chain of usable and overcast days (mean overcast run
 * MEAN_BAD_RUN_DAYS, the usable fraction set so that about `nightsPerYearTarget` nights are
 * observed), a daily weather anomaly for every date, the dark window of each night (Sun below
 * −12°), and the observer's sessions: from dusk until dawn one night in three, else for 3–9 h, sometimes with a second
 * session before dawn;
 * a usable night is partly cloudy one time in three (a random clear part of it). Short summer
 * nights are skipped more often (the observer's choice: less to gain). Deterministic in `random`.
 */
export function planNights(site: CalendarSite, startMjd: number, days: number, nightsPerYearTarget: number, random: SeededRandom): PlannedNight[] {
  const latitudeRad = site.latitudeDeg * DEG, longitudeRad = site.longitudeDeg * DEG;
  const usableFraction = Math.min(0.95, nightsPerYearTarget / 365 / 0.78);
  const meanGoodRun = (usableFraction * MEAN_BAD_RUN_DAYS) / (1 - usableFraction);
  let good = random.chance(usableFraction);
  let day: DayWeather | null = null;
  const nights: PlannedNight[] = [];
  for (let offset = 0; offset < days; offset++) {
    day = nextDayWeather(day, random);
    good = good ? !random.chance(1 / meanGoodRun) : random.chance(1 / MEAN_BAD_RUN_DAYS);
    const observerDraw = random.uniform();
    const sessionDraws = [random.uniform(), random.uniform(), random.uniform(), random.uniform(), random.uniform()];
    if (!good) continue;
    const localNoonUtcMjd = startMjd + offset + (12 - site.utcOffsetHours) / 24;
    const dark = darkWindow(localNoonUtcMjd, latitudeRad, longitudeRad, DARKNESS_SUN_LIMIT_DEG);
    if (dark === null) continue;
    const darkHours = (dark.endMjd - dark.startMjd) * 24;
    if (observerDraw < 0.12 + 0.3 * Math.max(0, 1 - darkHours / 12)) continue;
    const sessions = observerSessions(dark, darkHours, sessionDraws);
    const { year, month, day: dayOfMonth } = mjdToCalendarDay(startMjd + offset);
    const dayOfYear = startMjd + offset - calendarDayToMjd(year, 1, 1) + 1;
    const quality = sessionDraws[4] < 0.6 ? 'good' : sessionDraws[4] < 0.9 ? 'fair' : 'poor';
    nights.push({
      localDate: `${year}-${String(month).padStart(2, '0')}-${String(dayOfMonth).padStart(2, '0')}`,
      dayOfYear, localNoonUtcMjd, sessions, darkHours, day, quality,
    });
  }
  return nights;
}

function observerSessions(dark: { startMjd: number; endMjd: number }, darkHours: number, draws: readonly number[]): { startMjd: number; endMjd: number }[] {
  // One night in three the observer stays until dawn; otherwise 3–9 h from dusk.
  const eveningHours = draws[0] < 1 / 3 ? darkHours : Math.min(darkHours, 3 + 9 * draws[0]);
  const sessions = [{ startMjd: dark.startMjd, endMjd: dark.startMjd + eveningHours / 24 }];
  const morningHours = Math.min(3, darkHours - eveningHours);
  if (draws[1] < 0.25 && morningHours > 1) sessions.push({ startMjd: dark.endMjd - morningHours / 24, endMjd: dark.endMjd });
  if (draws[2] < 1 / 3) {
    // Partly cloudy: only a random 30–80 % stretch of the observing time is clear.
    const total = sessions.reduce((sum, s) => sum + (s.endMjd - s.startMjd), 0);
    const clear = total * (0.3 + 0.5 * draws[3]);
    const clearStart = sessions[0].startMjd + (total - clear) * draws[3];
    return sessions
      .map((s) => ({ startMjd: Math.max(s.startMjd, clearStart), endMjd: Math.min(s.endMjd, clearStart + clear) }))
      .filter((s) => s.endMjd > s.startMjd);
  }
  return sessions;
}
