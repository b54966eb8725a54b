/**
 * The archive's record types: what is stored (IndexedDB in the renderer, bundle files on disk,
 * CLI input) for sites, instruments, stars, nights and transits. Types only; every store and file
 * format shares them.
 *
 * Conventions for every record:
 * - ids are strings (random UUIDs for rows the user or an import creates);
 * - raw numbers carry their unit in the name (latitudeDeg, heightM, parallaxMas, pmRaMasYr);
 * - instants are stored as a modified Julian date on the scale the field names (utcMjd, clockMjd);
 *   a double holds an MJD to about 1 µs, enough for ordering and indexing; the reduction turns
 *   them into two-part Julian dates;
 * - `createdUtc` / `updatedUtc` are ISO 8601 UTC strings written by the store, for audit only.
 */

/**
 * A row written by the user is visible at once. An import writes its rows `visible` with its
 * `importId`, in chunks inside ONE IndexedDB transaction, so they appear together when it commits
 * and not at all when it is interrupted. `staged` rows exist only in archives written by earlier
 * versions, whose imports staged rows and flipped them at commit; they are swept at start.
 */
export type Visibility = 'visible' | 'staged';

/**
 * Fields on every importable row: the visibility above and the import that wrote it (the import
 * journal entry in `imports` records its status; DESIGN.md §3).
 */
export interface Importable {
  readonly visibility: Visibility;
  /** The import that wrote this row; absent for rows entered by hand. */
  readonly importId?: string;
}

export interface Audited {
  readonly createdUtc: string;
  readonly updatedUtc: string;
}

/** An observing site on the WGS84 ellipsoid. */
export interface SiteRecord extends Importable, Audited {
  readonly id: string;
  readonly label: string;
  /** Geodetic latitude, degrees, north positive, in [−90, 90]. */
  readonly latitudeDeg: number;
  /** Geodetic longitude, degrees, EAST positive, in [−180, 180]. */
  readonly longitudeDeg: number;
  /** Height above the WGS84 ellipsoid, metres (not above sea level). */
  readonly heightM: number;
  readonly note: string;
}

export type InstrumentKind = 'transit' | 'zenith-tube' | 'fixed-camera';

/** What a zenith-distance reading counts: micrometer turns, camera pixels, or circle arcseconds. */
export type ReadingUnit = 'micrometer-turn' | 'pixel' | 'circle-arcsec';

export interface InstrumentRecord extends Importable, Audited {
  readonly id: string;
  readonly label: string;
  readonly kind: InstrumentKind;
  readonly siteId: string;
  readonly readingUnit: ReadingUnit;
  /** Arcseconds of zenith distance per reading unit (1 for `circle-arcsec`). */
  readonly readingScaleArcsecPerUnit: number;
  /** +1 if a growing reading means a growing zenith distance, −1 if it means a shrinking one. */
  readonly readingSense: 1 | -1;
  /**
   * Equatorial intervals of the wires from the mean wire, seconds of time, in the order a star of
   * upper culmination crosses them; empty for a single reference line.
   */
  readonly wireIntervalsEquatorialS: readonly number[];
  /** Effective wavelength of the detector and optics, nanometres (refraction depends on it). */
  readonly effectiveWavelengthNm: number;
  /** Which clock the times are read on, e.g. "pier clock"; free text. */
  readonly clockLabel: string;
  readonly note: string;
  /**
   * Detector geometry of a `fixed-camera` (core/instrument/fixed-camera.ts CameraGeometry without
   * the scale, which is `readingScaleArcsecPerUnit`); absent for other kinds and for cameras
   * imported before it was kept.
   */
  readonly camera?: CameraGeometryRecord;
}

/** A fixed camera's detector geometry, as the site description (FORMATS.md `camera`) gives it. */
export interface CameraGeometryRecord {
  /** Angle from the detector's +x axis (after parity) to the along-track direction, degrees, counter-clockwise on the sky. */
  readonly orientationDeg: number;
  /** −1 for a mirrored image. */
  readonly parity: 1 | -1;
  /** Optical centre [x, y], pixels. */
  readonly opticalCentrePx: readonly [number, number];
  /** The detector column x taken as the reference line, pixels. */
  readonly referenceColumnPx: number;
}

export type InstrumentEventKind =
  | 'adjustment'
  | 'relevelling'
  | 'recollimation'
  | 'cleaning'
  | 'camera-change'
  | 'clock-change'
  | 'other';

/** Something done to an instrument; events cut the drift model into segments. */
export interface InstrumentEventRecord extends Importable, Audited {
  readonly id: string;
  readonly instrumentId: string;
  /** When it was done, UTC as MJD. */
  readonly utcMjd: number;
  readonly kind: InstrumentEventKind;
  readonly note: string;
}

/** A programme star: ICRS place at a catalogue epoch and its space motion. */
export interface StarRecord extends Importable, Audited {
  readonly id: string;
  /** The user's own id for the star (e.g. a catalogue number); unique within one archive by use. */
  readonly catalogueId: string;
  readonly label: string;
  /** ICRS right ascension at `catalogueEpochJulianYear`, degrees in [0, 360). */
  readonly raDeg: number;
  /** ICRS declination at `catalogueEpochJulianYear`, degrees in [−90, 90]. */
  readonly decDeg: number;
  /** Epoch of the position, Julian year on TDB (e.g. 2016.0). */
  readonly catalogueEpochJulianYear: number;
  /** Proper motion in right ascension times cos δ (μα*), mas per Julian year. */
  readonly pmRaMasYr: number;
  /** Proper motion in declination, mas per Julian year. */
  readonly pmDecMasYr: number;
  /** Annual parallax, mas (≥ 0 by physics; a catalogue may list small negatives, kept as given). */
  readonly parallaxMas: number;
  /** Standard uncertainty of the parallax, mas; 0 when unknown (NaN in stars imported before 2026-12-02, read as unknown too). */
  readonly parallaxErrorMas: number;
  /**
   * Stated standard uncertainty of the catalogue position at its epoch, per coordinate on the sky
   * (mas), and of each proper-motion component (mas/yr): the joint solve's catalogue priors.
   * Absent when unknown (never 0 or NaN); stars stored before these fields existed have neither.
   */
  readonly positionErrorMas?: number;
  readonly pmErrorMasYr?: number;
  /** Radial velocity, km/s, positive receding; 0 when unknown. */
  readonly radialVelocityKmS: number;
  /** Visual or band magnitude; NaN is not allowed, use `null` when unknown. */
  readonly magnitude: number | null;
  /** Where the place came from, e.g. "Gaia DR3" with the row id. */
  readonly source: string;
  /** Names of the observing programmes the star belongs to. */
  readonly programmes: readonly string[];
}

export interface ClockComparison {
  /** When the comparison was made, UTC as MJD. */
  readonly utcMjd: number;
  /** Clock reading minus UTC at that instant, seconds. */
  readonly clockMinusUtcS: number;
  /** The time signal compared with, e.g. "GNSS PPS"; free text. */
  readonly signal: string;
}

export interface LevelReading {
  readonly utcMjd: number;
  /** Inclination of the rotation axis, arcseconds, west end high positive. */
  readonly levelArcsec: number;
}

export interface CollimationReading {
  readonly utcMjd: number;
  /** Collimation error, arcseconds, positive when the line of sight points east of the normal. */
  readonly collimationArcsec: number;
}

export interface WeatherReading {
  readonly temperatureC: number;
  readonly pressureHpa: number;
  readonly relativeHumidityPercent: number;
}

export type NightQuality = 'good' | 'fair' | 'poor';

/** One observing night of one instrument. */
export interface NightRecord extends Importable, Audited {
  readonly id: string;
  readonly siteId: string;
  readonly instrumentId: string;
  /** Local civil date on which the night began, `YYYY-MM-DD`. */
  readonly localDate: string;
  readonly observer: string;
  /** Weather at the start of the night; transits may carry their own. */
  readonly weather: WeatherReading | null;
  readonly clockComparisons: readonly ClockComparison[];
  readonly levelReadings: readonly LevelReading[];
  readonly collimationReadings: readonly CollimationReading[];
  readonly quality: NightQuality;
  readonly note: string;
}

export type Culmination = 'upper' | 'lower';

/** One observed transit of one star. */
export interface TransitRecord extends Importable, Audited {
  readonly id: string;
  readonly nightId: string;
  readonly starId: string;
  /** Copied from the night so that per-instrument time series need no join. */
  readonly instrumentId: string;
  readonly culmination: Culmination;
  /**
   * Clamp (circle) position of a reversible instrument at this transit: it flips the sign of the
   * collimation and of the wire intervals (core/instrument/culmination.ts, c stated for clamp west).
   * Absent for an instrument that is not reversed, and for transits stored before it was kept.
   */
  readonly clamp?: 'east' | 'west';
  /** Mean-wire (or single-line) crossing time read on the instrument clock, as MJD. */
  readonly clockMjd: number;
  /** Clock times at each wire, as MJD, same order as the instrument's wire intervals; may be empty. */
  readonly wireClockMjd: readonly number[];
  /**
   * Approximate UTC of the crossing, MJD, for ordering and indexing only (clock reading with the
   * night's clock correction if known, else the raw reading; good to seconds).
   */
  readonly utcMjd: number;
  /** Zenith-distance readings in the instrument's `readingUnit`; may be empty (time-only). */
  readonly zenithReadings: readonly number[];
  /** Weather at this transit when measured, else null (the night's weather applies). */
  readonly weather: WeatherReading | null;
  /** Relative weight given by the observer, 1 = normal. */
  readonly weight: number;
  readonly userRejected: boolean;
  /** Set by a reduction's robust fit; kept so the archive shows it. */
  readonly flaggedOutlier: boolean;
  readonly note: string;
}

/** Earth orientation for one UTC day at 0h, from an IERS series. */
export interface EarthOrientationRecord {
  /** UTC MJD of the day (integer). Primary key. */
  readonly mjd: number;
  /** UT1 − UTC, seconds. */
  readonly dut1S: number;
  /** Polar motion x, arcseconds. */
  readonly xpArcsec: number;
  /** Polar motion y, arcseconds. */
  readonly ypArcsec: number;
  /** Final (observed) or predicted value. */
  readonly kind: 'final' | 'predicted';
  /** File the value came from, e.g. "finals2000A.all 2026-11-27" or "bundled". */
  readonly source: string;
}

/** A step of TAI − UTC. */
export interface LeapSecondRecord {
  /** UTC MJD of the first day on which `taiMinusUtcS` holds (integer). Primary key. */
  readonly mjd: number;
  /** TAI − UTC from that day on, seconds. */
  readonly taiMinusUtcS: number;
  readonly source: string;
}

/** A saved solve, so any published number can be traced and re-run. */
export interface ReductionRecord extends Audited {
  readonly id: string;
  readonly label: string;
  /** The model configuration as chosen (JSON-serialisable; its type is owned by the solver). */
  readonly modelConfiguration: Readonly<Record<string, unknown>>;
  /** Hash of every input row the solve used, so a re-run can tell if the archive changed. */
  readonly inputFingerprint: string;
  /** Version of the code that ran the solve (package version and commit if known). */
  readonly codeVersion: string;
  /** Results and residuals (JSON-serialisable; their types are owned by the solver). */
  readonly results: Readonly<Record<string, unknown>>;
  readonly residuals: readonly Readonly<Record<string, unknown>>[];
}

/** One row of an input file that an import refused, and why. */
export interface RejectedRow {
  /** 1-based row (line) number in the file. */
  readonly row: number;
  /** Column name or 1-based number; empty when the whole row is wrong. */
  readonly column: string;
  readonly reason: string;
}

export type ImportStatus = 'staging' | 'committed' | 'abandoned';

/** The journal entry of one import; its rows carry its id until committed. */
export interface ImportRecord {
  readonly id: string;
  readonly fileName: string;
  /** Name of the file format reader that parsed it. */
  readonly format: string;
  readonly status: ImportStatus;
  readonly startedUtc: string;
  /** When it committed or was abandoned; null while staging. */
  readonly finishedUtc: string | null;
  /** Rows written per table, e.g. `{ transits: 1200, stars: 40 }`. */
  readonly rowCounts: Readonly<Record<string, number>>;
  readonly rejectedRows: readonly RejectedRow[];
}
