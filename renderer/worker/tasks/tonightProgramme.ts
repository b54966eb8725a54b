import { iauEarthOrientation } from '../../../core/astrometry/iau-earth-orientation.ts';
import { nightProgramme } from '../../../core/astrometry/night-programme.ts';
import { starMotion } from '../../../core/astrometry/space-motion.ts';
import type { Weather } from '../../../core/astrometry/weather.ts';
import { TaskCancelledError, type TaskControl } from '../../../core/task/task-control.ts';
import { bundledEarthOrientationTable } from '../../../core/time/bundled-earth-orientation.ts';
import { BUNDLED_LEAP_SECONDS } from '../../../core/time/bundled-leap-seconds.ts';
import { TimeScale } from '../../../core/time/timescale.ts';
import { DEG } from '../../../core/units.ts';
import { ArchiveDatabase } from '../../store/database.ts';
import { archiveTimeScale } from './archiveTimeScale.ts';

/** One programme star as the worker needs it (the store's StarRecord fields, degrees and mas). */
export interface ProgrammeStarInput {
  readonly id: string;
  readonly raDeg: number;
  readonly decDeg: number;
  readonly pmRaMasYr: number;
  readonly pmDecMasYr: number;
  readonly parallaxMas: number;
  readonly radialVelocityKmS: number;
  readonly catalogueEpochJulianYear: number;
}

export interface TonightProgrammeRequest {
  readonly kind: 'tonight-programme';
  /** Geodetic latitude and longitude (degrees, east positive) and height above WGS84 (m). */
  readonly site: { readonly latitudeDeg: number; readonly longitudeDeg: number; readonly heightM: number };
  readonly stars: readonly ProgrammeStarInput[];
  /** The window searched, UTC as MJD; until must be later than from. */
  readonly fromUtcMjd: number;
  readonly untilUtcMjd: number;
  /** Weather for refraction of the observed zenith distance; null gives geometric values only. */
  readonly weather: Weather | null;
  /**
   * The archive whose imported leap seconds and Earth orientation to use (over the bundled ones);
   * absent: the bundled tables only.
   */
  readonly databaseName?: string;
}

/** One predicted transit, plain numbers only (structured clone). */
export interface PredictedTransit {
  readonly starId: string;
  readonly culmination: 'upper' | 'lower';
  readonly utcMjd: number;
  readonly side: 'north' | 'south';
  /** Geometric (topocentric) meridian zenith distance, rad. */
  readonly geometricZenithRad: number;
  /** Zenith distance with refraction when weather was given, else equal to the geometric one, rad. */
  readonly observedZenithRad: number;
  /** Topocentric declination of date (the one the wire reduction uses), rad. */
  readonly declinationRad: number;
  readonly sunAltitudeRad: number;
  readonly starSunSeparationRad: number;
  readonly caution: string | null;
  readonly warnings: readonly string[];
}

export interface TonightProgrammeResult {
  readonly kind: 'tonight-programme';
  readonly transits: readonly PredictedTransit[];
  /** Stars whose prediction failed, with the reason (the rest of the programme still stands). */
  readonly failures: readonly { readonly starId: string; readonly reason: string }[];
  /** The leap-second and Earth orientation tables used, in words. */
  readonly tablesInUse: string;
  /** Every distinct warning of the night's predictions (e.g. the night is beyond the Earth orientation tables). */
  readonly notes: readonly string[];
}

const MJD_ZERO_JD = 2_400_000.5;

/**
 * The night's programme in the worker: core/astrometry/night-programme.ts over the window, upper
 * and lower culminations above the horizon, the archive's leap seconds and Earth orientation
 * (archiveTimeScale: imported IERS files over the bundled ones; bundled only without a database),
 * IAU 2006/2000A. One star at a time so that a bad star is reported, not fatal, and a cancel is
 * seen between stars.
 */
export async function runTonightProgramme(request: TonightProgrammeRequest, control: TaskControl): Promise<TonightProgrammeResult> {
  if (!(request.untilUtcMjd > request.fromUtcMjd)) {
    throw new RangeError(`tonight-programme: untilUtcMjd ${request.untilUtcMjd} must be later than fromUtcMjd ${request.fromUtcMjd}`);
  }
  const { scale, tablesInUse } = await timeScaleFor(request.databaseName);
  const site = { latitudeRad: request.site.latitudeDeg * DEG, longitudeRad: request.site.longitudeDeg * DEG, heightM: request.site.heightM };
  const from = { jd1: MJD_ZERO_JD, jd2: request.fromUtcMjd };
  const until = { jd1: MJD_ZERO_JD, jd2: request.untilUtcMjd };
  const transits: PredictedTransit[] = [];
  const failures: { starId: string; reason: string }[] = [];
  for (const [index, star] of request.stars.entries()) {
    if (control.cancellation.isCancelled) throw new TaskCancelledError('tonight-programme', index);
    try {
      const motion = starMotion({
        raRad: star.raDeg * DEG, decRad: star.decDeg * DEG, pmRaCosDecMasYr: star.pmRaMasYr, pmDecMasYr: star.pmDecMasYr,
        parallaxMas: star.parallaxMas, radialVelocityKmS: star.radialVelocityKmS, epochJulianYear: star.catalogueEpochJulianYear,
      });
      const entries = nightProgramme([motion], site, request.weather, from, until, ['upper', 'lower'], (utc) => scale.fromUtc(utc), iauEarthOrientation);
      for (const entry of entries) {
        const p = entry.prediction;
        transits.push({
          starId: star.id, culmination: p.culmination, utcMjd: p.utc.jd1 - MJD_ZERO_JD + p.utc.jd2, side: p.side,
          geometricZenithRad: p.place.topocentricZenithRad, observedZenithRad: p.place.observedZenithRad,
          declinationRad: p.place.topocentricDeclinationRad, sunAltitudeRad: entry.sun.sunAltitudeRad,
          starSunSeparationRad: entry.sun.starSunSeparationRad, caution: entry.sun.caution ?? null, warnings: [...new Set(p.warnings)],
        });
      }
    } catch (error) {
      failures.push({ starId: star.id, reason: error instanceof Error ? error.message : String(error) });
    }
    control.reportProgress(index + 1, request.stars.length);
    await control.yieldToHost();
  }
  transits.sort((a, b) => a.utcMjd - b.utcMjd);
  // One line per distinct warning: the instant each prediction names is taken out, so a night beyond the tables says so once.
  const notes = [...new Set(transits.flatMap((t) => t.warnings).map(forTheNight))];
  return { kind: 'tonight-programme', transits, failures, tablesInUse, notes };
}

/** A prediction's warning said of the whole night: "MJD 61375.476: it is after…" → "This night: it is after…". */
function forTheNight(warning: string): string {
  return warning
    .replace(/^MJD \d+(\.\d+)?: /, 'This night: ')
    .replace(/values at MJD \d+(\.\d+)? are/, "this night's values are")
    .replace(/^MJD \d+(\.\d+)? is/, 'This night is');
}

async function timeScaleFor(databaseName: string | undefined): Promise<{ scale: TimeScale; tablesInUse: string }> {
  if (databaseName === undefined) {
    return { scale: new TimeScale(BUNDLED_LEAP_SECONDS, bundledEarthOrientationTable()), tablesInUse: 'bundled leap seconds and IERS C04 Earth orientation' };
  }
  const database = new ArchiveDatabase(databaseName);
  try {
    return await archiveTimeScale(database);
  } finally {
    database.close();
  }
}
