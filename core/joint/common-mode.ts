import { falseAlarmProbability, lombScarglePeriodogram, type JointSolution } from '../solver/index.ts';
import type { JointLayout } from './build-joint-problem.ts';
import type { JointObservation } from './joint-observations.ts';
import type { NightInstrumentTerms } from './solve-outputs.ts';

const YEAR_DAYS = 365.25;
/** An annual peak is flagged when its false-alarm probability at the one frequency tested (1/yr, chosen beforehand) is below this (common practice: 0.1 %). */
export const ANNUAL_FALSE_ALARM_LIMIT = 1e-3;
/** Highest frequency of the periodogram (per day): a 20-day period, well above night-to-night scatter's interest for drift. */
const HIGHEST_FREQUENCY_PER_DAY = 1 / 20;
const OVERSAMPLING = 5;

/** One per-night series of one instrument with its periodogram and the test of an annual peak. */
export interface CommonModeSeries {
  /** clockOffset (s), zeroPoint (arcsec), and the nights' weighted mean post-fit residuals: raResidual (Δα cos δ, mas), decResidual (zenith residual × ∂z/∂δ, mas). */
  readonly name: 'clockOffset' | 'zeroPoint' | 'raResidual' | 'decResidual';
  readonly unit: string;
  /** One value per night, the nights as in `nightIds`. */
  readonly values: readonly number[];
  readonly periodogram: { readonly frequenciesPerDay: readonly number[]; readonly power: readonly number[] };
  /** Normalised Lomb–Scargle power at 1/365.25 per day and its false-alarm probability e^(−P) (one frequency, fixed in advance). */
  readonly annualPower: number;
  readonly annualFalseAlarm: number;
  readonly annualSignificant: boolean;
}

export interface InstrumentCommonMode {
  readonly instrumentId: string;
  readonly nightIds: readonly string[];
  /** Per night: mean TT (days since J2000.0) and mean temperature (°C): the x axes against time and temperature. */
  readonly ttDaysSinceJ2000: readonly number[];
  readonly temperatureC: readonly number[];
  readonly series: readonly CommonModeSeries[];
  /**
   * True when a residual series (raResidual or decResidual) has a significant annual peak: a
   * common-mode seasonal signal the model leaves in the data (an unmodelled thermal or seasonal
   * term). The clock and zero-point series are random walks by nature, whose low-frequency power
   * is no evidence of a model error, so they are shown but not used for the flag.
   */
  readonly annualSignalFlagged: boolean;
  /** Why the periodograms are missing or weak (span under 300 days, fewer than 10 nights), else empty. */
  readonly notes: readonly string[];
}

function periodogramSeries(name: CommonModeSeries['name'], unit: string, t: Float64Array, values: Float64Array, spanDays: number): CommonModeSeries {
  const lowest = 1 / spanDays, steps = Math.max(1, Math.ceil(((HIGHEST_FREQUENCY_PER_DAY - lowest) / lowest) * OVERSAMPLING));
  const frequencies = Float64Array.from({ length: steps + 1 }, (_, i) => lowest + ((HIGHEST_FREQUENCY_PER_DAY - lowest) * i) / steps);
  const power = lombScarglePeriodogram(t, values, frequencies);
  const annualPower = lombScarglePeriodogram(t, values, Float64Array.of(1 / YEAR_DAYS))[0];
  const annualFalseAlarm = falseAlarmProbability(annualPower, 1);
  return { name, unit, values: Array.from(values), periodogram: { frequenciesPerDay: Array.from(frequencies), power: Array.from(power) }, annualPower, annualFalseAlarm, annualSignificant: annualFalseAlarm < ANNUAL_FALSE_ALARM_LIMIT };
}

/** Weighted mean post-fit residual per night, right ascension and declination sense (zenith residual × ∂z/∂δ, so that north and south stars add). */
function nightlyResiduals(solution: JointSolution, layout: JointLayout, observations: readonly JointObservation[], nightCount: number): { ra: Float64Array; dec: Float64Array } {
  const sums = new Float64Array(4 * nightCount);
  observations.forEach((o, k) => {
    const r = layout.raRow[k], z = layout.zenithRow[k];
    if (r >= 0) { sums[4 * o.night] += solution.finalWeight[r] * solution.residual[r]; sums[4 * o.night + 1] += solution.finalWeight[r]; }
    if (z >= 0) { sums[4 * o.night + 2] += solution.finalWeight[z] * solution.residual[z] * o.zenithPerDec; sums[4 * o.night + 3] += solution.finalWeight[z]; }
  });
  const mean = (s: number, w: number): number => (w > 0 ? s / w : 0);
  return {
    ra: Float64Array.from({ length: nightCount }, (_, n) => mean(sums[4 * n], sums[4 * n + 1])),
    dec: Float64Array.from({ length: nightCount }, (_, n) => mean(sums[4 * n + 2], sums[4 * n + 3])),
  };
}

/**
 * The common-mode series of each instrument (DESIGN §4 diagnostics): per night the solved clock
 * offset and zero point and the mean post-fit residual in each coordinate, against time and
 * temperature, each with a Lomb–Scargle periodogram (core/solver) and the test of an annual peak.
 */
export function commonModeSeries(solution: JointSolution, layout: JointLayout, series: readonly NightInstrumentTerms[], observations: readonly JointObservation[]): InstrumentCommonMode[] {
  const residuals = nightlyResiduals(solution, layout, observations, series.length);
  const instruments = [...new Set(series.map((s) => s.instrumentId))];
  return instruments.map((instrumentId) => {
    const index = series.flatMap((s, n) => (s.instrumentId === instrumentId ? [n] : []));
    const t = Float64Array.from(index, (n) => series[n].ttDaysSinceJ2000);
    const spanDays = t.length > 0 ? t[t.length - 1] - t[0] : 0;
    const notes: string[] = [];
    if (index.length < 10) notes.push(`${index.length} nights: too few for a periodogram (10 or more are needed)`);
    if (spanDays < 300) notes.push(`the nights span ${spanDays.toFixed(0)} days: an annual peak cannot be tested on less than 300 days`);
    const pick = (f: (n: number) => number): Float64Array => Float64Array.from(index, f);
    const out = notes.length > 0 ? [] : [
      periodogramSeries('clockOffset', 's', t, pick((n) => series[n].clockOffsetS), spanDays),
      periodogramSeries('zeroPoint', 'arcsec', t, pick((n) => series[n].zeroPointArcsec), spanDays),
      periodogramSeries('raResidual', 'mas', t, pick((n) => residuals.ra[n]), spanDays),
      periodogramSeries('decResidual', 'mas', t, pick((n) => residuals.dec[n]), spanDays),
    ];
    return {
      instrumentId, nightIds: index.map((n) => series[n].id), ttDaysSinceJ2000: Array.from(t), temperatureC: index.map((n) => series[n].temperatureC),
      series: out, annualSignalFlagged: out.some((s) => (s.name === 'raResidual' || s.name === 'decResidual') && s.annualSignificant), notes,
    };
  });
}
