import { readFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { describe, expect, it } from 'vitest';
import { bundledEarthOrientationTable } from '../../core/time/bundled-earth-orientation.ts';
import { BUNDLED_LEAP_SECONDS } from '../../core/time/bundled-leap-seconds.ts';
import { parseIersC04, parseIersFinals } from '../../core/time/earth-orientation-table.ts';
import { calendarDayToMjd, daysBetween } from '../../core/time/julian-date.ts';
import { TimeScale } from '../../core/time/timescale.ts';
import { ARCSEC, MAS } from '../../core/units.ts';
import { finals2016 } from './finals-excerpt.ts';

const c04Text = readFileSync(fileURLToPath(new URL('../../assets/eop/eopc04_IAU2000.62-now', import.meta.url)), 'utf8');
const c04 = parseIersC04(c04Text, 'assets/eop/eopc04_IAU2000.62-now');
const US = 1e-6;

// Eight real lines of the IERS finals2000A file (finals-excerpt.ts): 'I' then 'P' flags.
const FINALS_EXCERPT = finals2016();

describe('parseIersC04 on the bundled IERS EOP 14 C04 file', () => {
  it('covers 1962-01-01 … 2022-11-29 with the values printed in the file', () => {
    expect(c04.firstMjd).toBe(calendarDayToMjd(1962, 1, 1));
    expect(c04.lastMjd).toBe(calendarDayToMjd(2022, 11, 29));
    // File line "1962   1   1  37665  -0.012700   0.213000   0.0326338 ..."
    const first = c04.at(37665);
    expect(first.status).toBe('observed');
    expect(first.xpRad / ARCSEC).toBeCloseTo(-0.0127, 12);
    expect(first.ypRad / ARCSEC).toBeCloseTo(0.213, 12);
    expect(first.dut1Seconds).toBeCloseTo(0.0326338, 12);
  });

  it('the bundled core module decodes to exactly the file’s values', () => {
    const bundled = bundledEarthOrientationTable();
    expect([bundled.firstMjd, bundled.lastMjd]).toEqual([c04.firstMjd, c04.lastMjd]);
    for (let mjd = c04.firstMjd; mjd <= c04.lastMjd; mjd += 97) {
      const a = bundled.at(mjd);
      const b = c04.at(mjd);
      expect(Math.abs(a.dut1Seconds - b.dut1Seconds)).toBeLessThan(1e-12);
      expect(Math.abs(a.xpRad - b.xpRad)).toBeLessThan(1e-6 * MAS);
      expect(Math.abs(a.ypRad - b.ypRad)).toBeLessThan(1e-6 * MAS);
    }
  });

  it('rejects a damaged line with its line number', () => {
    const lines = c04Text.split('\n');
    const index = lines.findIndex((line) => line.startsWith('1970   1   1'));
    lines[index] = lines[index].replace('40587', '40588');
    expect(() => parseIersC04(lines.join('\n'), 'damaged.c04')).toThrow(new RegExp(`damaged\\.c04, line ${index + 1}: MJD 40588 does not match`));
  });
});

describe('parseIersC04 on the EOP 20 C04 field order', () => {
  it('reads year, month, day, hour, MJD, x, y, UT1−UTC, dX, dY, rates, LOD and 8 errors', () => {
    // Real 14 C04 values of 2016-04-25/26 (assets file) rearranged in the 20 C04 order; the rates
    // and errors are not read, so their columns hold the 14 C04 error values only as fillers.
    const lines = [
      '# header line of the file',
      '2016   4  25   0  57503.00   0.027052   0.463501  -0.1265210   0.000109   0.000140   0.000000   0.000000   0.0013205   0.000061   0.000046  0.0000144   0.000049   0.000047   0.000000   0.000000  0.0000151',
      '2016   4  26   0  57504.00   0.028032   0.465383  -0.1278100   0.000130   0.000158   0.000000   0.000000   0.0012194   0.000061   0.000046  0.0000125   0.000049   0.000048   0.000000   0.000000  0.0000151',
    ];
    const table = parseIersC04(lines.join('\n'), '20 C04 sample');
    for (const mjd of [57503, 57504]) {
      expect(table.at(mjd).dut1Seconds).toBeCloseTo(c04.at(mjd).dut1Seconds, 12);
      expect(table.at(mjd).xpRad).toBeCloseTo(c04.at(mjd).xpRad, 15);
      expect(table.at(mjd).ypRad).toBeCloseTo(c04.at(mjd).ypRad, 15);
    }
    const wrongCount = lines[1].replace(/ +0\.0000151$/, '');
    expect(() => parseIersC04(wrongCount + '\n' + lines[2], 'short')).toThrow(/short, line 1: a C04 line has 16 .* or 21 .* fields, this one has 20/);
  });
});

describe('parseIersFinals (IERS finals2000A layout)', () => {
  const finals = parseIersFinals(FINALS_EXCERPT, 'finals excerpt');

  it('reads Bulletin A values and flags: observed until 2016-04-28, predicted after', () => {
    expect([finals.firstMjd, finals.lastMjd, finals.lastObservedMjd]).toEqual([57503, 57510, 57506]);
    expect(finals.at(57503).dut1Seconds).toBeCloseTo(-0.1265278, 12);
    expect(finals.at(57503).xpRad / ARCSEC).toBeCloseTo(0.027084, 12);
    expect(finals.at(57504.5).status).toBe('observed');
    expect(finals.at(57508).status).toBe('predicted');
    expect(finals.at(57508).note).toMatch(/IERS predictions/);
  });

  // The excerpt's own error columns give 0.09 mas for the pole and 17 µs for UT1 on these days.
  it('agrees with the final C04 series within 0.05 ms and 0.2 mas where both are observed (two IERS products)', () => {
    for (let mjd = 57503; mjd <= 57506; mjd += 0.25) {
      expect(Math.abs(finals.at(mjd).dut1Seconds - c04.at(mjd).dut1Seconds)).toBeLessThan(50 * US);
      expect(Math.abs(finals.at(mjd).xpRad - c04.at(mjd).xpRad)).toBeLessThan(0.2 * MAS);
    }
  });

  it('rejects a bad field with its line number and is silent about nothing', () => {
    const broken = FINALS_EXCERPT.replace('-0.1278231', '-0.12X8231');
    expect(() => parseIersFinals(broken, 'broken finals')).toThrow(/broken finals, line 2: UT1−UTC \(columns 59–68\) "-0.12X8231" is not a number/);
    expect(() => parseIersFinals(FINALS_EXCERPT.replace(/ I /g, ' Q '), 'flags')).toThrow(/flag I or P/);
  });

  it('outside the table: zero values, status outside-table and a note that says what to load', () => {
    const outside = finals.at(60000);
    expect(outside).toMatchObject({ dut1Seconds: 0, xpRad: 0, ypRad: 0, status: 'outside-table' });
    expect(outside.note).toMatch(/load a newer IERS finals2000A or C04 file/);
  });
});

describe('interpolation', () => {
  it('returns the tabulated value at 0h UTC and a smooth value between (4-point Lagrange)', () => {
    const mjd = calendarDayToMjd(2010, 3, 14);
    const node = c04.at(mjd);
    expect(node.dut1Seconds).toBe(c04.at(mjd).dut1Seconds);
    const mid = c04.at(mjd + 0.5).dut1Seconds;
    const linear = (c04.at(mjd).dut1Seconds + c04.at(mjd + 1).dut1Seconds) / 2;
    expect(Math.abs(mid - linear)).toBeLessThan(20 * US); // curvature of UT1 over a day is tiny
  });

  it('UT1 stays continuous through the leap second at the end of 2016-12-31', () => {
    const scale = new TimeScale(BUNDLED_LEAP_SECONDS, c04);
    const before = scale.fromIsoUtc('2016-12-31T23:59:59Z');
    const after = scale.fromIsoUtc('2017-01-01T00:00:01Z');
    // 3 SI seconds of TAI elapse (…59, 60, 00:00:00 → 00:00:01); UT1 advances by the same to 1 ms.
    expect(daysBetween(after.tai, before.tai) * 86400).toBeCloseTo(3, 9);
    expect(Math.abs(daysBetween(after.ut1, before.ut1) * 86400 - 3)).toBeLessThan(1e-3);
    expect(after.dut1Seconds - before.dut1Seconds).toBeCloseTo(1, 2); // UT1 − UTC jumps by +1 s
    expect(before.warnings).toEqual([]);
  });

  it('TimeScale with the bundled table warns after 2022-11-29 and applies DUT1 = 0 there', () => {
    const scale = new TimeScale(BUNDLED_LEAP_SECONDS, bundledEarthOrientationTable());
    const late = scale.fromIsoUtc('2024-05-01T00:00:00Z');
    expect(late.dut1Seconds).toBe(0);
    expect(late.warnings.join(' ')).toMatch(/outside IERS EOP 14 C04 .* load a newer IERS/);
  });
});
