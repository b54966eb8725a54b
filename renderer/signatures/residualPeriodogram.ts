import { falseAlarmProbability, lombScarglePeriodogram } from '../../core/solver/index.ts';
import { ANNUAL_FALSE_ALARM_LIMIT } from '../../core/joint/common-mode.ts';
import type { ObservationResidual } from '../../core/joint/solve-outputs.ts';
import type { PlotModel } from './plotModel.ts';
import type { Coordinate } from './plotModels.ts';
import { paddedExtent } from './plotScales.ts';
import { YEAR_DAYS } from './parallaxEllipse.ts';

/** Highest frequency shown (per day, a 20-day period) and grid oversampling: as the solve's common-mode periodograms. */
const HIGHEST_FREQUENCY_PER_DAY = 1 / 20;
const OVERSAMPLING = 5;

/**
 * Lomb–Scargle periodogram (core/solver, Scargle 1982 normalisation) of the residuals of one star
 * or of all stars in one coordinate, only those fitted at full weight (an outlier would dominate),
 * with the power and false-alarm probability at 1/yr, tested at that one frequency chosen beforehand
 * and flagged below ANNUAL_FALSE_ALARM_LIMIT (0.1 %). Throws when fewer than 10 residuals or less
 * than 300 days remain: an annual term cannot be tested on less.
 */
export function residualPeriodogramPlot(residuals: readonly ObservationResidual[], starId: string | null, coordinate: Coordinate): PlotModel {
  const t: number[] = [], y: number[] = [];
  for (const r of residuals) {
    const c = coordinate === 'ra' ? r.ra : r.zenith;
    if ((starId !== null && r.starId !== starId) || c === null || c.flag !== 'fit' || !Number.isFinite(c.residualMas)) continue;
    t.push(r.utcMjd);
    y.push(c.residualMas);
  }
  const spanDays = t.length === 0 ? 0 : Math.max(...t) - Math.min(...t);
  const who = starId ?? 'all stars';
  if (t.length < 10 || spanDays < 300) throw new Error(`Periodogram of ${who}: ${t.length} fitted residuals over ${spanDays.toFixed(0)} days; an annual term needs at least 10 over 300 days.`);
  const lowest = 1 / spanDays, steps = Math.ceil(((HIGHEST_FREQUENCY_PER_DAY - lowest) / lowest) * OVERSAMPLING);
  const frequencies = Float64Array.from({ length: steps + 1 }, (_, i) => lowest + ((HIGHEST_FREQUENCY_PER_DAY - lowest) * i) / steps);
  const [times, values] = [Float64Array.from(t), Float64Array.from(y)];
  const power = lombScarglePeriodogram(times, values, frequencies);
  const annualPower = lombScarglePeriodogram(times, values, Float64Array.of(1 / YEAR_DAYS))[0];
  const annualFalseAlarm = falseAlarmProbability(annualPower, 1);
  const significant = annualFalseAlarm < ANNUAL_FALSE_ALARM_LIMIT;
  const words = significant ? 'significant annual peak' : 'no significant annual peak';
  const what = coordinate === 'ra' ? 'RA residuals' : 'zenith-distance residuals';
  return {
    id: 'residual-periodogram', title: `${who}: periodogram of the ${what}`, xLabel: 'frequency (cycles per year)', yLabel: 'normalised power',
    xDomain: [0, HIGHEST_FREQUENCY_PER_DAY * YEAR_DAYS], yDomain: [0, paddedExtent([...power, annualPower])[1]], xIsMjd: false, zoomable: false, equalAspect: false,
    lines: [{ points: Array.from(frequencies, (f, i) => [f * YEAR_DAYS, power[i]] as const), tone: 'main', label: what }],
    markers: [{ x: 1, label: '1 / year', tone: significant ? 'flagged' : 'muted' }],
    points: [{ x: 1, y: annualPower, tone: significant ? 'flagged' : 'second', label: `annual power ${annualPower.toFixed(2)}, false alarm ${annualFalseAlarm.toExponential(1)} — ${words}` }],
    note: `${t.length} residuals fitted at full weight. At 1/yr: power ${annualPower.toFixed(2)}, false-alarm probability ${annualFalseAlarm.toExponential(1)}: ${words}.`,
  };
}
