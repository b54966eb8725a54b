import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { parseClockComparisons } from '../../core/formats/clock-comparisons.ts';
import { mjdFromCalendar } from '../../core/formats/cells.ts';

const bytes = (text: string): Uint8Array => new TextEncoder().encode(text);

describe('parseClockComparisons', () => {
  it('reads the example of core/reduction/NIGHT.md', () => {
    const doc = readFileSync(new URL('../../core/reduction/NIGHT.md', import.meta.url), 'utf8');
    const example = /```csv clock-comparisons\n([\s\S]*?)```/.exec(doc);
    expect(example, 'NIGHT.md has a clock-comparisons example').not.toBeNull();
    const r = parseClockComparisons(bytes(example![1]), 'NIGHT.md');
    expect(r.rejected).toEqual([]);
    expect(r.rows).toHaveLength(2);
    // MJD of 2026-03-14 from the Fliegel–Van Flandern algorithm (cells.ts; checked there against MJD 51544 = 2000-01-01).
    expect(r.rows[0]).toMatchObject({ nightDateMjd: mjdFromCalendar(2026, 3, 14), clockS: 71_999.612, instrumentId: 'mt-1', utc: { secondsOfDay: 72_000 } });
  });

  it('lists a bad number, a bad time, a far date and a duplicate with row and column', () => {
    const text = [
      'nightDate,utc,clockS,signal',
      '2026-03-14,2026-03-14T20:00:00Z,71999.6,a',
      '2026-03-14,2026-03-14T21:00:00Z,7l999.6,a',
      '2026-03-14,2026-03-14T21:00:00,75599.6,a',
      '2026-03-14,2026-03-18T21:00:00Z,75599.6,a',
      '2026-03-14,2026-03-14T20:00:00Z,71999.7,a',
    ].join('\n');
    const r = parseClockComparisons(bytes(text), 'clock.csv');
    expect(r.rows).toHaveLength(1);
    expect(r.rejected.map((x) => [x.row, x.column])).toEqual([[2, 'clockS'], [3, 'utc'], [4, 'utc'], [5, 'utc']]);
    expect(r.rejected[3].reason).toMatch(/duplicate of row 1/);
  });

  it('rejects every row when a required column is missing', () => {
    const r = parseClockComparisons(bytes('nightDate,utc\n2026-03-14,2026-03-14T20:00:00Z\n'), 'clock.csv');
    expect(r.rows).toEqual([]);
    expect(r.rejected[0].reason).toMatch(/clockS missing/);
    expect(r.rejected).toHaveLength(2);
  });
});
