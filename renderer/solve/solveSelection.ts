import type { ArchiveContent } from '../../core/archive-folder/archive-folder.ts';
import type { ArchiveDatabase } from '../store/database.ts';
import { allTransits } from '../store/transitGroups.ts';
import { keyedByCatalogueId } from '../store/keyedByCatalogueId.ts';

/**
 * What part of the archive a solve uses. `null` in a list means "all"; dates are local night
 * dates (YYYY-MM-DD, inclusive) as the night records store them, `null` for an open end.
 */
export interface SolveSelection {
  readonly starIds: readonly string[] | null;
  readonly instrumentIds: readonly string[] | null;
  readonly fromDate: string | null;
  readonly untilDate: string | null;
}

export const WHOLE_ARCHIVE: SolveSelection = { starIds: null, instrumentIds: null, fromDate: null, untilDate: null };

const visible = <T extends { readonly visibility: string }>(rows: readonly T[]): T[] => rows.filter((r) => r.visibility === 'visible');

/**
 * The visible records of the store that `selection` keeps, as one ArchiveContent that
 * core/archive-folder's writeArchiveFolder turns into folder files. Throws an Error naming the
 * problem when the archive does not hold exactly one site (the folder layout has one) or the
 * selection leaves no transit.
 */
export async function archiveContentFromStore(database: ArchiveDatabase, selection: SolveSelection): Promise<ArchiveContent> {
  const sites = visible(await database.sites.toArray());
  if (sites.length !== 1) {
    throw new Error(`The solve reads one site, but the archive holds ${sites.length} visible sites; remove or merge sites in the Archive view first.`);
  }
  const keepInstrument = (id: string): boolean => selection.instrumentIds === null || selection.instrumentIds.includes(id);
  const keepStar = (id: string): boolean => selection.starIds === null || selection.starIds.includes(id);
  const inSpan = (date: string): boolean => (selection.fromDate === null || date >= selection.fromDate) && (selection.untilDate === null || date <= selection.untilDate);
  const instruments = visible(await database.instruments.toArray()).filter((i) => keepInstrument(i.id));
  const events = visible(await database.instrumentEvents.toArray()).filter((e) => keepInstrument(e.instrumentId));
  const stars = visible(await database.stars.toArray()).filter((s) => keepStar(s.id));
  const nights = visible(await database.nights.toArray()).filter((n) => keepInstrument(n.instrumentId) && inSpan(n.localDate));
  const nightIds = new Set(nights.map((n) => n.id));
  const transits = visible(await allTransits(database)).filter((t) => nightIds.has(t.nightId) && keepStar(t.starId));
  if (transits.length === 0) {
    throw new Error('The chosen stars, instruments and dates leave no transit to solve; widen the selection.');
  }
  const usedNights = new Set(transits.map((t) => t.nightId));
  return keyedByCatalogueId({ site: sites[0], instruments, events, stars, nights: nights.filter((n) => usedNights.has(n.id)), transits });
}

