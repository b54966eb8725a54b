import type { InstrumentCommonMode, CommonModeSeries } from '../../core/joint/common-mode.ts';
import type { ObservationResidual } from '../../core/joint/solve-outputs.ts';
import type { StarSignature } from '../../core/joint/star-signatures.ts';
import type { PlotLine, PlotModel, PlotPoint } from './plotModel.ts';
import { dayOfYearFromMjd, mjdFromTtDays, paddedExtent, symmetricExtent } from './plotScales.ts';
import { parallaxEllipsePoints, YEAR_DAYS } from './parallaxEllipse.ts';

/** Which coordinate's residuals to plot: right ascension on the sky (Δα cos δ) or zenith distance. */
export type Coordinate = 'ra' | 'zenith';

const SERIES_WORDS: Record<CommonModeSeries['name'], string> = {
  clockOffset: 'clock offset', zeroPoint: 'zenith zero point', raResidual: 'mean RA residual', decResidual: 'mean Dec residual',
};

/** "clock offset (s)": a series' name in words with its unit. */
export function seriesTitle(series: CommonModeSeries): string {
  return `${SERIES_WORDS[series.name]} (${series.unit})`;
}

const format = (value: number, digits = 1) => value.toFixed(digits);
const base = { lines: [] as PlotLine[], markers: [], note: '', xIsMjd: false, zoomable: false, equalAspect: false };

/** One instrument's per-night common-mode series against time (MJD) or against the night's mean temperature (°C). */
export function commonModePlot(instrument: InstrumentCommonMode, series: CommonModeSeries, against: 'time' | 'temperature'): PlotModel {
  const xs = against === 'time' ? instrument.ttDaysSinceJ2000.map(mjdFromTtDays) : instrument.temperatureC;
  const points: PlotPoint[] = [];
  series.values.forEach((y, i) => {
    if (!Number.isFinite(y) || !Number.isFinite(xs[i])) return;
    const night = instrument.nightIds[i];
    points.push({ x: xs[i], y, tone: 'main', nightId: night, label: `${night} · ${format(instrument.temperatureC[i])} °C · ${SERIES_WORDS[series.name]} ${format(y, 3)} ${series.unit}` });
  });
  return {
    ...base, id: `common-mode-${against}`, title: `${instrument.instrumentId}: ${seriesTitle(series)} against ${against}`,
    xLabel: against === 'time' ? 'date (UTC)' : 'night mean temperature (°C)', yLabel: seriesTitle(series),
    xDomain: paddedExtent(points.map((p) => p.x)), yDomain: paddedExtent(points.map((p) => p.y), 0.05, 1e-3),
    xIsMjd: against === 'time', zoomable: against === 'time', points,
  };
}

/** Residuals (mas) of one star (or of all when starId is null) against time or day of year; points not fitted at full weight are flagged. */
export function residualPlot(residuals: readonly ObservationResidual[], starId: string | null, coordinate: Coordinate, against: 'time' | 'season'): PlotModel {
  const points: PlotPoint[] = [];
  for (const r of residuals) {
    if (starId !== null && r.starId !== starId) continue;
    const c = coordinate === 'ra' ? r.ra : r.zenith;
    if (c === null || !Number.isFinite(c.residualMas)) continue;
    const x = against === 'time' ? r.utcMjd : dayOfYearFromMjd(r.utcMjd);
    points.push({ x, y: c.residualMas, tone: c.flag === 'fit' ? 'main' : 'flagged', nightId: r.nightId, label: `${r.starId} · ${r.nightId} · ${format(c.residualMas)} mas (${c.flag})` });
  }
  const who = starId ?? 'all stars';
  const what = coordinate === 'ra' ? 'RA residual Δα cos δ (mas)' : 'zenith-distance residual (mas)';
  return {
    ...base, id: `residuals-${against}`, title: `${who}: ${what} against ${against === 'time' ? 'time' : 'season'}`,
    xLabel: against === 'time' ? 'date (UTC)' : 'day of year', yLabel: what,
    xDomain: against === 'time' ? paddedExtent(points.map((p) => p.x)) : [0, 367], yDomain: symmetricExtent(points.map((p) => p.y)),
    xIsMjd: against === 'time', zoomable: against === 'time', points,
    note: points.some((p) => p.tone === 'flagged') ? 'Hollow marks: down-weighted, outlier or rejected.' : '',
  };
}

/** The dial: each star's parallax-phase amplitude (x, mas) against its aberration-phase amplitude (y, mas), with conditional 1σ bars. */
export function dialPlot(stars: readonly StarSignature[]): PlotModel {
  const points: PlotPoint[] = stars.map((s) => ({
    x: s.parallaxPhaseMas, y: s.aberrationPhaseMas, xError: s.parallaxPhaseConditionalSigmaMas, yError: s.aberrationPhaseConditionalSigmaMas, tone: 'main',
    label: `${s.id} · parallax phase ${format(s.parallaxPhaseMas)} ± ${format(s.parallaxPhaseConditionalSigmaMas)} mas · aberration phase ${format(s.aberrationPhaseMas)} ± ${format(s.aberrationPhaseConditionalSigmaMas)} mas · ρ ${format(s.correlation, 2)}`,
  }));
  const span = symmetricExtent(points.flatMap((p) => [p.x - (p.xError ?? 0), p.x + (p.xError ?? 0), p.y - (p.yError ?? 0), p.y + (p.yError ?? 0)]));
  return {
    ...base, id: 'annual-dial', title: 'Annual signal of each star: parallax phase against aberration phase',
    xLabel: 'parallax-phase amplitude (mas)', yLabel: 'aberration-phase amplitude (mas)', xDomain: span, yDomain: span, equalAspect: true, points,
    // The axes through the origin: zero parallax and the adopted aberration constant (Δκ = 0).
    lines: [{ points: [[span[0], 0], [span[1], 0]], tone: 'muted', label: 'Δκ = 0' }, { points: [[0, span[0]], [0, span[1]]], tone: 'muted', label: 'ϖ = 0' }],
    note: 'A star’s parallax lies along x; a common aberration error moves every star up or down together; an unmodelled instrument term scatters stars off both.',
  };
}

/** Parallax ellipses (mas per mas of parallax): each star's fitted annual path, and its factors at the observed instants. */
export function ellipsePlot(stars: readonly StarSignature[]): PlotModel {
  const lines: PlotLine[] = [], points: PlotPoint[] = [], skipped: string[] = [];
  for (const s of stars) {
    const f = s.parallaxFactors;
    try {
      lines.push({ points: parallaxEllipsePoints(f), tone: 'second', label: s.id });
    } catch {
      skipped.push(s.id); // Too little of the year: its points are still shown, only the ellipse is left out.
    }
    f.raFactor.forEach((x, i) => points.push({ x, y: f.decFactor[i], tone: 'main', label: `${s.id} · MJD ${format(mjdFromTtDays(f.ttDaysSinceJ2000[i]), 2)} · Pα ${format(x, 3)}, Pδ ${format(f.decFactor[i], 3)}` }));
  }
  const span = symmetricExtent([...points.flatMap((p) => [p.x, p.y]), ...lines.flatMap((l) => l.points.flat())], 0.05, 0.1);
  return {
    ...base, id: 'parallax-ellipses', title: 'Parallax ellipses from the parallax factors', xLabel: 'Pα = ∂(α cos δ)/∂ϖ', yLabel: 'Pδ = ∂δ/∂ϖ',
    xDomain: span, yDomain: span, equalAspect: true, points, lines,
    note: skipped.length > 0 ? `No ellipse for ${skipped.join(', ')}: observed over too little of the year.` : '',
  };
}

/** Lomb–Scargle periodogram of one common-mode series (frequency in cycles per year), the annual frequency marked, its flag in the note. */
export function periodogramPlot(instrument: InstrumentCommonMode, series: CommonModeSeries): PlotModel {
  const p = series.periodogram;
  const line: [number, number][] = p.frequenciesPerDay.map((f, i) => [f * YEAR_DAYS, p.power[i]]);
  const flag = series.annualSignificant ? 'significant annual peak' : 'no significant annual peak';
  return {
    ...base, id: 'periodogram', title: `${instrument.instrumentId}: periodogram of ${seriesTitle(series)}`,
    xLabel: 'frequency (cycles per year)', yLabel: 'normalised power', xDomain: [0, Math.max(1.5, ...line.map((l) => l[0]))],
    yDomain: [0, paddedExtent([...p.power, series.annualPower])[1]], lines: [{ points: line, tone: 'main', label: seriesTitle(series) }],
    markers: [{ x: 1, label: '1 / year', tone: series.annualSignificant ? 'flagged' : 'muted' }],
    points: [{ x: 1, y: series.annualPower, tone: series.annualSignificant ? 'flagged' : 'second', label: `annual power ${format(series.annualPower, 2)}, false alarm ${series.annualFalseAlarm.toExponential(1)} — ${flag}` }],
    note: `At 1/yr: power ${format(series.annualPower, 2)}, false-alarm probability ${series.annualFalseAlarm.toExponential(1)}: ${flag}.${instrument.annualSignalFlagged ? ' This instrument is FLAGGED: its residual series keep an annual signal the model leaves out (a thermal or seasonal term).' : ''}`,
  };
}
