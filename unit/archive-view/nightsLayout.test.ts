import { describe, expect, test } from 'vitest';
import { layoutNights, stepLimits, STEPS } from '../../renderer/archive/nightsLayout.ts';
import { nightRow } from '../store/rowFactories.ts';

const summary = (id: string, localDate: string, transitCount: number) => ({ night: nightRow(id, { localDate }), transitCount });

describe('nightsLayout', () => {
  test('stepLimits(20) gives five equal steps up to 20; stepLimits(0) still gives increasing limits', () => {
    expect(STEPS).toBe(5);
    expect(stepLimits(20)).toEqual([4, 8, 12, 16, 20]);
    expect(stepLimits(0)).toEqual([1, 2, 3, 4, 5]);
  });

  test('layoutNights puts 31 December of a leap year on day 365 and keeps years without nights', () => {
    // 2024 is a Gregorian leap year (divisible by 4, not a century): 366 days, last one is day 365.
    const { marks, years } = layoutNights([summary('a', '2022-01-01', 2), summary('b', '2024-12-31', 20), summary('c', '2024-03-01', 9)]);
    expect(years).toEqual([2022, 2023, 2024]);
    expect(marks.map((m) => [m.year, m.dayOfYear, m.step])).toEqual([[2022, 0, 0], [2024, 365, 4], [2024, 60, 2]]);
  });

  test('layoutNights([]) has no marks and no years', () => {
    expect(layoutNights([])).toEqual({ marks: [], years: [], limits: [1, 2, 3, 4, 5] });
  });
});
