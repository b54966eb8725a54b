import type { CorrelationMatrix } from '../../core/joint/solve-outputs.ts';
import { correlationColour, type HeatPalette } from './heatColour.ts';
import type { PlotColours } from './plotLayout.ts';

/** Pixel size of one heat-map cell and the room left for the parameter names. */
export const HEAT_CELL_PX = 9;
export const HEAT_LABEL_PX = 130;
/** Cells with a correlation at or below −this carry a dot, so the sign reads even in the one-hue night theme. */
export const NEGATIVE_MARK_FROM = 0.2;

const escape = (text: string) => text.replace(/&/g, '&amp;').replace(/</g, '&lt;').replace(/>/g, '&gt;').replace(/"/g, '&quot;');

/** The correlation matrix as a standalone SVG heat map: one <rect> per coefficient, its value in data-r and its <title>. */
export function heatMapSvg(correlation: CorrelationMatrix, palette: HeatPalette, colours: PlotColours): string {
  const count = correlation.names.length;
  const size = HEAT_LABEL_PX + count * HEAT_CELL_PX + 4;
  const parts = [
    `<svg xmlns="http://www.w3.org/2000/svg" width="${size}" height="${size}" viewBox="0 0 ${size} ${size}" font-family="sans-serif" font-size="8">`,
    '<title>Correlation matrix of the solved parameters</title>',
    `<rect width="100%" height="100%" fill="${colours.background}"/>`,
  ];
  correlation.names.forEach((name, i) => {
    const at = HEAT_LABEL_PX + i * HEAT_CELL_PX + HEAT_CELL_PX - 1;
    parts.push(`<text x="${HEAT_LABEL_PX - 4}" y="${at}" text-anchor="end" fill="${colours.text}">${escape(name)}</text>`);
    parts.push(`<text transform="translate(${at} ${HEAT_LABEL_PX - 4}) rotate(-90)" fill="${colours.text}">${escape(name)}</text>`);
  });
  correlation.matrix.forEach((row, i) => row.forEach((r, j) => {
    parts.push(`<rect x="${HEAT_LABEL_PX + j * HEAT_CELL_PX}" y="${HEAT_LABEL_PX + i * HEAT_CELL_PX}" width="${HEAT_CELL_PX}" height="${HEAT_CELL_PX}" fill="${correlationColour(r, palette)}" data-r="${r}"><title>${escape(`${correlation.names[i]} × ${correlation.names[j]}: ${r.toFixed(3)}`)}</title></rect>`);
    if (r <= -NEGATIVE_MARK_FROM) parts.push(`<circle cx="${HEAT_LABEL_PX + (j + 0.5) * HEAT_CELL_PX}" cy="${HEAT_LABEL_PX + (i + 0.5) * HEAT_CELL_PX}" r="${HEAT_CELL_PX / 5}" fill="${colours.background}"/>`);
  }));
  parts.push('</svg>');
  return parts.join('\n');
}
