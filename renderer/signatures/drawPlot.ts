import type { PlotModel, Tone } from './plotModel.ts';
import { MARGIN, type PlotColours, type PlotFrame } from './plotLayout.ts';

const DOT_RADIUS_PX = 2.5;
// Flagged points last, so that they stay on top of the others.
const TONE_ORDER: readonly Tone[] = ['muted', 'second', 'main', 'flagged'];

/** A linear scale as [pixel at value 0, pixels per unit]. */
function linearOf(scale: PlotFrame['x']): [number, number] {
  const [d0, d1] = scale.domain(), [r0, r1] = scale.range();
  const perUnit = d1 === d0 ? 0 : (r1 - r0) / (d1 - d0);
  return [r0 - d0 * perUnit, perUnit];
}

/**
 * The points inside the x domain, one path per tone (one fill or stroke per tone, not two per
 * point), and a dot whose pixel already holds a dot of its tone is not added again: with
 * hundreds of thousands of residuals most dots overlap, and rasterising each one made a redraw
 * take hundreds of milliseconds. The look differs by less than a pixel. Returns the points
 * inside the domain (drawn or covered by an identical dot).
 */
function drawPoints(context: CanvasRenderingContext2D, model: PlotModel, frame: PlotFrame, colours: PlotColours): number {
  const [a, b] = frame.x.domain();
  const low = Math.min(a, b), high = Math.max(a, b);
  const width = Math.ceil(frame.width), height = Math.ceil(frame.height);
  const dots = new Map<Tone, { path: Path2D; bars: Path2D | null; taken: Uint8Array }>();
  // The scales are linear: pixel = offset + value·scale, taken once instead of a scale call per point.
  const [xPixel, xScale] = linearOf(frame.x), [yPixel, yScale] = linearOf(frame.y);
  let inside = 0;
  for (const p of model.points) {
    if (p.x < low || p.x > high) continue;
    inside++;
    let tone = dots.get(p.tone);
    if (tone === undefined) dots.set(p.tone, (tone = { path: new Path2D(), bars: null, taken: new Uint8Array(width * height) }));
    const cx = xPixel + p.x * xScale, cy = yPixel + p.y * yScale;
    if (p.xError !== undefined || p.yError !== undefined) {
      tone.bars ??= new Path2D();
      if (p.xError !== undefined) { tone.bars.moveTo(frame.x(p.x - p.xError), cy); tone.bars.lineTo(frame.x(p.x + p.xError), cy); }
      if (p.yError !== undefined) { tone.bars.moveTo(cx, frame.y(p.y - p.yError)); tone.bars.lineTo(cx, frame.y(p.y + p.yError)); }
    }
    const px = Math.round(cx), py = Math.round(cy);
    const cell = px >= 0 && px < width && py >= 0 && py < height ? py * width + px : -1;
    if (cell >= 0 && tone.taken[cell] === 1) continue;
    if (cell >= 0) tone.taken[cell] = 1;
    tone.path.moveTo(cx + DOT_RADIUS_PX, cy);
    tone.path.arc(cx, cy, DOT_RADIUS_PX, 0, 2 * Math.PI);
  }
  for (const name of TONE_ORDER) {
    const tone = dots.get(name);
    if (tone === undefined) continue;
    context.strokeStyle = context.fillStyle = colours.tones[name];
    if (tone.bars !== null) context.stroke(tone.bars);
    if (name === 'flagged') context.stroke(tone.path);
    else context.fill(tone.path);
  }
  return inside;
}

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
  const drawn = drawPoints(context, model, frame, colours);
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
