import { createInterface } from 'node:readline';
import { type Culmination, predictTransit } from '../../../core/astrometry/transit.ts';
import { iauEarthOrientation } from '../../../core/astrometry/iau-earth-orientation.ts';
import type { TwoPartJulianDate } from '../../../core/astrometry/instant.ts';
import { checkSite, type Site } from '../../../core/astrometry/site.ts';
import { starMotion } from '../../../core/astrometry/space-motion.ts';
import { type CatalogueStar, checkCatalogueStar } from '../../../core/astrometry/star.ts';
import { sunAtTransit } from '../../../core/astrometry/sun-at-transit.ts';
import type { Weather } from '../../../core/astrometry/weather.ts';
import { bundledEarthOrientationTable } from '../../../core/time/bundled-earth-orientation.ts';
import { BUNDLED_LEAP_SECONDS } from '../../../core/time/bundled-leap-seconds.ts';
import { formatIsoUtc, parseIsoUtc } from '../../../core/time/iso.ts';
import { julianDateToMjd } from '../../../core/time/julian-date.ts';
import { TimeScale } from '../../../core/time/timescale.ts';
import { ARCSEC, DEG, SECONDS_PER_DAY } from '../../../core/units.ts';
import { type CliIo, type Command, EXIT_FAILED, EXIT_OK, UsageError } from '../command.ts';

const USAGE = `Usage: meridian-ledger predict < requests.jsonl > predictions.jsonl

Predicts meridian transits. Reads one JSON object per line on stdin and writes one JSON line per
request, in order (blank lines are skipped):

  {"star": {"raDeg", "decDeg", "pmRaMasYr" (μα·cos δ), "pmDecMasYr", "parallaxMas", "rvKmS",
            "epochJyear"},
   "site": {"latDeg", "lonDeg" (east positive), "heightM"},
   "afterUtc": "2025-03-01T18:00:00Z", "culmination": "upper" | "lower" (default upper),
   "weather": {"pressureHpa", "temperatureC", "relativeHumidity" (0–1), "wavelengthUm"},
   "eop": {"dut1S", "xpArcsec", "ypArcsec"}}

star: ICRS at the catalogue epoch (Julian year TDB); motions, parallax and rvKmS default to 0,
epochJyear is required when a proper motion is given. site.heightM defaults to 0 (WGS84).
weather absent: no refraction; wavelengthUm defaults to 0.55. eop absent: the bundled IERS C04
table, else zero (a warning says so).

Output: {"transitUtc" (ISO 8601, µs), "transitMjdUtc", "zenithDistanceDeg" (observed, refracted
when weather is given), "geometricZenithDistanceDeg", "side" ("north" | "south"), "apparentRaDeg",
"apparentDecDeg" (geocentric, true equator and equinox of date), "sunAltitudeDeg",
"sunDistanceDeg", "caution" (daylight transit near the Sun), "warnings"}. A bad line gives
{"error": "...", "line": N} and the rest is still processed; the exit status is 1 if any failed.`;

type Json = Record<string, unknown>;

class RequestError extends Error {}

function object(value: unknown, name: string): Json {
  if (typeof value !== 'object' || value === null || Array.isArray(value)) {
    throw new RequestError(`${name} must be a JSON object`);
  }
  return value as Json;
}

function number(source: Json, field: string, where: string, fallback?: number): number {
  const value = source[field];
  if (value === undefined && fallback !== undefined) return fallback;
  if (typeof value !== 'number' || !Number.isFinite(value)) {
    throw new RequestError(`${where}.${field} must be a finite number${value === undefined ? ' and is missing' : ` (got ${JSON.stringify(value)})`}`);
  }
  return value;
}

function parseStar(value: unknown): CatalogueStar {
  const s = object(value, 'star');
  const pmRa = number(s, 'pmRaMasYr', 'star', 0);
  const pmDec = number(s, 'pmDecMasYr', 'star', 0);
  if ((pmRa !== 0 || pmDec !== 0) && s.epochJyear === undefined) {
    throw new RequestError('star.epochJyear is missing: the catalogue epoch is needed with a proper motion (e.g. 2016.0 for Gaia DR3)');
  }
  const decDeg = number(s, 'decDeg', 'star');
  if (Math.abs(decDeg) > 90) throw new RequestError(`star.decDeg must lie within ±90° (got ${decDeg})`);
  const raDeg = number(s, 'raDeg', 'star');
  if (raDeg < 0 || raDeg >= 360) throw new RequestError(`star.raDeg must lie in [0, 360) degrees (got ${raDeg}); hours? multiply by 15`);
  const star: CatalogueStar = {
    raRad: raDeg * DEG,
    decRad: decDeg * DEG,
    pmRaCosDecMasYr: pmRa,
    pmDecMasYr: pmDec,
    parallaxMas: number(s, 'parallaxMas', 'star', 0),
    radialVelocityKmS: number(s, 'rvKmS', 'star', 0),
    epochJulianYear: number(s, 'epochJyear', 'star', 2000),
  };
  checkCatalogueStar(star);
  return star;
}

function parseSite(value: unknown): Site {
  const s = object(value, 'site');
  const site = { latitudeRad: number(s, 'latDeg', 'site') * DEG, longitudeRad: number(s, 'lonDeg', 'site') * DEG, heightM: number(s, 'heightM', 'site', 0) };
  checkSite(site);
  return site;
}

function parseWeather(value: unknown): Weather | null {
  if (value === undefined || value === null) return null;
  const w = object(value, 'weather');
  return {
    pressureHpa: number(w, 'pressureHpa', 'weather'),
    temperatureC: number(w, 'temperatureC', 'weather'),
    relativeHumidity: number(w, 'relativeHumidity', 'weather'),
    wavelengthUm: number(w, 'wavelengthUm', 'weather', 0.55),
  };
}

interface Eop { dut1S: number; xpRad: number; ypRad: number }

function parseEop(value: unknown): Eop | null {
  if (value === undefined || value === null) return null;
  const e = object(value, 'eop');
  const dut1S = number(e, 'dut1S', 'eop');
  if (Math.abs(dut1S) > 1) throw new RequestError(`eop.dut1S must lie within ±1 s (got ${dut1S}); it is UT1 − UTC in seconds`);
  return { dut1S, xpRad: number(e, 'xpArcsec', 'eop') * ARCSEC, ypRad: number(e, 'ypArcsec', 'eop') * ARCSEC };
}

function parseCulmination(value: unknown): Culmination {
  if (value === undefined) return 'upper';
  if (value === 'upper' || value === 'lower') return value;
  throw new RequestError(`culmination must be "upper" or "lower" (got ${JSON.stringify(value)})`);
}

/** Cuts the "no table" / "outside table" warning when the request supplied its own EOP. */
function instantsFor(scale: TimeScale, eop: Eop | null) {
  return (utc: TwoPartJulianDate) => {
    const instant = scale.fromUtc(utc);
    if (eop === null) return instant;
    const taiMinusUtc = (instant.tai.jd1 - instant.utc.jd1 + (instant.tai.jd2 - instant.utc.jd2)) * SECONDS_PER_DAY;
    return {
      ...instant,
      ut1: { jd1: instant.tai.jd1, jd2: instant.tai.jd2 + (eop.dut1S - taiMinusUtc) / SECONDS_PER_DAY },
      dut1Seconds: eop.dut1S,
      xpRad: eop.xpRad,
      ypRad: eop.ypRad,
      warnings: instant.warnings.filter((w) => !/Earth orientation|EOP|UT1 − UTC/i.test(w)),
    };
  };
}

function predictLine(text: string, scale: TimeScale): Json {
  let request: Json;
  try {
    request = object(JSON.parse(text), 'the line');
  } catch (error) {
    if (error instanceof RequestError) throw error;
    throw new RequestError(`the line is not valid JSON (${(error as Error).message})`);
  }
  const star = parseStar(request.star);
  const site = parseSite(request.site);
  const weather = parseWeather(request.weather);
  const eop = parseEop(request.eop);
  const culmination = parseCulmination(request.culmination);
  if (typeof request.afterUtc !== 'string') throw new RequestError('afterUtc must be an ISO 8601 UTC text such as "2025-03-01T18:00:00Z"');
  let afterUtc: TwoPartJulianDate;
  try {
    afterUtc = parseIsoUtc(request.afterUtc, BUNDLED_LEAP_SECONDS).utcJd;
  } catch (error) {
    throw new RequestError(`afterUtc: ${(error as Error).message}`);
  }
  const prediction = predictTransit(starMotion(star), site, weather, afterUtc, culmination, instantsFor(scale, eop), iauEarthOrientation);
  const place = prediction.place;
  const sun = sunAtTransit(prediction.context, place.topocentricHourAngleRad, place.topocentricDeclinationRad);
  const result: Json = {
    transitUtc: formatIsoUtc(prediction.utc, BUNDLED_LEAP_SECONDS, 6),
    transitMjdUtc: julianDateToMjd(prediction.utc),
    zenithDistanceDeg: place.observedZenithRad / DEG,
    geometricZenithDistanceDeg: place.topocentricZenithRad / DEG,
    side: prediction.side,
    culmination,
    apparentRaDeg: place.apparentRaRad / DEG,
    apparentDecDeg: place.apparentDecRad / DEG,
    sunAltitudeDeg: sun.sunAltitudeRad / DEG,
    sunDistanceDeg: sun.starSunSeparationRad / DEG,
  };
  if (sun.caution !== undefined) result.caution = sun.caution;
  const warnings = [...new Set(prediction.warnings)];
  if (warnings.length > 0) result.warnings = warnings;
  return result;
}

async function run(args: readonly string[], io: CliIo): Promise<number> {
  if (args.length > 0) throw new UsageError(`predict takes no arguments (got "${args[0]}"); it reads JSON lines on stdin`);
  const scale = new TimeScale(BUNDLED_LEAP_SECONDS, bundledEarthOrientationTable());
  const lines = createInterface({ input: io.stdin, crlfDelay: Infinity });
  let lineNumber = 0;
  let failed = 0;
  for await (const text of lines) {
    lineNumber++;
    if (text.trim() === '') continue;
    let output: Json;
    try {
      output = predictLine(text, scale);
    } catch (error) {
      failed++;
      const message = error instanceof Error ? error.message : String(error);
      output = { error: message, line: lineNumber };
    }
    io.stdout.write(`${JSON.stringify(output)}\n`);
  }
  return failed > 0 ? EXIT_FAILED : EXIT_OK;
}

export const predictCommand: Command = {
  name: 'predict',
  summary: 'predict meridian transits: JSON lines in (star, site, after), JSON lines out',
  usage: USAGE,
  run,
};
