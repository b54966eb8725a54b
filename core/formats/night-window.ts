import { utcCountS } from './utc-instant.ts';
import type { UtcInstant } from './utc-instant.ts';

/**
 * Whether an instant can belong to the night that begins on the local date `nightDateMjd`: from
 * that date's 0 h UTC − 1 day to + 2 days, which holds every night at any longitude (local dates
 * run up to 14 h from UTC) with a day to spare. A reading outside it has the wrong date.
 */
export function isWithinNightWindow(utc: UtcInstant, nightDateMjd: number): boolean {
  const dayOffsetS = utcCountS(utc) - nightDateMjd * 86_400;
  return dayOffsetS >= -86_400 && dayOffsetS <= 172_800;
}
