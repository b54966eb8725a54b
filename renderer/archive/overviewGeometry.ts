import type { NightMark, NightsLayout } from './nightsLayout.ts';

/**
 * Where the nights overview puts things, in its own drawing units (the svg's viewBox; the canvas
 * of marks is scaled to the same box): year rows top to bottom, one band per instrument in each,
 * day of year left to right.
 */
export const OVERVIEW = {
  width: 1000,
  /** Height of one instrument band. */
  band: 13,
  yearGap: 5,
  /** Room for the month names above the first year. */
  top: 18,
  /** Room for the year and band labels at the left. */
  left: 150,
  /** A mark is a little wider than one day (1000 − 154 units over 366 days ≈ 2.3 a day). */
  markWidth: 2.6,
  /** Days the x axis spans (a leap year's 366). */
  days: 366,
} as const;

/** The overview's geometry for one layout: row height, total height and each mark's box. */
export class OverviewGeometry {
  readonly rowHeight: number;
  readonly height: number;
  readonly firstYear: number;
  readonly #layout: NightsLayout;
  /** Mark index by `year|band|day`, for hit tests without a search. */
  readonly #byCell = new Map<string, number>();

  constructor(layout: NightsLayout) {
    this.#layout = layout;
    this.rowHeight = Math.max(1, layout.bands.length) * OVERVIEW.band + OVERVIEW.yearGap;
    this.firstYear = layout.years[0] ?? 0;
    this.height = OVERVIEW.top + 6 + this.rowHeight * layout.years.length;
    layout.marks.forEach((mark, index) => this.#byCell.set(`${mark.year}|${mark.band}|${mark.dayOfYear}`, index));
  }

  /** The x of the start of a day of the year (0 = 1 January). */
  x(dayOfYear: number): number {
    return OVERVIEW.left + (dayOfYear / OVERVIEW.days) * (OVERVIEW.width - 4 - OVERVIEW.left);
  }

  yearTop(year: number): number {
    return OVERVIEW.top + (year - this.firstYear) * this.rowHeight;
  }

  /** The box of a mark: x, y, width, height (the full band height less a unit above and below). */
  box(mark: NightMark): { x: number; y: number; width: number; height: number } {
    return { x: this.x(mark.dayOfYear), y: this.yearTop(mark.year) + mark.band * OVERVIEW.band + 1, width: OVERVIEW.markWidth, height: OVERVIEW.band - 2 };
  }

  /**
   * The index of the mark under a point (drawing units), or null. A mark drawn at day d covers
   * days d to d + 1.13, so the day under the point and the one before are tried, the later first.
   */
  markAt(xUnits: number, yUnits: number): number | null {
    const row = Math.floor((yUnits - OVERVIEW.top) / this.rowHeight);
    if (row < 0 || row >= this.#layout.years.length) return null;
    const band = Math.floor((yUnits - this.yearTop(this.firstYear + row)) / OVERVIEW.band);
    if (band < 0 || band >= Math.max(1, this.#layout.bands.length)) return null;
    const day = Math.floor(((xUnits - OVERVIEW.left) / (OVERVIEW.width - 4 - OVERVIEW.left)) * OVERVIEW.days);
    for (const candidate of [day, day - 1]) {
      const index = this.#byCell.get(`${this.firstYear + row}|${band}|${candidate}`);
      if (index === undefined) continue;
      const box = this.box(this.#layout.marks[index]);
      if (xUnits >= box.x && xUnits <= box.x + box.width) return index;
    }
    return null;
  }
}
