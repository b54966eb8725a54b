import { keepLaunchCopy, readLaunchCopy, type CopyStore } from '../store/launchCopy.ts';
import type { InstrumentRecord, SiteRecord, StarRecord } from '../../core/archive/records.ts';

/**
 * What Tonight's programme needs from the archive — the visible sites, instruments and programme
 * stars — kept in localStorage as last read, so that a launch shows the programme before the
 * archive has opened: at 1,000,000 transits Chromium takes 1–3 s (2 shared cores) to open the
 * archive's IndexedDB store, the programme itself ~0.2 s. A copy only: it is replaced by what the
 * archive holds as soon as the archive is open, and nothing is ever written from it.
 */
export interface ProgrammeInputs {
  readonly sites: readonly SiteRecord[];
  readonly instruments: readonly InstrumentRecord[];
  readonly stars: readonly StarRecord[];
}

const KEY = 'meridian-ledger:tonight-programme-inputs';
/** A larger copy (a programme of many thousand stars) is not kept: localStorage holds ~5 MB per origin. */
const MAX_CHARACTERS = 1_000_000;

type Store = CopyStore;

const hasIds = (rows: unknown): rows is { id: string }[] =>
  Array.isArray(rows) && rows.every((row) => typeof row === 'object' && row !== null && typeof (row as { id?: unknown }).id === 'string');

/** The copy kept for `databaseName`, or null when there is none, it is of another archive, or it is damaged. */
export function loadProgrammeInputs(storage: Store | null, databaseName: string): ProgrammeInputs | null {
  // Unreadable JSON or storage refused: start as without a copy.
  const value = readLaunchCopy(storage, KEY) as { databaseName?: unknown; sites?: unknown; instruments?: unknown; stars?: unknown } | null;
  if (value === null || value.databaseName !== databaseName || !hasIds(value.sites) || !hasIds(value.instruments) || !hasIds(value.stars)) return null;
  return { sites: value.sites as SiteRecord[], instruments: value.instruments as InstrumentRecord[], stars: value.stars as StarRecord[] };
}

/** Keeps the copy for `databaseName`; returns false (and keeps none) when it is too large or storage refuses it. */
export function saveProgrammeInputs(storage: Store | null, databaseName: string, inputs: ProgrammeInputs): boolean {
  // Too large, or quota or privacy settings: the next launch waits for the archive, as before.
  return keepLaunchCopy(storage, KEY, { databaseName, sites: inputs.sites, instruments: inputs.instruments, stars: inputs.stars }, MAX_CHARACTERS);
}
