import type { PlotModel } from './plotModel.ts';
import { MARGIN, type PlotColours, type PlotFrame } from './plotLayout.ts';

/**
 * Draws a plot's marks (lines, markers, error bars, points) on a canvas already sized to the
 * frame × devicePixelRatio; the axes are SVG on top. Returns how many points were drawn (those
 * inside the x domain), which the figure reports for tests and screen readers.
 */
export function drawPlot(context: CanvasRenderingContext2D, model: PlotModel, frame: PlotFrame, colours: PlotColours, highlighted: number, pixelRatio: number): number {
  context.setTransform(pixelRatio, 0, 0, pixelRatio, 0, 0);
  context.clearRect(0, 0, frame.width, frame.height);
  context.save();
  context.beginPath();
  context.rect(MARGIN.left, MARGIN.top, frame.width - MARGIN.left - MARGIN.right, frame.height - MARGIN.top - MARGIN.bottom);
  context.clip();
  context.lineWidth = 1;
  for (const m of model.markers) {
    context.strokeStyle = colours.tones[m.tone];
    context.setLineDash([4, 3]);
    context.beginPath();
    context.moveTo(frame.x(m.x), MARGIN.top);
    context.lineTo(frame.x(m.x), frame.height - MARGIN.bottom);
    context.stroke();
  }
  context.setLineDash([]);
  for (const l of model.lines) {
    context.strokeStyle = colours.tones[l.tone];
    context.beginPath();
    l.points.forEach(([x, y], i) => (i === 0 ? context.moveTo(frame.x(x), frame.y(y)) : context.lineTo(frame.x(x), frame.y(y))));
    context.stroke();
  }
  const [low, high] = frame.x.domain();
  let drawn = 0;
  for (const p of model.points) {
    if (p.x < Math.min(low, high) || p.x > Math.max(low, high)) continue;
    drawn++;
    const cx = frame.x(p.x), cy = frame.y(p.y), colour = colours.tones[p.tone];
    context.strokeStyle = colour;
    context.fillStyle = colour;
    context.beginPath();
    if (p.xError !== undefined) { context.moveTo(frame.x(p.x - p.xError), cy); context.lineTo(frame.x(p.x + p.xError), cy); }
    if (p.yError !== undefined) { context.moveTo(cx, frame.y(p.y - p.yError)); context.lineTo(cx, frame.y(p.y + p.yError)); }
    context.stroke();
    context.beginPath();
    context.arc(cx, cy, 2.5, 0, 2 * Math.PI);
    if (p.tone === 'flagged') context.stroke();
    else context.fill();
  }
  const h = model.points[highlighted];
  if (h !== undefined) {
    context.strokeStyle = colours.text;
    context.lineWidth = 2;
    context.beginPath();
    context.arc(frame.x(h.x), frame.y(h.y), 6, 0, 2 * Math.PI);
    context.stroke();
  }
  context.restore();
  return drawn;
}
