import { approximateUtcMjd, dateMjd, quantizedClockMjd } from '../archive-folder/folder-text.ts';
import type { InstrumentEventRecord, NightRecord, TransitRecord } from '../archive/records.ts';
import { TaskCancelledError, type TaskControl } from '../task/task-control.ts';
import { advanceDrift, applyEvent, initialDrift, type DriftState, type PlantedEvent } from './instrument-drift.ts';
import type { PlannedNight } from './night-calendar.ts';
import { meanWireClockMjd } from './observe-transit.ts';
import { plantBlunder, type MutableTransit } from './plant-blunders.ts';
import type { SeededRandom } from './seeded-random.ts';
import type { PlantedBlunder, TrueNightState } from './simulation-truth.ts';
import { simulateNight, type NightSetting } from './simulate-night.ts';
import type { ProgrammeStar } from './star-programme.ts';

/** One instrument's part of a simulated archive and its truth. */
export interface InstrumentArchive {
  readonly events: InstrumentEventRecord[];
  readonly nights: NightRecord[];
  readonly transits: TransitRecord[];
  readonly trueNights: TrueNightState[];
  readonly blunders: PlantedBlunder[];
}

/** What one instrument's run needs beyond the night setting: its streams, ids and the shared calendar. */
export interface InstrumentRun {
  readonly setting: NightSetting;
  readonly siteId: string;
  readonly programme: readonly ProgrammeStar[];
  readonly planned: readonly PlannedNight[];
  readonly eventPlan: readonly { readonly utcMjd: number; readonly kind: InstrumentEventRecord['kind'] }[];
  readonly startMjd: number;
  /** The night's id from its local date (unique across the instruments of one archive). */
  readonly nightIdOf: (localDate: string) => string;
  readonly observers: readonly string[];
  readonly random: { readonly drift: SeededRandom; readonly nights: SeededRandom; readonly blunders: SeededRandom };
  readonly latitudeVariationPeriodDays: number;
  readonly createdUtc: string;
  /** Progress is reported as nights done of `progressTotal`, starting at `progressOffset`. */
  readonly progressOffset: number;
  readonly progressTotal: number;
}

/**
 * Simulates every planned night of one instrument: its drift (random walks, events, clock resets),
 * each night's observations (simulate-night.ts), planted blunders, and the records as an import
 * would store them (times quantised as the archive folder writes them). Nights with fewer than
 * three transits are dropped, as an observer would not log them. Cancellable between nights.
 */
export async function simulateInstrumentNights(run: InstrumentRun, control: TaskControl): Promise<InstrumentArchive> {
  const { setting, programme, createdUtc } = run;
  const instrument = setting.instrument;
  const options = setting.options;
  const drift = initialDrift(run.random.drift, run.startMjd);
  const out: InstrumentArchive = { events: [], nights: [], transits: [], trueNights: [], blunders: [] };
  const addEvent = (event: PlantedEvent): void => {
    // Events are written by date (at 12h UTC), as an instrument log keeps them.
    out.events.push({ id: `${instrument.id}-event-${out.events.length + 1}`, instrumentId: instrument.id, utcMjd: Math.floor(event.utcMjd) + 0.5, kind: event.kind, note: event.note, visibility: 'visible', createdUtc, updatedUtc: createdUtc });
  };
  const advance = (mjd: number): void => advanceDrift(drift, mjd, run.random.drift).forEach(addEvent);
  let nextEvent = 0;
  for (let index = 0; index < run.planned.length; index++) {
    if (index % 10 === 0) {
      if (control.cancellation.isCancelled) throw new TaskCancelledError('simulation', run.progressOffset + index);
      control.reportProgress(run.progressOffset + index, run.progressTotal);
      await control.yieldToHost();
    }
    const night = run.planned[index];
    const startUtc = night.sessions[0].startMjd;
    while (nextEvent < run.eventPlan.length && run.eventPlan[nextEvent].utcMjd < startUtc) {
      const event = run.eventPlan[nextEvent++];
      advance(event.utcMjd);
      addEvent({ utcMjd: event.utcMjd, kind: event.kind, note: applyEvent(drift, event.kind, run.random.drift) });
    }
    advance(startUtc);
    const nightId = run.nightIdOf(night.localDate);
    const state = trueState(nightId, instrument.id, drift, options.latitudeVariationArcsec, run.startMjd, run.latitudeVariationPeriodDays);
    const simulated = simulateNight(setting, night, state, run.random.nights);
    if (simulated.transits.length < 3) continue;
    out.trueNights.push(state);
    out.nights.push({
      id: nightId, siteId: run.siteId, instrumentId: instrument.id, localDate: night.localDate,
      observer: run.observers[index % run.observers.length], weather: simulated.weather,
      clockComparisons: simulated.clockComparisons, levelReadings: simulated.levelReadings, collimationReadings: [],
      quality: night.quality, note: `${night.darkHours.toFixed(1)} h of darkness`,
      visibility: 'visible', createdUtc, updatedUtc: createdUtc,
    });
    const dayMjd = dateMjd(night.localDate);
    const observedTonight = new Set(simulated.transits.map((t) => t.starIndex));
    for (const t of simulated.transits) {
      const record: MutableTransit = { id: '', starId: programme[t.starIndex].catalogue.id, clockMjd: t.clockMjd, wireClockMjd: [...t.wireClockMjd], zenithReadings: [...t.zenithReadings] };
      const blundered = run.random.blunders.chance(options.blunderRate);
      // A swapped star is one not observed tonight (else the log would hold a duplicate row).
      let swapTo = -1;
      for (let k = 1; k < programme.length && swapTo < 0; k++) if (!observedTonight.has((t.starIndex + k) % programme.length)) swapTo = (t.starIndex + k) % programme.length;
      const blunder = blundered ? plantBlunder(record, instrument, swapTo < 0 ? null : programme[swapTo].catalogue.id, run.random.blunders) : null;
      if (blunder?.kind === 'star-swapped') observedTonight.add(swapTo);
      record.id = transitId(nightId, record.starId, t.culmination);
      if (blunder !== null) out.blunders.push({ ...blunder, transitId: record.id });
      // Times as the archive folder writes them (10 µs), the mean wire reduced from those times;
      // a single reference line (camera) writes its one time.
      record.wireClockMjd = record.wireClockMjd.map((m) => (Number.isFinite(m) ? quantizedClockMjd(m, dayMjd) : Number.NaN));
      record.clockMjd = quantizedClockMjd(instrument.wireIntervalsEquatorialS.length === 0 ? record.clockMjd : meanWireClockMjd(record.wireClockMjd, instrument.wireIntervalsEquatorialS, t.wireDeclinationRad, t.culmination), dayMjd);
      out.transits.push({
        id: record.id, nightId, starId: record.starId, instrumentId: instrument.id, culmination: t.culmination,
        clockMjd: record.clockMjd, wireClockMjd: record.wireClockMjd, utcMjd: approximateUtcMjd(record.clockMjd, simulated.clockComparisons),
        zenithReadings: record.zenithReadings, weather: t.weather, weight: 1, userRejected: false, flaggedOutlier: false, note: '',
        visibility: 'visible', createdUtc, updatedUtc: createdUtc,
      });
    }
  }
  return out;
}

/** The id of a transit: its night, star and culmination (one of each per night, so unique). */
export function transitId(nightId: string, starId: string, culmination: string): string {
  return `${nightId}/${starId}/${culmination}`;
}

function trueState(nightId: string, instrumentId: string, drift: DriftState, latitudeAmplitudeArcsec: number, startMjd: number, periodDays: number): TrueNightState {
  return {
    nightId, instrumentId, clockReferenceUtcMjd: drift.atMjd, clockOffsetS: drift.clockOffsetS, clockRateSPerDay: drift.clockRateSPerDay,
    azimuthArcsec: drift.azimuthArcsec, levelArcsec: drift.levelArcsec, collimationArcsec: drift.collimationArcsec,
    zeroPointArcsec: drift.zeroPointArcsec,
    latitudeVariationArcsec: latitudeAmplitudeArcsec * Math.cos((2 * Math.PI * (drift.atMjd - startMjd)) / periodDays),
  };
}
