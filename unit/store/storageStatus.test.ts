import { describe, expect, test } from 'vitest';
import { formatBytes, requestStorageStatus } from '../../renderer/store/storageStatus.ts';

describe('requestStorageStatus(storage)', () => {
  test('asks persist() when not yet persisted and reports the estimate', async () => {
    let asked = 0;
    const status = await requestStorageStatus({
      persisted: async () => false,
      persist: async () => { asked += 1; return true; },
      estimate: async () => ({ usage: 2048, quota: 1_000_000 }),
    });
    expect(asked).toBe(1);
    expect(status).toEqual({ persistence: 'persistent', usageBytes: 2048, quotaBytes: 1_000_000, errorMessage: null });
  });

  test('a refused request is best-effort; a missing StorageManager is unsupported', async () => {
    const refused = await requestStorageStatus({ persisted: async () => false, persist: async () => false });
    expect(refused.persistence).toBe('best-effort');
    expect(refused.usageBytes).toBeNull();
    expect((await requestStorageStatus(undefined)).persistence).toBe('unsupported');
  });

  test('a throwing browser gives persistence "failed" with its message, not an exception', async () => {
    const status = await requestStorageStatus({ persist: async () => { throw new Error('denied by policy'); } });
    expect(status).toMatchObject({ persistence: 'failed', errorMessage: 'denied by policy' });
  });
});

describe('formatBytes(bytes)', () => {
  test('uses binary prefixes (IEC 80000-13) with one decimal', () => {
    expect(formatBytes(512)).toBe('512 B');
    expect(formatBytes(1536)).toBe('1.5 KiB');
    expect(formatBytes(5 * 1024 ** 3)).toBe('5.0 GiB');
  });
  test('rejects a negative count with a message', () => {
    expect(() => formatBytes(-1)).toThrow(/non-negative finite byte count, got -1/);
  });
});
