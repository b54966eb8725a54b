import type { EarthOrientationRecord, LeapSecondRecord } from '../../core/archive/records.ts';
import { bundledEarthOrientationTable } from '../../core/time/bundled-earth-orientation.ts';
import { BUNDLED_LEAP_SECONDS } from '../../core/time/bundled-leap-seconds.ts';
import { parseIersC04, parseIersFinals, type EarthOrientationTable } from '../../core/time/earth-orientation-table.ts';
import { INTEGRAL_LEAP_SECOND_START_MJD } from '../../core/time/leap-seconds.ts';
import { parseLeapSecondsList } from '../../core/time/parse-leap-seconds-list.ts';
import { ARCSEC } from '../../core/units.ts';
import type { ArchiveDatabase } from '../store/database.ts';

export const LEAP_SECONDS_INFO_KEY = 'leapSecondsInfo';
export const EARTH_ORIENTATION_INFO_KEY = 'earthOrientationInfo';

/** Observed Earth orientation older than this many days before today counts as stale (common practice: IERS Bulletin A is weekly). */
export const EOP_STALE_AFTER_DAYS = 30;
/** A leap-second list within this many days of its expiry gets a warning (the IERS issues a new one every six months). */
export const LEAP_LIST_WARN_DAYS = 30;

export interface LeapSecondsInfo { readonly sourceName: string; readonly expiresMjd: number; readonly steps: number; readonly importedUtc: string }
export interface EarthOrientationInfo { readonly sourceName: string; readonly firstMjd: number; readonly lastMjd: number; readonly lastObservedMjd: number; readonly importedUtc: string }

/**
 * Imports an IERS leap-seconds.list (hash checked by the parser) into the leapSeconds table,
 * replacing the steps there in one transaction (a list always holds every step since 1972).
 */
export async function importLeapSecondsList(database: ArchiveDatabase, text: string, fileName: string, nowUtc: string): Promise<LeapSecondsInfo> {
  const table = parseLeapSecondsList(text, fileName);
  const records: LeapSecondRecord[] = table.steps
    .filter((s) => s.startMjd >= INTEGRAL_LEAP_SECOND_START_MJD)
    .map((s) => ({ mjd: s.startMjd, taiMinusUtcS: s.offsetSeconds, source: fileName }));
  const info: LeapSecondsInfo = { sourceName: fileName, expiresMjd: table.expiresMjd, steps: records.length, importedUtc: nowUtc };
  await database.transaction('rw', database.leapSeconds, database.settings, async () => {
    await database.leapSeconds.clear();
    await database.leapSeconds.bulkPut(records);
    await database.settings.put({ key: LEAP_SECONDS_INFO_KEY, value: info });
  });
  return info;
}

/** A C04 series has data lines that start with a four-digit year; finals2000A lines start with a two-digit one. */
function parseEarthOrientation(text: string, fileName: string): EarthOrientationTable {
  return /^\s*\d{4}\s+\d{1,2}\s+\d{1,2}\s/m.test(text) ? parseIersC04(text, fileName) : parseIersFinals(text, fileName);
}

/**
 * Imports an IERS finals2000A or EOP C04 file into the earthOrientation table, one record per
 * day (days already there are overwritten by the newer file, others kept), in one transaction.
 * Values are the table's own at whole days; pole coordinates go back from radians to arcseconds
 * (a relative rounding of 1e-16, far below the 10 µas the IERS prints).
 */
export async function importEarthOrientation(database: ArchiveDatabase, text: string, fileName: string, nowUtc: string): Promise<EarthOrientationInfo> {
  const table = parseEarthOrientation(text, fileName);
  const records: EarthOrientationRecord[] = [];
  for (let mjd = table.firstMjd; mjd <= table.lastMjd; mjd++) {
    const values = table.at(mjd);
    records.push({
      mjd, dut1S: values.dut1Seconds, xpArcsec: values.xpRad / ARCSEC, ypArcsec: values.ypRad / ARCSEC,
      kind: mjd <= table.lastObservedMjd ? 'final' : 'predicted', source: fileName,
    });
  }
  const info: EarthOrientationInfo = { sourceName: fileName, firstMjd: table.firstMjd, lastMjd: table.lastMjd, lastObservedMjd: table.lastObservedMjd, importedUtc: nowUtc };
  await database.transaction('rw', database.earthOrientation, database.settings, async () => {
    await database.earthOrientation.bulkPut(records);
    await database.settings.put({ key: EARTH_ORIENTATION_INFO_KEY, value: info });
  });
  return info;
}

export interface TableFreshness {
  readonly leapSeconds: { readonly origin: 'bundled' | 'imported'; readonly sourceName: string; readonly expiresMjd: number };
  readonly earthOrientation: { readonly origin: 'bundled' | 'imported'; readonly sourceName: string; readonly lastMjd: number; readonly lastObservedMjd: number };
  /** One line per stale table, saying what to import; empty when both are current. */
  readonly warnings: readonly string[];
}

/** How recent the tables in use are on UTC day `todayMjd`: imported ones when present, else the bundled ones. */
export async function tableFreshness(database: ArchiveDatabase, todayMjd: number): Promise<TableFreshness> {
  const leapInfo = (await database.settings.get(LEAP_SECONDS_INFO_KEY))?.value as LeapSecondsInfo | undefined;
  const eopInfo = (await database.settings.get(EARTH_ORIENTATION_INFO_KEY))?.value as EarthOrientationInfo | undefined;
  const bundledEop = bundledEarthOrientationTable();
  const leapSeconds = leapInfo
    ? { origin: 'imported' as const, sourceName: leapInfo.sourceName, expiresMjd: leapInfo.expiresMjd }
    : { origin: 'bundled' as const, sourceName: BUNDLED_LEAP_SECONDS.sourceName, expiresMjd: BUNDLED_LEAP_SECONDS.expiresMjd };
  const earthOrientation = eopInfo
    ? { origin: 'imported' as const, sourceName: eopInfo.sourceName, lastMjd: eopInfo.lastMjd, lastObservedMjd: eopInfo.lastObservedMjd }
    : { origin: 'bundled' as const, sourceName: bundledEop.sourceName, lastMjd: bundledEop.lastMjd, lastObservedMjd: bundledEop.lastObservedMjd };
  const warnings: string[] = [];
  if (todayMjd > leapSeconds.expiresMjd) {
    warnings.push(`The leap-second list expired ${todayMjd - leapSeconds.expiresMjd} days ago: import a current leap-seconds.list from the IERS.`);
  } else if (leapSeconds.expiresMjd - todayMjd <= LEAP_LIST_WARN_DAYS) {
    warnings.push(`The leap-second list expires in ${leapSeconds.expiresMjd - todayMjd} days: import the next leap-seconds.list from the IERS.`);
  }
  const age = todayMjd - earthOrientation.lastObservedMjd;
  if (age > EOP_STALE_AFTER_DAYS) {
    warnings.push(`Observed Earth orientation ends ${age} days ago: import a current IERS finals2000A or EOP C04 file (until then UT1 − UTC and polar motion after that day are predictions or zero).`);
  }
  return { leapSeconds, earthOrientation, warnings };
}
