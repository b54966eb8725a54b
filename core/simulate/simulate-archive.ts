import type { ArchiveContent } from '../archive-folder/archive-folder.ts';
import { approximateUtcMjd, dateMjd, quantizedClockMjd } from '../archive-folder/folder-text.ts';
import type { InstrumentEventRecord, NightRecord, TransitRecord } from '../archive/records.ts';
import { starMotion } from '../astrometry/space-motion.ts';
import { TaskCancelledError, type TaskControl, UNCONTROLLED } from '../task/task-control.ts';
import { BUNDLED_LEAP_SECONDS } from '../time/bundled-leap-seconds.ts';
import { TimeScale } from '../time/timescale.ts';
import { ARCSEC, DEG } from '../units.ts';
import { advanceDrift, applyEvent, initialDrift, planEvents, type DriftState } from './instrument-drift.ts';
import { INVENTED_SITE, inventedSite, inventedTransitInstrument } from './invented-site.ts';
import { planNights } from './night-calendar.ts';
import { meanWireClockMjd } from './observe-transit.ts';
import { plantBlunder, type MutableTransit } from './plant-blunders.ts';
import { SeededRandom } from './seeded-random.ts';
import { SimulatedSky } from './simulated-sky.ts';
import { resolveSimulationOptions, startDateMjd, type SimulationRequest } from './simulation-options.ts';
import type { PlantedBlunder, SimulationTruth, TrueNightState } from './simulation-truth.ts';
import { simulateNight, type NightSetting } from './simulate-night.ts';
import { inventStars } from './star-programme.ts';

/** A whole simulated archive: the records as an import would store them, and the truth. */
export interface SimulatedArchive extends ArchiveContent {
  readonly truth: SimulationTruth;
}

export const SIMULATOR_NAME = 'meridian-ledger archive simulator 1';
const OBSERVERS = ['R. Halloway', 'M. Ostrander', 'T. Vell'];
const LATITUDE_VARIATION_PERIOD_DAYS = 433;

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
  const instrument = inventedTransitInstrument(createdUtc);
  const programme = inventStars(options.starCount, site.latitudeDeg, root.fork('stars'), createdUtc);
  const startMjd = startDateMjd(options.startDate);
  const days = Math.round(options.years * 365.25);
  const planned = planNights(INVENTED_SITE, startMjd, days, options.nightsPerYearTarget, root.fork('weather'));
  const eventPlan = planEvents(startMjd, days, options.eventsPerYear, root.fork('events'));
  const driftRandom = root.fork('drift'), nightRandom = root.fork('nights'), blunderRandom = root.fork('blunders');
  const siteRad = { latitudeRad: site.latitudeDeg * DEG, longitudeRad: site.longitudeDeg * DEG, heightM: site.heightM };
  const setting: NightSetting = {
    options, instrument, latitudeDeg: site.latitudeDeg, longitudeDeg: site.longitudeDeg, utcOffsetHours: INVENTED_SITE.utcOffsetHours,
    sky: new SimulatedSky(siteRad, new TimeScale(BUNDLED_LEAP_SECONDS), options.deltaKappaArcsec * ARCSEC),
    stars: programme.map((p) => p.truth),
    motions: programme.map(({ truth: t }) => starMotion({
      raRad: t.raDeg * DEG, decRad: t.decDeg * DEG, pmRaCosDecMasYr: t.pmRaMasYr, pmDecMasYr: t.pmDecMasYr,
      parallaxMas: t.parallaxMas, radialVelocityKmS: t.radialVelocityKmS, epochJulianYear: t.epochJulianYear,
    })),
  };
  const drift = initialDrift(driftRandom, startMjd);
  const events: InstrumentEventRecord[] = [];
  const addEvent = (utcMjd: number, kind: InstrumentEventRecord['kind'], note: string): void => {
    // Events are written by date (at 12h UTC), as an instrument log keeps them.
    events.push({ id: `${instrument.id}-event-${events.length + 1}`, instrumentId: instrument.id, utcMjd: Math.floor(utcMjd) + 0.5, kind, note, visibility: 'visible', createdUtc, updatedUtc: createdUtc });
  };
  const nights: NightRecord[] = [];
  const transits: TransitRecord[] = [];
  const trueNights: TrueNightState[] = [];
  const blunders: PlantedBlunder[] = [];
  let nextEvent = 0;
  for (let index = 0; index < planned.length; index++) {
    if (index % 10 === 0) {
      if (control.cancellation.isCancelled) throw new TaskCancelledError('simulation', index);
      control.reportProgress(index, planned.length);
      await control.yieldToHost();
    }
    const night = planned[index];
    const startUtc = night.sessions[0].startMjd;
    while (nextEvent < eventPlan.length && eventPlan[nextEvent].utcMjd < startUtc) {
      const event = eventPlan[nextEvent++];
      advanceDriftRecording(drift, event.utcMjd, driftRandom, addEvent);
      addEvent(event.utcMjd, event.kind, applyEvent(drift, event.kind, driftRandom));
    }
    advanceDriftRecording(drift, startUtc, driftRandom, addEvent);
    const nightId = `night-${night.localDate}`;
    const state = trueState(nightId, instrument.id, drift, options.latitudeVariationArcsec, startMjd);
    const simulated = simulateNight(setting, night, state, nightRandom);
    if (simulated.transits.length < 3) continue;
    trueNights.push(state);
    nights.push({
      id: nightId, siteId: site.id, instrumentId: instrument.id, localDate: night.localDate,
      observer: OBSERVERS[index % OBSERVERS.length], weather: simulated.weather,
      clockComparisons: simulated.clockComparisons, levelReadings: simulated.levelReadings, collimationReadings: [],
      quality: night.quality, note: `${night.darkHours.toFixed(1)} h of darkness`,
      visibility: 'visible', createdUtc, updatedUtc: createdUtc,
    });
    const dayMjd = dateMjd(night.localDate);
    const observedTonight = new Set(simulated.transits.map((t) => t.starIndex));
    for (const t of simulated.transits) {
      const record: MutableTransit = { id: '', starId: programme[t.starIndex].catalogue.id, clockMjd: t.clockMjd, wireClockMjd: [...t.wireClockMjd], zenithReadings: [...t.zenithReadings] };
      const blundered = blunderRandom.chance(options.blunderRate);
      // A swapped star is one not observed tonight (else the log would hold a duplicate row).
      let swapTo = -1;
      for (let k = 1; k < programme.length && swapTo < 0; k++) if (!observedTonight.has((t.starIndex + k) % programme.length)) swapTo = (t.starIndex + k) % programme.length;
      const blunder = blundered ? plantBlunder(record, instrument, swapTo < 0 ? null : programme[swapTo].catalogue.id, blunderRandom) : null;
      if (blunder?.kind === 'star-swapped') observedTonight.add(swapTo);
      record.id = transitId(nightId, record.starId, t.culmination);
      if (blunder !== null) blunders.push({ ...blunder, transitId: record.id });
      // Times as the archive folder writes them (10 µs), the mean wire reduced from those times.
      record.wireClockMjd = record.wireClockMjd.map((m) => (Number.isFinite(m) ? quantizedClockMjd(m, dayMjd) : Number.NaN));
      record.clockMjd = quantizedClockMjd(meanWireClockMjd(record.wireClockMjd, instrument.wireIntervalsEquatorialS, t.wireDeclinationRad, t.culmination), dayMjd);
      transits.push({
        id: record.id, nightId, starId: record.starId, instrumentId: instrument.id, culmination: t.culmination,
        clockMjd: record.clockMjd, wireClockMjd: record.wireClockMjd, utcMjd: approximateUtcMjd(record.clockMjd, simulated.clockComparisons),
        zenithReadings: record.zenithReadings, weather: t.weather, weight: 1, userRejected: false, flaggedOutlier: false, note: '',
        visibility: 'visible', createdUtc, updatedUtc: createdUtc,
      });
    }
  }
  control.reportProgress(planned.length, planned.length);
  const truth: SimulationTruth = {
    generator: SIMULATOR_NAME, options,
    global: {
      deltaKappaArcsec: options.deltaKappaArcsec,
      thermalRaArcsecPerC: options.thermal.raArcsecPerC, thermalDecArcsecPerC: options.thermal.decArcsecPerC,
      thermalReferenceTemperatureC: options.thermal.referenceTemperatureC,
      latitudeVariationAmplitudeArcsec: options.latitudeVariationArcsec, latitudeVariationPeriodDays: LATITUDE_VARIATION_PERIOD_DAYS,
      skyModel: 'core/astrometry observedPlace (IAU 2006/2000A, relativistic aberration with Earth velocity × (κ₀+Δκ)/κ₀, diurnal aberration in the topocentric place, solar deflection, A tan Z + B tan³ Z refraction with the weather written with the transit or else the night); bundled leap seconds, no EOP table (UT1 − UTC = 0, no polar motion); Mayer factors and wire intervals at the topocentric (unrefracted) declination, as core/reduction reduces them (refraction of the image along the wires, ~10 ms/cos z over 30 s, is not modelled on either side); clamp west throughout',
    },
    instruments: [{ id: instrument.id, flexureArcsec: options.flexureArcsec, readingScaleArcsecPerUnit: instrument.readingScaleArcsecPerUnit, readingSense: instrument.readingSense }],
    stars: programme.map((p) => p.truth), nights: trueNights,
    events: events.map(({ id, instrumentId, utcMjd, kind, note }) => ({ id, instrumentId, utcMjd, kind, note })), blunders,
  };
  return { site, instruments: [instrument], events, stars: programme.map((p) => p.catalogue), nights, transits, truth };
}

/** The id of a transit: its night, star and culmination (one of each per night, so unique). */
export function transitId(nightId: string, starId: string, culmination: string): string {
  return `${nightId}/${starId}/${culmination}`;
}

function advanceDriftRecording(drift: DriftState, mjd: number, random: SeededRandom, addEvent: (utcMjd: number, kind: InstrumentEventRecord['kind'], note: string) => void): void {
  for (const reset of advanceDrift(drift, mjd, random)) addEvent(reset.utcMjd, reset.kind, reset.note);
}

function trueState(nightId: string, instrumentId: string, drift: DriftState, latitudeAmplitudeArcsec: number, startMjd: number): TrueNightState {
  return {
    nightId, instrumentId, clockReferenceUtcMjd: drift.atMjd, clockOffsetS: drift.clockOffsetS, clockRateSPerDay: drift.clockRateSPerDay,
    azimuthArcsec: drift.azimuthArcsec, levelArcsec: drift.levelArcsec, collimationArcsec: drift.collimationArcsec,
    zeroPointArcsec: drift.zeroPointArcsec,
    latitudeVariationArcsec: latitudeAmplitudeArcsec * Math.cos((2 * Math.PI * (drift.atMjd - startMjd)) / LATITUDE_VARIATION_PERIOD_DAYS),
  };
}
