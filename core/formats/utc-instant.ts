import { parseDateCell } from './cells.ts';
import type { CellResult } from './cells.ts';

/**
 * A UTC instant as the file gave it: the UTC calendar day (MJD, integer) and seconds of that
 * day, 0 ≤ secondsOfDay < 86 401 so that a leap second 23:59:60 keeps its own value. Converting
 * to a two-part Julian date needs the leap-second table and is left to core/time.
 */
export interface UtcInstant {
  readonly mjd: number;
  readonly secondsOfDay: number;
}

/** Seconds on a uniform count (mjd·86400 + s), for ordering and windows; not a time scale. */
export function utcCountS(instant: UtcInstant): number {
  return instant.mjd * 86_400 + instant.secondsOfDay;
}

const ISO = /^(\d{4}-\d{2}-\d{2})T(\d{2}):(\d{2}):(\d{2}(?:\.\d{1,9})?)Z$/;

/**
 * ISO 8601 UTC in the extended form YYYY-MM-DDThh:mm:ss[.fffffffff]Z. The trailing Z is required
 * (a time without a zone is ambiguous). Second 60 is accepted only at 23:59 (a leap second;
 * whether that day had one is checked against the leap-second table by the reduction).
 */
export function parseUtcCell(text: string): CellResult<UtcInstant> {
  const match = ISO.exec(text.trim());
  if (!match) return { ok: false, reason: `'${text}' is not ISO 8601 UTC like 2026-03-14T21:07:33.25Z (the Z is required)` };
  const date = parseDateCell(match[1]);
  if (!date.ok) return date;
  const [hour, minute, second] = [Number(match[2]), Number(match[3]), Number(match[4])];
  const leap = hour === 23 && minute === 59 && second >= 60 && second < 61;
  if (hour > 23 || minute > 59 || (second >= 60 && !leap)) return { ok: false, reason: `'${text}' has an impossible time of day` };
  return { ok: true, value: { mjd: date.value, secondsOfDay: hour * 3600 + minute * 60 + second } };
}
