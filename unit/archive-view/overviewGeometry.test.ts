import { describe, expect, test } from 'vitest';
import { layoutNights } from '../../renderer/archive/nightsLayout.ts';
import { OVERVIEW, OverviewGeometry } from '../../renderer/archive/overviewGeometry.ts';
import { nightRow } from '../store/rowFactories.ts';

const on = (id: string, localDate: string, instrumentId: string) => ({ night: nightRow(id, { localDate, instrumentId }), transitCount: 5 });
const instruments = [{ id: 'mt', label: 'Meridian circle' }, { id: 'zc', label: 'Zenith camera' }];
// Two instruments, two years apart, and two neighbouring days of one instrument.
const layout = layoutNights([on('a', '2020-01-01', 'mt'), on('b', '2020-01-02', 'mt'), on('c', '2020-01-01', 'zc'), on('d', '2022-12-31', 'zc')], instruments);
const geometry = new OverviewGeometry(layout);
const centre = (index: number) => {
  const box = geometry.box(layout.marks[index]);
  return [box.x + box.width / 2, box.y + box.height / 2] as const;
};

describe('OverviewGeometry', () => {
  test('rows are one band per instrument plus the gap; the height holds every year from first to last', () => {
    expect(geometry.rowHeight).toBe(2 * OVERVIEW.band + OVERVIEW.yearGap);
    expect(geometry.height).toBe(OVERVIEW.top + 6 + 3 * geometry.rowHeight); // 2020, 2021, 2022
  });

  test('markAt(centre of each mark) finds that mark, in every band and year', () => {
    layout.marks.forEach((_, index) => expect(geometry.markAt(...centre(index))).toBe(index));
  });

  test('markAt on the overlap of two neighbouring days gives the later day; off the marks gives null', () => {
    const [first, second] = [layout.marks.findIndex((m) => m.summary.night.id === 'a'), layout.marks.findIndex((m) => m.summary.night.id === 'b')];
    const secondBox = geometry.box(layout.marks[second]);
    // A mark is 2.6 units wide and a day ≈ 2.31: the first day's right edge lies over the second mark.
    expect(geometry.box(layout.marks[first]).x + OVERVIEW.markWidth).toBeGreaterThan(secondBox.x);
    expect(geometry.markAt(secondBox.x + 0.1, secondBox.y + 1)).toBe(second);
    expect(geometry.markAt(geometry.x(180), secondBox.y + 1)).toBeNull(); // mid-year, no night
    expect(geometry.markAt(...[centre(0)[0], geometry.yearTop(2021) + 2] as const)).toBeNull(); // 2021 has no night
    expect(geometry.markAt(10, 10)).toBeNull(); // the month labels
    expect(geometry.markAt(centre(0)[0], geometry.height + 5)).toBeNull(); // below the last year
  });
});
