import type { PlotModel } from './plotModel.ts';
import { MARGIN, plotFrame, type PlotColours } from './plotLayout.ts';

const escape = (text: string) => text.replace(/&/g, '&amp;').replace(/</g, '&lt;').replace(/>/g, '&gt;').replace(/"/g, '&quot;');
const n = (v: number) => (Math.round(v * 100) / 100).toString();

/**
 * The plot as a standalone SVG document (what "Export SVG" saves): axes, ticks, lines, markers,
 * every point as a circle with its label as a <title> and its data values as data-x / data-y,
 * error bars as lines; points outside the x domain (when zoomed) are left out.
 */
export function plotSvg(model: PlotModel, colours: PlotColours, xDomain: readonly [number, number] = model.xDomain): string {
  const f = plotFrame(model, xDomain);
  const [left, right] = [MARGIN.left, f.width - MARGIN.right];
  const [top, bottom] = [MARGIN.top, f.height - MARGIN.bottom];
  const inside = (x: number) => x >= Math.min(...xDomain) && x <= Math.max(...xDomain);
  const parts: string[] = [
    `<svg xmlns="http://www.w3.org/2000/svg" width="${f.width}" height="${f.height + 20}" viewBox="0 0 ${f.width} ${f.height + 20}" font-family="sans-serif" font-size="11">`,
    `<title>${escape(model.title)}</title>`,
    `<rect width="100%" height="100%" fill="${colours.background}"/>`,
    `<defs><clipPath id="area"><rect x="${left}" y="${top}" width="${right - left}" height="${bottom - top}"/></clipPath></defs>`,
  ];
  for (const t of f.yTicks) parts.push(`<line x1="${left}" x2="${right}" y1="${n(f.y(t.value))}" y2="${n(f.y(t.value))}" stroke="${colours.grid}"/><text x="${left - 6}" y="${n(f.y(t.value) + 4)}" text-anchor="end" fill="${colours.text}">${escape(t.label)}</text>`);
  for (const t of f.xTicks) parts.push(`<line x1="${n(f.x(t.value))}" x2="${n(f.x(t.value))}" y1="${bottom}" y2="${bottom + 5}" stroke="${colours.text}"/><text x="${n(f.x(t.value))}" y="${bottom + 17}" text-anchor="middle" fill="${colours.text}">${escape(t.label)}</text>`);
  parts.push(`<rect x="${left}" y="${top}" width="${right - left}" height="${bottom - top}" fill="none" stroke="${colours.muted}"/>`);
  parts.push(`<text x="${(left + right) / 2}" y="${f.height - 6}" text-anchor="middle" fill="${colours.text}">${escape(model.xLabel)}</text>`);
  parts.push(`<text transform="translate(14 ${(top + bottom) / 2}) rotate(-90)" text-anchor="middle" fill="${colours.text}">${escape(model.yLabel)}</text>`);
  parts.push('<g clip-path="url(#area)">');
  for (const m of model.markers) parts.push(`<line x1="${n(f.x(m.x))}" x2="${n(f.x(m.x))}" y1="${top}" y2="${bottom}" stroke="${colours.tones[m.tone]}" stroke-dasharray="4 3"><title>${escape(m.label)}</title></line>`);
  for (const l of model.lines) parts.push(`<polyline fill="none" stroke="${colours.tones[l.tone]}" stroke-width="1.2" points="${l.points.map(([x, y]) => `${n(f.x(x))},${n(f.y(y))}`).join(' ')}"><title>${escape(l.label)}</title></polyline>`);
  for (const p of model.points) {
    if (!inside(p.x)) continue;
    const [cx, cy, colour] = [f.x(p.x), f.y(p.y), colours.tones[p.tone]];
    if (p.xError !== undefined) parts.push(`<line x1="${n(f.x(p.x - p.xError))}" x2="${n(f.x(p.x + p.xError))}" y1="${n(cy)}" y2="${n(cy)}" stroke="${colour}"/>`);
    if (p.yError !== undefined) parts.push(`<line x1="${n(cx)}" x2="${n(cx)}" y1="${n(f.y(p.y - p.yError))}" y2="${n(f.y(p.y + p.yError))}" stroke="${colour}"/>`);
    const fill = p.tone === 'flagged' ? 'none' : colour;
    parts.push(`<circle cx="${n(cx)}" cy="${n(cy)}" r="2.5" fill="${fill}" stroke="${colour}" data-x="${p.x}" data-y="${p.y}"><title>${escape(p.label)}</title></circle>`);
  }
  parts.push('</g>');
  if (model.note !== '') parts.push(`<text x="${left}" y="${f.height + 14}" fill="${colours.muted}">${escape(model.note)}</text>`);
  parts.push('</svg>');
  return parts.join('\n');
}
