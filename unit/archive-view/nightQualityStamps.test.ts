// The cheap change stamps of the overview's per-night cache (no transit body read): each way a
// transit can change (added, edited through the audit trail, committed by an import) must change
// its night's key and only its night's; a rewritten archive must be noticed.
import { describe, expect, test } from 'vitest';
import type { ImportRecord } from '../../core/archive/records.ts';
import { NightChangeLedger, nightStampKey, readNightStamps } from '../../renderer/archive/nightQualityStamps.ts';
import { ArchiveDatabase } from '../../renderer/store/database.ts';
import { rebuildNightTallies } from '../../renderer/store/nightTallies.ts';
import { nightRow, transitRow, uniqueDatabaseName } from '../store/rowFactories.ts';
import { putTransitRows, updateTransitRow } from '../store/transitRows.ts';

const NIGHTS = [nightRow('n-1'), nightRow('n-2'), nightRow('n-3')];

async function archive(): Promise<ArchiveDatabase> {
  const database = new ArchiveDatabase(uniqueDatabaseName('stamps'));
  await database.nights.bulkAdd(NIGHTS);
  await putTransitRows(database, [1, 2, 3].flatMap((n) => [1, 2].map((k) => transitRow(`t-${n}-${k}`, { nightId: `n-${n}` }))));
  return database;
}

// The tests write transits straight into the table; the tallies are then made as every writer of
// transits keeps them (renderer/store/nightTallies.ts) before the stamps are read.
async function keys(database: ArchiveDatabase, ledger: NightChangeLedger): Promise<{ keys: string[]; rewritten: boolean }> {
  await rebuildNightTallies(database);
  const { tallies, rewritten } = await readNightStamps(database, NIGHTS, ledger);
  return { rewritten, keys: NIGHTS.map((n) => nightStampKey('ctx', n, tallies.get(n.id) ?? 'missing', ledger.touched.get(n.id) ?? '')) };
}

const audit = (key: string, nightId: string) => ({ key, value: { atUtc: key.split('/')[1], editor: 'T', table: 'transits', recordId: 'x', summary: 's', before: null, after: { nightId } } });
const importRow = (id: string, status: ImportRecord['status']): ImportRecord => ({ id, fileName: 'f.csv', format: 'csv', status, startedUtc: '2026-01-01T00:00:00.000Z', finishedUtc: status === 'staging' ? null : '2026-01-01T00:01:00.000Z', rowCounts: {}, rejectedRows: [] });

describe('readNightStamps(database, nights, ledger)', () => {
  test('reads each night\'s tally and gives the same keys when nothing changed', async () => {
    const database = await archive();
    const ledger = new NightChangeLedger();
    const first = await keys(database, ledger);
    const tallies = (await readNightStamps(database, NIGHTS, new NightChangeLedger())).tallies;
    expect([...tallies.values()].map((t) => t.split('|').slice(0, 2).join('|'))).toEqual(['n=2|r=0', 'n=2|r=0', 'n=2|r=0']);
    expect(await keys(database, ledger)).toEqual(first);
    expect(new Set(first.keys).size).toBe(3);
  });

  test('a transit added changes only its night; two edits in one millisecond are both seen, whatever their uuid order', async () => {
    const database = await archive();
    const ledger = new NightChangeLedger();
    await database.settings.add(audit('audit/2026-01-01T00:00:00.000Z/5555', 'n-3'));
    const start = await keys(database, ledger);
    await putTransitRows(database, [transitRow('t-2-9', { nightId: 'n-2' })]);
    const added = await keys(database, ledger);
    expect(added.keys.map((k, i) => k === start.keys[i])).toEqual([true, false, true]);
    // Same instant as the newest seen key, but a uuid that sorts before it: must not be missed.
    await database.settings.add(audit('audit/2026-01-01T00:00:00.000Z/1111', 'n-1'));
    const edited = await keys(database, ledger);
    expect(edited.keys.map((k, i) => k === added.keys[i])).toEqual([false, true, true]);
    await database.settings.add(audit('audit/2026-01-02T00:00:00.000Z/0000', 'n-1'));
    const again = await keys(database, ledger);
    expect(again.keys.map((k, i) => k === edited.keys[i])).toEqual([false, true, true]);
    expect(await keys(database, ledger)).toEqual(again);
  });

  test('a transit rejected by hand changes its night\'s key through the tally, with no audit entry', async () => {
    const database = await archive();
    const ledger = new NightChangeLedger();
    const before = await keys(database, ledger);
    await updateTransitRow(database, 't-2-1', { userRejected: true });
    const after = await keys(database, ledger);
    expect(after.keys.map((k, i) => k === before.keys[i])).toEqual([true, false, true]);
  });

  test('an import committed changes the nights of its rows, not the others', async () => {
    const database = await archive();
    await database.imports.add(importRow('imp-1', 'staging'));
    await updateTransitRow(database, 't-3-1', { importId: 'imp-1', visibility: 'staged' });
    const ledger = new NightChangeLedger();
    const before = await keys(database, ledger);
    await updateTransitRow(database, 't-3-1', { visibility: 'visible' });
    await database.imports.put(importRow('imp-1', 'committed'));
    const after = await keys(database, ledger);
    expect(after.keys.map((k, i) => k === before.keys[i])).toEqual([true, true, false]);
  });

  test('an audit trail or import that vanished (a restore) is reported as a rewritten archive', async () => {
    const database = await archive();
    await database.settings.add(audit('audit/2026-01-01T00:00:00.000Z/5555', 'n-3'));
    const ledger = new NightChangeLedger();
    expect((await keys(database, ledger)).rewritten).toBe(false);
    await database.settings.clear();
    expect((await keys(database, ledger)).rewritten).toBe(true);
    const other = await archive();
    await other.imports.add(importRow('imp-2', 'committed'));
    const second = new NightChangeLedger();
    await keys(other, second);
    await other.imports.clear();
    expect((await keys(other, second)).rewritten).toBe(true);
  });
});
