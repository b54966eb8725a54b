import type { InstrumentRecord } from '../../core/archive/records.ts';
import type { OverviewNight } from './archiveQueries.ts';

/** Where one night's mark goes in the years × instrument bands × day-of-year grid. */
export interface NightMark {
  readonly summary: OverviewNight;
  readonly year: number;
  /** Day of the year, 0 = 1 January. */
  readonly dayOfYear: number;
  /** Colour step 0 … STEPS−1 by transit count. */
  readonly step: number;
  /** Index into `bands`: the night's instrument's band within its year row. */
  readonly band: number;
}

/** One instrument's band inside every year row, top to bottom in this order. */
export interface InstrumentBand {
  readonly instrumentId: string;
  /** The instrument's label, or its id when the archive holds no visible record of it. */
  readonly label: string;
  /** The label without the words every band's label shares at its start and end (the site's name, say). */
  readonly shortLabel: string;
}

export interface NightsLayout {
  /** Marks in date order, nights of one date in band order: the order roving focus moves in. */
  readonly marks: NightMark[];
  readonly years: number[];
  readonly limits: number[];
  readonly bands: InstrumentBand[];
}

/** Number of colour steps in the overview. */
export const STEPS = 5;
const MS_PER_DAY = 86_400_000;

/** The upper transit count of each colour step, from the largest count (steps of equal width). */
export function stepLimits(maxCount: number): number[] {
  const width = Math.max(1, Math.ceil(maxCount / STEPS));
  return Array.from({ length: STEPS }, (_, index) => (index + 1) * width);
}

/**
 * The bands: every instrument that has a night, in the order of `instruments` (the archive's
 * instruments by label), then instruments known only from nights, by id.
 */
function bandsOf(nights: readonly OverviewNight[], instruments: readonly Pick<InstrumentRecord, 'id' | 'label'>[]): InstrumentBand[] {
  const used = new Set(nights.map((n) => n.night.instrumentId));
  const named = instruments.filter((i) => used.has(i.id)).map((i) => ({ instrumentId: i.id, label: i.label }));
  const known = new Set(named.map((b) => b.instrumentId));
  for (const id of [...used].filter((u) => !known.has(u)).sort()) named.push({ instrumentId: id, label: id });
  const short = shortLabels(named.map((b) => b.label));
  return named.map((b, index) => ({ ...b, shortLabel: short[index] }));
}

/**
 * The labels without the whole words all of them share at the start and at the end
 * ("Hill transit (x)", "Hill camera (x)" → "transit", "camera"); a label left empty, or a single
 * label, stays whole.
 */
export function shortLabels(labels: readonly string[]): string[] {
  if (labels.length < 2) return [...labels];
  const words = labels.map((l) => l.split(/\s+/).filter((w) => w !== ''));
  const shortest = Math.min(...words.map((w) => w.length));
  let head = 0;
  while (head < shortest - 1 && words.every((w) => w[head] === words[0][head])) head++;
  let tail = 0;
  while (tail < shortest - head - 1 && words.every((w) => w[w.length - 1 - tail] === words[0][words[0].length - 1 - tail])) tail++;
  return words.map((w, index) => w.slice(head, w.length - tail).join(' ') || labels[index]);
}

/**
 * Lays the nights out by local date (`YYYY-MM-DD`) into year rows, one band per instrument in
 * each row, so that two instruments' nights of one date never hide each other; years without
 * nights are kept. Marks come out sorted by date, then band.
 */
export function layoutNights(nights: readonly OverviewNight[], instruments: readonly Pick<InstrumentRecord, 'id' | 'label'>[] = []): NightsLayout {
  let maxCount = 0;
  for (const n of nights) maxCount = Math.max(maxCount, n.transitCount);
  const limits = stepLimits(maxCount);
  const bands = bandsOf(nights, instruments);
  const bandOf = new Map(bands.map((b, index) => [b.instrumentId, index]));
  const marks = nights.map((summary) => {
    const [year, month, day] = summary.night.localDate.split('-').map(Number);
    const dayOfYear = (Date.UTC(year, month - 1, day) - Date.UTC(year, 0, 1)) / MS_PER_DAY;
    const step = limits.findIndex((limit) => summary.transitCount <= limit);
    return { summary, year, dayOfYear, step: step < 0 ? STEPS - 1 : step, band: bandOf.get(summary.night.instrumentId) ?? 0 };
  });
  marks.sort((a, b) => (a.summary.night.localDate < b.summary.night.localDate ? -1 : a.summary.night.localDate > b.summary.night.localDate ? 1 : a.band - b.band));
  let low = Infinity;
  let high = -Infinity;
  for (const mark of marks) { low = Math.min(low, mark.year); high = Math.max(high, mark.year); }
  const years = marks.length === 0 ? [] : Array.from({ length: high - low + 1 }, (_, i) => low + i);
  return { marks, years, limits, bands };
}
