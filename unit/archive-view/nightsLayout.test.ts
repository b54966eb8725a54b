import { describe, expect, test } from 'vitest';
import { layoutNights, shortLabels, stepLimits, STEPS } from '../../renderer/archive/nightsLayout.ts';
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
    expect(marks.map((m) => [m.year, m.dayOfYear, m.step])).toEqual([[2022, 0, 0], [2024, 60, 2], [2024, 365, 4]]); // date order
  });

  test('layoutNights([]) has no marks and no years', () => {
    expect(layoutNights([])).toEqual({ marks: [], years: [], limits: [1, 2, 3, 4, 5], bands: [] });
  });

  test('two instruments with nights of one date get a band each, named by label, in date-then-band order', () => {
    const on = (id: string, localDate: string, instrumentId: string) => ({ night: nightRow(id, { localDate, instrumentId }), transitCount: 5 });
    const instruments = [{ id: 'zc', label: 'Zenith camera' }, { id: 'mt', label: 'Meridian circle' }, { id: 'unused', label: 'Spare' }];
    const { marks, bands } = layoutNights([on('m2', '2024-05-02', 'mt'), on('z1', '2024-05-01', 'zc'), on('m1', '2024-05-01', 'mt'), on('x', '2024-05-01', 'ghost')], instruments);
    // Bands follow the given instrument order; an instrument without a night gets none; an unknown id is named by its id, last.
    expect(bands).toEqual([{ instrumentId: 'zc', label: 'Zenith camera', shortLabel: 'Zenith camera' }, { instrumentId: 'mt', label: 'Meridian circle', shortLabel: 'Meridian circle' }, { instrumentId: 'ghost', label: 'ghost', shortLabel: 'ghost' }]);
    expect(marks.map((m) => [m.summary.night.id, m.band, m.dayOfYear])).toEqual([['z1', 0, 121], ['m1', 1, 121], ['x', 2, 121], ['m2', 1, 122]]);
  });

  test('shortLabels drops the words all labels share at the start and end, never a whole label', () => {
    expect(shortLabels(['Hill Top meridian transit (x)', 'Hill Top zenith camera (x)'])).toEqual(['meridian transit', 'zenith camera']);
    expect(shortLabels(['Hill transit', 'Hill transit 2'])).toEqual(['transit', 'transit 2']);
    expect(shortLabels(['Same', 'Same'])).toEqual(['Same', 'Same']);
    expect(shortLabels(['Only one (x)'])).toEqual(['Only one (x)']);
  });
});
