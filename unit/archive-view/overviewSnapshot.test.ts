import { describe, expect, test } from 'vitest';
import { loadOverviewCopy, saveOverviewCopy } from '../../renderer/archive/overviewSnapshot.ts';

function memoryStorage() {
  const items = new Map<string, string>();
  return { items, getItem: (k: string) => items.get(k) ?? null, setItem: (k: string, v: string) => void items.set(k, v), removeItem: (k: string) => void items.delete(k) };
}

const night = (id: string, localDate: string, instrumentId: string, transitCount: number) => ({ night: { id, localDate, instrumentId }, transitCount });
const copy = {
  instruments: [{ id: 'mt', label: 'Meridian circle' }],
  // A night of an instrument the archive no longer names keeps its id as its label, as the overview shows it.
  nights: [night('n-1', '2024-05-01', 'mt', 12), night('n-2', '2024-05-02', 'ghost', 0)],
};

describe('overviewSnapshot', () => {
  test('saveOverviewCopy then loadOverviewCopy(same archive) gives every night back; another archive gets none', () => {
    const storage = memoryStorage();
    expect(saveOverviewCopy(storage, 'archive-a', copy)).toBe(true);
    const back = loadOverviewCopy(storage, 'archive-a');
    expect(back?.nights).toEqual(copy.nights);
    expect(back?.instruments).toEqual([{ id: 'mt', label: 'Meridian circle' }, { id: 'ghost', label: 'ghost' }]);
    expect(loadOverviewCopy(storage, 'archive-b')).toBeNull();
  });

  test('a copy with any damaged night (bad date, unknown instrument index, negative count) is not used at all', () => {
    const storage = memoryStorage();
    saveOverviewCopy(storage, 'archive-a', copy);
    const [key] = [...storage.items.keys()];
    const good = JSON.parse(storage.items.get(key) ?? '{}') as { nights: unknown[][] };
    for (const bad of [['n-3', '2024-5-3', 0, 1], ['n-3', '2024-05-03', 7, 1], ['n-3', '2024-05-03', 0, -1], ['n-3', '2024-05-03', 0]]) {
      storage.items.set(key, JSON.stringify({ ...good, nights: [...good.nights, bad] }));
      expect(loadOverviewCopy(storage, 'archive-a'), JSON.stringify(bad)).toBeNull();
    }
  });

  test('an archive of more nights than the copy holds (over 1,500,000 characters) keeps no copy, not even an older one', () => {
    const storage = memoryStorage();
    saveOverviewCopy(storage, 'archive-a', copy);
    const many = { ...copy, nights: Array.from({ length: 40_000 }, (_, i) => night(`night-with-a-long-identifier-${i}`, '2024-05-01', 'mt', 100)) };
    expect(saveOverviewCopy(storage, 'archive-a', many)).toBe(false);
    expect(loadOverviewCopy(storage, 'archive-a')).toBeNull();
  });

  test('unreadable text, a null instrument, or storage that refuses to write give no copy and throw nothing', () => {
    const storage = memoryStorage();
    saveOverviewCopy(storage, 'archive-a', copy);
    const [key] = [...storage.items.keys()];
    const good = JSON.parse(storage.items.get(key) ?? '{}') as { instruments: unknown[] };
    for (const text of ['{not json', 'null', '5', JSON.stringify({ ...good, instruments: [null] })]) {
      storage.items.set(key, text);
      expect(loadOverviewCopy(storage, 'archive-a'), text).toBeNull();
    }
    const refusing = { getItem: () => null, setItem: () => { throw new DOMException('full', 'QuotaExceededError'); }, removeItem: () => {} };
    expect(saveOverviewCopy(refusing, 'archive-a', copy)).toBe(false);
  });
});
