import type { Site } from '../astrometry/site.ts';
import type { Weather } from '../astrometry/weather.ts';
import type { InstrumentRecord } from '../formats/site-description.ts';
import type { Rejection } from '../formats/parse-result.ts';
import type { StarListRow } from '../formats/star-list.ts';
import type { TransitLogRow } from '../formats/transit-log.ts';
import { utcCountS } from '../formats/utc-instant.ts';
import { mayerFactors } from '../instrument/mayer.ts';
import type { MayerFactors } from '../instrument/mayer.ts';
import { reduceToMeanWire } from '../instrument/wire-reduction.ts';
import type { MeanWireReduction } from '../instrument/wire-reduction.ts';
import { ARCSEC, DEG, SECONDS_PER_DAY } from '../units.ts';
import { cameraGeometryOf, reduceCameraTransit } from './camera-crossing.ts';
import type { CameraTransitReading } from './camera-crossing.ts';
import { clockCorrectionAtS, nominalClockSeconds } from './night-clock.ts';
import type { NightClockModel } from './night-clock.ts';
import type { NightWeather } from './night-inputs.ts';
import type { NightPredictions, StarPrediction } from './star-predictions.ts';

/** Slack (s) on the night's window for clock times whose correction is not yet known. */
const CLOCK_WINDOW_SLACK_S = 3600;

/** One transit with everything computed before the fit. Times in seconds from 0 h (UTC or clock) of the night's date. */
export interface PreparedTransit {
  readonly row: TransitLogRow;
  readonly star: StarListRow;
  /** Mean-wire reading: clock seconds (clock log) or UTC seconds (UTC log). */
  readonly meanWire: MeanWireReduction;
  /** The mean wire in nominal clock seconds (night-clock.ts); equal to meanWire for a UTC log. */
  readonly nominalS: number;
  readonly prediction: StarPrediction;
  readonly factors: MayerFactors;
  /** sense·scale·reading (rad): the observed zenith distance less the zero point; null without a reading. */
  readonly zenithFromReadingRad: number | null;
  readonly weather: Weather | null;
  readonly weatherSource: 'transit' | 'night' | 'partly night' | 'none';
  readonly weight: number;
  readonly userRejected: boolean;
}

export interface PreparedNight {
  readonly transits: readonly PreparedTransit[];
  readonly rejected: readonly Rejection[];
  readonly notes: readonly string[];
}

/** Common context of preparation. */
export interface PrepareContext {
  readonly site: Site;
  readonly longitudeDeg: number;
  readonly instrument: InstrumentRecord;
  readonly stars: ReadonlyMap<string, StarListRow>;
  readonly nightDateMjd: number;
  readonly weather: NightWeather | null;
  readonly aprioriClock: NightClockModel;
  readonly predictions: NightPredictions;
}

function wireColumn(row: TransitLogRow, wireIndex: number): string {
  return `wire${wireIndex + 1}${row.times.kind === 'utc' ? 'Utc' : 'ClockS'}`;
}

function transitWeather(row: TransitLogRow, night: NightWeather | null, wavelengthUm: number): Pick<PreparedTransit, 'weather' | 'weatherSource'> {
  const temperatureC = row.temperatureC ?? night?.temperatureC ?? null;
  const pressureHpa = row.pressureHpa ?? night?.pressureHpa ?? null;
  const humidityPercent = row.humidityPercent ?? night?.humidityPercent ?? null;
  if (temperatureC === null || pressureHpa === null || humidityPercent === null) return { weather: null, weatherSource: 'none' };
  const own = [row.temperatureC, row.pressureHpa, row.humidityPercent].filter((v) => v !== null).length;
  const weatherSource = own === 3 ? 'transit' : own === 0 ? 'night' : 'partly night';
  return { weather: { temperatureC, pressureHpa, relativeHumidity: humidityPercent / 100, wavelengthUm }, weatherSource };
}

function zenithFromReading(row: TransitLogRow, instrument: InstrumentRecord, problems: { column: string; reason: string }[]): number | null {
  const reading = row.zenithReading;
  if (reading === null) return null;
  if (reading.unit === 'deg') return reading.value * DEG;
  const scale = instrument.zenithScale;
  const column = reading.unit === 'turns' ? 'micrometerTurns' : 'offsetPx';
  const wanted = reading.unit === 'turns' ? 'turn' : 'pixel';
  if (scale === null || scale.unit !== wanted) {
    problems.push({ column, reason: `instrument '${instrument.id}' has no zenithScale in ${wanted}s; add one to the site description or give zenithDistanceDeg` });
    return null;
  }
  return scale.sense * scale.arcsecPerUnit * ARCSEC * reading.value;
}

/** Wire times of a row in seconds from 0 h (UTC or clock) of the night's date. */
export function wireSeconds(row: TransitLogRow, nightDateMjd: number): { wireIndex: number; clockTimeS: number }[] {
  return row.times.kind === 'utc'
    ? row.times.wires.map((w) => ({ wireIndex: w.wireIndex, clockTimeS: utcCountS(w.utc) - nightDateMjd * SECONDS_PER_DAY }))
    : row.times.wires.map((w) => ({ wireIndex: w.wireIndex, clockTimeS: w.clockS }));
}

/** A fixed camera's transit through its geometry (camera-crossing.ts); throws with the reason. */
function cameraTransit(row: TransitLogRow, wires: { wireIndex: number; clockTimeS: number }[], instrument: InstrumentRecord, prediction: StarPrediction, clockScale: 'sidereal' | 'mean-solar'): CameraTransitReading {
  if (row.zenithReading !== null && row.zenithReading.unit !== 'px') throw new RangeError(`a fixed camera reads row offsets in pixels (offsetPx), not ${row.zenithReading.unit === 'turns' ? 'micrometerTurns' : 'zenithDistanceDeg'}`);
  const geometry = cameraGeometryOf(instrument);
  // ∂z/∂δ on the meridian (zenith-distance.ts): upper culmination −1 south of the zenith, +1 north; lower the reverse.
  const north = prediction.side === 'north';
  const zenithPerDeclination = (row.culmination === 'upper') === north ? 1 : -1;
  // cameraGeometryOf has checked that the pixel scale exists.
  const sense = instrument.zenithScale?.sense ?? 1;
  return reduceCameraTransit(wires, row.zenithReading?.value ?? null, geometry, sense, prediction.topocentricDecRad, row.culmination, zenithPerDeclination, clockScale);
}

function prepareOne(row: TransitLogRow, ctx: PrepareContext, problems: { column: string; reason: string }[]): PreparedTransit | null {
  const star = ctx.stars.get(row.starId);
  if (star === undefined) {
    problems.push({ column: 'starId', reason: `unknown star id '${row.starId}'; add it to the star list or correct the id` });
    return null;
  }
  const { instrument } = ctx;
  if (row.instrumentId !== null && row.instrumentId !== instrument.id) {
    problems.push({ column: 'instrumentId', reason: `row is for instrument '${row.instrumentId}', this reduction for '${instrument.id}'` });
  }
  const wires = wireSeconds(row, ctx.nightDateMjd);
  const clockScale = row.times.kind === 'utc' ? 'mean-solar' : instrument.clockTimeScale;
  for (const w of wires) {
    if (w.wireIndex >= Math.max(1, instrument.wireIntervalsS.length)) {
      problems.push({ column: wireColumn(row, w.wireIndex), reason: `wire ${w.wireIndex + 1} does not exist: instrument '${instrument.id}' has ${instrument.wireIntervalsS.length} wire intervals` });
    }
  }
  const camera = instrument.kind === 'fixed-camera' && instrument.camera !== null;
  const readingRad = camera ? null : zenithFromReading(row, instrument, problems);
  if (problems.length > 0) return null;
  const firstNominal = nominalClockSeconds(wires[0].clockTimeS, clockScale);
  const roughUtcS = row.times.kind === 'utc' ? firstNominal : firstNominal + clockCorrectionAtS(ctx.aprioriClock, firstNominal);
  // The night runs from local mean noon of its date to the next noon (longitude east positive).
  const noonS = 43_200 - (ctx.longitudeDeg / 15) * 3600;
  const slack = row.times.kind === 'utc' ? 0 : CLOCK_WINDOW_SLACK_S;
  if (clockScale === 'mean-solar' && (roughUtcS < noonS - slack || roughUtcS > noonS + SECONDS_PER_DAY + slack)) {
    problems.push({ column: wireColumn(row, wires[0].wireIndex), reason: `time is outside the night of its date (local noon to noon${slack > 0 ? ' ± 1 h' : ''}); check nightDate and the time` });
    return null;
  }
  const prediction = ctx.predictions.nearest(star, row.culmination, roughUtcS);
  const intervals = instrument.wireIntervalsS.length === 0 ? [0] : instrument.wireIntervalsS;
  let meanWire: MeanWireReduction;
  let zenithFromReadingRad = readingRad;
  try {
    if (camera) {
      const reduced = cameraTransit(row, wires, instrument, prediction, clockScale);
      meanWire = reduced.meanWire;
      zenithFromReadingRad = reduced.zenithFromReadingRad;
    } else {
      meanWire = reduceToMeanWire(wires, intervals, prediction.topocentricDecRad, row.culmination, row.clamp, clockScale);
    }
  } catch (error) {
    problems.push({ column: camera && row.zenithReading?.unit !== 'px' ? 'offsetPx' : wireColumn(row, wires[0].wireIndex), reason: (error as Error).message });
    return null;
  }
  return {
    row, star, meanWire, nominalS: nominalClockSeconds(meanWire.meanWireTimeS, clockScale), prediction,
    factors: mayerFactors(ctx.site.latitudeRad, prediction.topocentricDecRad, row.culmination), zenithFromReadingRad,
    ...transitWeather(row, ctx.weather, instrument.effectiveWavelengthUm),
    weight: row.weight, userRejected: row.flags.includes('user-rejected'),
  };
}

/**
 * Checks and prepares every transit of the night: star known, instrument matching, wire numbers
 * within the instrument's list, a zenith scale for micrometer or pixel readings, the time within
 * the night (mean-solar clocks and UTC; a sidereal clock's window is not checked), then the
 * prediction, the mean wire (reduceToMeanWire at the predicted declination) and Mayer's factors.
 * Any problem rejects the row with its column; the caller reduces nothing while rows are rejected.
 */
export function prepareTransits(rows: readonly TransitLogRow[], ctx: PrepareContext): PreparedNight {
  const rejected: Rejection[] = [];
  const transits: PreparedTransit[] = [];
  const notes = new Set<string>();
  for (const row of rows) {
    const problems: { column: string; reason: string }[] = [];
    const prepared = prepareOne(row, ctx, problems);
    for (const p of problems) rejected.push({ row: row.row, line: row.line, column: p.column, reason: p.reason });
    if (prepared === null) continue;
    transits.push(prepared);
    if (prepared.weatherSource === 'none' && prepared.zenithFromReadingRad !== null) notes.add('no weather for some transits (neither their own nor the night\'s): their zenith distances carry no refraction');
    for (const w of prepared.prediction.warnings) notes.add(w);
  }
  if (ctx.instrument.clockTimeScale === 'sidereal' && rows.some((r) => r.times.kind === 'clock')) notes.add('sidereal clock: times are not checked against the night\'s window');
  return { transits, rejected, notes: [...notes] };
}
