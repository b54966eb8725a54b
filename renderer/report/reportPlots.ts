import type { ReductionRecord } from '../../core/archive/records.ts';
import { heatMapSvg } from '../signatures/heatMapSvg.ts';
import type { PlotModel } from '../signatures/plotModel.ts';
import { commonModePlot, dialPlot, ellipsePlot, periodogramPlot, residualPlot } from '../signatures/plotModels.ts';
import { plotSvg } from '../signatures/plotSvg.ts';
import { residualPeriodogramPlot } from '../signatures/residualPeriodogram.ts';
import { signatureDataOf } from '../signatures/solveResults.ts';
import { PRINT_HEAT_PALETTE, PRINT_PLOT_COLOURS } from './printPalette.ts';

/** One figure of the report: its caption and the plot as inline SVG markup. */
export interface ReportFigure {
  readonly title: string;
  readonly svg: string;
}

/**
 * A standalone SVG made fit to sit inline among others: the namespace attribute goes (HTML needs
 * none, and the report then holds no URL at all) and the clip-path id is made unique per figure,
 * since ids are shared by the whole document.
 */
function inlineSvg(svg: string, index: number): string {
  return svg.replace(' xmlns="http://www.w3.org/2000/svg"', '').replaceAll('id="area"', `id="plot-area-${index}"`).replaceAll('url(#area)', `url(#plot-area-${index})`);
}

/** Above this many parameters the heat map's cells are too small to read on A4; the report says so instead. */
export const HEAT_MAP_MAX_PARAMETERS = 90;

/**
 * The Signatures view's plots of a saved solve as SVG (plotSvg / heatMapSvg, print colours): each
 * instrument's common-mode series against time and their periodograms, the residuals of all
 * stars against time and season in both coordinates, the aberration/parallax dial, the parallax
 * ellipses, the residual periodogram and the correlation heat map. A plot that cannot be made
 * (e.g. no residuals saved) is listed in `missing` with the reason, never drawn empty.
 */
export function reportFigures(record: ReductionRecord): { figures: ReportFigure[]; missing: string[] } {
  const figures: ReportFigure[] = [];
  const missing: string[] = [];
  let data;
  try {
    data = signatureDataOf(record);
  } catch (error) {
    return { figures, missing: [error instanceof Error ? error.message : String(error)] };
  }
  const add = (what: string, make: () => PlotModel) => {
    try {
      const model = make();
      figures.push({ title: model.title, svg: inlineSvg(plotSvg(model, PRINT_PLOT_COLOURS), figures.length) });
    } catch (error) {
      missing.push(`${what}: ${error instanceof Error ? error.message : String(error)}`);
    }
  };
  for (const instrument of data.instruments) {
    for (const series of instrument.series) {
      add(`common-mode series ${series.name} of ${instrument.instrumentId}`, () => commonModePlot(instrument, series, 'time'));
      add(`periodogram of ${series.name} of ${instrument.instrumentId}`, () => periodogramPlot(instrument, series));
    }
  }
  if (data.residuals.length === 0) missing.push('residual plots: the solve was saved without its residuals');
  else {
    for (const coordinate of ['ra', 'zenith'] as const) {
      add(`residuals (${coordinate}) against time`, () => residualPlot(data.residuals, null, coordinate, 'time'));
      add(`residuals (${coordinate}) against season`, () => residualPlot(data.residuals, null, coordinate, 'season'));
    }
    add('residual periodogram', () => residualPeriodogramPlot(data.residuals, null, 'ra'));
  }
  add('aberration and parallax dial', () => dialPlot(data.stars));
  add('parallax ellipses', () => ellipsePlot(data.stars));
  const count = data.correlation.names.length;
  if (count > HEAT_MAP_MAX_PARAMETERS) missing.push(`correlation heat map: ${count} parameters are too many to read on a page (the Signatures view shows it with zoom and keyboard reading)`);
  else if (count > 0) figures.push({ title: 'Correlation matrix of the solved parameters', svg: inlineSvg(heatMapSvg(data.correlation, PRINT_HEAT_PALETTE, PRINT_PLOT_COLOURS), figures.length) });
  return { figures, missing };
}
