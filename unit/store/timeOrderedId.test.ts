import { describe, expect, test } from 'vitest';
import { TimeOrderedIds } from '../../renderer/store/timeOrderedId.ts';

// Layout source: RFC 9562 (2024) §5.7 (UUID version 7) and §6.2 method 1 (dedicated counter).
const UUID_V7 = /^[0-9a-f]{8}-[0-9a-f]{4}-7[0-9a-f]{3}-[89ab][0-9a-f]{3}-[0-9a-f]{12}$/;

describe('TimeOrderedIds', () => {
  test('ids have the version 7 layout and carry the Unix milliseconds in their first 48 bits', () => {
    const ids = new TimeOrderedIds(() => 1_764_633_600_123);
    const id = ids.next();
    expect(id).toMatch(UUID_V7);
    expect(parseInt(id.replace(/-/g, '').slice(0, 12), 16)).toBe(1_764_633_600_123);
  });

  test('20,000 ids made within one millisecond, then with the clock stepping back, sort in the order made and are all different', () => {
    let now = 1_764_633_600_000;
    const ids = new TimeOrderedIds(() => now);
    const made: string[] = [];
    for (let k = 0; k < 20_000; k++) {
      if (k === 12_000) now -= 5_000; // clock stepped back five seconds
      if (k === 16_000) now += 10_000;
      made.push(ids.next());
    }
    expect(new Set(made).size).toBe(made.length);
    expect([...made].sort()).toEqual(made);
    expect(made.every((id) => UUID_V7.test(id))).toBe(true);
  });
});
