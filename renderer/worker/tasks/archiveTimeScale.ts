import { bundledEarthOrientationTable } from '../../../core/time/bundled-earth-orientation.ts';
import { BUNDLED_LEAP_SECONDS } from '../../../core/time/bundled-leap-seconds.ts';
import { LeapSecondTable } from '../../../core/time/leap-seconds.ts';
import { daysOfTable, SplicedEarthOrientation, type EarthOrientationDay } from '../../../core/time/spliced-earth-orientation.ts';
import { TimeScale } from '../../../core/time/timescale.ts';
import { LEAP_SECONDS_INFO_KEY, type LeapSecondsInfo } from '../../exchange/iersTables.ts';
import type { ArchiveDatabase } from '../../store/database.ts';

let bundledDays: readonly EarthOrientationDay[] | undefined;

/** The time scale a reduction in the worker uses, and where its tables came from (for the user). */
export interface ArchiveTimeScale {
  readonly scale: TimeScale;
  /** e.g. "leap seconds: leap-seconds.list (imported); Earth orientation: bundled IERS C04 + finals2000A.daily (imported)". */
  readonly tablesInUse: string;
  /**
   * Changes when the stored tables do (their names, the number of leap-second steps and of
   * Earth-orientation days, the last such day): what a result computed with them is keyed on.
   */
  readonly tablesKey: string;
}

/**
 * The leap seconds and Earth orientation the archive holds: the imported leap-second list when
 * there is one (else the bundled list), and the bundled IERS C04 series with every imported IERS
 * day laid over it (core/time/spliced-earth-orientation.ts: gaps are named in the warnings, not
 * bridged). A damaged stored leap-second table (steps that no longer make a valid table) is not
 * used: the bundled list is, and `tablesInUse` says why.
 */
export async function archiveTimeScale(database: ArchiveDatabase): Promise<ArchiveTimeScale> {
  const [leapRecords, leapInfoRow, eopRecords] = await Promise.all([
    database.leapSeconds.orderBy('mjd').toArray(),
    database.settings.get(LEAP_SECONDS_INFO_KEY),
    database.earthOrientation.orderBy('mjd').toArray(),
  ]);
  const leapInfo = leapInfoRow?.value as LeapSecondsInfo | undefined;
  let leapSeconds = BUNDLED_LEAP_SECONDS;
  let leapNote = `${BUNDLED_LEAP_SECONDS.sourceName} (bundled)`;
  if (leapInfo !== undefined && leapRecords.length > 0) {
    try {
      const steps = leapRecords.map((r) => ({ startMjd: r.mjd, offsetSeconds: r.taiMinusUtcS, driftReferenceMjd: r.mjd, driftSecondsPerDay: 0 }));
      leapSeconds = new LeapSecondTable(steps, { sourceName: leapInfo.sourceName, expiresMjd: leapInfo.expiresMjd });
      leapNote = `${leapInfo.sourceName} (imported)`;
    } catch (error) {
      leapNote = `${BUNDLED_LEAP_SECONDS.sourceName} (bundled; the imported list could not be used: ${(error as Error).message})`;
    }
  }
  const bundled = bundledEarthOrientationTable();
  const imported = eopRecords.map((r) => ({ mjd: r.mjd, dut1Seconds: r.dut1S, xArcsec: r.xpArcsec, yArcsec: r.ypArcsec, predicted: r.kind === 'predicted' }));
  const sources = [...new Set(eopRecords.map((r) => r.source))];
  const eopName = sources.length === 0 ? `${bundled.sourceName} (bundled)` : `${bundled.sourceName} (bundled) + ${sources.join(', ')} (imported)`;
  const eop = new SplicedEarthOrientation([(bundledDays ??= daysOfTable(bundled)), imported], eopName);
  const tablesInUse = `leap seconds: ${leapNote}; Earth orientation: ${eopName}`;
  const tablesKey = `${tablesInUse}|${eopRecords.length}|${eopRecords.at(-1)?.mjd ?? ''}|${leapRecords.length}`;
  return { scale: new TimeScale(leapSeconds, eop), tablesInUse, tablesKey };
}
