import type { InstrumentEventKind } from '../../core/archive/records.ts';

/** The event kinds the form offers, with the words it shows. */
export const EVENT_KINDS: readonly { readonly kind: InstrumentEventKind; readonly label: string }[] = [
  { kind: 'adjustment', label: 'Adjustment' },
  { kind: 'relevelling', label: 'Relevelling' },
  { kind: 'recollimation', label: 'Recollimation' },
  { kind: 'cleaning', label: 'Cleaning' },
  { kind: 'camera-change', label: 'Camera change' },
  { kind: 'clock-change', label: 'Clock change' },
  { kind: 'other', label: 'Other' },
];

export interface EventFormText {
  /** `YYYY-MM-DD`, UTC. */
  dateUtc: string;
  /** `HH:MM`, UTC; empty means 00:00. */
  timeUtc: string;
  kind: string;
  note: string;
}

export interface EventDraft {
  readonly utcMjd: number;
  readonly kind: InstrumentEventKind;
  readonly note: string;
}

export type EventFormErrors = Partial<Record<keyof EventFormText, string>>;
export type EventFormResult = { readonly kind: 'valid'; readonly draft: EventDraft } | { readonly kind: 'invalid'; readonly errors: EventFormErrors };

/** MJD of the Unix epoch 1970-01-01T00:00Z (definition of MJD: JD − 2400000.5). */
const UNIX_EPOCH_MJD = 40_587;
const MS_PER_DAY = 86_400_000;
/** Earliest date accepted: before it a typing slip is likelier than a real event (common practice). */
const EARLIEST_MJD = 15_020; // 1900-01-01

function parseDateMs(dateUtc: string): number | string {
  const match = /^(\d{4})-(\d{2})-(\d{2})$/.exec(dateUtc.trim());
  if (match === null) return 'write the date as YYYY-MM-DD, e.g. 2025-04-17';
  const [year, month, day] = [Number(match[1]), Number(match[2]), Number(match[3])];
  const ms = Date.UTC(year, month - 1, day);
  const back = new Date(ms);
  if (back.getUTCMonth() !== month - 1 || back.getUTCDate() !== day) return `${dateUtc.trim()} is not a calendar date`;
  return ms;
}

function parseTimeMs(timeUtc: string): number | string {
  const text = timeUtc.trim();
  if (text === '') return 0;
  const match = /^(\d{2}):(\d{2})$/.exec(text);
  if (match === null || Number(match[1]) > 23 || Number(match[2]) > 59) return 'write the time as HH:MM (UTC, 00:00–23:59) or leave it empty';
  return (Number(match[1]) * 60 + Number(match[2])) * 60_000;
}

/**
 * Checks the add-event form. `nowUtcMjd` is the present instant: an event may not lie more than a
 * day after it (events are logged after they happen) nor before 1900.
 */
export function parseEventForm(text: EventFormText, nowUtcMjd: number): EventFormResult {
  const errors: EventFormErrors = {};
  const kind = EVENT_KINDS.find((entry) => entry.kind === text.kind)?.kind;
  if (kind === undefined) errors.kind = 'choose what was done from the list';
  const dateMs = parseDateMs(text.dateUtc);
  const timeMs = parseTimeMs(text.timeUtc);
  if (typeof dateMs === 'string') errors.dateUtc = dateMs;
  if (typeof timeMs === 'string') errors.timeUtc = timeMs;
  if (typeof dateMs === 'number' && typeof timeMs === 'number') {
    const utcMjd = (dateMs + timeMs) / MS_PER_DAY + UNIX_EPOCH_MJD;
    if (utcMjd < EARLIEST_MJD) errors.dateUtc = 'the date is before 1900: check the year';
    else if (utcMjd > nowUtcMjd + 1) errors.dateUtc = 'the date is in the future: log an event after it was done';
    else if (kind !== undefined && Object.keys(errors).length === 0) return { kind: 'valid', draft: { utcMjd, kind, note: text.note.trim() } };
  }
  return { kind: 'invalid', errors };
}

/** The current instant as UTC MJD (renderer only; core has no clock). */
export function nowUtcMjd(): number {
  return Date.now() / MS_PER_DAY + UNIX_EPOCH_MJD;
}

/** `YYYY-MM-DD HH:MM:SS` UTC of an MJD, for display (seconds rounded down). */
export function formatUtcMjd(utcMjd: number, withSeconds = true): string {
  const iso = new Date(Math.round((utcMjd - UNIX_EPOCH_MJD) * MS_PER_DAY)).toISOString();
  return `${iso.slice(0, 10)} ${iso.slice(11, withSeconds ? 19 : 16)}`;
}
