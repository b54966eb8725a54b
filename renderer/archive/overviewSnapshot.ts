import { keepLaunchCopy, readLaunchCopy, type CopyStore } from '../store/launchCopy.ts';
import type { InstrumentRecord } from '../../core/archive/records.ts';
import type { OverviewNight } from './archiveQueries.ts';

/**
 * The nights overview as last read (each night's id, local date, instrument and transit count,
 * and the instruments' labels), kept in localStorage so that a launch shows it while the archive
 * opens: at 1,000,000 transits Chromium takes 1–3 s (2 shared cores) to open the archive's
 * IndexedDB store. A copy only, replaced by the archive's own rows as soon as it is open; nothing
 * is ever written from it, and a night cannot be opened from it.
 */
export interface OverviewCopy {
  readonly nights: readonly OverviewNight[];
  readonly instruments: readonly Pick<InstrumentRecord, 'id' | 'label'>[];
}

const KEY = 'meridian-ledger:archive-overview';
/** ~45 characters a night: 30,000 nights fit; a larger archive keeps no copy (localStorage holds ~5 MB per origin). */
const MAX_CHARACTERS = 1_500_000;

type Store = CopyStore;
type Packed = [id: string, localDate: string, instrumentIndex: number, transitCount: number];

/** The copy kept for `databaseName`, or null when there is none, it is of another archive, or any part of it is damaged. */
export function loadOverviewCopy(storage: Store | null, databaseName: string): OverviewCopy | null {
  const value = readLaunchCopy(storage, KEY) as { databaseName?: unknown; instruments?: unknown; nights?: unknown } | null;
  if (value === null || value.databaseName !== databaseName || !Array.isArray(value.instruments) || !Array.isArray(value.nights)) return null;
  const instruments = value.instruments as { id?: unknown; label?: unknown }[];
  if (!instruments.every((i) => typeof i === 'object' && i !== null && typeof i.id === 'string' && typeof i.label === 'string')) return null;
  const ids = instruments.map((i) => i.id as string);
  const nights: OverviewNight[] = [];
  for (const row of value.nights as unknown[]) {
    if (!Array.isArray(row) || row.length !== 4) return null;
    const [id, localDate, instrumentIndex, transitCount] = row as Packed;
    if (typeof id !== 'string' || typeof localDate !== 'string' || !/^\d{4}-\d{2}-\d{2}$/.test(localDate) || ids[instrumentIndex] === undefined
      || !Number.isInteger(transitCount) || transitCount < 0) return null;
    nights.push({ night: { id, localDate, instrumentId: ids[instrumentIndex] }, transitCount });
  }
  return { nights, instruments: instruments as OverviewCopy['instruments'] };
}

/** Keeps the copy for `databaseName`; returns false (and keeps none) when it is too large or storage refuses it. */
export function saveOverviewCopy(storage: Store | null, databaseName: string, copy: OverviewCopy): boolean {
  if (storage === null) return false;
  const instruments = [...copy.instruments.map((i) => ({ id: i.id, label: i.label }))];
  const index = new Map(instruments.map((i, k) => [i.id, k]));
  for (const n of copy.nights) {
    if (!index.has(n.night.instrumentId)) {
      index.set(n.night.instrumentId, instruments.length);
      instruments.push({ id: n.night.instrumentId, label: n.night.instrumentId });
    }
  }
  const nights = copy.nights.map((n): Packed => [n.night.id, n.night.localDate, index.get(n.night.instrumentId) ?? 0, n.transitCount]);
  return keepLaunchCopy(storage, KEY, { databaseName, instruments, nights }, MAX_CHARACTERS);
}
