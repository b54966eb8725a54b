import { beforeAll, describe, expect, it } from 'vitest';
import { solveResultsFromPipeline } from './solveFixture.ts';
import { signatureDataOf, type SignatureData } from '../../renderer/signatures/solveResults.ts';
import { commonModePlot, dialPlot, ellipsePlot, periodogramPlot, residualPlot } from '../../renderer/signatures/plotModels.ts';
import { plotSvg } from '../../renderer/signatures/plotSvg.ts';
import { heatMapSvg } from '../../renderer/signatures/heatMapSvg.ts';
import { parseColour } from '../../renderer/signatures/heatColour.ts';
import type { PlotColours } from '../../renderer/signatures/plotLayout.ts';

const colours: PlotColours = { background: '#000', text: '#a80000', muted: '#780000', grid: '#3c0000', tones: { main: '#a80000', second: '#780000', flagged: '#c00000', muted: '#3c0000' } };
let data: SignatureData;
let results: Record<string, unknown>;

beforeAll(() => {
  // Made by the real pipeline (simulate + solve --json --residuals), not a hand-written shape.
  results = solveResultsFromPipeline();
  data = signatureDataOf({ label: 'seed 3', results, residuals: [] });
}, 60_000);

const circles = (svg: string) => svg.match(/<circle /g)?.length ?? 0;

describe('plot models and their SVG export, from a real solve', () => {
  it('the dial SVG holds one circle per star at its parallax-phase amplitude', () => {
    const svg = plotSvg(dialPlot(data.stars), colours);
    expect(svg.startsWith('<svg')).toBe(true);
    expect(circles(svg)).toBe(10);
    for (const s of data.stars) expect(svg).toContain(`data-x="${s.parallaxPhaseMas}"`);
    expect(svg).toContain(data.stars[0].id);
  });

  it('residuals of all stars: one circle per observation with a right-ascension residual; one star: only its own', () => {
    expect(data.residuals.length).toBe(862); // simulate reports 862 transits for seed 3
    expect(circles(plotSvg(residualPlot(data.residuals, null, 'ra', 'time'), colours))).toBe(862);
    const own = data.residuals.filter((r) => r.starId === 'ML-001').length;
    expect(circles(plotSvg(residualPlot(data.residuals, 'ML-001', 'ra', 'season'), colours))).toBe(own);
  });

  it('a zoomed x domain leaves out the points outside it', () => {
    const model = residualPlot(data.residuals, null, 'ra', 'time');
    const middle = (model.xDomain[0] + model.xDomain[1]) / 2;
    const kept = model.points.filter((p) => p.x <= middle).length;
    expect(circles(plotSvg(model, colours, [model.xDomain[0], middle]))).toBe(kept);
    expect(kept).toBeLessThan(model.points.length);
  });

  it('common mode against time and temperature: one point per night', () => {
    const instrument = data.instruments[0];
    const series = instrument.series.find((s) => s.name === 'clockOffset');
    if (series === undefined) throw new Error('the solve printed no clockOffset series');
    expect(commonModePlot(instrument, series, 'time').points.length).toBe(instrument.nightIds.length);
    const svg = plotSvg(commonModePlot(instrument, series, 'temperature'), colours);
    expect(circles(svg)).toBe(instrument.nightIds.length);
    expect(svg).toContain(instrument.nightIds[0]);
  });

  it('the periodogram marks 1/yr and says whether the annual peak is flagged', () => {
    const instrument = data.instruments[0];
    for (const series of instrument.series) {
      const model = periodogramPlot(instrument, series);
      expect(model.markers[0].x).toBe(1);
      expect(model.note).toContain(series.annualSignificant ? 'significant annual peak' : 'no significant annual peak');
      expect(model.lines[0].points.length).toBe(series.periodogram.power.length);
    }
  });

  it('the parallax ellipses pass through each star’s observed factors within 6 % of the ellipse size (the orbit’s eccentricity, 2e = 3.3 %, plus the 73-sample chords)', () => {
    const model = ellipsePlot(data.stars);
    expect(model.lines.length).toBe(10);
    for (const [k, star] of data.stars.entries()) {
      const curve = model.lines[k].points;
      const size = Math.max(...curve.map(([x, y]) => Math.hypot(x, y)));
      star.parallaxFactors.raFactor.forEach((x, i) => {
        const y = star.parallaxFactors.decFactor[i];
        const distance = Math.min(...curve.map(([cx, cy]) => Math.hypot(cx - x, cy - y)));
        expect(distance).toBeLessThan(0.06 * size);
      });
    }
  });

  it('the heat map SVG has one cell per coefficient and keeps the value', () => {
    const palette = { negative: parseColour('#5a0000'), neutral: parseColour('#080000'), positive: parseColour('#c80000') };
    const svg = heatMapSvg(data.correlation, palette, colours);
    const count = data.correlation.names.length;
    expect(svg.match(/<rect x=/g)?.length).toBe(count * count);
    expect(svg).toContain(`data-r="${data.correlation.matrix[0][1]}"`);
    expect(svg).not.toMatch(/rgb\(\d+, [1-9]/);
  });

  it('signatureDataOf names what a saved reduction lacks and how to fix it', () => {
    const { signatures: _dropped, ...rest } = results;
    expect(() => signatureDataOf({ label: 'old', results: rest, residuals: [] })).toThrow(/"old" has no signatures.*solve the archive again/);
  });
});
