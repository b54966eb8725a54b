import { readFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { describe, expect, it } from 'vitest';
import { BUNDLED_LEAP_SECONDS } from '../../core/time/bundled-leap-seconds.ts';
import { calendarDayToMjd } from '../../core/time/julian-date.ts';
import { parseLeapSecondsList } from '../../core/time/parse-leap-seconds-list.ts';
import { sha1Hex } from '../../core/time/sha1.ts';
import { createHash } from 'node:crypto';

const assetText = readFileSync(fileURLToPath(new URL('../../assets/leap-seconds.list', import.meta.url)), 'utf8');

describe('parseLeapSecondsList', () => {
  it('reads the IERS file in assets/ and its #h hash checks (hash computed by the IERS)', () => {
    const table = parseLeapSecondsList(assetText, 'assets/leap-seconds.list');
    // 28 integral steps 1972-2017 (IERS Bulletin C 1–69) plus the 14 rubber-second expressions.
    expect(table.steps.length).toBe(28 + 14);
    expect(table.expiresMjd).toBe(calendarDayToMjd(2027, 6, 28)); // "File expires on 28 June 2027"
    expect(table.valueOnDay(calendarDayToMjd(2017, 1, 1), 0)).toBe(37); // IERS Bulletin C 52
  });

  it('rejects an edited file through the hash', () => {
    const edited = assetText.replace('3692217600\t37', '3692217600\t38').replace('3692217600      37', '3692217600      38');
    expect(edited).not.toBe(assetText);
    expect(() => parseLeapSecondsList(edited, 'edited.list')).toThrow(/hash .* does not match/);
  });

  it('names the line of a malformed data line', () => {
    const broken = assetText.replace('2287785600      11', '2287785600      eleven');
    expect(() => parseLeapSecondsList(broken, 'broken.list')).toThrow(/broken\.list, line \d+: expected "NTP-seconds TAI-UTC"/);
  });

  it('BUNDLED_LEAP_SECONDS has the same content as assets/leap-seconds.list', () => {
    const fromAsset = parseLeapSecondsList(assetText, 'asset');
    expect(BUNDLED_LEAP_SECONDS.steps).toEqual(fromAsset.steps);
    expect(BUNDLED_LEAP_SECONDS.expiresMjd).toBe(fromAsset.expiresMjd);
    expect(BUNDLED_LEAP_SECONDS.updatedMjd).toBe(fromAsset.updatedMjd);
  });
});

describe('LeapSecondTable', () => {
  it('taiMinusUtcSeconds follows the USNO tai-utc.dat drift formula in 1960–1971', () => {
    // USNO tai-utc.dat: 1966 JAN 1: 4.3131700 + (MJD - 39126) X 0.002592 S; at MJD 39500.25:
    const mjd = 39500.25;
    expect(BUNDLED_LEAP_SECONDS.taiMinusUtcSeconds({ jd1: 2400000.5, jd2: mjd })).toBeCloseTo(4.31317 + (mjd - 39126) * 0.002592, 12);
  });

  it('leapAtEndOfDaySeconds is +1 on the 27 leap-second days and 0 the day before', () => {
    for (const [y, m, d] of [[1972, 6, 30], [1998, 12, 31], [2005, 12, 31], [2016, 12, 31]] as const) {
      const mjd = calendarDayToMjd(y, m, d);
      expect(BUNDLED_LEAP_SECONDS.leapAtEndOfDaySeconds(mjd)).toBe(1);
      expect(BUNDLED_LEAP_SECONDS.leapAtEndOfDaySeconds(mjd - 1)).toBe(0);
    }
  });

  it('refuses UTC before 1960 with the way out', () => {
    expect(() => BUNDLED_LEAP_SECONDS.taiMinusUtcSeconds({ jd1: 2400000.5, jd2: 36000 })).toThrow(/not defined before 1960.*fromTt/);
  });
});

describe('sha1Hex', () => {
  it('matches node:crypto SHA-1 on short and multi-block inputs', () => {
    for (const text of ['', 'abc', 'x'.repeat(55), 'y'.repeat(56), 'z'.repeat(200)]) {
      expect(sha1Hex(text)).toBe(createHash('sha1').update(text).digest('hex'));
    }
  });
});
