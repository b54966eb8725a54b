import type { ClockComparison, NightRecord, TransitRecord, WeatherReading } from '../../core/archive/records.ts';
import type { ArchiveDatabase } from '../store/database.ts';
import { nowUtcIso } from '../store/nowUtcIso.ts';
import { recountNightTallies } from '../store/nightTallies.ts';
import { addTransit as storeTransit, transitsOfNight } from '../store/transitGroups.ts';

/** Tonight's night record of an instrument, or undefined before the first entry. */
export async function findNight(database: ArchiveDatabase, instrumentId: string, localDate: string): Promise<NightRecord | undefined> {
  const rows = await database.nights.where('[instrumentId+localDate]').equals([instrumentId, localDate]).toArray();
  return rows.find((row) => row.visibility === 'visible');
}

/** The transits logged on a night, in time order. */
export async function nightTransits(database: ArchiveDatabase, nightId: string): Promise<TransitRecord[]> {
  return (await transitsOfNight(database, nightId)).filter((row) => row.visibility === 'visible');
}

/** Finds tonight's night or creates it (inside one transaction, so two quick entries make one night). */
export async function ensureNight(database: ArchiveDatabase, siteId: string, instrumentId: string, localDate: string): Promise<NightRecord> {
  return database.transaction('rw', database.nights, async () => {
    const existing = await findNight(database, instrumentId, localDate);
    if (existing !== undefined) return existing;
    const now = nowUtcIso();
    const night: NightRecord = {
      id: crypto.randomUUID(), siteId, instrumentId, localDate, observer: '', weather: null, clockComparisons: [], levelReadings: [],
      collimationReadings: [], quality: 'good', note: 'logged in the Tonight view', visibility: 'visible', createdUtc: now, updatedUtc: now,
    };
    await database.nights.add(night);
    return night;
  });
}

/** What the log entry hands over for one accepted transit. */
export type TransitDraft = Pick<TransitRecord, 'starId' | 'culmination' | 'clamp' | 'clockMjd' | 'wireClockMjd' | 'utcMjd' | 'zenithReadings' | 'note'>;

/** Writes one accepted transit at once (creating the night on the first entry). */
export async function addTransit(database: ArchiveDatabase, night: NightRecord, draft: TransitDraft): Promise<TransitRecord> {
  const now = nowUtcIso();
  const record: TransitRecord = {
    id: crypto.randomUUID(), nightId: night.id, instrumentId: night.instrumentId, ...draft, weather: null, weight: 1, userRejected: false,
    flaggedOutlier: false, visibility: 'visible', createdUtc: now, updatedUtc: now,
  };
  await database.transaction('rw', [database.transitGroups, database.nights, database.nightTallies], async () => {
    await storeTransit(database, record);
    await recountNightTallies(database, [record.nightId]);
  });
  return record;
}

/** Adds a clock comparison to the night, kept in time order. */
export async function addClockComparison(database: ArchiveDatabase, night: NightRecord, comparison: ClockComparison): Promise<NightRecord> {
  const clockComparisons = [...night.clockComparisons, comparison].sort((a, b) => a.utcMjd - b.utcMjd);
  const updated: NightRecord = { ...night, clockComparisons, updatedUtc: nowUtcIso() };
  await database.nights.put(updated);
  return updated;
}

/** Sets the night's weather (the latest reading applies to the predictions that follow). */
export async function setNightWeather(database: ArchiveDatabase, night: NightRecord, weather: WeatherReading): Promise<NightRecord> {
  const updated: NightRecord = { ...night, weather, updatedUtc: nowUtcIso() };
  await database.nights.put(updated);
  return updated;
}
