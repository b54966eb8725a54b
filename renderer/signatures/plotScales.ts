/**
 * Extent of `values` widened by `paddingFraction` of its span on each side, so no mark sits on an
 * axis. Non-finite values are ignored; an empty or single-valued input gets a span of `minimumSpan`
 * around its value (or around 0). Throws on a negative padding.
 */
export function paddedExtent(values: Iterable<number>, paddingFraction = 0.05, minimumSpan = 1): [number, number] {
  if (!(paddingFraction >= 0)) throw new Error(`paddedExtent: paddingFraction must be ≥ 0, got ${paddingFraction}.`);
  let low = Infinity, high = -Infinity;
  for (const v of values) {
    if (!Number.isFinite(v)) continue;
    if (v < low) low = v;
    if (v > high) high = v;
  }
  if (low === Infinity) return [-minimumSpan / 2, minimumSpan / 2];
  if (high - low < minimumSpan * 1e-9) return [low - minimumSpan / 2, high + minimumSpan / 2];
  const pad = (high - low) * paddingFraction;
  return [low - pad, high + pad];
}

/** A symmetric domain [−m, m] holding every value (error bars included by the caller), padded. */
export function symmetricExtent(values: Iterable<number>, paddingFraction = 0.05, minimumSpan = 1): [number, number] {
  const [low, high] = paddedExtent(values, paddingFraction, minimumSpan);
  const m = Math.max(Math.abs(low), Math.abs(high));
  return [-m, m];
}

/** MJD of J2000.0 TT (JD 2451545.0 − 2400000.5); TT−UTC (~69 s) is far below a plot's pixel. */
const MJD_J2000 = 51544.5;

/** TT days since J2000.0 → MJD (good to ~70 s, the TT−UTC difference: enough for a time axis). */
export function mjdFromTtDays(ttDaysSinceJ2000: number): number {
  return ttDaysSinceJ2000 + MJD_J2000;
}

/** MJD 0 is 1858-11-17 00:00 UTC; JS time 0 is MJD 40587 (common practice). */
const MJD_UNIX_EPOCH = 40587;

/** MJD (UTC) → JavaScript Date, for tick labels only. */
export function dateFromMjd(mjd: number): Date {
  return new Date((mjd - MJD_UNIX_EPOCH) * 86_400_000);
}

/** Day of the year (1 on 1 January 00:00 UTC, fractional) of an MJD (UTC): the season axis. */
export function dayOfYearFromMjd(mjd: number): number {
  const date = dateFromMjd(mjd);
  const yearStart = Date.UTC(date.getUTCFullYear(), 0, 1);
  return 1 + (date.getTime() - yearStart) / 86_400_000;
}
