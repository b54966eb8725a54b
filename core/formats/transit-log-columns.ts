/** How the wire times of a transit log are laid out, decided from the header. */
export interface TransitLogLayout {
  readonly timeKind: 'utc' | 'clock';
  /** Separate columns wire<N>Utc / wire<N>ClockS (wire numbers 1-based), or one list column. */
  readonly wireColumns: readonly { readonly name: string; readonly wireNumber: number }[];
  readonly listColumn: string | null;
  readonly unknownColumns: readonly string[];
}

/** Columns of the transit log other than the wire times (see FORMATS.md). */
export const TRANSIT_LOG_COLUMNS = [
  'starId',
  'culmination',
  'clamp',
  'nightDate',
  'instrumentId',
  'observer',
  'micrometerTurns',
  'offsetPx',
  'zenithDistanceDeg',
  'temperatureC',
  'pressureHpa',
  'humidityPercent',
  'weight',
  'flags',
  'note',
] as const;

export const REQUIRED_TRANSIT_LOG_COLUMNS = ['starId', 'culmination'] as const;

const WIRE_COLUMN = /^wire([1-9]\d?)(Utc|ClockS)$/;
const LIST_COLUMNS: Record<string, 'utc' | 'clock'> = { wireTimesUtc: 'utc', wireTimesClockS: 'clock' };

/**
 * Reads the header of a transit log: which time kind and layout it uses, and which columns are
 * unknown (reported as a warning by the parser, never dropped silently). Returns the reason
 * when the header cannot be used: a required column missing, no time column, UTC and clock times
 * mixed, or wire columns and a list column both present.
 */
export function analyseTransitLogHeader(header: readonly string[]): TransitLogLayout | { readonly problem: string } {
  for (const name of REQUIRED_TRANSIT_LOG_COLUMNS) {
    if (!header.includes(name)) return { problem: `required column '${name}' is missing` };
  }
  const kinds = new Set<'utc' | 'clock'>();
  const wireColumns: { name: string; wireNumber: number }[] = [];
  const lists: string[] = [];
  const unknownColumns: string[] = [];
  for (const name of header) {
    const wire = WIRE_COLUMN.exec(name);
    if (wire) {
      kinds.add(wire[2] === 'Utc' ? 'utc' : 'clock');
      wireColumns.push({ name, wireNumber: Number(wire[1]) });
    } else if (name in LIST_COLUMNS) {
      kinds.add(LIST_COLUMNS[name]);
      lists.push(name);
    } else if (!(TRANSIT_LOG_COLUMNS as readonly string[]).includes(name)) unknownColumns.push(name);
  }
  if (kinds.size === 0) return { problem: 'no time column; add wire1Utc, wire2Utc, … (or wire1ClockS, …) or one list column wireTimesUtc / wireTimesClockS' };
  if (kinds.size > 1) return { problem: 'the header mixes UTC and clock-time columns; use one kind per file' };
  if (lists.length > 1 || (lists.length === 1 && wireColumns.length > 0)) {
    return { problem: 'the header has both wire<N> columns and a wireTimes list column (or two lists); use one layout per file' };
  }
  wireColumns.sort((a, b) => a.wireNumber - b.wireNumber);
  return { timeKind: [...kinds][0], wireColumns, listColumn: lists[0] ?? null, unknownColumns };
}
