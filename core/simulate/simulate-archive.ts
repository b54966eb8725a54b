import type { ArchiveContent } from '../archive-folder/archive-folder.ts';
import { starMotion } from '../astrometry/space-motion.ts';
import { type TaskControl, UNCONTROLLED } from '../task/task-control.ts';
import { bundledEarthOrientationTable } from '../time/bundled-earth-orientation.ts';
import { BUNDLED_LEAP_SECONDS } from '../time/bundled-leap-seconds.ts';
import { TimeScale } from '../time/timescale.ts';
import { ARCSEC, DEG } from '../units.ts';
import { planEvents } from './instrument-drift.ts';
import {
  INVENTED_SITE, inventedSite, inventedTransitInstrument, inventedZenithCamera,
  ZENITH_CAMERA_FIELD_RADIUS_DEG, ZENITH_CAMERA_TIMING_NOISE_S, ZENITH_CAMERA_ZENITH_NOISE_ARCSEC,
} from './invented-site.ts';
import { planNights } from './night-calendar.ts';
import { SeededRandom } from './seeded-random.ts';
import { SimulatedSky } from './simulated-sky.ts';
import { resolveSimulationOptions, startDateMjd, type SimulationRequest } from './simulation-options.ts';
import type { SimulationTruth } from './simulation-truth.ts';
import type { NightSetting } from './simulate-night.ts';
import { simulateInstrumentNights, type InstrumentRun } from './simulate-instrument.ts';
import { inventStars, inventZenithStars, PROGRAMME_ZENITH_LIMIT_DEG } from './star-programme.ts';

/** A whole simulated archive: the records as an import would store them, and the truth. */
export interface SimulatedArchive extends ArchiveContent {
  readonly truth: SimulationTruth;
}

export const SIMULATOR_NAME = 'meridian-ledger archive simulator 1';
const OBSERVERS = ['R. Halloway', 'M. Ostrander', 'T. Vell'];
const LATITUDE_VARIATION_PERIOD_DAYS = 433;
const SKY_MODEL = 'core/astrometry observedPlace (IAU 2006/2000A, relativistic aberration with Earth velocity × (κ₀+Δκ)/κ₀, diurnal aberration in the topocentric place, solar deflection, A tan Z + B tan³ Z refraction with the weather written with the transit or else the night); bundled leap seconds and the bundled IERS C04 Earth orientation (UT1 − UTC and polar motion of the day, 0 after the table ends), as the app and the CLI reduce it; Mayer factors and wire intervals at the topocentric (unrefracted) declination, as core/reduction reduces them (refraction of the image along the wires, ~10 ms/cos z over 30 s, is not modelled on either side); clamp west throughout';
const CAMERA_SKY_MODEL = '; a fixed zenith camera times one reference column (Mayer correction with its own a, b, c) and reads row offsets in pixels, with its own drift, events and noise, no flexure';

/**
 * Simulates an archive with known truth (see core/simulate/README in FOLDER.md and each module's
 * header for the models). Deterministic: the same request gives the same records, to the bit.
 * `createdUtc` is only the audit stamp of the records (never written to the archive folder).
 * Reports progress in nights; cancellable between nights. Throws RangeError on a bad request.
 */
export async function simulateArchive(request: SimulationRequest, control: TaskControl = UNCONTROLLED, createdUtc = '2000-01-01T00:00:00.000Z'): Promise<SimulatedArchive> {
  const options = resolveSimulationOptions(request);
  const root = new SeededRandom(options.seed);
  const site = inventedSite(createdUtc);
  const transitInstrument = inventedTransitInstrument(createdUtc);
  const withCamera = options.zenithCameraStarCount > 0;
  // The zenith stars draw from their own stream, so the programme of an archive without a camera is unchanged.
  const programme = [
    ...inventStars(options.starCount, site.latitudeDeg, root.fork('stars'), createdUtc),
    ...(withCamera ? inventZenithStars(options.zenithCameraStarCount, options.starCount, site.latitudeDeg, ZENITH_CAMERA_FIELD_RADIUS_DEG, root.fork('zenith-stars'), createdUtc) : []),
  ];
  const startMjd = startDateMjd(options.startDate);
  const days = Math.round(options.years * 365.25);
  const planned = planNights(INVENTED_SITE, startMjd, days, options.nightsPerYearTarget, root.fork('weather'));
  const siteRad = { latitudeRad: site.latitudeDeg * DEG, longitudeRad: site.longitudeDeg * DEG, heightM: site.heightM };
  const common = {
    options, latitudeDeg: site.latitudeDeg, longitudeDeg: site.longitudeDeg, utcOffsetHours: INVENTED_SITE.utcOffsetHours,
    sky: new SimulatedSky(siteRad, new TimeScale(BUNDLED_LEAP_SECONDS, bundledEarthOrientationTable()), options.deltaKappaArcsec * ARCSEC),
    stars: programme.map((p) => p.truth),
    motions: programme.map(({ truth: t }) => starMotion({
      raRad: t.raDeg * DEG, decRad: t.decDeg * DEG, pmRaCosDecMasYr: t.pmRaMasYr, pmDecMasYr: t.pmDecMasYr,
      parallaxMas: t.parallaxMas, radialVelocityKmS: t.radialVelocityKmS, epochJulianYear: t.epochJulianYear,
    })),
  };
  const runOf = (setting: NightSetting, prefix: string, nightIdOf: (localDate: string) => string, offset: number): InstrumentRun => ({
    setting, siteId: site.id, programme, planned, startMjd, nightIdOf, observers: OBSERVERS, createdUtc,
    eventPlan: planEvents(startMjd, days, options.eventsPerYear, root.fork(`${prefix}events`)),
    random: { drift: root.fork(`${prefix}drift`), nights: root.fork(`${prefix}nights`), blunders: root.fork(`${prefix}blunders`) },
    latitudeVariationPeriodDays: LATITUDE_VARIATION_PERIOD_DAYS, progressOffset: offset, progressTotal: planned.length * (withCamera ? 2 : 1),
  });
  const transitNoise = { wireNoiseS: options.wireNoiseS, zenithNoiseArcsec: options.zenithNoiseArcsec, missedWireProbability: options.missedWireProbability, flexureArcsec: options.flexureArcsec };
  const parts = [{ instrument: transitInstrument, flexureArcsec: options.flexureArcsec, part: await simulateInstrumentNights(runOf(
    { ...common, instrument: transitInstrument, zenithLimitDeg: PROGRAMME_ZENITH_LIMIT_DEG, noise: transitNoise }, '', (date) => `night-${date}`, 0), control) }];
  if (withCamera) {
    const camera = inventedZenithCamera(createdUtc);
    // A camera looking at the zenith has no flexure term worth simulating (sin z < 0.01).
    const cameraNoise = { wireNoiseS: ZENITH_CAMERA_TIMING_NOISE_S, zenithNoiseArcsec: ZENITH_CAMERA_ZENITH_NOISE_ARCSEC, missedWireProbability: 0, flexureArcsec: 0 };
    parts.push({ instrument: camera, flexureArcsec: 0, part: await simulateInstrumentNights(runOf(
      { ...common, instrument: camera, zenithLimitDeg: ZENITH_CAMERA_FIELD_RADIUS_DEG, noise: cameraNoise }, 'camera-', (date) => `night-${date}-camera`, planned.length), control) });
  }
  control.reportProgress(planned.length * parts.length, planned.length * parts.length);
  const events = parts.flatMap((p) => p.part.events);
  const truth: SimulationTruth = {
    generator: SIMULATOR_NAME, options,
    global: {
      deltaKappaArcsec: options.deltaKappaArcsec,
      thermalRaArcsecPerC: options.thermal.raArcsecPerC, thermalDecArcsecPerC: options.thermal.decArcsecPerC,
      thermalReferenceTemperatureC: options.thermal.referenceTemperatureC,
      latitudeVariationAmplitudeArcsec: options.latitudeVariationArcsec, latitudeVariationPeriodDays: LATITUDE_VARIATION_PERIOD_DAYS,
      skyModel: withCamera ? SKY_MODEL + CAMERA_SKY_MODEL : SKY_MODEL,
    },
    instruments: parts.map(({ instrument, flexureArcsec }) => ({ id: instrument.id, flexureArcsec, readingScaleArcsecPerUnit: instrument.readingScaleArcsecPerUnit, readingSense: instrument.readingSense })),
    stars: programme.map((p) => p.truth), nights: parts.flatMap((p) => p.part.trueNights),
    events: events.map(({ id, instrumentId, utcMjd, kind, note }) => ({ id, instrumentId, utcMjd, kind, note })), blunders: parts.flatMap((p) => p.part.blunders),
  };
  return {
    site, instruments: parts.map((p) => p.instrument), events, stars: programme.map((p) => p.catalogue),
    nights: parts.flatMap((p) => p.part.nights), transits: parts.flatMap((p) => p.part.transits), truth,
  };
}

export { transitId } from './simulate-instrument.ts';
