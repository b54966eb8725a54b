import type { NightSummary } from './archiveQueries.ts';

/** Where one night's mark goes in the years × day-of-year grid. */
export interface NightMark {
  readonly summary: NightSummary;
  readonly year: number;
  /** Day of the year, 0 = 1 January. */
  readonly dayOfYear: number;
  /** Colour step 0 … STEPS−1 by transit count. */
  readonly step: number;
}

/** Number of colour steps in the overview. */
export const STEPS = 5;
const MS_PER_DAY = 86_400_000;

/** The upper transit count of each colour step, from the largest count (steps of equal width). */
export function stepLimits(maxCount: number): number[] {
  const width = Math.max(1, Math.ceil(maxCount / STEPS));
  return Array.from({ length: STEPS }, (_, index) => (index + 1) * width);
}

/** Lays the nights out by local date (`YYYY-MM-DD`) into year rows; years without nights are kept. */
export function layoutNights(nights: readonly NightSummary[]): { marks: NightMark[]; years: number[]; limits: number[] } {
  const limits = stepLimits(Math.max(0, ...nights.map((n) => n.transitCount)));
  const marks = nights.map((summary) => {
    const [year, month, day] = summary.night.localDate.split('-').map(Number);
    const dayOfYear = (Date.UTC(year, month - 1, day) - Date.UTC(year, 0, 1)) / MS_PER_DAY;
    const step = limits.findIndex((limit) => summary.transitCount <= limit);
    return { summary, year, dayOfYear, step: step < 0 ? STEPS - 1 : step };
  });
  const found = marks.map((mark) => mark.year);
  const years = found.length === 0 ? [] : Array.from({ length: Math.max(...found) - Math.min(...found) + 1 }, (_, i) => Math.min(...found) + i);
  return { marks, years, limits };
}
