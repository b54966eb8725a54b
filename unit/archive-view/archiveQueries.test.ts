import { describe, expect, test } from 'vitest';
import { ArchiveDatabase } from '../../renderer/store/database.ts';
import { loadInstruments, loadNightDetail, loadNightSummaries, loadStarProgramme } from '../../renderer/archive/archiveQueries.ts';
import { rebuildNightTallies } from '../../renderer/store/nightTallies.ts';
import { nightRow, starRow, transitRow, uniqueDatabaseName } from '../store/rowFactories.ts';
import { putTransitRows } from '../store/transitRows.ts';

// Invented rows; the checks count what was written.
async function filled(): Promise<ArchiveDatabase> {
  const database = new ArchiveDatabase(uniqueDatabaseName('queries'));
  await database.nights.bulkAdd([nightRow('n-2', { localDate: '2026-01-03' }), nightRow('n-1', { localDate: '2026-01-02' }), nightRow('n-3', { localDate: '2026-01-04' })]);
  await database.stars.bulkAdd([starRow('s-b', { catalogueId: 'B' }), starRow('s-a', { catalogueId: 'A' }), starRow('s-c', { catalogueId: 'C', visibility: 'staged' })]);
  await putTransitRows(database, [
    transitRow('t-1', { nightId: 'n-1', starId: 's-a', utcMjd: 61_002.9 }),
    transitRow('t-2', { nightId: 'n-1', starId: 's-b', utcMjd: 61_002.8 }),
    transitRow('t-3', { nightId: 'n-2', starId: 's-a', utcMjd: 61_003.9 }),
  ]);
  // Rows written straight into the tables: the tallies then made as every writer of transits keeps them.
  await rebuildNightTallies(database);
  return database;
}

describe('archive queries', () => {
  test('loadNightSummaries gives nights in date order with their transit counts', async () => {
    const summaries = await loadNightSummaries(await filled());
    expect(summaries.map((s) => [s.night.localDate, s.transitCount])).toEqual([['2026-01-02', 2], ['2026-01-03', 1], ['2026-01-04', 0]]);
  });

  test('loadNightSummaries counts from the tallies: a staged transit is not counted, an invisible night not listed', async () => {
    const database = await filled();
    await database.nights.add(nightRow('n-4', { localDate: '2026-01-01', visibility: 'staged' }));
    await putTransitRows(database, [transitRow('t-4', { nightId: 'n-3', starId: 's-a', visibility: 'staged' }), transitRow('t-5', { nightId: 'n-4', starId: 's-a' })]);
    await rebuildNightTallies(database);
    const summaries = await loadNightSummaries(database);
    expect(summaries.map((s) => [s.night.id, s.transitCount])).toEqual([['n-1', 2], ['n-2', 1], ['n-3', 0]]);
  });

  test('loadNightDetail gives the transits of one night in time order and their stars', async () => {
    const detail = await loadNightDetail(await filled(), 'n-1');
    expect(detail?.transits.map((t) => t.id)).toEqual(['t-2', 't-1']);
    expect([...(detail?.stars.keys() ?? [])].sort()).toEqual(['s-a', 's-b']);
    expect(await loadNightDetail(await filled(), 'n-9')).toBeNull();
  });

  test('loadStarProgramme counts transits per visible star', async () => {
    const programme = await loadStarProgramme(await filled());
    expect(programme.map((s) => [s.star.catalogueId, s.transitCount])).toEqual([['A', 2], ['B', 1]]);
  });

  test('loadInstruments lists events in time order per instrument', async () => {
    const database = await filled();
    await database.instruments.add({
      id: 'instr-1', label: 'Tube', kind: 'zenith-tube', siteId: 'site-1', readingUnit: 'pixel', readingScaleArcsecPerUnit: 0.5,
      readingSense: 1, wireIntervalsEquatorialS: [], effectiveWavelengthNm: 600, clockLabel: 'pier clock', note: '',
      visibility: 'visible', createdUtc: 'x', updatedUtc: 'x',
    });
    const stamp = { visibility: 'visible', createdUtc: 'x', updatedUtc: 'x', note: '' } as const;
    await database.instrumentEvents.bulkAdd([
      { id: 'e-2', instrumentId: 'instr-1', utcMjd: 61_005, kind: 'cleaning', ...stamp },
      { id: 'e-1', instrumentId: 'instr-1', utcMjd: 61_001, kind: 'adjustment', ...stamp },
      { id: 'e-3', instrumentId: 'other', utcMjd: 61_000, kind: 'adjustment', ...stamp },
    ]);
    const instruments = await loadInstruments(database);
    expect(instruments.map((i) => i.events.map((e) => e.id))).toEqual([['e-1', 'e-2']]);
  });
});

describe('loadNightSummaries over pages', () => {
  test('4,500 nights (three pages of 2,000) come back once each, in date order, with their counts', async () => {
    const database = new ArchiveDatabase(uniqueDatabaseName('queries-pages'));
    // Ids in the reverse order of the dates, so that key order and date order differ.
    const nights = Array.from({ length: 4500 }, (_, i) => nightRow(`n-${String(4500 - i).padStart(5, '0')}`, { localDate: new Date(Date.UTC(2000, 0, 1 + i)).toISOString().slice(0, 10) }));
    await database.nights.bulkAdd(nights);
    await putTransitRows(database, [transitRow('t-1', { nightId: 'n-00007' }), transitRow('t-2', { nightId: 'n-00007' })]);
    await rebuildNightTallies(database);
    const summaries = await loadNightSummaries(database);
    expect(summaries).toHaveLength(4500);
    expect(new Set(summaries.map((s) => s.night.id)).size).toBe(4500);
    const dates = summaries.map((s) => s.night.localDate);
    expect(dates).toEqual([...dates].sort());
    expect(summaries.filter((s) => s.transitCount > 0).map((s) => [s.night.id, s.transitCount])).toEqual([['n-00007', 2]]);
  });
});
