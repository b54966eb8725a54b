// Change keys of the overview's per-night cache: a key must change with every edit that changes
// what the night's reduction reads, and only with those.
import { describe, expect, test } from 'vitest';
import { archiveContextKey, fnv1a64, nightQualityKey } from '../../renderer/archive/nightQualityKey.ts';
import { NightQualityCache } from '../../renderer/archive/nightQualityCache.ts';
import { failedQuality } from '../../renderer/archive/nightQuality.ts';
import { nightRow, siteRow, starRow, transitRow } from '../store/rowFactories.ts';

/** Reference FNV-1a 64 with BigInt, straight from the definition (offset basis 0xcbf29ce484222325, prime 0x100000001b3). */
function referenceFnv(text: string): string {
  let hash = 0xcbf29ce484222325n;
  for (let i = 0; i < text.length; i++) hash = ((hash ^ BigInt(text.charCodeAt(i))) * 0x100000001b3n) & 0xffffffffffffffffn;
  return hash.toString(16).padStart(16, '0');
}

describe('fnv1a64(text)', () => {
  test('matches the published FNV-1a 64-bit test vectors (FNV reference test suite; from memory)', () => {
    expect(fnv1a64('')).toBe('cbf29ce484222325');
    expect(fnv1a64('a')).toBe('af63dc4c8601ec8c');
    expect(fnv1a64('foobar')).toBe('85944171f73967e8');
  });
  test('matches a BigInt evaluation of the definition on long and non-ASCII text', () => {
    for (const text of ['night-2019-12-08@2026-12-01T00:00:00.000Z|t1@x', 'δ −12° · Ω'.repeat(40)]) expect(fnv1a64(text)).toBe(referenceFnv(text));
  });
});

describe('nightQualityKey(contextKey, night, transits)', () => {
  const context = archiveContextKey(siteRow('s'), [], [starRow('a'), starRow('b')]);
  const night = nightRow('n-1');
  const transits = [transitRow('t-1', { nightId: 'n-1' }), transitRow('t-2', { nightId: 'n-1' })];
  const key = nightQualityKey(context, night, transits);

  test('does not depend on the order the transits were read in', () => {
    expect(nightQualityKey(context, night, [...transits].reverse())).toBe(key);
  });
  test('changes on a reject, an edit stamp, an added or removed transit, a night edit and a star edit', () => {
    const changed = [
      nightQualityKey(context, night, [{ ...transits[0], userRejected: true }, transits[1]]),
      nightQualityKey(context, night, [{ ...transits[0], updatedUtc: '2026-02-02T00:00:00.000Z' }, transits[1]]),
      nightQualityKey(context, night, [...transits, transitRow('t-3', { nightId: 'n-1' })]),
      nightQualityKey(context, night, [transits[0]]),
      nightQualityKey(context, { ...night, updatedUtc: '2026-03-03T00:00:00.000Z' }, transits),
      nightQualityKey(archiveContextKey(siteRow('s'), [], [starRow('a', { updatedUtc: '2026-04-04T00:00:00.000Z' }), starRow('b')]), night, transits),
    ];
    for (const other of changed) expect(other).not.toBe(key);
    expect(new Set(changed).size).toBe(changed.length);
  });
  test('ignores staged rows of an import not yet committed', () => {
    expect(nightQualityKey(context, night, [...transits, transitRow('t-9', { nightId: 'n-1', visibility: 'staged' })])).toBe(key);
  });
});

describe('NightQualityCache', () => {
  test('get(nightId, key) misses on another key; forget and retainOnly drop nights', () => {
    const cache = new NightQualityCache();
    cache.set(failedQuality('n-1', 'k1', 0, 'r'));
    cache.set(failedQuality('n-2', 'k2', 0, 'r'));
    expect(cache.get('n-1', 'k1')?.nightId).toBe('n-1');
    expect(cache.get('n-1', 'k-new')).toBeUndefined();
    cache.forget('n-1');
    expect(cache.get('n-1', 'k1')).toBeUndefined();
    cache.retainOnly(new Set(['n-3']));
    expect(cache.size).toBe(0);
  });
});
