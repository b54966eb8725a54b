import { describe, expect, test } from 'vitest';
import { BundleWriter } from '../../core/archive/bundle-writer.ts';
import { encodeUtf8 } from '../../core/text/utf8-encode.ts';
import { UNCONTROLLED } from '../../core/task/task-control.ts';
import { ArchiveDatabase } from '../../renderer/store/database.ts';
import { exportBundle } from '../../renderer/exchange/bundleExport.ts';
import { restoreBundle, verifyBundle } from '../../renderer/exchange/bundleRestore.ts';
import { archiveTableNames, readTableRows } from '../../renderer/store/archiveTables.ts';
import { gunzipBytes, gzipBytes } from '../../renderer/exchange/gzip.ts';
import { nightRow, siteRow, starRow, transitRow, uniqueDatabaseName } from '../store/rowFactories.ts';
import { putTransitRows, storedTransitCount } from '../store/transitRows.ts';

/** Deep equality where every number is compared with Object.is (−0 ≠ 0, NaN = NaN, every bit). */
function sameBits(a: unknown, b: unknown, path = ''): string[] {
  if (typeof a === 'number' || typeof b === 'number') return Object.is(a, b) ? [] : [`${path}: ${String(a)} vs ${String(b)}`];
  if (typeof a !== 'object' || a === null || typeof b !== 'object' || b === null) return a === b ? [] : [`${path}: ${String(a)} vs ${String(b)}`];
  const keys = new Set([...Object.keys(a), ...Object.keys(b)]);
  return [...keys].flatMap((k) => sameBits((a as Record<string, unknown>)[k], (b as Record<string, unknown>)[k], `${path}/${k}`));
}

async function filledArchive(): Promise<ArchiveDatabase> {
  const database = new ArchiveDatabase(uniqueDatabaseName('bundle-source'));
  await database.sites.put(siteRow('site-1', { latitudeDeg: 0.1 + 0.2, longitudeDeg: -0, note: 'Pier «north», line 1\nline 2 \u2014 "quoted"' }));
  await database.stars.bulkPut([
    starRow('star-1', { raDeg: 359.99999999999994, decDeg: -89.99999999999999, pmRaMasYr: Number.NaN, parallaxMas: 5e-324, magnitude: null }),
    starRow('star-2', { pmDecMasYr: 1e308, parallaxErrorMas: Number.POSITIVE_INFINITY, importId: 'imp-7' }),
  ]);
  await database.nights.put(nightRow('night-1', { weather: { temperatureC: -0, pressureHpa: 1013.2500000000001, relativeHumidityPercent: Number.NaN } }));
  await putTransitRows(database, Array.from({ length: 2_500 }, (_, k) => transitRow(`t-${k}`, { utcMjd: 61_000 + k / 7, clockMjd: 61_000 + k / 3, wireClockMjd: [61_000 + k / 11, Number.NaN], note: `n${k}` })));
  await database.leapSeconds.put({ mjd: 57754, taiMinusUtcS: 37, source: 'test' });
  await database.earthOrientation.put({ mjd: 60000, dut1S: -0.0123456789, xpArcsec: 0.1, ypArcsec: 0.3, kind: 'final', source: 'test' });
  await database.settings.put({ key: 'columnMapping:qt-2', value: { Star: 'starId' } });
  return database;
}

describe('bundle export → restore', () => {
  test('round trip is bit-exact for every row of every table (Object.is on each number)', async () => {
    const source = await filledArchive();
    const exported = await exportBundle(source, UNCONTROLLED, '2026-03-20T12:00:00.000Z', 'meridian-ledger test');
    expect(exported.rowCounts.transits).toBe(2_500);
    const target = new ArchiveDatabase(uniqueDatabaseName('bundle-target'));
    const verified = await verifyBundle(target, exported.bytes, UNCONTROLLED);
    expect(verified.header.schemaVersion).toBe(4);
    await restoreBundle(target, verified, 'into-empty');
    expect(verified.manifest.tables.map((t) => t.name)).not.toContain('nightTallies');
    // Derived, never in the bundle: rebuilt from the 2,500 transits of night-1 (utcMjd 61000 + k/7, k = 0…2499).
    expect(await target.nightTallies.toArray()).toStrictEqual([{ nightId: 'night-1', instrumentId: 'instr-1', localDate: '2026-01-01', transitCount: 2_500, rejectedCount: 0, firstUtcMjd: 61_000, lastUtcMjd: 61_000 + 2_499 / 7 }]);
    // Every archive table as the app reads it (archiveTables.ts: transits as rows, out of their groups).
    expect(archiveTableNames(source)).toContain('transits');
    for (const name of archiveTableNames(source)) {
      const before = await readTableRows(source, name);
      const after = await readTableRows(target, name);
      expect(after.length, name).toBe(before.length);
      expect(sameBits(before, after), name).toEqual([]);
    }
    source.close();
    target.close();
  });

  test('a restore into a non-empty archive is refused unless replace, and replace swaps the archive whole', async () => {
    const source = await filledArchive();
    const exported = await exportBundle(source, UNCONTROLLED, '2026-03-20T12:00:00.000Z', 'test');
    const target = new ArchiveDatabase(uniqueDatabaseName('bundle-nonempty'));
    await target.sites.put(siteRow('mine'));
    const verified = await verifyBundle(target, exported.bytes, UNCONTROLLED);
    await expect(restoreBundle(target, verified, 'into-empty')).rejects.toThrow(/never mixes/);
    expect(await target.sites.toArray()).toEqual([siteRow('mine')]);
    await restoreBundle(target, verified, 'replace');
    expect(await target.sites.get('mine')).toBeUndefined();
    expect(await storedTransitCount(target)).toBe(2_500);
    source.close();
    target.close();
  });

  test('a damaged, truncated, non-gzip or newer bundle is refused with the reason', async () => {
    const source = await filledArchive();
    const exported = await exportBundle(source, UNCONTROLLED, '2026-03-20T12:00:00.000Z', 'test');
    const text = new TextDecoder().decode(await gunzipBytes(exported.bytes));
    const target = new ArchiveDatabase(uniqueDatabaseName('bundle-refused'));
    const refuse = async (bytes: Uint8Array) => verifyBundle(target, bytes, UNCONTROLLED).then(() => 'accepted', (e: Error) => e.message);
    // One digit of one transit changed: its table's SHA-256 no longer matches the manifest.
    expect(await refuse(await gzipBytes(encodeUtf8(text.replace('"note":"n17"', '"note":"n18"'))))).toMatch(/transits.*damaged.*SHA-256/);
    const lines = text.split('\n');
    expect(await refuse(await gzipBytes(encodeUtf8(lines.slice(0, -2).join('\n'))))).toMatch(/truncated/);
    expect(await refuse(encodeUtf8(text))).toMatch(/not gzip/);
    expect(await refuse(exported.bytes.slice(0, exported.bytes.length - 40))).toMatch(/damaged or cut short/);
    const newer = new BundleWriter({ schemaVersion: 5, createdUtc: '2030-01-01T00:00:00Z', producer: 'later' });
    expect(await refuse(await gzipBytes(encodeUtf8(newer.start() + newer.finish())))).toMatch(/schema 5, newer than this program's \(4\)/);
    const newerFormat = text.replace('"formatVersion":1', '"formatVersion":2');
    expect(await refuse(await gzipBytes(encodeUtf8(newerFormat)))).toMatch(/format version 2, newer/);
    expect(await storedTransitCount(target)).toBe(0);
    source.close();
    target.close();
  });
});
