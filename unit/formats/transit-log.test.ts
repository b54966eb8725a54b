import { describe, expect, it } from 'vitest';
import { parseTransitLog } from '../../core/formats/transit-log.ts';
import { acceptWhole } from '../../core/formats/parse-result.ts';
import { mjdFromCalendar } from '../../core/formats/cells.ts';
import { parseUtcCell } from '../../core/formats/utc-instant.ts';

const bytes = (text: string): Uint8Array => new TextEncoder().encode(text);
const NIGHT = { start: { mjd: mjdFromCalendar(2026, 3, 14), secondsOfDay: 64_800 }, end: { mjd: mjdFromCalendar(2026, 3, 15), secondsOfDay: 21_600 } };
const STARS = new Set(['K-101', 'K-102', 'K-103']);

describe('mjdFromCalendar and parseUtcCell', () => {
  it('MJD of 2000-01-01 is 51544 and of 1858-11-17 is 0 (definition of MJD; Explanatory Supplement)', () => {
    expect(mjdFromCalendar(2000, 1, 1)).toBe(51_544);
    expect(mjdFromCalendar(1858, 11, 17)).toBe(0);
  });
  it('keeps a leap second 23:59:60 as its own second and refuses a time without Z', () => {
    expect(parseUtcCell('2016-12-31T23:59:60.5Z')).toEqual({ ok: true, value: { mjd: 57_753, secondsOfDay: 86_400.5 } });
    expect(parseUtcCell('2026-03-14T21:00:00')).toMatchObject({ ok: false });
    expect(parseUtcCell('2026-02-29T21:00:00Z')).toMatchObject({ ok: false });
  });
});

describe('parseTransitLog', () => {
  const header = 'starId,culmination,clamp,observer,wire1Utc,wire2Utc,wire3Utc,micrometerTurns,pressureHpa,temperatureC,flags,note,seeingArcsec';
  it('reads wire columns in UTC with units from the header and warns about an unknown column', () => {
    const text = `${header}\nK-101,upper,west,ER,2026-03-14T21:07:30.10Z,,2026-03-14T21:07:50.35Z,12.345,1013.2,4.5,doubtful,"gusty, ""fair""",1.5\n`;
    const r = parseTransitLog(bytes(text), { fileName: 'log.csv', knownStarIds: STARS, nightUtc: NIGHT });
    expect(r.rejected).toEqual([]);
    expect(r.warnings.join('\n')).toMatch(/unknown column\(s\) ignored: seeingArcsec/);
    const row = r.rows[0];
    expect(row.times.kind).toBe('utc');
    expect(row.times.wires.map((w) => w.wireIndex)).toEqual([0, 2]);
    expect(row.zenithReading).toEqual({ unit: 'turns', value: 12.345 });
    expect(row.pressureHpa).toBe(1013.2);
    expect(row.note).toBe('gusty, "fair"');
    expect(acceptWhole(r)).toHaveLength(1);
  });

  it('lists every bad row with row, line and column; valid rows stay available; nothing half-processed', () => {
    const text = [
      header,
      'K-101,upper,west,ER,2026-03-14T21:07:30Z,,,12.3,1013,4,,,',
      'K-999,upper,west,ER,2026-03-14T21:30:00Z,,,12.3,1013,4,,,', // unknown star
      'K-102,upper,west,ER,2026-03-14T21:40:00Z,,,"12,3",1013,4,,,', // comma decimal
      'K-103,sideways,west,ER,2026-03-14T21:50:00Z,,,12.3,1013,4,,,', // bad culmination
      'K-103,upper,west,ER,2026-03-16T21:50:00Z,,,12.3,1013,4,,,', // outside the night
      'K-102,upper,west,ER,2026-03-14T22:10:00Z,,,12.3,5000,4,,,', // impossible pressure
      'K-101,upper,east,ER,2026-03-14T21:07:40Z,,,12.3,1013,4,,,', // duplicate of row 1
      'K-102,lower,west,ER,2026-03-15T03:10:00Z,,,,,,cloud;sleepy,,', // unknown flag
    ].join('\n');
    const r = parseTransitLog(bytes(text), { fileName: 'log.csv', knownStarIds: STARS, nightUtc: NIGHT });
    expect(r.totalRows).toBe(8);
    expect(r.rows.map((x) => x.row)).toEqual([1]);
    const summary = r.rejected.map((x) => [x.row, x.line, x.column]);
    expect(summary).toEqual([
      [2, 3, 'starId'],
      [3, 4, 'micrometerTurns'],
      [4, 5, 'culmination'],
      [5, 6, 'wire1Utc'],
      [6, 7, 'pressureHpa'],
      [7, 8, 'starId'],
      [8, 9, 'flags'],
    ]);
    expect(r.rejected[1].reason).toMatch(/decimal separator/);
    expect(r.rejected[5].reason).toMatch(/duplicate of row 1/);
    expect(acceptWhole(r)).toBeNull();
  });

  it('reads a clock-time list with missing wires and checks the clock window', () => {
    const text = 'starId,culmination,wireTimesClockS,zenithDistanceDeg\nK-101,upper,75010.5;;75030.25;75040,35.2\nK-102,upper,99999,91\n';
    const r = parseTransitLog(bytes(text), { fileName: 'c.csv', nightClockS: { start: 64_800, end: 108_000 } });
    expect(r.rows).toHaveLength(1);
    expect(r.rows[0].times).toEqual({ kind: 'clock', wires: [{ wireIndex: 0, clockS: 75010.5 }, { wireIndex: 2, clockS: 75030.25 }, { wireIndex: 3, clockS: 75040 }] });
    expect(r.rows[0].clamp).toBe('none');
    expect(r.rejected).toEqual([{ row: 2, line: 3, column: 'zenithDistanceDeg', reason: expect.stringMatching(/outside the possible range/) }]);
    expect(r.warnings.join(' ')).toMatch(/star ids not checked/);
  });

  it('a header mixing UTC and clock columns rejects the whole file with the reason at row 0', () => {
    const r = parseTransitLog(bytes('starId,culmination,wire1Utc,wire2ClockS\nK-101,upper,2026-03-14T21:00:00Z,1\n'), { fileName: 'm.csv' });
    expect(r.rows).toEqual([]);
    expect(r.rejected[0]).toMatchObject({ row: 0, reason: expect.stringMatching(/mixes UTC and clock/) });
    expect(r.rejected[1]).toMatchObject({ row: 1 });
  });
});
