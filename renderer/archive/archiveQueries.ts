import { Dexie } from 'dexie';
import type {
  InstrumentEventRecord, InstrumentRecord, NightRecord, StarRecord, TransitRecord,
} from '../../core/archive/records.ts';
import type { ArchiveDatabase } from '../store/database.ts';
import { readNightTallies } from '../store/nightTallies.ts';
import { transitCountsByStar, transitsOfNight } from '../store/transitGroups.ts';

/** What the overview needs of a night: its id, local date and instrument, and how many transits it holds. */
export interface OverviewNight {
  readonly night: Pick<NightRecord, 'id' | 'localDate' | 'instrumentId'>;
  readonly transitCount: number;
}

/** A night for the overview: its record and how many transits it holds. */
export interface NightSummary extends OverviewNight {
  readonly night: NightRecord;
}

/**
 * Every visible night in date order with its transit count, from the derived `nightTallies`
 * table (renderer/store/nightTallies.ts: kept true by every write of transits; a night without a
 * tally holds no visible transit). No transit record, key or index entry is read: at 1,000,000
 * transits over 10,000 nights one count per night through the `nightId` index took 25–40 s in
 * Chromium (2 shared cores), the tallies are 10,000 small rows. Counts are of visible transits,
 * user-rejected ones included.
 */
export async function loadNightSummaries(database: ArchiveDatabase): Promise<NightSummary[]> {
  return database.transaction('r', database.nights, database.nightTallies, async () => {
    const [nights, tallies] = await Promise.all([readNightsInPages(database), readNightTallies(database)]);
    const countOf = new Map(tallies.map((tally) => [tally.nightId, tally.transitCount]));
    nights.sort((a, b) => (a.localDate < b.localDate ? -1 : a.localDate > b.localDate ? 1 : 0));
    return nights.filter((night) => night.visibility === 'visible').map((night) => ({ night, transitCount: countOf.get(night.id) ?? 0 }));
  });
}

/** Nights read per request: each page is structured-cloned in its own main-thread task. */
const NIGHT_PAGE = 2000;

/**
 * Every night record, read in pages by primary key: one request for 10,000 nights (the demo's
 * kind, with weather, clock and level readings) was cloned into the page in one task of ~200 ms
 * on 2 shared cores; pages of 2,000 keep each task a fifth of that.
 */
async function readNightsInPages(database: ArchiveDatabase): Promise<NightRecord[]> {
  const all: NightRecord[] = [];
  for (;;) {
    const last = all.at(-1)?.id;
    const page = await (last === undefined ? database.nights.orderBy(':id') : database.nights.where(':id').above(last)).limit(NIGHT_PAGE).toArray();
    all.push(...page);
    if (page.length < NIGHT_PAGE) return all;
  }
}

/** One night with its transits (in time order) and the stars they refer to. */
export interface NightDetail {
  readonly night: NightRecord;
  readonly transits: readonly TransitRecord[];
  readonly stars: ReadonlyMap<string, StarRecord>;
  readonly instrument: InstrumentRecord | null;
}

/** Reads one night through the transit groups' `nightIds` index; null if the night is not in the archive. */
export async function loadNightDetail(database: ArchiveDatabase, nightId: string): Promise<NightDetail | null> {
  const night = await database.nights.get(nightId);
  if (night === undefined) return null;
  const transits = (await transitsOfNight(database, nightId)).filter((row) => row.visibility === 'visible');
  const starIds = [...new Set(transits.map((row) => row.starId))];
  const stars = await database.stars.bulkGet(starIds);
  const instrument = (await database.instruments.get(night.instrumentId)) ?? null;
  return {
    night, transits, instrument,
    stars: new Map(stars.filter((star): star is StarRecord => star !== undefined).map((star) => [star.id, star])),
  };
}

/** A programme star and the number of its transits in the archive. */
export interface StarSummary {
  readonly star: StarRecord;
  readonly transitCount: number;
}

/** The visible stars by catalogue id, each with its stored transits counted over the transit groups. */
export async function loadStarProgramme(database: ArchiveDatabase): Promise<StarSummary[]> {
  const stars = (await database.stars.orderBy('catalogueId').toArray()).filter((star) => star.visibility === 'visible');
  const counts = await transitCountsByStar(database);
  return stars.map((star) => ({ star, transitCount: counts.get(star.id) ?? 0 }));
}

/** An instrument with its events in time order. */
export interface InstrumentSummary {
  readonly instrument: InstrumentRecord;
  readonly events: readonly InstrumentEventRecord[];
}

/** The visible instruments by label, with events read through `[instrumentId+utcMjd]`. */
export async function loadInstruments(database: ArchiveDatabase): Promise<InstrumentSummary[]> {
  const instruments = (await database.instruments.orderBy('label').toArray()).filter((row) => row.visibility === 'visible');
  const events = await Promise.all(
    instruments.map((row) =>
      database.instrumentEvents.where('[instrumentId+utcMjd]').between([row.id, Dexie.minKey], [row.id, Dexie.maxKey]).toArray()),
  );
  return instruments.map((instrument, index) => ({
    instrument,
    events: events[index].filter((event) => event.visibility === 'visible'),
  }));
}
