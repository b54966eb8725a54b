import { describe, expect, test } from 'vitest';
import { loadProgrammeInputs, saveProgrammeInputs } from '../../renderer/tonight/programmeSnapshot.ts';
import { starRow } from '../store/rowFactories.ts';

/** An in-memory Storage with a quota in characters, like localStorage's (which throws when full). */
function memoryStorage(quota = Infinity) {
  const items = new Map<string, string>();
  return {
    items,
    getItem: (key: string) => items.get(key) ?? null,
    setItem: (key: string, value: string) => {
      if (value.length > quota) throw new DOMException('quota exceeded', 'QuotaExceededError');
      items.set(key, value);
    },
    removeItem: (key: string) => void items.delete(key),
  };
}

const inputs = { sites: [{ id: 'site-1' }], instruments: [{ id: 'instr-1' }], stars: [starRow('s-1'), starRow('s-2')] } as unknown as Parameters<typeof saveProgrammeInputs>[2];

describe('programmeSnapshot', () => {
  test('saveProgrammeInputs then loadProgrammeInputs(same archive) gives the rows back; another archive gets none', () => {
    const storage = memoryStorage();
    expect(saveProgrammeInputs(storage, 'archive-a', inputs)).toBe(true);
    expect(loadProgrammeInputs(storage, 'archive-a')).toEqual(inputs);
    expect(loadProgrammeInputs(storage, 'archive-b')).toBeNull();
  });

  test('a damaged copy (bad JSON, rows without ids) is ignored, not half-used', () => {
    const storage = memoryStorage();
    saveProgrammeInputs(storage, 'archive-a', inputs);
    const [key] = [...storage.items.keys()];
    storage.items.set(key, '{"databaseName":"archive-a","sites":[{"id":"x"}],"instruments":[],"stars":[{"label":"no id"}]}');
    expect(loadProgrammeInputs(storage, 'archive-a')).toBeNull();
    storage.items.set(key, '{not json');
    expect(loadProgrammeInputs(storage, 'archive-a')).toBeNull();
    expect(loadProgrammeInputs(null, 'archive-a')).toBeNull();
  });

  test('a copy the storage refuses (quota) or over 1,000,000 characters is not kept, and an older one is not left behind', () => {
    expect(saveProgrammeInputs(memoryStorage(100), 'archive-a', inputs)).toBe(false);
    const storage = memoryStorage();
    saveProgrammeInputs(storage, 'archive-a', inputs);
    const many = { ...inputs, stars: Array.from({ length: 5000 }, (_, i) => starRow(`s-${i}`, { label: 'x'.repeat(200) })) };
    expect(saveProgrammeInputs(storage, 'archive-a', many)).toBe(false);
    expect(loadProgrammeInputs(storage, 'archive-a')).toBeNull();
  });
});
