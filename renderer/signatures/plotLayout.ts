import { scaleLinear, scaleUtc, type ScaleLinear } from 'd3';
import type { PlotModel, Tone } from './plotModel.ts';
import { dateFromMjd } from './plotScales.ts';

/** Pixel margins around the plotting area (room for tick labels and axis titles). */
export const MARGIN = { top: 12, right: 16, bottom: 44, left: 70 } as const;

/** The colours a plot uses, resolved from the theme's CSS variables. */
export interface PlotColours {
  readonly background: string;
  readonly text: string;
  readonly muted: string;
  readonly grid: string;
  readonly tones: Readonly<Record<Tone, string>>;
}

export interface PlotFrame {
  readonly width: number;
  readonly height: number;
  readonly x: ScaleLinear<number, number>;
  readonly y: ScaleLinear<number, number>;
  readonly xTicks: readonly { readonly value: number; readonly label: string }[];
  readonly yTicks: readonly { readonly value: number; readonly label: string }[];
}

/** Size of a plot: 640 × 360 px, or square for plots with equal axes. */
export function plotSize(model: PlotModel): { width: number; height: number } {
  return model.equalAspect ? { width: 440, height: 440 } : { width: 640, height: 360 };
}

/** Scales and ticks of a plot at the given (possibly zoomed) x domain. */
export function plotFrame(model: PlotModel, xDomain: readonly [number, number] = model.xDomain): PlotFrame {
  const { width, height } = plotSize(model);
  const x = scaleLinear().domain(xDomain).range([MARGIN.left, width - MARGIN.right]);
  const y = scaleLinear().domain(model.yDomain).range([height - MARGIN.bottom, MARGIN.top]);
  const yFormat = y.tickFormat(6);
  const yTicks = y.ticks(6).map((value) => ({ value, label: yFormat(value) }));
  let xTicks: { value: number; label: string }[];
  if (model.xIsMjd) {
    const utc = scaleUtc().domain([dateFromMjd(xDomain[0]), dateFromMjd(xDomain[1])]);
    const utcFormat = utc.tickFormat(7);
    xTicks = utc.ticks(7).map((date) => ({ value: date.getTime() / 86_400_000 + 40587, label: utcFormat(date) }));
  } else {
    const xFormat = x.tickFormat(7);
    xTicks = x.ticks(7).map((value) => ({ value, label: xFormat(value) }));
  }
  return { width, height, x, y, xTicks, yTicks };
}

/** Index of the point nearest (x, y) in pixels within `radiusPx`, or −1. Linear scan: plots hold at most a few thousand points. */
export function nearestPoint(model: PlotModel, frame: PlotFrame, xPx: number, yPx: number, radiusPx = 8): number {
  let best = -1, bestSquared = radiusPx * radiusPx;
  model.points.forEach((p, i) => {
    const dx = frame.x(p.x) - xPx, dy = frame.y(p.y) - yPx;
    const d = dx * dx + dy * dy;
    if (d <= bestSquared) { best = i; bestSquared = d; }
  });
  return best;
}
