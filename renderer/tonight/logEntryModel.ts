import type { InstrumentRecord, TransitRecord } from '../../core/archive/records.ts';
import type { ClampPosition } from '../../core/instrument/culmination.ts';
import { DEG, SECONDS_PER_DAY } from '../../core/units.ts';
import { findProgrammeStar, parseReading, parseWireTimes, type FieldResult, type LogDraftFields, type WireEntry } from './entryParsing.ts';
import { checkEntry, zenithOfReadingRad, type EntryCheck, type Tolerances } from './observedMinusComputed.ts';
import type { ProgrammeRow } from './programmeRows.ts';
import type { TransitDraft } from './tonightStore.ts';

/** Everything the entry needs to judge what is typed. */
export interface EntryContext {
  readonly rows: readonly ProgrammeRow[];
  readonly nextIndex: number;
  readonly loggedKeys: ReadonlySet<string>;
  readonly nowUtcMjd: number;
  readonly instrument: InstrumentRecord;
  readonly zeroPointDeg: number;
  readonly clamp: ClampPosition;
  readonly tolerances: Tolerances;
}

/** The typed entry judged field by field; `check` only when every field is acceptable. */
export interface JudgedEntry {
  readonly row: FieldResult<ProgrammeRow>;
  readonly wires: FieldResult<WireEntry> | null;
  readonly reading: FieldResult<number | null>;
  readonly check: EntryCheck | null;
}

/** Predicted clock time of a row (UTC when no clock offset is known), MJD. */
export const predictedClockMjd = (row: ProgrammeRow): number => row.clockMjd ?? row.transit.utcMjd;

/** The row a star id means: that star's unlogged transit nearest now; empty id = the next star. */
export function rowForStar(catalogueId: string, context: EntryContext): FieldResult<ProgrammeRow> {
  const open = context.rows.filter((row) => !context.loggedKeys.has(row.key));
  if (catalogueId.trim() === '') {
    const next = context.rows[context.nextIndex];
    return next === undefined ? { ok: false, reason: 'no transit left tonight; type a star id' } : { ok: true, value: next };
  }
  const star = findProgrammeStar(catalogueId, open.map((row) => row.star));
  if (!star.ok) return star;
  const candidates = open.filter((row) => row.star.id === star.value.id);
  const nearest = candidates.reduce((best, row) => (Math.abs(row.transit.utcMjd - context.nowUtcMjd) < Math.abs(best.transit.utcMjd - context.nowUtcMjd) ? row : best));
  return { ok: true, value: nearest };
}

/** Judges the three fields and, when all pass, computes the O−C as typed. */
export function judgeEntry(draft: LogDraftFields, context: EntryContext): JudgedEntry {
  const row = rowForStar(draft.starCatalogueId, context);
  const zenithDeg = (value: number) => zenithOfReadingRad(value, context.instrument, context.zeroPointDeg) / DEG;
  const reading = parseReading(draft.readingText, zenithDeg);
  if (!row.ok) return { row, wires: null, reading, check: null };
  const predicted = predictedClockMjd(row.value);
  const wireCount = Math.max(1, context.instrument.wireIntervalsEquatorialS.length);
  const wires = draft.wiresText.trim() === '' ? null : parseWireTimes(draft.wiresText, wireCount, predicted);
  if (wires === null || !wires.ok || !reading.ok) return { row, wires, reading, check: null };
  const others = context.rows.filter((other) => other.star.id !== row.value.star.id).map((other) => ({ catalogueId: other.star.catalogueId, predictedClockMjd: predictedClockMjd(other) }));
  const check = checkEntry(row.value, predicted, wires.value, reading.value, context.instrument, context, others);
  return { row, wires, reading, check };
}

/**
 * The transit to store for an accepted entry; `clockMinusUtcS` null means the clock is taken as
 * UTC. `clamp` is the night's clamp setting ('none' for an instrument that is not reversed: not stored).
 */
export function transitDraftOf(row: ProgrammeRow, wires: WireEntry, reading: number | null, check: EntryCheck, clockMinusUtcS: number | null, clamp: ClampPosition): TransitDraft {
  const complete = !wires.single && wires.wireClockMjd.every((t) => t !== null);
  const missed = wires.wireClockMjd.flatMap((t, k) => (t === null ? [k + 1] : []));
  const notes = [
    wires.single ? 'one time typed (mean wire)' : '',
    missed.length > 0 ? `wires missed: ${missed.join(', ')}; typed: ${wires.wireClockMjd.map((t) => (t === null ? '-' : t.toFixed(9))).join(' ')}` : '',
    clockMinusUtcS === null ? 'no clock offset known at entry: clock taken as UTC' : '',
    check.hints.length > 0 ? `flagged at entry: ${check.hints[0]}` : '',
  ].filter((text) => text !== '');
  return {
    starId: row.star.id, culmination: row.transit.culmination, ...(clamp === 'none' ? {} : { clamp }), clockMjd: check.meanClockMjd,
    wireClockMjd: complete ? (wires.wireClockMjd as number[]) : [],
    utcMjd: check.meanClockMjd - (clockMinusUtcS ?? 0) / SECONDS_PER_DAY,
    zenithReadings: reading === null ? [] : [reading], note: notes.join('; '),
  };
}

/** The O−C of a stored transit against tonight's programme row it belongs to, or null when none matches. */
export function checkStored(transit: TransitRecord, context: EntryContext): { row: ProgrammeRow; check: EntryCheck } | null {
  const row = context.rows.find((r) => r.star.id === transit.starId && r.transit.culmination === transit.culmination && Math.abs(r.transit.utcMjd - transit.utcMjd) < 20 / 1440);
  if (row === undefined) return null;
  const wires: WireEntry = transit.wireClockMjd.length > 0 ? { wireClockMjd: transit.wireClockMjd, single: false } : { wireClockMjd: [transit.clockMjd], single: true };
  return { row, check: checkEntry(row, predictedClockMjd(row), wires, transit.zenithReadings[0] ?? null, context.instrument, context, []) };
}
