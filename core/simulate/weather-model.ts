import type { WeatherReading } from '../archive/records.ts';
import type { SeededRandom } from './seeded-random.ts';

/**
 * The simulated climate of the invented site (continental, 612 m): temperature with an annual
 * cycle (mean 8.5 °C, ±9.5 °C, warmest near 19 July) and a diurnal one (±4 °C, warmest at 15 h
 * local, coldest at 3 h), a day-to-day anomaly (first-order autoregressive, σ 3 °C, correlation
 * 0.7 from one day to the next); station pressure 942 hPa (1013.25 hPa · exp(−612 m / 8434 m),
 * the isothermal barometric formula) with an autoregressive anomaly of σ 7 hPa; relative humidity
 * 60–95 %, higher in winter and at night. Numbers of our own, typical of such a site.
 */
export interface DayWeather {
  readonly temperatureAnomalyC: number;
  readonly pressureAnomalyHpa: number;
  readonly humidityAnomalyPercent: number;
}

const ANNUAL_MEAN_C = 8.5;
const ANNUAL_AMPLITUDE_C = 9.5;
const WARMEST_DAY_OF_YEAR = 200;
const DIURNAL_AMPLITUDE_C = 4;
const STATION_PRESSURE_HPA = 1013.25 * Math.exp(-612 / 8434);
const DAY_TO_DAY_CORRELATION = 0.7;

/** The next day's anomalies from the previous day's (AR(1) with the stationary σ stated above). */
export function nextDayWeather(previous: DayWeather | null, random: SeededRandom): DayWeather {
  const innovation = Math.sqrt(1 - DAY_TO_DAY_CORRELATION ** 2);
  const step = (last: number | undefined, sigma: number): number =>
    last === undefined ? random.normal(0, sigma) : DAY_TO_DAY_CORRELATION * last + random.normal(0, sigma * innovation);
  return {
    temperatureAnomalyC: step(previous?.temperatureAnomalyC, 3),
    pressureAnomalyHpa: step(previous?.pressureAnomalyHpa, 7),
    humidityAnomalyPercent: step(previous?.humidityAnomalyPercent, 6),
  };
}

/**
 * Weather at one instant: `dayOfYear` (1–366, fractional) and `localHour` (0–24, civil time) fix
 * the cycles, `day` the anomalies. Values rounded as a station records them (0.1 °C, 0.1 hPa, 1 %).
 */
export function weatherAt(dayOfYear: number, localHour: number, day: DayWeather): WeatherReading {
  const annual = Math.cos((2 * Math.PI * (dayOfYear - WARMEST_DAY_OF_YEAR)) / 365.25);
  const diurnal = Math.cos((2 * Math.PI * (localHour - 15)) / 24);
  const temperatureC = ANNUAL_MEAN_C + ANNUAL_AMPLITUDE_C * annual + DIURNAL_AMPLITUDE_C * diurnal + day.temperatureAnomalyC;
  const humidity = 78 - 8 * annual - 8 * diurnal + day.humidityAnomalyPercent;
  // `|| 0` turns a rounded −0 into 0, as a station would write it.
  return {
    temperatureC: Math.round(temperatureC * 10) / 10 || 0,
    pressureHpa: Math.round((STATION_PRESSURE_HPA + day.pressureAnomalyHpa) * 10) / 10,
    relativeHumidityPercent: Math.round(Math.min(98, Math.max(25, humidity))),
  };
}
