import type { InstrumentRecord, NightRecord, SiteRecord, StarRecord, TransitRecord } from '../archive/records.ts';
import type { ExportColumn } from './export-columns.ts';

/** Numbers of a list in one cell, ';'-separated, each the shortest round-trip decimal. */
function list(values: readonly number[]): string {
  return values.map((v) => (Object.is(v, -0) ? '-0' : String(v))).join(';');
}

const text = <Row>(name: string, description: string, value: (row: Row) => string): ExportColumn<Row> => ({ name, datatype: 'char', description, value });
const double = <Row>(name: string, unit: string, description: string, value: (row: Row) => number | null, ucd?: string): ExportColumn<Row> =>
  ({ name, datatype: 'double', description, value, ...(unit === '' ? {} : { unit }), ...(ucd === undefined ? {} : { ucd }) });

export const SITE_COLUMNS: readonly ExportColumn<SiteRecord>[] = [
  text('id', 'archive id of the site', (s) => s.id),
  text('label', 'site name', (s) => s.label),
  double('latitudeDeg', 'deg', 'geodetic latitude (WGS84), north positive', (s) => s.latitudeDeg),
  double('longitudeDeg', 'deg', 'geodetic longitude (WGS84), east positive', (s) => s.longitudeDeg),
  double('heightM', 'm', 'height above the WGS84 ellipsoid', (s) => s.heightM),
  text('note', 'note', (s) => s.note),
];

export const INSTRUMENT_COLUMNS: readonly ExportColumn<InstrumentRecord>[] = [
  text('id', 'archive id of the instrument', (i) => i.id),
  text('label', 'instrument name', (i) => i.label),
  text('kind', 'transit, zenith-tube or fixed-camera', (i) => i.kind),
  text('siteId', 'archive id of its site', (i) => i.siteId),
  text('readingUnit', 'what a zenith-distance reading counts', (i) => i.readingUnit),
  double('readingScaleArcsecPerUnit', 'arcsec', 'arcseconds of zenith distance per reading unit', (i) => i.readingScaleArcsecPerUnit),
  double('readingSense', '', '+1 if a growing reading means a growing zenith distance, -1 otherwise', (i) => i.readingSense),
  text('wireIntervalsEquatorialS', 'equatorial wire intervals from the mean wire, seconds of time, ;-separated', (i) => list(i.wireIntervalsEquatorialS)),
  double('effectiveWavelengthNm', 'nm', 'effective wavelength', (i) => i.effectiveWavelengthNm),
  text('clockLabel', 'the clock its times are read on', (i) => i.clockLabel),
  text('note', 'note', (i) => i.note),
];

/**
 * The programme stars in the star-list layout of core/formats/star-list.ts (FORMATS.md), so the
 * file reads back through the star-list import; `archiveId` is added last (the import ignores it
 * with a warning). Unknowns are written as empty cells, as the star list means them: a proper
 * motion, parallax or parallax error of NaN (the star import's "unknown", never zero), and a
 * parallax error or radial velocity of 0 (records.ts's "unknown").
 */
const nanIsUnknown = (value: number): number | null => (Number.isNaN(value) ? null : value);

export const STAR_COLUMNS: readonly ExportColumn<StarRecord>[] = [
  text('id', "the user's id for the star", (s) => s.catalogueId),
  text('label', 'star name', (s) => s.label),
  double('raDeg', 'deg', 'ICRS right ascension at epochJyear', (s) => s.raDeg, 'pos.eq.ra;meta.main'),
  double('decDeg', 'deg', 'ICRS declination at epochJyear', (s) => s.decDeg, 'pos.eq.dec;meta.main'),
  double('epochJyear', 'yr', 'epoch of the position, Julian year (TDB)', (s) => s.catalogueEpochJulianYear, 'time.epoch'),
  double('pmRaCosDecMasYr', 'mas/yr', 'proper motion in right ascension times cos(dec)', (s) => nanIsUnknown(s.pmRaMasYr), 'pos.pm;pos.eq.ra'),
  double('pmDecMasYr', 'mas/yr', 'proper motion in declination', (s) => nanIsUnknown(s.pmDecMasYr), 'pos.pm;pos.eq.dec'),
  double('parallaxMas', 'mas', 'annual parallax', (s) => nanIsUnknown(s.parallaxMas), 'pos.parallax'),
  double('parallaxSigmaMas', 'mas', 'standard uncertainty of the parallax; empty if unknown', (s) => (s.parallaxErrorMas === 0 ? null : nanIsUnknown(s.parallaxErrorMas)), 'stat.error;pos.parallax'),
  double('positionSigmaMas', 'mas', 'stated uncertainty of the position at epochJyear, per coordinate on the sky; empty if unknown', (s) => s.positionErrorMas ?? null, 'stat.error;pos.eq'),
  double('pmSigmaMasYr', 'mas/yr', 'stated uncertainty of each proper-motion component; empty if unknown', (s) => s.pmErrorMasYr ?? null, 'stat.error;pos.pm'),
  double('radialVelocityKmS', 'km/s', 'radial velocity, receding positive; empty if unknown', (s) => (s.radialVelocityKmS === 0 ? null : s.radialVelocityKmS), 'spect.dopplerVeloc'),
  double('magnitude', 'mag', 'magnitude; empty if unknown', (s) => s.magnitude, 'phot.mag'),
  text('source', 'where the place came from', (s) => s.source),
  text('programme', 'observing programmes, ;-separated', (s) => s.programmes.join(';')),
  text('archiveId', 'archive id of the star', (s) => s.id),
];

const weather = <Row extends { readonly weather: NightRecord['weather'] }>(): ExportColumn<Row>[] => [
  double('temperatureC', 'Cel', 'air temperature; empty if not measured', (r) => r.weather?.temperatureC ?? null),
  double('pressureHpa', 'hPa', 'air pressure; empty if not measured', (r) => r.weather?.pressureHpa ?? null),
  double('relativeHumidityPercent', '%', 'relative humidity; empty if not measured', (r) => r.weather?.relativeHumidityPercent ?? null),
];

/** Nights: the readings lists are flattened into ;-separated cells, pairs as `utcMjd:value`. */
export const NIGHT_COLUMNS: readonly ExportColumn<NightRecord>[] = [
  text('id', 'archive id of the night', (n) => n.id),
  text('siteId', 'archive id of the site', (n) => n.siteId),
  text('instrumentId', 'archive id of the instrument', (n) => n.instrumentId),
  text('localDate', 'local civil date the night began, YYYY-MM-DD', (n) => n.localDate),
  text('observer', 'observer', (n) => n.observer),
  ...weather<NightRecord>(),
  text('clockMinusUtcS', 'clock comparisons as utcMjd:clock-minus-UTC seconds, ;-separated', (n) => n.clockComparisons.map((c) => `${list([c.utcMjd])}:${list([c.clockMinusUtcS])}`).join(';')),
  text('levelArcsec', 'level readings as utcMjd:arcsec (west end high positive), ;-separated', (n) => n.levelReadings.map((c) => `${list([c.utcMjd])}:${list([c.levelArcsec])}`).join(';')),
  text('collimationArcsec', 'collimation readings as utcMjd:arcsec (east positive), ;-separated', (n) => n.collimationReadings.map((c) => `${list([c.utcMjd])}:${list([c.collimationArcsec])}`).join(';')),
  text('quality', 'good, fair or poor', (n) => n.quality),
  text('note', 'note', (n) => n.note),
];

export const TRANSIT_COLUMNS: readonly ExportColumn<TransitRecord>[] = [
  text('id', 'archive id of the transit', (t) => t.id),
  text('nightId', 'archive id of the night', (t) => t.nightId),
  text('starId', 'archive id of the star', (t) => t.starId),
  text('instrumentId', 'archive id of the instrument', (t) => t.instrumentId),
  text('culmination', 'upper or lower', (t) => t.culmination),
  text('clamp', 'clamp position of a reversed instrument (east, west); empty if not reversed', (t) => t.clamp ?? ''),
  double('clockMjd', 'd', 'mean-wire crossing read on the instrument clock, MJD', (t) => t.clockMjd),
  text('wireClockMjd', 'clock time at each wire, MJD, ;-separated', (t) => list(t.wireClockMjd)),
  double('utcMjd', 'd', 'approximate UTC of the crossing, MJD (for ordering)', (t) => t.utcMjd, 'time.epoch'),
  text('zenithReadings', "zenith-distance readings in the instrument's reading unit, ;-separated", (t) => list(t.zenithReadings)),
  ...weather<TransitRecord>(),
  double('weight', '', 'relative weight, 1 = normal', (t) => t.weight),
  { name: 'userRejected', datatype: 'boolean', description: 'rejected by the user', value: (t) => t.userRejected },
  { name: 'flaggedOutlier', datatype: 'boolean', description: "flagged by a reduction's robust fit", value: (t) => t.flaggedOutlier },
  text('note', 'note', (t) => t.note),
];
