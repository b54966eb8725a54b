import { describe, expect, test } from 'vitest';
import { UNCONTROLLED } from '../../core/task/task-control.ts';
import { ArchiveDatabase } from '../../renderer/store/database.ts';
import { exportBundle } from '../../renderer/exchange/bundleExport.ts';
import { forgetVerifiedBundle, verifyBundleOnce } from '../../renderer/exchange/verifiedBundleCache.ts';
import { runExchangeTask } from '../../renderer/worker/tasks/exchangeTasks.ts';
import { nightRow, siteRow, transitRow, uniqueDatabaseName } from '../store/rowFactories.ts';
import { putTransitRows, storedTransitCount } from '../store/transitRows.ts';

// Invented rows; what matters is which bytes are checked and restored.
async function bundleOf(transits: number): Promise<Uint8Array> {
  const source = new ArchiveDatabase(uniqueDatabaseName('cache-source'));
  await source.sites.put(siteRow('site-1'));
  await source.nights.put(nightRow('night-1'));
  await putTransitRows(source, Array.from({ length: transits }, (_, k) => transitRow(`t-${k}`, { utcMjd: 61_000 + k / 100 })));
  const { bytes } = await exportBundle(source, UNCONTROLLED, '2026-12-02T07:00:00.000Z', 'test');
  source.close();
  return bytes;
}

describe('verifyBundleOnce(database, bytes)', () => {
  test('reuses the check only for byte-identical bytes and the same archive; forget drops it', async () => {
    forgetVerifiedBundle();
    const bytes = await bundleOf(3);
    const target = new ArchiveDatabase(uniqueDatabaseName('cache-target'));
    const first = await verifyBundleOnce(target, bytes, UNCONTROLLED);
    expect(await verifyBundleOnce(target, bytes.slice(), UNCONTROLLED)).toBe(first); // a fresh copy of the same bytes
    const other = new ArchiveDatabase(uniqueDatabaseName('cache-other'));
    expect(await verifyBundleOnce(other, bytes, UNCONTROLLED)).not.toBe(first);
    const different = await bundleOf(4);
    const second = await verifyBundleOnce(other, different, UNCONTROLLED);
    expect(second.rows.get('transits')).toHaveLength(4);
    forgetVerifiedBundle();
    expect(await verifyBundleOnce(other, different, UNCONTROLLED)).not.toBe(second);
    forgetVerifiedBundle();
    target.close();
    other.close();
  });

  test('the worker task restores what the preview checked, and checks anew bytes that differ from it', async () => {
    const name = uniqueDatabaseName('cache-task');
    const previewed = await bundleOf(5);
    const preview = await runExchangeTask({ kind: 'bundle-verify', databaseName: name, bytes: previewed }, UNCONTROLLED);
    expect(preview).toMatchObject({ kind: 'bundle-verify', archiveRows: 0 });
    // A damaged copy sent for the restore must not pass on the strength of the preview's check.
    const damaged = previewed.slice(0, previewed.length - 40);
    await expect(runExchangeTask({ kind: 'bundle-restore', databaseName: name, bytes: damaged, mode: 'into-empty' }, UNCONTROLLED)).rejects.toThrow(/damaged or cut short/);
    await runExchangeTask({ kind: 'bundle-verify', databaseName: name, bytes: previewed }, UNCONTROLLED);
    const restored = await runExchangeTask({ kind: 'bundle-restore', databaseName: name, bytes: previewed.slice(), mode: 'into-empty' }, UNCONTROLLED);
    expect(restored).toMatchObject({ kind: 'bundle-restore', rowCounts: { transits: 5, nights: 1, sites: 1 } });
    const database = new ArchiveDatabase(name);
    expect(await storedTransitCount(database)).toBe(5);
    expect(await database.nightTallies.count()).toBe(1);
    database.close();
  });
});
