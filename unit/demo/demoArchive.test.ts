// The demo archive shipped in assets/demo: restored on the first start of an empty archive only,
// removable in one action, never restored again by itself.
import { readFile } from 'node:fs/promises';
import { describe, expect, it } from 'vitest';
import { DEMO_IMPORT_ID, demoState, loadDemoIfFirstStart, removeDemoArchive } from '../../renderer/demo/demoArchive.ts';
import { ArchiveDatabase } from '../../renderer/store/database.ts';
import { siteRow, uniqueDatabaseName } from '../store/rowFactories.ts';
import { storedTransitCount } from '../store/transitRows.ts';
import { allTransits } from '../../renderer/store/transitGroups.ts';

const fetchDemo = async () => new Uint8Array(await readFile('assets/demo/demo-archive.mlbundle'));
const NOW = '2026-12-01T12:00:00.000Z';

describe('loadDemoIfFirstStart(database, fetchDemo)', () => {
  it('restores the whole demo into an empty archive, marked with the demo import id', async () => {
    const database = new ArchiveDatabase(uniqueDatabaseName('demo-load'));
    const counts = await loadDemoIfFirstStart(database, fetchDemo, NOW);
    // main/scripts/make-demo-archive.ts: 24 programme stars and 8 near the zenith for the camera.
    expect(counts).toMatchObject({ sites: 1, instruments: 2, stars: 32 });
    expect(counts?.transits).toBeGreaterThan(5000);
    // One transit instrument and one fixed zenith camera, each with its own nights and transits.
    const instruments = await database.instruments.toArray();
    expect(instruments.map((i) => [i.kind, i.readingUnit]).sort()).toEqual([['fixed-camera', 'pixel'], ['transit', 'micrometer-turn']]);
    const camera = instruments.find((i) => i.kind === 'fixed-camera')!;
    expect(camera.camera).toEqual({ orientationDeg: 0, parity: 1, opticalCentrePx: [1024, 1024], referenceColumnPx: 1024 });
    const cameraNights = (await database.nights.toArray()).filter((n) => n.instrumentId === camera.id).length;
    expect(cameraNights).toBeGreaterThan(100);
    // The simulator keeps only nights with three transits or more.
    expect((await allTransits(database)).filter((t) => t.instrumentId === camera.id).length).toBeGreaterThanOrEqual(3 * cameraNights);
    // Filtered in memory: fake-indexeddb's notEqual range over ~7,500 rows takes minutes.
    expect((await allTransits(database)).filter((t) => t.importId !== DEMO_IMPORT_ID).length).toBe(0);
    expect((await database.stars.toArray()).every((s) => s.visibility === 'visible')).toBe(true);
    expect(await demoState(database)).toEqual({ state: 'loaded', whenUtc: NOW });
    // A second start does nothing.
    expect(await loadDemoIfFirstStart(database, fetchDemo, NOW)).toBeNull();
  });
  it('skips an archive that already holds data and remembers that', async () => {
    const database = new ArchiveDatabase(uniqueDatabaseName('demo-skip'));
    await database.sites.put(siteRow('mine'));
    expect(await loadDemoIfFirstStart(database, fetchDemo, NOW)).toBeNull();
    expect(await database.stars.count()).toBe(0);
    expect((await demoState(database))?.state).toBe('skipped');
  });
  it('removeDemoArchive removes every demo row and leaves the user own rows', async () => {
    const database = new ArchiveDatabase(uniqueDatabaseName('demo-remove'));
    await loadDemoIfFirstStart(database, fetchDemo, NOW);
    await database.sites.put(siteRow('mine'));
    const removed = await removeDemoArchive(database, NOW);
    expect(removed).toBeGreaterThan(5000);
    expect(await storedTransitCount(database)).toBe(0);
    expect(await database.stars.count()).toBe(0);
    expect((await database.sites.toArray()).map((s) => s.id)).toEqual(['mine']);
    expect((await demoState(database))?.state).toBe('removed');
  });
});
