import { describe, expect, test } from 'vitest';
import { Dexie } from 'dexie';
import { ArchiveDatabase } from '../../renderer/store/database.ts';
import { SCHEMA_V3 } from '../../renderer/store/schemaV3.ts';
import {
  addTransit, addTransits, allTransits, changeTransitsOfImport, getTransit, GROUP_MAX_SPAN_DAYS, GROUP_MAX_TRANSITS, groupTransits,
  removeTransitsOfImport, removeTransitsOfNights, replaceTransits, transitCountsByStar, transitsOfImport, transitsOfNight, transitsOfNights, transitsOfStar,
} from '../../renderer/store/transitGroups.ts';
import { nightRow, transitRow, uniqueDatabaseName } from './rowFactories.ts';

// Invented rows (rowFactories.ts). What is checked is the store's own contract (schemaV4.ts,
// transitGroups.ts): every transit written is read back unchanged by each way of finding it, and
// the groups keep their limits. The expected values are worked out by hand from the rows.

/** n transits of `starId`, one a night from MJD 61000.9 (`step` days apart), nights n-0, n-1, … */
function series(starId: string, n: number, step = 1, prefix = starId): ReturnType<typeof transitRow>[] {
  return Array.from({ length: n }, (_, k) => transitRow(`${prefix}-${String(k).padStart(4, '0')}`, { starId, nightId: `n-${k}`, utcMjd: 61_000.9 + k * step, importId: 'imp-1' }));
}

async function archiveWith(rows: readonly ReturnType<typeof transitRow>[]): Promise<ArchiveDatabase> {
  const database = new ArchiveDatabase(uniqueDatabaseName('groups'));
  await database.transaction('rw', database.transitGroups, () => addTransits(database, rows));
  return database;
}

describe('groupTransits', () => {
  test('cuts each star\'s run in time order at 64 transits and at the span limit; every transit lands once', () => {
    // 150 transits of star a, a night apart: 64 + 64 + 22. Star b: 3 transits 500 days apart: one group each (span 400).
    const rows = [...series('a', 150).reverse(), ...series('b', 3, 500)];
    const groups = groupTransits(rows);
    const ofA = groups.filter((g) => g.starId === 'a');
    expect(ofA.map((g) => g.transits.length)).toEqual([64, 64, 22]);
    expect(groups.filter((g) => g.starId === 'b').map((g) => g.transits.length)).toEqual([1, 1, 1]);
    expect(ofA[0].firstUtcMjd).toBe(61_000.9);
    expect(ofA[0].lastUtcMjd).toBe(61_000.9 + 63);
    expect(ofA[1].nightIds).toEqual(Array.from({ length: 64 }, (_, k) => `n-${64 + k}`));
    expect(ofA[1].importIds).toEqual(['imp-1']);
    for (const g of groups) {
      expect(g.transits.length).toBeLessThanOrEqual(GROUP_MAX_TRANSITS);
      expect(g.lastUtcMjd - g.firstUtcMjd).toBeLessThanOrEqual(GROUP_MAX_SPAN_DAYS);
      expect([...g.transits].sort((x, y) => x.utcMjd - y.utcMjd)).toEqual(g.transits);
    }
    expect(groups.flatMap((g) => g.transits.map((t) => t.id)).sort()).toEqual(rows.map((t) => t.id).sort());
  });
});

describe('the transit groups in IndexedDB (fake-indexeddb)', () => {
  test('night, star range, import and count queries each find exactly their transits, unchanged', async () => {
    const rows = [...series('a', 130), ...series('b', 70), transitRow('lone', { starId: 'c', nightId: 'n-5', utcMjd: 61_005.95 })];
    const database = await archiveWith(rows);
    expect(await database.transitGroups.count()).toBe(3 + 2 + 1);
    expect((await allTransits(database)).map((t) => t.id)).toEqual(rows.map((t) => t.id).sort());
    expect(await allTransits(database)).toStrictEqual([...rows].sort((x, y) => (x.id < y.id ? -1 : 1)));
    // Night n-5 holds a-0005, b-0005 and lone (utcMjd 61005.9, 61005.9, 61005.95): time order, ties by id.
    expect((await transitsOfNight(database, 'n-5')).map((t) => t.id)).toEqual(['a-0005', 'b-0005', 'lone']);
    expect((await transitsOfNights(database, ['n-100', 'n-5'])).map((t) => t.id)).toEqual(['a-0100', 'a-0005', 'b-0005', 'lone']);
    // Star a from 61050.9 to 61070.9 inclusive: k = 50 … 70 (21 transits), across its first and second group.
    expect((await transitsOfStar(database, 'a', 61_050.9, 61_070.9)).map((t) => t.id)).toEqual(Array.from({ length: 21 }, (_, k) => `a-${String(50 + k).padStart(4, '0')}`));
    expect((await transitsOfStar(database, 'a')).length).toBe(130);
    expect((await transitsOfImport(database, 'imp-1')).length).toBe(200);
    expect(Object.fromEntries(await transitCountsByStar(database))).toEqual({ a: 130, b: 70, c: 1 });
    expect(await getTransit(database, 'n-5', 'lone')).toStrictEqual(rows.at(-1));
    expect(await getTransit(database, 'n-6', 'lone')).toBeUndefined();
    database.close();
  });

  test('a live entry joins a group of its star with room, else starts one', async () => {
    const database = await archiveWith(series('a', 64));
    await database.transaction('rw', database.transitGroups, async () => {
      await addTransit(database, transitRow('live-1', { starId: 'a', nightId: 'n-64', utcMjd: 61_064.9 })); // first group is full: new group
      await addTransit(database, transitRow('live-2', { starId: 'a', nightId: 'n-65', utcMjd: 61_065.9 })); // joins live-1's group
      await addTransit(database, transitRow('live-3', { starId: 'a', nightId: 'n-900', utcMjd: 61_900.9 })); // > 400 days after: new group
    });
    const groups = await database.transitGroups.toArray();
    expect(groups.map((g) => g.transits.map((t) => t.id).filter((id) => id.startsWith('live'))).filter((ids) => ids.length > 0).sort()).toEqual([['live-1', 'live-2'], ['live-3']]);
    expect((await transitsOfStar(database, 'a', 61_060, 61_070)).map((t) => t.id)).toEqual(['a-0060', 'a-0061', 'a-0062', 'a-0063', 'live-1', 'live-2']);
    database.close();
  });

  test('replaceTransits changes only the named transits; one stretched far in time moves to a group of its own; an unknown id changes nothing', async () => {
    const rows = series('a', 10);
    const database = await archiveWith(rows);
    const edited = { ...rows[3], note: 'cloud', userRejected: true };
    const moved = { ...rows[4], utcMjd: 61_004.9 + 1_000 };
    await database.transaction('rw', database.transitGroups, () => replaceTransits(database, [edited, moved]));
    const after = await allTransits(database);
    expect(after).toStrictEqual([...rows.slice(0, 3), edited, moved, ...rows.slice(5)]);
    expect((await database.transitGroups.toArray()).map((g) => g.transits.length).sort()).toEqual([1, 9]);
    expect((await transitsOfStar(database, 'a', 62_000, 62_010)).map((t) => t.id)).toEqual(['a-0004']);
    await expect(database.transaction('rw', database.transitGroups, () => replaceTransits(database, [{ ...rows[0], note: 'x' }, transitRow('ghost', { nightId: 'n-1' })])))
      .rejects.toThrow(/no stored transit with id "ghost" in night "n-1"/);
    expect(await allTransits(database)).toStrictEqual(after);
    database.close();
  });

  test('removal by import or night, and a change of every transit of an import', async () => {
    const rows = [...series('a', 5), transitRow('mine', { starId: 'a', nightId: 'n-2', utcMjd: 61_002.95 })];
    const database = await archiveWith(rows);
    await database.transaction('rw', database.transitGroups, async () => {
      expect(await changeTransitsOfImport(database, 'imp-1', (t) => ({ ...t, visibility: 'staged' }))).toBe(5);
      expect((await removeTransitsOfNights(database, ['n-2'], (t) => t.visibility === 'staged')).map((t) => t.id)).toEqual(['a-0002']);
      expect((await removeTransitsOfImport(database, 'imp-1')).map((t) => t.id)).toEqual(['a-0000', 'a-0001', 'a-0003', 'a-0004']);
    });
    expect(await allTransits(database)).toStrictEqual([rows[5]]);
    await database.transaction('rw', database.transitGroups, () => removeTransitsOfNights(database, ['n-2']));
    expect(await database.transitGroups.count()).toBe(0);
    database.close();
  });
});

describe('the version 4 upgrade', () => {
  test('a version 3 archive of 20,050 transits (more than one page) opens with every row in groups, unchanged', async () => {
    const name = uniqueDatabaseName('v3-to-v4');
    const old = new Dexie(name);
    old.version(3).stores(SCHEMA_V3);
    await old.open();
    await old.table('nights').bulkAdd([nightRow('night-1'), nightRow('night-2', { localDate: '2026-01-02' })]);
    // Ids not in time order (k·7919 mod 20050 is a permutation, 7919 being prime to 20050), two stars, one staged row.
    const rows = Array.from({ length: 20_050 }, (_, k) => transitRow(`t-${String((k * 7919) % 20_050).padStart(5, '0')}`, {
      starId: k % 2 === 0 ? 'star-even' : 'star-odd', nightId: k < 10_000 ? 'night-1' : 'night-2', utcMjd: 61_000 + k / 1000,
      visibility: k === 17 ? 'staged' : 'visible', importId: k === 17 ? 'imp-unfinished' : undefined,
    }));
    await old.table('transits').bulkAdd(rows);
    old.close();
    const progress: [number, number][] = [];
    const database = new ArchiveDatabase(name, { onUpgradeProgress: (done, total) => progress.push([done, total]) });
    await database.open();
    expect(database.verno).toBe(4);
    // Read in pages of 20,000 (20,000 then 20,050), then written: out of 2 × 20,050, ending at the total, never going back.
    expect(progress.slice(0, 3)).toEqual([[0, 40_100], [20_000, 40_100], [20_050, 40_100]]);
    expect(progress.at(-1)).toEqual([40_100, 40_100]);
    expect(progress.every(([done], k) => k === 0 || done >= progress[k - 1][0])).toBe(true);
    expect(database.tables.map((t) => t.name)).not.toContain('transits');
    expect(await allTransits(database)).toStrictEqual([...rows].sort((a, b) => (a.id < b.id ? -1 : 1)));
    // 10,025 transits a star over 20.05 days: ⌈10025 / 64⌉ = 157 groups each.
    expect(await database.transitGroups.count()).toBe(2 * 157);
    expect((await transitsOfNight(database, 'night-2')).length).toBe(10_050);
    expect((await transitsOfImport(database, 'imp-unfinished')).map((t) => t.visibility)).toEqual(['staged']);
    database.close();
  });
});
