/**
 * A plot as data, independent of how it is drawn: the screen draws its points on a canvas and its
 * axes in SVG; the export writes the same model as one SVG document. Coordinates are in the
 * plot's own units (named in the axis labels).
 */
export type Tone = 'main' | 'second' | 'flagged' | 'muted';

export interface PlotPoint {
  readonly x: number;
  readonly y: number;
  /** 1σ half-widths of the error bars, same units as x and y; absent → no bar. */
  readonly xError?: number;
  readonly yError?: number;
  readonly tone: Tone;
  /** What hovering shows, e.g. "ML-001 · night-2021-01-04 · 11.9 mas". */
  readonly label: string;
  /** The night the point belongs to, for clicking through to the Archive; absent → not a night. */
  readonly nightId?: string;
}

export interface PlotLine {
  readonly points: readonly (readonly [number, number])[];
  readonly tone: Tone;
  readonly label: string;
}

/** A vertical marker (the annual frequency on a periodogram). */
export interface PlotMarker {
  readonly x: number;
  readonly label: string;
  readonly tone: Tone;
}

export interface PlotModel {
  /** Stable id: file names of exports and test ids. */
  readonly id: string;
  readonly title: string;
  readonly xLabel: string;
  readonly yLabel: string;
  readonly xDomain: readonly [number, number];
  readonly yDomain: readonly [number, number];
  /** x is a Modified Julian Date (UTC): ticks show calendar dates. */
  readonly xIsMjd: boolean;
  /** The time plots zoom and pan along x. */
  readonly zoomable: boolean;
  /** Same scale on both axes (the dial and the ellipses). */
  readonly equalAspect: boolean;
  readonly points: readonly PlotPoint[];
  readonly lines: readonly PlotLine[];
  readonly markers: readonly PlotMarker[];
  /** A sentence under the plot (an annual flag, a missing part). */
  readonly note: string;
}
