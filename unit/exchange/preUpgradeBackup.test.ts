import { Dexie } from 'dexie';
import { describe, expect, test } from 'vitest';
import type { BackupRequest, BridgeResult, BackupInfo, ShellInfo } from '../../core/bridge.ts';
import { restoreBundle, verifyBundle } from '../../renderer/exchange/bundleRestore.ts';
import { addTransits, allTransits } from '../../renderer/store/transitGroups.ts';
import { backupBeforeUpgrade, exportOldArchive } from '../../renderer/exchange/preUpgradeBackup.ts';
import { openArchive } from '../../renderer/store/openArchive.ts';
import { ArchiveDatabase, ARCHIVE_SCHEMA_VERSION } from '../../renderer/store/database.ts';
import { SCHEMA_V1 } from '../../renderer/store/schemaV1.ts';
import { siteRow, starRow, transitRow, uniqueDatabaseName } from '../store/rowFactories.ts';
import { watchingControl } from './exchangeFixtures.ts';
import { runExchangeTask } from '../../renderer/worker/tasks/exchangeTasks.ts';
import { UNCONTROLLED } from '../../core/task/task-control.ts';

async function versionOneArchive(name: string) {
  const shipped = new Dexie(name);
  shipped.version(1).stores(SCHEMA_V1);
  await shipped.table('sites').put(siteRow('s1'));
  await shipped.table('stars').put(starRow('x1', { parallaxMas: 0.1 + 0.2 }));
  await shipped.table('transits').bulkPut([transitRow('t1'), transitRow('t2', { visibility: 'staged', importId: 'unfinished' })]);
  shipped.close();
}

function recordingShell(info: ShellInfo, answer: BridgeResult<BackupInfo> | null = null) {
  const writes: BackupRequest[] = [];
  return {
    writes,
    bridge: {
      info: async () => info,
      writeBackup: async (request: BackupRequest): Promise<BridgeResult<BackupInfo>> => {
        writes.push(request);
        return answer ?? { kind: 'ok', value: { fileName: request.fileName, sizeBytes: request.bytes.length, writtenUtc: '2026-12-01T00:00:00.000Z' } };
      },
    },
  };
}
const ELECTRON: ShellInfo = { shell: 'electron', appVersion: 'test', automaticBackups: true };

describe('a backup before the schema upgrade (desktop app)', () => {
  test('a version-1 archive is bundled as schema 1 before it is upgraded, and the bundle verifies', async () => {
    const name = uniqueDatabaseName('pre-upgrade');
    await versionOneArchive(name);
    const shell = recordingShell(ELECTRON);
    const opened = await openArchive(name, backupBeforeUpgrade(name, shell.bridge));
    expect(opened.kind).toBe('open');
    if (opened.kind !== 'open') return;
    expect(shell.writes).toHaveLength(1);
    expect(shell.writes[0].fileName).toMatch(/^archive-\d{4}-\d\d-\d\dT\d{6}Z-before-upgrade-from-v1\.mlbundle$/);
    expect(opened.database.verno).toBe(ARCHIVE_SCHEMA_VERSION);
    const bundle = await verifyBundle(opened.database, shell.writes[0].bytes, watchingControl(() => {}));
    expect(bundle.header.schemaVersion).toBe(1);
    expect(bundle.manifest.tables.find((t) => t.name === 'settings')).toBeUndefined();
    expect(bundle.rows.get('transits')?.map((r) => (r as { id: string }).id)).toEqual(['t1']);
    expect(Object.is((bundle.rows.get('stars')?.[0] as { parallaxMas: number }).parallaxMas, 0.1 + 0.2)).toBe(true);
    opened.database.close();
  });

  test('an archive whose transits are in groups (v4) is bundled with them as transit rows, which restore unchanged', async () => {
    const name = uniqueDatabaseName('pre-upgrade-v4');
    const current = new ArchiveDatabase(name);
    const rows = Array.from({ length: 70 }, (_, k) => transitRow(`t-${String(k).padStart(2, '0')}`, { utcMjd: 61_000 + k / 10, note: k === 3 ? 'é ☁' : '' }));
    await current.transaction('rw', current.transitGroups, () => addTransits(current, rows));
    await current.sites.put(siteRow('s1'));
    current.close();
    // As a later build would before its upgrade from version 4: the old archive as it is on disk.
    const bytes = await exportOldArchive(name, 4, '2026-12-02T00:00:00.000Z', 'test');
    const target = new ArchiveDatabase(uniqueDatabaseName('pre-upgrade-v4-target'));
    const bundle = await verifyBundle(target, bytes, watchingControl(() => {}));
    expect(bundle.manifest.tables.map((t) => t.name)).toContain('transits');
    expect(bundle.manifest.tables.map((t) => t.name)).not.toContain('transitGroups');
    await restoreBundle(target, bundle, 'into-empty');
    expect(await allTransits(target)).toStrictEqual(rows);
    target.close();
  });

  test('the worker job bundles the old archive without upgrading it', async () => {
    const name = uniqueDatabaseName('pre-upgrade-worker');
    await versionOneArchive(name);
    const result = await runExchangeTask({ kind: 'archive-export-old', databaseName: name, fromSchemaVersion: 1, createdUtc: '2026-12-02T00:00:00.000Z', producer: 'test' }, UNCONTROLLED);
    expect((await indexedDB.databases()).find((d) => d.name === name)?.version).toBe(10);
    if (result.kind !== 'archive-export-old') throw new Error(`unexpected ${result.kind}`);
    const shell = recordingShell(ELECTRON);
    const opened = await openArchive(name, backupBeforeUpgrade(name, shell.bridge, async () => result.bytes));
    if (opened.kind !== 'open') throw new Error('expected the archive to open');
    const bundle = await verifyBundle(opened.database, shell.writes[0].bytes, watchingControl(() => {}));
    expect(bundle.header.schemaVersion).toBe(1);
    expect(bundle.rows.get('transits')?.map((r) => (r as { id: string }).id)).toEqual(['t1']);
    opened.database.close();
  });

  test('a failed backup leaves the archive at version 1 and says why', async () => {
    const name = uniqueDatabaseName('pre-upgrade-fails');
    await versionOneArchive(name);
    const shell = recordingShell(ELECTRON, { kind: 'failed', message: 'no space left on the backup disk' });
    const opened = await openArchive(name, backupBeforeUpgrade(name, shell.bridge));
    expect(opened.kind).toBe('failed');
    if (opened.kind === 'failed') expect(opened.failure.message).toMatch(/schema 1.*no space left on the backup disk/);
    const onDisk = (await indexedDB.databases()).find((d) => d.name === name);
    expect(onDisk?.version).toBe(10); // Dexie stores schema v as IndexedDB version 10·v
  });

  test('the browser writes nothing and upgrades as before; a current archive calls no hook', async () => {
    const name = uniqueDatabaseName('pre-upgrade-browser');
    await versionOneArchive(name);
    const shell = recordingShell({ shell: 'browser', appVersion: 'test', automaticBackups: false });
    const opened = await openArchive(name, backupBeforeUpgrade(name, shell.bridge));
    expect(opened.kind).toBe('open');
    if (opened.kind === 'open') opened.database.close();
    let calls = 0;
    const again = await openArchive(name, async () => (calls++, null));
    expect([again.kind, calls, shell.writes.length]).toEqual(['open', 0, 0]);
    if (again.kind === 'open') again.database.close();
  });
});
