import { quantizedUtcMjd } from '../archive-folder/folder-text.ts';
import { canonicalClockComparison } from '../archive-folder/night-files.ts';
import type { ClockComparison, InstrumentRecord, LevelReading, WeatherReading } from '../archive/records.ts';
import type { Culmination } from '../instrument/culmination.ts';
import type { StarMotion } from '../astrometry/space-motion.ts';
import type { Weather } from '../astrometry/weather.ts';
import { ARCSEC, SECONDS_PER_DAY } from '../units.ts';
import { candidateTransits } from './candidate-transits.ts';
import type { PlannedNight } from './night-calendar.ts';
import { observeTransit, type ObservationNoise, type RecordedTransit } from './observe-transit.ts';
import type { SeededRandom } from './seeded-random.ts';
import type { SimulatedSky } from './simulated-sky.ts';
import type { SimulationOptions } from './simulation-options.ts';
import type { TrueNightState } from './simulation-truth.ts';
import { weatherAt } from './weather-model.ts';

/** Everything one night needs that does not change from night to night. */
export interface NightSetting {
  readonly options: SimulationOptions;
  readonly sky: SimulatedSky;
  readonly instrument: InstrumentRecord;
  readonly stars: readonly { readonly raDeg: number; readonly decDeg: number }[];
  readonly motions: readonly StarMotion[];
  readonly latitudeDeg: number;
  readonly longitudeDeg: number;
  readonly utcOffsetHours: number;
  /** Largest zenith distance observed, degrees (the programme limit, or a zenith camera's field radius). */
  readonly zenithLimitDeg: number;
  /** Noise of this instrument's readings (from the options for the transit instrument). */
  readonly noise: ObservationNoise;
}

export interface SimulatedTransit extends RecordedTransit {
  readonly starIndex: number;
  readonly culmination: Culmination;
  /** Weather written with the transit (null: the night's applies); the refraction used it. */
  readonly weather: WeatherReading | null;
  /** Topocentric declination the wires and Mayer's factors used, rad. */
  readonly wireDeclinationRad: number;
}

export interface SimulatedNight {
  readonly weather: WeatherReading;
  readonly clockComparisons: ClockComparison[];
  readonly levelReadings: LevelReading[];
  readonly transits: SimulatedTransit[];
}

/** The shortest gap between two transits one observer can take, days (90 s; common practice). */
const MINIMUM_GAP_DAYS = 90 / SECONDS_PER_DAY;

/**
 * One night at the instrument: weather at the start, 3–5 clock comparisons spread over the
 * sessions (noise `clockComparisonNoiseS`, clock − UTC to 0.1 ms, then times as the folder writes them), a level reading at the start and
 * end (noise `levelNoiseArcsec`, written to 0.01″), and the transits — each candidate taken with
 * probability 0.9, no two within 90 s. Six transits in ten carry their own weather; the others are
 * refracted with the night's weather, as a reduction would assume, so the truth stays exact.
 */
export function simulateNight(setting: NightSetting, planned: PlannedNight, state: TrueNightState, random: SeededRandom): SimulatedNight {
  const { options, sky, instrument } = setting;
  const localHour = (mjd: number): number => ((((mjd - Math.floor(mjd)) * 24 + setting.utcOffsetHours) % 24) + 24) % 24;
  const first = planned.sessions[0].startMjd;
  const last = planned.sessions[planned.sessions.length - 1].endMjd;
  const nightWeather = weatherAt(planned.dayOfYear, localHour(first), planned.day);
  const clockMinusUtcS = (utc: number): number => state.clockOffsetS + state.clockRateSPerDay * (utc - state.clockReferenceUtcMjd);
  const comparisonCount = 3 + random.integer(3);
  const clockComparisons: ClockComparison[] = [];
  for (let k = 0; k < comparisonCount; k++) {
    const utcMjd = quantizedUtcMjd(first + ((last - first) * k) / (comparisonCount - 1));
    const reading = clockMinusUtcS(utcMjd) + random.normal(0, options.clockComparisonNoiseS);
    clockComparisons.push(canonicalClockComparison({ utcMjd, clockMinusUtcS: Math.round(reading * 1e4) / 1e4, signal: 'GNSS PPS' }, planned.localDate));
  }
  const levelReadings = [first, last].map((utcMjd) => ({
    utcMjd: quantizedUtcMjd(utcMjd), levelArcsec: Math.round((state.levelArcsec + random.normal(0, options.levelNoiseArcsec)) * 100) / 100,
  }));
  const noise = setting.noise;
  const transits: SimulatedTransit[] = [];
  let lastTaken = -Infinity;
  for (const candidate of candidateTransits(setting.stars, planned.sessions, setting.latitudeDeg, setting.longitudeDeg, setting.zenithLimitDeg)) {
    const takeIt = random.chance(0.9);
    const ownWeather = random.chance(0.6);
    if (!takeIt || candidate.approximateUtcMjd - lastTaken < MINIMUM_GAP_DAYS) continue;
    lastTaken = candidate.approximateUtcMjd;
    const weather = ownWeather ? weatherAt(planned.dayOfYear, localHour(candidate.approximateUtcMjd), planned.day) : null;
    const used = weather ?? nightWeather;
    const truth = sky.culmination(setting.motions[candidate.starIndex], candidate.approximateUtcMjd, candidate.culmination, skyWeather(used, instrument));
    const thermalC = used.temperatureC - options.thermal.referenceTemperatureC;
    const shifts = {
      raOnSkyRad: options.thermal.raArcsecPerC * thermalC * ARCSEC,
      decRad: options.thermal.decArcsecPerC * thermalC * ARCSEC,
      latitudeRad: state.latitudeVariationArcsec * ARCSEC,
    };
    const recorded = observeTransit(truth, candidate.culmination, instrument, state, shifts, noise, setting.latitudeDeg * (Math.PI / 180), random);
    transits.push({ ...recorded, starIndex: candidate.starIndex, culmination: candidate.culmination, weather, wireDeclinationRad: truth.place.topocentricDeclinationRad });
  }
  return { weather: nightWeather, clockComparisons, levelReadings, transits };
}

/** The refraction model's weather from a station reading and the instrument's wavelength. */
export function skyWeather(reading: WeatherReading, instrument: InstrumentRecord): Weather {
  return {
    pressureHpa: reading.pressureHpa,
    temperatureC: reading.temperatureC,
    relativeHumidity: reading.relativeHumidityPercent / 100,
    wavelengthUm: instrument.effectiveWavelengthNm / 1000,
  };
}
