import { describe, expect, test } from 'vitest';
import { Dexie } from 'dexie';
import { openArchive } from '../../renderer/store/openArchive.ts';
import { describeOpenFailure } from '../../renderer/store/describeOpenFailure.ts';
import { SCHEMA_V4 } from '../../renderer/store/schemaV4.ts';
import { siteRow, uniqueDatabaseName } from './rowFactories.ts';

describe('openArchive(name)', () => {
  test('creates a new archive and keeps what is written across reopening', async () => {
    const name = uniqueDatabaseName('open');
    const first = await openArchive(name);
    if (first.kind !== 'open') throw new Error(`expected open, got ${first.failure.message}`);
    await first.database.sites.put(siteRow('s1'));
    first.database.close();
    const second = await openArchive(name);
    if (second.kind !== 'open') throw new Error(`expected open, got ${second.failure.message}`);
    expect(await second.database.sites.count()).toBe(1);
    second.database.close();
  });

  test('refuses an archive of a newer schema and leaves its rows in place', async () => {
    const name = uniqueDatabaseName('newer');
    const newer = new Dexie(name);
    newer.version(5).stores({ ...SCHEMA_V4, futureTable: 'id' });
    await newer.table('sites').put(siteRow('kept'));
    newer.close();

    const result = await openArchive(name);
    expect(result.kind).toBe('failed');
    if (result.kind !== 'failed') return;
    expect(result.failure.errorName).toBe('VersionError');
    expect(result.failure.message).toContain('schema version 5');
    expect(result.failure.advice).toContain('Nothing in the archive was changed or deleted');

    const check = new Dexie(name);
    await check.open(); // open without a declared schema: reads what is there
    expect(check.verno).toBe(5);
    expect(await check.table('sites').get('kept')).toBeDefined();
    check.close();
  });
});

describe('describeOpenFailure(error)', () => {
  test('looks through Dexie.OpenFailedError to a QuotaExceededError', () => {
    const inner = new DOMException('The quota has been exceeded.', 'QuotaExceededError');
    const wrapped = new Dexie.OpenFailedError('open failed', inner);
    const failure = describeOpenFailure(wrapped);
    expect(failure.errorName).toBe('QuotaExceededError');
    expect(failure.title).toMatch(/no storage space/);
    expect(failure.message).toContain('The quota has been exceeded.');
  });

  test('an unknown thrown value still yields advice and the no-deletion promise', () => {
    const failure = describeOpenFailure('disk on fire');
    expect(failure.errorName).toBe('Error');
    expect(failure.message).toContain('disk on fire');
    expect(failure.advice).toMatch(/Reload the app.*Nothing in the archive was changed or deleted/);
  });
});
